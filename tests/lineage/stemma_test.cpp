#include "lineage/lineage.hpp"

#include <doctest/doctest.h>

#include <functional>

#include "collate/collation.hpp"
#include "lineage/neighbour_joining.hpp"
#include "lineage/synthetic.hpp"

namespace lineage = apograph::lineage;
namespace collate = apograph::collate;

namespace {

// Path length between two named nodes of a stemma.
double PathLength(const lineage::Stemma& s, const std::string& a, const std::string& b) {
  auto find = [&](const std::string& name) {
    for (std::size_t i = 0; i < s.nodes.size(); ++i) {
      if (s.nodes[i].name == name) return static_cast<int>(i);
    }
    return -1;
  };
  auto up = [&](int n) {
    std::vector<std::pair<int, double>> path;
    double d = 0;
    for (; n >= 0; n = s.nodes[n].parent) {
      path.push_back({n, d});
      d += s.nodes[n].length;
    }
    return path;
  };
  auto pa = up(find(a)), pb = up(find(b));
  for (const auto& [na, da] : pa) {
    for (const auto& [nb, db] : pb) {
      if (na == nb) return da + db;
    }
  }
  return -1;
}

lineage::CharacterMatrix Matrix(const lineage::SyntheticTradition& t) {
  collate::CollateOptions o;
  o.reference = t.Reference();
  o.tolerance_units = 0;
  return lineage::BuildErrorCharacters(collate::Collate(t.Witnesses(), o));
}

}  // namespace

TEST_CASE("neighbour joining on a worked five-taxon example") {
  // The usual textbook example (from memory): an additive matrix whose tree
  // is a:2, b:3 on node u; c:4 on v; d:2, e:1 on w; u-v 3, v-w 2. Computed
  // by hand: first step r = 5, row sums a 31, b 34, c 34, d 30, e 27;
  // Q(a,b) = 3*5 - 31 - 34 = -50 is the least, so a and b join with
  // d(a,u) = 5/2 + (31 - 34)/6 = 2 and d(b,u) = 3. Because the matrix is
  // additive, NJ returns that tree exactly: every path length equals the
  // input distance.
  const std::vector<std::string> names = {"a", "b", "c", "d", "e"};
  const lineage::DistanceMatrix d = {
      {0, 5, 9, 9, 8}, {5, 0, 10, 10, 9}, {9, 10, 0, 8, 7}, {9, 10, 8, 0, 3}, {8, 9, 7, 3, 0}};
  const auto tree = lineage::NeighbourJoining(d);
  CHECK(tree.edges.size() == 7);
  REQUIRE(tree.edges[0].a == 0);
  CHECK(tree.edges[0].length == doctest::Approx(2));
  CHECK(tree.edges[1].a == 1);
  CHECK(tree.edges[1].length == doctest::Approx(3));
  const auto s = lineage::RootAt(tree, names, 4);
  for (int i = 0; i < 5; ++i) {
    for (int j = i + 1; j < 5; ++j)
      CHECK(PathLength(s, names[i], names[j]) == doctest::Approx(d[i][j]));
  }
  CHECK(PathLength(s, "c", "e") == doctest::Approx(7));
}

TEST_CASE("shared right readings do not count; shared errors bring witnesses together") {
  lineage::CharacterMatrix m;
  m.taxa = {"A", "B", "C"};
  m.characters.push_back({"e1", "r1", "1", 0, {1, 1, 0}, 1, ""});
  m.characters.push_back({"e2", "r2", "2", 1, {0, 0, 1}, 1, ""});
  const auto d = lineage::ErrorDistances(m);
  // A and B share error e1; C alone has e2. d(A,B) = 0, d(A,C) = 2,
  // archetype (last) to A = 1, to C = 1.
  CHECK(d[0][1] == doctest::Approx(0));
  CHECK(d[0][2] == doctest::Approx(2));
  CHECK(d[3][0] == doctest::Approx(1));
  CHECK(d[3][2] == doctest::Approx(1));
}

TEST_CASE("error weights: distinctive errors count more than common slips") {
  collate::Reading r;
  r.text = "0;45";
  std::string why;
  CHECK(lineage::ErrorWeight(r, "0;40", &why) == 1);  // one symbol
  CHECK(why == "one symbol changed: a common confusion");
  r.text = "0;04";
  CHECK(lineage::ErrorWeight(r, "0;40", &why) == 1);  // transposed
  r.text = "1;17";
  CHECK(lineage::ErrorWeight(r, "0;40", &why) == 3);
  r.units_off = 1;
  CHECK(lineage::ErrorWeight(r, "0;40", &why) == 0.5);
}

TEST_CASE("synthetic traditions of 4 to 12 witnesses: the stemma comes back") {
  for (auto method : {lineage::Method::kParsimony, lineage::Method::kNeighbourJoining}) {
    int truth = 0, recovered = 0, distance = 0;
    for (int n = 4; n <= 12; ++n) {
      for (unsigned seed = 1; seed <= 3; ++seed) {
        lineage::SyntheticOptions o;
        o.witnesses = n;
        o.lost = n / 3 + 1;
        o.rows = 150;
        o.seed = seed * 100 + n;
        const auto t = lineage::SimulateTradition(o);
        lineage::LineageOptions lo;
        lo.methods = {method};
        const auto report = lineage::AnalyseLineage(Matrix(t), lo);
        std::vector<lineage::Group> found;
        for (const auto& g : report.results[0].groups) found.push_back(g.witnesses);
        const auto cmp = lineage::CompareGroups(t.TrueGroups(), found);
        truth += cmp.truth_groups;
        recovered += cmp.recovered;
        distance += cmp.distance;
        if (method == lineage::Method::kParsimony) CHECK(report.results[0].parsimony->exact);
      }
    }
    INFO("method " << std::string(lineage::ToString(method)) << ": " << recovered << " of " << truth
                   << ", RF " << distance);
    MESSAGE(std::string(lineage::ToString(method))
            << ": " << recovered << " of " << truth << " groups, RF " << distance);
    CHECK(truth > 50);
    CHECK(recovered >= 0.9 * truth);
    CHECK(distance <= truth / 5);
  }
}

