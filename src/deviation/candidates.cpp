// Candidate explanations of one deviant cell: symbol confusions, transposed
// digits, places omitted/added/moved, repetition of a neighbour.
#include "deviation/explain_internal.hpp"

#include <algorithm>
#include <cmath>

namespace apograph::deviation::internal {
namespace {

int Limit(std::size_t place) { return place == 0 ? 1000 : 60; }

std::string Seq(const std::vector<ConfusionStep>& steps, const NumeralScript& script) {
  std::string out;
  for (const auto& s : steps) out += (out.empty() ? "" : ", then ") + StepWords(s, script);
  return out;
}

std::string SourceWords(const std::vector<ConfusionStep>& steps, const NumeralScript& script) {
  bool memory = std::any_of(steps.begin(), steps.end(), [](const ConfusionStep& s) {
    return s.source == ConfusionSource::kFromMemory;
  });
  return std::string(steps.size() > 1 ? "confusions" : "a confusion") + " of " + script.title() +
         (memory ? ", listed from memory" : ", common practice");
}

struct PlaceChange {
  std::size_t place;
  PlaceVariant variant;
};

Explanation ConfusionExplanation(const CellContext& c, const Sexagesimal& reading,
                                 const std::vector<PlaceChange>& changes, const Digits& copy) {
  double weight = 1;
  std::string words;
  std::vector<ConfusionStep> all;
  for (const auto& ch : changes) {
    weight *= ch.variant.weight;
    const int from = static_cast<int>(copy.d[ch.place]);
    words +=
        (words.empty() ? "" : "; ") +
        DigitPlaceWords(*c.script, ch.variant.original, from, static_cast<int>(ch.place), c.unit) +
        ": " + Seq(ch.variant.steps, *c.script);
    all.insert(all.end(), ch.variant.steps.begin(), ch.variant.steps.end());
  }
  Explanation e;
  e.cls = SlipClass::kConfusion;
  e.score = kPriorConfusion * weight * c.Closeness(reading);
  e.emendation = reading;
  e.evidence = words + " (" + SourceWords(all, *c.script) + "); " + c.ModelClause(reading);
  return e;
}

/// Fractional places in a positional script are two-digit positions: a copy
/// may show 51 where 01 was meant (0 read as 5) and 1 where 51 was (5 read
/// as 0), the leading zero being a symbol like any other.
bool TwoDigitPlace(const CellContext& c, std::size_t place) {
  return c.script->writing() == Writing::kPositional && place >= 1;
}

void AddLeadingZeroVariants(const CellContext& c, int written,
                            std::vector<PlaceVariant>& variants) {
  const std::string zero = "0";
  for (const auto& conf : c.script->confusions()) {
    PlaceVariant v;
    if (written >= 10 && conf.intended == zero && conf.written == std::to_string(written / 10)) {
      v.original = written % 10;  // the tens digit stood for a leading zero
    } else if (written < 10 && conf.written == zero && conf.intended.size() == 1 &&
               conf.intended[0] >= '1' && conf.intended[0] <= '5') {
      v.original =
          (conf.intended[0] - '0') * 10 + written;  // the leading zero stood for a tens digit
    } else {
      continue;
    }
    v.weight = conf.weight;
    v.steps = {{conf.intended, conf.written, conf.weight, conf.source}};
    auto same = std::find_if(variants.begin(), variants.end(),
                             [&](const PlaceVariant& o) { return o.original == v.original; });
    if (same == variants.end())
      variants.push_back(v);
    else if (same->weight < v.weight)
      *same = v;
  }
}

}  // namespace

std::vector<Explanation> ConfusionCandidates(const CellContext& c) {
  std::vector<Explanation> out;
  const Digits copy = ToDigits(c.tabulated, c.places);
  const int steps = std::max(1, c.options->max_confusions);
  std::vector<std::vector<PlaceVariant>> per_place;
  for (std::size_t p = 0; p < copy.d.size(); ++p) {
    const int written = static_cast<int>(copy.d[p]);
    per_place.push_back(written < 1000 ? c.script->OriginalsOf(written, Limit(p), steps)
                                       : std::vector<PlaceVariant>{});
    if (TwoDigitPlace(c, p) && written < 60) AddLeadingZeroVariants(c, written, per_place.back());
  }
  for (std::size_t p = 0; p < copy.d.size(); ++p) {
    for (const auto& v : per_place[p]) {
      Digits d = copy;
      d.d[p] = v.original;
      auto reading = FromDigits(d);
      if (reading && c.Reaches(*reading))
        out.push_back(ConfusionExplanation(c, *reading, {{p, v}}, copy));
    }
  }
  if (c.options->max_confusions < 2) return out;
  // One confusion in each of two places.
  for (std::size_t p = 0; p < copy.d.size(); ++p) {
    for (std::size_t q = p + 1; q < copy.d.size(); ++q) {
      for (const auto& vp : per_place[p]) {
        if (vp.steps.size() != 1) continue;
        for (const auto& vq : per_place[q]) {
          if (vq.steps.size() != 1) continue;
          Digits d = copy;
          d.d[p] = vp.original;
          d.d[q] = vq.original;
          auto reading = FromDigits(d);
          if (reading && c.Reaches(*reading)) {
            out.push_back(ConfusionExplanation(c, *reading, {{p, vp}, {q, vq}}, copy));
          }
        }
      }
    }
  }
  return out;
}

std::vector<Explanation> TranspositionCandidates(const CellContext& c) {
  std::vector<Explanation> out;
  const Digits copy = ToDigits(c.tabulated, c.places);
  for (std::size_t p = 0; p < copy.d.size(); ++p) {
    const std::int64_t v = copy.d[p];
    // 43 for 34; in a two-digit place also 4 (04) for 40 and 40 for 4 (04).
    const bool padded = TwoDigitPlace(c, p) && v >= 1 && v <= 59 && (v < 10 || v % 10 == 0);
    if (!padded && (v < 10 || v > 99 || v % 10 == 0 || v / 10 == v % 10)) continue;
    Digits d = copy;
    d.d[p] = (v % 10) * 10 + v / 10;
    auto reading = FromDigits(d);
    if (!reading || !c.Reaches(*reading)) continue;
    const bool positional = c.script->writing() == Writing::kPositional;
    Explanation e;
    e.cls = SlipClass::kTransposition;
    e.score = (positional ? kPriorTransposition : kPriorTranspositionOther) * c.Closeness(*reading);
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
    out.push_back(std::move(e));
  }
  return out;
}

namespace {

void AddPlace(const CellContext& c, std::vector<Explanation>& out, const Digits& d, double prior,
              const std::string& words) {
  auto reading = FromDigits(d);
  if (!reading || !c.Reaches(*reading) || reading->Identical(c.tabulated)) return;
  Explanation e;
  e.cls = SlipClass::kPlace;
  e.score = prior * c.Closeness(*reading);
  e.emendation = reading;
  e.evidence = words + "; " + c.ModelClause(*reading);
  out.push_back(std::move(e));
}

std::string Supplied(const CellContext& c, std::size_t place, std::int64_t value) {
  return "the lost " + PlaceName(static_cast<int>(place), c.unit) + " (" + std::to_string(value) +
         ") supplied from the model";
}

}  // namespace

std::vector<Explanation> PlaceCandidates(const CellContext& c) {
  std::vector<Explanation> out;
  const Digits copy = ToDigits(c.tabulated, c.places);
  const Digits model = ToDigits(c.model_reading, c.places);
  const std::size_t n = copy.d.size();
  if (n < 2 || model.d.size() != n) return out;
  for (std::size_t p = 0; p < n; ++p) {  // a place left empty (written as zero)
    if (copy.d[p] != 0 || model.d[p] == 0) continue;
    Digits d = copy;
    d.d[p] = model.d[p];
    AddPlace(c, out, d, kPriorPlaceOmitted,
             PlaceName(static_cast<int>(p), c.unit) + " omitted (written as 0); " +
                 Supplied(c, p, model.d[p]));
  }
  for (std::size_t p = 0; p + 1 < n; ++p) {
    // Place p dropped and the places after it moved up one: restore it.
    Digits up = copy;
    up.d.insert(up.d.begin() + static_cast<std::ptrdiff_t>(p), model.d[p]);
    up.d.pop_back();
    AddPlace(c, out, up, kPriorPlaceMoved,
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
      AddPlace(c, out, down, doubled ? kPriorPlaceAdded : kPriorPlaceMoved,
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

std::vector<Explanation> RepetitionCandidates(const CellContext& c) {
  std::vector<Explanation> out;
  const Digits copy = ToDigits(c.tabulated, c.places);
  const Digits model = ToDigits(c.model_reading, c.places);
  for (std::ptrdiff_t off : {-1, 1}) {
    auto n = c.Neighbour(off);
    if (!n) continue;
    const std::string where = off < 0 ? "the entry above" : "the entry below";
    if (n->Rounded(c.places) == c.tabulated) {
      Explanation e;
      e.cls = SlipClass::kRepetition;
      e.score = kPriorRepetition;
      e.emendation = c.model_reading;
      e.evidence =
          "repeats " + where + " (" + n->ToString() + "); " + c.ModelClause(c.model_reading);
      out.push_back(std::move(e));
      continue;
    }
    const Digits nd = ToDigits(*n, c.places);
    for (std::size_t p = 0; p < copy.d.size() && p < nd.d.size() && p < model.d.size(); ++p) {
      if (copy.d[p] != nd.d[p] || copy.d[p] == model.d[p]) continue;
      Digits d = copy;
      d.d[p] = model.d[p];
      auto reading = FromDigits(d);
      if (!reading || !c.Reaches(*reading)) continue;
      Explanation e;
      e.cls = SlipClass::kRepetition;
      // A place agreeing with a neighbour's by chance is likely when the
      // departure is as small as an author's: weigh it down then.
      const bool small = std::fabs(c.diff) <= c.options->computational_units + 1e-9;
      e.score = kPriorPlaceRepeated * c.Closeness(*reading) * (small ? 0.5 : 1.0);
      e.emendation = reading;
      e.evidence = PlaceName(static_cast<int>(p), c.unit) + " " + std::to_string(copy.d[p]) +
                   " repeated from " + where + " (" + n->ToString() + "), the model's " +
                   std::to_string(model.d[p]) + " restored; " + c.ModelClause(*reading);
      out.push_back(std::move(e));
    }
  }
  return out;
}

}  // namespace apograph::deviation::internal
