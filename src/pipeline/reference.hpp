#pragma once
/// The explanation of one column that every later stage works against: a
/// model (built-in or formula), its parameter values and the author's
/// computing practice, with a sentence saying what it is and how it was
/// obtained (given by the editor, or identified from a witness).
///
/// Obtained either from an explicit request (model name, saved formula or
/// formula text; parameters; practice) or automatically: every witness's
/// column is identified (estimate::Identify: families x practices, round
/// and attested values adopted where they keep the entries), the witness
/// whose best candidate reproduces the most entries within one unit is
/// chosen (ties: more exact, the higher identification score, then the
/// first siglum). One witness rather than all of them jointly: witnesses
/// disagree exactly where they carry slips, and the least corrupted copy
/// shows the author's practice best; the description names that witness.
///
/// A column computed from another column (differences, sums, products: see
/// estimate/derived_columns.hpp) gets a derived reference: its model is an
/// estimate::DerivedModel, so that Recompute and ValueAt give the derived
/// values like any other. Where witnesses were computed differently (one
/// recomputed the column from its own rounded entries, another from exact
/// values), the reference carries one variant per computation
/// (`variants`) and ForWitness picks a witness's.
///
/// When nothing explains a column (estimate::kExplainedShare), the
/// reference is still returned, with `explains` false and the verdict in
/// words: later stages screen such a column without a model and propose no
/// emendation from it.
///
///     pipeline::ReferenceRequest r;
///     r.automatic = true;
///     auto refs = pipeline::ResolveReferences(witnesses, r, library);
///     refs[0].description  // "solar-eccentric e = 2;16, rounded to 2 places, ..."

#include <memory>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "edition/transcription.hpp"
#include "estimate/catalog.hpp"
#include "estimate/fit.hpp"
#include "estimate/identify.hpp"
#include "estimate/mean_motion_analysis.hpp"
#include "model/model.hpp"

namespace apograph::store {
class Database;
}

