#pragma once
/// User formulas: a small expression language of our own (grammar/formula.ebnf)
/// compiled into a Model, so that a formula stands in for a built-in model
/// anywhere (check, fit, identify).
///
/// Example (the solar equation with a parameter, on one line or several):
///
///     param e = 2;4,48 range 1 .. 4 "eccentricity, parts of 60"
///     atan2(e * sin(arg), 60 + e * cos(arg))
///
/// and a derived column checked against the table's own entries:
///
///     (col(chord, +1) - col(chord)) / 30

#include <memory>
#include <string>
#include <vector>

#include "model/model.hpp"

namespace apograph::model {

namespace internal {
struct Node;
}

/// A compiled formula. Evaluate() is thread-compatible (no mutable state).
class FormulaModel final : public Model {
 public:
  ~FormulaModel() override;
  const std::string& name() const override { return name_; }
  /// The formula's text.
  const std::string& description() const override { return text_; }
  const std::string& convention() const override { return convention_; }
  const std::vector<ParamSpec>& params() const override { return params_; }
  /// A mean motion when the formula has parameters named rate and modulus
  /// (grammar/formula.ebnf); a function of the argument otherwise.
  const ModelTraits& traits() const override { return traits_; }
  double Evaluate(const std::vector<double>& params, const RowContext& row) const override;

  /// Column names the formula reads with col(...), in order of appearance,
  /// so that a caller can check them against a table before running.
  const std::vector<std::string>& columns() const { return columns_; }

 private:
  friend std::unique_ptr<FormulaModel> CompileFormula(const std::string&, const std::string&,
                                                      const std::string&);
  FormulaModel() = default;
  double EvaluateAt(const std::vector<double>& params, const RowContext& row, int depth) const;
  std::string name_, text_, convention_;
  std::vector<ParamSpec> params_;
  ModelTraits traits_;
  std::vector<std::string> columns_;
  std::unique_ptr<internal::Node> body_;
};

/// Compiles `text` into a model named `name`. A mistyped formula throws
/// InputError positioned in the text, reported as `SOURCE:LINE:COL: error:
/// expected ..., found ...` with the offending line and a caret (`source`
/// defaults to "formula").
std::unique_ptr<FormulaModel> CompileFormula(const std::string& text,
                                             const std::string& name = "formula",
                                             const std::string& source = "formula");

/// Functions the language knows, with their arity as "name(args)" text, for
/// help output.
const std::vector<std::string>& FormulaFunctions();

}  // namespace apograph::model
