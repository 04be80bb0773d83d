// The SVG plot writer: scales, marks, legend, and what the HTML report
// draws from an analysis.
#include "publish/svg_plot.hpp"

#include <doctest/doctest.h>

#include <algorithm>
#include <string>

namespace apograph::publish {
namespace {

int Count(const std::string& text, const std::string& what) {
  int n = 0;
  for (std::size_t at = text.find(what); at != std::string::npos; at = text.find(what, at + 1)) ++n;
  return n;
}

PlotSpec Spec() {
  PlotSpec p;
  p.title = "equation";
  PlotTrace a{"A", 0, {{0, 0}, {6, 1}, {12, 3, PointKind::kSlip, "#cell-t-2-0", "A 12"}}};
  PlotTrace b{"B", 1, {{0, 0}, {6, -1, PointKind::kDeparture}, {12, 0}}};
  p.traces = {a, b};
  return p;
}

}  // namespace

TEST_CASE("linear scale maps its ends to the pixel ends and widens to round ticks") {
  const Scale s = LinearScale(3, 97, 50, 650);
  CHECK(s.lo == 0);
  CHECK(s.hi == 100);
  CHECK(s(0) == doctest::Approx(50));
  CHECK(s(100) == doctest::Approx(650));
  CHECK(s(50) == doctest::Approx(350));
  const auto ticks = s.Ticks();
  CHECK(ticks == std::vector<double>{0, 20, 40, 60, 80, 100});
}

TEST_CASE("deviation scale: linear up to 10 units, signed log beyond, zero in the middle") {
  const Scale small = DeviationScale(3, 200, 20);
  CHECK_FALSE(small.symlog);
  CHECK(small.lo == -3);
  CHECK(small.hi == 3);
  CHECK(small(0) == doctest::Approx(110));
  const Scale tiny = DeviationScale(0, 200, 20);
  CHECK(tiny.hi == 2);  // at least +-2 so that a unit shows

  const Scale big = DeviationScale(212900, 200, 20);
  CHECK(big.symlog);
  CHECK(big.hi == doctest::Approx(1e6));
  CHECK(big(0) == doctest::Approx(110));
  CHECK(big(1e6) == doctest::Approx(20));
  CHECK(big(-1e6) == doctest::Approx(200));
  // A slip of 2 units is still visibly off the axis next to one of 200000.
  CHECK(big(0) - big(2) > 6);
  CHECK(big(5) - big(0) == doctest::Approx(big(0) - big(-5)));
  const auto ticks = big.Ticks();
  CHECK(std::count(ticks.begin(), ticks.end(), 0.0) == 1);
  CHECK(std::find(ticks.begin(), ticks.end(), 1.0) != ticks.end());
  CHECK(std::find(ticks.begin(), ticks.end(), -1.0) != ticks.end());
  CHECK(ticks.size() <= 9);
  CHECK(SymLog(-9) == doctest::Approx(-1));
}

TEST_CASE("plot: one polyline per witness, each mark by its kind, links to cells") {
  const std::string svg = PlotSvg(Spec());
  CHECK(svg.rfind("<svg", 0) == 0);
  CHECK(Count(svg, "<polyline") == 2);
  CHECK(Count(svg, "class=\"m-slip\"") == 1);
  CHECK(Count(svg, "class=\"m-author\"") == 1);
  CHECK(Count(svg, "class=\"m-flag\"") == 0);
  CHECK(svg.find("<a href=\"#cell-t-2-0\"><title>A 12</title>") != std::string::npos);
  CHECK(svg.find("data-witness=\"B\"") != std::string::npos);
  // Traces differ by dash as well as colour (greyscale).
  CHECK(svg.find(std::string("stroke-dasharray=\"") + StyleOf(1).dash) != std::string::npos);
  CHECK(svg.find("signed log") == std::string::npos);
}

TEST_CASE("plot: grid nodes inside the range are drawn, those outside are not") {
  PlotSpec p = Spec();
  p.nodes = {0, 6, 12, 18};
  CHECK(Count(PlotSvg(p), "class=\"node\"") == 3);
}

TEST_CASE("plot escapes labels and titles") {
  PlotSpec p = Spec();
  p.title = "a<b & \"c\"";
  const std::string svg = PlotSvg(p);
  CHECK(svg.find("a&lt;b &amp; &quot;c&quot;") != std::string::npos);
  CHECK(svg.find("a<b") == std::string::npos);
}

TEST_CASE("legend names every witness and every mark, and the grid only when there is one") {
  const auto traces = Spec().traces;
  const std::string with = LegendSvg(traces, true), without = LegendSvg(traces, false);
  for (const char* text : {"witness A", "witness B", "copyist's slip", "displaced run",
                           "the author's own departure", "flagged, unexplained"})
    CHECK(with.find(text) != std::string::npos);
  CHECK(with.find("interpolation grid") != std::string::npos);
  CHECK(without.find("interpolation grid") == std::string::npos);
  // Distinct styles for the first traces: no two alike in colour or dash.
  for (int i = 0; i < 8; ++i)
    for (int j = i + 1; j < 8; ++j) {
      CHECK(std::string(StyleOf(i).colour) != StyleOf(j).colour);
      CHECK(std::string(StyleOf(i).dash) != StyleOf(j).dash);
    }
}

}  // namespace apograph::publish

namespace apograph::publish {

TEST_CASE("tick labels too close together are left out, zero always labelled") {
  PlotSpec p;
  p.height = 130;
  p.traces = {{"A", 0, {{0, 0}, {10, 212900, PointKind::kSlip}}}};  // x ticks 0, 2, ... 10
  const std::string svg = PlotSvg(p);
  CHECK(svg.find(">0</text>") != std::string::npos);
  CHECK(svg.find(">1</text>") == std::string::npos);  // 1 is a few pixels from 0 here
  CHECK(svg.find(">1e+06</text>") != std::string::npos);
  CHECK(svg.find("signed log") != std::string::npos);
  p.height = 2000;
  CHECK(PlotSvg(p).find(">1</text>") != std::string::npos);
}

}  // namespace apograph::publish
