// Author's tables drawn by the generator: reproducible, parseable, their
// key consistent with their entries, phenomena at their configured rates.
#include "synth/tables.hpp"

#include <doctest/doctest.h>

#include <cmath>
#include <map>
#include <set>

#include "synth/key_json.hpp"
#include "synth/table_build.hpp"
#include "test_support.hpp"
#include "transcription/parser.hpp"
#include "transcription/writer.hpp"

namespace synth = apograph::synth;
using apograph::Sexagesimal;

namespace {

constexpr int kSeeds = 200;  // seeds 1..200 in every rate test

std::string Bytes(const synth::AuthorTable& t) {
  return apograph::WriteTranscription(t.text) + synth::ToJson(t.key).dump();
}

// |observed - expected| <= tolerance, printed when it fails.
bool Near(double observed, double expected, double tolerance) {
  INFO("observed " << observed << ", expected " << expected << " +- " << tolerance);
  CHECK(std::fabs(observed - expected) <= tolerance);
  return std::fabs(observed - expected) <= tolerance;
}

double Units(const Sexagesimal& v, int places) { return v.ToDouble() * std::pow(60.0, places); }

}  // namespace

TEST_CASE("synth table: the same seed gives the same bytes, another seed other bytes") {
  for (std::uint64_t seed : {1u, 7u, 99u}) {
    CHECK(Bytes(synth::DrawTable(seed, {})) == Bytes(synth::DrawTable(seed, {})));
  }
  CHECK(Bytes(synth::DrawTable(1, {})) != Bytes(synth::DrawTable(2, {})));
}

TEST_CASE("synth table: every family is drawable and every written table parses") {
  for (synth::Family f : synth::AllFamilies()) {
    for (std::uint64_t seed = 1; seed <= 12; ++seed) {
      synth::TableOptions o;
      o.family = f;
      synth::AuthorTable t = synth::DrawTable(seed, o);
      t.text.witness.siglum = "A";
      CAPTURE(synth::FamilyName(f));
      CAPTURE(seed);
      const auto parsed =
          apograph::ParseTranscription(apograph::WriteTranscription(t.text), "t.apo");
      REQUIRE(parsed.tables.size() == 1);
      CHECK(parsed.tables[0].SameContent(t.text));
      CHECK(t.key.family == f);
    }
  }
}

TEST_CASE("synth table: entries within a unit of the exact value, departures as keyed") {
  for (std::uint64_t seed = 1; seed <= kSeeds; ++seed) {
    const synth::AuthorTable t = synth::DrawTable(seed, {});
    for (const auto& c : t.key.columns) {
      CAPTURE(seed);
      CAPTURE(c.name);
      std::map<int, int> dep;
      for (const auto& d : c.departures) dep[d.row] = d.units;
      for (std::size_t i = 0; i < c.tabulated.size(); ++i) {
        const double diff = Units(c.tabulated[i] - c.computed[i], c.places);
        CHECK(diff ==
              doctest::Approx(dep.count(static_cast<int>(i)) ? dep[static_cast<int>(i)] : 0));
        const bool plain = c.role == synth::ColumnKey::Role::kModel && c.practice.grid == 0 &&
                           !c.mean_motion && !c.modulo_360;
        if (plain)
          CHECK(std::fabs(Units(c.computed[i], c.places) - c.exact[i] * std::pow(60.0, c.places)) <=
                1.0);
      }
    }
  }
}

TEST_CASE("synth table: difference columns from tabulated entries are the keyed differences") {
  int checked = 0;
  for (std::uint64_t seed = 1; seed <= kSeeds; ++seed) {
    const synth::AuthorTable t = synth::DrawTable(seed, {});
    for (const auto& c : t.key.columns) {
      if (!c.derived || c.derived->from_exact ||
          c.derived->kind != synth::DerivedSpec::Kind::kDifference || c.derived->span_rows != 1 ||
          c.derived->wrap_360)
        continue;
      const auto& s =
          t.key.columns[static_cast<std::size_t>(t.key.ColumnIndex(c.derived->from[0]))];
      for (std::size_t i = 1; i + 1 < c.computed.size(); ++i) {
        const auto& a = c.derived->forward ? s.tabulated[i + 1] : s.tabulated[i];
        const auto& b = c.derived->forward ? s.tabulated[i] : s.tabulated[i - 1];
        const double expected = Units(a - b, c.places) / static_cast<double>(c.derived->divisor);
        CHECK(std::fabs(Units(c.computed[i], c.places) - expected) <= 0.5 + 1e-9);
        ++checked;
      }
    }
  }
  CHECK(checked > 100);
}

TEST_CASE("synth table: mean motions by addition are multiples of the rounded unit value") {
  int checked = 0;
  for (std::uint64_t seed = 1; seed <= kSeeds; ++seed) {
    synth::TableOptions o;
    o.family = synth::Family::kMeanMotion;
    const synth::AuthorTable t = synth::DrawTable(seed, o);
    const auto& c = t.key.columns.front();
    if (c.mean_motion->construction != "addition" || c.function.Param("radix") != 0) continue;
    for (std::size_t i = 0; i < c.computed.size(); ++i) {
      const Sexagesimal expected =
          (*c.mean_motion->unit_value * t.key.argument.values[i].IntegerPart()).Modulo(360);
      CHECK(c.computed[i] == expected);
      ++checked;
    }
  }
  CHECK(checked > 100);
}

