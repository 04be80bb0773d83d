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
    case SlipClass::kSystematic:
      return "systematic";
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

std::vector<SlipClass> Finding::Undecided() const {
  // Judgement: the class shares that rank two stories of one reading
  // (scoring.hpp) are not known to better than a factor of two, and the
  // reading fits both alike, so within that factor the evidence does not
  // decide between them.
  constexpr double kUndecided = 2;
  std::vector<SlipClass> out;
  const Explanation& b = best();
  if (!IsCopyingSlip(b.cls) || !b.emendation) return out;
  for (std::size_t i = 1; i < explanations.size(); ++i) {
    const Explanation& e = explanations[i];
    const bool same = e.emendation && e.emendation->Identical(*b.emendation);
    if (!same || !IsCopyingSlip(e.cls) || e.cls == b.cls || e.score * kUndecided < b.score ||
        std::find(out.begin(), out.end(), e.cls) != out.end())
      continue;
    out.push_back(e.cls);
  }
  return out;
}

namespace internal {

Digits ToDigits(const Sexagesimal& value, int places) {
  const Sexagesimal x = AtPlaces(value, places);
  Digits d;
  d.negative = x.negative();
  d.d.push_back(x.IntegerPart());
  for (int f : x.FractionDigits()) d.d.push_back(f);
  return d;
}

std::optional<Sexagesimal> FromDigits(const Digits& digits) {
  if (digits.d.empty() || digits.d[0] < 0) return std::nullopt;
  std::vector<int> fractions;
  for (std::size_t i = 1; i < digits.d.size(); ++i) {
    if (digits.d[i] < 0 || digits.d[i] > 59) return std::nullopt;
    fractions.push_back(static_cast<int>(digits.d[i]));
  }
  return Sexagesimal::FromParts(digits.negative, digits.d[0], fractions);
}

Sexagesimal AtPlaces(const Sexagesimal& v, int places) {
  return v.places() <= places ? v.Extended(places) : v.Rounded(places);
}

int UnitsOff(double diff, double tolerance) {
  const double off = std::fabs(diff) - tolerance;
  if (off <= 1e-9) return 0;
  constexpr double kMax = 1e9;  // far beyond any departure: saturates instead of overflowing
  return static_cast<int>(std::ceil(std::min(off, kMax) - 1e-9));
}

std::optional<double> CellContext::Fit(const Sexagesimal& reading) const {
  double against = 1;
  if (tradition_reading) {  // each witness reading otherwise would have had to change it
    if (reading == *tradition_reading) return 1.0;
    against = std::pow(kCorrection, std::clamp(tradition ? tradition->agree : 1, 1, 3));
  }
  const double dist = DepartureDiff(reading, computed, places, grid);
  const int k = UnitsOff(dist, options->tolerance);
  if (k == 0) return against * (reading == model_reading ? 1.0 : kNearOnly);
  if (k > author->typical) return std::nullopt;
  const double rate = author->Rate(k);
  double fit = rate / 2 / (1 - rate);  // the author departs this way rather than not at all
  if (std::isfinite(exact) &&
      std::fabs(reading.ToDouble() - exact) * std::pow(60.0, places) <= 0.75 + 1e-9)
    fit *= kBoundaryFactor;
  return against * std::min(1.0, fit);
}

std::string CellContext::ModelClause(const Sexagesimal& reading) const {
  const std::string model = ModelText(computed, exact, places);
  if (tradition_reading && reading == *tradition_reading) {
    if (reading == model_reading) return "the other witnesses and the model (" + model + ") agree";
    return "the other witnesses read " + reading.ToString() +
           " (the author's departure from the model's " + model + ")";
  }
  std::string out = "the model gives " + model + ", the emended reading " + reading.ToString();
  const int k = UnitsOff(DepartureDiff(reading, computed, places, grid), options->tolerance);
  if (k > 0) {
    return out + " is " + SignedUnits(DiffUnits(reading, model_reading, places)) +
           " from it, within the author's usual departure";
  }
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

using internal::Candidate;
using internal::CellContext;

bool SameStory(const Explanation& a, const Explanation& b) {
  return a.cls == b.cls && a.emendation.has_value() == b.emendation.has_value() &&
         (!a.emendation || a.emendation->Identical(*b.emendation));
}

/// Candidates grouped by story (class and reading: two paths to one reading
/// are two ways of one story, their likelihoods add up), best first, scored
/// as their share of `total`.
std::vector<Explanation> Ranked(std::vector<Candidate> all, double total) {
  std::stable_sort(all.begin(), all.end(), [](const Candidate& a, const Candidate& b) {
    return a.likelihood > b.likelihood;
  });
  std::vector<Candidate> stories;
  for (auto& c : all) {
    auto same = std::find_if(stories.begin(), stories.end(), [&](const Candidate& o) {
      return SameStory(o.explanation, c.explanation);
    });
    if (same == stories.end())
      stories.push_back(std::move(c));
    else
      same->likelihood += c.likelihood;
  }
  std::stable_sort(stories.begin(), stories.end(), [](const Candidate& a, const Candidate& b) {
    return a.likelihood > b.likelihood;
  });
  std::vector<Explanation> out;
  for (auto& s : stories) {
    s.explanation.score = total > 0 ? std::min(1.0, s.likelihood / total) : 0;
    out.push_back(std::move(s.explanation));
  }
  return out;
}

/// A copy that reads the model's value where every other witness (two or
/// more) reads the author's departure: its reading is its own, a slip that
/// lands on the model's value. A modern edition may have recomputed it.
bool AgainstTradition(const Transcription& table, const ColumnValues& values,
                      const internal::ColumnContext& column, std::size_t row) {
  if (!column.tradition_reading[row] || row >= values.tradition.size()) return false;
  const TraditionCell& t = values.tradition[row];
  return t.witnesses >= 2 && t.agree == t.witnesses &&
         table.witness.Kind() != WitnessKind::kModernEdition;
}

/// "a transposition", "a place left out or moved", ...
std::string AlsoWords(SlipClass cls) {
  switch (cls) {
    case SlipClass::kConfusion:
      return "a confusion of symbols";
    case SlipClass::kTransposition:
      return "a transposition";
    case SlipClass::kPlace:
      return "a place left out, added or moved";
    case SlipClass::kRepetition:
      return "a repetition";
    default:
      return std::string("a slip of class ") + ToString(cls);
  }
}

}  // namespace

namespace internal {

Finding SingleFinding(const CellContext& c, const ColumnValues& values) {
  std::vector<Candidate> all;
  for (auto* gen :
       {ConfusionCandidates, TranspositionCandidates, PlaceCandidates, RepetitionCandidates}) {
    auto found = gen(c);
    all.insert(all.end(), found.begin(), found.end());
  }
  const bool slip_found = !all.empty();
  auto author = AuthorCandidate(c);
  if (author) {
    all.push_back(*author);
  } else if (!slip_found) {
    // Beyond the author's departure and out of every slip's reach: where the
    // whole tradition reads it, the reading is kept (TraditionKeptCandidate).
    if (auto kept = TraditionKeptCandidate(c)) {
      Finding f = NewFinding(*c.table, values, c.places);
      f.explanations.push_back(kept->explanation);
      f.kept_against_model = true;
      f.cells.push_back(MakeCell(*c.table, values, c.row, c.places));
      return f;
    }
  }
  const Candidate unexplained = UnexplainedCandidate(c);
  double total = unexplained.likelihood + c.slip_rate * kOtherStories;
  for (const auto& a : all) total += a.likelihood;
  // "Unexplained" is listed only when no slip is: it is the story of last resort.
  if (!slip_found) all.push_back(unexplained);
  Finding f = NewFinding(*c.table, values, c.places);
  f.explanations = Ranked(std::move(all), total);
  // Name the other class where the evidence cannot tell it from the best.
  for (SlipClass other : f.Undecided()) {
    f.explanations.front().evidence += "; " + AlsoWords(other) +
                                       " gives the same reading as well (the evidence does not "
                                       "tell the two apart)";
  }
  f.cells.push_back(MakeCell(*c.table, values, c.row, c.places));
  if (IsCopyingSlip(f.best().cls)) f.cells.back().emendation = f.best().emendation;
  return f;
}

}  // namespace internal

std::vector<Finding> ExplainColumn(const Transcription& table, const ColumnValues& values,
                                   const NumeralScript& script, const ExplainOptions& options,
                                   const std::vector<const NumeralScript*>& tradition_scripts) {
  std::vector<const NumeralScript*> others;
  for (const auto* s : tradition_scripts) {
    const bool seen = std::any_of(others.begin(), others.end(),
                                  [&](const NumeralScript* o) { return o->name() == s->name(); });
    if (s && s->name() != script.name() && !seen) others.push_back(s);
  }
  const std::size_t col = static_cast<std::size_t>(values.column);
  const int places = table.columns.at(col).places;
  const internal::ColumnContext column = internal::MeasureColumn(table, values, options, places);
  std::vector<bool> claimed(table.rows.size(), false);
  // Rows the tradition reads alike where the model misses a compensating
  // window: kept first, so that no run of slips is fitted to the model there.
  std::vector<Finding> kept;
  for (std::size_t r = 0; r < table.rows.size() && r < values.computed.size(); ++r) {
    const Cell& cell = table.rows[r].cells[col];
    if (!column.compensating[r] || column.deviant[r] || cell.state != CellState::kRead ||
        !std::isfinite(column.departure[r]) ||
        internal::UnitsOff(column.departure[r], options.tolerance) == 0 ||
        !(internal::AtPlaces(*cell.value, places) == *column.consensus[r]))
      continue;
    kept.push_back(internal::CompensatedFinding(table, values, column, r, places));
    claimed[r] = true;
  }
  // Deviant rows whose model rests on a doubtful argument: kept before a
  // run of slips is fitted to a model computed at another argument.
  for (std::size_t r = 0; r < values.argument_doubt.size() && r < values.computed.size(); ++r) {
    const Cell& cell = table.rows[r].cells[col];
    if (claimed[r] || values.argument_doubt[r].empty() || !values.computed[r] ||
        !column.deviant[r] || cell.state != CellState::kRead ||
        !std::isfinite(column.diffs.diff[r]))
      continue;
    kept.push_back(internal::ArgumentDoubtFinding(table, values, column, r, places));
    claimed[r] = true;
  }
  std::vector<Finding> out = internal::DisplacedRuns(table, values, options, column, claimed);
  out.insert(out.end(), kept.begin(), kept.end());
  // Rows where the model leaves the column's curve and the entry does not:
  // kept before a run of slips or a single slip is fitted to the model
  // there. After the displaced runs: a line slid by rows near a sharp turn
  // of the column may lie as near the neighbours' line as the original
  // (claimed before them, seeds 1-40 of deviation_bench lost 12 eye-skip
  // cells' class; DEVELOPERS.md, eighteenth round of issue 10).
  for (std::size_t r = 0; r < table.rows.size() && r < column.off_curve.size(); ++r) {
    if (claimed[r] || !column.off_curve[r]) continue;
    out.push_back(internal::OffCurveFinding(table, values, column, r, places));
    claimed[r] = true;
  }
  auto runs = internal::SystematicRuns(table, values, options, column, claimed);
  out.insert(out.end(), runs.begin(), runs.end());
  for (std::size_t r = 0; r < table.rows.size() && r < values.computed.size(); ++r) {
    if (claimed[r] || !values.computed[r]) continue;
    const Cell& cell = table.rows[r].cells[col];
    if (cell.state != CellState::kRead) {
      out.push_back(internal::MissingFinding(table, values, column, r, places));
      continue;
    }
    const double d = column.departure[r];
    if (!std::isfinite(d)) continue;
    if (internal::UnitsOff(d, options.tolerance) == 0 &&
        !AgainstTradition(table, values, column, r))
      continue;
    auto c = internal::MakeContext(table, values, script, options, column, r, places);
    c.other_scripts = &others;
    out.push_back(internal::SingleFinding(c, values));
  }
  internal::MergeComputationalRuns(out);
  std::sort(out.begin(), out.end(), [](const Finding& a, const Finding& b) {
    return a.cells.front().row < b.cells.front().row;
  });
  return out;
}

}  // namespace apograph::deviation
