// synth_draw: one seeded draw of the shared generator written to a folder
// (transcriptions, CSV sheets, truth.json). See tests/synth/README.md.
#include <boost/program_options.hpp>

#include <iostream>

#include "synth/draw_files.hpp"
#include "synth/options.hpp"

namespace po = boost::program_options;
namespace synth = apograph::synth;

namespace {

constexpr const char* kUsage =
    "synth_draw --seed N --out DIR [--kind table|tradition] [--witnesses K] [--tables N]\n"
    "           [--family F]... [--rate R] [--hand KIND[:SCRIPT]] [--set NAME=VALUE]... "
    "[--no-csv]\n\n"
    "Draws an invented tradition (or, --kind table, one author's table and one copy of it, siglum "
    "A)\n"
    "and writes SIGLUM.apo, SIGLUM-TABLE.csv and truth.json (the answer key) into DIR.\n\n"
    "example: synth_draw --seed 7 --out draw7 --witnesses 8 --set share_contaminated=0.3\n";

struct UsageError {
  std::string message;
};

synth::Hand ParseHand(const std::string& text) {
  const auto colon = text.find(':');
  const std::string kind = text.substr(0, colon);
  synth::Hand hand;
  if (kind == "print" || kind == "digitised") {
    hand = {kind == "print" ? synth::HandKind::kPrint : synth::HandKind::kDigitised,
            synth::Script::kPrinted};
  } else if (kind != "manuscript") {
    throw UsageError{"--hand: expected manuscript, print or digitised, found '" + kind + "'"};
  }
  if (colon == std::string::npos) return hand;
  const auto script = synth::ScriptFromName(text.substr(colon + 1));
  if (!script) throw UsageError{"--hand: unknown script '" + text.substr(colon + 1) + "'"};
  hand.script = *script;
  return hand;
}

synth::TraditionOptions Options(const po::variables_map& vm) {
  synth::TraditionOptions o;
  if (vm.count("witnesses")) o.witnesses = vm["witnesses"].as<int>();
  if (vm.count("tables")) o.tables = vm["tables"].as<int>();
  for (const auto& name : vm.count("family") ? vm["family"].as<std::vector<std::string>>()
                                             : std::vector<std::string>{}) {
    const auto f = synth::FamilyFromName(name);
    if (!f) throw UsageError{"--family: unknown family '" + name + "'"};
    o.table.families.push_back(*f);
  }
  if (vm.count("rate")) {
    o.copy.rate = o.manuscript_rate_min = o.manuscript_rate_max = vm["rate"].as<double>();
  }
  for (const auto& set :
       vm.count("set") ? vm["set"].as<std::vector<std::string>>() : std::vector<std::string>{}) {
    const auto eq = set.find('=');
    double value = 0;
    try {
      value = std::stod(set.substr(eq == std::string::npos ? set.size() : eq + 1));
    } catch (const std::invalid_argument&) {
      throw UsageError{"--set: expected NAME=NUMBER, found '" + set + "'"};
    }
    if (eq == std::string::npos || !synth::SetOption(o, set.substr(0, eq), value)) {
      throw UsageError{"--set: unknown option in '" + set + "' (see tests/synth/README.md)"};
    }
  }
  if (o.witnesses != 0 && (o.witnesses < 4 || o.witnesses > 26))
    throw UsageError{"--witnesses: expected 4 to 26"};
  if (o.copy.rate < 0 || o.copy.rate > 0.5) throw UsageError{"--rate: expected 0 to 0.5"};
  return o;
}

int Run(const po::variables_map& vm) {
  const auto seed = vm["seed"].as<std::uint64_t>();
  const std::string kind = vm["kind"].as<std::string>();
  if (kind != "table" && kind != "tradition")
    throw UsageError{"--kind: expected table or tradition, found '" + kind + "'"};
  const synth::TraditionOptions o = Options(vm);
  synth::Rng rng(seed);
  const synth::Tradition t =
      kind == "table"
          ? synth::DrawTableWitness(rng, o.table, ParseHand(vm["hand"].as<std::string>()), o.copy)
          : synth::DrawTradition(rng, o);
  synth::DrawFilesOptions files;
  files.csv = !vm.count("no-csv");
  files.kind = kind;
  synth::WriteDraw(vm["out"].as<std::string>(), t, seed, rng, files);
  std::cout << "synth_draw: " << t.Surviving().size() << " witness(es), " << t.tables.size()
            << " table(s) into " << vm["out"].as<std::string>() << "\n";
  return 0;
}

}  // namespace

int main(int argc, char** argv) {
  po::options_description desc("options");
  desc.add_options()("seed", po::value<std::uint64_t>()->required(), "seed of the draw")(
      "out", po::value<std::string>()->required(), "folder to write into (created)")(
      "kind", po::value<std::string>()->default_value("tradition"), "table or tradition")(
      "witnesses", po::value<int>(), "surviving witnesses, 4 to 26 (default: drawn 4-15)")(
      "tables", po::value<int>(), "tables of the work (default: drawn 1-3)")(
      "family", po::value<std::vector<std::string>>(), "family of the tables (repeatable: a pool)")(
      "rate", po::value<double>(), "slip rate of each manuscript copy (table: of the one copy)")(
      "hand", po::value<std::string>()->default_value("manuscript"),
      "table: the copy's hand, manuscript[:SCRIPT], print or digitised")(
      "set", po::value<std::vector<std::string>>(),
      "any documented option NAME=VALUE (repeatable)")("no-csv", "write no CSV sheets")(
      "help,h", "show this help");
  po::variables_map vm;
  try {
    po::store(po::parse_command_line(argc, argv, desc), vm);
    if (vm.count("help")) {
      std::cout << kUsage << "\n" << desc;
      return 0;
    }
    po::notify(vm);
    return Run(vm);
  } catch (const po::error& e) {
    std::cerr << "synth_draw: " << e.what() << "\n\n" << kUsage;
  } catch (const UsageError& e) {
    std::cerr << "synth_draw: " << e.message << "\n";
  }
  return 2;
}
