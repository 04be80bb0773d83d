// The author's computing practice on a model column. Order (the
// generator's own): function -> sign form (magnitude, flip, displacement)
// -> grid interpolation (nodes rounded first when asked) -> rounding or
// truncation to the column's places -> reduction modulo 360.
#include <cmath>
#include <stdexcept>

#include "table_build.hpp"

namespace apograph::synth::internal {

bool SignMatters(const Function& f) {
  return CanChangeSign(f.family) || (f.family == Family::kTrueSun && f.variant == "equation");
}

std::int64_t Scale(int places) {
  if (places < 0 || places > 8) throw std::logic_error("synth: places out of range");
  std::int64_t s = 1;
  for (int i = 0; i < places; ++i) s *= 60;
  return s;
}

std::int64_t ToUnits(long double x, int places, Rounding rounding) {
  const long double scaled = x * static_cast<long double>(Scale(places));
  return static_cast<std::int64_t>(rounding == Rounding::kTruncate ? truncl(scaled)
                                                                   : roundl(scaled));
}

Sexagesimal FromUnits(std::int64_t units, int places) {
  return Sexagesimal::FromUnits(units, places);
}

std::int64_t Reduce360(std::int64_t units, int places) {
  const std::int64_t turn = 360 * Scale(places);
  return ((units % turn) + turn) % turn;
}

double Formed(const ColumnKey& c, double arg) {
  const double f = Evaluate(c.function, arg);
  const double s = c.negated ? -f : f;
  switch (c.sign_form) {
    case SignForm::kMagnitude:
      return std::fabs(f);
    case SignForm::kDisplaced:
      return c.displacement->ToDouble() + s;
    case SignForm::kSigned:
      return s;
    case SignForm::kAsComputed:
      return f;
  }
  return f;
}

namespace {

// The value at a grid node, rounded when the author rounded his nodes.
long double Node(const ColumnKey& c, double arg) {
  const double v = Formed(c, arg);
  if (!c.practice.round_nodes) return v;
  return static_cast<long double>(ToUnits(v, c.places, c.practice.rounding)) / Scale(c.places);
}

long double Interpolated(const ColumnKey& c, double arg) {
  const double g = c.practice.grid, o = c.practice.grid_origin;
  const double j = std::floor((arg - o) / g + 1e-9);
  const double lo = o + j * g;
  if (std::fabs(arg - lo) < 1e-9) return Node(c, arg);
  const long double a = Node(c, lo), b = Node(c, lo + g);
  return a + (b - a) * (arg - lo) / g;
}

// Runs of one sign of the function over the rows (zeros join the run
// before them).
std::vector<RubricRange> Rubric(const ColumnKey& c, const ArgumentKey& argument) {
  std::vector<RubricRange> out;
  for (std::size_t i = 0; i < argument.values.size(); ++i) {
    const double f = Evaluate(c.function, argument.values[i].ToDouble());
    const int sign = (c.negated ? -f : f) < 0 ? -1 : 1;
    if (std::fabs(f) < 1e-12 && !out.empty()) {
      out.back().to = argument.values[i];
      continue;
    }
    if (out.empty() || out.back().sign != sign) {
      out.push_back({argument.values[i], argument.values[i], sign});
    } else {
      out.back().to = argument.values[i];
    }
  }
  return out;
}

}  // namespace

Sexagesimal Practised(const ColumnKey& c, double arg) {
  const long double v = c.practice.grid > 0 ? Interpolated(c, arg) : Formed(c, arg);
  std::int64_t units = ToUnits(v, c.places, c.practice.rounding);
  if (c.modulo_360) units = Reduce360(units, c.places);
  return FromUnits(units, c.places);
}

double SignedFromTabulated(const ColumnKey& c, std::size_t row, double arg) {
  const double t = c.tabulated[row].ToDouble();
  switch (c.sign_form) {
    case SignForm::kMagnitude:
      return Evaluate(c.function, arg) < 0 ? -t : t;
    case SignForm::kDisplaced:
      return c.negated ? -(t - c.displacement->ToDouble()) : t - c.displacement->ToDouble();
    case SignForm::kSigned:
      return c.negated ? -t : t;
    case SignForm::kAsComputed:
      return t;
  }
  return t;
}

void ComputeModelColumn(ColumnKey& c, const ArgumentKey& argument) {
  c.exact.clear();
  c.computed.clear();
  for (const auto& a : argument.values) {
    double x = Formed(c, a.ToDouble());
    if (c.modulo_360) x = std::fmod(std::fmod(x, 360.0) + 360.0, 360.0);
    c.exact.push_back(x);
    c.computed.push_back(Practised(c, a.ToDouble()));
  }
  c.tabulated = c.computed;
  if (SignMatters(c.function)) {
    c.rubric = Rubric(c, argument);
  }
}

void AddDepartures(ColumnKey& c, Rng& rng, const TableOptions& o) {
  for (std::size_t i = 0; i < c.tabulated.size(); ++i) {
    if (!rng.Chance(o.departure_rate)) continue;
    const int units = rng.Sign() * (rng.Chance(o.share_departure_two) ? 2 : 1);
    const auto before = static_cast<std::int64_t>(c.tabulated[i].units());
    std::int64_t v = before + units;
    if (c.modulo_360) v = Reduce360(v, c.places);
    // A departure never changes an entry's sign (a magnitude stays one).
    if ((v < 0) != (before < 0)) continue;
    c.tabulated[i] = FromUnits(v, c.places);
    c.departures.push_back({static_cast<int>(i), units});
  }
}

}  // namespace apograph::synth::internal
