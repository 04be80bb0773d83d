// apograph stemma: the stemma of one table or of all tables of a work, by
// neighbour joining and/or maximum parsimony over the shared errors.
#include "cli/command.hpp"

#include <cstdio>
#include <filesystem>
#include <ostream>

#include "cli/collate_input.hpp"
#include "cli/output_files.hpp"
#include "lineage/lineage.hpp"
#include "lineage/lineage_text.hpp"
#include "store/edition_store.hpp"
#include "support/input_error.hpp"

namespace apograph::cli {

extern const char kStemmaUsage[] =
    "usage: apograph stemma (--table ID | --work ID) [--method nj|parsimony|both] [--bootstrap N]\n"
    "                       [--seed N] [--format text|newick|dot|json] [--svg FILE [--force]]\n"
    "                       [--witnesses A,B,...] [--db FILE]\n"
    "                       [(--model NAME | --formula TEXT) [--param N=V]... [practice options] | "
    "--auto]\n\n"
    "Works out the stemma from the errors the witnesses share (shared right readings\n"
    "do not count; distinctive errors weigh more than common slips), rooted at the\n"
    "archetype. Parsimony is exact (branch-and-bound) up to 12 witnesses and a\n"
    "heuristic (stepwise addition + SPR) beyond. Also names candidate direct copies\n"
    "and contaminated witnesses with the rows where they change exemplar.\n"
    "--svg renders the DOT drawing with Graphviz (dot) into FILE (an existing file only\n"
    "with --force, never the edition database). --bootstrap takes at most 100000.\n"
    "Which readings are errors: see apograph collate --help. With --auto (or a model)\n"
    "the author's own departures from the model do not count as errors of descent\n"
    "and common slips weigh less; --work with --auto identifies each table's model.\n"
    "Exit code 1 when copies or contamination were found.\n\n"
    "example: apograph stemma --table sun-eq --auto --method both --bootstrap 100";

namespace {

lineage::CharacterMatrix Characters(store::Database& db, const std::string& table,
                                    const std::string& work, CollateRequest request) {
  if (!table.empty()) {
    request.table = table;
    return lineage::BuildErrorCharacters(CollateFromDb(db, request));
  }
  if (!request.reference.Empty() && !request.reference.automatic) {
    throw InputError::ForOption(
        "--model",
        "expected --table with a model (a work's tables differ; --auto identifies "
        "each table's own), found --work");
  }
  std::vector<lineage::CharacterMatrix> parts;
  for (const auto& t : store::TablesOfWork(db, work)) {
    request.table = t;
    if (!store::Sigla(db, t).empty())
      parts.push_back(lineage::BuildErrorCharacters(CollateFromDb(db, request)));
  }
  if (parts.empty())
    throw InputError::ForOption("--work",
                                ExpectedFound("a work with transcribed tables", "'" + work + "'"));
  return lineage::MergeMatrices(parts);
}

}  // namespace

int RunStemma(const std::vector<std::string>& args, Io& io) {
  po::options_description options("options");
  CollateRequest request;
  std::string table, work, method, format, db_path, svg;
  lineage::LineageOptions lo;
  options.add_options()("table", po::value(&table), "table id")("work", po::value(&work),
                                                                "work id (all its tables)")(
      "method", po::value(&method)->default_value("parsimony"), "nj|parsimony|both")(
      "bootstrap", po::value(&lo.bootstrap)->default_value(0),
      "bootstrap replicates (rows resampled)")("seed", po::value(&lo.seed)->default_value(1),
                                               "random seed of the bootstrap and the heuristic")(
      "svg", po::value(&svg), "render the stemma with Graphviz into this SVG file")(
      "force", "replace an existing --svg file");
  AddCollateOptions(options, request);
  AddFormatOption(options, format, {"text", "newick", "dot", "json"});
  AddDbOption(options, db_path);
  po::variables_map vm;
  if (ParseOptions(FindCommand("stemma"), args, options, vm, io)) return kOk;
  FinishCollateRequest(request, vm);
  CheckChoice("--method", method, {"nj", "parsimony", "both"});
  if (table.empty() == work.empty())
    throw InputError::ForOption("stemma", "expected one of --table or --work, found " +
                                              std::string(table.empty() ? "neither" : "both"));
  // A replicate costs a whole tree search: 100000 of them already take hours
  // on a large tradition, and supports need no more than 1,000 (judgement).
  constexpr int kMaxBootstrap = 100000;
  if (lo.bootstrap < 0 || lo.bootstrap > kMaxBootstrap)
    throw InputError::ForOption(
        "--bootstrap", ExpectedFound("a count from 0 to 100000", std::to_string(lo.bootstrap)));
  if (method == "nj") lo.methods = {lineage::Method::kNeighbourJoining};
  if (method == "both")
    lo.methods = {lineage::Method::kParsimony, lineage::Method::kNeighbourJoining};
  const OutputRules svg_rules{"--svg", db_path, vm.count("force") > 0, {}};
  if (!svg.empty()) CheckOutputFile(svg, svg_rules);  // before the work, not after
  store::Database db = OpenEdition(db_path);
  const auto report = lineage::AnalyseLineage(Characters(db, table, work, request), lo);
  if (format == "json") {
    io.out << lineage::ToJson(report).dump(2) << "\n";
  } else if (format == "newick") {
    for (const auto& res : report.results) io.out << lineage::ToNewick(res.stemma) << "\n";
  } else if (format == "dot") {
    for (std::size_t k = 0; k < report.results.size(); ++k) io.out << lineage::ToDot(report, k);
  } else {
    io.out << lineage::DescribeLineage(report);
  }
  if (!svg.empty() && !RenderSvgFile(lineage::ToDot(report), svg, svg_rules)) {
    throw InputError::ForOption("--svg",
                                "expected Graphviz 'dot' on PATH to render SVG, found none");
  }
  return report.copies.empty() && report.contamination.empty() ? kOk : kFindings;
}

}  // namespace apograph::cli
