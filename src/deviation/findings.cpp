// Findings that span rows (displaced runs, smooth computational runs), blank
// and illegible cells, and the author's small departures.
#include <algorithm>
#include <cmath>
#include <cstdio>

#include "deviation/explain_internal.hpp"

namespace apograph::deviation::internal {
namespace {

const Cell& CellAt(const Transcription& t, std::size_t row, int column) {
  return t.rows[row].cells[static_cast<std::size_t>(column)];
}

Sexagesimal AtPlaces(const Sexagesimal& v, int places) {
  return v.places() <= places ? v.Extended(places) : v.Rounded(places);
}

std::string Signed(double units) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%+g", std::round(units * 100) / 100);
  return buf;
}

std::string UnitsWord(double units) { return std::fabs(units) == 1 ? " unit" : " units"; }

}  // namespace

DiffColumn Diffs(const Transcription& table, const ColumnValues& values, int places) {
  DiffColumn out;
  out.diff.assign(table.rows.size(), NAN);
  for (std::size_t r = 0; r < table.rows.size() && r < values.computed.size(); ++r) {
    const Cell& cell = CellAt(table, r, values.column);
    if (cell.state != CellState::kRead || !cell.value || !values.computed[r]) continue;
    out.diff[r] = DiffUnits(*cell.value, *values.computed[r], places);
  }
  return out;
}

CellContext MakeContext(const Transcription& table, const ColumnValues& values,
                        const NumeralScript& script, const ExplainOptions& options, std::size_t row,
                        int places) {
  CellContext c;
  c.table = &table;
  c.script = &script;
  c.options = &options;
  c.row = row;
  c.column = values.column;
  c.places = places;
  c.unit = table.columns[static_cast<std::size_t>(values.column)].unit;
  const Cell& cell = CellAt(table, row, values.column);
  if (cell.value) c.tabulated = AtPlaces(*cell.value, places);
  c.computed = *values.computed[row];
  c.model_reading = AtPlaces(c.computed, places);
  if (row < values.exact.size()) c.exact = values.exact[row];
  return c;
}

FindingCell MakeCell(const Transcription& table, const ColumnValues& values, std::size_t row,
                     int places) {
  FindingCell out;
  out.row = row;
  const Cell& arg = table.rows[row].argument;
  if (!arg.raw.empty()) {
    out.arg = arg.raw;
  } else if (auto expected = table.ExpectedArgument(row)) {
    out.arg = expected->ToString();
  } else {
    out.arg = "row " + std::to_string(row + 1);
  }
  const Cell& cell = CellAt(table, row, values.column);
  out.value = cell.value;
  out.tabulated = !cell.raw.empty() ? cell.raw : (cell.value ? cell.value->ToString() : "");
  if (row < values.computed.size()) out.computed = values.computed[row];
  out.diff_units = NAN;
  if (out.value && out.computed) out.diff_units = DiffUnits(*out.value, *out.computed, places);
  return out;
}

Finding NewFinding(const Transcription& table, const ColumnValues& values, int places) {
  Finding f;
  f.column = values.column;
  f.column_name = table.columns[static_cast<std::size_t>(values.column)].name;
  f.places = places;
  return f;
}

