#pragma once
/// A derived column as a model: differences per row or per k rows (divided
/// by the step, or a fixed fraction of them), sums and products of other
/// columns, computed from the source's rounded entries, from a witness's own
/// entries, or from exact values. Being a model::Model, it serves every
/// later stage like any other model (Recompute, Check, a column
/// reference's ValueAt).
///
///     DerivedRelation r;                // 1/30 of the difference to the next row
///     r.rows = 1;
///     r.divisor = 30;
///     DerivedModel m("sixtieths", r, DerivedBasis::kRounded, {chord_source}, 3,
///                    Rounding::kNearest, 0.5);
///
/// Arithmetic on entries is exact (Sexagesimal); the value returned lies on
/// the side of the rounding boundary the exact arithmetic gives, so that
/// rounding it in double reproduces the exact result.

#include <cstdint>
#include <memory>
#include <string>
#include <vector>

#include "model/model.hpp"

namespace apograph::estimate {

/// What a derived column is computed from.
enum class DerivedBasis : std::uint8_t {
  /// The source's rounded entries as the author tabulated them: the source
  /// reference's values under its practice.
  kRounded,
  /// The entries of the witness at hand (a copyist or editor who recomputed
  /// the column from his own copy, slips included); where a cell is not
  /// readable, the rounded value.
  kOwnEntries,
  /// The source's exact values (a modern edition, or an author working
  /// from more precise values than he tabulated).
  kExact,
};
/// "rounded entries", "the witness's own entries", "exact values".
const char* ToString(DerivedBasis basis);

/// The relation of a derived column to its source column(s).
struct DerivedRelation {
  enum class Kind : std::uint8_t { kDifference, kSum, kProduct };
  Kind kind = Kind::kDifference;
  /// Difference: to the entry this many rows ahead (negative: from the
  /// entry that many rows behind, i.e. this one minus it).
  int rows = 1;
  int multiplier = 1;  ///< the result times multiplier / divisor
  int divisor = 1;
  /// Sum: the first column plus this times the second (-1: true = mean
  /// minus an equation whose geometric sign is the opposite of the
  /// correction's).
  int other_sign = 1;
  /// Differences of positions: brought into (-180, 180] (a motion across
  /// the turn from 359 to 1 is 2, not -358); sums of positions (true =
  /// mean + equation): brought into [0, 360), as a position is written.
  bool wrap_360 = false;
  /// `x` brought into (-180, 180] (a difference) or [0, 360) (a sum or
  /// product) when wrap_360 is set.
  Sexagesimal Wrapped(const Sexagesimal& x) const;
  double Wrapped(double x) const;
  /// "1/30 of the difference to the next row of chord", "the sum of mean
  /// and equation".
  std::string Text(const std::string& source, const std::string& other = "") const;
};

/// A source column as the derived model reads it.
struct DerivedSource {
  std::string column;                         ///< its name in the table
  std::shared_ptr<const model::Model> model;  ///< null: only its entries
  std::vector<double> params;
  model::Practice practice;  ///< places filled in
};

class DerivedModel final : public model::Model {
 public:
  /// `sources`: one (difference) or two (sum, product) columns; `places`
  /// and `rounding` of the derived column; `step` the argument step (for
  /// the argument k rows away when no table is at hand).
  DerivedModel(std::string name, DerivedRelation relation, DerivedBasis basis,
               std::vector<DerivedSource> sources, int places, Rounding rounding, double step);

  const std::string& name() const override { return name_; }
  /// The relation and basis in words.
  const std::string& description() const override { return description_; }
  const std::vector<model::ParamSpec>& params() const override { return params_; }
  double Evaluate(const std::vector<double>& params, const model::RowContext& row) const override;

  const DerivedRelation& relation() const { return relation_; }
  DerivedBasis basis() const { return basis_; }
  const std::vector<DerivedSource>& sources() const { return sources_; }

 private:
  /// The value of source `s` at row `row` (argument `arg`) as an exact
  /// entry, or nullopt.
  std::optional<Sexagesimal> Entry(const DerivedSource& s, const model::RowContext& at) const;
  double Exact(const DerivedSource& s, const model::RowContext& at) const;
  /// The context of the row `rows` away (argument from the table, or the
  /// step).
  std::optional<model::RowContext> Away(const model::RowContext& row, int rows) const;

  std::string name_, description_;
  std::vector<model::ParamSpec> params_;
  DerivedRelation relation_;
  DerivedBasis basis_;
  std::vector<DerivedSource> sources_;
  int places_ = 0;
  Rounding rounding_ = Rounding::kNearest;
  double step_ = 1;
};

}  // namespace apograph::estimate
