#include "publish/apparatus.hpp"

#include <algorithm>
#include <cctype>
#include <map>

#include "support/input_error.hpp"

namespace apograph::publish {
namespace {

using collate::Reading;

bool Carries(const Reading& r, const std::string& siglum) {
  return std::find(r.sigla.begin(), r.sigla.end(), siglum) != r.sigla.end();
}

// Votes of the independent branches for each comparable reading.
std::vector<int> BranchVotes(const collate::CollatedCell& cell,
                             const std::vector<std::vector<std::string>>& branches) {
  std::vector<int> votes(cell.readings.size(), 0);
  for (const auto& branch : branches) {
    int best = -1, best_n = 0;
    bool tie = false;
    for (std::size_t k = 0; k < cell.readings.size(); ++k) {
      if (!cell.readings[k].Comparable()) continue;
      int n = 0;
      for (const auto& s : branch) n += Carries(cell.readings[k], s) ? 1 : 0;
      if (n > best_n)
        best = static_cast<int>(k), best_n = n, tie = false;
      else if (n == best_n && n > 0)
        tie = true;
    }
    if (best >= 0 && !tie) ++votes[best];
  }
  return votes;
}

int DefaultLemma(const collate::CollatedCell& cell,
                 const std::vector<std::vector<std::string>>& branches) {
  const auto votes = BranchVotes(cell, branches);
  int best = -1;
  auto better = [&](std::size_t a, std::size_t b) {  // is reading a better than b?
    const auto &ra = cell.readings[a], &rb = cell.readings[b];
    if (ra.error != rb.error) return !ra.error;
    if (votes[a] != votes[b]) return votes[a] > votes[b];
    return ra.sigla.size() > rb.sigla.size();
  };
  for (std::size_t k = 0; k < cell.readings.size(); ++k) {
    if (!cell.readings[k].Comparable()) continue;
    if (best < 0 || better(k, static_cast<std::size_t>(best))) best = static_cast<int>(k);
  }
  return best;
}

std::string Canonical(const std::string& text) {
  auto v = Sexagesimal::Parse(text);
  return v ? v->ToString() : text;
}

ApparatusEntry Entry(const collate::CollatedCell& cell, int lemma, const Override* o) {
  ApparatusEntry e;
  int chosen = lemma;
  if (o) {
    chosen = -1;
    const std::string text = Canonical(o->reading);
    for (std::size_t k = 0; k < cell.readings.size(); ++k) {
      if (cell.readings[k].Comparable() && cell.readings[k].text == text)
        chosen = static_cast<int>(k);
    }
    e.editor = true;
    e.lemma = text;
    e.emendation = chosen < 0;
    e.note = o->note.empty() ? (e.emendation ? "emended by the editor" : "adopted by the editor")
                             : o->note;
  }
  if (chosen >= 0) {
    const Reading& r = cell.readings[chosen];
    e.lemma = r.text;
    e.lemma_sigla = r.sigla;
    if (!o) {
      e.note = r.error ? "every witness deviates: " + r.why : (cell.Varies() ? r.why : "");
      if (!r.error && cell.basis == collate::Basis::kUndetermined)
        e.note = "no model and no majority: undetermined";
    }
  } else if (!o) {
    e.note = "no witness can be read here";
  }
  for (std::size_t k = 0; k < cell.readings.size(); ++k) {
    if (static_cast<int>(k) == chosen) continue;
    const Reading& r = cell.readings[k];
    e.variants.push_back({r.text, r.sigla, r.kind, r.error});
  }
  return e;
}

const Override* FindOverride(const std::vector<Override>& os, const Sexagesimal& arg,
                             const std::string& column) {
  for (const auto& o : os) {
    auto v = Sexagesimal::Parse(o.row);
    if (v && *v == arg && o.column == column) return &o;
  }
  return nullptr;
}

void CheckOverrides(const collate::Collation& c, const std::vector<Override>& os) {
  for (const auto& o : os) {
    auto v = Sexagesimal::Parse(o.row);
    const bool row_ok =
        v && std::any_of(c.rows.begin(), c.rows.end(), [&](auto& r) { return r.argument == *v; });
    if (!row_ok) {
      throw InputError::ForOption(
          "--override",
          ExpectedFound("the argument of a row of table " + c.table_id, "'" + o.row + "'"));
    }
    const bool col_ok = std::any_of(c.columns.begin(), c.columns.end(),
                                    [&](auto& k) { return k.name == o.column; });
    if (!col_ok) {
      throw InputError::ForOption(
          "--override", ExpectedFound("a column of table " + c.table_id, "'" + o.column + "'"));
    }
  }
}

}  // namespace

Apparatus BuildApparatus(const collate::Collation& c,
                         const std::vector<std::vector<std::string>>& branches_in,
                         const std::vector<Override>& overrides) {
  CheckOverrides(c, overrides);
  std::vector<std::vector<std::string>> branches = branches_in;
  if (branches.empty()) {
    for (const auto& w : c.witnesses) branches.push_back({w.siglum});
  }
  Apparatus a;
  a.table_id = c.table_id;
  a.table_title = c.table_title;
  a.work = c.work;
  a.witnesses = c.witnesses;
  a.argument = c.argument;
  a.columns = c.columns;
  for (const auto& row : c.rows) {
    a.arguments.push_back(row.argument);
    std::vector<ApparatusEntry> entries;
    for (const auto& cell : row.cells) {
      const Override* o = FindOverride(overrides, row.argument, c.columns[cell.column].name);
      entries.push_back(Entry(cell, DefaultLemma(cell, branches), o));
    }
    a.cells.push_back(std::move(entries));
  }
  return a;
}

std::string XmlId(const std::string& siglum) {
  std::string id;
  for (unsigned char ch : siglum) {
    const bool ok = std::isalnum(ch) || ch == '-' || ch == '_' || ch == '.';
    id += ok ? static_cast<char>(ch) : '_';
  }
  if (id.empty() || std::isdigit(static_cast<unsigned char>(id[0])) || id[0] == '-' || id[0] == '.')
    id = "w" + id;
  return id;
}

}  // namespace apograph::publish