std::optional<Explanation> ComputationalCandidate(const CellContext& c, const DiffColumn& diffs) {
  const double tol = c.options->tolerance, limit = c.options->computational_units;
  const double ad = std::fabs(c.diff);
  if (ad > limit + 1e-9) return std::nullopt;
  bool shared = false;
  for (std::ptrdiff_t off : {-1, 1}) {
    const std::ptrdiff_t j = static_cast<std::ptrdiff_t>(c.row) + off;
    if (j < 0 || j >= static_cast<std::ptrdiff_t>(diffs.diff.size())) continue;
    const double d = diffs.diff[static_cast<std::size_t>(j)];
    if (std::isfinite(d) && std::fabs(d) > tol + 1e-9 && std::fabs(d) <= limit + 1e-9 &&
        (d > 0) == (c.diff > 0)) {
      shared = true;
    }
  }
  bool boundary = false;
  if (std::isfinite(c.exact) && ad <= 1 + 1e-9) {
    boundary = std::fabs(c.tabulated.ToDouble() - c.exact) * std::pow(60.0, c.places) <= 0.75;
  }
  Explanation e;
  e.cls = SlipClass::kComputational;
  const std::string what = "a departure of " + Signed(c.diff) + UnitsWord(c.diff);
  const std::string model = "the model gives " + ModelText(c.computed, c.exact, c.places);
  if (shared) {
    e.score = ad <= 1 + 1e-9 ? 0.85 : kSharedComputational;
    e.evidence =
        what +
        ", shared by a neighbouring entry: the author's computation, not a copyist's slip; " +
        model + "; keep the reading";
  } else if (boundary) {
    e.score = 0.65;  // below kSharedComputational: does not weaken the slips
    e.evidence =
        what + "; " + model +
        ", close to the rounding boundary, so a slightly different computation by the author "
        "explains it; keep the reading";
  } else {
    e.score = ad <= 1 + 1e-9 ? 0.45 : 0.25;
    e.evidence = "a small " + what.substr(2) + ", perhaps the author's computation; " + model;
  }
  return e;
}

Finding MissingFinding(const Transcription& table, const ColumnValues& values, std::size_t row,
                       int places, const ExplainOptions& options) {
  (void)options;
  const Cell& cell = CellAt(table, row, values.column);
  Finding f = NewFinding(table, values, places);
  f.cells.push_back(MakeCell(table, values, row, places));
  Explanation e;
  e.cls = cell.state == CellState::kBlank ? SlipClass::kBlank : SlipClass::kIllegible;
  e.score = kPriorBlank;
  e.emendation = AtPlaces(*values.computed[row], places);
  const std::string what = cell.state == CellState::kBlank ? "nothing written in the witness"
                           : cell.state == CellState::kPartial
                               ? "partly illegible in the witness ('" + cell.raw + "')"
                               : "illegible in the witness ('" + cell.raw + "')";
  const double exact = row < values.exact.size() ? values.exact[row] : NAN;
  e.evidence = what + "; the model gives " + ModelText(*values.computed[row], exact, places) +
               ", supplied as " + e.emendation->ToString();
  f.cells.back().emendation = e.emendation;
  f.explanations.push_back(std::move(e));
  return f;
}

void MergeComputationalRuns(std::vector<Finding>& findings, const ExplainOptions& options) {
  (void)options;
  std::sort(findings.begin(), findings.end(), [](const Finding& a, const Finding& b) {
    return a.cells.front().row < b.cells.front().row;
  });
  std::vector<Finding> out;
  for (auto& f : findings) {
    const bool comp = f.best().cls == SlipClass::kComputational && f.cells.size() == 1;
    if (comp && !out.empty()) {
      Finding& last = out.back();
      const bool last_comp = last.best().cls == SlipClass::kComputational;
      const bool next_row = last.cells.back().row + 1 == f.cells.front().row;
      const bool same_sign = (last.cells.back().diff_units > 0) == (f.cells.front().diff_units > 0);
      if (last_comp && next_row && same_sign) {
        last.cells.push_back(f.cells.front());
        std::string diffs;
        for (const auto& c : last.cells)
          diffs += (diffs.empty() ? "" : ", ") + Signed(c.diff_units);
        Explanation& e = last.explanations.front();
        e.score = std::max(e.score, 0.85);
        e.evidence =
            std::to_string(last.cells.size()) + " consecutive entries depart from the model by " +
            diffs +
            " units, all of one sign: a smooth run left by the author's computation, not a "
            "copyist's slip; keep the readings";
        continue;
      }
    }
    out.push_back(std::move(f));
  }
  findings = std::move(out);
}

}  // namespace apograph::deviation::internal
