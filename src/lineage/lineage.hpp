#pragma once
/// The lineage stage in one call: from the characters to stemmata (by
/// neighbour joining and/or maximum parsimony) with the support of every
/// group, candidate direct copies, contaminated witnesses, witnesses that
/// correct against the model, and what the evidence cannot decide.
///
///     auto matrix = lineage::BuildCharacters(collation);
///     lineage::LineageOptions o;
///     o.bootstrap = 100;
///     lineage::LineageReport r = lineage::AnalyseLineage(matrix, o);
///     std::cout << lineage::ToNewick(r.results[0].stemma);
///
/// The steps, in order:
///  1. a first stemma from every character (rooted by the directed ones, or
///     at its midpoint when none direct it: rooting.hpp), the right
///     readings of correctors (corrections.hpp) set aside;
///  2. contaminated witnesses (relations.hpp), each then made unknown where
///     it follows its secondary exemplar;
///  3. correctors once more, on that matrix, each made unknown where it
///     reads right;
///  4. the stemmata of the masked matrix, their support (bootstrap, or the
///     count of characters on each group's branch), the groups the
///     characters contradict;
///  5. candidate copies (with dates and kinds: relations.hpp), each
///     surviving exemplar drawn above its copy.

#include <map>
#include <optional>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "lineage/characters.hpp"
#include "lineage/corrections.hpp"
#include "lineage/parsimony.hpp"
#include "lineage/relations.hpp"
#include "lineage/rooting.hpp"
#include "lineage/stemma.hpp"

namespace apograph::lineage {

enum class Method { kNeighbourJoining, kParsimony };
const char* ToString(Method method);  ///< "nj", "parsimony"

struct LineageOptions {
  std::vector<Method> methods{Method::kParsimony};
  int bootstrap = 0;  ///< replicates (0: none; support is then the count of characters)
  unsigned seed = 1;
  ParsimonyOptions parsimony;
};

/// A stemma by one method, rooted as rooting.hpp says (the bootstrap's
/// replicates are built the same way).
Stemma BuildStemma(const CharacterMatrix& matrix, Method method,
                   const std::vector<double>& weights = {}, const ParsimonyOptions& parsimony = {});

/// Share of bootstrap replicates in which each group appears. Replicates
/// draw blocks (rows of a table; all characters of a row go together) with
/// replacement; parsimony replicates use the heuristic search only.
std::map<Group, double> Bootstrap(const CharacterMatrix& matrix, Method method, int replicates,
                                  unsigned seed, const ParsimonyOptions& parsimony = {});

/// Puts the support of every group on the node that carries it.
void AnnotateSupport(Stemma& stemma, const std::map<Group, double>& support);

struct GroupInfo {
  Group witnesses;
  std::optional<double> support;  ///< bootstrap share, when a bootstrap was run
  double length = 0;    ///< weighted changes (or distance) on the branch leading to the group
  int characters = 0;   ///< characters that change on that branch
  int conflicting = 0;  ///< informative characters no tree with the group can hold
  double conflict_weight = 0;
};

struct MethodResult {
  Method method = Method::kParsimony;
  Stemma stemma;
  std::vector<GroupInfo> groups;
  std::optional<ParsimonyResult> parsimony;  ///< length, exactness, search (parsimony only)
};

/// Something the evidence cannot decide, said instead of drawn as found.
struct Undecided {
  std::string what;  ///< "evidence", "root", "group", "witness", "copy"
  std::string text;
};

struct LineageReport {
  std::string title;  ///< the work's (or table's) title
  std::vector<std::string> witnesses;
  std::vector<WitnessInfo> witness_info;  ///< kind and date, per witness (may be empty)
  int characters = 0;
  int undetermined_cells = 0;
  RootEvidence root;
  std::vector<MethodResult> results;
  std::vector<CopyCandidate> copies;
  std::vector<Contamination> contamination;
  std::vector<Correction> corrections;
  std::vector<Undecided> undecided;
  int bootstrap = 0;  ///< replicates behind the groups' support (0: counts of characters)
};

LineageReport AnalyseLineage(const CharacterMatrix& matrix, const LineageOptions& options = {});

/// The documented JSON of a report (README, "JSON output"): {witnesses,
/// characters, undetermined_cells, method, newick, groups, support, undecided,
/// root, results: [{method, newick, groups: [{witnesses, support, length,
/// characters, conflicting}], length, exact, search}], copies: [{copy,
/// exemplar, exemplar_errors, own_errors, unreadable, filled, corrected,
/// twins, dated, text}], contamination: [{witness, primary, secondary, text,
/// segments: [{relative, first_row, last_row, shared, against}],
/// inherited_by}], corrections: [{witness, corrected, kept, relatives, basis,
/// text}]}.
nlohmann::json ToJson(const LineageReport& report);

}  // namespace apograph::lineage
