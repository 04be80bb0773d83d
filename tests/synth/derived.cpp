// Derived columns: differences (per row or per k rows, divided by the step,
// from the tabulated entries or from exact values) and sums (true = mean +
// equation). Rows beyond the table's ends take the source's value computed
// the same way (the author computed one entry more to difference the last).
#include <cmath>
#include <stdexcept>

#include "table_build.hpp"

namespace apograph::synth::internal {
namespace {

const ColumnKey& Source(const TableKey& table, const std::string& name) {
  const int i = table.ColumnIndex(name);
  if (i < 0) throw std::logic_error("synth: derived column from unknown column " + name);
  return table.columns[static_cast<std::size_t>(i)];
}

// The argument `offset` rows from row i (may lie outside the table).
double ArgumentAt(const ArgumentKey& a, std::size_t i, int offset) {
  const long long j = static_cast<long long>(i) + offset;
  if (j >= 0 && j < static_cast<long long>(a.values.size()))
    return a.values[static_cast<std::size_t>(j)].ToDouble();
  return a.values[i].ToDouble() + offset * a.step->ToDouble();
}

bool Inside(const ArgumentKey& a, std::size_t i, int offset) {
  const long long j = static_cast<long long>(i) + offset;
  return j >= 0 && j < static_cast<long long>(a.values.size());
}

// The source's written units at row i + offset (computed when outside).
std::int64_t TabulatedUnits(const ColumnKey& s, const ArgumentKey& a, std::size_t i, int offset) {
  if (Inside(a, i, offset))
    return static_cast<std::int64_t>(s.tabulated[i + static_cast<std::size_t>(offset)].units());
  return static_cast<std::int64_t>(Practised(s, ArgumentAt(a, i, offset)).units());
}

double Wrapped(double d) {
  while (d > 180) d -= 360;
  while (d <= -180) d += 360;
  return d;
}

std::int64_t WrappedUnits(std::int64_t d, int places) {
  const std::int64_t turn = 360 * Scale(places), half = turn / 2;
  while (d > half) d -= turn;
  while (d <= -half) d += turn;
  return d;
}

// units / divisor, to nearest with ties away from zero, exactly.
std::int64_t DivideRounded(std::int64_t num, std::int64_t divisor) {
  const std::int64_t q = num / divisor, r = num % divisor;
  if (2 * (r < 0 ? -r : r) >= divisor) return q + (num < 0 ? -1 : 1);
  return q;
}

void Difference(ColumnKey& c, const ColumnKey& s, const ArgumentKey& a) {
  const DerivedSpec& d = *c.derived;
  const int hi = d.forward ? d.span_rows : 0, lo = d.forward ? 0 : -d.span_rows;
  for (std::size_t i = 0; i < a.values.size(); ++i) {
    double exact = Formed(s, ArgumentAt(a, i, hi)) - Formed(s, ArgumentAt(a, i, lo));
    if (d.wrap_360) exact = Wrapped(exact);
    c.exact.push_back(exact / static_cast<double>(d.divisor));
    if (d.from_exact) {
      c.computed.push_back(
          FromUnits(ToUnits(exact / d.divisor, c.places, Rounding::kNearest), c.places));
      continue;
    }
    std::int64_t diff = TabulatedUnits(s, a, i, hi) - TabulatedUnits(s, a, i, lo);
    if (d.wrap_360) diff = WrappedUnits(diff, s.places);
    const std::int64_t num = diff * Scale(c.places - s.places);
    c.computed.push_back(FromUnits(DivideRounded(num, d.divisor), c.places));
  }
}

void Sum(ColumnKey& c, const ColumnKey& s1, const ColumnKey& s2, const ArgumentKey& a) {
  const DerivedSpec& d = *c.derived;
  for (std::size_t i = 0; i < a.values.size(); ++i) {
    const double arg = a.values[i].ToDouble();
    double exact = Evaluate(s1.function, arg) + Evaluate(s2.function, arg);
    if (d.wrap_360) exact = std::fmod(std::fmod(exact, 360.0) + 360.0, 360.0);
    c.exact.push_back(exact);
    std::int64_t units = 0;
    if (d.from_exact) {
      units = ToUnits(exact, c.places, Rounding::kNearest);
    } else {
      const double v = SignedFromTabulated(s1, i, arg) + SignedFromTabulated(s2, i, arg);
      units = ToUnits(v, c.places, Rounding::kNearest);  // exact: both are at <= c.places
    }
    if (d.wrap_360) units = Reduce360(units, c.places);
    c.computed.push_back(FromUnits(units, c.places));
  }
}

}  // namespace

void ComputeDerived(ColumnKey& c, const TableKey& table) {
  c.exact.clear();
  c.computed.clear();
  const DerivedSpec& d = *c.derived;
  if (d.kind == DerivedSpec::Kind::kDifference) {
    Difference(c, Source(table, d.from.at(0)), table.argument);
  } else {
    Sum(c, Source(table, d.from.at(0)), Source(table, d.from.at(1)), table.argument);
  }
  c.tabulated = c.computed;
}

}  // namespace apograph::synth::internal
