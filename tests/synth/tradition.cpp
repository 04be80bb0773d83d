// The tree of a tradition: who copied whom, when, in which hand. The texts
// are copied along it afterwards (tradition_text.cpp).
#include "tradition.hpp"

#include <algorithm>
#include <stdexcept>

#include "tradition_build.hpp"

namespace apograph::synth {
namespace {

const std::vector<const char*> kLostNames = {
    "alpha", "beta",  "gamma",  "delta",   "epsilon", "zeta", "eta",     "theta",
    "iota",  "kappa", "lambda", "mu",      "nu",      "xi",   "omicron", "pi",
    "rho",   "sigma", "tau",    "upsilon", "phi",     "chi",  "psi",     "omega"};

// Invented libraries of the generator's own scenario (no real collection).
const std::vector<const char*> kLibraries = {"Harrowgate Minster Library",
                                             "Old Quay Town Library",
                                             "Saint Ivel Abbey",
                                             "Fenmarch Castle Collection",
                                             "Lindwick College",
                                             "Brannock Seminary",
                                             "Corvel Priory",
                                             "Eastmere University Library"};

class Builder {
 public:
  Builder(Tradition& t, const TraditionOptions& o, Rng& rng) : t_(t), o_(o), rng_(rng) {}

  void Grow(int witnesses) {
    // At least three manuscripts; up to three editions and two prints.
    const int most_editions = std::min(3, witnesses - 3);
    const int editions = rng_.Chance(o_.share_with_editions) ? rng_.Int(1, most_editions) : 0;
    const int most_prints = std::min(2, witnesses - editions - 3);
    const int prints =
        most_prints > 0 && rng_.Chance(o_.share_with_prints) ? rng_.Int(1, most_prints) : 0;
    Node root;
    root.name = "archetype";
    root.hand = ManuscriptHand();
    root.date = internal::DrawDate(rng_.Int(1150, 1400), WitnessKind::kManuscript, rng_);
    t_.nodes.push_back(root);
    for (int i = 0; i < witnesses - editions - prints; ++i)
      AddCopy(ManuscriptExemplar(), true, WitnessKind::kManuscript);
    for (int i = 0; i < prints; ++i) AddPrint();
    for (int i = 0; i < editions; ++i) AddEdition(i);
    Contaminate();
    Correctors();
    Name();
  }

 private:
  Hand ManuscriptHand() {
    const Script scripts[] = {Script::kHinduArabic, Script::kGreek, Script::kHebrew,
                              Script::kArabicAbjad, Script::kRoman};
    return {HandKind::kManuscript, scripts[rng_.Weighted({0.35, 0.15, 0.15, 0.2, 0.15})]};
  }

  int AddCopy(int exemplar, bool surviving, WitnessKind kind, int year = 0) {
    const Node& p = t_.nodes[static_cast<std::size_t>(exemplar)];
    Node n;
    n.parent = exemplar;
    n.surviving = surviving;
    n.kind = kind;
    n.hand = p.hand;
    if (kind == WitnessKind::kManuscript &&
        (p.kind != WitnessKind::kManuscript || rng_.Chance(o_.share_script_change))) {
      n.hand = ManuscriptHand();
    }
    if (kind != WitnessKind::kManuscript) n.hand = {HandKind::kPrint, Script::kPrinted};
    n.digitised = kind != WitnessKind::kManuscript && surviving && rng_.Chance(o_.share_digitised);
    if (year == 0) year = p.date.year + rng_.Int(3, 30);
    n.date = internal::DrawDate(year, kind, rng_);
    n.rate = kind == WitnessKind::kManuscript
                 ? rng_.Uniform(o_.manuscript_rate_min, o_.manuscript_rate_max)
             : kind == WitnessKind::kPrint ? rng_.Uniform(o_.print_rate_min, o_.print_rate_max)
                                           : rng_.Uniform(o_.edition_rate_min, o_.edition_rate_max);
    t_.nodes.push_back(std::move(n));
    return static_cast<int>(t_.nodes.size()) - 1;
  }

