// Irregular arguments (a mean motion by 1, 2, ... 9 days, then 10, 20, ...
// 90, then 100, 200, 300 days) are taken as written: the collation invents
// no row between them, with or without the declaration step=list.
#include <doctest/doctest.h>

#include "../value_cells.hpp"
#include "collate/collation.hpp"

using apograph::Cell;
using apograph::Row;
using apograph::Sexagesimal;
using apograph::Transcription;
namespace collate = apograph::collate;

namespace {

using apograph::testing::S;
using apograph::testing::ValueCell;

std::vector<std::string> Days() {
  std::vector<std::string> days;
  for (int d = 1; d <= 9; ++d) days.push_back(std::to_string(d));
  for (int d = 10; d <= 90; d += 10) days.push_back(std::to_string(d));
  for (int d = 100; d <= 300; d += 100) days.push_back(std::to_string(d));
  return days;
}

/// A mean motion of 0;59,8 a day (common practice: the sun's daily mean
/// motion to two places), rows by the days given.
Transcription Witness(const std::string& siglum, const std::vector<std::string>& days,
                      bool listed) {
  Transcription t;
  t.table_id = "mean-sun";
  t.witness.siglum = siglum;
  t.argument.name = "days";
  t.argument.listed = listed;
  t.columns.push_back({"motion", "", 2, "", std::nullopt});
  for (const auto& d : days) {
    Row r;
    r.argument = ValueCell(d);
    const auto units = std::stoll(d) * (59 * 60 + 8) % (360 * 3600);
    r.cells.push_back(ValueCell(Sexagesimal::FromUnits(units, 2).ToString()));
    t.rows.push_back(r);
  }
  return t;
}

int Count(const collate::Collation& c, const std::string& kind) {
  int n = 0;
  for (const auto& note : c.notes) n += note.kind == kind;
  return n;
}

}  // namespace

TEST_CASE("irregular arguments without a declared step are collated as written") {
  for (bool listed : {false, true}) {
    CAPTURE(listed);
    const auto days = Days();
    auto coll = collate::Collate(
        {Witness("A", days, listed), Witness("B", days, listed), Witness("C", days, listed)});
    REQUIRE(coll.rows.size() == days.size());
    for (std::size_t i = 0; i < days.size(); ++i) CHECK(coll.rows[i].argument == S(days[i]));
    CHECK(coll.notes.empty());
  }
}

TEST_CASE("in an argument list a missing row and a miscopied argument are still found") {
  const auto days = Days();
  auto b = days;
  b.erase(b.begin() + 12);  // B lacks 40 days
  auto c_rows = Witness("C", days, true);
  c_rows.rows[10].argument = ValueCell("29");  // C writes 29 for 20
  auto coll = collate::Collate({Witness("A", days, true), Witness("B", b, true), c_rows});
  REQUIRE(coll.rows.size() == days.size());
  CHECK(Count(coll, "missing row") == 1);
  CHECK(Count(coll, "miscopied argument") == 1);
  CHECK(Count(coll, "extra row") == 0);
  for (const auto& n : coll.notes) {
    if (n.kind == "missing row")
      CHECK(coll.rows[static_cast<std::size_t>(n.row)].argument == S("40"));
    if (n.kind == "miscopied argument")
      CHECK(n.text.find("written 29 where 20") != std::string::npos);
  }
}
