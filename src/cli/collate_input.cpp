#include "cli/collate_input.hpp"

#include <algorithm>
#include <sstream>

#include "deviation/numeral_script.hpp"
#include "pipeline/witness_findings.hpp"
#include "store/edition_store.hpp"
#include "support/input_error.hpp"

namespace apograph::cli {
namespace {

std::vector<std::string> Split(const std::string& text, char sep) {
  std::vector<std::string> out;
  std::stringstream in(text);
  for (std::string part; std::getline(in, part, sep);) {
    if (!part.empty()) out.push_back(part);
  }
  return out;
}

/// Each witness's findings against the references become the judgements.
collate::CollateOptions JudgedOptions(store::Database& db,
                                      const std::vector<Transcription>& witnesses,
                                      const CollateRequest& r) {
  pipeline::ReferenceRequest request = r.reference;
  if (!r.column.empty()) request.columns = {r.column};
  const auto refs = pipeline::ResolveReferences(witnesses, request, pipeline::LoadModelLibrary(db));
  const auto findings = pipeline::ExplainTradition(witnesses, refs, r.scripts);
  return pipeline::JudgedCollateOptions(witnesses, refs, findings, r.tolerance);
}

}  // namespace

void AddCollateOptions(po::options_description& o, CollateRequest& r) {
  o.add_options()("witnesses", po::value(&r.witnesses),
                  "only these witnesses (comma-separated sigla)")(
      "column", po::value(&r.column), "the column the model computes (default: every column)")(
      "tolerance", po::value(&r.tolerance)->default_value(1),
      "units of the last place a reading may lie from the recomputed value (cells without a "
      "judgement)")("scripts", po::value(&r.scripts)->default_value(deviation::DefaultScriptDir()),
                    "folder of numeral scripts");
  AddReferenceOptions(
      o, r.reference_args,
      "identify each column's model, parameters and practice from the witnesses, and judge by it");
}

void FinishCollateRequest(CollateRequest& r, const po::variables_map& vm) {
  r.reference = ToReferenceRequest(r.reference_args, vm);
  if (r.reference.Empty() && !r.reference_args.params.empty()) {
    throw InputError::ForOption("--param",
                                "expected --model or --formula with --param, found neither");
  }
}

collate::Collation CollateFromDb(store::Database& db, const CollateRequest& r) {
  auto all = store::LoadTable(db, r.table);
  if (all.empty()) {
    throw InputError::ForOption("--table",
                                ExpectedFound("a table with transcriptions", "'" + r.table + "'"));
  }
  std::vector<Transcription> chosen;
  if (r.witnesses.empty()) {
    chosen = std::move(all);
  } else {
    for (const auto& s : Split(r.witnesses, ',')) {
      auto it = std::find_if(all.begin(), all.end(),
                             [&](const Transcription& t) { return t.witness.siglum == s; });
      if (it == all.end()) {
        throw InputError::ForOption("--witnesses",
                                    ExpectedFound("a witness of table " + r.table, "'" + s + "'"));
      }
      chosen.push_back(*it);
    }
  }
  collate::CollateOptions options;
  options.tolerance_units = r.tolerance;
  if (!r.reference.Empty()) options = JudgedOptions(db, chosen, r);
  return collate::Collate(chosen, options);
}

}  // namespace apograph::cli
