#include "lineage/characters.hpp"

#include <algorithm>
#include <cmath>
#include <map>
#include <optional>
#include <tuple>

namespace apograph::lineage {

int CharacterMatrix::ErrorCount(int taxon) const {
  int n = 0;
  for (const auto& c : characters) n += c.states[taxon] == 1 ? 1 : 0;
  return n;
}

namespace {

int SymbolsChanged(const std::string& a, const std::string& b) {
  if (a.size() != b.size()) return 99;
  int n = 0;
  for (std::size_t i = 0; i < a.size(); ++i) n += a[i] != b[i] ? 1 : 0;
  return n;
}

bool AdjacentTransposition(const std::string& a, const std::string& b) {
  if (a.size() != b.size()) return false;
  for (std::size_t i = 0; i + 1 < a.size(); ++i) {
    if (a[i] != b[i]) {
      std::string t = a;
      std::swap(t[i], t[i + 1]);
      return t == b;
    }
  }
  return false;
}

}  // namespace

double ErrorWeight(const collate::Reading& r, const std::string& right, std::string* reason) {
  auto say = [&](double w, const char* why) {
    if (reason) *reason = why;
    return w;
  };
  if (r.common_slip) return say(1, "a common slip (as explained)");
  if (r.units_off && std::fabs(*r.units_off) <= 1.0 + 1e-9) {
    return say(0.5, "one unit off in the last place: arises independently");
  }
  if (r.kind == collate::ReadingKind::kBlank) return say(1, "entry left blank");
  if (!right.empty() && SymbolsChanged(r.text, right) == 1) {
    return say(1, "one symbol changed: a common confusion");
  }
  if (!right.empty() && AdjacentTransposition(r.text, right))
    return say(1, "two symbols transposed");
  if (!r.slip.empty()) return say(2, "an explained slip that is not a common one");
  return say(3, "distinctive: several symbols or a place changed");
}

namespace {

int Legible(const std::vector<const collate::Reading*>& rs) {
  int n = 0;
  for (const auto* r : rs) n += static_cast<int>(r->sigla.size());
  return n;
}

// Distance in units of the last place between two value readings, when both
// are values.
std::optional<double> UnitsBetween(const collate::Reading& a, const collate::Reading& b) {
  if (!a.value || !b.value) return std::nullopt;
  return DiffUnits(*a.value, *b.value, std::max(a.value->places(), b.value->places()));
}

// A witness without the slide reads the run's rows right; with an error
// (its own slide or slip) or an unreadable cell there it may have had the
// slide and written over it: unknown, as for a cell.
bool ReadsRunRight(const collate::Collation& c, const std::string& siglum, int col, int first,
                   int last) {
  for (int j = first; j <= last; ++j) {
    const collate::Reading* r = c.rows[j].cells[col].ReadingOf(siglum);
    if (!r || !r->Comparable() || r->error) return false;
  }
  return true;
}

void AddSlideCharacters(const collate::Collation& c, CharacterMatrix& m) {
  // Witnesses sharing the same slid run share one character.
  std::map<std::tuple<int, int, int, int>, std::vector<std::string>> runs;
  for (const auto& s : c.slides)
    runs[{s.column, s.first_row, s.last_row, s.offset}].push_back(s.siglum);
  for (const auto& [key, sigla] : runs) {
    const auto [col, first, last, offset] = key;
    Character ch;
    ch.row_label = c.rows[first].argument.ToString();
    ch.label = c.table_id + " " + ch.row_label + "-" + c.rows[last].argument.ToString() + " " +
               c.columns[col].name + ": column slid by a row";
    ch.block = c.table_id + " " + ch.row_label;
    ch.position = first;
    ch.weight = 3;
    ch.weight_reason = "a run of a column slid by a row";
    ch.direction = c.reference_description.empty() ? Direction::kMajority : Direction::kModel;
    // Judged by a model, state 0 reads every row of the run as the model
    // does: a right reading, which a corrector may have restored.
    ch.base_is_right = ch.direction == Direction::kModel;
    for (const auto& w : c.witnesses) {
      const bool has = std::find(sigla.begin(), sigla.end(), w.siglum) != sigla.end();
      ch.states.push_back(has ? 1 : (ReadsRunRight(c, w.siglum, col, first, last) ? 0 : -1));
    }
    m.characters.push_back(std::move(ch));
  }
}

// The comparable readings of a cell (values and blanks) by witnesses whose
// cell is not part of a slid run (the slide is its own character).
struct CellReadings {
  std::vector<collate::Reading> readings;
  std::vector<const collate::Reading*> all, right, wrong;
};

CellReadings Readings(const collate::Collation& c, int j, const collate::CollatedCell& cell) {
  CellReadings out;
  for (const auto& r : cell.readings) {
    if (!r.Comparable()) continue;
    collate::Reading kept = r;
    kept.sigla.clear();
    for (const auto& s : r.sigla) {
      if (!c.SlideAt(s, j, cell.column)) kept.sigla.push_back(s);
    }
    if (kept.sigla.empty()) continue;
    // The same reading judged differently in two witnesses is one reading
    // here (the judgement of the first, most witnesses, stands).
    auto same = std::find_if(out.readings.begin(), out.readings.end(), [&](const auto& x) {
      return x.kind == kept.kind && x.text == kept.text;
    });
    if (same == out.readings.end())
      out.readings.push_back(std::move(kept));
    else
      same->sigla.insert(same->sigla.end(), kept.sigla.begin(), kept.sigla.end());
  }
  for (const auto& r : out.readings) {
    out.all.push_back(&r);
    (r.error ? out.wrong : out.right).push_back(&r);
  }
  return out;
}

// One character: `carrier` in state 1, `base` in state 0, every other
// comparable reading unknown (its own change may have been made on this one).
Character MakeCharacter(const collate::Collation& c, int j, const collate::CollatedCell& cell,
                        const collate::Reading& carrier, const collate::Reading* base) {
  Character ch;
  ch.row_label = c.rows[j].argument.ToString();
  ch.label = c.table_id + " " + ch.row_label + " " + c.columns[cell.column].name + ": " +
             carrier.text + (base ? " (" + base->text + ")" : "");
  ch.block = c.table_id + " " + ch.row_label;
  ch.position = j;
  ch.omission = carrier.kind == collate::ReadingKind::kBlank;
  ch.cause = carrier.error ? carrier.cause : "";
  ch.row = j;
  ch.column = c.columns[cell.column].name;
  for (const auto& w : c.witnesses) {
    const collate::Reading* mine = nullptr;
    for (const auto& r : carrier.sigla) mine = r == w.siglum ? &carrier : mine;
    for (const auto& r : base ? base->sigla : std::vector<std::string>{})
      mine = r == w.siglum ? base : mine;
    ch.states.push_back(mine == &carrier ? 1 : (mine == base && base ? 0 : -1));
  }
  return ch;
}

// Whether a value reading repeats an entry of the row above or below in the
// same column (as some witness reads it there).
bool RepeatsNeighbour(const collate::Collation& c, int j, int column, const collate::Reading& r) {
  if (r.kind != collate::ReadingKind::kValue) return false;
  for (int k : {j - 1, j + 1}) {
    if (k < 0 || k >= static_cast<int>(c.rows.size())) continue;
    for (const auto& x : c.rows[k].cells[column].readings) {
      if (x.kind == collate::ReadingKind::kValue && x.text == r.text) return true;
    }
  }
  return false;
}

void Weigh(Character& ch, const collate::Reading& carrier, const collate::Reading* base,
           std::optional<double> units_off) {
  collate::Reading r = carrier;
  if (units_off) r.units_off = units_off;
  ch.weight = ErrorWeight(r, base ? base->text : "", &ch.weight_reason);
  const auto between = base ? UnitsBetween(carrier, *base) : std::nullopt;
  ch.one_unit = between && std::fabs(*between) <= 1.0 + 1e-9;
}

// Weigh, and a repeated neighbour weighs as a common slip (the eye falls on
// the line above or below: copyists do it independently, and it lands on
// the same value whoever makes it).
void Weigh(Character& ch, const collate::Collation& c, int j, int column,
           const collate::Reading& carrier, const collate::Reading* base,
           std::optional<double> units_off) {
  Weigh(ch, carrier, base, units_off);
  if (ch.weight > 1 && RepeatsNeighbour(c, j, column, carrier)) {
    ch.weight = 1;
    ch.weight_reason = "repeats a neighbouring entry: a common slip";
  }
}

bool Recomputed(const collate::Reading& r) { return r.units_off && std::fabs(*r.units_off) < 1e-9; }

// Right readings that differ among themselves (all within the tolerance of
// the model). When most witnesses read the recomputed value, it is the
// base and the others' readings are directed characters. Otherwise most
// keep another right reading (as a rule the author's own departure of a
// unit) and the recomputed value is a correction, evidence of nothing but
// the recomputing: its readers are counted (CharacterMatrix::recomputed)
// and left unknown; the other right readings still split the witnesses.
void RoundingCharacters(const collate::Collation& c, int j, const collate::CollatedCell& cell,
                        const CellReadings& rs, CharacterMatrix& m) {
  if (rs.right.size() < 2) return;
  const collate::Reading* recomputed = nullptr;
  for (const auto* r : rs.right) recomputed = Recomputed(*r) ? r : recomputed;
  const bool model_base =
      recomputed && 2 * static_cast<int>(recomputed->sigla.size()) > Legible(rs.all);
  const collate::Reading* base = recomputed;
  if (!model_base) {
    base = nullptr;
    for (const auto* r : rs.right) base = !base && r != recomputed ? r : base;
  }
  // Where two thirds of the witnesses or more keep another right reading,
  // that reading was the archetype's (as a rule the author's own): reading
  // the recomputed value there is a correction.
  const bool kept =
      !recomputed || 3 * static_cast<int>(recomputed->sigla.size()) <= Legible(rs.all);
  if (!model_base && kept) {
    for (std::size_t t = 0; t < c.witnesses.size(); ++t) {
      const auto& s = c.witnesses[t].siglum;
      for (const auto* r : rs.right) {
        if (std::find(r->sigla.begin(), r->sigla.end(), s) == r->sigla.end()) continue;
        ++m.departure_cells[t];
        if (r == recomputed) ++m.recomputed[t];
      }
    }
  }
  for (const auto* r : rs.right) {
    if (r == base || (r == recomputed && !model_base)) continue;
    Character ch = MakeCharacter(c, j, cell, *r, base);
    Weigh(ch, c, j, cell.column, *r, base, UnitsBetween(*r, *base));
    ch.base_is_right = model_base;
    ch.carrier_is_right = true;
    ch.direction = model_base ? Direction::kModel : Direction::kNone;
    m.characters.push_back(std::move(ch));
  }
}

// Judged by a model: every error against a right reading; right readings
// that differ among themselves (RoundingCharacters).
void JudgedCharacters(const collate::Collation& c, int j, const collate::CollatedCell& cell,
                      const CellReadings& rs, CharacterMatrix& m) {
  const collate::Reading* base = rs.right.front();  // most witnesses first
  for (const auto* r : rs.right) base = Recomputed(*r) ? r : base;
  for (const auto* e : rs.wrong) {
    Character ch = MakeCharacter(c, j, cell, *e, base);
    for (std::size_t k = 0; k < ch.states.size(); ++k) {
      for (const auto* r : rs.right) {  // every right reading is state 0 for an error
        if (std::find(r->sigla.begin(), r->sigla.end(), c.witnesses[k].siglum) != r->sigla.end())
          ch.states[k] = 0;
      }
    }
    Weigh(ch, c, j, cell.column, *e, base, e->units_off);
    ch.base_is_right = true;
    ch.direction = Direction::kModel;
    m.characters.push_back(std::move(ch));
  }
  RoundingCharacters(c, j, cell, rs, m);
}

// No model (or every reading wrong): the most frequent reading is the base.
void UnjudgedCharacters(const collate::Collation& c, int j, const collate::CollatedCell& cell,
                        const CellReadings& rs, CharacterMatrix& m) {
  const int legible = Legible(rs.all);
  const collate::Reading* base = rs.all.front();
  const bool majority = 2 * static_cast<int>(base->sigla.size()) > legible;
  if (!majority) ++m.undetermined_cells;
  for (const auto* r : rs.all) {
    if (r == base) continue;
    Character ch = MakeCharacter(c, j, cell, *r, base);
    Weigh(ch, c, j, cell.column, *r, base, UnitsBetween(*r, *base));
    ch.direction = majority ? Direction::kMajority : Direction::kNone;
    m.characters.push_back(std::move(ch));
  }
}

void AddCellCharacters(const collate::Collation& c, int j, const collate::CollatedCell& cell,
                       CharacterMatrix& m) {
  CellReadings rs = Readings(c, j, cell);
  if (rs.all.size() < 2) return;
  std::stable_sort(rs.all.begin(), rs.all.end(),
                   [](auto* a, auto* b) { return a->sigla.size() > b->sigla.size(); });
  std::stable_sort(rs.right.begin(), rs.right.end(),
                   [](auto* a, auto* b) { return a->sigla.size() > b->sigla.size(); });
  const bool judged =
      cell.basis == collate::Basis::kCaller || cell.basis == collate::Basis::kRecomputation;
  if (judged && !rs.right.empty())
    JudgedCharacters(c, j, cell, rs, m);
  else
    UnjudgedCharacters(c, j, cell, rs, m);
}

}  // namespace

const char* ToString(Direction d) {
  switch (d) {
    case Direction::kModel:
      return "model";
    case Direction::kMajority:
      return "majority";
    case Direction::kTree:
      return "tree";
    case Direction::kNone:
      return "none";
  }
  return "?";
}

int CharacterMatrix::TaxonIndex(const std::string& siglum) const {
  const auto it = std::find(taxa.begin(), taxa.end(), siglum);
  return it == taxa.end() ? -1 : static_cast<int>(it - taxa.begin());
}

void JoinRepeatedSlips(CharacterMatrix& m) {
  std::vector<Character> out;
  out.reserve(m.characters.size());
  // The run each joined character extends, by table, column and carriers.
  std::map<std::tuple<std::string, std::string, std::vector<bool>>, std::size_t> open;
  for (auto& ch : m.characters) {
    if (ch.cause != "systematic" || ch.tie_break) {
      out.push_back(std::move(ch));
      continue;
    }
    std::vector<bool> carriers(ch.states.size());
    for (std::size_t t = 0; t < ch.states.size(); ++t) carriers[t] = ch.states[t] == 1;
    const auto key = std::make_tuple(ch.block.substr(0, ch.block.find(' ')), ch.column, carriers);
    const auto it = open.find(key);
    if (it == open.end() || out[it->second].row + out[it->second].rows != ch.row) {
      open[key] = out.size();
      out.push_back(std::move(ch));
      continue;
    }
    Character& run = out[it->second];
    ++run.rows;
    run.label = run.block + "-" + ch.block.substr(ch.block.find(' ') + 1) + " " + ch.column +
                ": one slip repeated over " + std::to_string(run.rows) + " rows";
    // A witness reads the run's base only where it reads every row's.
    for (std::size_t t = 0; t < ch.states.size(); ++t) {
      if (run.states[t] != ch.states[t]) run.states[t] = -1;
    }
    run.one_unit = run.one_unit && ch.one_unit;
    const bool head = run.row < kHeadRows;
    // One event: as distinctive as its most distinctive row, no more than a
    // slid run; at a column's head, a habit.
    run.weight = head ? std::min(run.weight, kRepeatedSlipAtHead)
                      : std::min(std::max(run.weight, ch.weight), kRepeatedSlipWeight);
    run.weight_reason = head ? "one slip repeated over the head of a column: a habit copyists share"
                             : "one slip repeated over a run of rows (one event)";
  }
  m.characters = std::move(out);
}

CharacterMatrix BuildCharacters(const collate::Collation& c) {
  CharacterMatrix m;
  for (const auto& w : c.witnesses) m.taxa.push_back(w.siglum);
  m.witnesses = c.witnesses;
  m.recomputed.assign(m.taxa.size(), 0);
  m.departure_cells.assign(m.taxa.size(), 0);
  m.title = c.work.title.empty() ? c.table_title : c.work.title;
  AddSlideCharacters(c, m);
  for (std::size_t j = 0; j < c.rows.size(); ++j) {
    for (const auto& cell : c.rows[j].cells) {
      if (cell.Varies()) AddCellCharacters(c, static_cast<int>(j), cell, m);
    }
  }
  std::stable_sort(m.characters.begin(), m.characters.end(),
                   [](const Character& a, const Character& b) { return a.position < b.position; });
  JoinRepeatedSlips(m);
  return m;
}

CharacterMatrix MergeMatrices(const std::vector<CharacterMatrix>& parts) {
  CharacterMatrix m;
  for (const auto& p : parts) {
    if (m.title.empty()) m.title = p.title;
    for (std::size_t k = 0; k < p.taxa.size(); ++k) {
      if (m.TaxonIndex(p.taxa[k]) >= 0) continue;
      m.taxa.push_back(p.taxa[k]);
      m.witnesses.push_back(k < p.witnesses.size() ? p.witnesses[k] : WitnessInfo{p.taxa[k]});
    }
  }
  m.recomputed.assign(m.taxa.size(), 0);
  m.departure_cells.assign(m.taxa.size(), 0);
  for (const auto& p : parts) {
    for (std::size_t k = 0; k < p.taxa.size(); ++k) {
      const int at = m.TaxonIndex(p.taxa[k]);
      if (k < p.recomputed.size()) m.recomputed[at] += p.recomputed[k];
      if (k < p.departure_cells.size()) m.departure_cells[at] += p.departure_cells[k];
    }
  }
  int offset = 0;
  for (const auto& p : parts) {
    int last = 0;
    for (const auto& ch : p.characters) {
      Character out = ch;
      out.position = offset + ch.position;
      if (parts.size() > 1) out.row_label = ch.block;  // "decl 25": rows of several tables
      last = std::max(last, ch.position + 1);
      out.states.assign(m.taxa.size(), -1);
      for (std::size_t k = 0; k < p.taxa.size(); ++k) {
        const auto at = std::find(m.taxa.begin(), m.taxa.end(), p.taxa[k]) - m.taxa.begin();
        out.states[at] = ch.states[k];
      }
      m.characters.push_back(std::move(out));
    }
    offset += last;
    m.undetermined_cells += p.undetermined_cells;
  }
  return m;
}

}  // namespace apograph::lineage
