// apograph catalog: list attested parameter values (shipped file + database)
// or add one to the database.
#include "cli/command.hpp"

#include <filesystem>
#include <ostream>

#include <nlohmann/json.hpp>

#include "estimate/catalog.hpp"
#include "store/estimate_store.hpp"
#include "support/input_error.hpp"
#include "support/tabular.hpp"

namespace apograph::cli {

extern const char kCatalogUsage[] =
    "usage: apograph catalog list [--kind KIND] [--model MODEL] [--format text|csv|json] [--db "
    "FILE]\n"
    "       apograph catalog add --kind KIND --applies-to MODEL:PARAM... --value VALUE\n"
    "                            --source SOURCE [--tradition TEXT] [--from-memory] [--db FILE]\n\n"
    "Attested parameter values come from corpora/catalog/parameters.tsv (shipped; rows\n"
    "recalled rather than read are marked from memory) and from rows added to the database.\n"
    "fit and identify name the nearest attested values and their distance in standard errors.\n\n"
    "example:\n"
    "  apograph catalog add --kind obliquity --applies-to declination:obliquity \\\n"
    "      --value '23;33,30' --tradition \"Tables of Qarmel\" --source \"MS Q, fol. 3r\"\n"
    "  apograph catalog list --kind obliquity";

namespace {

std::vector<estimate::CatalogEntry> AllEntries(const std::string& db_path) {
  std::vector<estimate::CatalogEntry> all =
      estimate::ReadCatalogFile(estimate::DefaultCatalogPath());
  if (std::filesystem::exists(db_path)) {
    store::Database db(db_path);
    auto more = store::CatalogEntries(db);
    all.insert(all.end(), more.begin(), more.end());
  }
  return all;
}

int List(const std::vector<estimate::CatalogEntry>& all, const std::string& kind,
         const std::string& model, Format format, Io& io) {
  Tabular tab;
  tab.headers = {"kind", "value", "applies_to", "tradition", "source", "from_memory", "origin"};
  nlohmann::json j = nlohmann::json::array();
  for (const auto& e : all) {
    if (!kind.empty() && e.kind != kind) continue;
    bool model_ok = model.empty();
    for (const auto& [m, p] : e.applies_to) model_ok = model_ok || m == model;
    if (!model_ok) continue;
    tab.Add({e.kind, e.value.ToString(), e.AppliesToText(), e.tradition, e.source,
             e.from_memory ? "yes" : "no", e.origin});
    j.push_back({{"kind", e.kind},
                 {"value", e.value.ToString()},
                 {"value_real", e.value.ToDouble()},
                 {"applies_to", e.AppliesToText()},
                 {"tradition", e.tradition},
                 {"source", e.source},
                 {"from_memory", e.from_memory},
                 {"origin", e.origin}});
  }
  if (format == Format::kJson)
    io.out << nlohmann::json{{"catalog", j}}.dump(2) << "\n";
  else if (format == Format::kCsv)
    io.out << tab.RenderCsv();
  else
    io.out << tab.RenderText();
  return kOk;
}

}  // namespace

int RunCatalog(const std::vector<std::string>& args, Io& io) {
  const Command& cmd = FindCommand("catalog");
  std::string action, kind, model, applies, value, tradition, source, db, format;
  po::options_description opts("options");
  opts.add_options()("action", po::value(&action), "list or add")(
      "kind", po::value(&kind),
      "kind of parameter (obliquity, solar-eccentricity, mean-motion, ...)")(
      "model", po::value(&model), "list: only values that apply to this model")(
      "applies-to", po::value(&applies), "add: model:parameter pairs separated by blanks")(
      "value", po::value(&value), "add: the value in trade notation")(
      "tradition", po::value(&tradition)->default_value(""), "add: tradition or work")(
      "source", po::value(&source), "add: where the value was read")(
      "from-memory", "add: the value was recalled, not read");
  AddDbOption(opts, db);
  AddFormatOption(opts, format, {"text", "csv", "json"});
  po::positional_options_description pos;
  pos.add("action", 1);
  po::variables_map vm;
  if (ParseOptions(cmd, args, opts, vm, io, &pos)) return kOk;
  if (action == "list") return List(AllEntries(db), kind, model, ParseFormat(format), io);
  if (action != "add")
    throw InputError::ForOption("apograph catalog",
                                ExpectedFound("list or add", action.empty() ? "nothing" : action));
  const auto entry = estimate::MakeCatalogEntry(kind, applies, value, tradition, source,
                                                vm.count("from-memory") > 0);
  store::Database database(db);
  const auto id = store::AddCatalogEntry(database, entry);
  io.out << "added attested value #" << id << ": " << entry.kind << " " << entry.value.ToString()
         << " (" << entry.AppliesToText() << ")\n";
  return kOk;
}

}  // namespace apograph::cli
