#include "pipeline/analysis.hpp"

#include <algorithm>

#include "deviation/numeral_script.hpp"
#include "estimate/report.hpp"
#include "lineage/parsimony.hpp"
#include "store/apparatus_store.hpp"
#include "store/edition_store.hpp"
#include "store/estimate_store.hpp"
#include "support/input_error.hpp"

namespace apograph::pipeline {

namespace {

std::vector<Transcription> Chosen(std::vector<Transcription> all,
                                  const std::vector<std::string>& sigla,
                                  const std::string& table_id) {
  if (sigla.empty()) return all;
  std::vector<Transcription> out;
  for (const auto& s : sigla) {
    auto it = std::find_if(all.begin(), all.end(),
                           [&](const Transcription& t) { return t.witness.siglum == s; });
    if (it == all.end()) {
      throw InputError::ForOption("--witnesses",
                                  ExpectedFound("a witness of table " + table_id, "'" + s + "'"));
    }
    out.push_back(*it);
  }
  return out;
}

/// The parsimony stemma when the report has one, else a parsimony search now.
lineage::Stemma ParsimonyStemma(const TableAnalysis& a) {
  for (const auto& r : a.lineage.results) {
    if (r.method == lineage::Method::kParsimony) return r.stemma;
  }
  return lineage::Parsimony(a.characters).stemma;
}

}  // namespace

const WitnessFindings* TableAnalysis::FindingsOf(const std::string& siglum) const {
  for (const auto& w : witnesses) {
    if (w.siglum == siglum) return &w;
  }
  return nullptr;
}

const ColumnReference* TableAnalysis::ReferenceOf(const std::string& column) const {
  for (const auto& r : references) {
    if (r.column_name == column) return &r;
  }
  return nullptr;
}

std::vector<std::vector<std::string>> Branches(const lineage::Stemma& s) {
  std::vector<std::vector<std::string>> out;
  if (s.root < 0) return out;
  for (int child : s.nodes[static_cast<std::size_t>(s.root)].children)
    out.push_back(s.Below(child));
  return out;
}

TableAnalysis AnalyseTranscriptions(std::vector<Transcription> transcriptions,
                                    const AnalysisOptions& options, const ModelLibrary& library) {
  if (transcriptions.empty())
    throw InputError::ForOption("--table", "expected a table with transcriptions, found none");
  TableAnalysis a;
  a.table_id = transcriptions.front().table_id;
  a.table_title = transcriptions.front().table_title;
  a.work = transcriptions.front().work;
  a.transcriptions = std::move(transcriptions);
  a.references = ResolveReferences(a.transcriptions, options.reference, library);
  const std::string dir =
      options.scripts_dir.empty() ? deviation::DefaultScriptDir() : options.scripts_dir;
  a.witnesses = ExplainTradition(a.transcriptions, a.references, dir, options.explain,
                                 options.check_tolerance, options.guard);
  a.collation = collate::Collate(
      a.transcriptions,
      JudgedCollateOptions(a.transcriptions, a.references, a.witnesses, options.collate_tolerance));
  a.characters = lineage::BuildErrorCharacters(a.collation);
  a.lineage = lineage::AnalyseLineage(a.characters, options.lineage);
  a.apparatus =
      publish::BuildApparatus(a.collation, Branches(ParsimonyStemma(a)), options.overrides);
  return a;
}

lineage::LineageReport WorkLineage(const std::vector<TableAnalysis>& tables,
                                   const lineage::LineageOptions& options) {
  std::vector<lineage::CharacterMatrix> parts;
  for (const auto& t : tables) parts.push_back(t.characters);
  return lineage::AnalyseLineage(lineage::MergeMatrices(parts), options);
}

TableAnalysis AnalyseTable(store::Database& db, const std::string& table_id,
                           const AnalysisOptions& options) {
  auto all = store::LoadTable(db, table_id);
  if (all.empty()) {
    throw InputError::ForOption("--table",
                                ExpectedFound("a table with transcriptions", "'" + table_id + "'"));
  }
  AnalysisOptions o = options;
  for (const auto& d : store::LoadApparatusOverrides(db, table_id)) {
    if (!d.reading.empty()) o.overrides.push_back({d.row_argument, d.column, d.reading, d.note});
  }
  TableAnalysis a = AnalyseTranscriptions(Chosen(std::move(all), options.witnesses, table_id), o,
                                          LoadModelLibrary(db));
  const auto catalog = store::LoadCatalog(db);
  for (auto& r : a.references) {
    if (r.estimates.empty()) continue;
    estimate::FitResult fit;
    fit.model = r.model->name();
    fit.params = r.estimates;
    r.attested = estimate::AttestedText(fit, catalog);
  }
  return a;
}

}  // namespace apograph::pipeline
