// apograph list: what the edition database holds, with cell counts.
#include "cli/command.hpp"

#include <filesystem>
#include <ostream>

#include <nlohmann/json.hpp>

#include "store/edition_store.hpp"
#include "support/tabular.hpp"

namespace apograph::cli {

extern const char kListUsage[] =
    "usage: apograph list [works|tables|witnesses|transcriptions|revisions]\n"
    "                     [--work ID] [--table ID] [--witness SIGLUM]\n"
    "                     [--format text|csv|json] [--db FILE]\n"
    "\n"
    "Lists the works, the tables (default; with the number of witnesses and\n"
    "current cells), the witnesses (with their tables and cells), the\n"
    "transcriptions (one per table and witness, with the current revision),\n"
    "or every revision. Cells are value cells of current revisions; argument\n"
    "cells are not counted.\n"
    "\n"
    "examples:\n"
    "  apograph list\n"
    "  apograph list witnesses --table sun-eq\n"
    "  apograph list revisions --table sun-eq --witness K --format json";

namespace {

using json = nlohmann::ordered_json;
using Opt = std::optional<std::string>;

struct Listing {
  Tabular tab;
  json items = json::array();
};

std::string N(std::int64_t n) { return std::to_string(n); }

Listing Works(store::Database& db) {
  Listing l;
  l.tab.headers = {"work", "title", "author", "tables", "witnesses", "cells"};
  l.tab.right_aligned = {false, false, false, true, true, true};
  for (const auto& w : store::ListWorks(db)) {
    l.tab.Add({w.work.id, w.work.title, w.work.author, N(w.tables), N(w.witnesses), N(w.cells)});
    l.items.push_back({{"work", w.work.id},
                       {"title", w.work.title},
                       {"author", w.work.author},
                       {"tables", w.tables},
                       {"witnesses", w.witnesses},
                       {"cells", w.cells}});
  }
  return l;
}

Listing Tables(store::Database& db, const Opt& work) {
  Listing l;
  l.tab.headers = {"table", "work", "title", "kind", "witnesses", "cells"};
  l.tab.right_aligned = {false, false, false, false, true, true};
  for (const auto& t : store::ListTables(db, work)) {
    l.tab.Add({t.id, t.work_id, t.title, t.kind, N(t.witnesses), N(t.cells)});
    l.items.push_back({{"table", t.id},
                       {"work", t.work_id},
                       {"title", t.title},
                       {"kind", t.kind},
                       {"witnesses", t.witnesses},
                       {"cells", t.cells}});
  }
  return l;
}

Listing Witnesses(store::Database& db, const Opt& table) {
  Listing l;
  l.tab.headers = {"witness", "library", "shelfmark", "date", "kind", "script", "tables", "cells"};
  l.tab.right_aligned = {false, false, false, false, false, false, true, true};
  for (const auto& s : store::ListWitnesses(db, table)) {
    const auto& w = s.witness;
    l.tab.Add({w.siglum, w.library, w.shelfmark, w.date, ToString(w.Kind()), w.script, N(s.tables),
               N(s.cells)});
    l.items.push_back({{"witness", w.siglum},
                       {"library", w.library},
                       {"shelfmark", w.shelfmark},
                       {"date", w.date},
                       {"kind", ToString(w.Kind())},
                       {"script", w.script},
                       {"tables", s.tables},
                       {"cells", s.cells}});
  }
  return l;
}

Listing Revisions(const std::vector<store::RevisionSummary>& list, const Opt& witness) {
  Listing l;
  l.tab.headers = {"table", "witness", "revision", "revisions",
                   "rows",  "cells",   "imported", "file"};
  l.tab.right_aligned = {false, false, true, true, true, true, false, false};
  for (const auto& r : list) {
    if (witness && r.siglum != *witness) continue;
    l.tab.Add({r.table_id, r.siglum, N(r.number), N(r.revisions), N(r.rows), N(r.cells),
               r.imported_at, r.source_file});
    l.items.push_back({{"table", r.table_id},
                       {"witness", r.siglum},
                       {"revision", r.number},
                       {"revisions", r.revisions},
                       {"rows", r.rows},
                       {"cells", r.cells},
                       {"imported_at", r.imported_at},
                       {"source_file", r.source_file}});
  }
  return l;
}

Opt Given(const po::variables_map& vm, const char* name) {
  return vm.count(name) ? Opt(vm[name].as<std::string>()) : std::nullopt;
}

}  // namespace

int RunList(const std::vector<std::string>& args, Io& io) {
  std::string db_path, format, what;
  const std::vector<std::string> kinds = {"works", "tables", "witnesses", "transcriptions",
                                          "revisions"};
  po::options_description options("options");
  AddDbOption(options, db_path);
  options.add_options()("what", po::value(&what)->default_value("tables"),
                        "works|tables|witnesses|transcriptions|revisions")(
      "work", po::value<std::string>(), "tables: only those of this work")(
      "table", po::value<std::string>(), "witnesses, transcriptions, revisions: only this table")(
      "witness", po::value<std::string>(), "transcriptions, revisions: only this witness");
  AddFormatOption(options, format, {"text", "csv", "json"});
  po::positional_options_description positional;
  positional.add("what", 1);
  po::variables_map vm;
  if (ParseOptions(FindCommand("list"), args, options, vm, io, &positional)) return kOk;
  CheckChoice("list", what, kinds);
  store::Database db = OpenEdition(db_path);
  const Opt table = Given(vm, "table");
  Listing l = what == "works"       ? Works(db)
              : what == "tables"    ? Tables(db, Given(vm, "work"))
              : what == "witnesses" ? Witnesses(db, table)
              : what == "revisions"
                  ? Revisions(store::ListRevisions(db, table, Given(vm, "witness")), {})
                  : Revisions(store::ListTranscriptions(db, table), Given(vm, "witness"));
  switch (ParseFormat(format)) {
    case Format::kJson:
      io.out << json{{what, l.items}}.dump(2) << "\n";
      break;
    case Format::kCsv:
      io.out << l.tab.RenderCsv();
      break;
    case Format::kText:
      io.out << (l.tab.rows.empty() ? "(none)\n" : l.tab.RenderText());
      break;
  }
  return kOk;
}

}  // namespace apograph::cli
