// The deviation stage's best case: one witness of a synthetic table, the
// true model given, slips drawn from the very confusion lists the explainer
// reads (corpora/scripts/). Recall of erroneous entries, precision of flags,
// and how often the proposed emendation restores the original reading. The
// realistic figures come from deviation_bench (traditions of the shared
// generator, model estimated, slips from its own lists).
//
//   cmake -S . -B build-bench -DAPOGRAPH_BENCH=ON -DAPOGRAPH_TESTS=OFF && cmake --build build-bench
//   ./build-bench/deviation_listed_bench [tables-per-setting]   (default 20; BENCH_DEBUG=1
//   prints every missed entry and every emendation that does not restore the original)
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <map>
#include <random>
#include <set>

#include "../deviation/synthetic.hpp"
#include "deviation/explain.hpp"
#include "deviation/numeral_script.hpp"

using namespace apograph;
using namespace apograph::deviation;
using apograph::testing::Synthetic;

namespace {

enum Kind { kConf, kTrans, kMoved, kZero, kRep, kRun, kBlank, kIllegible, kKinds };
const char* kKindNames[] = {"confusion",  "transposition", "place moved", "place omitted",
                            "repetition", "displaced run", "blank",       "illegible"};

struct Tally {
  int erroneous = 0, caught = 0, flagged = 0, flagged_real = 0, restored = 0,
      computational_rows = 0, computational_as_slip = 0, right_class = 0;
};

std::vector<std::int64_t> Places(const Sexagesimal& v) {
  std::vector<std::int64_t> d = {v.IntegerPart()};
  for (int f : v.FractionDigits()) d.push_back(f);
  return d;
}

std::optional<Sexagesimal> Build(const std::vector<std::int64_t>& d, bool negative) {
  if (d[0] < 0 || d[0] > 999) return std::nullopt;
  std::vector<int> f;
  for (std::size_t i = 1; i < d.size(); ++i) {
    if (d[i] < 0 || d[i] > 59) return std::nullopt;
    f.push_back(static_cast<int>(d[i]));
  }
  return Sexagesimal::FromParts(negative, d[0], f);
}

/// A copy of `original` with one symbol confused (the script's own confusions).
std::optional<Sexagesimal> Confuse(const Sexagesimal& original, const NumeralScript& script,
                                   std::mt19937& rng) {
  auto d = Places(original);
  std::uniform_int_distribution<std::size_t> pick_place(0, d.size() - 1);
  for (int attempt = 0; attempt < 10; ++attempt) {
    const std::size_t p = pick_place(rng);
    const int limit = p == 0 ? 1000 : 60;
    std::vector<int> copies;
    for (int c = 0; c < limit; ++c) {
      for (const auto& v : script.OriginalsOf(c, limit, 1)) {
        if (v.original == d[p]) copies.push_back(c);
      }
    }
    if (copies.empty()) continue;
    d[p] = copies[std::uniform_int_distribution<std::size_t>(0, copies.size() - 1)(rng)];
    return Build(d, original.negative());
  }
  return std::nullopt;
}

std::optional<Sexagesimal> Inject(Kind kind, const Synthetic& s, std::size_t row,
                                  const NumeralScript& script, std::mt19937& rng) {
  const Sexagesimal o = *s.table.rows[row].cells[0].value;
  const bool original_negative = o.negative();
  auto d = Places(o);
  switch (kind) {
    case kConf:
      return Confuse(o, script, rng);
    case kTrans:
      for (std::size_t p = d.size(); p-- > 0;) {
        const auto x = d[p];
        if (x >= 10 && x <= 99 && x % 10 != 0 && x / 10 != x % 10 &&
            (x % 10) * 10 + x / 10 < (p ? 60 : 1000)) {
          d[p] = (x % 10) * 10 + x / 10;
          return Build(d, original_negative);
        }
      }
      return std::nullopt;
    case kMoved: {
      if (d[0] > 59) return std::nullopt;
      d.insert(d.begin(), 0);
      d.pop_back();
      return Build(d, original_negative);
    }
    case kZero: {
      for (std::size_t p = 1; p < d.size(); ++p) {
        if (d[p] >= 10) {
          d[p] = 0;
          return Build(d, original_negative);
        }
      }
      return std::nullopt;
    }
    case kRep:
      return s.table.rows[row - 1].cells[0].value;
    default:
      return std::nullopt;
  }
}

void RunTable(Synthetic s, const NumeralScript& script, std::mt19937& rng, Tally& t,
              std::map<int, std::pair<int, int>>& per_kind) {
  const std::size_t n = s.table.rows.size();
  std::vector<Sexagesimal> original;
  // The author's own departures: smooth runs of +1 or -1 unit (kept, not errors).
  for (std::size_t r = 8; r + 4 < n; r += 37) {
    const int len = 2 + static_cast<int>(rng() % 3);
    const int sign = rng() % 2 ? 1 : -1;
    for (int k = 0; k < len; ++k) {
      auto v = *s.table.rows[r + k].cells[0].value +
               Sexagesimal::FromUnits(sign, s.table.columns[0].places);
      s.Set(r + k, v.ToString());
    }
  }
  for (std::size_t r = 0; r < n; ++r) original.push_back(*s.table.rows[r].cells[0].value);
  std::vector<int> kind_of(n, -1);
  std::vector<bool> computational(n, false);
  for (std::size_t r = 0; r < n; ++r) computational[r] = !(original[r] == *s.values.computed[r]);
  // Slips at random sites, at least 6 rows apart, clear of the author's runs.
  for (std::size_t r = 3; r + 8 < n; r += 6 + rng() % 6) {
    bool clear = true;
    for (std::size_t k = r - 2; k < r + 8; ++k) clear = clear && !computational[k];
    if (!clear) continue;
    const Kind kind = static_cast<Kind>(rng() % kKinds);
    if (kind == kRun) {
      const int len = 3 + static_cast<int>(rng() % 3), shift = rng() % 2 ? 1 : -1;
      for (int k = 0; k < len; ++k) {
        const std::size_t row = r + static_cast<std::size_t>(k);
        if (original[row + static_cast<std::size_t>(shift)] == original[row]) continue;
        s.Set(row, original[row + static_cast<std::size_t>(shift)].ToString());
        kind_of[row] = kRun;
      }
      r += static_cast<std::size_t>(len);
      continue;
    }
    if (kind == kBlank || kind == kIllegible) {
      s.Set(r, kind == kBlank ? "_" : "?");
      kind_of[r] = kind;
      continue;
    }
    auto copy = Inject(kind, s, r, script, rng);
    if (!copy || *copy == original[r]) continue;
    s.Set(r, copy->ToString());
    kind_of[r] = kind;
  }
  const auto findings = ExplainColumn(s.table, s.values, script);
  std::set<std::size_t> flagged;
  std::map<std::size_t, std::optional<Sexagesimal>> emendation;
  std::map<std::size_t, SlipClass> cls;
  for (const auto& f : findings) {
    for (const auto& c : f.cells) {
      if (std::getenv("BENCH_DEBUG") && kind_of[c.row] >= 0 &&
          (!c.emendation || !c.emendation->Identical(original[c.row])))
        std::printf("%s | %s | orig %s\n", kKindNames[kind_of[c.row]], f.Note("A").c_str(),
                    original[c.row].ToString().c_str());
      const bool changes =
          !c.emendation || !c.value || !c.emendation->Identical(c.value->Rounded(f.places));
      if (IsCopyingSlip(f.best().cls) && changes) {
        flagged.insert(c.row);
        emendation[c.row] = c.emendation;
        cls[c.row] = f.best().cls;
      }
    }
  }
  for (std::size_t r = 0; r < n; ++r) {
    const bool wrong = kind_of[r] >= 0;
    t.erroneous += wrong;
    if (computational[r]) {
      ++t.computational_rows;
      t.computational_as_slip += flagged.count(r) > 0;
    }
    if (wrong) ++per_kind[kind_of[r]].first;
    if (!flagged.count(r)) {
      if (wrong && std::getenv("BENCH_DEBUG"))
        std::printf("MISSED %s row %zu orig %s copy %s\n", kKindNames[kind_of[r]], r,
                    original[r].ToString().c_str(), s.Get(r).c_str());
      continue;
    }
    ++t.flagged;
    if (!wrong) continue;
    ++t.flagged_real;
    ++t.caught;
    static const SlipClass kExpected[] = {SlipClass::kConfusion,  SlipClass::kTransposition,
                                          SlipClass::kPlace,      SlipClass::kPlace,
                                          SlipClass::kRepetition, SlipClass::kDisplacedRun,
                                          SlipClass::kBlank,      SlipClass::kIllegible};
    t.right_class += cls[r] == kExpected[kind_of[r]];
    const auto& e = emendation[r];
    if (e && e->Identical(original[r])) {
      ++t.restored;
      ++per_kind[kind_of[r]].second;
    }
  }
}

}  // namespace

