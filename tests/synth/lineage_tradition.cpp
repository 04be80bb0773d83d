#include "synth/lineage_tradition.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <functional>
#include <map>
#include <numbers>
#include <set>

#include "edition/witness_date.hpp"

namespace apograph::lineage {
namespace {

using Units = std::int64_t;

struct SimCell {
  Units units = 0;
  char state = 'r';  // r read, b blank, i illegible
};
using SimTable = std::vector<SimCell>;

// One table of the work as the author computed it.
struct TableSpec {
  std::string id, title, kind, argument;
  int rows = 0, places = 2;
  std::vector<double> exact;     // per row, in units of the last place
  std::vector<Units> model;      // the exact value rounded
  std::vector<Units> archetype;  // with the author's departures
};

double Radians(double degrees) { return degrees * std::numbers::pi / 180; }

// Round sexagesimal parameters, as authors used.
double Pick(std::mt19937& rng, std::initializer_list<double> values) {
  std::vector<double> v(values);
  return v[std::uniform_int_distribution<std::size_t>(0, v.size() - 1)(rng)];
}

TableSpec MakeTable(int family, int index, std::mt19937& rng, double departures) {
  TableSpec t;
  t.id = "t" + std::to_string(index + 1);
  std::function<double(double)> f;
  if (family == 0) {
    const double e =
        Pick(rng, {2 + 4 / 60.0, 2 + 10 / 60.0, 2 + 16 / 60.0, 2 + 29 / 60.0, 1 + 56 / 60.0});
    t.title = "Equation of the sun", t.kind = "solar equation", t.argument = "anomaly";
    t.rows = Pick(rng, {90, 120, 180}) > 100 ? 180 : 90;
    f = [e](double a) {
      return std::atan2(e * std::sin(Radians(a)), 60 + e * std::cos(Radians(a))) * 180 /
             std::numbers::pi;
    };
  } else if (family == 1) {
    const double eps = Pick(rng, {23 + 51 / 60.0 + 20 / 3600.0, 23 + 33 / 60.0 + 30 / 3600.0,
                                  23 + 35 / 60.0, 23 + 32 / 60.0 + 40 / 3600.0});
    t.title = "Declination of the sun", t.kind = "declination", t.argument = "longitude";
    t.rows = 90;
    f = [eps](double a) {
      return std::asin(std::sin(Radians(eps)) * std::sin(Radians(a))) * 180 / std::numbers::pi;
    };
  } else {
    t.title = "Sines", t.kind = "sine", t.argument = "arc";
    t.rows = 90;
    f = [](double a) { return 60 * std::sin(Radians(a)); };
  }
  std::uniform_real_distribution<double> u(0, 1);
  const double scale = 3600;  // two places
  for (int r = 0; r < t.rows; ++r) {
    const double x = f(r + 1) * scale;
    t.exact.push_back(x);
    t.model.push_back(static_cast<Units>(std::floor(x + 0.5)));
    Units a = t.model.back();
    if (u(rng) < departures) a += u(rng) < 0.5 ? -1 : 1;  // the author's own rounding
    t.archetype.push_back(std::max<Units>(0, a));
  }
  return t;
}

// ------------------------------------------------------------------ slips

std::vector<int> Places(Units u, int places) {  // [integer, d1, ..., dp]
  std::vector<int> d(places + 1);
  for (int k = places; k >= 1; --k) d[k] = static_cast<int>(u % 60), u /= 60;
  d[0] = static_cast<int>(u);
  return d;
}

Units Join(const std::vector<int>& d) {
  Units u = d[0];
  for (std::size_t k = 1; k < d.size(); ++k) u = u * 60 + d[k];
  return u;
}

// Look-alike digits of this generator (deliberately not the list in
// corpora/scripts, which the explainer reads).
const std::vector<std::pair<char, char>>& Confusions() {
  static const std::vector<std::pair<char, char>> c = {
      {'3', '8'}, {'5', '6'}, {'1', '4'}, {'2', '7'}, {'0', '9'}, {'6', '8'}, {'4', '9'}};
  return c;
}

std::optional<Units> DigitSlip(Units u, int places, bool look_alike, std::mt19937& rng) {
  auto d = Places(u, places);
  for (int attempt = 0; attempt < 12; ++attempt) {
    const int k = std::uniform_int_distribution<int>(places > 0 ? 1 : 0, places)(rng);
    std::string s = std::to_string(d[k]);
    const std::size_t i = std::uniform_int_distribution<std::size_t>(0, s.size() - 1)(rng);
    char to = s[i];
    if (look_alike) {
      std::vector<char> options;
      for (auto [a, b] : Confusions()) {
        if (s[i] == a) options.push_back(b);
        if (s[i] == b) options.push_back(a);
      }
      if (options.empty()) continue;
      to = options[std::uniform_int_distribution<std::size_t>(0, options.size() - 1)(rng)];
    } else {
      to = static_cast<char>('0' + std::uniform_int_distribution<int>(0, 9)(rng));
    }
    s[i] = to;
    const int v = std::stoi(s);
    if (v == d[k] || (k > 0 && v > 59)) continue;
    auto e = d;
    e[k] = v;
    return Join(e);
  }
  return std::nullopt;
}

std::optional<Units> Transposition(Units u, int places, std::mt19937& rng) {
  auto d = Places(u, places);
  std::vector<int> ks;
  for (int k = 1; k <= places; ++k) {
    const int rev = (d[k] % 10) * 10 + d[k] / 10;
    if (d[k] >= 10 && rev != d[k] && rev <= 59) ks.push_back(k);
  }
  if (ks.empty()) return std::nullopt;
  const int k = ks[std::uniform_int_distribution<std::size_t>(0, ks.size() - 1)(rng)];
  d[k] = (d[k] % 10) * 10 + d[k] / 10;
  return Join(d);
}

std::optional<Units> PlaceSlip(Units u, int places, std::mt19937& rng) {
  auto d = Places(u, places);
  if (places < 2 || d[places] == d[places - 1]) {
    // A place left out: the last place written as 0.
    if (d[places] == 0) return std::nullopt;
    d[places] = 0;
    return Join(d);
  }
  const int k = std::uniform_int_distribution<int>(1, places - 1)(rng);
  std::swap(d[k], d[k + 1]);  // two places exchanged (minutes written as seconds)
  return Join(d);
}

void OneSlip(SimTable& t, int places, std::mt19937& rng) {
  const int n = static_cast<int>(t.size());
  const int i = std::uniform_int_distribution<int>(1, n - 5)(rng);
  SimCell& c = t[i];
  if (c.state != 'r') return;
  const double kind = std::uniform_real_distribution<double>(0, 1)(rng);
  std::optional<Units> v;
  if (kind < 0.30) {
    v = DigitSlip(c.units, places, true, rng);
  } else if (kind < 0.45) {
    v = DigitSlip(c.units, places, false, rng);
  } else if (kind < 0.57) {
    v = Transposition(c.units, places, rng);
  } else if (kind < 0.63) {
    v = c.units + (std::uniform_int_distribution<int>(0, 1)(rng) ? 1 : -1);
  } else if (kind < 0.70) {
    v = PlaceSlip(c.units, places, rng);
  } else if (kind < 0.80) {
    if (t[i - 1].state == 'r') v = t[i - 1].units;  // the neighbour's entry repeated
  } else if (kind < 0.87) {
    for (int j = i; j < i + 3; ++j) t[j] = t[j + 1];  // the eye slips: a run copied a row up
    return;
  } else if (kind < 0.94) {
    c.state = 'b';
    return;
  } else {
    c.state = 'i';
    return;
  }
  if (v && *v >= 0 && *v != c.units) c.units = *v;
}

void AddSlips(SimTable& t, int places, double per_100, std::mt19937& rng) {
  const double mean = per_100 * static_cast<double>(t.size()) / 100 *
                      std::uniform_real_distribution<double>(0.5, 2)(rng);
  std::poisson_distribution<int> count(mean);
  for (int k = count(rng); k > 0; --k) OneSlip(t, places, rng);
}

// A careful copyist or a modern editor recomputes: errors beyond a unit are
// put right with probability `p`; blanks and illegible entries are filled.
void Correct(SimTable& t, const TableSpec& spec, double p, std::mt19937& rng) {
  std::uniform_real_distribution<double> u(0, 1);
  for (std::size_t r = 0; r < t.size(); ++r) {
    auto& c = t[r];
    const bool wrong = c.state != 'r' || std::llabs(c.units - spec.model[r]) > 1;
    if (wrong && u(rng) < p) c = {spec.model[r], 'r'};
  }
}

// A modern edition prints the recomputed value at some of the author's
// departures, and rounds differently near a half unit here and there.
void Recompute(SimTable& t, const TableSpec& spec, double fix_departures, std::mt19937& rng) {
  std::uniform_real_distribution<double> u(0, 1);
  for (std::size_t r = 0; r < t.size(); ++r) {
    auto& c = t[r];
    if (c.state != 'r') continue;
    if (c.units == spec.archetype[r] && spec.archetype[r] != spec.model[r] &&
        u(rng) < fix_departures)
      c.units = spec.model[r];
    const double frac = spec.exact[r] - std::floor(spec.exact[r]);
    if (std::fabs(frac - 0.5) < 0.08 && c.units == spec.model[r] && u(rng) < 0.5)
      c.units = frac >= 0.5 ? c.units - 1 : c.units + 1;
  }
}

// ------------------------------------------------------------------ the stemma

std::string CenturyText(int year, std::mt19937& rng) {
  const int century = year / 100 + 1;
  const std::string th = std::to_string(century) + "th century";
  const int in = year % 100;
  const int form = std::uniform_int_distribution<int>(0, 3)(rng);
  if (form == 1 && in < 30) return "early " + th;
  if (form == 2 && in >= 70) return "late " + th;
  if (form == 3) return (in < 50 ? "first half of the " : "second half of the ") + th;
  return th;
}

std::string DateText(int year, WitnessKind kind, std::mt19937& rng) {
  const int y = year;
  std::string text;
  const double form = std::uniform_real_distribution<double>(0, 1)(rng);
  if (kind == WitnessKind::kModernEdition || form < 0.25) {
    text = std::to_string(y);
  } else if (form < 0.5) {
    text = "c. " + std::to_string((y + 5) / 10 * 10);
  } else if (form < 0.7) {
    text = CenturyText(y, rng);
  } else if (form < 0.85) {
    const int lo = y - std::uniform_int_distribution<int>(0, 20)(rng);
    text = std::to_string(lo) + "-" + std::to_string(lo + 25);
  } else {
    return "";
  }
  const auto range = ParseWitnessDate(text);
  if (!range || range->earliest > y || range->latest < y) return std::to_string(y);
  return text;
}

bool IsAncestor(const std::vector<TraditionNode>& nodes, int a, int b) {  // a above b
  for (int x = b; x >= 0; x = nodes[x].parent) {
    if (x == a) return true;
  }
  return false;
}

struct Builder {
  const DrawOptions& o;
  std::mt19937 rng;
  std::vector<TableSpec> specs;
  std::vector<TraditionNode> nodes;
  std::vector<std::vector<SimTable>> values;  // [node][table]

