// Candidate explanations of one deviant cell: transposed digits or places,
// places omitted/added/moved, repetition of a neighbour (symbol slips are in
// symbol_slips.cpp). Each with its likelihood (see scoring.hpp).
#include <algorithm>
#include <cmath>

#include "deviation/explain_internal.hpp"

namespace apograph::deviation::internal {
namespace {

/// Fractional places in a positional script are two-digit positions: a copy
/// may show 4 (04) where 40 was meant.
bool TwoDigitPlace(const CellContext& c, std::size_t place) {
  return c.script->writing() == Writing::kPositional && place >= 1;
}

}  // namespace

std::vector<std::string> PlaceSymbols(const NumeralScript& script, std::int64_t value, int place) {
  if (value < 0 || value > script.MaxWritten()) return {};
  auto symbols = script.Write(static_cast<int>(value));
  if (script.writing() == Writing::kPositional && place >= 1 && value < 10)
    symbols.insert(symbols.begin(), script.Write(0).front());
  return symbols;
}

std::vector<Candidate> TranspositionCandidates(const CellContext& c) {
  std::vector<Candidate> out;
  const Digits copy = ToDigits(c.tabulated, c.places);
  for (std::size_t p = 0; p < copy.d.size(); ++p) {
    const std::int64_t v = copy.d[p];
    // 43 for 34; in a two-digit place also 4 (04) for 40 and 40 for 4 (04).
    const bool padded = TwoDigitPlace(c, p) && v >= 1 && v <= 59 && (v < 10 || v % 10 == 0);
    if (!padded && (v < 10 || v > 99 || v % 10 == 0 || v / 10 == v % 10)) continue;
    Digits d = copy;
    d.d[p] = (v % 10) * 10 + v / 10;
    auto reading = FromDigits(d);
    if (!reading) continue;
    const auto fit = c.Fit(*reading);
    if (!fit) continue;
    const bool positional = c.script->writing() == Writing::kPositional;
    Candidate cand;
    Explanation& e = cand.explanation;
    e.cls = SlipClass::kTransposition;
    e.emendation = reading;
    auto two = [&](std::int64_t x) {
      std::string t = std::to_string(x);
      if (padded && x < 10) t.insert(t.begin(), '0');
      return t;
    };
    e.evidence = PlaceName(static_cast<int>(p), c.unit) + ": the digits of " + two(d.d[p]) +
                 " transposed to " + two(v) + (padded ? " (read " + std::to_string(v) + ")" : "") +
                 (positional ? "" : " (a slip of digits, unusual in " + c.script->title() + ")") +
                 "; " + c.ModelClause(*reading);
    const double share = positional ? kShareTransposition : kShareTranspositionOther;
    cand.likelihood = c.SlipLikelihood(share, 1.0 / copy.d.size(), *fit);
    out.push_back(std::move(cand));
  }
  // Neighbouring digits of a whole part of three digits or more swapped
  // (385 for 358, 4337 for 3437): a positional script's slip.
  if (c.script->writing() == Writing::kPositional && !copy.d.empty() && copy.d[0] >= 100) {
    const std::string digits = std::to_string(copy.d[0]);
    std::vector<int> fractions(copy.d.begin() + 1, copy.d.end());
    for (std::size_t i = 0; i + 1 < digits.size(); ++i) {
      if (digits[i] == digits[i + 1] || (i == 0 && digits[1] == '0')) continue;
      std::string swapped = digits;
      std::swap(swapped[i], swapped[i + 1]);
      const auto reading = Sexagesimal::FromParts(copy.negative, std::stoll(swapped), fractions);
      const auto fit = c.Fit(reading);
      if (!fit) continue;
      Candidate cand;
      cand.explanation.cls = SlipClass::kTransposition;
      cand.explanation.emendation = reading;
      cand.explanation.evidence = PlaceName(0, c.unit) + ": the digits " + swapped.substr(i, 2) +
                                  " of " + swapped + " transposed to " + digits + "; " +
                                  c.ModelClause(reading);
      cand.likelihood = c.SlipLikelihood(kShareTransposition, 1.0 / copy.d.size(), *fit);
      out.push_back(std::move(cand));
    }
  }
  // Two neighbouring places swapped (0;13,41 for 0;41,13), in any script.
  for (std::size_t p = 0; p + 1 < copy.d.size(); ++p) {
    if (copy.d[p] == copy.d[p + 1]) continue;
    Digits d = copy;
    std::swap(d.d[p], d.d[p + 1]);
    auto reading = FromDigits(d);
    if (!reading) continue;
    const auto fit = c.Fit(*reading);
    if (!fit) continue;
    Candidate cand;
    cand.explanation.cls = SlipClass::kTransposition;
    cand.explanation.emendation = reading;
    cand.explanation.evidence = "the " + PlaceName(static_cast<int>(p), c.unit) + " and the " +
                                PlaceName(static_cast<int>(p + 1), c.unit) + " swapped; " +
                                c.ModelClause(*reading);
    cand.likelihood = c.SlipLikelihood(kSharePlacesSwapped, 1.0 / copy.d.size(), *fit);
    out.push_back(std::move(cand));
  }
  return out;
}

namespace {

void AddPlace(const CellContext& c, std::vector<Candidate>& out, const Digits& d, double share,
              const std::string& words) {
  auto reading = FromDigits(d);
  if (!reading || reading->Identical(c.tabulated)) return;
  const auto fit = c.Fit(*reading);
  if (!fit) return;
  Candidate cand;
  cand.explanation.cls = SlipClass::kPlace;
  cand.explanation.emendation = reading;
  cand.explanation.evidence = words + "; " + c.ModelClause(*reading);
  cand.likelihood = c.SlipLikelihood(share, 1.0 / d.d.size(), *fit);
  out.push_back(std::move(cand));
}

std::string Supplied(const CellContext& c, std::size_t place, std::int64_t value) {
  return "the lost " + PlaceName(static_cast<int>(place), c.unit) + " (" + std::to_string(value) +
         ") supplied from " + (c.tradition_reading ? "the other witnesses" : "the model");
}

}  // namespace

std::vector<Candidate> PlaceCandidates(const CellContext& c) {
  std::vector<Candidate> out;
  const Digits copy = ToDigits(c.tabulated, c.places);
  const Digits model = ToDigits(c.Expected(), c.places);
  const std::size_t n = copy.d.size();
  if (n == 0 || model.d.size() != n) return out;
  // A place left empty (written as zero); an entry of one place (a sine in
  // whole units, 3141) is then written 0.
  for (std::size_t p = 0; p < n; ++p) {
    if (copy.d[p] != 0 || model.d[p] == 0) continue;
    Digits d = copy;
    d.d[p] = model.d[p];
    AddPlace(c, out, d, kSharePlaceOmitted,
             PlaceName(static_cast<int>(p), c.unit) + " omitted (written as 0); " +
                 Supplied(c, p, model.d[p]));
  }
  for (std::size_t p = 0; p + 1 < n; ++p) {  // stories of two places or more
    // Place p dropped and the places after it moved up one: restore it.
    Digits up = copy;
    up.d.insert(up.d.begin() + static_cast<std::ptrdiff_t>(p), model.d[p]);
    up.d.pop_back();
    // The last place is left empty by the move: anything else written there
    // is a coincidence the story does not explain.
    AddPlace(c, out, up, kSharePlaceMoved * (copy.d[n - 1] == 0 ? 1 : kUnexplainedPlace),
             PlaceName(static_cast<int>(p), c.unit) +
                 " omitted and the following places moved up (" +
                 PlaceName(static_cast<int>(p + 1), c.unit) + " written as " +
                 PlaceName(static_cast<int>(p), c.unit) + "); " + Supplied(c, p, model.d[p]));
    // Places from p moved down one (minutes written as seconds), a 0 in front.
    if (copy.d[p] == 0 || copy.d[p] == copy.d[p + 1]) {
      Digits down = copy;
      down.d.erase(down.d.begin() + static_cast<std::ptrdiff_t>(p));
      down.d.push_back(model.d[n - 1]);
      const bool doubled = copy.d[p] != 0;
      AddPlace(c, out, down, doubled ? kSharePlaceDoubled : kSharePlaceMoved,
               (doubled ? PlaceName(static_cast<int>(p), c.unit) +
                              " written twice, pushing the following places down"
                        : PlaceName(static_cast<int>(p), c.unit) + " written as " +
                              PlaceName(static_cast<int>(p + 1), c.unit) +
                              " (the places from there moved down one)") +
                   "; " + Supplied(c, n - 1, model.d[n - 1]));
    }
  }
  return out;
}

namespace {

/// A neighbour's reading, when it is itself right (within the author's
/// departure): a wrong neighbour does not vouch for a repetition.
std::optional<Sexagesimal> RightNeighbour(const CellContext& c, std::ptrdiff_t offset) {
  const std::ptrdiff_t j = static_cast<std::ptrdiff_t>(c.row) + offset;
  if (c.deviant && j >= 0 && j < static_cast<std::ptrdiff_t>(c.deviant->size()) &&
      (*c.deviant)[static_cast<std::size_t>(j)])
    return std::nullopt;
  return c.Neighbour(offset);
}

}  // namespace

std::vector<Candidate> RepetitionCandidates(const CellContext& c) {
  std::vector<Candidate> out;
  const Digits copy = ToDigits(c.tabulated, c.places);
  const Digits model = ToDigits(c.Expected(), c.places);
  for (std::ptrdiff_t off : {-1, 1}) {
    const std::string where = off < 0 ? "the entry above" : "the entry below";
    // A whole entry written twice is a repetition even when the entry above
    // it is itself miscopied: the copyist repeats the line he has just
    // written. The entry below is not yet on his page, so a wrong one does
    // not vouch, nor does a wrong neighbour for a single repeated place.
    const auto written = c.Neighbour(off);
    const auto n = RightNeighbour(c, off);
    const bool itself_wrong = !n;
    if (written && AtPlaces(*written, c.places) == c.tabulated && (off < 0 || !itself_wrong)) {
      Candidate cand;
      cand.explanation.cls = SlipClass::kRepetition;
      cand.explanation.emendation = c.Expected();
      cand.explanation.evidence = "repeats " + where + " (" + written->ToString() +
                                  (itself_wrong ? ", itself miscopied" : "") + "); " +
                                  c.ModelClause(c.Expected());
      cand.likelihood = c.SlipLikelihood(kShareRepetition, 0.5, *c.Fit(c.Expected()));
      out.push_back(std::move(cand));
      continue;
    }
    // The neighbouring line as the exemplar had it, where this copy wrote
    // something else there (miscopied, left blank, illegible): the copyist
    // repeated what he saw, not what he or a later hand put on the page.
    const auto& exemplar = off < 0 ? c.exemplar_above : c.exemplar_below;
    if (exemplar && *exemplar == c.tabulated && !(*exemplar == c.Expected()) &&
        !(written && AtPlaces(*written, c.places) == c.tabulated)) {
      Candidate cand;
      cand.explanation.cls = SlipClass::kRepetition;
      cand.explanation.emendation = c.Expected();
      cand.explanation.evidence = "repeats " + where + " as the exemplar had it (" +
                                  exemplar->ToString() +
                                  (written ? "; this copy reads " + written->ToString() + " there"
                                           : "; unread in this copy") +
                                  "); " + c.ModelClause(c.Expected());
      cand.likelihood = c.SlipLikelihood(kShareRepetition, 0.5, *c.Fit(c.Expected()));
      out.push_back(std::move(cand));
      continue;
    }
    if (!n) continue;
    const Digits nd = ToDigits(*n, c.places);
    for (std::size_t p = 0; p < copy.d.size() && p < nd.d.size() && p < model.d.size(); ++p) {
      if (copy.d[p] != nd.d[p] || copy.d[p] == model.d[p]) continue;
      Digits d = copy;
      d.d[p] = model.d[p];
      auto reading = FromDigits(d);
      if (!reading) continue;
      const auto fit = c.Fit(*reading);
      if (!fit) continue;
      Candidate cand;
      cand.explanation.cls = SlipClass::kRepetition;
      cand.explanation.emendation = reading;
      cand.explanation.evidence =
          PlaceName(static_cast<int>(p), c.unit) + " " + std::to_string(copy.d[p]) +
          " repeated from " + where + " (" + n->ToString() + "), the " +
          (c.tradition_reading ? "other witnesses' " : "model's ") + std::to_string(model.d[p]) +
          " restored; " + c.ModelClause(*reading);
      cand.likelihood =
          c.SlipLikelihood(kSharePlaceRepeated, 0.5 / static_cast<double>(copy.d.size()), *fit);
      out.push_back(std::move(cand));
    }
  }
  return out;
}

}  // namespace apograph::deviation::internal
