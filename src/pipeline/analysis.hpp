#pragma once
/// The whole chain for one table, in one call: which model and practice
/// explain each column, what every witness's deviations are (copyist's
/// slips versus the author's own departures), the collation judged by
/// those explanations, the stemma with copies and contamination, and the
/// edited table with its apparatus. This is what `apograph demo` and a
/// report render; every stage's own value is kept, so a renderer can show
/// as much evidence as it likes.
///
///     store::Database db("edition.sqlite");
///     pipeline::TableAnalysis a = pipeline::AnalyseTable(db, "sun-eq");
///     for (const auto& ref : a.references) std::cout << ref.description << "\n";
///     for (const auto& w : a.witnesses) ...   // w.findings, w.checks
///     lineage::ToNewick(a.lineage.results[0].stemma);
///     publish::ToTei(a.apparatus);

#include <string>
#include <vector>

#include "collate/collation.hpp"
#include "deviation/explain.hpp"
#include "edition/transcription.hpp"
#include "lineage/characters.hpp"
#include "lineage/lineage.hpp"
#include "pipeline/reference.hpp"
#include "pipeline/witness_findings.hpp"
#include "publish/apparatus.hpp"

namespace apograph::store {
class Database;
}

namespace apograph::pipeline {

struct AnalysisOptions {
  /// How the references are obtained; by default identified from the
  /// witnesses (ReferenceRequest::automatic).
  ReferenceRequest reference = [] {
    ReferenceRequest r;
    r.automatic = true;
    return r;
  }();
  std::vector<std::string> witnesses;  ///< sigla to analyse; empty: every witness of the table
  deviation::ExplainOptions explain;   ///< tolerance 0.5 unit: every departure is explained
  deviation::GuardOptions guard;       ///< when a column's reference is refused
  double check_tolerance = 1;          ///< the check summary flags |diff| > this
  double collate_tolerance = 1;        ///< used only where a cell has no judgement
  lineage::LineageOptions lineage;     ///< methods (parsimony by default), bootstrap
  std::string scripts_dir;             ///< numeral scripts; empty: deviation::DefaultScriptDir()
  /// The editor's overrides of adopted readings (AnalyseTable with a
  /// database adds the stored ones).
  std::vector<publish::Override> overrides;
};

/// Everything found about one table. Field by field:
struct TableAnalysis {
  std::string table_id;
  std::string table_title;
  WorkInfo work;
  std::vector<Transcription> transcriptions;  ///< the witnesses analysed, by siglum
  /// One per value column: model, parameters, practice, description and
  /// how it was obtained (ColumnReference::how names the witness
  /// identified from).
  std::vector<ColumnReference> references;
  /// Per witness (order of `transcriptions`): check summary per column,
  /// explained deviations with emendations (each cell seen with what the
  /// other witnesses read), and whether each column's reference explains it.
  std::vector<WitnessFindings> witnesses;
  /// The witnesses aligned and every reading judged by the findings
  /// (Basis::kCaller): the author's departures are right readings, slips
  /// are errors, common slips weigh less.
  collate::Collation collation;
  /// The error characters the stemma is argued from.
  lineage::CharacterMatrix characters;
  /// Stemmata (per method), groups with support, candidate direct copies,
  /// contaminated witnesses.
  lineage::LineageReport lineage;
  /// The edited table and its apparatus (lemma by the branches of the
  /// parsimony stemma, or by witness count without one).
  publish::Apparatus apparatus;

  /// The findings of one witness, or nullptr.
  const WitnessFindings* FindingsOf(const std::string& siglum) const;
  /// The reference of a column by name, or nullptr.
  const ColumnReference* ReferenceOf(const std::string& column) const;
};

/// The chain on plain values: `transcriptions` are the witnesses of one
/// table (at least one). Throws InputError on a bad reference request.
TableAnalysis AnalyseTranscriptions(std::vector<Transcription> transcriptions,
                                    const AnalysisOptions& options = {},
                                    const ModelLibrary& library = {});

/// Loads the table's current transcriptions, the saved formulas and the
/// editor's stored apparatus overrides, and runs AnalyseTranscriptions.
/// Throws InputError (option --table / --witnesses) when there is no such
/// table or witness.
TableAnalysis AnalyseTable(store::Database& db, const std::string& table_id,
                           const AnalysisOptions& options = {});

/// The lineage of a whole work: the error characters of its tables'
/// analyses joined (lineage::MergeMatrices), then one stemma for all.
/// More evidence than any one table; a witness lacking a table is unknown
/// there.
lineage::LineageReport WorkLineage(const std::vector<TableAnalysis>& tables,
                                   const lineage::LineageOptions& options = {});

/// The sigla of each independent branch below the archetype of a stemma
/// (what the apparatus's lemma choice votes by).
std::vector<std::vector<std::string>> Branches(const lineage::Stemma& stemma);

}  // namespace apograph::pipeline
