#pragma once
/// Later correction is not descent. A careful copyist or a modern editor
/// who recomputed the table reads the model's value where his exemplar
/// erred: he shares right readings with unrelated witnesses, and on a tree
/// those readings pull him away from his relatives.
///
/// The criterion: witness W reads right (the model's value) an error k
/// whose carriers include another carrier of errors l that W does carry,
/// and also a witness that lacks l: on a tree, k's group then holds l's
/// group, W among them (l puts it there), and yet W lacks k (the other
/// carriers of l that lack k descend from W, or corrected too). The errors
/// l must be two or more, of weight kMinPlacingWeight together. Copied
/// without correction, W would carry k; it lacks such an error only by a
/// slip that restores the value, or where independent slips made the l
/// look shared. A witness with at least
/// kMinCorrections such errors (weight kMinCorrectionWeight) corrects
/// against the model.
///
/// A witness that recomputed the table shows it another way too: where
/// two thirds of the witnesses or more keep another value within a unit
/// (the author's own, as a rule), it reads the recomputed value
/// (CharacterMatrix::recomputed). At kMinRecomputed such entries, three
/// quarters or more of those where it can be read, it is called a
/// recomputing witness.
///
/// A modern edition is taken to have corrected against the model unless
/// it is seen to keep its exemplar's errors: modern editors correct, and
/// their recomputed values and rounding are their own (a faithful
/// edition loses little: it is still placed by the errors it keeps).
///
/// Either way its right readings are set aside (they are not evidence of
/// its descent), and so are the rounding differences from the other right
/// readings that only such witnesses carry (a recomputation reaches them by
/// itself; a difference of a unit that a copyist carries too was inherited).

#include <string>
#include <vector>

#include "lineage/characters.hpp"
#include "lineage/relations.hpp"
#include "lineage/stemma.hpp"

namespace apograph::lineage {

struct Correction {
  std::string witness;
  int corrected = 0;   ///< errors of its group it reads right
  double weight = 0;   ///< their weight
  int kept = 0;        ///< errors it shares with its group
  int recomputed = 0;  ///< entries where it reads the recomputed value, most another right one
  int departures = 0;  ///< entries of that kind where it can be read
  bool modern_edition = false;  ///< set aside as a modern edition
  /// What it rests on: "corrections" (errors of its group read right),
  /// "recomputed" (recomputed values where the others keep the author's),
  /// "exemplar" (a modern edition reading right its surviving exemplar's
  /// errors) or "kind" (a modern edition, set aside for its kind alone).
  std::string basis;
  std::vector<std::string> relatives;  ///< the witnesses that share those errors
  std::string text;  ///< "D corrects 14 entries that its group (A B C) has wrong ..."
};

/// Corrections from which a witness is called a corrector: judgement,
/// checked on the lineage benchmark's draws (tests/bench/lineage_accuracy_bench.cpp).
inline constexpr int kMinCorrections = 3;
inline constexpr double kMinCorrectionWeight = 3;
/// Entries read as recomputed (see above): judgement, checked on the
/// benchmark (a copyist's slip of a unit in a large group leaves the others
/// reading the recomputed value by chance, two or three times at most).
inline constexpr int kMinRecomputed = 4;
/// Share of a corrector's corrections (by weight) that must hold when each
/// error read right must also be carried by more of the other carriers of
/// the placing errors than lack it (its own group, once placed), for it to
/// be looked at before the others (FindCorrections). Measured on the
/// lineage benchmark, seeds 1-100, cached characters: 1/2 and 2/3 the same;
/// 1/3 and 1/4 one right corrector fewer and two wrong copy claims more;
/// 1 one group more, four wrong correctors more. (Seeds 101-174, checked
/// after: 1/4 gave a false alarm more.)
inline constexpr double kOwnGroupShare = 0.5;
/// Weight of the shared errors (two or more) that put a witness inside a
/// group (judgement: more than one common slip, which two copyists may make
/// independently).
inline constexpr double kMinPlacingWeight = 2;

/// Weight of the placing errors that may conflict with an error read right,
/// once the witness is counted among its carriers, as a share of the weight
/// of the witness's errors that the correction explains (Examine). A
/// correction makes the error's carriers and the witness one group of the
/// tree; where they make none, the carriers made the same slip
/// independently and the witness never had it. Judgement (the conflicts
/// fewer than the evidence), checked on the lineage benchmark (cached
/// characters): seeds 1-53 correctors precision 0.540 -> 0.582, recall
/// 0.415 -> 0.390, groups 152 -> 151 of 170; held-out seeds 101-130
/// precision 0.625 -> 0.714, recall unchanged, groups 82 -> 83 of 99; a
/// tradition of 100 witnesses with 30-60 slips a copy and no corrector
/// (lineage_bench): 81 named -> 2. Shares of 0, 1/4, 1/2 and 2 were
/// measured too (DEVELOPERS.md, "Lineage accuracy", twelfth round).
inline constexpr double kMaxConflictShare = 1.0;

/// Witnesses that correct against the model (only characters whose base
/// reading the model calls right count).
std::vector<Correction> FindCorrections(const CharacterMatrix& matrix);

/// Whether a correction rests on the witness's own readings (errors of its
/// group read right, or recomputed values), not only on its being a modern
/// edition.
bool ShowsCorrection(const Correction& correction);

/// Once the copies are known, a witness set aside that is a copy of a
/// surviving witness is judged by that exemplar. One that keeps its
/// exemplar's errors (it reads fewer than kMinCorrections of them right:
/// slips of a transcription or of text recognition in the exemplar, which
/// no copy inherits, make a few) is no longer named a corrector when it was
/// set aside only as a modern edition (a faithful edition) or when its
/// exemplar is set aside too (a copy or reprint of a corrected or
/// recomputed text: its right readings are its exemplar's). A modern
/// edition set aside only for its kind that reads more of them right has
/// that as its evidence, now said.
void ReviseByExemplars(std::vector<Correction>& corrections,
                       const std::vector<CopyCandidate>& copies);

/// Once the stemma is found, a modern edition set aside for its kind alone
/// (basis "kind") is judged by the group the stemma places it in (by its
/// errors): of the errors every other witness of that group carries where
/// it can be read (more than a unit off, directed by the model), one that
/// reads right fewer than kMinCorrections and keeps kMinCorrections or more
/// is a faithful edition, no longer named a corrector (its readings were
/// set aside for the tree, which placed it by its errors all the same).
/// `oriented`: the matrix (right readings not set aside) oriented by
/// `stemma`. Measured on seeds 1-300 of the lineage benchmark (DEVELOPERS.md,
/// "Lineage accuracy", seventeenth round): correctors named 177 -> 171,
/// right 135 -> 134; asking two witnesses or more in the group: 177 -> 175.
void ReviseByGroups(std::vector<Correction>& corrections, const Stemma& stemma,
                    const CharacterMatrix& oriented);

/// What is left of a corrector's right reading as evidence: enough to
/// choose, among the places its errors allow equally, the one its right
/// readings contradict least (judgement: 1/128, so that even fifty of them
/// weigh less than one common slip it kept).
inline constexpr double kCorrectorTieBreak = 1.0 / 128;

/// The matrix with each corrector's right readings set aside: made unknown,
/// and kept only as a tie-break (a copy of the character at
/// kCorrectorTieBreak of its weight, marked Character::tie_break); rounding
/// differences that only correctors carry made unknown.
CharacterMatrix MaskCorrections(const CharacterMatrix& matrix,
                                const std::vector<Correction>& corrections);

}  // namespace apograph::lineage
