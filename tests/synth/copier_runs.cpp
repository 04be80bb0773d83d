// Slips over a run of consecutive rows of one column: the eye skipping a
// line, an error carried down a column, a place left out or moved in the
// first rows of a column (systematic).
#include <algorithm>

#include "copier.hpp"

namespace apograph::synth::internal {

// First row and length of a run of at most options.max_run rows (and at
// most `remaining` + 1 entries, so a run does not overshoot the rate much).
std::pair<int, int> Copier::RunRows(int remaining, bool at_start) {
  const int longest = std::max(2, std::min({options_.max_run, remaining + 1, Rows()}));
  const int length = rng_.Int(2, longest);
  const int first = at_start ? 0 : rng_.Int(0, Rows() - length);
  return {first, length};
}

int Copier::EyeSkip(int remaining) {
  if (Rows() < 4) return 0;
  const int c = rng_.Int(0, Columns() - 1);
  const int shift = rng_.Pick(std::vector<int>{1, 1, 2, -1});
  auto [first, length] = RunRows(remaining, false);
  const int run = runs_++;
  int changed = 0;
  for (int r = first; r < first + length; ++r) {
    const int from = r + shift;
    if (from < 0 || from >= Rows() || !Free(r, c) || Exemplar(from, c).raw == At(r, c).raw)
      continue;
    Slip s = Base(SlipClass::kEyeSkip, r, copy_.text.columns[static_cast<std::size_t>(c)].name);
    s.run = run;
    s.detail = shift > 0 ? "the entry " + std::to_string(shift) + " row(s) below"
                         : "the entry of the row above";
    SetCell(r, c, Exemplar(from, c), std::move(s));
    ++changed;
  }
  return changed;
}

int Copier::ConstantRun(int remaining) {
  const int c = rng_.Int(0, Columns() - 1);
  const int places = copy_.text.columns[static_cast<std::size_t>(c)].places;
  const int k = places >= 1 && rng_.Chance(0.5) ? 1 : 0;
  std::int64_t unit = 1;
  for (int j = k; j < places; ++j) unit *= 60;
  const int sign = rng_.Sign();
  const Sexagesimal amount = Sexagesimal::FromUnits(sign * unit, places);
  const std::string detail =
      std::string(sign > 0 ? "+1" : "-1") + " in place " + std::to_string(k) + " over the run";
  auto [first, length] = RunRows(remaining, false);
  const int run = runs_++;
  int changed = 0;
  for (int r = first; r < first + length; ++r) {
    if (!Free(r, c) || !Readable(r, c)) continue;
    auto ch = Added(*At(r, c).value, amount, detail);
    if (!ch) continue;
    ch->place = k;
    SetValue(r, c, *ch, SlipClass::kConstantRun, run);
    ++changed;
  }
  return changed;
}

int Copier::SystematicRun(SlipClass k, int remaining) {
  const int c = rng_.Int(0, Columns() - 1);
  auto [first, length] = RunRows(std::max(remaining, 3), rng_.Chance(options_.share_run_at_start));
  length = std::max(length, std::min(3, Rows()));
  const int run = runs_++;
  int changed = 0;
  for (int r = first; r < first + length && r < Rows(); ++r) {
    if (!Free(r, c) || !Readable(r, c)) continue;
    const Sexagesimal& v = *At(r, c).value;
    auto ch = k == SlipClass::kPlaceDropped ? LeadingPlaceLeftOut(v) : ShiftedDown(v);
    if (!ch) continue;
    ch->detail = "systematic: " + ch->detail;
    SetValue(r, c, *ch, k, run);
    ++changed;
  }
  return changed;
}

}  // namespace apograph::synth::internal
