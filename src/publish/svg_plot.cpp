#include "publish/svg_plot.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <sstream>

namespace apograph::publish {
namespace {

// Margins of a plot in pixels: room for tick labels left and below.
constexpr double kLeft = 58, kRight = 12, kTop = 22, kBottom = 34;

std::string Num(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f", v);
  return buf;
}

std::string TickLabel(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g", v);
  return buf;
}

/// The mark of one point centred at (x, y), in the trace's colour where the
/// shape alone already says what it is.
std::string Mark(PointKind kind, double x, double y, const char* colour) {
  const std::string cx = Num(x), cy = Num(y);
  switch (kind) {
    case PointKind::kAgrees:
      return "<circle cx=\"" + cx + "\" cy=\"" + cy + "\" r=\"1.6\" fill=\"" + colour + "\"/>";
    case PointKind::kFlagged:
      return "<path class=\"m-flag\" d=\"M" + Num(x - 4) + " " + Num(y - 4) + "l8 8m0 -8l-8 8\"/>";
    case PointKind::kSlip:
      return "<path class=\"m-slip\" d=\"M" + Num(x) + " " + Num(y - 5) + "l5 8.5h-10z\"/>";
    case PointKind::kDisplaced:
      return "<rect class=\"m-run\" x=\"" + Num(x - 3.5) + "\" y=\"" + Num(y - 3.5) +
             "\" width=\"7\" height=\"7\"/>";
    case PointKind::kDeparture:
      return "<circle class=\"m-author\" cx=\"" + cx + "\" cy=\"" + cy + "\" r=\"4.5\"/>";
  }
  return "";
}

double NiceStep(double range, int ticks) {
  const double raw = range / std::max(1, ticks);
  const double p = std::pow(10, std::floor(std::log10(raw)));
  for (double m : {1.0, 2.0, 5.0}) {
    if (m * p >= raw) return m * p;
  }
  return 10 * p;
}

struct Frame {
  Scale x, y;
  double width, height;
};

Frame FrameOf(const PlotSpec& spec) {
  double x_lo = INFINITY, x_hi = -INFINITY, worst = 0;
  for (const auto& t : spec.traces) {
    for (const auto& p : t.points) {
      x_lo = std::min(x_lo, p.x);
      x_hi = std::max(x_hi, p.x);
      worst = std::max(worst, std::fabs(p.y));
    }
  }
  if (!std::isfinite(x_lo)) x_lo = 0, x_hi = 1;
  worst = std::max(worst, spec.y_extent);
  const double w = spec.width, h = spec.height;
  return {LinearScale(x_lo, x_hi, kLeft, w - kRight), DeviationScale(worst, h - kBottom, kTop), w,
          h};
}

void Axes(const PlotSpec& spec, const Frame& f, std::ostream& out) {
  // Labels closer than a line of text to the previous one are left out
  // (their grid lines stay): 0 is always labelled.
  constexpr double kLabelGap = 10;
  double last = -INFINITY;
  const auto ticks = f.y.Ticks();
  for (double t : ticks) {
    const std::string y = Num(f.y(t));
    out << "<line class=\"" << (t == 0 ? "zero" : "grid") << "\" x1=\"" << kLeft << "\" x2=\""
        << Num(f.width - kRight) << "\" y1=\"" << y << "\" y2=\"" << y << "\"/>";
    const bool near_zero = t != 0 && std::fabs(f.y(t) - f.y(0)) < kLabelGap;
    if (near_zero || std::fabs(f.y(t) - last) < kLabelGap) continue;
    last = f.y(t);
    out << "<text class=\"tick\" x=\"" << kLeft - 4 << "\" y=\"" << Num(f.y(t) + 3)
        << "\" text-anchor=\"end\">" << TickLabel(t) << "</text>";
  }
  for (double t : f.x.Ticks()) {
    out << "<text class=\"tick\" x=\"" << Num(f.x(t)) << "\" y=\"" << Num(f.height - kBottom + 13)
        << "\" text-anchor=\"middle\">" << TickLabel(t) << "</text>";
  }
  out << "<text class=\"axis\" x=\"" << Num(f.width - kRight) << "\" y=\"" << Num(f.height - 4)
      << "\" text-anchor=\"end\">" << EscapeXml(spec.x_label) << "</text>";
  out << "<text class=\"axis\" x=\"4\" y=\"12\">units of the last place"
      << (f.y.symlog ? " (signed log scale)" : "") << "</text>";
  out << "<text class=\"ptitle\" x=\"" << Num(f.width - kRight)
      << "\" y=\"12\" text-anchor=\"end\">" << EscapeXml(spec.title) << "</text>";
}

void Nodes(const PlotSpec& spec, const Frame& f, std::ostream& out) {
  for (double n : spec.nodes) {
    if (n < f.x.lo || n > f.x.hi) continue;
    const std::string x = Num(f.x(n));
    out << "<line class=\"node\" x1=\"" << x << "\" x2=\"" << x << "\" y1=\"" << kTop << "\" y2=\""
        << Num(f.height - kBottom) << "\"/>";
  }
}

void Trace(const PlotTrace& t, const Frame& f, std::ostream& out) {
  const TraceStyle s = StyleOf(t.style);
  out << "<g class=\"trace\" data-witness=\"" << EscapeXml(t.label) << "\"><polyline points=\"";
  for (const auto& p : t.points) out << Num(f.x(p.x)) << "," << Num(f.y(p.y)) << " ";
  out << "\" fill=\"none\" stroke=\"" << s.colour << "\" stroke-width=\"1.2\""
      << (*s.dash ? std::string(" stroke-dasharray=\"") + s.dash + "\"" : "") << "/>";
  for (const auto& p : t.points) {
    const std::string mark = Mark(p.kind, f.x(p.x), f.y(p.y), s.colour);
    const std::string tip = p.title.empty() ? "" : "<title>" + EscapeXml(p.title) + "</title>";
    if (p.link.empty() || p.kind == PointKind::kAgrees) {
      out << (tip.empty() ? mark : "<g>" + tip + mark + "</g>");
    } else {
      out << "<a href=\"" << EscapeXml(p.link) << "\">" << tip << mark << "</a>";
    }
  }
  out << "</g>";
}

}  // namespace

TraceStyle StyleOf(int index) {
  // Dark to light, each with its own dash: the order alternates lightness
  // so neighbouring traces never look alike (judgement).
  static const TraceStyle kStyles[] = {
      {"#1d3557", ""},        {"#d17a22", "6 3"},  {"#5b8e7d", "2 2"}, {"#7a3b69", "9 3 2 3"},
      {"#9aa7b8", "4 2 1 2"}, {"#3d2b1f", "12 4"}, {"#c9a227", "1 3"}, {"#2f6690", "6 2 2 2"},
  };
  constexpr int n = sizeof kStyles / sizeof kStyles[0];
  return kStyles[((index % n) + n) % n];
}

double SymLog(double v) { return std::copysign(std::log10(1 + std::fabs(v)), v); }

double Scale::operator()(double v) const {
  const double a = symlog ? SymLog(lo) : lo, b = symlog ? SymLog(hi) : hi;
  const double t = symlog ? SymLog(v) : v;
  if (b == a) return (px_lo + px_hi) / 2;
  return px_lo + (t - a) / (b - a) * (px_hi - px_lo);
}

std::vector<double> Scale::Ticks() const {
  std::vector<double> ticks;
  if (symlog) {
    // 0, +-1 and at most three more powers of ten a side, evenly spaced.
    const int powers = static_cast<int>(std::lround(std::log10(hi)));
    const int every = std::max(1, (powers + 2) / 3);
    ticks.push_back(0);
    for (int k = 0; k <= powers; k += every) {
      const double p = std::pow(10, k);
      ticks.push_back(p);
      ticks.insert(ticks.begin(), -p);
    }
    return ticks;
  }
  const double step = NiceStep(hi - lo, 5);
  for (double t = std::ceil(lo / step - 1e-9) * step; t <= hi + step * 1e-9; t += step)
    ticks.push_back(std::fabs(t) < step * 1e-9 ? 0 : t);
  return ticks;
}

Scale LinearScale(double lo, double hi, double px_lo, double px_hi) {
  if (hi <= lo) hi = lo + 1;
  const double step = NiceStep(hi - lo, 5);
  return {std::floor(lo / step + 1e-9) * step, std::ceil(hi / step - 1e-9) * step, px_lo, px_hi,
          false};
}

Scale DeviationScale(double worst, double px_lo, double px_hi) {
  // Up to 10 units every unit still reads off a linear axis (judgement).
  constexpr double kLinearUpTo = 10;
  if (worst <= kLinearUpTo) {
    const double m = std::max(2.0, std::ceil(worst));
    return {-m, m, px_lo, px_hi, false};
  }
  const double top = std::pow(10, std::ceil(std::log10(worst) - 1e-12));
  return {-top, top, px_lo, px_hi, true};
}

std::string PlotSvg(const PlotSpec& spec) {
  const Frame f = FrameOf(spec);
  std::ostringstream out;
  out << "<svg class=\"plot\" xmlns=\"http://www.w3.org/2000/svg\" viewBox=\"0 0 " << spec.width
      << " " << spec.height << "\" width=\"" << spec.width << "\" height=\"" << spec.height
      << "\" role=\"img\"><title>" << EscapeXml(spec.title)
      << ": tabulated minus computed along the argument</title>";
  Axes(spec, f, out);
  Nodes(spec, f, out);
  for (const auto& t : spec.traces) Trace(t, f, out);
  out << "</svg>";
  return out.str();
}

std::string LegendSvg(const std::vector<PlotTrace>& traces, bool nodes) {
  struct Item {
    PointKind kind;
    const char* text;
  };
  static const Item kMarks[] = {
      {PointKind::kAgrees, "within one unit of the model"},
      {PointKind::kSlip, "copyist's slip"},
      {PointKind::kDisplaced, "displaced run (slid by rows)"},
      {PointKind::kDeparture, "the author's own departure"},
      {PointKind::kFlagged, "flagged, unexplained"},
  };
  const int rows = static_cast<int>(traces.size() + std::size(kMarks)) + (nodes ? 1 : 0);
  std::ostringstream out;
  out << "<svg class=\"legend\" xmlns=\"http://www.w3.org/2000/svg\" width=\"250\" height=\""
      << rows * 18 + 6 << "\" role=\"img\"><title>legend</title>";
  int y = 14;
  for (const auto& t : traces) {
    const TraceStyle s = StyleOf(t.style);
    out << "<line x1=\"4\" x2=\"34\" y1=\"" << y - 4 << "\" y2=\"" << y - 4 << "\" stroke=\""
        << s.colour << "\" stroke-width=\"2\""
        << (*s.dash ? std::string(" stroke-dasharray=\"") + s.dash + "\"" : "")
        << "/><text x=\"42\" y=\"" << y << "\">witness " << EscapeXml(t.label) << "</text>";
    y += 18;
  }
  for (const auto& m : kMarks) {
    out << Mark(m.kind, 19, y - 4, "#333") << "<text x=\"42\" y=\"" << y << "\">" << m.text
        << "</text>";
    y += 18;
  }
  if (nodes) {
    out << "<line class=\"node\" x1=\"19\" x2=\"19\" y1=\"" << y - 13 << "\" y2=\"" << y + 2
        << "\"/><text x=\"42\" y=\"" << y << "\">interpolation grid node</text>";
  }
  out << "</svg>";
  return out.str();
}

std::string EscapeXml(std::string_view text) {
  std::string out;
  out.reserve(text.size());
  for (char c : text) {
    switch (c) {
      case '&':
        out += "&amp;";
        break;
      case '<':
        out += "&lt;";
        break;
      case '>':
        out += "&gt;";
        break;
      case '"':
        out += "&quot;";
        break;
      case '\'':
        out += "&#39;";
        break;
      default:
        out += c;
    }
  }
  return out;
}

}  // namespace apograph::publish
