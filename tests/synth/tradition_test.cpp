// Traditions: trees consistent with their dates and texts, copies holding
// their exemplar's errors, keys consistent, phenomena at their rates.
#include "synth/tradition.hpp"

#include <doctest/doctest.h>

#include <cmath>
#include <functional>
#include <map>
#include <set>

#include "edition/witness_date.hpp"
#include "synth/tradition_json.hpp"
#include "test_support.hpp"
#include "transcription/parser.hpp"
#include "transcription/writer.hpp"

namespace synth = apograph::synth;

namespace {

constexpr int kSeeds = 200;  // seeds 1..200 in every rate test

const synth::Node& N(const synth::Tradition& t, int i) {
  return t.nodes[static_cast<std::size_t>(i)];
}

std::string Bytes(const synth::Tradition& t) {
  std::string out = synth::TraditionJson(t).dump();
  for (int i : t.Surviving()) out += apograph::WriteTranscription(t.WitnessTables(i));
  return out;
}

bool Near(double observed, double expected, double tolerance) {
  INFO("observed " << observed << ", expected " << expected << " +- " << tolerance);
  CHECK(std::fabs(observed - expected) <= tolerance);
  return std::fabs(observed - expected) <= tolerance;
}

// (origin row, column) -> reading, first row of each origin.
std::map<std::pair<int, std::string>, std::string> Cells(const synth::TableText& t) {
  std::map<std::pair<int, std::string>, std::string> out;
  for (std::size_t i = 0; i < t.text.rows.size(); ++i) {
    out.emplace(std::make_pair(t.origin[i], std::string("@argument")), t.text.rows[i].argument.raw);
    for (std::size_t c = 0; c < t.text.columns.size(); ++c) {
      out.emplace(std::make_pair(t.origin[i], t.text.columns[c].name), t.text.rows[i].cells[c].raw);
    }
  }
  return out;
}

}  // namespace

TEST_CASE("synth tradition: the same seed gives the same bytes") {
  for (std::uint64_t seed : {3u, 17u})
    CHECK(Bytes(synth::DrawTradition(seed, {})) == Bytes(synth::DrawTradition(seed, {})));
  CHECK(Bytes(synth::DrawTradition(3, {})) != Bytes(synth::DrawTradition(4, {})));
}

TEST_CASE("synth tradition: dates agree with the tree and the catalogue text covers the year") {
  for (std::uint64_t seed = 1; seed <= kSeeds; ++seed) {
    const synth::Tradition t = synth::DrawTradition(seed, {});
    const int survivors = static_cast<int>(t.Surviving().size());
    CHECK(survivors >= 4);
    CHECK(survivors <= 15);
    for (std::size_t i = 1; i < t.nodes.size(); ++i) {
      const synth::Node& n = t.nodes[i];
      CAPTURE(seed);
      CAPTURE(n.name);
      CHECK(n.date.year > N(t, n.parent).date.year);
      if (n.contamination) CHECK(N(t, n.contamination->second).date.year < n.date.year);
      CHECK(n.date.from <= n.date.year);
      CHECK(n.date.year <= n.date.to);
      CHECK_FALSE(n.date.text.empty());
      // The project's reading of the catalogue date allows the true year.
      const auto range = apograph::ParseWitnessDate(n.date.text);
      REQUIRE(range.has_value());
      CHECK(range->earliest <= n.date.year);
      CHECK(n.date.year <= range->latest);
    }
  }
}

TEST_CASE("synth tradition: a copy holds its exemplar's text but for its own slips") {
  int checked = 0;
  for (std::uint64_t seed = 1; seed <= 60; ++seed) {
    const synth::Tradition t = synth::DrawTradition(seed, {});
    for (std::size_t i = 1; i < t.nodes.size(); ++i) {
      const synth::Node& n = t.nodes[i];
      if (n.contamination || n.corrector != synth::CorrectorMode::kNone) continue;
      std::set<std::tuple<std::string, int, std::string>> own;
      for (const auto& s : n.slips) own.insert({s.table, s.origin_row, s.column});
      for (std::size_t k = 0; k < n.text.size(); ++k) {
        const auto mine = Cells(n.text[k]);
        for (const auto& [where, reading] : Cells(N(t, n.parent).text[k])) {
          const auto it = mine.find(where);
          if (it == mine.end() || own.count({n.text[k].text.table_id, where.first, where.second}))
            continue;
          CHECK(it->second == reading);
          ++checked;
        }
      }
    }
  }
  CHECK(checked > 10000);
}

