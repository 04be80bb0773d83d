// The stemma drawn as SVG without Graphviz.
#include "publish/svg_stemma.hpp"

#include <doctest/doctest.h>

#include "lineage/stemma.hpp"

namespace apograph::publish {
namespace {

int Count(const std::string& text, const std::string& what) {
  int n = 0;
  for (std::size_t at = text.find(what); at != std::string::npos; at = text.find(what, at + 1)) ++n;
  return n;
}

/// archetype -> (A, lost -> (B, C)), C contaminated from A.
lineage::LineageReport Report() {
  lineage::Stemma s;
  s.root = s.Add({lineage::kArchetype, false, -1, {}, 0, std::nullopt});
  const int a = s.Add({"A", true, -1, {}, 1, std::nullopt});
  const int lost = s.Add({"", false, -1, {}, 2, 0.87});
  const int b = s.Add({"B", true, -1, {}, 1, std::nullopt});
  const int c = s.Add({"C", true, -1, {}, 1, std::nullopt});
  s.Attach(s.root, a);
  s.Attach(s.root, lost);
  s.Attach(lost, b);
  s.Attach(lost, c);
  lineage::LineageReport r;
  r.results.push_back({lineage::Method::kParsimony, s, {}, std::nullopt});
  lineage::Contamination con;
  con.witness = "C";
  con.segments.push_back({"A", "1", "30", 0, 29, 3, 2});
  con.text = "C follows A in rows 1 to 30";
  r.contamination.push_back(con);
  return r;
}

}  // namespace

TEST_CASE("stemma SVG: witnesses as boxes, lost copies as circles, support, contamination") {
  const std::string svg = StemmaSvg(Report(), "sun eq");
  CHECK(Count(svg, "class=\"wit\"") == 3);
  CHECK(Count(svg, "class=\"arch\"") == 1);
  CHECK(Count(svg, "class=\"lost\"") == 1);
  CHECK(Count(svg, "class=\"branch\"") == 4);
  CHECK(svg.find(">87%</text>") != std::string::npos);
  CHECK(Count(svg, "class=\"contam\"") == 1);
  CHECK(svg.find("<title>C follows A in rows 1 to 30</title>") != std::string::npos);
  // The arrow marker's id is made from the given id, so two stemmata on one
  // page do not share it.
  CHECK(svg.find("id=\"arrow-sun-eq\"") != std::string::npos);
  CHECK(svg.find("url(#arrow-sun-eq)") != std::string::npos);
  CHECK(StemmaSvg({}).empty());
}

}  // namespace apograph::publish
