// The true tree as Newick and the groups of surviving witnesses, with how
// many surviving errors mark each group.
#include <algorithm>
#include <map>
#include <set>

#include "tradition.hpp"

namespace apograph::synth {
namespace {

std::vector<std::vector<int>> Children(const Tradition& t) {
  std::vector<std::vector<int>> out(t.nodes.size());
  for (std::size_t i = 1; i < t.nodes.size(); ++i) {
    out[static_cast<std::size_t>(t.nodes[i].parent)].push_back(static_cast<int>(i));
  }
  for (auto& kids : out) {
    std::sort(kids.begin(), kids.end(), [&](int a, int b) {
      return t.nodes[static_cast<std::size_t>(a)].name < t.nodes[static_cast<std::size_t>(b)].name;
    });
  }
  return out;
}

std::string Write(const Tradition& t, const std::vector<std::vector<int>>& kids, int i,
                  bool leaves) {
  const Node& n = t.nodes[static_cast<std::size_t>(i)];
  const std::string length = i == 0 ? "" : ":" + std::to_string(n.slips.size());
  const auto& k = kids[static_cast<std::size_t>(i)];
  if (k.empty()) return n.name + length;
  std::string inner = leaves && n.surviving ? n.name + ":0" : "";
  for (int c : k) inner += (inner.empty() ? "" : ",") + Write(t, kids, c, leaves);
  return "(" + inner + ")" + (leaves && n.surviving ? "" : n.name) + length;
}

void Descendants(const std::vector<std::vector<int>>& kids, const Tradition& t, int i,
                 std::set<std::string>& out) {
  if (t.nodes[static_cast<std::size_t>(i)].surviving)
    out.insert(t.nodes[static_cast<std::size_t>(i)].name);
  for (int c : kids[static_cast<std::size_t>(i)]) Descendants(kids, t, c, out);
}

// What each surviving witness reads: (table, archetype row, column) -> reading.
using Readings = std::map<std::tuple<std::string, int, std::string>, std::string>;
std::map<std::string, Readings> AllReadings(const Tradition& t) {
  std::map<std::string, Readings> out;
  for (int w : t.Surviving()) {
    const Node& n = t.nodes[static_cast<std::size_t>(w)];
    Readings& r = out[n.name];
    for (const auto& table : n.transcribed) {
      for (std::size_t i = 0; i < table.text.rows.size(); ++i) {
        const Row& row = table.text.rows[i];
        const auto key = [&](const std::string& column) {
          return std::make_tuple(table.text.table_id, table.origin[i], column);
        };
        r.emplace(key(""), "row");
        r.emplace(key("@argument"), row.argument.raw);
        for (std::size_t c = 0; c < row.cells.size(); ++c)
          r.emplace(key(table.text.columns[c].name), row.cells[c].raw);
      }
    }
  }
  return out;
}

// Witnesses that still carry a slip: its reading, or the row's absence.
std::set<std::string> Carriers(const Slip& s, const std::map<std::string, Readings>& readings) {
  std::set<std::string> out;
  const bool omitted = s.slip == SlipClass::kRowOmitted;
  if (s.slip == SlipClass::kRowDuplicated) return out;
  for (const auto& [siglum, r] : readings) {
    const auto it = r.find({s.table, s.origin_row, omitted ? "" : s.column});
    if (omitted ? it == r.end() : (it != r.end() && it->second == s.after)) out.insert(siglum);
  }
  return out;
}

}  // namespace

std::string Newick(const Tradition& t, bool survivors_as_leaves) {
  return Write(t, Children(t), 0, survivors_as_leaves) + ";";
}

std::vector<Group> Groups(const Tradition& t) {
  const auto kids = Children(t);
  const auto readings = AllReadings(t);
  const std::size_t total = readings.size();
  std::map<std::set<std::string>, Group> groups;
  for (std::size_t i = 1; i < t.nodes.size(); ++i) {
    std::set<std::string> members;
    Descendants(kids, t, static_cast<int>(i), members);
    if (members.size() < 2 || members.size() >= total) continue;
    Group& g = groups[members];
    g.node += (g.node.empty() ? "" : "+") + t.nodes[i].name;
    g.witnesses.assign(members.begin(), members.end());
    for (const auto& s : t.nodes[i].slips) {
      const auto carriers = Carriers(s, readings);
      if (carriers == members) ++g.errors_exact;
      if (carriers.size() >= 2 &&
          std::includes(members.begin(), members.end(), carriers.begin(), carriers.end())) {
        ++g.errors_some;
      }
    }
  }
  std::vector<Group> out;
  for (auto& [members, g] : groups) out.push_back(std::move(g));
  return out;
}

}  // namespace apograph::synth