namespace apograph::pipeline {

/// The one registry of models for every command: the built-ins, the
/// formulas saved in the database (compiled), and the attested parameter
/// values (shipped catalog + the database's), which identification tries as
/// round values.
struct ModelLibrary {
  std::vector<std::shared_ptr<const model::Model>> formulas;
  std::vector<estimate::CatalogEntry> catalog;
  /// Saved formulas that no longer compile, with the reason (for a warning).
  std::vector<std::string> skipped;
  /// A built-in model or saved formula by name; nullptr when unknown.
  std::shared_ptr<const model::Model> Find(const std::string& name) const;
  /// As Find, or InputError naming `option`: "expected a built-in model or
  /// a saved formula (chord, sine, ...), found 'NAME'" (the one message).
  std::shared_ptr<const model::Model> FindOrThrow(const std::string& name,
                                                  const std::string& option = "--model") const;
  /// "chord, sine, ..., my-formula": for error messages.
  std::string KnownNames() const;
  /// The saved formulas as plain pointers (identify's extra models).
  std::vector<const model::Model*> FormulaPointers() const;
};

/// Every saved formula of the database that compiles (one that no longer
/// compiles goes to `skipped` with its reason) and the whole catalog.
ModelLibrary LoadModelLibrary(store::Database& db);

/// What the editor asked for. Either a model (`model` or `formula`) with
/// `params` over its defaults and `practice`, or `automatic`.
struct ReferenceRequest {
  std::string model;                                   ///< built-in model or saved formula name
  std::string formula;                                 ///< formula text (grammar/formula.ebnf)
  std::vector<std::pair<std::string, double>> params;  ///< overrides of the defaults
  model::Practice practice;
  /// Identify the model and practice from the entries. With `model` or
  /// `formula` set, only that model is tried (its parameters and the
  /// practice are still estimated).
  bool automatic = false;
  /// The editor gave the practice (rounding, places, grid, displacement):
  /// with `automatic` and a model, only the parameters are then fitted
  /// under it; `automatic` without a model refuses it.
  bool practice_given = false;
  /// For `automatic`: identify from this witness only (empty: choose).
  std::string witness;
  /// Identification runs per column; empty: every value column.
  std::vector<std::string> columns;
  bool Empty() const { return model.empty() && formula.empty() && !automatic; }
};

/// How a reference was obtained.
enum class ReferenceSource { kGiven, kIdentified };
const char* ToString(ReferenceSource source);  ///< "given", "identified"

struct ColumnReference {
  int column = 0;  ///< index in the table's columns
  std::string column_name;
  /// Shared so that references stay plain copyable values; a built-in model
  /// is held without ownership, a formula is owned.
  std::shared_ptr<const model::Model> model;
  std::vector<double> params;  ///< in the model's order
  model::Practice practice;    ///< places filled in (the column's unless given)
  std::string formula;         ///< formula text when the model is a formula
  ReferenceSource source = ReferenceSource::kGiven;
  /// For identified references: the witness identified from, and the
  /// evidence of its best candidate.
  std::string witness;
  double score = 0;
  /// The free parameters that score counted (the model's, a displacement,
  /// one for a grid): what the column's own fit spent to reach its entries.
  int penalised_parameters = 0;
  int exact = 0, entries = 0;     ///< entries of that witness reproduced exactly / compared
  int within_one = 0;             ///< entries of that witness within one unit
  std::vector<std::string> ties;  ///< identify's notes on near-ties and set-asides (not `naming`)
  /// The estimate before round values were adopted, with standard errors
  /// (identified only).
  std::vector<estimate::FittedParam> estimates;
  /// Round or attested values adopted, each with the fitted value and its
  /// error (empty: the fitted values stand).
  std::vector<estimate::AdoptedValue> adopted;
  /// Which were adopted and why, in words (empty when none).
  std::string adoption;
  /// Models that compute the same values ("solar-epicycle r = 2;30"), and
  /// why this one is shown (empty without equivalents).
  std::vector<std::string> equivalents;
  std::string naming;
  /// The "nothing fits" verdict: false when no model keeps
  /// estimate::kExplainedShare of the identified witness's entries within
  /// one unit. Later stages then screen the column without a model and
  /// record no emendation from this reference. Given references explain.
  bool explains = true;
  /// Why it does not explain the column (empty when it does).
  std::string verdict;
  /// For a derived column (`model` is then an estimate::DerivedModel): the
  /// relation and what it is computed from, in words.
  std::string derived;
  /// Per-witness computations of this column when witnesses differ: each
  /// variant is a whole reference (model, practice, description) with the
  /// sigla that follow it in `followers`. Empty when one computation serves
  /// every witness.
  std::vector<ColumnReference> variants;
  std::vector<std::string> followers;  ///< in a variant: the sigla that follow it
  /// For a mean-motion column: how the identified witness's entries were
  /// made (multiplication, successive addition, other rounded entries).
  std::optional<estimate::MeanMotionAnalysis> mean_motion;
  /// The attested values nearest to the estimate, one line each (filled by
  /// AnalyseTable from the catalog; empty otherwise).
  std::string attested;
  /// "solar-eccentric e = 2;16, rounded to 2 places, exact every 6 and
  /// linear between"
  std::string description;
  /// "identified from witness D (178 of 180 entries exact, score -60.2);
  /// parameters brought to 2 places" or "given".
  std::string how;

  /// "solar-eccentric e=2.26667 (2;16)": name and parameter values, both
  /// in decimal and, for short sexagesimal fractions, the trade's notation.
  std::string ModelText() const;
  /// The reference a witness follows: its variant when there are variants
  /// and one lists the siglum, else this one.
  const ColumnReference& ForWitness(const std::string& siglum) const;
  /// Recomputes this column of a witness (with the witness's variant).
  model::ColumnRecomputation Recompute(const Transcription& witness) const;
  /// The value at an argument (and column argument, in a double-argument
  /// table) under the practice, at the practice's places; nullopt where the
  /// model is undefined or needs the table's other cells (a formula reading
  /// col() or a neighbouring row).
  std::optional<Sexagesimal> ValueAt(double argument,
                                     std::optional<double> arg2 = std::nullopt) const;
};

/// A parameter value as an editor writes it: the trade's notation when it
/// is a sexagesimal fraction of at most 3 places (2;16), else decimal
/// (360, 2.26913).
std::string ParamValueText(double value);

/// "rounded to 2 places, exact every 6 and linear between".
std::string DescribePractice(const model::Practice& practice, int places);

/// Resolves the references of the requested columns (every value column
/// when the request names none) of a table from its witnesses (at least
/// one, all of the same table). Throws InputError (option --model,
/// --formula, --param, --auto, --witness or --column) on bad requests.
std::vector<ColumnReference> ResolveReferences(const std::vector<Transcription>& witnesses,
                                               const ReferenceRequest& request,
                                               const ModelLibrary& library = {});

/// Entries of `columns` of `table` that `model` at `params` under `practice`
/// reproduces exactly.
int ExactEntries(const model::Model& model, const std::vector<double>& params,
                 const Transcription& table, const std::vector<int>& columns,
                 const model::Practice& practice);

}  // namespace apograph::pipeline
