#include "draw_files.hpp"

#include <fstream>
#include <stdexcept>

#include "sheets.hpp"
#include "tradition_build.hpp"
#include "tradition_json.hpp"
#include "transcription/writer.hpp"

namespace apograph::synth {
namespace {

void WriteFile(const std::filesystem::path& path, const std::string& text) {
  std::ofstream out(path, std::ios::binary);
  out << text;
  if (!out) throw std::runtime_error("synth: cannot write " + path.string());
}

}  // namespace

Tradition DrawTableWitness(Rng& rng, const TableOptions& table, const Hand& hand,
                           const CopyOptions& copy) {
  Tradition t;
  t.work = {"work", "An invented work of tables", "an invented author"};
  AuthorTable author = DrawTable(rng, table, "t1");
  author.text.work = t.work;
  t.tables.push_back(std::move(author));
  Node root;
  root.name = "archetype";
  root.hand = {HandKind::kManuscript,
               hand.kind == HandKind::kManuscript ? hand.script : Script::kHinduArabic};
  root.date = internal::DrawDate(rng.Int(1150, 1400), WitnessKind::kManuscript, rng);
  Node a;
  a.name = "A";
  a.parent = 0;
  a.surviving = true;
  a.kind = hand.kind == HandKind::kManuscript ? WitnessKind::kManuscript : WitnessKind::kPrint;
  a.hand = hand;
  a.rate = copy.rate;
  const int year =
      a.kind == WitnessKind::kManuscript ? root.date.year + rng.Int(3, 150) : rng.Int(1472, 1600);
  a.date = internal::DrawDate(year, a.kind, rng);
  t.nodes = {root, a};
  TraditionOptions o;
  o.copy = copy;
  internal::CopyTexts(t, o, rng);
  return t;
}

std::string WitnessFile(const Tradition& t, int node, std::uint64_t seed) {
  const std::string& siglum = t.nodes[static_cast<std::size_t>(node)].name;
  return "# Invented data, made by tests/synth (synth_draw, seed " + std::to_string(seed) +
         "; options in truth.json): witness " + siglum +
         " of an invented work. Do not edit; draw again instead.\n" +
         WriteTranscription(t.WitnessTables(node));
}

nlohmann::json WriteDraw(const std::filesystem::path& dir, const Tradition& t, std::uint64_t seed,
                         Rng& rng, const DrawFilesOptions& options) {
  std::filesystem::create_directories(dir);
  nlohmann::json sheets = nlohmann::json::array();
  for (int i : t.Surviving()) {
    const std::string& siglum = t.nodes[static_cast<std::size_t>(i)].name;
    WriteFile(dir / (siglum + ".apo"), WitnessFile(t, i, seed));
    if (!options.csv) continue;
    for (const auto& table : t.WitnessTables(i)) {
      const Sheet sheet = WriteSheet(table, DrawSheetStyle(table, rng), rng);
      const std::string file = siglum + "-" + table.table_id + ".csv";
      WriteFile(dir / file, sheet.text);
      nlohmann::json key = sheet.key;
      key["file"] = file;
      key["witness"] = siglum;
      key["table"] = table.table_id;
      sheets.push_back(key);
    }
  }
  nlohmann::json key = TraditionJson(t);
  key["generator"] = "tests/synth (synth_draw)";
  key["seed"] = seed;
  key["kind"] = options.kind;
  key["sheets"] = sheets;
  WriteFile(dir / "truth.json", key.dump(1) + "\n");
  return key;
}

}  // namespace apograph::synth
