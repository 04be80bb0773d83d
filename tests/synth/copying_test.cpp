// Witnesses copied with slips: the key matches the copy, rates hold over
// many seeds, copies parse, the numeral scripts read what they write.
#include "synth/copying.hpp"

#include <doctest/doctest.h>

#include <cmath>
#include <map>
#include <set>

#include "test_support.hpp"
#include "transcription/parser.hpp"
#include "transcription/writer.hpp"

namespace synth = apograph::synth;
using synth::SlipClass;

namespace {

constexpr int kSeeds = 200;  // seeds 1..200 in every rate test

const std::vector<synth::Hand> kHands = {
    {synth::HandKind::kManuscript, synth::Script::kHinduArabic},
    {synth::HandKind::kManuscript, synth::Script::kGreek},
    {synth::HandKind::kManuscript, synth::Script::kHebrew},
    {synth::HandKind::kManuscript, synth::Script::kArabicAbjad},
    {synth::HandKind::kManuscript, synth::Script::kRoman},
    {synth::HandKind::kPrint, synth::Script::kPrinted},
    {synth::HandKind::kDigitised, synth::Script::kPrinted},
};

struct Draw {
  synth::TableText exemplar, copy;
  std::vector<synth::Slip> slips;
};

Draw CopyOnce(std::uint64_t seed, const synth::Hand& hand, double rate) {
  synth::Rng rng(seed);
  Draw d;
  d.exemplar = synth::FromAuthor(synth::DrawTable(rng, {}));
  synth::CopyOptions o;
  o.rate = rate;
  d.copy = synth::CopyTable(d.exemplar, hand, o, rng, d.slips);
  return d;
}

const apograph::Cell& CellOf(const synth::TableText& t, int row, const std::string& column) {
  const auto& r = t.text.rows[static_cast<std::size_t>(row)];
  if (column == "@argument") return r.argument;
  return r.cells[static_cast<std::size_t>(t.text.ColumnIndex(column))];
}

// The first row of the text standing for archetype row `origin`, or -1.
int RowOf(const synth::TableText& t, int origin) {
  for (std::size_t i = 0; i < t.origin.size(); ++i) {
    if (t.origin[i] == origin) return static_cast<int>(i);
  }
  return -1;
}

bool Near(double observed, double expected, double tolerance) {
  INFO("observed " << observed << ", expected " << expected << " +- " << tolerance);
  CHECK(std::fabs(observed - expected) <= tolerance);
  return std::fabs(observed - expected) <= tolerance;
}

}  // namespace

TEST_CASE("synth numerals: every script reads back what it writes") {
  for (synth::Script s :
       {synth::Script::kHinduArabic, synth::Script::kGreek, synth::Script::kHebrew,
        synth::Script::kArabicAbjad, synth::Script::kRoman, synth::Script::kPrinted}) {
    for (int v = 0; v <= 999; ++v) {
      CAPTURE(v);
      CHECK(synth::ReadNumber(s, synth::WriteNumber(s, v)) == v);
    }
  }
  CHECK(synth::WriteNumber(synth::Script::kGreek, 23) == "κγ");
  CHECK(synth::WriteNumber(synth::Script::kHebrew, 15) == "טו");  // from memory: 9 + 6
  CHECK(synth::WriteNumber(synth::Script::kHebrew, 16) == "טז");
  CHECK(synth::WriteNumber(synth::Script::kArabicAbjad, 52) == "نب");
  CHECK(synth::WriteNumber(synth::Script::kRoman, 49) == "xxxxviiii");
}

TEST_CASE("synth numerals: look-alike lists use the script's glyphs and say their basis") {
  for (const auto& hand : kHands) {
    for (const auto& c : synth::Confusions(hand)) {
      CAPTURE(c.from);
      CAPTURE(c.to);
      CHECK(synth::ReadNumber(hand.script, c.from).has_value());
      CHECK(synth::ReadNumber(hand.script, c.to).has_value());
      CHECK((std::string(c.basis) == "judgement" || std::string(c.basis) == "from memory"));
    }
  }
}

TEST_CASE("synth copy: rate 0 copies the exemplar exactly") {
  for (const auto& hand : kHands) {
    for (std::uint64_t seed = 1; seed <= 10; ++seed) {
      const Draw d = CopyOnce(seed, hand, 0);
      CHECK(d.slips.empty());
      CHECK(d.copy.text.SameContent(d.exemplar.text));
      CHECK(d.copy.origin == d.exemplar.origin);
    }
  }
}

