// Derived columns as references, per-witness computations, and the
// "nothing fits" verdict carried by a reference.
#include <doctest/doctest.h>

#include <cmath>
#include <numbers>

#include "estimate/derived_model.hpp"
#include "pipeline/reference.hpp"

namespace apograph::pipeline {
namespace {

double Sine(double a) { return 60 * std::sin(a * std::numbers::pi / 180); }

Cell ReadCell(const Sexagesimal& v) {
  Cell c;
  c.value = v;
  c.raw = v.ToString();
  c.places = 2;
  return c;
}

/// How a witness's difference column was made.
enum class Made { kAuthor, kOwnEntries, kExact };

/// Sines on a radius of 60 at 1..89 with the difference to the next row
/// (2 places each); `slips` rows of the sine column miscopied by 100 units;
/// the difference column as `made` (the author's from his rounded entries,
/// recomputed from the witness's own entries, or from exact values).
Transcription Witness(const std::string& siglum, const std::vector<int>& slips, Made made) {
  Transcription t;
  t.table_id = "sines";
  t.witness.siglum = siglum;
  t.argument = {"arc", "deg", 0, Sexagesimal::FromUnits(1, 0), Sexagesimal::FromUnits(1, 0)};
  t.columns = {{"sine", "", 2, "", std::nullopt}, {"difference", "", 2, "", std::nullopt}};
  std::vector<Sexagesimal> author, own;
  for (int a = 1; a <= 90; ++a) author.push_back(Sexagesimal::FromDouble(Sine(a), 2));
  own = author;
  for (int r : slips)
    own[static_cast<std::size_t>(r)] =
        own[static_cast<std::size_t>(r)] + Sexagesimal::FromUnits(100, 2);
  for (int i = 0; i < 89; ++i) {
    Sexagesimal d;
    const auto k = static_cast<std::size_t>(i);
    if (made == Made::kAuthor) d = author[k + 1] - author[k];
    if (made == Made::kOwnEntries) d = own[k + 1] - own[k];
    if (made == Made::kExact) d = Sexagesimal::FromDouble(Sine(i + 2) - Sine(i + 1), 2);
    Row row;
    row.argument.value = Sexagesimal::FromUnits(i + 1, 0);
    row.argument.raw = row.argument.value->ToString();
    row.cells = {ReadCell(own[k]), ReadCell(d)};
    t.rows.push_back(row);
  }
  return t;
}

const ColumnReference& Of(const std::vector<ColumnReference>& refs, const std::string& name) {
  for (const auto& r : refs) {
    if (r.column_name == name) return r;
  }
  FAIL("no reference for " << name);
  return refs.front();
}

ReferenceRequest Automatic() {
  ReferenceRequest r;
  r.automatic = true;
  return r;
}

}  // namespace

TEST_CASE("a difference column is a derived reference that every stage can recompute") {
  const std::vector<Transcription> ws = {Witness("A", {20}, Made::kAuthor)};
  const auto refs = ResolveReferences(ws, Automatic());
  const ColumnReference& sine = Of(refs, "sine");
  CHECK(sine.model->name() == "sine");
  const ColumnReference& diff = Of(refs, "difference");
  REQUIRE_FALSE(diff.derived.empty());
  CHECK(diff.derived.find("the difference to the next row of sine") == 0);
  CHECK(diff.derived.find("from rounded entries") != std::string::npos);
  CHECK(diff.explains);
  // Recompute gives the differences of the author's rounded sines, also
  // where this witness miscopied the sine (rows 19 and 20).
  const auto re = diff.Recompute(ws[0]);
  for (int i = 0; i < 88; ++i) {  // the last row has no next row
    CAPTURE(i);
    const Sexagesimal want =
        Sexagesimal::FromDouble(Sine(i + 2), 2) - Sexagesimal::FromDouble(Sine(i + 1), 2);
    REQUIRE(re.computed[static_cast<std::size_t>(i)].has_value());
    CHECK(*re.computed[static_cast<std::size_t>(i)] == want);
  }
  // ValueAt, with no table at hand, gives the same from the argument alone.
  const auto v = diff.ValueAt(30);
  REQUIRE(v.has_value());
  CHECK(*v == Sexagesimal::FromDouble(Sine(31), 2) - Sexagesimal::FromDouble(Sine(30), 2));
}

TEST_CASE("witnesses computed differently get their own references, and say so") {
  // A and C copy the author's column; B recomputed it from its own entries
  // (with four slips in its sines); M, a modern edition, from exact values.
  const std::vector<Transcription> ws = {
      Witness("A", {}, Made::kAuthor), Witness("B", {10, 30, 50, 70}, Made::kOwnEntries),
      Witness("C", {60}, Made::kAuthor), Witness("M", {}, Made::kExact)};
  const auto refs = ResolveReferences(ws, Automatic());
  const ColumnReference& diff = Of(refs, "difference");
  REQUIRE_FALSE(diff.derived.empty());
  CHECK(diff.derived.find("from rounded entries") != std::string::npos);
  REQUIRE(diff.variants.size() == 2);
  CHECK(diff.ForWitness("A").model == diff.model);
  CHECK(diff.ForWitness("C").model == diff.model);
  const auto* own = dynamic_cast<const estimate::DerivedModel*>(diff.ForWitness("B").model.get());
  const auto* exact = dynamic_cast<const estimate::DerivedModel*>(diff.ForWitness("M").model.get());
  REQUIRE(own != nullptr);
  REQUIRE(exact != nullptr);
  CHECK(own->basis() == estimate::DerivedBasis::kOwnEntries);
  CHECK(exact->basis() == estimate::DerivedBasis::kExact);
  // B's recomputation reproduces B's column, slips and all.
  const auto re = diff.Recompute(ws[1]);
  int exact_b = 0;
  for (std::size_t i = 0; i < ws[1].rows.size(); ++i)
    exact_b += re.computed[i] && *re.computed[i] == *ws[1].rows[i].cells[1].value;
  CHECK(exact_b == 88);  // every row with a next row
}

TEST_CASE("a reference that explains nothing carries the verdict") {
  Transcription t = Witness("A", {}, Made::kAuthor);
  // A third column of no model: a slow wave of a period that is not a turn.
  t.columns.push_back({"odd", "", 2, "", std::nullopt});
  for (std::size_t i = 0; i < t.rows.size(); ++i) {
    const double a = static_cast<double>(i + 1);
    t.rows[i].cells.push_back(
        ReadCell(Sexagesimal::FromDouble(5 * std::sin(a / 13.7) + 0.03 * a, 2)));
  }
  const auto refs = ResolveReferences({t}, Automatic());
  const ColumnReference& odd = Of(refs, "odd");
  CHECK_FALSE(odd.explains);
  CHECK(odd.verdict.find("no model explains column odd") == 0);
  CHECK(odd.how.find(odd.verdict) != std::string::npos);
  CHECK(Of(refs, "sine").explains);
  // A reference the editor gives always explains (the editor's choice).
  ReferenceRequest given;
  given.model = "sine";
  given.params = {{"R", 60}};
  given.columns = {"odd"};
  CHECK(ResolveReferences({t}, given).at(0).explains);
}

}  // namespace apograph::pipeline
