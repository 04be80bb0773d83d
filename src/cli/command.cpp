#include "cli/command.hpp"

#include <filesystem>
#include <iostream>
#include <stdexcept>

#include "cli/manual.hpp"
#include "store/database.hpp"
#include "support/data_dir.hpp"
#include "support/input_error.hpp"

namespace apograph::cli {
namespace {

void PrintOverview(std::ostream& out) {
  out << "apograph: critical editions of astronomical tables\n\n"
         "usage: apograph COMMAND [OPTIONS]    (apograph COMMAND --help for details)\n\n"
         "commands:\n";
  for (const auto& c : Commands()) {
    std::string name = c.name;
    name.resize(12, ' ');
    out << "  " << name << c.summary << "\n";
  }
  out << "\nglobal options (before the command):\n"
         "  --wait SECONDS       how long to wait for another process writing to the\n"
         "                       database (default 5)\n"
         "  --zero-on-findings   exit 0 instead of 1 when a command succeeds with findings\n"
         "                       (for scripts and make)\n"
         "  -V, --version        the version and the data folder in use\n"
         "  -h, --help           this overview\n";
  out << "\nexit codes: 0 success, 1 success with findings to look at,\n"
         "            2 bad input or usage (nothing written), 3 database or internal error\n";
}

void PrintVersion(std::ostream& out) {
  out << "apograph " << kVersion << "\ndata folder: " << DataDir()
      << " (APOGRAPH_DATA to change it)\n";
}

/// The options as --help shows them: positional arguments (`--action`,
/// `--id`, `--words` ...) are plumbing that the usage names in its own words.
po::options_description Visible(const po::options_description& options,
                                const po::positional_options_description* positional) {
  po::options_description visible("options");
  for (const auto& option : options.options()) {
    bool hidden = false;
    for (unsigned i = 0; positional && !hidden && i < positional->max_total_count() && i < 16;
         ++i) {
      hidden = positional->name_for_position(i) == option->long_name();
    }
    if (!hidden) visible.add(option);
  }
  return visible;
}

}  // namespace

const Command& FindCommand(const std::string& name) {
  for (const auto& c : Commands()) {
    if (name == c.name) return c;
  }
  throw InputError::ForOption("apograph", "unknown command '" + name + "' (see apograph --help)");
}

bool ParseOptions(const Command& command, const std::vector<std::string>& args,
                  po::options_description& options, po::variables_map& vm, Io& io,
                  const po::positional_options_description* positional) {
  options.add_options()("help,h", "show this help");
  try {
    po::command_line_parser parser(args);
    parser.options(options);
    if (positional) parser.positional(*positional);
    po::store(parser.run(), vm);
    if (vm.count("help")) {
      io.out << "apograph " << command.name << ": " << command.summary << "\n\n"
             << command.usage << "\n\n"
             << Visible(options, positional) << "\n";
      return true;
    }
    po::notify(vm);
  } catch (const po::error& e) {
    throw InputError::ForOption(
        std::string("apograph ") + command.name,
        std::string(e.what()) + " (see apograph " + command.name + " --help)");
  }
  return false;
}

void AddDbOption(po::options_description& options, std::string& db) {
  options.add_options()("db", po::value(&db)->default_value("edition.sqlite"),
                        "edition database (SQLite file)");
}

void AddFormatOption(po::options_description& options, std::string& format,
                     const std::vector<std::string>& allowed) {
  std::string list;
  for (const auto& a : allowed) list += (list.empty() ? "" : "|") + a;
  // The choice is checked where it is parsed (a notifier), so a command
  // names its formats once.
  options.add_options()(
      "format",
      po::value(&format)->default_value(allowed.front())->notifier([allowed](const std::string& v) {
        CheckChoice("--format", v, allowed);
      }),
      ("output format: " + list).c_str());
}

void CheckChoice(const std::string& option, const std::string& value,
                 const std::vector<std::string>& allowed) {
  for (const auto& a : allowed) {
    if (a == value) return;
  }
  std::string list;
  for (const auto& a : allowed) list += (list.empty() ? "" : ", ") + a;
  throw InputError::ForOption(option, ExpectedFound("one of " + list, "'" + value + "'"));
}

store::Database OpenEdition(const std::string& path) {
  if (!std::filesystem::is_regular_file(path)) {
    throw InputError::ForOption("--db",
                                ExpectedFound("an edition database", "no file '" + path + "'") +
                                    " (create one with apograph init or apograph import)");
  }
  return store::Database(path);
}

void SetWait(const std::string& seconds) {
  std::size_t used = 0;
  double s = -1;
  try {
    s = std::stod(seconds, &used);
  } catch (const std::invalid_argument&) {
    used = 0;
  } catch (const std::out_of_range&) {
    used = 0;
  }
  constexpr double kMaxWait = 86400;  // a day: beyond that a wait is a mistake (judgement)
  if (seconds.empty() || used != seconds.size() || !(s >= 0 && s <= kMaxWait)) {
    throw InputError::ForOption(
        "--wait", ExpectedFound("seconds from 0 to 86400 (how long to wait for another process "
                                "writing to the database)",
                                "'" + seconds + "'"));
  }
  store::SetBusyTimeout(static_cast<int>(s * 1000));
}

void CheckThreads(int threads) {
  // Far beyond the cores of any machine this runs on; each thread holds a
  // copy of a table's work, so an absurd count only exhausts memory (judgement).
  constexpr int kMaxThreads = 256;
  if (threads < 1 || threads > kMaxThreads) {
    throw InputError::ForOption("--threads",
                                ExpectedFound("a count from 1 to 256", std::to_string(threads)));
  }
}

Format ParseFormat(const std::string& value) {
  if (value == "csv") return Format::kCsv;
  if (value == "json") return Format::kJson;
  return Format::kText;
}

int Dispatch(const std::vector<std::string>& args, Io& io) {
  if (args.empty() || args[0] == "--help" || args[0] == "-h" || args[0] == "help") {
    PrintOverview(args.empty() ? io.err : io.out);
    return args.empty() ? kBadInput : kOk;
  }
  if (args[0] == "--version" || args[0] == "-V") {
    PrintVersion(io.out);
    return kOk;
  }
  // Written at build time into the manual page and the completion script.
  if (args[0] == "--man-page" || args[0] == "--bash-completion") {
    (args[0] == "--man-page" ? WriteManPage : WriteBashCompletion)(io.out);
    return kOk;
  }
  try {
    if (args[0] == "--wait") {  // global: apograph --wait SECONDS COMMAND ...
      SetWait(args.size() > 1 ? args[1] : "");
      if (args.size() < 3) throw InputError::ForOption("--wait", "expected a command after it");
      return Dispatch(std::vector<std::string>(args.begin() + 2, args.end()), io);
    }
    if (args[0] == "--zero-on-findings") {
      if (args.size() < 2) {
        throw InputError::ForOption("--zero-on-findings", "expected a command after it");
      }
      const int code = Dispatch(std::vector<std::string>(args.begin() + 1, args.end()), io);
      return code == kFindings ? kOk : code;
    }
    const Command& command = FindCommand(args[0]);
    return command.run(std::vector<std::string>(args.begin() + 1, args.end()), io);
  } catch (const InputError& e) {
    io.err << e.Render() << "\n";
    return kBadInput;
  } catch (const store::StoreError& e) {
    io.err << "apograph: database error: " << e.what() << "\n";
    return kInternal;
  } catch (const std::exception& e) {
    io.err << "apograph: internal error: " << e.what() << "\n";
    return kInternal;
  }
}

}  // namespace apograph::cli