namespace apograph::synth {
namespace {

// The node and every node its text came from (exemplars, second exemplars).
std::vector<int> Sources(const Tradition& t, int node) {
  std::set<int> seen;
  std::vector<int> stack = {node};
  while (!stack.empty()) {
    const int n = stack.back();
    stack.pop_back();
    if (n < 0 || !seen.insert(n).second) continue;
    const Node& x = t.nodes[static_cast<std::size_t>(n)];
    stack.push_back(x.parent);
    if (x.contamination) stack.push_back(x.contamination->second);
  }
  std::vector<int> out(seen.begin(), seen.end());
  std::stable_sort(out.begin(), out.end(), [&](int a, int b) {
    return t.nodes[static_cast<std::size_t>(a)].date.year <
           t.nodes[static_cast<std::size_t>(b)].date.year;
  });
  return out;
}

using Key = std::tuple<std::string, int, std::string>;

std::map<Key, std::string> ReadingsOf(const std::vector<TableText>& text,
                                      std::map<std::pair<std::string, int>, int>* rows) {
  std::map<Key, std::string> out;
  for (const auto& table : text) {
    for (std::size_t i = 0; i < table.text.rows.size(); ++i) {
      const Row& row = table.text.rows[i];
      const std::string& id = table.text.table_id;
      if (rows) ++(*rows)[{id, table.origin[i]}];
      out.emplace(Key{id, table.origin[i], "@argument"}, row.argument.raw);
      for (std::size_t c = 0; c < row.cells.size(); ++c)
        out.emplace(Key{id, table.origin[i], table.text.columns[c].name}, row.cells[c].raw);
    }
  }
  return out;
}

bool Shows(const Slip& s, const std::map<Key, std::string>& mine,
           const std::map<Key, std::string>& author,
           const std::map<std::pair<std::string, int>, int>& rows) {
  const auto count = rows.find({s.table, s.origin_row});
  const int n = count == rows.end() ? 0 : count->second;
  if (s.slip == SlipClass::kRowOmitted) return n == 0;
  if (s.slip == SlipClass::kRowDuplicated) return n >= 2;
  const Key key{s.table, s.origin_row, s.column};
  const auto it = mine.find(key);
  return it != mine.end() && it->second == s.after && it->second != author.at(key);
}

}  // namespace

std::vector<VisibleSlip> VisibleSlips(const Tradition& t, int node) {
  const Node& w = t.nodes[static_cast<std::size_t>(node)];
  std::map<std::pair<std::string, int>, int> rows;
  const auto mine = ReadingsOf(w.surviving ? w.transcribed : w.text, &rows);
  const auto author = ReadingsOf(t.nodes[0].text, nullptr);
  std::map<Key, VisibleSlip> found;  // later slips at a cell replace earlier ones
  for (int n : Sources(t, node)) {
    const Node& x = t.nodes[static_cast<std::size_t>(n)];
    std::vector<const Slip*> slips;
    for (const auto& s : x.slips) slips.push_back(&s);
    if (n == node) {
      for (const auto& s : x.recognition) slips.push_back(&s);
    }
    for (const Slip* s : slips) {
      if (!Shows(*s, mine, author, rows)) continue;
      const std::string column = s->slip == SlipClass::kRowDuplicated ? "+dup" : s->column;
      found[Key{s->table, s->origin_row, column}] = VisibleSlip{*s, x.name};
    }
  }
  std::vector<VisibleSlip> out;
  for (auto& [key, v] : found) out.push_back(std::move(v));
  return out;
}

}  // namespace apograph::synth
