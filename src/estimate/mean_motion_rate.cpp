// The mean-motion analysis's first steps: entries as items, whole turns
// restored, the radix, and the direct entries (the largest set of entries
// one rate reproduces under a rounding).
#include <algorithm>
#include <cmath>

#include "estimate/mean_motion_internal.hpp"
#include "estimate/observations.hpp"
#include "support/input_error.hpp"

namespace apograph::estimate {
namespace mean_motion {

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

}  // namespace mean_motion

namespace mean_motion {

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

}  // namespace mean_motion

}  // namespace apograph::estimate
