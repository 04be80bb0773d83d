#include "estimate/mean_motion_analysis.hpp"

#include <algorithm>
#include <cmath>
#include <map>
#include <sstream>
#include <unordered_map>

#include "estimate/notation.hpp"
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

using Real = long double;

struct Item {
  std::size_t entry = 0;  ///< index into MeanMotionAnalysis::entries
  Real a = 0;             ///< argument
  Real v = 0;             ///< tabulated value
  Real t = 0;             ///< unwrapped motion net of the radix
  Real u = 0;             ///< unit of the last place
  bool integer = false;
  std::int64_t ia = 0;
};

Real Wrap360(Real x) {
  x = std::fmod(x, Real(360));
  return x < 0 ? x + 360 : x;
}

std::string Fmt(const Sexagesimal& s) { return s.ToString(); }

/// An argument in the trade's notation (0;30, not 0.5).
std::string Arg(Real a) { return NumberText(static_cast<double>(a)); }

/// Restores whole turns by argument and sets radix and rate estimates.
void Unwrap(std::vector<Item>& items, Real radix, Real rate,
            std::vector<MeanMotionEntry>& entries) {
  Real best_a = 0;
  for (auto& it : items) {
    const Real k = std::round((radix + rate * it.a - it.v) / 360);
    it.t = it.v + 360 * k - radix;
    entries[it.entry].turns = static_cast<int>(k);
    if (it.a > best_a && it.a > 0) {
      rate = it.t / it.a;
      best_a = it.a;
    }
  }
}

struct Stab {
  int count = 0;
  Real lo = 0, hi = 0;
};

/// The rate interval shared by the most entries (closed intervals).
Stab MaxStab(const std::vector<Item>& items, Rounding rounding) {
  std::vector<std::pair<Real, int>> ev;
  for (const auto& it : items) {
    if (it.a <= 0) continue;
    const Real lo = rounding == Rounding::kNearest ? it.t - it.u / 2 : it.t;
    const Real hi = rounding == Rounding::kNearest ? it.t + it.u / 2 : it.t + it.u;
    ev.push_back({lo / it.a, -1});  // opening sorts first at equal positions
    ev.push_back({hi / it.a, +1});
  }
  std::sort(ev.begin(), ev.end());
  Stab best;
  int c = 0;
  for (std::size_t i = 0; i < ev.size(); ++i) {
    c -= ev[i].second;
    if (ev[i].second < 0 && c > best.count) {
      best.count = c;
      best.lo = ev[i].first;
      best.hi = i + 1 < ev.size() ? ev[i + 1].first : ev[i].first;
    }
  }
  return best;
}

bool InInterval(const Item& it, Rounding r, Real lo, Real hi) {
  const Real a = r == Rounding::kNearest ? it.t - it.u / 2 : it.t;
  const Real b = r == Rounding::kNearest ? it.t + it.u / 2 : it.t + it.u;
  const Real mid = (lo + hi) / 2;
  return a / it.a <= mid && mid <= b / it.a;
}

/// `value` brought to `places` (exactly) and reduced mod 360.
Sexagesimal AtPlaces(const Sexagesimal& value, int places, Rounding r) {
  const Sexagesimal v = value.places() > places ? value.Rounded(places, r) : value.Extended(places);
  return v.Modulo(360);
}

/// The rate r (exact) reproduces entry `e` at argument ia.
bool Reproduces(const Sexagesimal& rate, const Sexagesimal& radix, std::int64_t ia,
                const MeanMotionEntry& e, int places, Rounding r) {
  return AtPlaces(rate * ia + radix, places, r) == e.value;
}

}  // namespace

