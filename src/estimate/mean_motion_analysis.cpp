#include "estimate/mean_motion_analysis.hpp"

#include <algorithm>
#include <cmath>
#include <map>
#include <sstream>
#include <unordered_map>

#include "estimate/mean_motion_internal.hpp"
#include "estimate/observations.hpp"
#include "support/input_error.hpp"

namespace apograph::estimate {

const char* ToString(EntryOrigin origin) {
  switch (origin) {
    case EntryOrigin::kDirect:
      return "direct";
    case EntryOrigin::kMultiple:
      return "multiple";
    case EntryOrigin::kSum:
      return "sum";
    case EntryOrigin::kUnexplained:
      return "unexplained";
  }
  return "unexplained";
}

namespace {

using namespace mean_motion;

std::string TurnsText(const Sexagesimal& raw, const Sexagesimal& reduced) {
  const auto turns = (raw - reduced).IntegerPart() / 360;
  if (turns == 0) return Fmt(raw);
  return Fmt(raw) + ", less " + std::to_string(turns) + " x 360 = " + Fmt(reduced);
}

/// m x (entry j net of the radix) + radix, at entry i's places.
bool TryMultiple(MeanMotionAnalysis& out, const Item& i, const Item& j, const Sexagesimal& radix) {
  if (!j.integer || j.ia <= 0 || i.ia % j.ia != 0 || i.ia / j.ia < 2) return false;
  const std::int64_t m = i.ia / j.ia;
  auto& e = out.entries[i.entry];
  const auto& f = out.entries[j.entry];
  const Sexagesimal raw = (f.value - radix) * m + radix;
  const Sexagesimal reduced = AtPlaces(raw, out.places, out.rounding);
  if (!(reduced == e.value)) return false;
  e.origin = EntryOrigin::kMultiple;
  e.from = {f.row};
  e.evidence = Fmt(e.value) + " = " + std::to_string(m) + " x " + Fmt(f.value) + " (the entry at " +
               Arg(j.a) + ") = " + TurnsText(raw, reduced) + ": made from the rounded entry";
  if (e.direct) e.evidence += "; the rate itself would give " + Fmt(*e.direct);
  return true;
}

bool TrySum(MeanMotionAnalysis& out, const Item& i, const Item& j, const Item& l,
            const Sexagesimal& radix) {
  if (!j.integer || !l.integer || j.ia <= 0 || l.ia <= 0 || j.ia + l.ia != i.ia) return false;
  auto& e = out.entries[i.entry];
  const auto& f = out.entries[j.entry];
  const auto& g = out.entries[l.entry];
  const Sexagesimal raw = f.value + g.value - radix;
  const Sexagesimal reduced = AtPlaces(raw, out.places, out.rounding);
  if (!(reduced == e.value)) return false;
  e.origin = EntryOrigin::kSum;
  e.from = {f.row, g.row};
  e.evidence = Fmt(e.value) + " = " + Fmt(f.value) + " + " + Fmt(g.value) + " (entries at " +
               Arg(j.a) + " and " + Arg(l.a) + ") = " + TurnsText(raw, reduced) +
               ": made from rounded entries";
  if (e.direct) e.evidence += "; the rate itself would give " + Fmt(*e.direct);
  return true;
}

void Derivations(MeanMotionAnalysis& out, const std::vector<Item>& items) {
  const Sexagesimal radix = out.radix_present ? out.radix : Sexagesimal::FromUnits(0, out.places);
  std::unordered_map<std::int64_t, const Item*> by_arg;
  for (const auto& it : items) {
    if (it.integer) by_arg.emplace(it.ia, &it);
  }
  for (const auto& i : items) {
    auto& e = out.entries[i.entry];
    if (e.origin == EntryOrigin::kDirect || !i.integer) continue;
    bool found = false;
    for (auto j = items.rbegin(); j != items.rend() && !found; ++j) {
      if (&*j != &i) found = TryMultiple(out, i, *j, radix);
    }
    for (std::size_t j = 0; j < items.size() && !found && i.integer; ++j) {
      if (&items[j] == &i || !items[j].integer || 2 * items[j].ia > i.ia) continue;
      auto l = by_arg.find(i.ia - items[j].ia);
      if (l != by_arg.end() && l->second != &i) found = TrySum(out, i, items[j], *l->second, radix);
    }
    if (found) continue;
    const Real lo = (i.t - (out.rounding == Rounding::kNearest ? i.u / 2 : 0)) / i.a;
    const Real hi = (i.t + (out.rounding == Rounding::kNearest ? i.u / 2 : i.u)) / i.a;
    std::ostringstream o;
    o.precision(12);
    o << "not explained: reproducing " << Fmt(e.value) << " needs a rate in ["
      << static_cast<double>(lo) << ", " << static_cast<double>(hi)
      << "], outside the rates shared by the direct entries [" << out.rate_low << ", "
      << out.rate_high << "] (they give " << (e.direct ? Fmt(*e.direct) : std::string("-"))
      << "); it is no multiple of another entry and no sum of two";
    e.evidence = o.str();
    ++out.unexplained;
  }
}

/// The coarsest rate (fewest places) that reproduces every direct entry.
void RoundedRate(MeanMotionAnalysis& out, const std::vector<Item>& items) {
  const Sexagesimal radix = out.radix_present ? out.radix : Sexagesimal::FromUnits(0, out.places);
  for (int p = 1; p <= 8 && !out.rounded_rate; ++p) {
    const Real scale = static_cast<Real>(PowerOf60(p));
    const auto lo = static_cast<std::int64_t>(std::floor(out.rate_low * scale)) - 1;
    const auto hi = static_cast<std::int64_t>(std::ceil(out.rate_high * scale)) + 1;
    for (std::int64_t c = lo; c <= hi && c - lo < 200 && !out.rounded_rate; ++c) {
      const Sexagesimal rate = Sexagesimal::FromUnits(c, p);
      bool all = true;
      for (const auto& it : items) {
        const auto& e = out.entries[it.entry];
        if (e.origin != EntryOrigin::kDirect || it.a <= 0) continue;
        all = all && it.integer && Reproduces(rate, radix, it.ia, e, out.places, out.rounding);
      }
      if (all) out.rounded_rate = rate;
    }
  }
}

/// Regular arguments, and entries that are the first plus k times one unit
/// value: the most frequent difference of neighbouring entries. Successive
/// addition of a rounded unit value and multiplication of it give the same
/// entries in exact arithmetic, so one test serves both. A few entries off
/// the pattern (copyists' slips) do not hide it: it must hold for at least
/// three quarters of the entries.
void SuccessiveAddition(MeanMotionAnalysis& out, const std::vector<Item>& items) {
  if (items.size() < 3) return;
  const Real step = items[1].a - items[0].a;
  std::map<Sexagesimal::Units, int> votes;
  int best_votes = 0;
  std::optional<Sexagesimal> unit;
  for (std::size_t k = 1; k < items.size(); ++k) {
    if (std::fabs(static_cast<double>(items[k].a - items[k - 1].a - step)) > 1e-9) return;
    const auto& now = out.entries[items[k].entry].value;
    const auto& before = out.entries[items[k - 1].entry].value;
    const Sexagesimal diff = (now - before).Modulo(360).Extended(out.places);
    if (++votes[diff.units()] > best_votes) {
      best_votes = votes[diff.units()];
      unit = diff;
    }
  }
  // The first entry that follows the pattern anchors it.
  for (std::size_t anchor = 0; anchor + 1 < items.size(); ++anchor) {
    const Sexagesimal first = out.entries[items[anchor].entry].value;
    std::vector<std::string> off;
    for (std::size_t k = 0; k < items.size(); ++k) {
      const auto steps = static_cast<std::int64_t>(k) - static_cast<std::int64_t>(anchor);
      const Sexagesimal expected = (first + *unit * steps).Modulo(360);
      if (!(expected == out.entries[items[k].entry].value)) off.push_back(Arg(items[k].a));
    }
    if (off.size() * 4 > items.size()) continue;
    out.successive_addition = true;
    out.unit_value = unit;
    out.successive_exceptions = off;
    out.error_first = out.entries[items.front().entry].direct_diff_units;
    out.error_last = out.entries[items.back().entry].direct_diff_units;
    return;
  }
}

void Verdict(MeanMotionAnalysis& out) {
  std::ostringstream o;
  o.precision(12);
  int direct = 0, derived = 0;
  std::string derived_args, unexplained_args;
  for (const auto& e : out.entries) {
    if (e.origin == EntryOrigin::kDirect) ++direct;
    if (e.origin == EntryOrigin::kMultiple || e.origin == EntryOrigin::kSum) {
      ++derived;
      derived_args += (derived_args.empty() ? "" : ", ") + Arg(e.arg);
    }
    if (e.origin == EntryOrigin::kUnexplained)
      unexplained_args += (unexplained_args.empty() ? "" : ", ") + Arg(e.arg);
  }
  o << direct << " of " << out.entries.size() << " entries are reproduced by one rate ("
    << (out.rounding == Rounding::kNearest ? "rounded" : "truncated")
    << "): " << Fmt(out.rate_sexagesimal) << " per unit (any rate in [" << out.rate_low << ", "
    << out.rate_high << "]).";
  if (out.successive_addition && out.successive_exceptions.empty()) {
    o << " Every entry is the previous one plus " << Fmt(*out.unit_value)
      << ": successive addition of the rounded unit value (error against the shared rate "
      << out.error_first << " units at the first entry, " << out.error_last << " at the last).";
  } else if (out.rounded_rate && out.rounded_rate->places() <= out.places) {
    o << " The rounded value " << Fmt(*out.rounded_rate)
      << " reproduces them: multiplication of a rate rounded to the table's own places.";
  } else if (out.rounded_rate) {
    o << " The coarsest rate that reproduces them is " << Fmt(*out.rounded_rate) << " ("
      << out.rounded_rate->places() << " places): multiplication of a rate rounded to "
      << out.rounded_rate->places() << " places (or of a more precise one).";
  } else {
    o << " No rate of up to 8 places reproduces them exactly: multiplication of a precise rate.";
  }
  if (derived > 0) o << " Made from other rounded entries: " << derived_args << ".";
  if (out.unexplained > 0) o << " Unexplained: " << unexplained_args << ".";
  out.verdict = o.str();
  if (out.successive_addition && !out.successive_exceptions.empty()) {
    // The simplest account comes first; the entry-by-entry reading follows.
    std::string off;
    for (const auto& a : out.successive_exceptions) off += (off.empty() ? "" : ", ") + a;
    const std::size_t n = out.entries.size();
    out.verdict =
        "Built from the rounded unit value " + Fmt(*out.unit_value) + ": " +
        std::to_string(n - out.successive_exceptions.size()) + " of " + std::to_string(n) +
        " entries are the first plus k times it (successive addition, or multiplication, of the "
        "rounded value; the error against a precise rate grows along the table). Off the pattern, "
        "to be explained as slips or as the author's: " +
        off + ". Entry by entry: " + out.verdict;
  }
}

int Explained(const MeanMotionAnalysis& a) {
  return static_cast<int>(a.entries.size()) - a.unexplained;
}

/// Other rounded entries an entry (made directly) also equals.
void AlsoDerived(MeanMotionAnalysis& out, const std::vector<Item>& items) {
  MeanMotionAnalysis probe = out;
  for (auto& e : probe.entries) {
    if (e.origin == EntryOrigin::kDirect) e.origin = EntryOrigin::kUnexplained;
  }
  for (auto& e : probe.entries) e.evidence.clear();
  Derivations(probe, items);
  for (std::size_t i = 0; i < out.entries.size(); ++i) {
    auto& e = out.entries[i];
    const auto& q = probe.entries[i];
    if (e.origin == EntryOrigin::kDirect &&
        (q.origin == EntryOrigin::kMultiple || q.origin == EntryOrigin::kSum)) {
      e.evidence += "; it also equals " + q.evidence.substr(q.evidence.find('=') + 2);
      e.from = q.from;
    }
  }
}

/// Entries that equal a multiple or a sum of other tabulated entries.
std::vector<bool> MadeFromOthers(const MeanMotionAnalysis& base, const std::vector<Item>& items,
                                 Rounding r) {
  MeanMotionAnalysis probe = base;
  probe.rounding = r;
  Derivations(probe, items);
  std::vector<bool> out(probe.entries.size(), false);
  for (std::size_t i = 0; i < out.size(); ++i)
    out[i] = probe.entries[i].origin != EntryOrigin::kUnexplained;
  return out;
}

MeanMotionAnalysis Run(const MeanMotionAnalysis& base, std::vector<Item>& items, Rounding r,
                       bool derived_first) {
  MeanMotionAnalysis a = base;
  const std::vector<bool> aside = derived_first ? MadeFromOthers(base, items, r)
                                                : std::vector<bool>(base.entries.size(), false);
  Direct(a, items, r, aside);
  Derivations(a, items);
  AlsoDerived(a, items);
  RoundedRate(a, items);
  SuccessiveAddition(a, items);
  Verdict(a);
  return a;
}

}  // namespace

using namespace mean_motion;

MeanMotionAnalysis AnalyseMeanMotion(const Transcription& table, int column) {
  MeanMotionAnalysis base;
  std::vector<Item> items;
  Setup(table, column, base, items);
  RadixAndTurns(base, items);
  // Four readings: rounding or truncation; the rate taken from every entry,
  // or only from those that are not exact multiples or sums of other
  // entries (an exact coincidence is evidence that the entry was made from
  // the others). The reading that explains most entries wins; on a tie
  // rounding to nearest (common practice) before truncation, and the rate
  // from every entry before setting any aside. An equally good reading with
  // the other rounding is named in the verdict.
  std::vector<MeanMotionAnalysis> runs;
  for (Rounding r : {Rounding::kNearest, Rounding::kTruncate}) {
    for (bool derived_first : {false, true}) runs.push_back(Run(base, items, r, derived_first));
  }
  std::size_t win = 0;
  for (std::size_t i = 1; i < runs.size(); ++i) {
    if (Explained(runs[i]) > Explained(runs[win])) win = i;
  }
  MeanMotionAnalysis out = runs[win];
  for (const auto& other : runs) {
    if (other.rounding == out.rounding || Explained(other) != Explained(out)) continue;
    int direct = 0;
    for (const auto& e : other.entries) direct += e.origin == EntryOrigin::kDirect;
    std::ostringstream o;
    o.precision(12);
    o << " Equally good: " << (other.rounding == Rounding::kNearest ? "rounding" : "truncation")
      << " of a rate in [" << other.rate_low << ", " << other.rate_high << "] ("
      << Fmt(other.rate_sexagesimal) << ") makes " << direct
      << " entries direct and explains as many; the entries alone cannot tell the two apart.";
    out.verdict += o.str();
    break;
  }
  return out;
}

bool LooksLikeMeanMotion(const Transcription& table, int column) {
  const auto obs = CollectObservations(table, {column});
  if (obs.size() < 3) return false;
  for (const auto& o : obs) {
    if (o.value.negative() || o.value.ToDouble() >= 360) return false;
  }
  // Cheap test (no search for entries made from others): most entries
  // share one rate after unwrapping.
  try {
    MeanMotionAnalysis a;
    std::vector<Item> items;
    Setup(table, column, a, items);
    RadixAndTurns(a, items);
    const int shared = std::max(MaxStab(items, Rounding::kNearest).count,
                                MaxStab(items, Rounding::kTruncate).count);
    return shared * 10 >= static_cast<int>(items.size()) * 6 && shared >= 3;
  } catch (const InputError&) {  // fewer than two entries at positive arguments
    return false;
  }
}

}  // namespace apograph::estimate
