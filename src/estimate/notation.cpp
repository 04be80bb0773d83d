#include "estimate/notation.hpp"

#include <cmath>
#include <cstdio>

namespace apograph::estimate {

namespace {

std::string Decimal(double v, int digits = 6) {
  char buf[40];
  std::snprintf(buf, sizeof buf, "%.*g", digits, v);
  return buf;
}

/// The fewest places (up to `max`) that write v to within a part in 10^12.
int PlacesNeeded(double v, int max) {
  for (int p = 0; p < max; ++p) {
    if (std::fabs(Sexagesimal::FromDouble(v, p).ToDouble() - v) <=
        1e-12 * std::max(1.0, std::fabs(v)))
      return p;
  }
  return max;
}

}  // namespace

std::string NumberText(double v, int max_places) {
  if (!std::isfinite(v) || std::fabs(v) >= 1e9) return Decimal(v);
  return Sexagesimal::FromDouble(v, PlacesNeeded(v, max_places)).ToString();
}

std::string NumberWithDecimal(double v, int places) {
  if (!std::isfinite(v) || std::fabs(v) >= 1e9) return Decimal(v);
  const std::string trade = Sexagesimal::FromDouble(v, places).ToString();
  const std::string dec = Decimal(v, 10);
  if (trade == dec || PlacesNeeded(v, 2) < 2) return trade;
  return trade + " (" + dec + ")";
}

std::string Percent(double share) {
  char buf[16];
  std::snprintf(buf, sizeof buf, "%.0f%%", 100 * share);
  return buf;
}

std::string SignText(model::SignForm form) {
  switch (form) {
    case model::SignForm::kSigned:
      return "signed";
    case model::SignForm::kNegated:
      return "negated (negative where the geometry is positive)";
    case model::SignForm::kMagnitude:
      return "magnitudes (sign by the rubric)";
    case model::SignForm::kConventional:
      break;
  }
  return "as the model's convention";
}

std::string ArgumentText(const Transcription& table, std::size_t row) {
  const auto a = table.ArgumentInUse(row);
  return a ? a->ToString() : "-";
}

std::string ArgumentText(const Transcription& table, double argument) {
  const int places = std::max(table.argument.places, PlacesNeeded(argument, 4));
  return Sexagesimal::FromDouble(argument, places).ToString();
}

}  // namespace apograph::estimate
