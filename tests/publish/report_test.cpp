// The editor's report: headings and the decisions it shows.
#include "publish/report.hpp"

#include <doctest/doctest.h>

TEST_CASE("a table imported without a title is headed by its id") {
  apograph::pipeline::TableAnalysis a;
  a.table_id = "T1";
  const std::string report = apograph::publish::TableReport(a);
  CHECK(report.rfind("## T1\n", 0) == 0);
  a.table_title = "Sines";
  CHECK(apograph::publish::TableReport(a).rfind("## T1: Sines\n", 0) == 0);
}
