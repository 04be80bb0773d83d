#include "lineage/stemma.hpp"

#include <algorithm>
#include <cmath>
#include <functional>
#include <set>
#include <sstream>

namespace apograph::lineage {

int Stemma::Add(StemmaNode node) {
  nodes.push_back(std::move(node));
  return static_cast<int>(nodes.size()) - 1;
}

void Stemma::Attach(int parent, int child) {
  nodes[child].parent = parent;
  nodes[parent].children.push_back(child);
}

Group Stemma::Below(int node) const {
  Group g;
  std::function<void(int)> walk = [&](int n) {
    if (nodes[n].witness) g.push_back(nodes[n].name);
    for (int c : nodes[n].children) walk(c);
  };
  walk(node);
  std::sort(g.begin(), g.end());
  return g;
}

std::vector<std::pair<Group, int>> Stemma::Groups() const {
  std::vector<std::pair<Group, int>> out;
  if (root < 0) return out;
  const std::size_t all = Below(root).size();
  std::set<Group> seen;
  std::function<void(int)> walk = [&](int n) {
    if (n != root) {
      Group g = Below(n);
      if (g.size() >= 2 && g.size() < all && seen.insert(g).second) out.emplace_back(g, n);
    }
    for (int c : nodes[n].children) walk(c);
  };
  walk(root);
  return out;
}

void Stemma::Compact() {
  std::vector<int> keep(nodes.size(), -1);
  std::vector<StemmaNode> out;
  std::function<void(int)> walk = [&](int n) {
    keep[n] = static_cast<int>(out.size());
    out.push_back(nodes[n]);
    for (int c : nodes[n].children) walk(c);
  };
  walk(root);
  for (auto& n : out) {
    if (n.parent >= 0) n.parent = keep[n.parent];
    for (int& c : n.children) c = keep[c];
  }
  out[0].parent = -1;
  nodes = std::move(out);
  root = 0;
}

GroupComparison CompareGroups(const std::vector<Group>& truth, const std::vector<Group>& found) {
  std::set<Group> t(truth.begin(), truth.end()), f(found.begin(), found.end());
  GroupComparison c;
  c.truth_groups = static_cast<int>(t.size());
  for (const auto& g : t) {
    if (f.count(g))
      ++c.recovered;
    else
      ++c.distance;
  }
  for (const auto& g : f) c.distance += t.count(g) ? 0 : 1;
  return c;
}

namespace {

std::string Number(double x) {
  std::ostringstream o;
  o << std::round(x * 100) / 100;
  return o.str();
}

std::string NewickName(const std::string& name) {
  if (name.find_first_of(" ():;,[]'") == std::string::npos) return name;
  std::string q = "'";
  for (char ch : name) q += ch == '\'' ? std::string("''") : std::string(1, ch);
  return q + "'";
}

// A witness standing at an inner node (a surviving exemplar) is written as
// a leaf of length 0 beside its copies, so that every witness is a leaf.
void WriteNewick(const Stemma& s, int n, std::ostringstream& o) {
  const auto& node = s.nodes[n];
  const bool inner_witness = node.witness && !node.children.empty();
  if (!node.children.empty()) {
    o << "(";
    for (std::size_t i = 0; i < node.children.size(); ++i) {
      if (i) o << ",";
      WriteNewick(s, node.children[i], o);
    }
    if (inner_witness) o << "," << NewickName(node.name) << ":0";
    o << ")";
  }
  if (!node.name.empty() && !inner_witness)
    o << NewickName(node.name);
  else if (node.support)
    o << std::lround(*node.support * 100);
  if (n != s.root) o << ":" << Number(node.length);
}

std::string DotId(int n) { return "n" + std::to_string(n); }

std::string DotEscape(const std::string& t) {
  std::string o;
  for (char ch : t) o += (ch == '"' || ch == '\\') ? std::string("\\") + ch : std::string(1, ch);
  return o;
}

// Nodes reachable from the root, parents first.
std::vector<int> Preorder(const Stemma& s) {
  std::vector<int> out, stack;
  if (s.root >= 0) stack.push_back(s.root);
  while (!stack.empty()) {
    const int n = stack.back();
    stack.pop_back();
    out.push_back(n);
    for (auto it = s.nodes[n].children.rbegin(); it != s.nodes[n].children.rend(); ++it)
      stack.push_back(*it);
  }
  return out;
}

}  // namespace

std::vector<std::string> NodeLabels(const Stemma& s) {
  // Editors name lost copies with Greek letters, the archetype omega.
  static const char* const kGreek[] = {"α", "β", "γ", "δ", "ε", "ζ", "η", "θ", "ι", "κ", "λ", "μ",
                                       "ν", "ξ", "ο", "π", "ρ", "σ", "τ", "υ", "φ", "χ", "ψ"};
  constexpr int kLetters = sizeof kGreek / sizeof kGreek[0];
  std::vector<std::string> out(s.nodes.size());
  int next = 0;
  for (int n : Preorder(s)) {
    const auto& node = s.nodes[n];
    if (node.witness) {
      out[n] = node.name;
    } else if (n == s.root) {
      out[n] = "ω";
    } else {
      out[n] = kGreek[next % kLetters];
      if (next >= kLetters) out[n] += std::to_string(next / kLetters + 1);
      ++next;
    }
  }
  return out;
}

std::string ToNewick(const Stemma& s) {
  std::ostringstream o;
  if (s.root >= 0) WriteNewick(s, s.root, o);
  o << ";";
  return o.str();
}

std::string ToDot(const Stemma& s, const std::string& title, const std::vector<DashedEdge>& extra) {
  const auto labels = NodeLabels(s);
  std::ostringstream o;
  o << "digraph stemma {\n  label=\"" << DotEscape(title) << "\";\n  labelloc=t;\n"
    << "  node [fontname=\"serif\"];\n  edge [arrowhead=none, fontsize=10];\n";
  for (int n : Preorder(s)) {
    const auto& node = s.nodes[n];
    if (node.witness) {
      o << "  " << DotId(n) << " [label=\"" << DotEscape(node.name) << "\", shape=box];\n";
    } else {
      const std::string label = n == s.root ? labels[n] + " (archetype)" : labels[n];
      o << "  " << DotId(n) << " [label=\"" << DotEscape(label)
        << "\", shape=plaintext, fontname=\"serif italic\"];\n";
    }
  }
  for (int n : Preorder(s)) {
    const auto& node = s.nodes[n];
    if (node.parent < 0) continue;
    std::string label = Number(node.length);
    if (node.support) label += " (" + std::to_string(std::lround(*node.support * 100)) + "%)";
    o << "  " << DotId(node.parent) << " -> " << DotId(n) << " [label=\"" << label << "\"];\n";
  }
  for (const auto& e : extra) {
    if (e.from < 0 || e.to < 0) continue;
    o << "  " << DotId(e.from) << " -> " << DotId(e.to)
      << " [style=dashed, constraint=false, label=\"" << DotEscape(e.label) << "\"];\n";
  }
  o << "}\n";
  return o.str();
}

namespace {

void WriteText(const Stemma& s, const std::vector<std::string>& labels, int n,
               const std::string& prefix, bool last, bool top, std::ostringstream& o) {
  const auto& node = s.nodes[n];
  std::string name = node.witness ? node.name : labels[n] + " (lost)";
  if (top && !node.witness) name = kArchetype;
  o << prefix << (top ? "" : (last ? "`-- " : "|-- ")) << name;
  if (!top) o << "  [" << Number(node.length) << "]";
  if (node.support) o << "  support " << std::lround(*node.support * 100) << "%";
  o << "\n";
  const std::string next = top ? "" : prefix + (last ? "    " : "|   ");
  for (std::size_t i = 0; i < node.children.size(); ++i) {
    WriteText(s, labels, node.children[i], next, i + 1 == node.children.size(), false, o);
  }
}

}  // namespace

std::string ToText(const Stemma& s) {
  std::ostringstream o;
  if (s.root >= 0) WriteText(s, NodeLabels(s), s.root, "", true, true, o);
  return o.str();
}

int FindWitness(const Stemma& s, const std::string& siglum) {
  for (std::size_t n = 0; n < s.nodes.size(); ++n) {
    if (s.nodes[n].witness && s.nodes[n].name == siglum) return static_cast<int>(n);
  }
  return -1;
}

}  // namespace apograph::lineage
