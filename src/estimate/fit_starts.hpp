#pragma once
/// Internal to the estimate stage: where the solver starts. A coarse grid
/// over every free parameter's historical range (a function of the
/// argument), and starts read off the entries themselves for the kinds whose
/// cost has basins far narrower than any grid: a mean motion's rate, and a
/// table of positions' rates in longitude and in anomaly.

#include <vector>

#include "estimate/fit_problem.hpp"
#include "estimate/observations.hpp"
#include "model/model.hpp"

namespace apograph::estimate::internal {

/// Coarse search over the free parameters' ranges on a subsample; returns up
/// to `count` distinct starting vectors, best first (just `x0` when there is
/// nothing to search or no entry).
std::vector<std::vector<double>> GridStarts(FitProblem& problem, const std::vector<double>& x0,
                                            double loss_scale, int count);

/// A mean motion's start: the rate as the median of the local rates between
/// neighbouring entries (each step taken modulo 360), the radix as the
/// median of entry - rate x argument. Empty when the model has no free rate
/// or there are too few entries.
std::vector<double> MeanMotionStart(const model::Model& model, const FitProblem& problem,
                                    const std::vector<Observation>& obs, std::vector<double> x);

/// The entries read as longitudes: none negative and some beyond the
/// largest equation by date (a column that stays near 0 is an equation
/// by date, which a planet's seven parameters mimic).
bool Longitudes(const std::vector<Observation>& obs);

/// A table of positions' starts (see fit_starts.cpp): the entries unwrapped,
/// a straight line for the mean motion, and the periodic part read as
/// harmonics (the solar equation at the mean motion's own rate; the
/// epicycle at the rate in anomaly that fits best, the deferent's
/// eccentricity at the rate in longitude); for a planet, first the starts
/// with its rates tied as the models tie them to the mean sun (inner:
/// longitude with the sun; outer: longitude + anomaly = the sun), the rate
/// in anomaly scanned; for an equation by date (no mean motion), also the
/// harmonic alone, no line, at the rates in anomaly that leave the smallest
/// median distance (over a short arc its curvature fixes the rate). Empty
/// when the model is not a table of positions or there are too few entries.
std::vector<std::vector<double>> PositionStarts(const model::Model& model,
                                                const FitProblem& problem,
                                                const std::vector<Observation>& obs,
                                                const std::vector<double>& x);

}  // namespace apograph::estimate::internal