TEST_CASE("synth tradition: every witness's transcription parses") {
  for (std::uint64_t seed = 1; seed <= 40; ++seed) {
    const synth::Tradition t = synth::DrawTradition(seed, {});
    for (int i : t.Surviving()) {
      const auto tables = t.WitnessTables(i);
      const auto parsed =
          apograph::ParseTranscription(apograph::WriteTranscription(tables), "w.apo");
      REQUIRE(parsed.tables.size() == tables.size());
      for (std::size_t k = 0; k < tables.size(); ++k) {
        CHECK(parsed.tables[k].SameContent(tables[k]));
        CHECK(std::string(apograph::ToString(parsed.tables[k].witness.Kind())) ==
              synth::WitnessKindName(N(t, i).kind));
      }
    }
  }
}

TEST_CASE("synth tradition: every difference from the author's table is a visible keyed slip") {
  int checked = 0;
  for (std::uint64_t seed = 1; seed <= 60; ++seed) {
    const synth::Tradition t = synth::DrawTradition(seed, {});
    const auto author = Cells(t.nodes[0].text[0]);
    for (int i : t.Surviving()) {
      // Correctors change entries without a slip: leave out witnesses with one among their sources.
      std::function<bool(int)> corrected = [&](int n) {
        if (n < 0) return false;
        const auto& x = N(t, n);
        return x.corrector != synth::CorrectorMode::kNone || corrected(x.parent) ||
               (x.contamination && corrected(x.contamination->second));
      };
      if (corrected(i)) continue;
      std::set<std::pair<int, std::string>> visible;
      for (const auto& v : synth::VisibleSlips(t, i)) {
        if (v.slip.table == "t1") visible.insert({v.slip.origin_row, v.slip.column});
      }
      for (const auto& [where, reading] : Cells(N(t, i).transcribed[0])) {
        if (reading == author.at(where)) continue;
        CHECK(visible.count(where));
        ++checked;
      }
    }
  }
  CHECK(checked > 1000);
}

TEST_CASE("synth tradition: the key's tree, groups and copies agree with the nodes") {
  for (std::uint64_t seed = 1; seed <= 60; ++seed) {
    const synth::Tradition t = synth::DrawTradition(seed, {});
    const auto key = synth::TraditionJson(t);
    const std::string leaves = key["newick_leaves"];
    for (int i : t.Surviving()) {
      const std::string& name = N(t, i).name;
      // Every witness a leaf: followed by its length, preceded by ( or ,.
      const auto at = leaves.find(name + ":");
      REQUIRE(at != std::string::npos);
      CHECK((leaves[at - 1] == '(' || leaves[at - 1] == ','));
    }
    for (const auto& g : key["groups"]) {
      CHECK(g["witnesses"].size() >= 2);
      CHECK(g["witnesses"].size() < t.Surviving().size());
    }
    for (const auto& c : key["copies"]) {
      const int copy = t.Find(c["copy"]), exemplar = t.Find(c["exemplar"]);
      CHECK(N(t, copy).parent == exemplar);
      CHECK(N(t, exemplar).surviving);
    }
  }
}