  std::vector<int> Select(bool (*keep)(const Node&)) const {
    std::vector<int> out;
    for (std::size_t i = 0; i < t_.nodes.size(); ++i) {
      if (keep(t_.nodes[i])) out.push_back(static_cast<int>(i));
    }
    return out;
  }

  // A surviving manuscript, an existing lost one, or a new lost copy of one.
  int ManuscriptExemplar() {
    const auto surviving =
        Select([](const Node& n) { return n.surviving && n.kind == WitnessKind::kManuscript; });
    if (!surviving.empty() && rng_.Chance(o_.share_copy_of_surviving)) return rng_.Pick(surviving);
    const int base = rng_.Pick(Select([](const Node& n) { return !n.surviving; }));
    if (!rng_.Chance(o_.share_new_lost)) return base;
    return AddCopy(base, false, WitnessKind::kManuscript);
  }

  void AddPrint() {
    const int exemplar =
        rng_.Pick(Select([](const Node& n) { return n.kind == WitnessKind::kManuscript; }));
    const int after = t_.nodes[static_cast<std::size_t>(exemplar)].date.year + rng_.Int(2, 30);
    AddCopy(exemplar, true, WitnessKind::kPrint, std::max(after, rng_.Int(1472, 1600)));
  }

  void AddEdition(int i) {
    const auto editions =
        Select([](const Node& n) { return n.kind == WitnessKind::kModernEdition; });
    const bool from_edition = i > 0 && rng_.Chance(o_.share_edition_from_edition);
    const int base = from_edition ? rng_.Pick(editions) : rng_.Pick(Select([](const Node& n) {
      return n.surviving && n.kind != WitnessKind::kModernEdition;
    }));
    int year =
        std::max(rng_.Int(1850, 1990), t_.nodes[static_cast<std::size_t>(base)].date.year + 5);
    for (int e : editions)
      year = std::max(year, t_.nodes[static_cast<std::size_t>(e)].date.year + rng_.Int(5, 30));
    Node& n =
        t_.nodes[static_cast<std::size_t>(AddCopy(base, true, WitnessKind::kModernEdition, year))];
    if (from_edition) return;  // a later edition: reprinted, with its own one-unit variants
    if (rng_.Chance(o_.share_edition_recomputed)) {
      n.corrector = CorrectorMode::kRecompute;
      n.derived_basis = rng_.Chance(0.5) ? "exact" : "tabulated";
    } else if (rng_.Chance(o_.share_edition_checks)) {
      n.corrector = CorrectorMode::kCheck;
      n.correction_share = rng_.Uniform(0.5, 1.0);
    }
  }

  bool IsAncestor(int a, int n) const {
    for (int p = t_.nodes[static_cast<std::size_t>(n)].parent; p >= 0;
         p = t_.nodes[static_cast<std::size_t>(p)].parent) {
      if (p == a) return true;
    }
    return false;
  }

  void Contaminate() {
    const int tables = static_cast<int>(t_.tables.size());
    for (std::size_t i = 1; i < t_.nodes.size(); ++i) {
      Node& n = t_.nodes[i];
      if (!n.surviving || n.kind != WitnessKind::kManuscript || !rng_.Chance(o_.share_contaminated))
        continue;
      std::vector<int> sources;
      for (std::size_t j = 1; j < t_.nodes.size(); ++j) {
        const Node& s = t_.nodes[j];
        if (j != i && s.kind == WitnessKind::kManuscript && s.date.year < n.date.year &&
            !IsAncestor(static_cast<int>(j), static_cast<int>(i)) &&
            !IsAncestor(static_cast<int>(i), static_cast<int>(j)))
          sources.push_back(static_cast<int>(j));
      }
      if (sources.empty()) continue;
      Contamination c;
      c.second = rng_.Pick(sources);
      c.between_tables = tables >= 2 && rng_.Chance(o_.share_between_tables);
      c.table = c.between_tables ? rng_.Int(1, tables - 1) : rng_.Int(0, tables - 1);
      const int rows =
          static_cast<int>(t_.tables[static_cast<std::size_t>(c.table)].text.rows.size());
      c.row = c.between_tables ? 0 : rng_.Int(rows / 4, std::max(rows / 4, 3 * rows / 4));
      n.contamination = c;
    }
  }

