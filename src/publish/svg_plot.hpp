#pragma once
/// Plots of a column's deviations along the argument, written as inline SVG
/// by the project itself (no plotting service, no script): tabulated minus
/// computed in units of the last place, one trace per witness, every entry
/// marked by what it is (agrees, a copyist's slip, a displaced run, the
/// author's departure, an unexplained flag), and the nodes of an
/// interpolation grid as thin vertical lines.
///
/// Traces differ by colour AND dash pattern, marks by shape AND fill, so
/// that a plot reads in greyscale and by colour-blind readers; LegendSvg
/// explains both.
///
///     publish::PlotSpec p;
///     p.title = "equation";
///     p.traces.push_back({"A", {{0, 0}, {6, 3, publish::PointKind::kSlip}}});
///     std::string svg = publish::PlotSvg(p);

#include <string>
#include <string_view>
#include <vector>

namespace apograph::publish {

/// What an entry is, as its mark shows.
enum class PointKind {
  kAgrees,     ///< within one unit of the model: a small dot
  kFlagged,    ///< beyond one unit, no explanation: a cross
  kSlip,       ///< a copyist's slip: a filled triangle
  kDisplaced,  ///< part of a displaced run: a filled square
  kDeparture,  ///< the author's own departure: a hollow circle
};

struct PlotPoint {
  double x = 0;  ///< the argument
  double y = 0;  ///< tabulated - computed, units of the last place
  PointKind kind = PointKind::kAgrees;
  std::string link;   ///< "#cell-..." for the cell view; empty: none
  std::string title;  ///< tooltip ("A 12: 0;14 read 0;44")
};

struct PlotTrace {
  std::string label;  ///< the witness's siglum
  int style = 0;      ///< index into the trace styles (stable per witness)
  std::vector<PlotPoint> points;
};

struct PlotSpec {
  std::string title;
  std::string x_label = "argument";
  std::vector<PlotTrace> traces;
  std::vector<double> nodes;  ///< interpolation grid nodes (arguments)
  int width = 720;
  int height = 220;
  /// The largest deviation the vertical scale must hold (a common scale
  /// for small multiples); 0: the largest of the points.
  double y_extent = 0;
};

/// The colour and dash pattern of trace `index` (cycled): colours chosen
/// to differ in lightness, so dash and lightness still tell traces apart
/// in greyscale (judgement).
struct TraceStyle {
  const char* colour;
  const char* dash;  ///< SVG stroke-dasharray; "" for a solid line
};
TraceStyle StyleOf(int index);

/// A map from data to pixels: linear, or signed logarithmic
/// (sign(v) log10(1 + |v|)) when the deviations span many orders of
/// magnitude, so that a slip of 200000 units and one of 2 both show.
struct Scale {
  double lo = 0, hi = 1;        ///< data domain (for symlog: in data units)
  double px_lo = 0, px_hi = 1;  ///< pixels of lo and hi
  bool symlog = false;
  double operator()(double v) const;
  /// Tick values (data units) inside the domain.
  std::vector<double> Ticks() const;
};

/// sign(v) * log10(1 + |v|).
double SymLog(double v);
/// A linear scale over [lo, hi] widened to round tick steps (1, 2, 5 x 10^k).
Scale LinearScale(double lo, double hi, double px_lo, double px_hi);
/// The vertical scale for deviations up to `worst` units (absolute):
/// linear, at least +-2, up to 10 units; symmetric log beyond.
Scale DeviationScale(double worst, double px_lo, double px_hi);

/// One plot as an <svg> element (with a <title> for screen readers).
std::string PlotSvg(const PlotSpec& spec);

/// The legend: every trace's label with its line, and every mark with its
/// meaning (and the grid node line when `nodes` is set).
std::string LegendSvg(const std::vector<PlotTrace>& traces, bool nodes);

/// Escapes &, <, >, " and ' for XML and HTML text and attributes.
std::string EscapeXml(std::string_view text);

}  // namespace apograph::publish
