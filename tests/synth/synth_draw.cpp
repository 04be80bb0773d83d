// synth_draw: one seeded draw of the shared generator written to a folder
// (transcriptions, CSV sheets, truth.json). See tests/synth/README.md.
#include <boost/program_options.hpp>

#include <filesystem>
#include <fstream>
#include <iostream>

#include "synth/key_json.hpp"
#include "synth/tables.hpp"
#include "transcription/writer.hpp"

namespace po = boost::program_options;
namespace synth = apograph::synth;

namespace {

void WriteFile(const std::filesystem::path& path, const std::string& text) {
  std::ofstream out(path, std::ios::binary);
  out << text;
  if (!out) throw std::runtime_error("cannot write " + path.string());
}

int Run(const po::variables_map& vm) {
  synth::TableOptions options;
  if (vm.count("family")) {
    const auto f = synth::FamilyFromName(vm["family"].as<std::string>());
    if (!f) {
      std::cerr << "synth_draw: --family: unknown family '" << vm["family"].as<std::string>()
                << "'\n";
      return 2;
    }
    options.family = *f;
  }
  const std::filesystem::path dir = vm["out"].as<std::string>();
  std::filesystem::create_directories(dir);
  synth::AuthorTable table = synth::DrawTable(vm["seed"].as<std::uint64_t>(), options);
  WriteFile(dir / (table.key.id + ".apo"), apograph::WriteTranscription(table.text));
  WriteFile(dir / "truth.json", synth::ToJson(table.key).dump(1) + "\n");
  return 0;
}

}  // namespace

int main(int argc, char** argv) {
  po::options_description desc("synth_draw --seed N --out DIR [options]");
  desc.add_options()("seed", po::value<std::uint64_t>()->required(), "seed of the draw")(
      "out", po::value<std::string>()->required(), "folder to write into")(
      "family", po::value<std::string>(), "family of the table")("help,h", "show this help");
  po::variables_map vm;
  try {
    po::store(po::parse_command_line(argc, argv, desc), vm);
    if (vm.count("help")) {
      std::cout << desc;
      return 0;
    }
    po::notify(vm);
  } catch (const po::error& e) {
    std::cerr << "synth_draw: " << e.what() << "\n" << desc;
    return 2;
  }
  return Run(vm);
}
