#include "estimate/identify.hpp"

#include <algorithm>
#include <cmath>
#include <set>
#include <sstream>

#include "estimate/observations.hpp"

namespace apograph::estimate {

namespace {

constexpr double kAuthor = 0.98;  // share of entries as the author computed them
constexpr double kRatio = 0.1;    // P(|d| = j+1) / P(|d| = j) for the author's entries
constexpr double kNearTie = 2.0;  // score difference below which candidates tie
constexpr std::size_t kGridRefits = 2;
constexpr double kZeroShare = 0.9;  // share of entries ending in 0 that reduces the places (see
                                    // ReducedPlaces)  // grids refitted per family (see BestGrids)

std::string Trimmed(double v) {
  std::ostringstream o;
  o << v;
  return o.str();
}

bool IsMeanMotion(const model::Model& m) {
  return m.ParamIndex("modulus") >= 0 && m.ParamIndex("rate") >= 0;
}

/// The model gives a finite value for most rows at its defaults.
bool Applicable(const model::Model& m, const Transcription& table,
                const std::vector<Observation>& obs) {
  const std::vector<double> p = m.Defaults();
  int bad = 0, tried = 0;
  const std::size_t step = std::max<std::size_t>(1, obs.size() / 20);
  for (std::size_t i = 0; i < obs.size(); i += step) {
    const auto& col = table.columns[static_cast<std::size_t>(obs[i].column)];
    model::RowContext ctx{obs[i].arg,
                          col.arg2 ? std::optional<double>(col.arg2->ToDouble()) : std::nullopt,
                          &table, obs[i].row, obs[i].column};
    ++tried;
    try {
      bad += !std::isfinite(m.Evaluate(p, ctx));
    } catch (const std::exception&) {  // e.g. a formula reading a column this table lacks
      return false;
    }
  }
  return tried > 0 && bad * 5 <= tried;
}

Candidate MakeCandidate(const model::Model& m, FitResult fit, bool grid) {
  Candidate c;
  c.model = &m;
  c.penalised_parameters = fit.free_parameters + (grid ? 1 : 0);
  c.score = Score(fit, c.penalised_parameters, &c.log_likelihood);
  c.fit = std::move(fit);
  return c;
}

/// A practice text for comparing two candidates.
std::string Difference(const Candidate& a, const Candidate& b) {
  std::vector<std::string> parts;
  if (a.model != b.model)
    parts.push_back("the model (" + a.model->name() + " / " + b.model->name() + ")");
  if (a.PracticeText() != b.PracticeText())
    parts.push_back("the practice (" + a.PracticeText() + " / " + b.PracticeText() + ")");
  std::vector<std::string> args;
  for (std::size_t i = 0; i < a.fit.entries.size() && i < b.fit.entries.size(); ++i) {
    const auto& x = a.fit.entries[i].computed;
    const auto& y = b.fit.entries[i].computed;
    if (x.has_value() != y.has_value() || (x && !(*x == *y)))
      args.push_back(Trimmed(a.fit.entries[i].arg));
  }
  std::string s;
  for (std::size_t i = 0; i < parts.size(); ++i) s += (i ? " and " : "") + parts[i];
  if (args.empty())
    return s +
           "; they compute the same value at every entry, so the entries cannot tell them apart";
  s += "; their computed values differ at " + std::to_string(args.size()) + " entries (argument";
  s += args.size() > 1 ? "s " : " ";
  for (std::size_t i = 0; i < args.size() && i < 8; ++i) s += (i ? ", " : "") + args[i];
  if (args.size() > 8) s += ", ...";
  return s + ")";
}

/// The `keep` grids that fit best when each is fitted on the subsample only
/// (from the seed's estimate, few iterations): one full fit per kept grid
/// instead of one per grid. The ranking of grids is clear on a subsample:
/// the right grid reproduces its entries exactly, a wrong one misses by the
/// curvature between its nodes.
std::vector<double> BestGrids(const model::Model& m, const Transcription& table,
                              const std::vector<Observation>& sub, const Candidate& seed,
                              const std::vector<double>& grids, std::size_t keep) {
  std::vector<std::pair<double, double>> scored;  // score, grid
  for (double g : grids) {
    FitOptions fo;
    fo.practice = seed.fit.practice;
    fo.practice.grid = g;
    fo.fit_displacement = seed.fit.practice.displacement != 0;
    fo.max_iterations = 10;
    for (const auto& p : seed.fit.params) {
      if (!p.fixed) fo.start[p.name] = p.value;
    }
    scored.emplace_back(Score(Fit(m, table, sub, fo), seed.fit.free_parameters + 1), g);
  }
  std::stable_sort(scored.begin(), scored.end(),
                   [](const auto& a, const auto& b) { return a.first > b.first; });
  std::vector<double> out;
  for (std::size_t i = 0; i < scored.size() && i < keep; ++i) out.push_back(scored[i].second);
  return out;
}

/// One place fewer than the column shows when at least kZeroShare of its
/// entries end in 0 (see identify.hpp); nullopt otherwise.
std::optional<int> ReducedPlaces(const std::vector<Observation>& obs) {
  const int places = obs.front().places;
  if (places < 1) return std::nullopt;
  std::size_t zeros = 0;
  for (const auto& o : obs) zeros += o.places == places && std::fmod(std::fabs(o.units), 60.0) == 0;
  if (static_cast<double>(zeros) < kZeroShare * static_cast<double>(obs.size()))
    return std::nullopt;
  return places - 1;
}

/// Why a candidate's estimate is no historical value: a free parameter more
/// than its range's width outside the model's historical range (ParamSpec
/// low..high), as an obliquity of 0;6 with a latitude of 89;44 (a degenerate
/// limit of the ascensional difference that mimics the declination). Empty
/// when every estimate is plausible or the model gives no range.
std::string Implausible(const Candidate& c) {
  const auto& specs = c.model->params();
  for (std::size_t j = 0; j < specs.size() && j < c.fit.params.size(); ++j) {
    const auto& p = c.fit.params[j];
    const double width = specs[j].high - specs[j].low;
    if (p.fixed || !(width > 0)) continue;
    if (p.value < specs[j].low - width || p.value > specs[j].high + width) {
      std::ostringstream o;
      o << p.name << " = " << p.value << ", far outside its historical range " << specs[j].low
        << " .. " << specs[j].high;
      return o.str();
    }
  }
  return {};
}

/// Moves implausible candidates (see Implausible) after the others, with a
/// note for each that would otherwise have come first.
void SetAsideImplausible(std::vector<Candidate>& all, std::vector<std::string>& notes) {
  std::vector<Candidate> plausible, aside;
  for (auto& c : all) {
    const std::string why = Implausible(c);
    if (why.empty()) {
      plausible.push_back(std::move(c));
      continue;
    }
    if (plausible.empty()) {
      std::ostringstream o;
      o.precision(4);
      o << c.model->name() << " (" << c.PracticeText() << ") scores " << c.score << " but with "
        << why << "; ranked after the explanations with historical values.";
      notes.push_back(o.str());
    }
    aside.push_back(std::move(c));
  }
  if (plausible.empty()) {  // nothing better: keep the order and say so
    all = std::move(aside);
    return;
  }
  for (auto& c : aside) plausible.push_back(std::move(c));
  all = std::move(plausible);
}

}  // namespace

std::string Candidate::PracticeText() const {
  const auto& p = fit.practice;
  std::string s = p.rounding == Rounding::kTruncate ? "truncated" : "rounded";
  if (p.places) s += ", " + std::to_string(*p.places) + " places";
  if (p.grid > 0) s += ", grid " + Trimmed(p.grid) + (p.round_nodes ? " (rounded nodes)" : "");
  if (p.displacement != 0)
    s += ", displacement " + Sexagesimal::FromDouble(p.displacement, 2).ToString();
  return s;
}

double Score(const FitResult& fit, int penalised, double* log_likelihood) {
  double lo = 0, hi = 0;
  for (const auto& e : fit.entries) {
    const double u = static_cast<double>(e.tabulated.units());
    lo = std::min(lo, u);
    hi = std::max(hi, u);
  }
  const double slip = (1 - kAuthor) / std::max(hi - lo + 1, 60.0);
  const double norm = kAuthor * (1 - kRatio) / (1 + kRatio);
  double ll = 0;
  for (const auto& e : fit.entries) {
    const double d = std::isfinite(e.diff_units) ? std::fabs(std::round(e.diff_units)) : 1e9;
    ll += std::log(norm * std::pow(kRatio, std::min(d, 300.0)) + slip);
  }
  if (log_likelihood) *log_likelihood = ll;
  const double n = std::max<double>(1, static_cast<double>(fit.entries.size()));
  return ll - 0.5 * penalised * std::log(n);
}

std::vector<double> CandidateGrids(const Transcription& table) {
  std::vector<double> args;
  for (std::size_t r = 0; r < table.rows.size(); ++r) {
    if (auto a = model::RowArgument(table, r)) args.push_back(*a);
  }
  if (args.size() < 6) return {};
  double step = table.argument.step ? table.argument.step->ToDouble() : args[1] - args[0];
  if (!(step > 0)) return {};
  const double range = args.back() - args.front();
  std::vector<double> out;
  for (int m : {2, 3, 4, 5, 6, 10, 12, 15, 20, 30}) {
    if (step * m * 3 <= range) out.push_back(step * m);
  }
  return out;
}

Identification Identify(const Transcription& table, int column, const IdentifyOptions& options) {
  Identification out;
  out.column = column;
  const std::vector<Observation> obs = CollectObservations(table, {column});
  if (obs.size() < 3) return out;
  const bool mean_motion = LooksLikeMeanMotion(table, column);
  if (mean_motion) out.mean_motion = AnalyseMeanMotion(table, column);
  std::vector<const model::Model*> models =
      options.models.empty() ? model::BuiltinModels() : options.models;
  models.insert(models.end(), options.extra_models.begin(), options.extra_models.end());
  auto by_score = [](const Candidate& a, const Candidate& b) { return a.score > b.score; };
  // Round 0, on a subsample of at most 60 entries: every applicable family,
  // rounding and truncation, with and without displacement (nearest only).
  std::vector<Observation> sub;
  const std::size_t stride = std::max<std::size_t>(1, (obs.size() + 59) / 60);
  for (std::size_t i = 0; i < obs.size(); i += stride) sub.push_back(obs[i]);
  std::vector<Candidate> screen;
  // A column whose last place is (nearly) always 0 was computed to one place
  // fewer: every fit then works at that number of places.
  const std::optional<int> reduced = ReducedPlaces(obs);
  const double unit = std::pow(60.0, -(reduced ? *reduced : obs.front().places));
  for (const model::Model* m : models) {
    if (IsMeanMotion(*m) != mean_motion || !Applicable(*m, table, obs)) continue;
    // Rounding and truncation shift an estimate by half a unit at most, so
    // the screen ranks families under rounding; both are refitted below.
    for (Rounding r : {Rounding::kNearest}) {
      for (bool disp : {false, true}) {
        if (disp && (!options.try_displacement || mean_motion)) continue;
        FitOptions fo;
        fo.practice.rounding = r;
        fo.practice.places = reduced;
        fo.fit_displacement = disp;
        fo.max_iterations = 10;
        Candidate c = MakeCandidate(*m, Fit(*m, table, sub, fo), false);
        ++out.candidates_tried;
        // A displacement under one unit of the last place is no displacement
        // (and truncation plus half a unit is rounding): not a candidate.
        if (disp && std::fabs(c.fit.practice.displacement) < unit) continue;
        screen.push_back(std::move(c));
      }
    }
  }
  std::stable_sort(screen.begin(), screen.end(), by_score);
  // Round 1: the best of the screen refitted on every entry from its estimate.
  std::vector<Candidate> all;
  auto refit = [&](const Candidate& from, Rounding r, double grid, bool round_nodes = false,
                   std::optional<int> places = std::nullopt, bool keep_places = true) {
    FitOptions fo;
    fo.practice.rounding = r;
    fo.practice.places = keep_places ? from.fit.practice.places : places;
    fo.practice.grid = grid;
    fo.practice.round_nodes = grid > 0 && round_nodes;
    fo.practice.displacement = from.fit.practice.displacement;
    fo.fit_displacement = from.fit.practice.displacement != 0;
    for (const auto& p : from.fit.params) {
      if (!p.fixed) fo.start[p.name] = p.value;
    }
    Candidate c = MakeCandidate(*from.model, Fit(*from.model, table, obs, fo), grid > 0);
    if (fo.fit_displacement && std::fabs(c.fit.practice.displacement) < unit) {  // see the screen
      fo.fit_displacement = false;
      fo.practice.displacement = 0;
      c = MakeCandidate(*from.model, Fit(*from.model, table, obs, fo), grid > 0);
    }
    all.push_back(std::move(c));
  };
  for (std::size_t i = 0; i < screen.size() && i < static_cast<std::size_t>(options.refine + 3);
       ++i) {
    for (Rounding r : {Rounding::kNearest, Rounding::kTruncate}) {
      refit(screen[i], r, 0);
      ++out.candidates_tried;
    }
  }
  if (reduced && !screen.empty()) {  // the best family at the places as written, for comparison
    refit(screen[0], Rounding::kNearest, 0, false, std::nullopt, false);
    ++out.candidates_tried;
  }
  std::stable_sort(all.begin(), all.end(), by_score);
  // Round 2: the best families with interpolation grids, both roundings.
  if (options.try_grids && !mean_motion) {
    std::vector<Candidate> seeds;
    std::set<const model::Model*> seen;
    for (const auto& c : all) {
      if (static_cast<int>(seeds.size()) >= options.refine) break;
      if (seen.insert(c.model).second) seeds.push_back(c);
    }
    // A grid cannot improve on a column reproduced exactly without one.
    const bool perfect = !all.empty() && all[0].fit.exact == all[0].fit.n;
    const std::vector<double> grids = CandidateGrids(table);
    for (const auto& seed : perfect ? std::vector<Candidate>{} : seeds) {
      for (double g : BestGrids(*seed.model, table, sub, seed, grids, kGridRefits))
        refit(seed, seed.fit.practice.rounding, g);
      out.candidates_tried += static_cast<int>(grids.size());
    }
    std::stable_sort(all.begin(), all.end(), by_score);
    if (!perfect && all[0].fit.practice.grid > 0) {  // the best grid under the other rounding
      const Candidate best = all[0];
      refit(best,
            best.fit.practice.rounding == Rounding::kNearest ? Rounding::kTruncate
                                                             : Rounding::kNearest,
            best.fit.practice.grid);
      ++out.candidates_tried;
      std::stable_sort(all.begin(), all.end(), by_score);
    }
    if (!perfect && all[0].fit.practice.grid > 0) {  // the best grid with its nodes rounded first
      const Candidate best = all[0];
      refit(best, best.fit.practice.rounding, best.fit.practice.grid, true);
      ++out.candidates_tried;
      std::stable_sort(all.begin(), all.end(), by_score);
    }
  }
  if (all.empty()) return out;
  SetAsideImplausible(all, out.notes);
  for (std::size_t i = 1; i < all.size() && i < static_cast<std::size_t>(options.top); ++i) {
    if (all[0].score - all[i].score >= kNearTie) break;
    std::ostringstream o;
    o.precision(4);
    o << all[0].model->name() << " (" << all[0].PracticeText() << ") and " << all[i].model->name()
      << " (" << all[i].PracticeText() << ") explain the column about equally well (score "
      << all[0].score << " vs " << all[i].score << "); they differ in "
      << Difference(all[0], all[i]) << ".";
    out.notes.push_back(o.str());
  }
  if (static_cast<int>(all.size()) > options.top) all.resize(static_cast<std::size_t>(options.top));
  out.ranked = std::move(all);
  return out;
}

}  // namespace apograph::estimate
