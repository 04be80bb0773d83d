// apograph init: create an edition database, or bring an old one up to the
// current schema.
#include "cli/command.hpp"

#include <filesystem>
#include <ostream>

#include "store/database.hpp"

namespace apograph::cli {

extern const char kInitUsage[] =
    "usage: apograph init [--db FILE]\n"
    "\n"
    "Creates the edition database (default edition.sqlite in the current\n"
    "directory) with every table and view described in schema/*.sql, or\n"
    "applies the migrations an older database lacks. Running it again is\n"
    "harmless. `apograph import` creates the database too when needed.\n"
    "\n"
    "example:\n"
    "  apograph init --db harbour.sqlite";

int RunInit(const std::vector<std::string>& args, Io& io) {
  std::string db_path;
  po::options_description options("options");
  AddDbOption(options, db_path);
  po::variables_map vm;
  if (ParseOptions(FindCommand("init"), args, options, vm, io)) return kOk;
  const bool existed = std::filesystem::exists(db_path);
  store::Database db(db_path);
  io.out << (existed ? "opened " : "created ") << db_path << " (schema version "
         << db.SchemaVersion() << ")\n";
  return kOk;
}

}  // namespace apograph::cli
