// Candidate explanations of one deviant cell: symbol confusions (listed in
// the script, or not), transposed digits, places omitted/added/moved,
// repetition of a neighbour. Each with its likelihood (see scoring.hpp).
#include <algorithm>
#include <cmath>

#include "deviation/explain_internal.hpp"

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

/// The chance of a path of listed confusions among a confusion's outcomes:
/// which symbol of the entry (1 / symbols), the pair's weight against the
/// script's mean, and a second slip in the same entry counted as one.
double PathChance(const CellContext& c, const std::vector<ConfusionStep>& steps) {
  const double mean = c.script->MeanConfusionWeight();
  double chance = 1.0 / c.symbols;
  for (std::size_t i = 0; i < steps.size(); ++i)
    chance *= std::min(1.0, steps[i].weight / mean) * (i > 0 ? kSecondSlip : 1);
  return chance;
}

std::optional<Candidate> ConfusionCandidate(const CellContext& c, const Sexagesimal& reading,
                                            const std::vector<PlaceChange>& changes,
                                            const Digits& copy) {
  const auto fit = c.Fit(reading);
  if (!fit) return std::nullopt;
  std::string words;
  std::vector<ConfusionStep> all;
  for (const auto& ch : changes) {
    const int from = static_cast<int>(copy.d[ch.place]);
    words +=
        (words.empty() ? "" : "; ") +
        DigitPlaceWords(*c.script, ch.variant.original, from, static_cast<int>(ch.place), c.unit) +
        ": " + Seq(ch.variant.steps, *c.script);
    all.insert(all.end(), ch.variant.steps.begin(), ch.variant.steps.end());
  }
  Candidate out;
  Explanation& e = out.explanation;
  e.cls = SlipClass::kConfusion;
  e.emendation = reading;
  e.evidence = words + " (" + SourceWords(all, *c.script) + "); " + c.ModelClause(reading);
  out.likelihood = c.SlipLikelihood(kShareConfusion, PathChance(c, all), *fit);
  return out;
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

void Add(std::vector<Candidate>& out, std::optional<Candidate> c) {
  if (c) out.push_back(std::move(*c));
}

}  // namespace

std::vector<std::string> PlaceSymbols(const NumeralScript& script, std::int64_t value, int place) {
  if (value < 0 || value >= 1000) return {};
  auto symbols = script.Write(static_cast<int>(value));
  if (script.writing() == Writing::kPositional && place >= 1 && value < 10)
    symbols.insert(symbols.begin(), script.Write(0).front());
  return symbols;
}

std::vector<Candidate> ConfusionCandidates(const CellContext& c) {
  std::vector<Candidate> out;
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
      if (auto reading = FromDigits(d)) Add(out, ConfusionCandidate(c, *reading, {{p, v}}, copy));
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
          if (auto reading = FromDigits(d))
            Add(out, ConfusionCandidate(c, *reading, {{p, vp}, {q, vq}}, copy));
        }
      }
    }
  }
  return out;
}

namespace {

/// The one symbol by which two writings of a place differ: a substitution,
/// or a symbol dropped or added; nullopt when they differ otherwise.
std::optional<ConfusionStep> OneSymbol(const std::vector<std::string>& intended,
                                       const std::vector<std::string>& written) {
  if (intended.size() == written.size()) {
    std::optional<ConfusionStep> step;
    for (std::size_t i = 0; i < intended.size(); ++i) {
      if (intended[i] == written[i]) continue;
      if (step) return std::nullopt;
      step = ConfusionStep{intended[i], written[i], 0, ConfusionSource::kFromMemory};
    }
    return step;
  }
  const bool dropped = intended.size() == written.size() + 1;
  if (!dropped && written.size() != intended.size() + 1) return std::nullopt;
  const auto& longer = dropped ? intended : written;
  const auto& shorter = dropped ? written : intended;
  for (std::size_t i = 0; i < longer.size(); ++i) {
    auto rest = longer;
    rest.erase(rest.begin() + static_cast<std::ptrdiff_t>(i));
    if (rest == shorter) {
      return dropped ? ConfusionStep{longer[i], "", 0, ConfusionSource::kFromMemory}
                     : ConfusionStep{"", longer[i], 0, ConfusionSource::kFromMemory};
    }
  }
  return std::nullopt;
}

}  // namespace

std::vector<Candidate> UnlistedCandidates(const CellContext& c) {
  const Sexagesimal& target = c.Expected();
  const Digits copy = ToDigits(c.tabulated, c.places), want = ToDigits(target, c.places);
  if (copy.negative != want.negative || copy.d.size() != want.d.size()) return {};
  std::optional<std::size_t> place;
  for (std::size_t p = 0; p < copy.d.size(); ++p) {
    if (copy.d[p] == want.d[p]) continue;
    if (place) return {};
    place = p;
  }
  if (!place) return {};
  const int p = static_cast<int>(*place);
  const auto step = OneSymbol(PlaceSymbols(*c.script, want.d[*place], p),
                              PlaceSymbols(*c.script, copy.d[*place], p));
  if (!step || c.script->ListedWeight(step->intended, step->written) > 0) return {};
  const auto fit = c.Fit(target);
  if (!fit) return {};
  Candidate out;
  Explanation& e = out.explanation;
  e.cls = SlipClass::kConfusion;
  e.emendation = target;
  e.evidence = DigitPlaceWords(*c.script, static_cast<int>(want.d[*place]),
                               static_cast<int>(copy.d[*place]), p, c.unit) +
               ": " + StepWords(*step, *c.script) + " (a slip of one symbol that " +
               c.script->title() + " does not list among its confusions); " + c.ModelClause(target);
  const double change = 1.0 / c.symbols / std::max(1, c.script->SlotSize() - 1);
  out.likelihood = c.SlipLikelihood(kShareUnlisted, change, *fit);
  return {out};
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
  if (n < 2 || model.d.size() != n) return out;
  for (std::size_t p = 0; p < n; ++p) {  // a place left empty (written as zero)
    if (copy.d[p] != 0 || model.d[p] == 0) continue;
    Digits d = copy;
    d.d[p] = model.d[p];
    AddPlace(c, out, d, kSharePlaceOmitted,
             PlaceName(static_cast<int>(p), c.unit) + " omitted (written as 0); " +
                 Supplied(c, p, model.d[p]));
  }
  for (std::size_t p = 0; p + 1 < n; ++p) {
    // Place p dropped and the places after it moved up one: restore it.
    Digits up = copy;
    up.d.insert(up.d.begin() + static_cast<std::ptrdiff_t>(p), model.d[p]);
    up.d.pop_back();
    AddPlace(c, out, up, kSharePlaceMoved,
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
    auto n = RightNeighbour(c, off);
    if (!n) continue;
    const std::string where = off < 0 ? "the entry above" : "the entry below";
    if (AtPlaces(*n, c.places) == c.tabulated) {
      Candidate cand;
      cand.explanation.cls = SlipClass::kRepetition;
      cand.explanation.emendation = c.Expected();
      cand.explanation.evidence =
          "repeats " + where + " (" + n->ToString() + "); " + c.ModelClause(c.Expected());
      cand.likelihood = c.SlipLikelihood(kShareRepetition, 0.5, *c.Fit(c.Expected()));
      out.push_back(std::move(cand));
      continue;
    }
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
