#pragma once
// The mean-motion analysis's shared pieces (mean_motion_analysis.hpp is the
// interface): entries as items, the rate and radix shared by most entries
// (mean_motion_rate.cpp), used by the derivations and the verdict
// (mean_motion_analysis.cpp). Not for other files.

#include <cmath>
#include <cstdint>
#include <string>
#include <vector>

#include "estimate/mean_motion_analysis.hpp"
#include "estimate/notation.hpp"

namespace apograph::estimate::mean_motion {

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

struct Stab {
  int count = 0;
  Real lo = 0, hi = 0;
};

inline Real Wrap360(Real x) {
  x = std::fmod(x, Real(360));
  return x < 0 ? x + 360 : x;
}

inline std::string Fmt(const Sexagesimal& s) { return s.ToString(); }

/// An argument in the trade's notation (0;30, not 0.5).
inline std::string Arg(Real a) { return NumberText(static_cast<double>(a)); }

/// The rate interval shared by the most entries (closed intervals).
Stab MaxStab(const std::vector<Item>& items, Rounding rounding);
/// `value` brought to `places` (exactly) and reduced mod 360.
Sexagesimal AtPlaces(const Sexagesimal& value, int places, Rounding r);
/// The rate r (exact) reproduces entry `e` at argument ia.
bool Reproduces(const Sexagesimal& rate, const Sexagesimal& radix, std::int64_t ia,
                const MeanMotionEntry& e, int places, Rounding r);
/// Entries, items sorted by argument, radix and a first rate.
void Setup(const Transcription& table, int column, MeanMotionAnalysis& out,
           std::vector<Item>& items);
/// Radix (an entry at argument 0, or a least-squares intercept kept only
/// when it exceeds half a unit) and the unwrapped motions.
void RadixAndTurns(MeanMotionAnalysis& out, std::vector<Item>& items);
/// Direct entries under a rounding: the largest set sharing a rate.
/// Entries flagged in `set_aside` take no part (they are explained otherwise).
void Direct(MeanMotionAnalysis& out, std::vector<Item>& items, Rounding rounding,
            const std::vector<bool>& set_aside);

}  // namespace apograph::estimate::mean_motion