int main(int argc, char** argv) {
  const int per_setting = argc > 1 ? std::atoi(argv[1]) : 20;
  const std::string dir = DefaultScriptDir();
  std::mt19937 rng(20240611);
  Tally t;
  std::map<int, std::pair<int, int>> per_kind;
  const auto start = std::chrono::steady_clock::now();
  int tables = 0;
  for (const char* name :
       {"hindu-arabic", "greek-alphabetic", "hebrew-alphabetic", "arabic-abjad", "roman"}) {
    const NumeralScript script = FindNumeralScript(name, dir);
    for (int i = 0; i < per_setting; ++i) {
      RunTable(testing::MakeTable(testing::SolarEquation, 1, 1, 360, 2, name), script, rng, t,
               per_kind);
      RunTable(testing::MakeTable(testing::Chord, 1, 1, 180, 2, name), script, rng, t, per_kind);
      RunTable(testing::MakeTable(testing::SolarEquation, 1, 1, 180, 1, name), script, rng, t,
               per_kind);
      tables += 3;
    }
  }
  const double secs =
      std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  std::printf(
      "deviation_listed_bench (best case): %d synthetic tables (solar equation e=2;30 at 1 and 2 "
      "places, chords),\n"
      "5 numeral scripts, %d erroneous entries, %d rows of the author's own departures\n",
      tables, t.erroneous, t.computational_rows);
  std::printf("recall of erroneous entries:       %6.2f%% (%d/%d)\n",
              100.0 * t.caught / t.erroneous, t.caught, t.erroneous);
  std::printf("precision of flags:                %6.2f%% (%d/%d)\n",
              100.0 * t.flagged_real / t.flagged, t.flagged_real, t.flagged);
  std::printf("emendations restoring the original: %6.2f%% (%d/%d flagged erroneous entries)\n",
              100.0 * t.restored / t.caught, t.restored, t.caught);
  std::printf("class named as injected:            %6.2f%% (%d/%d)\n",
              100.0 * t.right_class / t.caught, t.right_class, t.caught);
  std::printf("author's departures flagged as slips: %d of %d rows\n", t.computational_as_slip,
              t.computational_rows);
  for (const auto& [k, v] : per_kind) {
    std::printf("  %-14s %5d entries, %5.1f%% restored\n", kKindNames[k], v.first,
                100.0 * v.second / v.first);
  }
  std::printf("time: %.2f s\n", secs);
  return 0;
}