TEST_CASE("synth copy: every keyed slip is visible and every difference is keyed") {
  for (const auto& hand : kHands) {
    for (std::uint64_t seed = 1; seed <= 40; ++seed) {
      const Draw d = CopyOnce(seed, hand, 0.15);
      CAPTURE(seed);
      CAPTURE(synth::HandKindName(hand.kind));
      std::set<std::pair<int, std::string>> keyed;
      for (const auto& s : d.slips) {
        CAPTURE(synth::SlipName(s.slip));
        if (s.slip != SlipClass::kRowDuplicated) CHECK(s.before != s.after);
        if (s.slip == SlipClass::kRowOmitted) {
          CHECK(RowOf(d.copy, s.origin_row) == -1);
          continue;
        }
        REQUIRE(s.copy_row >= 0);
        CHECK(d.copy.origin[static_cast<std::size_t>(s.copy_row)] == s.origin_row);
        if (s.slip == SlipClass::kRowDuplicated) {
          CHECK(d.copy.origin[static_cast<std::size_t>(s.copy_row - 1)] == s.origin_row);
          continue;
        }
        CHECK(CellOf(d.copy, s.copy_row, s.column).raw == s.after);
        CHECK(CellOf(d.exemplar, s.origin_row, s.column).raw == s.before);
        if (s.slip == SlipClass::kLookAlike)
          CHECK(synth::Listed(hand, s.pair.substr(0, s.pair.find('/')),
                              s.pair.substr(s.pair.find('/') + 1)));
        if (s.slip == SlipClass::kOtherSymbol) CHECK_FALSE(s.listed);
        keyed.insert({s.origin_row, s.column});
      }
      for (std::size_t r = 0; r < d.exemplar.text.rows.size(); ++r) {
        const int at = RowOf(d.copy, static_cast<int>(r));
        if (at < 0) continue;
        const auto& row = d.copy.text.rows[static_cast<std::size_t>(at)];
        if (row.argument.raw != d.exemplar.text.rows[r].argument.raw)
          CHECK(keyed.count({static_cast<int>(r), "@argument"}));
        for (std::size_t c = 0; c < row.cells.size(); ++c) {
          if (row.cells[c].raw != d.exemplar.text.rows[r].cells[c].raw) {
            CHECK(keyed.count({static_cast<int>(r), d.copy.text.columns[c].name}));
          }
        }
      }
    }
  }
}

TEST_CASE("synth copy: written copies parse with the project's parser") {
  for (const auto& hand : kHands) {
    for (std::uint64_t seed = 1; seed <= 30; ++seed) {
      Draw d = CopyOnce(seed, hand, 0.2);
      d.copy.text.witness.siglum = "B";
      const auto parsed =
          apograph::ParseTranscription(apograph::WriteTranscription(d.copy.text), "b.apo");
      REQUIRE(parsed.tables.size() == 1);
      CHECK(parsed.tables[0].SameContent(d.copy.text));
    }
  }
}

TEST_CASE("synth copy: corruption and outside-list shares at their configured rates") {
  for (double rate : {0.03, 0.1, 0.2}) {
    long cells = 0, corrupted = 0, symbol = 0, outside = 0;
    std::map<SlipClass, int> classes;
    int systematic = 0;
    for (std::uint64_t seed = 1; seed <= kSeeds; ++seed) {
      const auto& hand = kHands[seed % kHands.size()];
      const Draw d = CopyOnce(seed, hand, rate);
      cells += static_cast<long>(d.exemplar.text.rows.size() * d.exemplar.text.columns.size());
      std::set<std::pair<int, std::string>> entries;
      for (const auto& s : d.slips) {
        ++classes[s.slip];
        if (s.detail.rfind("systematic", 0) == 0) ++systematic;
        if (s.slip == SlipClass::kLookAlike || s.slip == SlipClass::kOtherSymbol) {
          ++symbol;
          outside += s.slip == SlipClass::kOtherSymbol ? 1 : 0;
        }
        if (s.slip == SlipClass::kRowOmitted) {
          corrupted += static_cast<long>(d.exemplar.text.columns.size());
        } else if (!s.column.empty()) {
          entries.insert({s.origin_row, s.column});
        } else {
          ++corrupted;
        }
      }
      corrupted += static_cast<long>(entries.size());
    }
    CAPTURE(rate);
    Near(static_cast<double>(corrupted) / cells, rate, 0.15 * rate);
    Near(static_cast<double>(outside) / symbol, synth::CopyOptions{}.share_outside_list, 0.06);
    CHECK(systematic > 0);
    for (SlipClass k : synth::AllSlipClasses()) {
      CAPTURE(synth::SlipName(k));
      if (rate >= 0.1) CHECK(classes[k] > 0);
    }
  }
}
