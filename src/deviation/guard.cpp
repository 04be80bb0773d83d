#include "deviation/guard.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>

namespace apograph::deviation {

int FlaggedCells(const std::vector<Finding>& findings, int column) {
  int n = 0;
  for (const auto& f : findings) {
    const SlipClass cls = f.best().cls;
    const bool flagged = IsCopyingSlip(cls) || (f.kept_against_model && !f.argument_doubted);
    if (f.column != column || !flagged || cls == SlipClass::kBlank || cls == SlipClass::kIllegible)
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

namespace {

/// Rows [first, last] of one hill: the rounded difference has one sign and
/// is never zero.
struct Hill {
  std::size_t first = 0, last = 0;
};

std::vector<Hill> Hills(const std::vector<long>& k) {
  std::vector<Hill> out;
  for (std::size_t i = 0; i < k.size();) {
    if (k[i] == 0) {
      ++i;
      continue;
    }
    std::size_t j = i;
    while (j + 1 < k.size() && k[j + 1] != 0 && (k[j + 1] > 0) == (k[i] > 0)) ++j;
    out.push_back({i, j});
    i = j + 1;
  }
  return out;
}

/// A hill grown smoothly out of the author's rounding: it starts or ends
/// within `trend_start` units and never steps by more than `trend_step` plus
/// `trend_growth` of the smaller side.
bool Smooth(const std::vector<long>& k, const Hill& h, const GuardOptions& o) {
  if (std::labs(k[h.first]) > o.trend_start && std::labs(k[h.last]) > o.trend_start) return false;
  for (std::size_t i = h.first; i < h.last; ++i) {
    const double smaller = static_cast<double>(std::min(std::labs(k[i]), std::labs(k[i + 1])));
    if (static_cast<double>(std::labs(k[i + 1] - k[i])) > o.trend_step + o.trend_growth * smaller)
      return false;
  }
  return true;
}

/// A hill whose rows in `on` are proportional to the argument (k = b x,
/// least squares through the origin) within `trend_proportional` units, and
/// grow at least twofold: a mean motion's rate off, its arguments far apart.
bool Proportional(const std::vector<TrendRow>& rows, const std::vector<long>& k,
                  const std::vector<std::size_t>& on, const GuardOptions& o) {
  double kx = 0, xx = 0;
  long least = 0, most = 0;
  for (std::size_t i : on) {
    kx += static_cast<double>(k[i]) * rows[i].x;
    xx += rows[i].x * rows[i].x;
    least = least == 0 ? std::labs(k[i]) : std::min(least, std::labs(k[i]));
    most = std::max(most, std::labs(k[i]));
  }
  if (xx <= 0 || most < 2 * least) return false;
  const double b = kx / xx;
  for (std::size_t i : on) {
    if (std::fabs(static_cast<double>(k[i]) - b * rows[i].x) > o.trend_proportional) return false;
  }
  return true;
}

/// The running median of three rows (the ends kept), rounded to units.
std::vector<long> Smoothed(const std::vector<TrendRow>& rows) {
  std::vector<long> k;
  for (std::size_t i = 0; i < rows.size(); ++i) {
    double u = rows[i].units;
    if (i > 0 && i + 1 < rows.size()) {
      double three[] = {rows[i - 1].units, u, rows[i + 1].units};
      std::sort(three, three + 3);
      u = three[1];
    }
    // Saturate: a difference of billions of units says only "far off".
    k.push_back(std::lround(std::clamp(u, -1e9, 1e9)));
  }
  return k;
}

/// Rows of hill `h` beyond the rounding that most witnesses flag.
std::vector<std::size_t> OnHill(const std::vector<TrendRow>& rows, const std::vector<long>& k,
                                const Hill& h, const GuardOptions& o) {
  std::vector<std::size_t> on;
  for (std::size_t i = h.first; i <= h.last; ++i) {
    if (std::labs(k[i]) > o.trend_start && 2 * rows[i].flaggers > rows[i].readers) on.push_back(i);
  }
  return on;
}

}  // namespace

ReferenceVerdict GuardTrend(const std::vector<TrendRow>& rows, const GuardOptions& options) {
  ReferenceVerdict v;
  v.consensus = true;
  v.compared = static_cast<int>(rows.size());
  const std::vector<long> k = Smoothed(rows);
  const TrendRow* from = nullptr;
  const TrendRow* to = nullptr;
  long largest = 0;
  for (const auto& h : Hills(k)) {
    const auto on = OnHill(rows, k, h, options);
    if (static_cast<int>(on.size()) < options.trend_rows) continue;
    if (!Smooth(k, h, options) && !Proportional(rows, k, on, options)) continue;
    v.flagged += static_cast<int>(on.size());
    if (!from) from = &rows[on.front()];
    to = &rows[on.back()];
    for (std::size_t i : on) largest = std::max(largest, std::labs(k[i]));
  }
  if (v.flagged == 0) return v;
  v.explains = false;
  char what[320];
  std::snprintf(what, sizeof what,
                "%d rows that most witnesses flag (%s to %s, up to %ld units) lie where the "
                "tradition's difference from it grows smoothly out of the author's rounding",
                v.flagged, from->arg.c_str(), to->arg.c_str(), largest);
  v.why = std::string("the reference does not explain this column: ") + what +
          ", which is a model, parameters or practice slightly off rather than a copy's slips; "
          "no emendation is proposed (the model-free screen is shown instead)";
  return v;
}

ReferenceVerdict GuardAgreedRun(const std::vector<TrendRow>& rows, const GuardOptions& options) {
  ReferenceVerdict v;
  v.consensus = true;
  v.compared = static_cast<int>(rows.size());
  std::size_t first = 0, best_first = 0;
  int run = 0, best = 0;
  for (std::size_t i = 0; i < rows.size(); ++i) {
    const TrendRow& r = rows[i];
    if (r.readers < 2 || 2 * r.unexplained <= r.readers) {
      run = 0;
      continue;
    }
    if (run++ == 0) first = i;
    if (run > best) best = run, best_first = first;
    if (run == options.agreed_rows)
      v.flagged += run;
    else if (run > options.agreed_rows)
      ++v.flagged;
  }
  if (best < options.agreed_rows || v.flagged <= options.agreed_share * v.compared) {
    v.flagged = 0;
    return v;
  }
  v.explains = false;
  char what[320];
  std::snprintf(what, sizeof what,
                "%d of %d rows (%.0f%%), in runs of %d or more (the longest %s to %s, %d rows), "
                "where most witnesses read alike a value off it that no listed slip reaches",
                v.flagged, v.compared, 100.0 * v.flagged / v.compared, options.agreed_rows,
                rows[best_first].arg.c_str(),
                rows[best_first + static_cast<std::size_t>(best) - 1].arg.c_str(), best);
  v.why = std::string("the reference does not explain this column: ") + what +
          ", which is the author's text departing from the reference there (the reference "
          "misses those rows) rather than a copy's slips; no emendation is proposed (the "
          "model-free screen is shown instead)";
  return v;
}

}  // namespace apograph::deviation