TEST_CASE(
    "synth tradition: lost copies, copies of witnesses, contamination, correctors and editions at "
    "their rates") {
  const synth::TraditionOptions o;
  int manuscripts = 0, contaminated = 0, correctors = 0, with_editions = 0, with_lost = 0,
      with_copies = 0;
  int editions = 0, recomputed = 0, digitised = 0, printed = 0;
  for (std::uint64_t seed = 1; seed <= kSeeds; ++seed) {
    const synth::Tradition t = synth::DrawTradition(seed, o);
    bool lost = false, copies = false, has_edition = false;
    for (const auto& n : t.nodes) {
      lost = lost || (!n.surviving && n.name != "archetype");
      if (!n.surviving) continue;
      copies = copies || N(t, n.parent).surviving;
      if (n.kind == synth::WitnessKind::kModernEdition) {
        has_edition = true;
        ++editions;
        recomputed += n.corrector == synth::CorrectorMode::kRecompute ? 1 : 0;
      }
      if (n.kind != synth::WitnessKind::kManuscript) {
        ++printed;
        digitised += n.digitised ? 1 : 0;
        continue;
      }
      ++manuscripts;
      contaminated += n.contamination ? 1 : 0;
      correctors += n.corrector == synth::CorrectorMode::kCheck ? 1 : 0;
    }
    with_lost += lost ? 1 : 0;
    with_copies += copies ? 1 : 0;
    with_editions += has_edition ? 1 : 0;
  }
  CHECK(with_lost >= 0.95 * kSeeds);  // lost intermediates are the rule
  CHECK(with_copies > 0.3 * kSeeds);
  // Contamination needs a dated source outside the witness's own line: a
  // few witnesses (the first copies) have none.
  Near(static_cast<double>(contaminated) / manuscripts, o.share_contaminated, 0.03);
  Near(static_cast<double>(correctors) / manuscripts, o.share_corrector, 0.03);
  Near(static_cast<double>(with_editions) / kSeeds, o.share_with_editions, 0.08);
  // First editions are recomputed at the option's share, later ones mostly reprint.
  CHECK(recomputed > 0);
  CHECK(recomputed < editions);
  Near(static_cast<double>(digitised) / printed, o.share_digitised, 0.1);
}

TEST_CASE("synth tradition: the author's departures are shared by uncorrected witnesses") {
  int kept = 0, total = 0;
  for (std::uint64_t seed = 1; seed <= 60; ++seed) {
    const synth::Tradition t = synth::DrawTradition(seed, {});
    for (int i : t.Surviving()) {
      const synth::Node& n = N(t, i);
      if (n.corrector == synth::CorrectorMode::kRecompute) continue;
      for (std::size_t k = 0; k < t.tables.size(); ++k) {
        const auto cells = Cells(n.transcribed[k]);
        for (const auto& c : t.tables[k].key.columns) {
          for (const auto& d : c.departures) {
            const auto it = cells.find({d.row, c.name});
            if (it == cells.end()) continue;
            ++total;
            kept += it->second == c.tabulated[static_cast<std::size_t>(d.row)].ToString() ? 1 : 0;
          }
        }
      }
    }
  }
  CHECK(total > 500);
  // Lost where a copyist slipped on the very entry or a corrector recomputed it.
  CHECK(static_cast<double>(kept) / total > 0.85);
}

TEST_CASE("synth tradition: recomputed editions print the computed values") {
  int checked = 0;
  for (std::uint64_t seed = 1; seed <= kSeeds && checked < 5; ++seed) {
    const synth::Tradition t = synth::DrawTradition(seed, {});
    for (const auto& n : t.nodes) {
      if (n.corrector != synth::CorrectorMode::kRecompute) continue;
      ++checked;
      std::set<std::tuple<std::string, int, std::string>> own;
      for (const auto& s : n.slips) own.insert({s.table, s.origin_row, s.column});
      for (std::size_t k = 0; k < t.tables.size(); ++k) {
        const auto cells = Cells(n.text[k]);
        for (const auto& c : t.tables[k].key.columns) {
          if (c.role != synth::ColumnKey::Role::kModel) continue;
          for (std::size_t r = 0; r < c.computed.size(); ++r) {
            const auto it = cells.find({static_cast<int>(r), c.name});
            if (it == cells.end() || own.count({t.tables[k].key.id, static_cast<int>(r), c.name}))
              continue;
            CHECK(it->second == c.computed[r].ToString());
          }
        }
      }
    }
  }
  CHECK(checked >= 5);
}