TEST_CASE("a direct copy is named with its counts") {
  lineage::SyntheticOptions o;
  o.witnesses = 5;
  o.lost = 1;
  o.seed = 7;
  auto t = lineage::SimulateTradition(o);
  t.AddCopy("Q", t.Node("C"));
  const auto report = lineage::AnalyseLineage(Matrix(t));
  bool found = false;
  for (const auto& c : report.copies) {
    if (c.copy == "Q" && c.exemplar == "C") {
      found = true;
      CHECK(c.own_errors >= 3);
      CHECK(c.text.find("Q may be a copy of C: Q has all ") == 0);
    }
    CHECK(c.exemplar != "Q");  // Q's own errors are nowhere else
  }
  CHECK(found);
}

TEST_CASE("a contaminated witness is flagged with the rows where it changes exemplar") {
  lineage::SyntheticOptions o;
  o.witnesses = 6;
  o.lost = 2;
  o.rows = 300;
  o.slips_min = 8;
  o.slips_max = 12;
  o.seed = 11;
  auto t = lineage::SimulateTradition(o);
  // Two copies, far apart: X follows lost1's line and Y the archetype's other line.
  const int a = t.AddCopy("P", t.Node(lineage::kArchetype));
  const int a2 = t.AddCopy("P2", a);
  const int b = t.AddCopy("R", t.Node(lineage::kArchetype));
  const int b2 = t.AddCopy("R2", b);
  t.AddContaminated("Z", a, b, 150);
  (void)a2, (void)b2;
  const auto m = Matrix(t);
  const auto found = lineage::FindContamination(m);
  const lineage::Contamination* z = nullptr;
  for (const auto& c : found) {
    if (c.witness == "Z") z = &c;
  }
  REQUIRE(z != nullptr);
  REQUIRE(z->segments.size() == 2);
  CHECK((z->segments[0].relative == "P" || z->segments[0].relative == "P2"));
  CHECK((z->segments[1].relative == "R" || z->segments[1].relative == "R2"));
  const int last_a = std::stoi(z->segments[0].last_row),
            first_b = std::stoi(z->segments[1].first_row);
  CHECK(last_a <= 150);
  CHECK(first_b >= 151);
  CHECK(z->text.find("Z follows ") == 0);
  // Nobody else is flagged.
  CHECK(found.size() == 1);
}

TEST_CASE("bootstrap support and the output formats") {
  lineage::SyntheticOptions o;
  o.witnesses = 6;
  o.lost = 2;
  o.seed = 3;
  const auto t = lineage::SimulateTradition(o);
  lineage::LineageOptions lo;
  lo.methods = {lineage::Method::kParsimony, lineage::Method::kNeighbourJoining};
  lo.bootstrap = 50;
  const auto r = lineage::AnalyseLineage(Matrix(t), lo);
  REQUIRE(r.results.size() == 2);
  for (const auto& res : r.results) {
    REQUIRE_FALSE(res.groups.empty());
    for (const auto& g : res.groups) {
      REQUIRE(g.support);
      CHECK(*g.support >= 0.5);  // clean data: every recovered group well supported
    }
    const std::string nwk = lineage::ToNewick(res.stemma);
    CHECK(nwk.back() == ';');
    CHECK(nwk.find(")archetype;") != std::string::npos);
    const std::string dot = lineage::ToDot(res.stemma, "T1");
    CHECK(dot.rfind("digraph stemma {", 0) == 0);
    CHECK(lineage::ToText(res.stemma).rfind("archetype\n", 0) == 0);
  }
  const auto j = lineage::ToJson(r);
  CHECK(j["method"] == "parsimony");
  CHECK(j["results"][1]["method"] == "nj");
  CHECK(j["groups"].size() == r.results[0].groups.size());
  CHECK(j.contains("copies"));
  CHECK(j.contains("contamination"));
}

TEST_CASE("newick of a hand-made stemma") {
  lineage::Stemma s;
  s.root = s.Add({lineage::kArchetype, false, -1, {}, 0, std::nullopt});
  const int x = s.Add({"", false, -1, {}, 3, 0.95});
  s.Attach(s.root, x);
  s.Attach(x, s.Add({"A", true, -1, {}, 2, std::nullopt}));
  s.Attach(x, s.Add({"B", true, -1, {}, 1, std::nullopt}));
  s.Attach(s.root, s.Add({"C", true, -1, {}, 4, std::nullopt}));
  CHECK(lineage::ToNewick(s) == "((A:2,B:1)95:3,C:4)archetype;");
  const auto groups = s.Groups();
  REQUIRE(groups.size() == 1);
  CHECK(groups[0].first == lineage::Group{"A", "B"});
}
