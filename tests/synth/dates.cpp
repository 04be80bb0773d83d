// Catalogue dates: manuscripts dated exactly, approximately, by century or
// part of one, or by a range of years (common practice); prints and modern
// editions by their year.
#include <string>

#include "tradition_build.hpp"

namespace apograph::synth::internal {
namespace {

std::string Ordinal(int n) {
  const char* suffix = "th";
  if (n % 100 < 11 || n % 100 > 13) {
    if (n % 10 == 1) suffix = "st";
    if (n % 10 == 2) suffix = "nd";
    if (n % 10 == 3) suffix = "rd";
  }
  return std::to_string(n) + suffix;
}

CatalogueDate Century(int year, Rng& rng) {
  const int c = year / 100 + 1, first = (c - 1) * 100;
  const std::string name = Ordinal(c) + " century";
  const std::size_t form = rng.Weighted({0.35, 0.4, 0.25});
  if (form == 0) return {year, name, first, first + 99};
  if (form == 1) {
    const int third = (year - first) / 34;  // 0-33 early, 34-67 mid, 68-99 late
    const char* words[] = {"early ", "mid-", "late "};
    const int from[] = {0, 34, 68}, to[] = {33, 67, 99};
    return {year, words[third] + name, first + from[third], first + to[third]};
  }
  const bool second = year - first >= 50;
  return {year, std::string(second ? "second" : "first") + " half of the " + name,
          second ? first + 50 : first, second ? first + 99 : first + 49};
}

}  // namespace

CatalogueDate DrawDate(int year, WitnessKind kind, Rng& rng) {
  const std::string exact = std::to_string(year);
  if (kind != WitnessKind::kManuscript) return {year, exact, year, year};
  switch (rng.Weighted({0.25, 0.2, 0.45, 0.1})) {
    case 0:
      return {year, exact, year, year};
    case 1: {
      const int round = (year + 2) / 5 * 5;
      return {year, "c. " + std::to_string(round), round - 10, round + 10};
    }
    case 2:
      return Century(year, rng);
    default: {
      const int decade = year / 10 * 10;
      return {year, std::to_string(decade) + "-" + std::to_string(decade + 10), decade,
              decade + 10};
    }
  }
}

}  // namespace apograph::synth::internal
