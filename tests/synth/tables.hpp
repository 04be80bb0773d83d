#pragma once
/// Seeded draws of an author's table (the archetype of a tradition) with
/// its answer key.
///
/// A draw picks a family, its parameters (round, attested-looking or, at a
/// small share, non-round), the argument (regular steps or, for mean
/// motions, irregular lists), the computing practice (rounding or
/// truncation, exact nodes every k-th argument with linear interpolation,
/// signed / magnitude / displaced forms, reduction modulo 360), derived
/// columns (differences, sums) and the author's own departures of one or
/// two units. Every value is computed by the closed forms of families.hpp.
///
/// Example:
///
///     apograph::synth::TableOptions options;
///     options.family = apograph::synth::Family::kSine;
///     auto table = apograph::synth::DrawTable(42, options);
///     // table.text: the author's table as a Transcription
///     // table.key:  family, parameters, practice, departures, per-row values

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "edition/transcription.hpp"
#include "families.hpp"
#include "number/sexagesimal.hpp"
#include "random.hpp"

namespace apograph::synth {

/// How a column that changes sign is written.
enum class SignForm {
  kAsComputed,  ///< the function keeps one sign over the table: nothing to choose
  kSigned,      ///< negative entries written with a minus
  kMagnitude,   ///< magnitudes; the sign given by a rubric per range of the argument
  kDisplaced,   ///< a constant added so that no entry is negative
};
const char* ToString(SignForm form);

/// The author's computing practice for one column.
struct Practice {
  Rounding rounding = Rounding::kNearest;
  double grid = 0;           ///< exact every `grid` argument units, linear between; 0: none
  double grid_origin = 0;    ///< argument of one node
  bool round_nodes = false;  ///< nodes rounded to the column's places before interpolating
};

/// A range of arguments over which the tabulated function has one sign
/// (the rubric of a magnitude table: "add" where +, "subtract" where -).
struct RubricRange {
  Sexagesimal from, to;
  int sign = 1;  ///< sign of the written function (after `negated`)
};

/// A column computed from other columns.
struct DerivedSpec {
  enum class Kind { kDifference, kSum };
  Kind kind = Kind::kDifference;
  std::vector<std::string> from;  ///< source columns (one for a difference, two for a sum)
  bool from_exact = false;        ///< from exact values (true) or the tabulated entries
  int span_rows = 1;              ///< difference between rows i and i + span (or i - span)
  bool forward = true;            ///< row i holds V(i + span) - V(i); else V(i) - V(i - span)
  std::int64_t divisor = 1;       ///< the difference divided by this (the step in small units)
  bool wrap_360 = false;          ///< positions: differences into (-180, 180], sums mod 360
};

/// An entry the author wrote off his own computation.
struct Departure {
  int row = 0;    ///< archetype row
  int units = 0;  ///< tabulated - computed, in units of the last place
};

/// How a mean-motion column was built.
struct MeanMotionBuild {
  /// "multiplication" (rate x t, rounded), "addition" (t x the rounded unit
  /// value: successive addition), "from-entries" (10 x the rounded entry
  /// for 10 times fewer units, m x the rounded entry for 10^k).
  std::string construction;
  std::optional<Sexagesimal> unit_value;  ///< the rounded value added (addition)
  /// from-entries: powers of ten up to this are multiplied from the rate
  std::int64_t multiplied_up_to = 100;
  std::string period;  ///< "day", "hour", "month", "year"
  std::optional<Sexagesimal> days_per_period;
  std::vector<std::string> how;  ///< per row: "rate x 29", "10 x entry 100", ...
};

/// One column of the author's table and everything about how it was made.
struct ColumnKey {
  enum class Role { kModel, kDerived, kUnexplained };
  std::string name, unit, title;
  int places = 0;
  Role role = Role::kModel;
  Function function;  ///< kModel and kUnexplained: what is tabulated
  std::optional<Sexagesimal> arg2;
  SignForm sign_form = SignForm::kAsComputed;
  bool negated = false;  ///< the function's sign flipped (signed and displaced forms)
  std::optional<Sexagesimal> displacement;
  std::vector<RubricRange> rubric;  ///< where the exact function is positive / negative
  Practice practice;
  bool modulo_360 = false;
  std::optional<DerivedSpec> derived;
  std::optional<MeanMotionBuild> mean_motion;
  std::vector<Departure> departures;
  std::vector<double> exact;           ///< per row: the function (after sign form), no practice
  std::vector<Sexagesimal> computed;   ///< per row: after the practice, before departures
  std::vector<Sexagesimal> tabulated;  ///< per row: what the author wrote
};

struct ArgumentKey {
  std::string name, unit;
  int places = 0;
  bool regular = true;  ///< start + step; else an explicit list
  std::optional<Sexagesimal> start, step;
  std::vector<Sexagesimal> values;  ///< every row's argument
};

struct TableKey {
  std::string id, title, kind;  ///< kind: the trade's words ("equation of the sun")
  Family family = Family::kSine;
  ArgumentKey argument;
  std::optional<ArgumentKey> argument2;  ///< double-argument tables (one column per value)
  std::vector<ColumnKey> columns;
  int ColumnIndex(const std::string& name) const;
};

/// The author's table: its text (witness fields left empty) and its key.
struct AuthorTable {
  Transcription text;
  TableKey key;
};

/// Every proportion of a table draw, with its default (see README.md).
struct TableOptions {
  std::optional<Family> family;  ///< fixed family; else drawn from `families`
  std::vector<Family> families;  ///< pool (empty: every family but kUnexplained, plus it at
                                 ///< share_unexplained_table)
  double share_unexplained_table = 0.05;  ///< tables whose main column no model explains
  double share_nonround = 0.08;           ///< parameters drawn non-round
  double share_attested = 0.45;           ///< of round draws: an attested-looking value
  double share_truncation = 0.2;          ///< columns truncated instead of rounded
  double share_grid = 0.25;               ///< columns computed exactly every k-th argument
  double share_round_nodes = 0.5;         ///< of grid columns: nodes rounded first
  double share_full_range = 0.6;          ///< sign-changing families over the full range
  double share_signed = 0.45;             ///< of sign-changing columns: signed
  double share_displaced = 0.2;           ///< of sign-changing columns: displaced (rest: magnitude)
  double share_negated = 0.25;            ///< of signed / displaced: the sign flipped
  double share_double_argument = 0.15;    ///< latitude families as a grid of latitudes
  double share_derived = 0.3;             ///< tables with a difference column
  double share_derived_exact = 0.35;      ///< of difference columns: from exact values
  double share_derived_extra_place = 0.6;  ///< of difference columns: one more place
  double share_derived_divided = 0.5;      ///< of difference columns: divided by the step
  double share_derived_span = 0.2;         ///< of difference columns: per k rows (k = grid or 2..6)
  double share_sum_exact = 0.35;           ///< of sums (true = mean + equation): from exact values
  double departure_rate = 0.03;            ///< entries the author wrote off his computation
  double share_departure_two = 0.15;       ///< of departures: two units
  bool departures_in_derived = true;       ///< derived columns get departures too
  double share_unexplained_column = 0.08;  ///< tables with an extra column no model explains
  double share_irregular_mean_motion = 0.6;  ///< mean motions by an irregular argument list
  double share_addition = 0.35;              ///< mean motions by successive addition
  double share_from_entries = 0.3;           ///< mean motions (decimal lists) from rounded entries
  int max_rows = 360;                        ///< longest table drawn
};

/// Draws one author's table. `id` names the table (default: the family).
AuthorTable DrawTable(Rng& rng, const TableOptions& options, const std::string& id = "");
/// Same, with a fresh generator seeded from `seed`.
AuthorTable DrawTable(std::uint64_t seed, const TableOptions& options, const std::string& id = "");

/// Apograph built-in models that compute the same values as a column's
/// function (names from `apograph formula list --builtin`, parameters by
/// apograph's names), for scoring an identification. Practice not included.
struct EquivalentModel {
  std::string model;
  std::vector<std::pair<std::string, double>> params;
  std::string note;
};
std::vector<EquivalentModel> EquivalentModels(const ColumnKey& column);

}  // namespace apograph::synth
