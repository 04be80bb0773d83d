#include "collate/collation.hpp"

#include <doctest/doctest.h>

#include "../value_cells.hpp"

using apograph::Cell;
using apograph::CellState;
using apograph::Row;
using apograph::Sexagesimal;
using apograph::Transcription;
namespace collate = apograph::collate;

namespace {

using apograph::testing::S;
using apograph::testing::ValueCell;

// A witness of a one-column table "eq" with argument start 10 step 10, rows
// given as (argument, value) pairs; "?" makes an illegible cell.
Transcription Witness(const std::string& siglum,
                      const std::vector<std::pair<std::string, std::string>>& rows,
                      bool declare = true) {
  Transcription t;
  t.table_id = "T1";
  t.witness.siglum = siglum;
  t.argument.name = "arg";
  if (declare) t.argument.start = S("10"), t.argument.step = S("10");
  t.columns.push_back({"eq", "", 1, "", std::nullopt});
  for (const auto& [a, v] : rows) {
    Row r;
    r.argument = ValueCell(a);
    if (v == "?") {
      Cell c;
      c.raw = "?";
      c.state = CellState::kIllegible;
      c.places = 1;
      r.cells.push_back(c);
    } else {
      r.cells.push_back(ValueCell(v));
    }
    t.rows.push_back(r);
  }
  return t;
}

const std::vector<std::pair<std::string, std::string>> kRight = {
    {"10", "0;20"}, {"20", "0;40"}, {"30", "0;58"}, {"40", "1;15"}, {"50", "1;29"},
    {"60", "1;41"}, {"70", "1;51"}, {"80", "1;57"}, {"90", "1;59"}};

}  // namespace

TEST_CASE("a missing row and a miscopied argument are aligned by argument and neighbours") {
  auto b = kRight;
  b.erase(b.begin() + 3);  // B lacks the row for 40
  auto c = kRight;
  c[5].first = "66";  // C miscopies the argument 60
  auto coll = collate::Collate({Witness("A", kRight), Witness("B", b), Witness("C", c)});
  REQUIRE(coll.rows.size() == 9);
  CHECK(coll.rows[3].argument == S("40"));
  CHECK(coll.rows[3].source_row[1] == -1);  // B missing
  CHECK(coll.rows[4].source_row[1] == 3);   // B's 4th row is 50
  CHECK(coll.rows[5].source_row[2] == 5);   // C's miscopied row stays at 60
  int missing = 0, miscopied = 0;
  for (const auto& n : coll.notes) {
    if (n.kind == "missing row" && n.siglum == "B" && n.row == 3) ++missing;
    if (n.kind == "miscopied argument" && n.siglum == "C" && n.row == 5) ++miscopied;
  }
  CHECK(missing == 1);
  CHECK(miscopied == 1);
  CHECK(coll.rows[3].cells[0].ReadingOf("B")->kind == collate::ReadingKind::kOmitted);
  CHECK(coll.notes.size() == 2);
}

TEST_CASE(
    "an extra row is reported and left out of the grid; arguments inferred without declaration") {
  auto b = kRight;
  b.insert(b.begin() + 2, {"25", "0;50"});
  auto coll = collate::Collate(
      {Witness("A", kRight, false), Witness("B", b, false), Witness("C", kRight, false)});
  REQUIRE(coll.rows.size() == 9);
  CHECK(coll.rows[2].argument == S("30"));
  CHECK(coll.rows[2].source_row[1] == 3);
  REQUIRE(coll.notes.size() == 1);
  CHECK(coll.notes[0].kind == "extra row");
  CHECK(coll.notes[0].source_row == 2);
}

TEST_CASE("a column slid by a row in one witness is detected by comparison with the others") {
  auto d = kRight;
  // D copies rows 40..70 from the next row (eye slipped), then repeats.
  for (int i = 3; i <= 6; ++i) d[i].second = kRight[i + 1].second;
  auto coll = collate::Collate(
      {Witness("A", kRight), Witness("B", kRight), Witness("C", kRight), Witness("D", d)});
  REQUIRE(coll.slides.size() == 1);
  CHECK(coll.slides[0].siglum == "D");
  CHECK(coll.slides[0].first_row == 3);
  CHECK(coll.slides[0].last_row == 6);
  CHECK(coll.slides[0].offset == 1);
  CHECK(coll.SlideAt("D", 4, 0) != nullptr);
  CHECK(coll.SlideAt("A", 4, 0) == nullptr);
}

