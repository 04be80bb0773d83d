#pragma once
/// Seeded traditions: the author's table(s) of one work copied along a tree
/// to 4-15 surviving witnesses, with lost intermediates (the rule), copies
/// of surviving witnesses, contamination (a change of exemplar part-way
/// through a table or between tables), correctors (who check entries
/// against computation and so share right readings with unrelated
/// witnesses), early prints and modern editions (recomputed, or printed
/// from a witness; later editions differing from earlier ones by one-unit
/// variants), each witness with a siglum, a catalogue date consistent with
/// the tree, a kind and a numeral script.
///
/// Example:
///
///     apograph::synth::TraditionOptions o;
///     o.witnesses = 8;
///     auto tradition = apograph::synth::DrawTradition(42, o);
///     for (int i : tradition.Surviving()) {
///       auto tables = tradition.WitnessTables(i);  // Transcriptions to import
///     }
///     auto key = apograph::synth::TraditionJson(tradition);

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "copying.hpp"
#include "tables.hpp"

namespace apograph::synth {

enum class WitnessKind { kManuscript, kPrint, kModernEdition };
/// "manuscript", "print", "modern-edition" (the transcription's `kind=`).
const char* WitnessKindName(WitnessKind kind);

/// A date as catalogues write it, and the years it covers.
struct CatalogueDate {
  int year = 0;          ///< the true year (the key's)
  std::string text;      ///< "1461", "c. 1420", "15th century", "late 15th century", "1460-1470"
  int from = 0, to = 0;  ///< years the text covers (inclusive)
};

/// A change of exemplar.
struct Contamination {
  int second = -1;              ///< node index of the second exemplar
  bool between_tables = false;  ///< whole tables from the second exemplar from `table` on
  int table = 0;                ///< the table where the switch happens
  int row = 0;                  ///< part-way: first archetype row taken from the second exemplar
};

/// An entry a corrector changed against computation.
struct Correction {
  std::string table;
  int origin_row = 0;
  std::string arg, column, before, after;
  bool restores_archetype =
      false;  ///< the new reading is the author's (not only the computed value)
};

enum class CorrectorMode {
  kNone,
  kCheck,      ///< checks entries against computation, corrects a share of those off by more than a
               ///< unit
  kRecompute,  ///< recomputes every entry (a recomputed modern edition)
};
const char* CorrectorModeName(CorrectorMode mode);

/// One node of the true tree: the archetype, a lost copy or a witness.
struct Node {
  std::string name;  ///< siglum of a witness; "archetype"; lost copies "alpha", "beta", ...
  int parent = -1;   ///< (first) exemplar
  std::optional<Contamination> contamination;
  bool surviving = false;
  WitnessKind kind = WitnessKind::kManuscript;
  Hand hand;
  bool digitised = false;  ///< the transcription was made by text recognition of the printed page
  CatalogueDate date;
  CorrectorMode corrector = CorrectorMode::kNone;
  double correction_share = 0;
  std::string
      derived_basis;  ///< recompute: "tabulated" or "exact" (how derived columns were recomputed)
  double rate = 0;    ///< slip rate of this copy
  std::string library, shelfmark;
  std::vector<TableText> text;         ///< the physical text per table (what its copies inherit)
  std::vector<TableText> transcribed;  ///< what the editor has (text + recognition slips)
  std::vector<Slip> slips;             ///< its own copying slips
  std::vector<Slip> recognition;       ///< slips of text recognition (digitised witnesses)
  std::vector<Correction> corrections;
};

/// Every proportion of a tradition draw, with its default (see README.md).
struct TraditionOptions {
  int witnesses = 0;  ///< surviving witnesses, 4..15 (0: drawn in that range)
  int tables = 0;     ///< tables of the work, 1..3 (0: drawn)
  TableOptions table;
  CopyOptions copy;  ///< base options of every copy (its rate is drawn per node, below)
  double manuscript_rate_min = 0.01, manuscript_rate_max = 0.06;
  double print_rate_min = 0.005, print_rate_max = 0.02;
  double edition_rate_min = 0.002, edition_rate_max = 0.01;
  double recognition_rate_min = 0.005, recognition_rate_max = 0.02;
  double share_copy_of_surviving = 0.15;  ///< manuscripts copied from a surviving witness
  double share_new_lost = 0.5;  ///< otherwise: a new lost intermediate (else an existing lost one)
  double share_contaminated = 0.12;   ///< manuscripts with a second exemplar
  double share_between_tables = 0.5;  ///< of those (works of 2+ tables): the switch between tables
  double share_corrector = 0.1;       ///< manuscripts that check entries against computation
  double corrector_share_min = 0.3, corrector_share_max = 0.9;
  double share_with_prints = 0.3;    ///< traditions with early prints (1-2)
  double share_with_editions = 0.4;  ///< traditions with modern editions (1-3)
  double share_edition_recomputed =
      0.3;  ///< modern editions recomputed (else printed from a witness)
  double share_edition_from_edition = 0.7;  ///< later editions based on an earlier edition
  double share_edition_checks = 0.7;        ///< printed editions that check against computation
  double share_digitised = 0.4;             ///< prints and editions transcribed by text recognition
  double share_script_change = 0.2;         ///< a manuscript in another script than its exemplar
};

struct Tradition {
  WorkInfo work;
  std::vector<AuthorTable> tables;
  std::vector<Node> nodes;  ///< nodes[0] is the archetype; exemplars come before their copies

  /// Indices of the surviving witnesses, in siglum order.
  std::vector<int> Surviving() const;
  /// A witness's tables as the editor transcribed them (metadata filled).
  std::vector<Transcription> WitnessTables(int node) const;
  int Find(const std::string& name) const;
};

Tradition DrawTradition(Rng& rng, const TraditionOptions& options);
Tradition DrawTradition(std::uint64_t seed, const TraditionOptions& options);

/// The true tree in Newick, lost nodes named, branch lengths the number of
/// slips made on the branch. `survivors_as_leaves`: a surviving exemplar
/// becomes a zero-length leaf under an unnamed node (so that every witness
/// is a leaf, as phylogenetics tools expect).
std::string Newick(const Tradition& tradition, bool survivors_as_leaves);

/// A group of surviving witnesses: the surviving descendants of one node
/// (by first exemplars), with how many of that node's slips surviving
/// errors still mark: `errors_exact` read by exactly the group,
/// `errors_some` by two or more of its members and no other witness.
struct Group {
  std::string node;
  std::vector<std::string> witnesses;
  int errors_exact = 0;
  int errors_some = 0;
};
std::vector<Group> Groups(const Tradition& tradition);

/// A slip still visible in a witness's transcription, with the node that
/// made it (the witness itself, a lost or surviving ancestor, a second
/// exemplar, or the witness's text recognition).
struct VisibleSlip {
  Slip slip;
  std::string by;
};
/// The slips of a witness's ancestry (exemplars and second exemplars) and
/// its own, whose reading it still shows (or whose row it still lacks or
/// repeats). Every cell where a witness without correctors in its ancestry
/// differs from the author's table is one of these (tested).
std::vector<VisibleSlip> VisibleSlips(const Tradition& tradition, int node);

}  // namespace apograph::synth
