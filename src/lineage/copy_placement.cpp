// Copies read against a stemma (copy_placement.hpp): the candidate copies
// that stand beside their exemplar, and the exemplar drawn above its copy.
#include "lineage/copy_placement.hpp"

#include <algorithm>
#include <set>
#include <utility>

namespace apograph::lineage {

namespace {

int NodeOf(const Stemma& s, const std::string& name) {
  for (std::size_t n = 0; n < s.nodes.size(); ++n) {
    if (s.nodes[n].witness && s.nodes[n].name == name && s.nodes[n].parent >= 0)
      return static_cast<int>(n);
  }
  return -1;
}

void Detach(Stemma& s, int n) {
  auto& siblings = s.nodes[s.nodes[n].parent].children;
  siblings.erase(std::find(siblings.begin(), siblings.end(), n));
  s.nodes[n].parent = -1;
}

// Whether every witness below `node` is `copy` or holds all its errors
// (a copy of it, by `held`: pairs copy-exemplar of CopyCandidates).
bool OnlyItsLine(const Stemma& s, int node, const std::string& copy,
                 const std::set<std::pair<std::string, std::string>>& held) {
  for (const auto& w : s.Below(node)) {
    if (w != copy && !held.count({w, copy})) return false;
  }
  return true;
}

// A direct copy stands beside its exemplar in the stemma (or below it):
// a lost copy between them, with readings the exemplar lacks, makes the
// relation indirect. The copy may stand at the head of a group of its own
// copies (their node is its own, and the readings that mark it its own
// errors): the exemplar then stands beside that group, or above it.
bool Adjacent(const Stemma& s, const CopyCandidate& c,
              const std::set<std::pair<std::string, std::string>>& held) {
  const int a = NodeOf(s, c.exemplar), b = NodeOf(s, c.copy);
  if (a < 0 || b < 0) return false;
  const int pa = s.nodes[a].parent, pb = s.nodes[b].parent;
  if (pb == a || pa == pb || pa == b) return true;
  for (int n = pb; n >= 0 && n != s.root && OnlyItsLine(s, n, c.copy, held);
       n = s.nodes[n].parent) {
    if (s.nodes[n].parent == pa || s.nodes[n].parent == a) return true;
  }
  return false;
}

}  // namespace

std::vector<CopyCandidate> AdjacentCopies(const Stemma& s, const CharacterMatrix& oriented,
                                          const std::vector<std::string>& correctors,
                                          std::vector<std::string>& undecided) {
  const std::vector<CopyCandidate> all = CopyCandidates(oriented, correctors);
  std::set<std::pair<std::string, std::string>> held;
  // Any witness holding all the copy's errors may stand on its line, however
  // few they are (judgement; measured in DEVELOPERS.md, "Lineage accuracy").
  for (const auto& c : CopyCandidates(oriented, correctors, 0)) held.insert({c.copy, c.exemplar});
  // A copy that reads right more of an exemplar's errors than it holds (a
  // corrector) is named for it only when it is the closest by the errors
  // alone (judgement, measured in DEVELOPERS.md, "Lineage accuracy").
  std::set<std::pair<std::string, std::string>> closest;
  for (const auto& c : ChooseCopies(oriented, all)) closest.insert({c.copy, c.exemplar});
  const auto admissible = [&](const CopyCandidate& c) {
    return Adjacent(s, c, held) &&
           (c.corrected <= c.exemplar_errors || closest.count({c.copy, c.exemplar}) > 0);
  };
  return ChooseCopies(oriented, all, admissible, &undecided);
}

// A surviving exemplar is drawn above its copy: the copy, found beside it,
// moves below it; a lost node left with the exemplar alone gives way to it.
void PlaceExemplars(Stemma& s, const std::vector<CopyCandidate>& copies) {
  for (const auto& c : copies) {
    if (c.twins) continue;
    const int a = NodeOf(s, c.exemplar), b = NodeOf(s, c.copy);
    if (a < 0 || b < 0 || s.nodes[a].parent != s.nodes[b].parent) continue;
    const int lost = s.nodes[a].parent;
    Detach(s, b);
    s.Attach(a, b);
    if (lost != s.root && !s.nodes[lost].witness && s.nodes[lost].children.size() == 1) {
      const int up = s.nodes[lost].parent;
      s.nodes[a].length += s.nodes[lost].length;
      Detach(s, a);
      Detach(s, lost);
      s.Attach(up, a);
    }
  }
  s.Compact();
}

}  // namespace apograph::lineage