  double U() { return std::uniform_real_distribution<double>(0, 1)(rng); }
  int Int(int lo, int hi) { return std::uniform_int_distribution<int>(lo, hi)(rng); }

  std::vector<SimTable> Exemplar(const TraditionNode& n) {
    std::vector<SimTable> out = values[n.parent];
    if (n.second_exemplar < 0) return out;
    int offset = 0;
    for (std::size_t t = 0; t < specs.size(); ++t) {
      for (int r = 0; r < specs[t].rows; ++r) {
        const int w = offset + r;
        const bool second = n.switch_row > 0 ? w >= n.switch_row : w < -n.switch_row;
        if (second) out[t][r] = values[n.second_exemplar][t][r];
      }
      offset += specs[t].rows;
    }
    return out;
  }

  int Add(TraditionNode n) {
    auto v = Exemplar(n);
    const double fix = U();
    for (std::size_t t = 0; t < specs.size(); ++t) {
      auto& table = v[t];
      for (auto& c : table) {
        if (c.state == 'i') c.state = 'r';  // the copyist read it in his exemplar
      }
      if (n.kind == WitnessKind::kModernEdition) {
        // Half the modern editions print recomputed values (departures
        // put right, their own rounding near a half unit); the others
        // print the manuscript with its evident errors corrected.
        Correct(table, specs[t], fix < 0.5 ? 0.95 : 0.8, rng);
        if (fix < 0.5) Recompute(table, specs[t], 0.9, rng);
        AddSlips(table, specs[t].places, o.slips_per_100 * 0.2, rng);
      } else {
        if (n.corrector) Correct(table, specs[t], 0.3 + 0.5 * fix, rng);
        AddSlips(table, specs[t].places, o.slips_per_100 * (n.corrector ? 0.5 : 1), rng);
      }
    }
    nodes.push_back(std::move(n));
    values.push_back(std::move(v));
    return static_cast<int>(nodes.size()) - 1;
  }

