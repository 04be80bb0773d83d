#pragma once
/// The lineage stage in one call: from the error characters to stemmata (by
/// neighbour joining and/or maximum parsimony) with bootstrap support,
/// candidate direct copies and contaminated witnesses.
///
///     auto matrix = lineage::BuildErrorCharacters(collation);
///     lineage::LineageOptions o;
///     o.bootstrap = 100;
///     lineage::LineageReport r = lineage::AnalyseLineage(matrix, o);
///     std::cout << lineage::ToNewick(r.results[0].stemma);

#include <map>
#include <optional>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "lineage/characters.hpp"
#include "lineage/parsimony.hpp"
#include "lineage/relations.hpp"
#include "lineage/stemma.hpp"

namespace apograph::lineage {

enum class Method { kNeighbourJoining, kParsimony };
const char* ToString(Method method);  ///< "nj", "parsimony"

struct LineageOptions {
  std::vector<Method> methods{Method::kParsimony};
  int bootstrap = 0;  ///< replicates (0: none)
  unsigned seed = 1;
  ParsimonyOptions parsimony;
};

/// Share of bootstrap replicates in which each group appears. Replicates
/// draw blocks (rows of a table; all errors of a row go together) with
/// replacement; parsimony replicates use the heuristic search only.
std::map<Group, double> Bootstrap(const CharacterMatrix& matrix, Method method, int replicates,
                                  unsigned seed, const ParsimonyOptions& parsimony = {});

/// Puts the support of every group on the node that carries it.
void AnnotateSupport(Stemma& stemma, const std::map<Group, double>& support);

struct GroupInfo {
  Group witnesses;
  std::optional<double> support;
  double length = 0;  ///< weighted errors (or distance) on the branch leading to the group
};

struct MethodResult {
  Method method = Method::kParsimony;
  Stemma stemma;
  std::vector<GroupInfo> groups;
  std::optional<ParsimonyResult> parsimony;  ///< length, exactness, search (parsimony only)
};

struct LineageReport {
  std::vector<std::string> witnesses;
  int characters = 0;
  int undetermined_cells = 0;
  std::vector<MethodResult> results;
  std::vector<CopyCandidate> copies;
  std::vector<Contamination> contamination;
};

LineageReport AnalyseLineage(const CharacterMatrix& matrix, const LineageOptions& options = {});

/// The documented JSON of a report: {witnesses, characters,
/// undetermined_cells, results: [{method, newick, groups: [{witnesses,
/// support, length}], length, exact, search}], copies: [{copy, exemplar,
/// exemplar_errors, own_errors, unreadable, filled, twins, text}], contamination:
/// [{witness, text, segments: [{relative, first_row, last_row, shared,
/// against}]}]}.
nlohmann::json ToJson(const LineageReport& report);

}  // namespace apograph::lineage