namespace {

/// Entries, items sorted by argument, radix and a first rate.
void Setup(const Transcription& table, int column, MeanMotionAnalysis& out,
           std::vector<Item>& items) {
  const auto obs = CollectObservations(table, {column});
  if (obs.size() < 2) {
    throw InputError::ForOption(
        "--column", ExpectedFound("a mean-motion column with two or more readable entries",
                                  table.columns.at(static_cast<std::size_t>(column)).name));
  }
  out.column = column;
  out.places = obs.front().places;
  for (const auto& o : obs) {
    MeanMotionEntry e;
    e.row = o.row;
    e.arg = o.arg;
    e.value = o.value;
    Item it;
    it.entry = out.entries.size();
    it.a = o.arg;
    it.v = static_cast<Real>(o.value.units()) / static_cast<Real>(PowerOf60(o.places));
    it.u = 1 / static_cast<Real>(PowerOf60(o.places));
    it.integer = std::fabs(o.arg - std::round(o.arg)) < 1e-9;
    it.ia = static_cast<std::int64_t>(std::llround(o.arg));
    out.places = std::max(out.places, o.places);
    out.entries.push_back(e);
    items.push_back(it);
  }
  std::sort(items.begin(), items.end(), [](const Item& x, const Item& y) { return x.a < y.a; });
}

/// The median of entry - rate x argument over the entries, each reduced
/// near the first (a robust radix for unwrapping).
Real MedianRadix(const std::vector<const Item*>& pos, Real rate) {
  std::vector<Real> r;
  const Real first = Wrap360(pos[0]->v - rate * pos[0]->a);
  for (const auto* it : pos) {
    Real x = Wrap360(it->v - rate * it->a);
    if (x - first > 180) x -= 360;
    if (first - x > 180) x += 360;
    r.push_back(x);
  }
  std::nth_element(r.begin(), r.begin() + static_cast<std::ptrdiff_t>(r.size() / 2), r.end());
  return Wrap360(r[r.size() / 2]);
}

/// Two lines through the unwrapped values (it->t + radix): least squares,
/// and a robust one (the median slope over baselines of half the table,
/// the median intercept), which a slip does not pull. As (rate, intercept).
std::vector<std::pair<Real, Real>> Lines(const std::vector<const Item*>& pos, Real radix) {
  Real sa = 0, sv = 0, saa = 0, sav = 0, n = 0;
  for (const auto* it : pos) {
    const Real v = it->t + radix;
    sa += it->a, sv += v, saa += it->a * it->a, sav += it->a * v, n += 1;
  }
  const Real rate = (n * sav - sa * sv) / (n * saa - sa * sa);
  std::vector<std::pair<Real, Real>> out = {{rate, (sv - rate * sa) / n}};
  const std::size_t h = pos.size() / 2;
  std::vector<Real> slopes, intercepts;
  for (std::size_t i = 0; i + h < pos.size(); ++i) {
    if (pos[i + h]->a > pos[i]->a)
      slopes.push_back((pos[i + h]->t - pos[i]->t) / (pos[i + h]->a - pos[i]->a));
  }
  if (slopes.empty()) return out;
  std::nth_element(slopes.begin(), slopes.begin() + static_cast<std::ptrdiff_t>(slopes.size() / 2),
                   slopes.end());
  const Real robust = slopes[slopes.size() / 2];
  for (const auto* it : pos) intercepts.push_back(it->t + radix - robust * it->a);
  std::nth_element(intercepts.begin(),
                   intercepts.begin() + static_cast<std::ptrdiff_t>(intercepts.size() / 2),
                   intercepts.end());
  out.push_back({robust, intercepts[intercepts.size() / 2]});
  return out;
}

/// No radix unless an intercept (of either line, at the table's places)
/// lets more entries share one rate than none does.
void ChooseRadix(MeanMotionAnalysis& out, std::vector<Item>& items,
                 const std::vector<const Item*>& pos, Real radix) {
  auto shared = [&](Real r, Real rate) {
    Unwrap(items, r, rate, out.entries);
    return std::max(MaxStab(items, Rounding::kNearest).count,
                    MaxStab(items, Rounding::kTruncate).count);
  };
  const auto lines = Lines(pos, radix);
  Real best_rate = lines.front().first;
  int best = shared(0, best_rate);
  std::optional<Sexagesimal> chosen;
  for (const auto& [rate, intercept] : lines) {
    const Sexagesimal fitted = Sexagesimal::FromDouble(static_cast<double>(intercept), out.places);
    if (fitted.is_zero() || pos.size() <= 2) continue;
    const int n = shared(static_cast<Real>(fitted.ToDouble()), rate);
    if (n > best) best = n, chosen = fitted, best_rate = rate;
  }
  if (chosen) {
    out.radix = *chosen;
    out.radix_present = true;
  }
  Unwrap(items, chosen ? static_cast<Real>(chosen->ToDouble()) : 0, best_rate, out.entries);
}

/// Radix (an entry at argument 0, or a least-squares intercept kept only
/// when it exceeds half a unit) and the unwrapped motions.
void RadixAndTurns(MeanMotionAnalysis& out, std::vector<Item>& items) {
  std::vector<const Item*> pos;
  for (const auto& it : items) {
    if (it.a > 0) pos.push_back(&it);
    if (it.a == 0) {
      out.radix = out.entries[it.entry].value;
      out.radix_present = true;
    }
  }
  if (pos.size() < 2)
    throw InputError::ForOption("--column",
                                "expected two entries at positive arguments, found fewer");
  // A first rate: the median of the rates between neighbouring entries (a
  // slip in the first entries must not set it).
  std::vector<Real> local;
  for (std::size_t i = 1; i < pos.size(); ++i) {
    if (pos[i]->a > pos[i - 1]->a)
      local.push_back(Wrap360(pos[i]->v - pos[i - 1]->v) / (pos[i]->a - pos[i - 1]->a));
  }
  if (local.empty()) local.push_back(Wrap360(pos[1]->v - pos[0]->v) / pos[1]->a);
  std::nth_element(local.begin(), local.begin() + static_cast<std::ptrdiff_t>(local.size() / 2),
                   local.end());
  const Real rate0 = local[local.size() / 2];
  Real radix =
      out.radix_present ? static_cast<Real>(out.radix.ToDouble()) : MedianRadix(pos, rate0);
  if (radix > 180) radix -= 360;
  Unwrap(items, radix, rate0, out.entries);
  if (!out.radix_present) ChooseRadix(out, items, pos, radix);
}

/// Direct entries under a rounding: the largest set sharing a rate.
/// Entries flagged in `set_aside` take no part (they are explained otherwise).
void Direct(MeanMotionAnalysis& out, std::vector<Item>& items, Rounding rounding,
            const std::vector<bool>& set_aside) {
  out.rounding = rounding;
  std::vector<Item> voters;
  for (const auto& it : items) {
    if (!set_aside[it.entry]) voters.push_back(it);
  }
  const Stab s = MaxStab(voters, rounding);
  out.rate_low = static_cast<double>(s.lo);
  out.rate_high = static_cast<double>(s.hi);
  Real saa = 0, sat = 0, umax = 0;
  for (const auto& it : items) {
    auto& e = out.entries[it.entry];
    if (it.a == 0) {
      e.origin = EntryOrigin::kDirect;
      e.evidence = "the radix (value at argument 0)";
      continue;
    }
    if (set_aside[it.entry] || !InInterval(it, out.rounding, s.lo, s.hi)) continue;
    e.origin = EntryOrigin::kDirect;
    const Real off = out.rounding == Rounding::kTruncate ? it.u / 2 : 0;
    saa += it.a * it.a;
    sat += it.a * (it.t + off);
    umax = std::max(umax, it.u);
  }
  out.rate = static_cast<double>(sat / saa);
  out.rate_stderr = static_cast<double>(umax / std::sqrt(Real(12)) / std::sqrt(saa));
  const Real mid = (s.lo + s.hi) / 2, half = (s.hi - s.lo) / 2;
  int p = 1;
  while (p < 8 && 1 / static_cast<Real>(PowerOf60(p)) > half) ++p;
  out.rate_sexagesimal = Sexagesimal::FromDouble(static_cast<double>(mid), std::max(p, out.places));
  const Sexagesimal radix = out.radix_present ? out.radix : Sexagesimal::FromUnits(0, out.places);
  for (const auto& it : items) {
    auto& e = out.entries[it.entry];
    if (it.a <= 0) continue;
    const double exact = static_cast<double>(mid * it.a) + radix.ToDouble();
    e.direct = Sexagesimal::FromDouble(exact, out.places, out.rounding).Modulo(360);
    e.direct_diff_units = DiffUnits(e.value, *e.direct, out.places);
    const double full = 360.0 * std::pow(60.0, out.places);
    e.direct_diff_units -= full * std::round(e.direct_diff_units / full);
    if (e.origin == EntryOrigin::kDirect) {
      e.evidence = "reproduced by the shared rate: " + Arg(it.a) + " x rate" +
                   (out.radix_present ? " + radix" : "") + " gives " + Fmt(*e.direct);
    }
  }
}

}  // namespace

namespace {

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
