#pragma once
/// Columns computed from other columns of the same table: differences of
/// entries one or k rows apart (whole, divided by the step, or a fixed
/// fraction such as the "sixtieths" of an interpolation column), sums and
/// products of two columns - and what they were computed from: the
/// witness's tabulated entries, the source's rounded values (as the author
/// tabulated them, when a reference gives them), or exact values.
///
/// Each relation is evaluated in exact sexagesimal arithmetic on the
/// tabulated source entries and on the rounded source values, and in double
/// on exact source values (given, e.g. from a fit of the source's model, or
/// else a local quadratic smoothing of the tabulated source, which removes
/// most of its rounding), and compared with the target entry brought to its
/// places (nearest or truncated). A relation is reported when at least
/// kDerivedShare (kDifferenceShare) of the rows it applies to are
/// reproduced from some basis
/// (not necessarily the same at every row); the basis that reproduces most
/// is named.

#include <optional>
#include <string>
#include <vector>

#include "edition/transcription.hpp"
#include "estimate/derived_model.hpp"

namespace apograph::estimate {

/// Share of rows a sum or product must reproduce (from at least one basis)
/// to be reported. Judgement: with a fifth of the derived entries miscopied
/// and the author's own departures, the right relation keeps about three
/// quarters; a chance relation between columns of two or more places
/// matches a few rows, but a sum with a magnitude where the signed value was
/// added matches the rows of one sign, which may be well over half.
inline constexpr double kDerivedShare = 0.7;

/// The same for a difference of one column's entries (no sign to confuse).
/// Judgement, checked on the shared generator (identify_accuracy_bench,
/// seeds 1..600, 194 difference columns): a source's slip spoils two
/// differences of its tabulated entries, so that with a fifth of the
/// entries miscopied a difference of tabulated entries keeps about half its
/// rows; the share of a model's verdict (kExplainedShare).
inline constexpr double kDifferenceShare = 0.5;

struct DerivedColumn {
  int column = 0;        ///< the derived column
  int source = 0;        ///< the column it is made from
  int other = -1;        ///< second column of a sum or product
  DerivedRelation spec;  ///< the relation
  std::string relation;  ///< spec in words
  Rounding rounding = Rounding::kNearest;
  int rows = 0;               ///< rows the relation applies to
  int matched_tabulated = 0;  ///< reproduced from the tabulated source entries
  int matched_rounded = 0;    ///< from the source's rounded values (0 without them)
  int matched_precise = 0;    ///< reproduced from precise source values
  int matched_any = 0;        ///< reproduced from at least one of the three
  DerivedBasis best = DerivedBasis::kOwnEntries;  ///< the basis that reproduces most
  /// "tabulated entries", "rounded values", "precise values", "cannot tell".
  std::string basis;
  std::vector<std::size_t> mismatched_rows;  ///< rows not reproduced from the tabulated entries
  std::string evidence;                      ///< one sentence with an example in exact arithmetic
};

/// What is known of the source columns beyond their entries (per column,
/// per row; empty vectors where unknown).
struct DerivedInputs {
  std::vector<std::vector<double>> exact;                        ///< NaN where undefined
  std::vector<std::vector<std::optional<Sexagesimal>>> rounded;  ///< as the author tabulated
  /// For sums: the signed exact and rounded values of columns that print
  /// magnitudes (empty where the same as exact and rounded).
  std::vector<std::vector<double>> exact_signed;
  std::vector<std::vector<std::optional<Sexagesimal>>> rounded_signed;
};

/// Finds derived columns. `inputs` (optional) gives exact and rounded
/// values of source columns.
std::vector<DerivedColumn> DetectDerivedColumns(const Transcription& table,
                                                const DerivedInputs* inputs = nullptr);

/// Every relation the detection tries for a table whose argument step is
/// `step` (differences, sums, products).
std::vector<DerivedRelation> CandidateRelations(double step);

}  // namespace apograph::estimate