TEST_CASE("synth table: phenomena at their configured rates over 200 seeds") {
  const synth::TableOptions o;
  int cells = 0, departures = 0, params = 0, nonround = 0, columns = 0, truncated = 0, grids = 0;
  std::set<std::string> forms;
  int irregular = 0, derived_exact = 0, derived_tab = 0, unexplained = 0, double_arg = 0;
  for (std::uint64_t seed = 1; seed <= kSeeds; ++seed) {
    const synth::AuthorTable t = synth::DrawTable(seed, o);
    irregular += t.key.argument.regular ? 0 : 1;
    double_arg += t.key.argument2 ? 1 : 0;
    for (const auto& c : t.key.columns) {
      if (c.role == synth::ColumnKey::Role::kUnexplained) ++unexplained;
      if (c.derived) (c.derived->from_exact ? derived_exact : derived_tab)++;
      if (c.role != synth::ColumnKey::Role::kModel) continue;
      forms.insert(synth::ToString(c.sign_form));
      cells += static_cast<int>(c.tabulated.size());
      departures += static_cast<int>(c.departures.size());
      ++columns;
      truncated += c.practice.rounding == apograph::Rounding::kTruncate ? 1 : 0;
      grids += c.practice.grid > 0 ? 1 : 0;
      if (&c != &t.key.columns.front()) continue;  // parameters once per table
      for (const auto& p : c.function.params) {
        if (p.basis == "drawn" || p.basis == "convention" || p.basis.rfind("derived", 0) == 0 ||
            p.role == "radix" || p.text == "0")
          continue;
        ++params;
        nonround += p.basis.rfind("non-round", 0) == 0 ? 1 : 0;
      }
    }
  }
  // Departures: the option's 3 % less the few refused because they would
  // change an entry's sign.
  Near(static_cast<double>(departures) / cells, o.departure_rate, 0.004);
  Near(static_cast<double>(nonround) / params, o.share_nonround, 0.03);
  Near(static_cast<double>(truncated) / columns, o.share_truncation, 0.05);
  CHECK(grids > 10);
  CHECK(forms == std::set<std::string>{"as-computed", "signed", "magnitude", "displaced"});
  CHECK(irregular > 0);
  CHECK(double_arg > 0);
  CHECK(derived_exact > 0);
  CHECK(derived_tab > 0);
  CHECK(unexplained > 0);
}

TEST_CASE("synth table: mean motions by every construction, irregular lists among them") {
  std::map<std::string, int> constructions;
  int irregular = 0;
  synth::TableOptions o;
  o.family = synth::Family::kMeanMotion;
  for (std::uint64_t seed = 1; seed <= kSeeds; ++seed) {
    const synth::AuthorTable t = synth::DrawTable(seed, o);
    ++constructions[t.key.columns.front().mean_motion->construction];
    irregular += t.key.argument.regular ? 0 : 1;
  }
  CHECK(constructions.size() == 3);
  CHECK(constructions["from-entries"] >= 5);
  // Irregular lists are drawn for days and expanded years (0.45 + 0.2 of
  // mean motions, parameters.cpp).
  Near(static_cast<double>(irregular) / kSeeds, 0.65 * o.share_irregular_mean_motion, 0.08);
}

TEST_CASE("synth table: planets on their epicycles progress and, in most draws, regress") {
  int regress = 0;
  synth::TableOptions o;
  o.family = synth::Family::kPlanetPosition;
  for (std::uint64_t seed = 1; seed <= kSeeds; ++seed) {
    const auto key = synth::ToJson(synth::DrawTable(seed, o).key);
    regress += key["columns"][0]["regresses"].get<bool>() ? 1 : 0;
  }
  CHECK(regress > kSeeds / 2);
  CHECK(regress < kSeeds);
}

TEST_CASE("synth table: displaced columns are never negative, magnitudes carry a rubric") {
  int displaced = 0, magnitude = 0;
  for (std::uint64_t seed = 1; seed <= kSeeds; ++seed) {
    synth::TableOptions o;
    o.families = {synth::Family::kSolarEquation, synth::Family::kDeclination, synth::Family::kSine};
    o.share_full_range = 1;
    const synth::AuthorTable t = synth::DrawTable(seed, o);
    for (const auto& c : t.key.columns) {
      if (c.sign_form == synth::SignForm::kDisplaced) {
        ++displaced;
        for (const auto& v : c.tabulated) CHECK_FALSE(v.negative());
      }
      if (c.sign_form == synth::SignForm::kMagnitude) {
        ++magnitude;
        for (const auto& v : c.tabulated) CHECK_FALSE(v.negative());
        CHECK(c.rubric.size() >= 2);
      }
    }
  }
  CHECK(displaced > 10);
  CHECK(magnitude > 10);
}
