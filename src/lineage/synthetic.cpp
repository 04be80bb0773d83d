#include "lineage/synthetic.hpp"

#include <algorithm>
#include <cmath>
#include <set>

namespace apograph::lineage {
namespace {

std::string WitnessName(int k) {
  std::string s(1, static_cast<char>('A' + k % 26));
  return k < 26 ? s : s + std::to_string(k / 26 + 1);
}

// One slip: either one symbol of the written value changed, or a whole
// place off by a random amount.
Sexagesimal Slip(const Sexagesimal& v, double one_symbol_share, std::mt19937& rng) {
  std::uniform_real_distribution<double> u(0, 1);
  if (u(rng) < one_symbol_share) {
    const std::string text = v.ToString();
    for (int attempt = 0; attempt < 20; ++attempt) {
      std::uniform_int_distribution<std::size_t> at(0, text.size() - 1);
      const std::size_t i = at(rng);
      if (text[i] < '0' || text[i] > '9') continue;
      std::string t = text;
      t[i] = static_cast<char>('0' + std::uniform_int_distribution<int>(0, 9)(rng));
      auto parsed = Sexagesimal::Parse(t);
      if (parsed && !parsed->Identical(v) && parsed->places() == v.places()) return *parsed;
    }
  }
  const int place =
      std::uniform_int_distribution<int>(std::max(0, v.places() - 1), v.places())(rng);
  const auto unit = PowerOf60(v.places() - place);
  const int amount = std::uniform_int_distribution<int>(2, 9)(rng) * (u(rng) < 0.5 ? -1 : 1);
  Sexagesimal out = Sexagesimal::FromUnits(v.units() + unit * amount, v.places());
  return out.negative() ? Sexagesimal::FromUnits(v.units() + unit * std::abs(amount), v.places())
                        : out;
}

void AddSlips(SyntheticTradition& t, int node) {
  const auto& o = t.options;
  const int n = std::uniform_int_distribution<int>(o.slips_min, o.slips_max)(t.rng);
  std::set<std::pair<int, int>> done;
  while (static_cast<int>(done.size()) < n) {
    const int r = std::uniform_int_distribution<int>(0, o.rows - 1)(t.rng);
    const int c = std::uniform_int_distribution<int>(0, o.columns - 1)(t.rng);
    if (!done.insert({r, c}).second) continue;
    t.values[node][r][c] = Slip(t.values[node][r][c], o.one_symbol_share, t.rng);
  }
}

int AddNode(SyntheticTradition& t, const std::string& name, int parent, bool extant) {
  t.names.push_back(name);
  t.parent.push_back(parent);
  t.extant.push_back(extant);
  t.values.push_back(t.values[parent]);
  const int id = static_cast<int>(t.names.size()) - 1;
  AddSlips(t, id);
  return id;
}

}  // namespace

SyntheticTradition SimulateTradition(const SyntheticOptions& o) {
  SyntheticTradition t;
  t.options = o;
  t.rng.seed(o.seed);
  t.names = {kArchetype};
  t.parent = {-1};
  t.extant = {false};
  std::vector<std::vector<Sexagesimal>> table(o.rows, std::vector<Sexagesimal>(o.columns));
  for (int r = 0; r < o.rows; ++r) {
    for (int c = 0; c < o.columns; ++c) {
      table[r][c] = Sexagesimal::FromDouble(30 + 25 * std::sin(0.05 * (r + 1) + c), o.places);
    }
  }
  t.values.push_back(table);
  for (int k = 0; k < o.lost; ++k) {
    const int parent =
        std::uniform_int_distribution<int>(0, static_cast<int>(t.names.size()) - 1)(t.rng);
    AddNode(t, "lost" + std::to_string(k + 1), parent, false);
  }
  for (int k = 0; k < o.witnesses; ++k) {
    const int parent =
        std::uniform_int_distribution<int>(0, static_cast<int>(t.names.size()) - 1)(t.rng);
    AddNode(t, WitnessName(k), parent, true);
  }
  return t;
}

int SyntheticTradition::Node(const std::string& name) const {
  return static_cast<int>(std::find(names.begin(), names.end(), name) - names.begin());
}

int SyntheticTradition::AddCopy(const std::string& name, int exemplar) {
  return AddNode(*this, name, exemplar, true);
}

int SyntheticTradition::AddContaminated(const std::string& name, int a, int b, int split) {
  const int id = AddNode(*this, name, a, true);
  for (int r = split; r < options.rows; ++r) values[id][r] = values[b][r];
  AddSlips(*this, id);
  return id;
}

std::vector<Transcription> SyntheticTradition::Witnesses() const {
  std::vector<Transcription> out;
  for (std::size_t n = 0; n < names.size(); ++n) {
    if (!extant[n]) continue;
    Transcription t;
    t.work = {"W1", "An invented work", ""};
    t.table_id = "T1";
    t.table_title = "A synthetic table";
    t.witness.siglum = names[n];
    t.witness.library = "Invented Library";
    t.witness.shelfmark = "MS " + names[n];
    t.argument = {"arg", "", 0, Sexagesimal::FromUnits(1, 0), Sexagesimal::FromUnits(1, 0)};
    for (int c = 0; c < options.columns; ++c) {
      t.columns.push_back({"c" + std::to_string(c + 1), "", options.places, "", std::nullopt});
    }
    for (int r = 0; r < options.rows; ++r) {
      Row row;
      row.argument.raw = std::to_string(r + 1);
      row.argument.value = Sexagesimal::FromUnits(r + 1, 0);
      for (int c = 0; c < options.columns; ++c) {
        Cell cell;
        cell.value = values[n][r][c];
        cell.raw = cell.value->ToString();
        cell.places = options.places;
        row.cells.push_back(cell);
      }
      t.rows.push_back(row);
    }
    out.push_back(std::move(t));
  }
  return out;
}

collate::Reference SyntheticTradition::Reference() const {
  const auto table = values[0];
  return {"the archetype's values",
          [table](const Sexagesimal& arg, int col) -> std::optional<Sexagesimal> {
            const auto r = static_cast<std::size_t>(arg.IntegerPart()) - 1;
            if (r >= table.size()) return std::nullopt;
            return table[r][col];
          }};
}

std::vector<Group> SyntheticTradition::TrueGroups() const {
  const int total = static_cast<int>(std::count(extant.begin(), extant.end(), true));
  std::set<Group> groups;
  for (std::size_t n = 1; n < names.size(); ++n) {
    Group g;
    for (std::size_t m = 0; m < names.size(); ++m) {
      int x = static_cast<int>(m);
      while (x >= 0 && x != static_cast<int>(n)) x = parent[x];
      if (x == static_cast<int>(n) && extant[m]) g.push_back(names[m]);
    }
    std::sort(g.begin(), g.end());
    if (g.size() >= 2 && static_cast<int>(g.size()) < total) groups.insert(g);
  }
  return {groups.begin(), groups.end()};
}

}  // namespace apograph::lineage
