#pragma once
/// Seeded draws of whole traditions for the lineage tests and benchmark,
/// with their answer key: a work of one to three tables computed from a
/// model (solar equation, declination, sine) with the author's one-unit
/// departures shared by every copy, copied along a random stemma with lost
/// intermediates, copies of surviving witnesses, contaminated witnesses
/// (exemplar changed part-way through the work), careful copyists who
/// correct against the model, and modern editions that recompute and differ
/// from each other by a unit here and there. Witnesses carry a kind and a
/// catalogue date consistent with the stemma. The copying slips come from a
/// confusion list of this file, not from corpora/scripts (which the
/// explainer reads), plus slips outside any list. Nothing historical.
///
/// The lineage stage's own, smaller generator (written before the shared
/// traditions of tradition.hpp); kept for its benchmark, whose scoring
/// reads its key (lineage_accuracy_bench). New lineage tests should draw
/// from tradition.hpp.
///
///     lineage::DrawOptions o;
///     o.seed = 7;
///     lineage::TraditionDraw t = lineage::DrawTradition(o);
///     for (const auto& table : t.tables) ...  // transcriptions, one per witness
///     t.TrueGroups();                         // the answer key

#include <random>
#include <string>
#include <utility>
#include <vector>

#include "collate/collation.hpp"
#include "edition/transcription.hpp"
#include "lineage/lineage.hpp"
#include "lineage/stemma.hpp"

namespace apograph::lineage {

struct DrawOptions {
  unsigned seed = 1;
  int min_witnesses = 4;
  int max_witnesses = 15;
  int min_tables = 1;
  int max_tables = 3;
  /// Share of traditions with one contaminated witness (0 gives none).
  double contamination = 0.35;
  /// Chance that a manuscript copy is made by a careful copyist who
  /// recomputes and corrects most errors of the exemplar he sees.
  double corrector = 0.12;
  /// Share of traditions with modern editions (one to three).
  double modern_editions = 0.4;
  /// Copying slips per 100 entries and copy (each copy draws between half
  /// and twice this).
  double slips_per_100 = 2.5;
  /// Share of entries where the author's computation is a unit off.
  double author_departures = 0.03;
};

/// One node of the true stemma (node 0 is the archetype).
struct TraditionNode {
  std::string name;  ///< siglum, or "archetype", or "lost N"
  int parent = -1;   ///< the exemplar followed for most of the work
  bool extant = false;
  WitnessKind kind = WitnessKind::kManuscript;
  int year = 0;
  std::string date;  ///< as a catalogue would write it (may be empty)
  /// A second exemplar followed from `switch_row` on (contamination), or -1.
  int second_exemplar = -1;
  int switch_row = 0;      ///< index in the work's rows (tables in order)
  bool corrector = false;  ///< recomputed and corrected (careful copyist, modern edition)
};

struct TraditionDraw {
  std::vector<TraditionNode> nodes;
  /// Per table, the transcriptions of the extant witnesses.
  std::vector<std::vector<Transcription>> tables;
  /// Per table, the values the author's model gives (rounded), as a reference.
  std::vector<collate::Reference> models;
  /// Per table and row, the archetype's reading (the author's departures included).
  std::vector<std::vector<Sexagesimal>> archetype;

  /// Extant witnesses below (or at) each node: the true groups of two or
  /// more witnesses short of all of them.
  std::vector<Group> TrueGroups() const;
  /// (copy, exemplar) for every extant witness whose exemplar survives
  /// (contaminated witnesses left out: they have two).
  std::vector<std::pair<std::string, std::string>> TrueCopies() const;
  std::vector<std::string> Contaminated() const;
  std::vector<std::string> Correctors() const;
  int Node(const std::string& name) const;
};

TraditionDraw DrawTradition(const DrawOptions& options);

/// A lineage report scored against a draw's answer key.
///  - A true group is *marked* when at some cell the witnesses of the group
///    that can be read there (two or more) and no others read the same
///    value, other than the archetype's: the surviving readings show it;
///    *strongly marked* when that value is more than a unit from the
///    archetype's.
///  - Normalised Robinson-Foulds distance: (true groups not found + found
///    groups not true) / (true groups + found groups); `rf_best` is the
///    same for the true stemma cut down to its marked groups (the best tree
///    the surviving readings allow).
///  - Copy claims: CopyCandidates that name a direction (not twins left
///    open); right when the exemplar is the copy's true exemplar (either of
///    a contaminated witness's two).
struct DrawScore {
  int true_groups = 0, marked_groups = 0, found_groups = 0;
  int marked_recovered = 0;  ///< marked true groups found
  /// Groups marked by a reading more than one unit from the archetype's
  /// (one-unit readings arise independently too easily to mark a group).
  int strongly_marked = 0, strongly_marked_recovered = 0;
  double rf_found = 0, rf_best = 0;
  int copy_claims = 0, copy_claims_right = 0, true_copies = 0, true_copies_named = 0;
  int date_violations = 0;  ///< copy claims whose copy is dated wholly before its exemplar
  int contaminated = 0, flagged = 0, flagged_right = 0;
  int correctors = 0, correctors_flagged = 0, correctors_right = 0;
  std::vector<Group> missed;                             ///< marked true groups not found
  std::vector<Group> false_groups;                       ///< found groups that are not true
  std::vector<std::string> missed_copies, wrong_copies;  ///< "B<A"
};
DrawScore ScoreDraw(const TraditionDraw& draw, const LineageReport& report);

}  // namespace apograph::lineage
