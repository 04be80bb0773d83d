#include "deviation/explain.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "deviation/explain_internal.hpp"

namespace apograph::deviation {

const char* ToString(SlipClass cls) {
  switch (cls) {
    case SlipClass::kConfusion:
      return "confusion";
    case SlipClass::kTransposition:
      return "transposition";
    case SlipClass::kPlace:
      return "place";
    case SlipClass::kDisplacedRun:
      return "displaced-run";
    case SlipClass::kRepetition:
      return "repetition";
    case SlipClass::kBlank:
      return "blank";
    case SlipClass::kIllegible:
      return "illegible";
    case SlipClass::kComputational:
      return "computational";
    case SlipClass::kUnexplained:
      return "unexplained";
  }
  return "unexplained";
}

std::optional<SlipClass> SlipClassFromString(const std::string& text) {
  for (int i = 0; i <= static_cast<int>(SlipClass::kUnexplained); ++i) {
    if (text == ToString(static_cast<SlipClass>(i))) return static_cast<SlipClass>(i);
  }
  return std::nullopt;
}

bool IsCopyingSlip(SlipClass cls) { return cls != SlipClass::kComputational; }

namespace internal {

Digits ToDigits(const Sexagesimal& value, int places) {
  const Sexagesimal x = value.places() <= places ? value.Extended(places) : value.Rounded(places);
  Digits d;
  d.negative = x.negative();
  d.d.push_back(x.IntegerPart());
  for (int f : x.FractionDigits()) d.d.push_back(f);
  return d;
}

std::optional<Sexagesimal> FromDigits(const Digits& digits) {
  if (digits.d.empty() || digits.d[0] < 0 || digits.d[0] > 999) return std::nullopt;
  std::vector<int> fractions;
  for (std::size_t i = 1; i < digits.d.size(); ++i) {
    if (digits.d[i] < 0 || digits.d[i] > 59) return std::nullopt;
    fractions.push_back(static_cast<int>(digits.d[i]));
  }
  return Sexagesimal::FromParts(digits.negative, digits.d[0], fractions);
}

bool CellContext::Reaches(const Sexagesimal& reading) const {
  return std::fabs(DiffUnits(reading, computed, places)) <= options->tolerance + 1e-9;
}

double CellContext::Closeness(const Sexagesimal& reading) const {
  return reading == model_reading ? 1.0 : kNearOnly;
}

std::string CellContext::ModelClause(const Sexagesimal& reading) const {
  std::string out = "the model gives " + ModelText(computed, exact, places) +
                    ", the emended reading " + reading.ToString();
  if (std::isfinite(exact)) {
    const double off = std::fabs(reading.ToDouble() - exact) * std::pow(60.0, places);
    if (off <= 0.5 + 1e-9) return out + " is within half a unit";
    if (reading == model_reading) return out + " is its value after the author's rounding";
  } else if (reading == model_reading) {
    return out + " agrees with it";
  }
  return out + " is " + ToleranceWords(options->tolerance);
}

std::optional<Sexagesimal> CellContext::Neighbour(std::ptrdiff_t offset) const {
  const std::ptrdiff_t r = static_cast<std::ptrdiff_t>(row) + offset;
  if (r < 0 || r >= static_cast<std::ptrdiff_t>(table->rows.size())) return std::nullopt;
  const Cell& cell =
      table->rows[static_cast<std::size_t>(r)].cells[static_cast<std::size_t>(column)];
  if (cell.state != CellState::kRead || !cell.value) return std::nullopt;
  return cell.value;
}

}  // namespace internal

namespace {

using internal::CellContext;

std::vector<Explanation> Ranked(std::vector<Explanation> all) {
  std::stable_sort(all.begin(), all.end(),
                   [](const Explanation& a, const Explanation& b) { return a.score > b.score; });
  std::vector<Explanation> out;
  for (auto& e : all) {  // one candidate per (class, emendation)
    const bool seen = std::any_of(out.begin(), out.end(), [&](const Explanation& o) {
      return o.cls == e.cls && o.emendation.has_value() == e.emendation.has_value() &&
             (!o.emendation || o.emendation->Identical(*e.emendation));
    });
    if (!seen) out.push_back(std::move(e));
  }
  return out;
}

Explanation Unexplained(const CellContext& c) {
  Explanation e;
  e.cls = SlipClass::kUnexplained;
  char diff[32];
  std::snprintf(diff, sizeof diff, "%+g", std::round(c.diff * 100) / 100);
  e.evidence = "unexplained: the entry differs from the model (" +
               internal::ModelText(c.computed, c.exact, c.places) + ") by " + diff +
               " units, and no confusion of " + c.script->title() +
               ", transposition, moved place or repeated neighbour reaches the model's value " +
               internal::ToleranceWords(c.options->tolerance);
  return e;
}

}  // namespace

namespace internal {

Finding SingleFinding(const CellContext& c, const ColumnValues& values, const DiffColumn& diffs) {
  std::vector<Explanation> all;
  for (auto* gen :
       {ConfusionCandidates, TranspositionCandidates, PlaceCandidates, RepetitionCandidates}) {
    auto found = gen(c);
    all.insert(all.end(), found.begin(), found.end());
  }
  if (auto comp = ComputationalCandidate(c, diffs)) {
    if (comp->score >= kSharedComputational) {
      for (auto& e : all) e.score *= 0.5;  // shared departures are the author's
    }
    all.push_back(*comp);
  }
  if (all.empty()) all.push_back(Unexplained(c));
  Finding f = NewFinding(*c.table, values, c.places);
  f.explanations = Ranked(std::move(all));
  f.cells.push_back(MakeCell(*c.table, values, c.row, c.places));
  if (IsCopyingSlip(f.best().cls)) f.cells.back().emendation = f.best().emendation;
  return f;
}

}  // namespace internal

std::vector<Finding> ExplainColumn(const Transcription& table, const ColumnValues& values,
                                   const NumeralScript& script, const ExplainOptions& options) {
  const std::size_t col = static_cast<std::size_t>(values.column);
  const int places = table.columns.at(col).places;
  const internal::DiffColumn diffs = internal::Diffs(table, values, places);
  std::vector<bool> claimed(table.rows.size(), false);
  std::vector<Finding> out =
      internal::DisplacedRuns(table, values, script, options, diffs, claimed);
  for (std::size_t r = 0; r < table.rows.size() && r < values.computed.size(); ++r) {
    if (claimed[r] || !values.computed[r]) continue;
    const Cell& cell = table.rows[r].cells[col];
    if (cell.state != CellState::kRead) {
      out.push_back(internal::MissingFinding(table, values, r, places, options));
      continue;
    }
    if (!std::isfinite(diffs.diff[r]) || std::fabs(diffs.diff[r]) <= options.tolerance + 1e-9)
      continue;
    CellContext c = internal::MakeContext(table, values, script, options, r, places);
    c.diff = diffs.diff[r];
    out.push_back(internal::SingleFinding(c, values, diffs));
  }
  internal::MergeComputationalRuns(out, options);
  std::sort(out.begin(), out.end(), [](const Finding& a, const Finding& b) {
    return a.cells.front().row < b.cells.front().row;
  });
  return out;
}

}  // namespace apograph::deviation
