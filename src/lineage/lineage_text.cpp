#include "lineage/lineage_text.hpp"

#include <cmath>
#include <sstream>

namespace apograph::lineage {
namespace {

std::string Number(double x) {
  std::ostringstream o;
  o << std::round(x * 100) / 100;
  return o.str();
}

const char* MethodName(Method m) {
  return m == Method::kParsimony ? "maximum parsimony" : "neighbour joining";
}

std::string GroupLine(const GroupInfo& g) {
  std::ostringstream o;
  o << "{";
  for (std::size_t k = 0; k < g.witnesses.size(); ++k) o << (k ? " " : "") << g.witnesses[k];
  o << "}  " << g.characters << (g.characters == 1 ? " character" : " characters")
    << " on its branch (weight " << Number(g.length) << ")";
  if (g.conflicting)
    o << ", " << g.conflicting << " against (weight " << Number(g.conflict_weight) << ")";
  if (g.support) o << ", bootstrap support " << std::lround(*g.support * 100) << "%";
  return o.str();
}

void Counts(const LineageReport& r, std::ostringstream& out) {
  out << r.witnesses.size() << " witnesses, " << r.characters << " characters";
  if (r.undetermined_cells)
    out << " (" << r.undetermined_cells << " cells where no model or majority tells the "
        << "archetype's reading: they group witnesses but do not root the tree)";
  out << ". Shared errors are evidence of common descent; shared right readings are not.\n";
  out << "Root: ";
  if (r.root.Basis() == "model")
    out << "placed by the readings the model calls wrong";
  else if (r.root.Basis() == "majority")
    out << "placed by the majority's readings (no model)";
  else
    out << "undecided; the tree is rooted at its midpoint";
  out << ".\n";
}

void OneMethod(const MethodResult& res, const DescribeOptions& o, std::ostringstream& out) {
  out << "\nBy " << MethodName(res.method);
  if (res.parsimony) {
    out << " (" << res.parsimony->search << (res.parsimony->exact ? ", exact" : "") << "; length "
        << Number(res.parsimony->length) << ")";
  }
  out << ":\n"
      << (o.markdown ? "\n```\n" : "") << ToText(res.stemma) << (o.markdown ? "```\n" : "");
  for (const auto& g : res.groups) out << "- group " << GroupLine(g) << "\n";
  if (res.groups.empty()) out << "- no group supported\n";
  out << "- Newick: " << (o.markdown ? "`" : "") << ToNewick(res.stemma) << (o.markdown ? "`" : "")
      << "\n";
}

}  // namespace

std::string DescribeLineage(const LineageReport& r, const DescribeOptions& o) {
  std::ostringstream out;
  if (r.results.empty() || r.witnesses.size() < 2) {
    out << "No stemma: fewer than two witnesses.\n";
    return out.str();
  }
  Counts(r, out);
  for (const auto& res : r.results) OneMethod(res, o, out);
  out << "\n";
  for (const auto& c : r.copies) {
    if (!c.twins) out << "- copy? " << c.text << "\n";
  }
  for (const auto& c : r.contamination) {
    out << "- contamination? " << c.text;
    if (!c.inherited_by.empty()) {
      out << "; handed down to";
      for (const auto& w : c.inherited_by) out << " " << w;
    }
    out << ". Drawn under " << c.primary << "'s line, dashed from " << c.secondary << "\n";
  }
  for (const auto& c : r.corrections) out << "- correction? " << c.text << "\n";
  if (r.copies.empty() && r.contamination.empty())
    out << "- no direct copy and no contamination found\n";
  for (const auto& u : r.undecided) out << "- undecided (" << u.what << "): " << u.text << "\n";
  return out.str();
}

std::string StemmaTitle(const LineageReport& r, std::size_t result) {
  std::string title = r.title.empty() ? "Stemma" : r.title + ": stemma";
  if (result < r.results.size())
    title += std::string(" by ") + MethodName(r.results[result].method);
  return title;
}

std::string ToDot(const LineageReport& r, std::size_t result) {
  if (result >= r.results.size()) return ToDot(Stemma{}, StemmaTitle(r, result));
  const Stemma& s = r.results[result].stemma;
  std::vector<DashedEdge> extra;
  for (const auto& c : r.contamination) {
    extra.push_back({FindWitness(s, c.secondary), FindWitness(s, c.witness), "second exemplar"});
  }
  return ToDot(s, StemmaTitle(r, result), extra);
}

}  // namespace apograph::lineage