  TraditionNode Child(int parent, bool extant) {
    TraditionNode n;
    n.parent = parent;
    n.extant = extant;
    n.year = std::min(1590, nodes[parent].year + Int(8, 60));
    return n;
  }

  // A second exemplar for a contaminated copy: on another line of the stemma.
  int SecondExemplar(int primary, int year) {
    std::vector<int> options;
    for (int k = 1; k < static_cast<int>(nodes.size()); ++k) {
      if (nodes[k].kind == WitnessKind::kModernEdition || nodes[k].year > year) continue;
      if (IsAncestor(nodes, k, primary) || IsAncestor(nodes, primary, k)) continue;
      options.push_back(k);
    }
    if (options.empty()) return -1;
    return options[std::uniform_int_distribution<std::size_t>(0, options.size() - 1)(rng)];
  }
};

int TotalRows(const std::vector<TableSpec>& specs) {
  int n = 0;
  for (const auto& s : specs) n += s.rows;
  return n;
}

void BuildManuscripts(Builder& b, int witnesses, int lost) {
  for (int k = 0; k < lost; ++k) {
    auto n = b.Child(b.Int(0, static_cast<int>(b.nodes.size()) - 1), false);
    n.name = "lost " + std::to_string(k + 1);
    b.Add(std::move(n));
  }
  const bool contaminate = b.U() < b.o.contamination && witnesses >= 4;
  const int contaminated = contaminate ? b.Int(witnesses / 2, witnesses - 1) : -1;
  for (int k = 0; k < witnesses; ++k) {
    int parent = -1;
    for (int x = 1; x < static_cast<int>(b.nodes.size()) && parent < 0; ++x) {
      bool childless = !b.nodes[x].extant;
      for (const auto& y : b.nodes) childless = childless && y.parent != x;
      if (childless) parent = x;  // every lost copy has a descendant
    }
    if (parent < 0) parent = b.Int(0, static_cast<int>(b.nodes.size()) - 1);
    auto n = b.Child(parent, true);
    n.kind = b.U() < 0.1 ? WitnessKind::kPrint : WitnessKind::kManuscript;
    if (n.kind == WitnessKind::kPrint) n.year = std::max(n.year, 1480 + b.Int(0, 100));
    n.corrector = b.U() < b.o.corrector;
    if (k == contaminated) {
      n.corrector = false;
      n.second_exemplar = b.SecondExemplar(parent, n.year);
      const int rows = TotalRows(b.specs);
      const int at = static_cast<int>(rows * b.U() * 0.4 + rows * 0.3);
      // The exemplar followed for more of the work is the parent; the
      // other one is followed before or after the switch.
      n.switch_row = b.U() < 0.5 ? std::max(at, rows - at) : -std::min(at, rows - at);
    }
    b.Add(std::move(n));
  }
}

void BuildModernEditions(Builder& b) {
  if (b.U() >= b.o.modern_editions) return;
  const int count = b.Int(1, 3);
  for (int k = 0; k < count; ++k) {
    std::vector<int> options;
    for (int x = 1; x < static_cast<int>(b.nodes.size()); ++x) {
      const bool modern = b.nodes[x].kind == WitnessKind::kModernEdition;
      if (b.nodes[x].extant && (!modern || b.U() < 0.5)) options.push_back(x);
    }
    auto n = b.Child(
        options[std::uniform_int_distribution<std::size_t>(0, options.size() - 1)(b.rng)], true);
    n.kind = WitnessKind::kModernEdition;
    n.year = std::max(b.nodes[n.parent].year + 1, b.Int(1850, 2010));
    n.corrector = true;
    b.Add(std::move(n));
  }
}

void NameWitnesses(Builder& b) {
  std::vector<std::string> names;
  for (char c = 'A'; c <= 'Z'; ++c) names.push_back(std::string(1, c));
  std::shuffle(names.begin(), names.end(), b.rng);
  std::size_t next = 0;
  for (auto& n : b.nodes) {
    if (!n.extant) continue;
    n.name = names[next++];
    n.date = DateText(n.year, n.kind, b.rng);
  }
}

Transcription Write(const Builder& b, int node, int table) {
  const auto& spec = b.specs[table];
  const auto& n = b.nodes[node];
  Transcription t;
  t.work = {"synthetic", "A synthetic tradition (invented)", ""};
  t.table_id = spec.id;
  t.table_title = spec.title;
  t.kind = spec.kind;
  t.witness.siglum = n.name;
  t.witness.library = "Invented Library";
  t.witness.shelfmark = "MS " + n.name;
  t.witness.date = n.date;
  t.witness.kind = ToString(n.kind);
  t.witness.script = "hindu-arabic";
  t.argument = {spec.argument, "deg", 0, Sexagesimal::FromUnits(1, 0),
                Sexagesimal::FromUnits(1, 0)};
  t.columns.push_back({"value", "deg", spec.places, "", std::nullopt});
  for (int r = 0; r < spec.rows; ++r) {
    Row row;
    row.argument.raw = std::to_string(r + 1);
    row.argument.value = Sexagesimal::FromUnits(r + 1, 0);
    const SimCell& c = b.values[node][table][r];
    Cell cell;
    cell.places = spec.places;
    if (c.state == 'b') {
      cell.state = CellState::kBlank, cell.raw = "_";
    } else if (c.state == 'i') {
      cell.state = CellState::kIllegible, cell.raw = "?";
    } else {
      cell.value = Sexagesimal::FromUnits(c.units, spec.places);
      cell.raw = cell.value->ToString();
    }
    row.cells.push_back(std::move(cell));
    t.rows.push_back(std::move(row));
  }
  return t;
}

}  // namespace

TraditionDraw DrawTradition(const DrawOptions& o) {
  Builder b{o, std::mt19937(o.seed), {}, {}, {}};
  const int tables = b.Int(o.min_tables, o.max_tables);
  std::vector<int> families = {0, 1, 2};
  std::shuffle(families.begin(), families.end(), b.rng);
  for (int t = 0; t < tables; ++t)
    b.specs.push_back(MakeTable(families[t % 3], t, b.rng, o.author_departures));
  TraditionNode root;
  root.name = kArchetype;
  root.year = b.Int(1150, 1300);
  b.nodes.push_back(root);
  std::vector<SimTable> archetype;
  for (const auto& s : b.specs) {
    SimTable t;
    for (Units u : s.archetype) t.push_back({u, 'r'});
    archetype.push_back(std::move(t));
  }
  b.values.push_back(std::move(archetype));
  const int editions_room = 3;
  const int witnesses =
      b.Int(o.min_witnesses, std::max(o.min_witnesses, o.max_witnesses - editions_room));
  const int lost = b.Int(1, std::max(1, witnesses / 2));
  BuildManuscripts(b, witnesses, lost);
  BuildModernEditions(b);
  NameWitnesses(b);

  TraditionDraw out;
  out.nodes = b.nodes;
  for (std::size_t t = 0; t < b.specs.size(); ++t) {
    std::vector<Transcription> ws;
    for (std::size_t n = 0; n < b.nodes.size(); ++n) {
      if (b.nodes[n].extant) ws.push_back(Write(b, static_cast<int>(n), static_cast<int>(t)));
    }
    out.tables.push_back(std::move(ws));
    std::vector<Sexagesimal> archetype_values;
    for (Units u : b.specs[t].archetype)
      archetype_values.push_back(Sexagesimal::FromUnits(u, b.specs[t].places));
    out.archetype.push_back(std::move(archetype_values));
    const auto model = b.specs[t].model;
    const int places = b.specs[t].places;
    out.models.push_back(
        {"the author's model (given)",
         [model, places](const Sexagesimal& arg, int) -> std::optional<Sexagesimal> {
           const auto r = static_cast<std::size_t>(arg.IntegerPart()) - 1;
           if (r >= model.size()) return std::nullopt;
           return Sexagesimal::FromUnits(model[r], places);
         }});
  }
  return out;
}

int TraditionDraw::Node(const std::string& name) const {
  for (std::size_t n = 0; n < nodes.size(); ++n) {
    if (nodes[n].name == name) return static_cast<int>(n);
  }
  return -1;
}

std::vector<Group> TraditionDraw::TrueGroups() const {
  const int total =
      static_cast<int>(std::count_if(nodes.begin(), nodes.end(), [](auto& n) { return n.extant; }));
  std::set<Group> groups;
  for (std::size_t n = 1; n < nodes.size(); ++n) {
    Group g;
    for (std::size_t m = 0; m < nodes.size(); ++m) {
      if (nodes[m].extant && IsAncestor(nodes, static_cast<int>(n), static_cast<int>(m)))
        g.push_back(nodes[m].name);
    }
    std::sort(g.begin(), g.end());
    if (g.size() >= 2 && static_cast<int>(g.size()) < total) groups.insert(g);
  }
  return {groups.begin(), groups.end()};
}

std::vector<std::pair<std::string, std::string>> TraditionDraw::TrueCopies() const {
  std::vector<std::pair<std::string, std::string>> out;
  for (const auto& n : nodes) {
    if (n.extant && n.parent >= 0 && nodes[n.parent].extant && n.second_exemplar < 0)
      out.emplace_back(n.name, nodes[n.parent].name);
  }
  return out;
}

std::vector<std::string> TraditionDraw::Contaminated() const {
  std::vector<std::string> out;
  for (const auto& n : nodes) {
    if (n.extant && n.second_exemplar >= 0) out.push_back(n.name);
  }
  return out;
}

std::vector<std::string> TraditionDraw::Correctors() const {
  std::vector<std::string> out;
  for (const auto& n : nodes) {
    if (n.extant && n.corrector) out.push_back(n.name);
  }
  return out;
}

}  // namespace apograph::lineage