  void Correctors() {
    for (auto& n : t_.nodes) {
      if (!n.surviving || n.kind != WitnessKind::kManuscript || !rng_.Chance(o_.share_corrector))
        continue;
      n.corrector = CorrectorMode::kCheck;
      n.correction_share = rng_.Uniform(o_.corrector_share_min, o_.corrector_share_max);
    }
  }

  void Name() {
    int lost = 0, surviving = 0;
    for (const auto& n : t_.nodes) surviving += n.surviving ? 1 : 0;
    std::vector<std::string> sigla;
    for (int i = 0; i < surviving; ++i) sigla.push_back(std::string(1, static_cast<char>('A' + i)));
    rng_.Shuffle(sigla);
    for (std::size_t i = 1; i < t_.nodes.size(); ++i) {
      Node& n = t_.nodes[i];
      if (!n.surviving) {
        const auto k = static_cast<std::size_t>(lost++);
        n.name = std::string(kLostNames[k % kLostNames.size()]) +
                 (k >= kLostNames.size() ? std::to_string(k / kLostNames.size() + 1) : "");
        continue;
      }
      n.name = sigla.back();
      sigla.pop_back();
      if (n.kind == WitnessKind::kModernEdition) continue;
      n.library = rng_.Pick(kLibraries);
      n.shelfmark =
          (n.kind == WitnessKind::kPrint ? "Inc. " : "Cod. ") + std::to_string(rng_.Int(10, 999));
    }
  }

  Tradition& t_;
  const TraditionOptions& o_;
  Rng& rng_;
};

}  // namespace

const char* WitnessKindName(WitnessKind kind) {
  switch (kind) {
    case WitnessKind::kManuscript:
      return "manuscript";
    case WitnessKind::kPrint:
      return "print";
    case WitnessKind::kModernEdition:
      return "modern-edition";
  }
  return "";
}

const char* CorrectorModeName(CorrectorMode mode) {
  switch (mode) {
    case CorrectorMode::kNone:
      return "none";
    case CorrectorMode::kCheck:
      return "check";
    case CorrectorMode::kRecompute:
      return "recompute";
  }
  return "";
}

int Tradition::Find(const std::string& name) const {
  for (std::size_t i = 0; i < nodes.size(); ++i) {
    if (nodes[i].name == name) return static_cast<int>(i);
  }
  return -1;
}

std::vector<int> Tradition::Surviving() const {
  std::vector<int> out;
  for (std::size_t i = 0; i < nodes.size(); ++i) {
    if (nodes[i].surviving) out.push_back(static_cast<int>(i));
  }
  std::sort(out.begin(), out.end(), [&](int a, int b) {
    return nodes[static_cast<std::size_t>(a)].name < nodes[static_cast<std::size_t>(b)].name;
  });
  return out;
}

Tradition DrawTradition(Rng& rng, const TraditionOptions& o) {
  if (o.witnesses != 0 && (o.witnesses < 4 || o.witnesses > 26)) {
    throw std::invalid_argument("TraditionOptions::witnesses outside 4..26");
  }
  Tradition t;
  t.work = {"work", "An invented work of tables", "an invented author"};
  const int tables = o.tables > 0 ? o.tables : rng.Int(1, 3);
  for (int i = 0; i < tables; ++i) {
    AuthorTable table = DrawTable(rng, o.table, "t" + std::to_string(i + 1));
    table.text.work = t.work;
    t.tables.push_back(std::move(table));
  }
  Builder(t, o, rng).Grow(o.witnesses > 0 ? o.witnesses : rng.Int(4, 15));
  internal::CopyTexts(t, o, rng);
  return t;
}

Tradition DrawTradition(std::uint64_t seed, const TraditionOptions& o) {
  Rng rng(seed);
  return DrawTradition(rng, o);
}

}  // namespace apograph::synth
