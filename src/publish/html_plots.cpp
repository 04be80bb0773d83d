#include "publish/html_plots.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <map>
#include <utility>

#include "model/check.hpp"

namespace apograph::publish {
namespace {

/// Beyond this many witnesses one plot holds too many lines to follow:
/// small multiples instead (judgement).
constexpr std::size_t kOverlaidTraces = 4;

/// (transcription row) -> mark, for one witness's column.
std::map<std::size_t, PointKind> MarksOf(const pipeline::WitnessFindings* w,
                                         const std::string& column) {
  std::map<std::size_t, PointKind> marks;
  if (!w) return marks;
  for (const auto& f : w->findings) {
    if (f.column_name != column) continue;
    for (const auto& c : f.cells) marks[c.row] = KindOf(f.best().cls);
  }
  return marks;
}

PlotPoint PointOf(const pipeline::TableAnalysis& a, const std::string& siglum, int column,
                  const model::CheckEntry& e, const std::map<std::size_t, PointKind>& marks) {
  PlotPoint p;
  p.x = *e.arg_value;
  p.y = *e.diff_units;
  const auto m = marks.find(e.row);
  p.kind = m != marks.end() ? m->second : e.flag ? PointKind::kFlagged : PointKind::kAgrees;
  const int row = AlignedRow(a, siglum, static_cast<int>(e.row));
  if (row >= 0) p.link = "#" + CellAnchor(a.table_id, row, column);
  p.title = siglum + " " + e.arg + ": " + e.tabulated_raw +
            (e.computed ? ", model " + e.computed->ToString() : "");
  return p;
}

PlotTrace TraceOf(const pipeline::TableAnalysis& a, const pipeline::ColumnReference& ref,
                  const Transcription& t, int style) {
  PlotTrace trace{t.witness.siglum, style, {}};
  const int column = t.ColumnIndex(ref.column_name);
  if (column < 0 || !ref.model) return trace;
  const auto check = model::Check(t, *ref.model, ref.params, ref.practice, 1, column);
  const auto marks = MarksOf(a.FindingsOf(t.witness.siglum), ref.column_name);
  const int shown_column = CollationColumn(a, ref.column_name);
  for (const auto& e : check.entries) {
    if (!e.arg_value || !e.diff_units || !std::isfinite(*e.diff_units)) continue;
    trace.points.push_back(PointOf(a, t.witness.siglum, shown_column, e, marks));
  }
  return trace;
}

double Worst(const std::vector<PlotTrace>& traces) {
  double worst = 0;
  for (const auto& t : traces)
    for (const auto& p : t.points) worst = std::max(worst, std::fabs(p.y));
  return worst;
}

}  // namespace

std::string CellAnchor(const std::string& table_id, int row, int column) {
  std::string id = "cell-";
  for (char c : table_id) id += std::isalnum(static_cast<unsigned char>(c)) ? c : '-';
  return id + "-" + std::to_string(row) + "-" + std::to_string(column);
}

int CollationColumn(const pipeline::TableAnalysis& a, const std::string& name) {
  for (std::size_t c = 0; c < a.collation.columns.size(); ++c)
    if (a.collation.columns[c].name == name) return static_cast<int>(c);
  return -1;
}

int AlignedRow(const pipeline::TableAnalysis& a, const std::string& siglum, int source_row) {
  const int w = a.collation.WitnessIndex(siglum);
  if (w < 0) return -1;
  for (std::size_t r = 0; r < a.collation.rows.size(); ++r)
    if (a.collation.rows[r].source_row[static_cast<std::size_t>(w)] == source_row)
      return static_cast<int>(r);
  return -1;
}

PointKind KindOf(deviation::SlipClass cls) {
  switch (cls) {
    case deviation::SlipClass::kComputational:
      return PointKind::kDeparture;
    case deviation::SlipClass::kDisplacedRun:
      return PointKind::kDisplaced;
    case deviation::SlipClass::kUnexplained:
      return PointKind::kFlagged;
    default:
      return PointKind::kSlip;
  }
}

std::vector<PlotTrace> ColumnTraces(const pipeline::TableAnalysis& a,
                                    const pipeline::ColumnReference& ref) {
  std::vector<PlotTrace> traces;
  for (std::size_t i = 0; i < a.transcriptions.size(); ++i) {
    auto t = TraceOf(a, ref, a.transcriptions[i], static_cast<int>(i));
    if (!t.points.empty()) traces.push_back(std::move(t));
  }
  return traces;
}

std::vector<double> GridNodes(const pipeline::ColumnReference& ref,
                              const std::vector<PlotTrace>& traces) {
  const double g = ref.practice.grid;
  std::vector<double> nodes;
  double lo = INFINITY, hi = -INFINITY;
  for (const auto& t : traces)
    for (const auto& p : t.points) lo = std::min(lo, p.x), hi = std::max(hi, p.x);
  if (!(g > 0) || !std::isfinite(lo)) return nodes;
  const double origin = ref.practice.grid_origin;
  for (double k = std::ceil((lo - origin) / g - 1e-9); origin + k * g <= hi + 1e-9; ++k)
    nodes.push_back(origin + k * g);
  return nodes;
}

std::string ColumnPlots(const pipeline::TableAnalysis& a, const pipeline::ColumnReference& ref) {
  const auto traces = ColumnTraces(a, ref);
  if (traces.empty()) return "<p>No entry of this column could be recomputed.</p>";
  const auto nodes = GridNodes(ref, traces);
  std::string html = "<figure class=\"plots\"><div class=\"panels\">";
  if (traces.size() <= kOverlaidTraces) {
    html += PlotSvg({ref.column_name, "argument", traces, nodes, 720, 240, 0});
  } else {
    const double worst = Worst(traces);
    for (const auto& t : traces)
      html += PlotSvg(
          {ref.column_name + ", witness " + t.label, "argument", {t}, nodes, 720, 130, worst});
  }
  html += "</div><div class=\"key\">" + LegendSvg(traces, !nodes.empty()) + "</div>";
  return html + "<figcaption>" + ref.column_name +
         ": tabulated minus computed, in units of the last place, along the argument. Click a "
         "mark to see the cell.</figcaption></figure>";
}

}  // namespace apograph::publish