namespace apograph::lineage {
namespace {

double NormalisedRf(const std::set<Group>& truth, const std::set<Group>& found) {
  if (truth.empty() && found.empty()) return 0;
  int d = 0;
  for (const auto& g : truth) d += found.count(g) ? 0 : 1;
  for (const auto& g : found) d += truth.count(g) ? 0 : 1;
  return static_cast<double>(d) / static_cast<double>(truth.size() + found.size());
}

// Groups that some cell shows: its readers of one value (other than the
// archetype's; more than a unit from it when `strong`) are exactly the
// group's legible members, two or more.
std::set<Group> MarkedGroups(const TraditionDraw& d, const std::set<Group>& truth, bool strong) {
  std::set<Group> marked;
  for (std::size_t t = 0; t < d.tables.size(); ++t) {
    const auto& ws = d.tables[t];
    for (std::size_t r = 0; r < d.archetype[t].size(); ++r) {
      std::map<std::string, Group> by_value;
      Group legible;
      for (const auto& w : ws) {
        const Cell& c = w.rows[r].cells[0];
        if (c.state == CellState::kIllegible) continue;
        legible.push_back(w.witness.siglum);
        const std::string v = c.value ? c.value->ToString() : "blank";
        if (c.value && c.value->Identical(d.archetype[t][r])) continue;
        if (strong && c.value &&
            std::fabs(DiffUnits(*c.value, d.archetype[t][r], c.value->places())) <= 1 + 1e-9)
          continue;
        by_value[v].push_back(w.witness.siglum);
      }
      for (auto& [v, g] : by_value) {
        std::sort(g.begin(), g.end());
        if (g.size() < 2) continue;
        for (const auto& group : truth) {
          Group inside;
          for (const auto& s : group) {
            if (std::find(legible.begin(), legible.end(), s) != legible.end()) inside.push_back(s);
          }
          if (inside == g) marked.insert(group);
        }
      }
    }
  }
  return marked;
}

bool Contains(const std::vector<std::string>& v, const std::string& x) {
  return std::find(v.begin(), v.end(), x) != v.end();
}

}  // namespace

DrawScore ScoreDraw(const TraditionDraw& d, const LineageReport& report) {
  DrawScore s;
  const auto truth_list = d.TrueGroups();
  const std::set<Group> truth(truth_list.begin(), truth_list.end());
  std::set<Group> found;
  if (!report.results.empty()) {
    for (const auto& g : report.results.front().groups) found.insert(g.witnesses);
  }
  const std::set<Group> marked = MarkedGroups(d, truth, false);
  const std::set<Group> strongly = MarkedGroups(d, truth, true);
  s.strongly_marked = static_cast<int>(strongly.size());
  for (const auto& g : strongly) s.strongly_marked_recovered += found.count(g) ? 1 : 0;
  s.true_groups = static_cast<int>(truth.size());
  s.marked_groups = static_cast<int>(marked.size());
  s.found_groups = static_cast<int>(found.size());
  for (const auto& g : marked) {
    s.marked_recovered += found.count(g) ? 1 : 0;
    if (!found.count(g)) s.missed.push_back(g);
  }
  for (const auto& g : found) {
    if (!truth.count(g)) s.false_groups.push_back(g);
  }
  s.rf_found = NormalisedRf(truth, found);
  s.rf_best = NormalisedRf(truth, marked);
  const auto copies = d.TrueCopies();
  s.true_copies = static_cast<int>(copies.size());
  for (const auto& c : report.copies) {
    if (c.twins) continue;
    ++s.copy_claims;
    const int node = d.Node(c.copy), exemplar = d.Node(c.exemplar);
    const bool right =
        node >= 0 && exemplar >= 0 &&
        (d.nodes[node].parent == exemplar || d.nodes[node].second_exemplar == exemplar);
    s.copy_claims_right += right ? 1 : 0;
    if (!right) s.wrong_copies.push_back(c.copy + "<" + c.exemplar);
    const auto a = ParseWitnessDate(d.nodes[exemplar].date),
               b = ParseWitnessDate(d.nodes[node].date);
    if (a && b && b->WhollyBefore(*a)) ++s.date_violations;
    for (const auto& [copy, ex] : copies) {
      if (copy == c.copy && ex == c.exemplar) ++s.true_copies_named;
    }
  }
  for (const auto& [copy, ex] : copies) {
    bool named = false;
    for (const auto& c : report.copies)
      named = named || (c.copy == copy && c.exemplar == ex && !c.twins);
    if (!named) s.missed_copies.push_back(copy + "<" + ex);
  }
  const auto contaminated = d.Contaminated();
  s.contaminated = static_cast<int>(contaminated.size());
  for (const auto& c : report.contamination) {
    ++s.flagged;
    s.flagged_right += Contains(contaminated, c.witness) ? 1 : 0;
  }
  const auto correctors = d.Correctors();
  s.correctors = static_cast<int>(correctors.size());
  for (const auto& c : report.corrections) {
    ++s.correctors_flagged;
    s.correctors_right += Contains(correctors, c.witness) ? 1 : 0;
  }
  return s;
}

}  // namespace apograph::lineage