TEST_CASE("readings are grouped and minority readings marked on the majority basis") {
  auto b = kRight, c = kRight;
  b[1].second = "0;45";
  c[2].second = "?";
  auto coll = collate::Collate({Witness("A", kRight), Witness("B", b), Witness("C", c)});
  const auto& cell = coll.rows[1].cells[0];
  CHECK(cell.basis == collate::Basis::kMajority);
  REQUIRE(cell.readings.size() == 2);
  CHECK(cell.readings[0].text == "0;40");
  CHECK(cell.readings[0].sigla == std::vector<std::string>{"A", "C"});
  CHECK_FALSE(cell.readings[0].error);
  CHECK(cell.readings[1].text == "0;45");
  CHECK(cell.readings[1].error);
  CHECK(cell.readings[1].why == "minority reading: 1 against 2 for 0;40");
  // An illegible reading is listed but not compared.
  const auto& ill = coll.rows[2].cells[0];
  CHECK_FALSE(ill.Varies());
  CHECK(ill.ReadingOf("C")->kind == collate::ReadingKind::kIllegible);
}

TEST_CASE("with two witnesses disagreeing and no model nothing is marked") {
  auto b = kRight;
  b[1].second = "0;45";
  auto coll = collate::Collate({Witness("A", kRight), Witness("B", b)});
  const auto& cell = coll.rows[1].cells[0];
  CHECK(cell.basis == collate::Basis::kUndetermined);
  CHECK_FALSE(cell.readings[0].error);
  CHECK_FALSE(cell.readings[1].error);
}

TEST_CASE("with a recomputed value readings beyond the tolerance are errors") {
  auto b = kRight;
  b[1].second = "0;45";
  collate::CollateOptions o;
  // The recomputed solar equation at 20 is 0;39 (Maimonides' table shows 0;40,
  // see published-checks.md section 2; model value 0;39,28 rounds to 0;39).
  o.reference =
      collate::Reference{"test model", [](const Sexagesimal& a, int) -> std::optional<Sexagesimal> {
                           if (a == S("20")) return S("0;39");
                           return std::nullopt;
                         }};
  auto coll = collate::Collate({Witness("A", kRight), Witness("B", b)}, o);
  const auto& cell = coll.rows[1].cells[0];
  CHECK(cell.basis == collate::Basis::kRecomputation);
  const auto* a = cell.ReadingOf("A");
  const auto* bb = cell.ReadingOf("B");
  CHECK_FALSE(a->error);  // 1 unit off: within the tolerance
  CHECK(bb->error);
  CHECK(*bb->units_off == doctest::Approx(6));
  CHECK(bb->why == "0;45 is 6 units from the recomputed 0;39 (beyond the tolerance of 1)");
}

TEST_CASE("caller judgements take precedence") {
  collate::CollateOptions o;
  collate::JudgementGrid g(kRight.size(), std::vector<std::optional<collate::CellJudgement>>(1));
  g[1][0] = collate::CellJudgement{true, S("0;39"), 1, "author's value kept", false};
  o.judgements["A"] = g;
  auto coll = collate::Collate({Witness("A", kRight), Witness("B", kRight)}, o);
  const auto& cell = coll.rows[1].cells[0];
  CHECK(cell.basis == collate::Basis::kCaller);
  CHECK(cell.ReadingOf("A")->error);
  CHECK_FALSE(cell.ReadingOf("B")->error);
}

TEST_CASE("witnesses of different tables are refused") {
  auto a = Witness("A", kRight), b = Witness("B", kRight);
  b.table_id = "T2";
  CHECK_THROWS_AS(collate::Collate({a, b}), apograph::InputError);
  CHECK_THROWS_AS(collate::Collate({}), apograph::InputError);
}
