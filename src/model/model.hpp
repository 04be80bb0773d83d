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
  std::string name;         ///< e.g. "e"
  std::string unit;         ///< e.g. "parts of 60", "deg"
  std::string description;
  double default_value = 0;
  double low = 0;           ///< typical historical range, used as search bounds
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
  /// Defaults of all parameters, in order.
  std::vector<double> Defaults() const;
};

/// How the table's author brought exact values into the table.
struct Practice {
  Rounding rounding = Rounding::kNearest;
  std::optional<int> places;  ///< default: the column's places
  /// Interpolation grid in argument units: exact values at arguments that are
  /// multiples of `grid`, linear in between, then rounded. 0 = none.
  double grid = 0;
  double displacement = 0;  ///< constant added to every entry
};

/// The recomputation of one column of a table.
struct ColumnRecomputation {
  std::vector<double> exact;                         ///< model value per row (NaN: none)
  std::vector<std::optional<Sexagesimal>> computed;  ///< after the practice
};

/// Evaluates `model` on every row of column `column`. The argument used is the
/// expected one (from the declared start and step) when the table declares
/// them, otherwise the argument as written; rows whose argument is unreadable
/// and undeclared get no value.
ColumnRecomputation Recompute(const Model& model, const std::vector<double>& params,
                              const Transcription& table, int column, const Practice& practice);

/// The argument a model should use for row `row` (see Recompute).
std::optional<double> RowArgument(const Transcription& table, std::size_t row);

/// Built-in models, by name; nullptr when unknown.
const Model* FindBuiltinModel(std::string_view name);
/// All built-in models in a stable order.
std::vector<const Model*> BuiltinModels();

}  // namespace apograph::model
