// apograph errors: explain a witness's deviations from a model, propose
// emendations and record them in the database for the editor to decide.
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <ostream>

#include <nlohmann/json.hpp>

#include "cli/batch_output.hpp"
#include "cli/command.hpp"
#include "cli/errors_output.hpp"
#include "cli/estimate_options.hpp"
#include "cli/reference_options.hpp"
#include "deviation/explain.hpp"
#include "deviation/numeral_script.hpp"
#include "estimate/notation.hpp"
#include "model/model.hpp"
#include "pipeline/decisions.hpp"
#include "pipeline/reference.hpp"
#include "pipeline/witness_findings.hpp"
#include "store/deviation_store.hpp"
#include "store/edition_store.hpp"
#include "support/input_error.hpp"
#include "support/ordered_batch.hpp"
#include "support/tabular.hpp"

namespace apograph::cli {

extern const char kErrorsUsage[] =
    "usage: apograph errors --table ID --witness SIGLUM\n"
    "                       ((--model NAME | --formula TEXT) [--param N=V]... [practice options]\n"
    "                        | --auto [--model NAME | --formula TEXT] [practice options])\n"
    "                       [--column NAME] [--tolerance U]\n"
    "                       [--revision N] [--scripts DIR] [--no-record] [--format text|csv|json] "
    "[--db FILE]\n"
    "       apograph errors (--all | --work WORK) (--model ... | --auto ...) [the options above]\n"
    "                       [--threads N]\n"
    "\n"
    "Recomputes the witness's entries from the model and, for every entry further\n"
    "from it than the tolerance (units of the last place, default 0.5), ranks the\n"
    "explanations: a confusion of symbols in the witness's numeral script,\n"
    "transposed digits, a place omitted/added/moved, a run of entries displaced by\n"
    "rows (reported once), a repeated neighbour, a blank or illegible cell, the\n"
    "author's own computation, or 'unexplained'. Each finding is one line that\n"
    "reads like a critical note; the proposed readings are recorded in the\n"
    "database as emendations for the editor to accept or reject (apograph\n"
    "emendation). --auto first identifies each column's model, parameters and\n"
    "computing practice (interpolation grid, truncation, displacement) as apograph\n"
    "identify does, from every witness of the table, keeping the witness whose best\n"
    "explanation reproduces most entries exactly, and brings the parameters to the\n"
    "coarsest sexagesimal values that reproduce as many; with --model (or --formula)\n"
    "only that model is tried, and with practice options too only its parameters are\n"
    "fitted. Practice options: --rounding nearest|truncate, --places N, --grid G\n"
    "[--grid-origin O] [--round-nodes], --displacement D, --sign signed|negated|magnitude.\n"
    "Exit 1 when there are findings.\n"
    "--all (or --work) goes table by table in one process on every core (references\n"
    "from all of a table's witnesses, as for one), printing each witness as it is\n"
    "explained (CSV rows with its table and witness; JSON one object per witness and\n"
    "line) and recording its proposals; a progress bar shows on a terminal.\n"
    "\n"
    "example: apograph errors --table sun-eq --witness D --model solar-eccentric --param 'e=2;16' "
    "--grid 6\n"
    "         apograph errors --table sun-eq --witness D --auto";

namespace {

struct ErrorsOptions {
  std::string db, table, witness, column, format, scripts;
  ReferenceArgs reference;
  double tolerance = 0.5;
  int revision = 0;
  bool no_record = false;
};

void Print(const ErrorsOptions& o, const Transcription& t,
           const std::vector<pipeline::ColumnReference>& refs,
           const pipeline::WitnessFindings& explained, Io& io) {
  switch (ParseFormat(o.format)) {
    case Format::kJson:
      io.out << ErrorsJson(o.tolerance, t, refs, explained).dump(2) << "\n";
      return;
    case Format::kCsv: {
      Tabular tab;
      tab.headers = kCsvHeaders;
      tab.rows = CsvRows(explained.findings);
      io.out << tab.RenderCsv();
      return;
    }
    case Format::kText:
      PrintText(t, refs, explained, true, io);
      return;
  }
}

std::vector<store::EmendationRecord> Proposals(const Transcription& t, int revision,
                                               const std::string& model,
                                               const std::vector<deviation::Finding>& findings) {
  std::vector<store::EmendationRecord> out;
  for (std::size_t i = 0; i < findings.size(); ++i) {
    const auto& f = findings[i];
    if (!deviation::IsCopyingSlip(f.best().cls)) continue;
    for (const auto& c : f.cells) {
      if (!c.emendation || (c.value && c.emendation->Identical(c.value->Rounded(f.places))))
        continue;
      store::EmendationRecord r;
      r.table_id = t.table_id;
      r.siglum = t.witness.siglum;
      r.revision = revision;
      r.row = static_cast<int>(c.row);
      r.column = f.column;
      r.column_name = f.column_name;
      r.arg = c.arg;
      r.tabulated = c.tabulated;
      r.proposed = c.emendation->ToString();
      r.cls = deviation::ToString(f.best().cls);
      r.evidence = f.best().evidence;
      r.score = f.best().score;
      r.model = model;
      r.group = f.cells.size() > 1 ? static_cast<int>(i + 1) : 0;
      out.push_back(std::move(r));
    }
  }
  return out;
}

/// Records a witness's proposals unless --no-record; a line on stderr.
void Record(store::Database& db, const ErrorsOptions& o, const Transcription& t, int revision,
            const std::vector<pipeline::ColumnReference>& refs,
            const std::vector<deviation::Finding>& findings, Io& io) {
  if (o.no_record) return;
  auto proposals = Proposals(t, revision, ModelText(refs, t), findings);
  if (proposals.empty()) return;
  const auto r = pipeline::RecordProposals(db, proposals);
  io.err << "recorded " << r.added << " new proposed emendation" << (r.added == 1 ? "" : "s")
         << (o.table.empty() ? " for " + t.table_id + " " + t.witness.siglum : "") << " in " << o.db
         << (r.kept ? " (" + std::to_string(r.kept) + " already recorded)" : "") << "\n";
}

bool Refused(const pipeline::WitnessFindings& explained) {
  return std::any_of(explained.verdicts.begin(), explained.verdicts.end(),
                     [](const auto& v) { return !v.verdict.explains; });
}

/// errors --all / --work: table by table (the references come from all of a
/// table's witnesses), each witness printed as it is explained and its
/// proposals recorded; JSON is one object per witness and line.
int RunBatch(store::Database& db, const ErrorsOptions& o, const BatchArgs& batch,
             const pipeline::ReferenceRequest& request, Io& io) {
  std::vector<std::string> tables;
  for (const auto& r : BatchScope(db, batch)) {
    if (tables.empty() || tables.back() != r.table_id) tables.push_back(r.table_id);
  }
  const pipeline::ModelLibrary library = LoadModels(db, io);
  const Format format = ParseFormat(o.format);
  std::vector<std::string> headers = {"table", "witness"};
  headers.insert(headers.end(), kCsvHeaders.begin(), kCsvHeaders.end());
  StreamingTable csv(io, format == Format::kCsv ? format : Format::kJson, headers);
  deviation::ExplainOptions eo;
  eo.tolerance = o.tolerance;
  struct Done {
    std::vector<pipeline::ColumnReference> refs;
    std::vector<pipeline::WitnessFindings> explained;
  };
  bool findings = false;
  ProgressBar bar(io, "errors");
  support::RunInOrder<std::vector<Transcription>, Done>(
      tables.size(), {static_cast<unsigned>(batch.threads)},
      [&](std::size_t i) { return store::LoadTable(db, tables[i]); },
      [&](const std::vector<Transcription>& witnesses) -> Done {
        pipeline::ReferenceRequest one = request;
        if (!o.column.empty()) one.columns = {o.column};
        auto refs = pipeline::ResolveReferences(
            request.automatic ? witnesses : std::vector<Transcription>{witnesses.front()}, one,
            library);
        auto explained = pipeline::ExplainTradition(witnesses, refs, o.scripts, eo);
        return {std::move(refs), std::move(explained)};
      },
      [&](std::size_t, std::vector<Transcription>&& witnesses, Done&& d) {
        for (std::size_t w = 0; w < witnesses.size(); ++w) {
          const Transcription& t = witnesses[w];
          const auto& e = d.explained[w];
          findings = findings || !e.findings.empty() || Refused(e);
          if (format == Format::kText) {
            PrintText(t, d.refs, e, w == 0, io);
            io.out << "\n";
          } else if (format == Format::kJson) {
            io.out << ErrorsJson(o.tolerance, t, d.refs, e).dump() << "\n";
          } else {
            for (auto& row : CsvRows(e.findings)) {
              row.insert(row.begin(), {t.table_id, t.witness.siglum});
              csv.Add(row);
            }
          }
          Record(db, o, t, store::CurrentRevision(db, t.table_id, t.witness.siglum), d.refs,
                 e.findings, io);
        }
      },
      [&](std::size_t done, std::size_t total) { bar.Show(done, total); });
  csv.Finish();
  return findings ? kFindings : kOk;
}

}  // namespace

int RunErrors(const std::vector<std::string>& args, Io& io) {
  ErrorsOptions o;
  po::options_description options("options");
  BatchArgs batch;
  options.add_options()("table", po::value(&o.table), "table id")(
      "witness", po::value(&o.witness), "siglum of the witness")("column", po::value(&o.column),
                                                                 "only this column")(
      "tolerance", po::value(&o.tolerance)->default_value(0.5),
      "units of the last place an entry may differ")(
      "revision", po::value(&o.revision),
      "an earlier revision of the transcription (default: current)")(
      "scripts", po::value(&o.scripts)->default_value(deviation::DefaultScriptDir()),
      "folder of numeral scripts")("no-record", po::bool_switch(&o.no_record),
                                   "do not record the proposals in the database");
  AddReferenceOptions(
      options, o.reference,
      "identify the model, parameters and practice from the table's witnesses first");
  AddBatchOptions(options, batch);
  AddFormatOption(options, o.format, {"text", "csv", "json"});
  AddDbOption(options, o.db);
  po::variables_map vm;
  if (ParseOptions(FindCommand("errors"), args, options, vm, io)) return kOk;
  CheckBatchOptions(batch, !o.table.empty() || !o.witness.empty(), "errors");
  if (!batch.Batch() && (o.table.empty() || o.witness.empty()))
    throw InputError::ForOption(o.table.empty() ? "--table" : "--witness",
                                ExpectedFound("--table and --witness together", "only one"));
  if (batch.Batch() && o.revision > 0)
    throw InputError::ForOption(
        "--revision", ExpectedFound("one table (--all explains current revisions)", "--all"));
  CheckChoice("--rounding", o.reference.rounding, {"nearest", "truncate"});
  pipeline::ReferenceRequest request = ToReferenceRequest(o.reference, vm);
  if (request.Empty())
    throw InputError::ForOption(
        "--model", "expected --model NAME, --formula TEXT or --auto, found none of them");
  if (!(o.tolerance >= 0))
    throw InputError::ForOption(
        "--tolerance", ExpectedFound("a number of units >= 0", std::to_string(o.tolerance)));

  store::Database db = OpenEdition(o.db);
  if (batch.Batch()) return RunBatch(db, o, batch, request, io);
  const Transcription t = store::Load(
      db, o.table, o.witness, o.revision > 0 ? std::optional<int>(o.revision) : std::nullopt);
  if (!o.column.empty()) request.columns = {o.column};
  // Every witness of the table (this revision of this one): --auto identifies
  // from them, and each cell is judged with what the others read there.
  std::vector<Transcription> witnesses = store::LoadTable(db, o.table);
  std::erase_if(witnesses,
                [&](const Transcription& w) { return w.witness.siglum == t.witness.siglum; });
  witnesses.insert(witnesses.begin(), t);
  const auto refs = pipeline::ResolveReferences(
      request.automatic ? witnesses : std::vector<Transcription>{t}, request, LoadModels(db, io));
  deviation::ExplainOptions eo;
  eo.tolerance = o.tolerance;
  const auto explained = pipeline::ExplainTradition(witnesses, refs, o.scripts, eo).front();
  Print(o, t, refs, explained, io);
  Record(db, o, t, o.revision > 0 ? o.revision : store::CurrentRevision(db, o.table, o.witness),
         refs, explained.findings, io);
  return explained.findings.empty() && !Refused(explained) ? kOk : kFindings;
}

}  // namespace apograph::cli
