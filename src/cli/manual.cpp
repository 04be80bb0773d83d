#include "cli/manual.hpp"

#include <ostream>
#include <regex>
#include <set>
#include <sstream>
#include <string>

#include "cli/command.hpp"

namespace apograph::cli {
namespace {

/// What `apograph NAME --help` prints.
std::string HelpOf(const Command& command) {
  std::ostringstream out, err;
  Io io{out, err};
  command.run({"--help"}, io);
  return out.str();
}

/// The long options a help text names, in order of first mention.
std::vector<std::string> OptionsIn(const std::string& help) {
  std::vector<std::string> names;
  std::set<std::string> seen;
  static const std::regex kOption("(^|[\\s\\[(])(--[a-z][a-z0-9-]*)");
  for (std::sregex_iterator it(help.begin(), help.end(), kOption), end; it != end; ++it) {
    const std::string name = (*it)[2];
    if (seen.insert(name).second) names.push_back(name);
  }
  return names;
}

/// Text safe in roff: a backslash doubled, a line starting with '.' or '\''
/// protected.
std::string Roff(const std::string& text) {
  std::string out;
  bool line_start = true;
  for (char c : text) {
    if (line_start && (c == '.' || c == '\'')) out += "\\&";
    if (c == '\\')
      out += "\\e";
    else if (c == '-')
      out += "\\-";
    else
      out += c;
    line_start = c == '\n';
  }
  return out;
}

void WriteCommands(std::ostream& out) {
  out << ".SH COMMANDS\n";
  for (const auto& c : Commands()) {
    std::string help = HelpOf(c);
    // The first line repeats the name and summary given in the heading.
    if (const auto nl = help.find("\n\n"); nl != std::string::npos) help.erase(0, nl + 2);
    out << ".SS " << c.name << "\n" << Roff(c.summary) << ".\n.PP\n.nf\n" << Roff(help) << ".fi\n";
  }
}

}  // namespace

void WriteManPage(std::ostream& out) {
  out << ".TH APOGRAPH 1 \"\" \"apograph " << kVersion
      << "\" \"User Commands\"\n"
         ".SH NAME\napograph \\- critical editions of astronomical tables\n"
         ".SH SYNOPSIS\n.B apograph\n[\\fB\\-\\-wait\\fR \\fISECONDS\\fR] "
         "[\\fB\\-\\-zero\\-on\\-findings\\fR] \\fICOMMAND\\fR [\\fIOPTIONS\\fR]\n"
         ".SH DESCRIPTION\n"
         "apograph takes witnesses of a table of sexagesimal numbers from plain-text\n"
         "transcription into an SQLite edition database, recomputes every entry from\n"
         "a model, estimates the model and computing practice, explains deviations as\n"
         "copyists' slips or the author's departures, collates the witnesses, works out\n"
         "their stemma and writes the edited table with its apparatus. Its findings\n"
         "are suggestions with their evidence: the editor decides.\n";
  WriteCommands(out);
  out << ".SH EXIT STATUS\n.TP\n0\nsuccess, nothing to look at\n.TP\n1\n"
         "success, with findings the editor should look at (0 with "
         "\\fB\\-\\-zero\\-on\\-findings\\fR)\n"
         ".TP\n2\nbad input or usage; nothing was written\n.TP\n3\n"
         "database or internal error; nothing was written\n"
         ".SH ENVIRONMENT\n.TP\nAPOGRAPH_DATA\n"
         "the data folder (numeral scripts, parameter catalog, demo corpus); by default\n"
         "\\fI../share/apograph\\fR beside the program\n"
         ".TP\nAPOGRAPH_SCRIPTS\nthe folder of numeral scripts (default: "
         "\\fIscripts\\fR in the data folder)\n";
}

void WriteBashCompletion(std::ostream& out) {
  out << "# bash completion for apograph (written by apograph --bash-completion)\n"
         "_apograph() {\n"
         "  local cur=\"${COMP_WORDS[COMP_CWORD]}\" cmd=\"\" i\n"
         "  for ((i = 1; i < COMP_CWORD; i++)); do\n"
         "    case \"${COMP_WORDS[i]}\" in --wait) ((i++)) ;; -*) ;; *) cmd=\"${COMP_WORDS[i]}\"; "
         "break ;; esac\n"
         "  done\n"
         "  local words\n"
         "  case \"$cmd\" in\n"
         "    \"\") words=\"--help --version --wait --zero-on-findings";
  for (const auto& c : Commands()) out << " " << c.name;
  out << "\" ;;\n";
  for (const auto& c : Commands()) {
    out << "    " << c.name << ") words=\"";
    const auto names = OptionsIn(HelpOf(c));
    for (std::size_t i = 0; i < names.size(); ++i) out << (i ? " " : "") << names[i];
    out << "\" ;;\n";
  }
  out << "  esac\n"
         "  if [[ \"$cur\" == -* || -z \"$cmd\" ]]; then\n"
         "    COMPREPLY=($(compgen -W \"$words\" -- \"$cur\"))\n"
         "  else\n"
         "    COMPREPLY=($(compgen -f -- \"$cur\"))\n"
         "  fi\n"
         "}\n"
         "complete -o filenames -F _apograph apograph\n";
}

}  // namespace apograph::cli
