// The grader of tests/deviation/tradition_grade.hpp (used by
// deviation_bench and tradition_rates_test): what it counts as one run and
// which classes it accepts for a run seen in one cell.
#include <doctest/doctest.h>

#include "tradition_grade.hpp"

using namespace apograph;

namespace {

synth::Slip ConstantRunSlip(int origin_row, const std::string& after) {
  synth::Slip s;
  s.slip = synth::SlipClass::kConstantRun;
  s.table = "t";
  s.origin_row = origin_row;
  s.column = "equation";
  s.after = after;
  s.run = 0;  // run ids are numbered per copy: both copies' first run is 0
  s.detail = "+1 in place 0 over the run";
  return s;
}

}  // namespace

TEST_CASE("the grader keys a run by the copy that made it, not by its run id alone") {
  // An ancestor's constant error at row 40 and a later copy's at row 90,
  // both the copy's run 0: two runs, each seen in one cell (keyed by the run
  // id alone, they were one run of two cells, and a constant error seen in
  // one cell was graded as a run the copy shows).
  synth::Tradition t;
  t.nodes.resize(2);
  t.nodes[0].slips.push_back(ConstantRunSlip(40, "2;10"));
  t.nodes[1].slips.push_back(ConstantRunSlip(90, "3;5"));
  const auto index = testing::grade_internal::IndexSlips(t);
  const auto& first = t.nodes[0].slips.front();
  const auto& second = t.nodes[1].slips.front();
  CHECK(index.Run(first) != index.Run(second));
  CHECK(index.Run(first) == std::make_pair(std::size_t{0}, 0));
  CHECK(index.Run(second) == std::make_pair(std::size_t{1}, 0));
  Cell cell;
  cell.raw = "3;5";
  CHECK(testing::grade_internal::SlipFor(index, "t", 90, "equation", cell) == &second);
}

TEST_CASE("a constant error seen in one cell may be named a confusion, over more cells not") {
  const auto s = ConstantRunSlip(40, "2;10");
  const auto one = testing::grade_internal::Expected(s, 1);
  CHECK(one == std::set<std::string>{"confusion", "systematic"});
  const auto two = testing::grade_internal::Expected(s, 2);
  CHECK(two == std::set<std::string>{"systematic"});
}
