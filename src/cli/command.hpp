#pragma once
/// The subcommand table and what every handler shares. The table (in
/// command.cpp) drives dispatch and `apograph --help`; each handler lives in
/// its own cmd_<name>.cpp, parses its options with Boost.Program_options and
/// calls the library.

#include <iosfwd>
#include <string>
#include <vector>

#include <boost/program_options.hpp>

#include "store/database.hpp"

namespace apograph::cli {

/// The version `--version` and the manual page print.
inline constexpr const char* kVersion = "0.1.0";

/// Exit codes (listed in the README).
enum ExitCode : int {
  kOk = 0,        ///< success, nothing to look at
  kFindings = 1,  ///< success, with findings the editor should look at
  kBadInput = 2,  ///< bad input or usage; nothing was written
  kInternal = 3,  ///< database or internal failure; nothing was written
};

/// Output format of tabular results.
enum class Format { kText, kCsv, kJson };

/// Streams and facts about the terminal, passed to every handler.
struct Io {
  std::ostream& out;
  std::ostream& err;
  bool out_is_terminal = false;
  bool err_is_terminal = false;
};

using Handler = int (*)(const std::vector<std::string>& args, Io& io);

struct Command {
  const char* name;
  const char* summary;  ///< one line, shown by `apograph --help`
  const char* usage;    ///< synopsis and an example, shown by `apograph NAME --help`
  Handler run;
};

/// Every subcommand, in the order `--help` lists them.
const std::vector<Command>& Commands();

/// Runs argv[1..] (the subcommand and its arguments); maps exceptions to exit
/// codes and prints errors to io.err.
int Dispatch(const std::vector<std::string>& args, Io& io);

namespace po = boost::program_options;

/// Parses `args` against `options`; prints the usage and returns true when
/// --help was given. Throws InputError on unknown or malformed options.
bool ParseOptions(const Command& command, const std::vector<std::string>& args,
                  po::options_description& options, po::variables_map& vm, Io& io,
                  const po::positional_options_description* positional = nullptr);

/// Adds --db (default edition.sqlite).
void AddDbOption(po::options_description& options, std::string& db);
/// Adds --format with the given allowed values (first is the default); any
/// other value is refused when the options are parsed (InputError naming --format).
void AddFormatOption(po::options_description& options, std::string& format,
                     const std::vector<std::string>& allowed);
/// Opens an existing edition database (never creates one: a mistyped --db
/// must not leave an empty file behind); InputError naming --db otherwise.
store::Database OpenEdition(const std::string& path);

/// Checks a --format value against the allowed ones (InputError otherwise).
void CheckChoice(const std::string& option, const std::string& value,
                 const std::vector<std::string>& allowed);
Format ParseFormat(const std::string& value);

/// Sets how long every database opened from now on waits for another
/// process's lock (`--wait SECONDS`, 0 to 86400); InputError naming --wait.
void SetWait(const std::string& seconds);

/// Checks a --threads value: 1 to 256 (InputError naming --threads).
void CheckThreads(int threads);

/// Finds a command by name (for handlers that print their own usage).
const Command& FindCommand(const std::string& name);

// Handlers, one per cmd_<name>.cpp.
int RunInit(const std::vector<std::string>& args, Io& io);
int RunImport(const std::vector<std::string>& args, Io& io);
int RunExport(const std::vector<std::string>& args, Io& io);
int RunList(const std::vector<std::string>& args, Io& io);
int RunDemo(const std::vector<std::string>& args, Io& io);
int RunCheck(const std::vector<std::string>& args, Io& io);
int RunFormula(const std::vector<std::string>& args, Io& io);
int RunFit(const std::vector<std::string>& args, Io& io);
int RunIdentify(const std::vector<std::string>& args, Io& io);
int RunCatalog(const std::vector<std::string>& args, Io& io);
int RunErrors(const std::vector<std::string>& args, Io& io);
int RunScreen(const std::vector<std::string>& args, Io& io);
int RunEmendation(const std::vector<std::string>& args, Io& io);
int RunCollate(const std::vector<std::string>& args, Io& io);
int RunStemma(const std::vector<std::string>& args, Io& io);
int RunApparatus(const std::vector<std::string>& args, Io& io);
int RunReport(const std::vector<std::string>& args, Io& io);
int RunServe(const std::vector<std::string>& args, Io& io);

}  // namespace apograph::cli
