// The author's departures of a table as a pattern (which rows, how large,
// read by which witnesses), gathered from the witnesses' findings.
#include <algorithm>
#include <cmath>
#include <cstdio>

#include "pipeline/witness_findings.hpp"

namespace apograph::pipeline {

std::string DeparturePattern::Text() const {
  std::string out;
  for (std::size_t i = 0; i < rows.size();) {
    std::size_t j = i;
    while (j + 1 < rows.size() && rows[j + 1].units == rows[i].units) ++j;
    char units[32];
    std::snprintf(units, sizeof units, "%+g", rows[i].units);
    out += (out.empty() ? "" : ", ") + rows[i].arg + (j > i ? "-" + rows[j].arg : "") + " (" +
           units + (j > i ? " each)" : ")");
    i = j + 1;
  }
  return out;
}

std::vector<DeparturePattern> AuthorsDepartures(const std::vector<WitnessFindings>& findings) {
  std::vector<DeparturePattern> out;
  for (const auto& w : findings) {
    for (const auto& f : w.findings) {
      // A reading kept against the model (the tradition's, out of every
      // slip's reach) is kept, but is no departure of the author's habit.
      if (f.best().cls != deviation::SlipClass::kComputational || f.kept_against_model) continue;
      auto pattern = std::find_if(out.begin(), out.end(), [&](const DeparturePattern& p) {
        return p.column_name == f.column_name;
      });
      if (pattern == out.end()) pattern = out.insert(out.end(), {f.column_name, {}});
      for (const auto& c : f.cells) {
        if (!std::isfinite(c.diff_units)) continue;
        auto& rows = pattern->rows;
        auto same = std::find_if(rows.begin(), rows.end(), [&](const DeparturePattern::Row& r) {
          return r.arg == c.arg && r.units == std::round(c.diff_units * 100) / 100;
        });
        if (same == rows.end())
          rows.push_back({c.arg, std::round(c.diff_units * 100) / 100, {w.siglum}});
        else
          same->sigla.push_back(w.siglum);
      }
    }
  }
  auto order = [](const std::string& arg) {
    const auto v = Sexagesimal::Parse(arg);
    return v ? v->ToDouble() : 0.0;
  };
  for (auto& p : out) {
    std::stable_sort(p.rows.begin(), p.rows.end(),
                     [&](const DeparturePattern::Row& a, const DeparturePattern::Row& b) {
                       return order(a.arg) < order(b.arg);
                     });
  }
  return out;
}

}  // namespace apograph::pipeline
