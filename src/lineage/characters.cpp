#include "lineage/characters.hpp"

#include <algorithm>
#include <cmath>
#include <map>
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

// The right reading of a cell in words: a reading not marked as an error, or
// the recomputed value.
std::string RightText(const collate::CollatedCell& cell) {
  for (const auto& r : cell.readings) {
    if (r.Comparable() && !r.error) return r.text;
  }
  return cell.computed ? cell.computed->ToString() : "";
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
    for (const auto& w : c.witnesses) {
      const bool has = std::find(sigla.begin(), sigla.end(), w.siglum) != sigla.end();
      ch.states.push_back(has ? 1 : (ReadsRunRight(c, w.siglum, col, first, last) ? 0 : -1));
    }
    m.characters.push_back(std::move(ch));
  }
}

void AddCellCharacters(const collate::Collation& c, int j, const collate::CollatedCell& cell,
                       CharacterMatrix& m) {
  const std::string right = RightText(cell);
  for (const auto& r : cell.readings) {
    if (!r.Comparable() || !r.error) continue;
    Character ch;
    ch.row_label = c.rows[j].argument.ToString();
    ch.label = c.table_id + " " + ch.row_label + " " + c.columns[cell.column].name + ": " + r.text +
               (right.empty() ? "" : " (" + right + ")");
    ch.block = c.table_id + " " + ch.row_label;
    ch.position = j;
    ch.weight = ErrorWeight(r, right, &ch.weight_reason);
    ch.omission = r.kind == collate::ReadingKind::kBlank;
    for (const auto& w : c.witnesses) {
      const collate::Reading* mine = cell.ReadingOf(w.siglum);
      signed char s = -1;
      if (c.SlideAt(w.siglum, j, cell.column))
        s = -1;  // counted once as the slide
      else if (mine == &r)
        s = 1;
      else if (mine && mine->Comparable())
        s = mine->error ? -1 : 0;  // another error may hide this one
      ch.states.push_back(s);
    }
    if (std::count(ch.states.begin(), ch.states.end(), 1) > 0)
      m.characters.push_back(std::move(ch));
  }
}

}  // namespace

CharacterMatrix BuildErrorCharacters(const collate::Collation& c) {
  CharacterMatrix m;
  for (const auto& w : c.witnesses) m.taxa.push_back(w.siglum);
  AddSlideCharacters(c, m);
  for (std::size_t j = 0; j < c.rows.size(); ++j) {
    for (const auto& cell : c.rows[j].cells) {
      if (!cell.Varies()) continue;
      if (cell.basis == collate::Basis::kUndetermined) {
        ++m.undetermined_cells;
        continue;
      }
      AddCellCharacters(c, static_cast<int>(j), cell, m);
    }
  }
  std::stable_sort(m.characters.begin(), m.characters.end(),
                   [](const Character& a, const Character& b) { return a.position < b.position; });
  return m;
}

CharacterMatrix MergeMatrices(const std::vector<CharacterMatrix>& parts) {
  CharacterMatrix m;
  for (const auto& p : parts) {
    for (const auto& t : p.taxa) {
      if (std::find(m.taxa.begin(), m.taxa.end(), t) == m.taxa.end()) m.taxa.push_back(t);
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
