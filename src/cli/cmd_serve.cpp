// apograph serve: the review page on a local HTTP server.
#include "cli/command.hpp"

#include <ostream>

#include "pipeline/decisions.hpp"
#include "serve/guard.hpp"
#include "serve/pages.hpp"
#include "serve/server.hpp"
#include "support/input_error.hpp"

namespace apograph::cli {

extern const char kServeUsage[] =
    "usage: apograph serve [--port N] [--listen ADDRESS] [--editor NAME] [--db FILE]\n"
    "\n"
    "Serves the review page on this machine: the recorded findings, filterable\n"
    "by table, witness, class and status, with buttons to accept, reject or undo\n"
    "each (a displaced run as one decision) and to override or conjecture its\n"
    "cell's reading; each table's HTML report with its plots. Every decision is\n"
    "written to the database as apograph emendation writes it, in one transaction\n"
    "with the editor (--editor, else APOGRAPH_EDITOR, else the login name), the\n"
    "time and the note; a page that was decided meanwhile (another tab) is told\n"
    "so and writes nothing. Listens on 127.0.0.1 only, on --port or a free port, and prints the\n"
    "URL with a random token that every request must carry. Stop with Ctrl-C.\n"
    "--listen another address exposes the page beyond this machine: a warning is\n"
    "printed. Nothing but the database is written.\n"
    "\n"
    "example: apograph serve --db apograph-demo/edition.sqlite --editor \"A. Editor\"";

int RunServe(const std::vector<std::string>& args, Io& io) {
  std::string db_path, listen, editor;
  int port = 0;
  po::options_description options("options");
  options.add_options()("port", po::value(&port)->default_value(0), "port (0: a free one)")(
      "listen", po::value(&listen)->default_value("127.0.0.1"), "address to listen on")(
      "editor", po::value(&editor), "who decides (default: APOGRAPH_EDITOR, else the login name)");
  AddDbOption(options, db_path);
  po::variables_map vm;
  if (ParseOptions(FindCommand("serve"), args, options, vm, io)) return kOk;
  if (port < 0 || port > 65535)
    throw InputError::ForOption("--port",
                                ExpectedFound("a port from 0 to 65535", std::to_string(port)));
  editor = pipeline::DefaultEditor(editor);  // the same editor as the CLI's decisions
  if (!serve::IsLoopback(listen))
    io.err << "warning: listening on " << listen
           << ": anyone who can reach this address and learns the URL can decide\n";
  store::Database db = OpenEdition(db_path);
  serve::Site site{db, serve::NewToken(), editor, {}};
  serve::Serve(site, {listen, port}, [&](const std::string& url) {
    io.out << "apograph serve: review page at " << url << "\n(Ctrl-C to stop)" << std::endl;
  });
  return kOk;
}

}  // namespace apograph::cli
