#include "publish/svg_stemma.hpp"

#include <cctype>
#include <cmath>
#include <cstdio>
#include <map>
#include <sstream>

#include "lineage/stemma.hpp"
#include "publish/svg_plot.hpp"

namespace apograph::publish {
namespace {

constexpr double kColumn = 70, kLevel = 64, kMargin = 30;

struct Layout {
  std::vector<double> x, y;
  int leaves = 0, depth = 0;
};

/// Leaves left to right in preorder; an inner node above the middle of
/// its children.
double Place(const lineage::Stemma& s, int node, int depth, Layout& l) {
  l.depth = std::max(l.depth, depth);
  l.y[node] = kMargin + depth * kLevel;
  const auto& n = s.nodes[node];
  if (n.children.empty()) return l.x[node] = kMargin + kColumn * l.leaves++;
  double sum = 0;
  for (int c : n.children) sum += Place(s, c, depth + 1, l);
  return l.x[node] = sum / n.children.size();
}

std::string Num(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f", v);
  return buf;
}

void Edge(const lineage::Stemma& s, const Layout& l, int c, std::ostream& out) {
  const auto& n = s.nodes[c];
  const int p = n.parent;
  out << "<line class=\"branch\" x1=\"" << Num(l.x[p]) << "\" y1=\"" << Num(l.y[p]) << "\" x2=\""
      << Num(l.x[c]) << "\" y2=\"" << Num(l.y[c]) << "\"/>";
  if (n.support && !n.witness) {
    out << "<text class=\"support\" x=\"" << Num((l.x[p] + l.x[c]) / 2 + 4) << "\" y=\""
        << Num((l.y[p] + l.y[c]) / 2) << "\">" << std::lround(*n.support * 100) << "%</text>";
  }
}

void Node(const lineage::Stemma& s, const Layout& l, int i, std::ostream& out) {
  const auto& n = s.nodes[i];
  const std::string x = Num(l.x[i]), y = Num(l.y[i]);
  if (n.witness || n.name == lineage::kArchetype) {
    const double w = 12 + 8.0 * n.name.size();
    out << "<rect class=\"" << (n.witness ? "wit" : "arch") << "\" x=\"" << Num(l.x[i] - w / 2)
        << "\" y=\"" << Num(l.y[i] - 11) << "\" width=\"" << Num(w)
        << "\" height=\"22\" rx=\"3\"/><text class=\"sig\" x=\"" << x << "\" y=\""
        << Num(l.y[i] + 4) << "\" text-anchor=\"middle\">" << EscapeXml(n.name) << "</text>";
  } else {
    out << "<circle class=\"lost\" cx=\"" << x << "\" cy=\"" << y << "\" r=\"4\"/>";
  }
}

/// Dashed arrows from each relative to the contaminated witness.
void Contamination(const lineage::LineageReport& r, const lineage::Stemma& s, const Layout& l,
                   const std::string& marker, std::ostream& out) {
  std::map<std::string, int> at;
  for (std::size_t i = 0; i < s.nodes.size(); ++i)
    if (s.nodes[i].witness) at[s.nodes[i].name] = static_cast<int>(i);
  for (const auto& c : r.contamination) {
    for (const auto& seg : c.segments) {
      if (!at.count(seg.relative) || !at.count(c.witness)) continue;
      const int a = at[seg.relative], b = at[c.witness];
      out << "<path class=\"contam\" marker-end=\"url(#" << marker << ")\" d=\"M" << Num(l.x[a])
          << " " << Num(l.y[a] + 11) << " Q" << Num((l.x[a] + l.x[b]) / 2) << " "
          << Num(std::max(l.y[a], l.y[b]) + 40) << " " << Num(l.x[b]) << " " << Num(l.y[b] + 11)
          << "\"><title>" << EscapeXml(c.text) << "</title></path>";
    }
  }
}

}  // namespace

std::string StemmaSvg(const lineage::LineageReport& report, const std::string& id) {
  if (report.results.empty() || report.results.front().stemma.root < 0) return "";
  const auto& s = report.results.front().stemma;
  Layout l;
  l.x.assign(s.nodes.size(), 0);
  l.y.assign(s.nodes.size(), 0);
  Place(s, s.root, 0, l);
  std::string marker = "arrow-";
  for (char c : id) marker += std::isalnum(static_cast<unsigned char>(c)) ? c : '-';
  const double w = 2 * kMargin + kColumn * std::max(0, l.leaves - 1);
  const double h = 2 * kMargin + kLevel * l.depth + 40;
  std::ostringstream out;
  out << "<svg class=\"stemma\" xmlns=\"http://www.w3.org/2000/svg\" viewBox=\"0 0 " << Num(w)
      << " " << Num(h) << "\" width=\"" << Num(w) << "\" height=\"" << Num(h)
      << "\" role=\"img\"><title>stemma</title><defs><marker id=\"" << marker
      << "\" viewBox=\"0 0 8 8\" "
         "refX=\"7\" refY=\"4\" markerWidth=\"7\" markerHeight=\"7\" orient=\"auto\"><path "
         "d=\"M0 0L8 4L0 8z\"/></marker></defs>";
  for (std::size_t i = 0; i < s.nodes.size(); ++i)
    if (s.nodes[i].parent >= 0) Edge(s, l, static_cast<int>(i), out);
  Contamination(report, s, l, marker, out);
  for (std::size_t i = 0; i < s.nodes.size(); ++i) Node(s, l, static_cast<int>(i), out);
  out << "</svg>";
  return out.str();
}

}  // namespace apograph::publish
