#include "deviation/guard.hpp"

#include <cstdio>

namespace apograph::deviation {

int FlaggedCells(const std::vector<Finding>& findings, int column) {
  int n = 0;
  for (const auto& f : findings) {
    const SlipClass cls = f.best().cls;
    if (f.column != column || !IsCopyingSlip(cls) || cls == SlipClass::kBlank ||
        cls == SlipClass::kIllegible)
      continue;
    n += static_cast<int>(f.cells.size());
  }
  return n;
}

ReferenceVerdict GuardReference(int compared, int flagged, const GuardOptions& options,
                                bool consensus) {
  ReferenceVerdict v;
  v.consensus = consensus;
  v.compared = compared;
  v.flagged = flagged;
  v.limit = consensus ? options.consensus_share : options.witness_share;
  const int least = consensus ? options.min_rows : options.min_cells;
  if (compared <= 0 || flagged < least || flagged <= v.limit * compared) return v;
  v.explains = false;
  char share[64];
  std::snprintf(share, sizeof share, "%d of %d %s (%.0f%%)", flagged, compared,
                consensus ? "rows" : "entries", 100.0 * flagged / compared);
  char limit[16];
  std::snprintf(limit, sizeof limit, "%.0f%%", 100 * v.limit);
  v.why = std::string("the reference does not explain this column: ") + share +
          (consensus ? " deviate from it in every witness"
                     : " deviate from it beyond the author's usual departure") +
          ", more than " + limit +
          ", which is a wrong model, parameters or practice rather than a copy's slips; no "
          "emendation is proposed (the model-free screen is shown instead)";
  return v;
}

}  // namespace apograph::deviation
