#pragma once
/// The model library's public face: what recomputation, estimation and the
/// deviation stage call. A model maps parameters and a row's arguments to the
/// exact (double) value of an entry; computing practice (rounding,
/// truncation, interpolation grid, displacement) is applied separately.

#include <cstddef>
#include <memory>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "edition/transcription.hpp"
#include "number/sexagesimal.hpp"

namespace apograph::model {

/// One parameter of a model.
struct ParamSpec {
  std::string name;  ///< e.g. "e"
  std::string unit;  ///< e.g. "parts of 60", "deg"
  std::string description;
  double default_value = 0;
  double low = 0;  ///< typical historical range, used as search bounds
  double high = 0;
};

/// What a model may look at when it computes one entry.
struct RowContext {
  double arg = 0;                        ///< the row argument (expected, or as written)
  std::optional<double> arg2;            ///< column argument of a double-argument table
  const Transcription* table = nullptr;  ///< the whole table, for formulas that
  std::size_t row = 0;                   ///< refer to other columns or rows
  int column = -1;                       ///< the column being computed
};

/// A model of one column. Built-in models and user formulas both implement it.
class Model {
 public:
  virtual ~Model() = default;
  virtual const std::string& name() const = 0;
  /// The published formula it implements, in one or two sentences.
  virtual const std::string& description() const = 0;
  virtual const std::vector<ParamSpec>& params() const = 0;
  /// The exact value for one row; NaN where the model is undefined.
  virtual double Evaluate(const std::vector<double>& params, const RowContext& row) const = 0;
  /// The exact value (as Evaluate) and its partial derivatives with respect
  /// to the parameters params()[wrt[j]], written to gradient[j]. Estimation
  /// needs them for every entry at every step. The default takes forward
  /// differences (step 1e-7 max(|p|, 0.01)), so user formulas need nothing
  /// more; built-in models give exact derivatives by dual numbers at about
  /// the cost of one evaluation.
  virtual double EvaluateWithGradient(const std::vector<double>& params, const RowContext& row,
                                      const std::vector<int>& wrt, double* gradient) const;
  /// Whether EvaluateWithGradient is exact rather than forward differences
  /// (a caller comparing values modulo 360 must difference the wrapped
  /// residuals itself when it is not).
  virtual bool ExactGradient() const { return false; }
  /// Defaults of all parameters, in order.
  std::vector<double> Defaults() const;
  /// The argument convention in words: what the argument is, how arguments
  /// beyond 90/180/360 are treated (symmetry, sign) and whether a constant is
  /// added. Empty when the model says nothing (user formulas).
  virtual const std::string& convention() const;
  /// Index of a parameter by name, or -1.
  int ParamIndex(std::string_view param_name) const;
};

/// How the table's author brought exact values into the table.
///
/// The order of operations for one entry at argument x is:
///  1. v = model(x), or, with a grid g > 0 and x not a node, the straight
///     line between the nodes n0 = origin + g*floor((x-origin)/g) and n0 + g:
///     v = f(n0) + (f(n0+g) - f(n0)) * (x - n0) / g, where f is the model
///     value at a node, itself brought to `places` places first when
///     `round_nodes` is set (the author tabulated the nodes, then filled in
///     between from the rounded nodes); a node's own entry is f(node);
///  2. v += displacement;
///  3. the entry is v brought to `places` places by `rounding`.
struct Practice {
  Rounding rounding = Rounding::kNearest;
  std::optional<int> places;  ///< default: the column's places
  /// Interpolation grid in argument units: exact values at arguments that are
  /// multiples of `grid` (counted from `grid_origin`), linear in between,
  /// then rounded. 0 = none.
  double grid = 0;
  double displacement = 0;  ///< constant added to every entry (before rounding)
  /// With a grid: bring the node values to `places` places (with `rounding`)
  /// before interpolating between them. Default: exact nodes.
  bool round_nodes = false;
  double grid_origin = 0;  ///< nodes at grid_origin + k * grid
};

/// "nearest" or "truncate".
const char* ToString(Rounding rounding);
/// The inverse of ToString; nullopt for anything else.
std::optional<Rounding> RoundingFromString(std::string_view text);

/// The recomputation of one column of a table.
struct ColumnRecomputation {
  std::vector<double> exact;                         ///< model value per row (NaN: none)
  std::vector<std::optional<Sexagesimal>> computed;  ///< after the practice
};

/// Evaluates `model` on every row of column `column`. The argument used is
/// Transcription::ArgumentInUse: the written one when it fits the sequence,
/// repaired from its neighbours when it was miscopied; rows with no usable
/// argument get no value.
ColumnRecomputation Recompute(const Model& model, const std::vector<double>& params,
                              const Transcription& table, int column, const Practice& practice);

/// The argument a model should use for row `row` (see Recompute).
std::optional<double> RowArgument(const Transcription& table, std::size_t row);

/// The exact value for one row under `practice`, before the final rounding
/// (steps 1 and 2 above); NaN where the model is undefined.
double PracticeValue(const Model& model, const std::vector<double>& params, const RowContext& row,
                     const Practice& practice, int places);

/// PracticeValue and its partial derivatives with respect to
/// params[wrt[j]] (see Model::EvaluateWithGradient). With rounded nodes the
/// rounding counts as the identity in the derivatives (it is flat almost
/// everywhere, which would tell a solver nothing about where to go).
double PracticeValueWithGradient(const Model& model, const std::vector<double>& params,
                                 const RowContext& row, const Practice& practice, int places,
                                 const std::vector<int>& wrt, double* gradient);

/// Built-in models, by name; nullptr when unknown.
const Model* FindBuiltinModel(std::string_view name);
/// All built-in models in a stable order.
std::vector<const Model*> BuiltinModels();

}  // namespace apograph::model
