// The checks of a finished tree (tree_checks.hpp): Fitch's length of a tree
// with lost copies, multifurcations and a witness standing at an inner
// node, and which groups the errors keep. Lengths are sums of weights that
// are small binary fractions, so they are compared exactly.
#include "lineage/tree_checks.hpp"

#include <doctest/doctest.h>

#include <string>
#include <vector>

namespace lineage = apograph::lineage;

namespace {

lineage::Character Error(std::vector<signed char> states, double weight = 1,
                         lineage::Direction direction = lineage::Direction::kModel) {
  lineage::Character c;
  c.states = std::move(states);
  c.weight = weight;
  c.direction = direction;
  return c;
}

int Add(lineage::Stemma& s, int parent, const std::string& name) {
  lineage::StemmaNode n;
  n.name = name;
  n.witness = !name.empty();
  const int id = s.Add(n);
  if (parent >= 0) s.Attach(parent, id);
  return id;
}

lineage::Stemma Rooted() {
  lineage::Stemma s;
  lineage::StemmaNode root;
  root.name = lineage::kArchetype;
  s.root = s.Add(root);
  return s;
}

// A, B, C, D; A B C share one error; A has one of its own (weight 2); A and
// D agree at an undirected cell; C and B share one where A cannot be read.
lineage::CharacterMatrix Matrix() {
  lineage::CharacterMatrix m;
  m.taxa = {"A", "B", "C", "D"};
  m.characters = {Error({1, 1, 1, 0}), Error({1, 0, 0, 0}, 2),
                  Error({1, 0, 0, 1}, 1, lineage::Direction::kNone), Error({-1, 1, 1, 0})};
  return m;
}

std::vector<lineage::Group> Groups(const lineage::Stemma& s) {
  std::vector<lineage::Group> out;
  for (const auto& [g, node] : s.Groups()) out.push_back(g);
  return out;
}

}  // namespace

TEST_CASE("Fitch's length counts the changes of a tree with lost copies and witnesses inside") {
  const auto m = Matrix();
  // archetype -> (lost x -> A B C), D
  lineage::Stemma lost = Rooted();
  const int x = Add(lost, lost.root, "");
  for (const char* w : {"A", "B", "C"}) Add(lost, x, w);
  Add(lost, lost.root, "D");
  // The shared error once, where D and the archetype read the base (1);
  // A's own error once (weight 2); the undirected cell once below x (A)
  // and once at the root, whose children x and D differ and where no
  // archetype's reading is known (2); B and C's error, A unreadable, once
  // above x (1).
  CHECK(lineage::FitchLength(lost, m) == 1 + 2 + 2 + 1);

  // archetype -> C -> (A, B), D: C keeps its own readings at the inner node.
  lineage::Stemma inner = Rooted();
  const int c = Add(inner, inner.root, "C");
  Add(inner, c, "A");
  Add(inner, c, "B");
  Add(inner, inner.root, "D");
  CHECK(lineage::FitchLength(inner, m) == 1 + 2 + 2 + 1);

  // Weights replace the characters' own: the shared error thrice, A's
  // own error not at all.
  CHECK(lineage::FitchLength(lost, m, {3, 0, 1, 1}) == 3 + 0 + 2 + 1);

  // A star of the four: the root takes the reading most of its children
  // and the archetype hold, and every other one costs a change (the shared
  // error: D and the archetype; A's own error, once at weight 2; the
  // undirected cell: two; B and C's error, A unreadable: two).
  lineage::Stemma star = Rooted();
  for (const char* w : {"A", "B", "C", "D"}) Add(star, star.root, w);
  CHECK(lineage::FitchLength(star, m) == 2 + 2 + 2 + 2);
}

TEST_CASE("a group no error supports is dissolved; a supported one is kept") {
  lineage::CharacterMatrix m;
  m.taxa = {"A", "B", "C", "D"};
  m.characters = {Error({1, 1, 0, 0}), Error({0, 0, 1, 0}), Error({0, 0, 0, 1}),
                  Error({1, 0, 0, 0}), Error({0, 1, 0, 0})};
  lineage::Stemma s = Rooted();
  const int y = Add(s, s.root, ""), z = Add(s, s.root, "");
  Add(s, y, "A");
  Add(s, y, "B");
  Add(s, z, "C");
  Add(s, z, "D");
  lineage::KeepSupported(s, m);
  CHECK(Groups(s) == std::vector<lineage::Group>{{"A", "B"}});
  CHECK(lineage::FitchLength(s, m) == 5);
}

TEST_CASE("a witness with no change of its own is drawn at the place of its lost parent") {
  lineage::CharacterMatrix m;
  m.taxa = {"A", "B", "C"};
  // A and B share two errors, B has one of its own, A none; C one of its own.
  m.characters = {Error({1, 1, 0}), Error({1, 1, 0}), Error({0, 1, 0}), Error({0, 0, 1})};
  lineage::Stemma s = Rooted();
  const int y = Add(s, s.root, "");
  Add(s, y, "A");
  Add(s, y, "B");
  Add(s, s.root, "C");
  lineage::KeepSupported(s, m);
  const int a = lineage::FindWitness(s, "A");
  REQUIRE(a >= 0);
  CHECK(s.nodes[static_cast<std::size_t>(a)].parent == s.root);
  REQUIRE(s.nodes[static_cast<std::size_t>(a)].children.size() == 1);
  CHECK(s.nodes[static_cast<std::size_t>(s.nodes[static_cast<std::size_t>(a)].children[0])].name ==
        "B");
  CHECK(Groups(s) == std::vector<lineage::Group>{{"A", "B"}});
}
