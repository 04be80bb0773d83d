#pragma once
// Internal to the deviation stage: the constants the explanations are scored
// with, each with its basis, and the author's departures as measured on a
// column. How they combine is described in explain.hpp.
//
// "Judgement" means chosen by the developers from the trade's common practice
// (what editors report about copies), not measured; the benchmark
// (tests/bench/deviation_bench.cpp, figures in DEVELOPERS.md) measures how the
// whole stage does with them on draws whose slips come from outside the lists.

#include <cstddef>

namespace apograph::deviation::internal {

// --- How often each kind of slip happens, as a share of one copyist's slips.
// Judgement: symbol confusions are the commonest slip of every script (common
// practice); a symbol changed into one that no list pairs with it is rarer but
// real ("no list is complete"); transposed digits belong to positional
// scripts; a place left empty or moved comes next; a place written twice is
// less common (see below). The shares need not sum to 1: the rest is eye-skips (found as runs) and
// blank cells (found by their state).
constexpr double kShareConfusion = 0.40;
constexpr double kShareUnlisted = 0.15;
constexpr double kShareTransposition = 0.08;       // positional scripts
constexpr double kSharePlacesSwapped = 0.03;       // two neighbouring places swapped
constexpr double kShareTranspositionOther = 0.01;  // a slip of digits, unusual elsewhere
constexpr double kSharePlaceOmitted = 0.05;        // a place left empty (read as 0)
constexpr double kSharePlaceMoved = 0.05;          // places moved up or down by one
// A place written twice, the rest pushed down. Judgement (realism notes list
// a place added beside one dropped or shifted), below a place moved since the
// story needs two equal neighbouring places. It was 0.002 ("rare"), which let
// a confusion outscore it wherever one landed: measured on seeds 41-80 of the
// shared generator (deviation_bench), places added rightly named 77.8% and
// 67.1% at 0.002, 83.3% and 89.4% at 0.02; recall and precision unchanged,
// 3 of 2,071 look-alikes and 2 of 648 other-symbol slips then misnamed.
constexpr double kSharePlaceDoubled = 0.02;
constexpr double kShareRepetition = 0.06;     // a neighbouring entry repeated
constexpr double kSharePlaceRepeated = 0.02;  // one place of a neighbour repeated
constexpr double kShareOther = 0.05;          // anything else (several symbols at once)

// Judgement: given a slip outside every class above, the chance it produced
// this particular reading (a story that fits any deviation explains none
// well).
constexpr double kOtherOutcome = 1e-3;
// Judgement: a second independent slip in the same entry, relative to the
// first (two confusions in one entry are far rarer than one).
constexpr double kSecondSlip = 0.05;
// A place a story leaves unexplained (written where the story says nothing
// was): the chance of that value among the 60 a place takes.
constexpr double kUnexplainedPlace = 1.0 / 60;
// Judgement: a copyist correcting an entry against computation where the
// author departed (or changing a reading the other witnesses keep); each
// witness that reads otherwise would have had to do it. A checker leaves a
// one-unit difference alone (it is within his own rounding), so correcting
// one is far rarer than correcting a larger one.
constexpr double kCorrection = 0.05;
constexpr double kCorrectionOneUnit = 0.01;
constexpr double kCorrectionLarger = 0.3;
// Judgement: a slip inherited from an ancestor written in another numeral
// script of the tradition (the scripts the other witnesses write), relative
// to one in the witness's own script; listed confusions only.
constexpr double kOtherScript = 0.2;
// Judgement: the stories not thought of, as a likelihood beside the others
// (times the copy's slip rate): keeps a lone weak story from scoring 1.
constexpr double kOtherStories = 2e-3;

// --- A reading that lies within the tolerance of the model but is not its
// reading (the model computed at more places than the column): judgement.
constexpr double kNearOnly = 0.8;

// --- Rates measured on a column are shrunk toward a prior worth this many
// entries (judgement: a short column says little, a long one speaks for
// itself): rate = (count + prior x kPriorEntries) / (entries + kPriorEntries).
constexpr double kPriorEntries = 50;

// --- The copy's slip rate: the share of its entries beyond the author's
// departure. Prior 2% (judgement from realism notes: copies miscopy a few
// percent of their entries); at most a quarter (beyond that the guard refuses
// the reference, see guard.hpp).
constexpr double kSlipRatePrior = 0.02;
constexpr double kSlipRateCeiling = 0.25;

// --- The author's departures: the shares of entries that depart by one and
// by two units. Priors (judgement from realism notes: departures of one unit
// at a few percent of the entries, two units sometimes).
constexpr double kAuthorRate1Prior = 0.02;
constexpr double kAuthorRate2Prior = 0.002;
// A column shows 2-unit departures as the author's habit when at least this
// share of its entries (and two of them) depart by two units (judgement).
constexpr double kAuthorTwoUnitsShare = 0.01;
// Judgement: how much more likely the author departs where the exact value
// lies near the rounding boundary (within 0.75 unit of the reading), where a
// neighbour departs the same way (the author's departures come in smooth
// runs), where the other witnesses read the same value (more than half of
// them); where some read the model's value, each of them would have had to
// correct the author (kCorrection, below, once per witness).
constexpr double kBoundaryFactor = 5;
constexpr double kNeighbourFactor = 10;
constexpr double kTraditionSharesFactor = 50;

/// The author's departures from the model, measured on one column.
struct AuthorProfile {
  int typical = 1;  ///< units: departures up to this may be the author's
  double rate1 = kAuthorRate1Prior;
  double rate2 = kAuthorRate2Prior;
  double Rate(int units) const { return units == 1 ? rate1 : units == 2 ? rate2 : 0; }
};

}  // namespace apograph::deviation::internal
