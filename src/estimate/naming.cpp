// Ties decided by evidence: candidates set aside for unhistorical estimates,
// equivalent models folded into one explanation under the name the evidence
// chooses, and the near-ties that remain, said with what tells them apart.
#include <algorithm>
#include <cctype>
#include <cmath>
#include <sstream>

#include "estimate/identify_internal.hpp"
#include "estimate/notation.hpp"

namespace apograph::estimate::internal {

namespace {

constexpr double kNearTie = 2.0;  // score difference below which candidates tie (judgement:
                                  // a likelihood ratio below e^2 after the penalty)

/// An attested value counts for a name when the estimate lies within this
/// many standard errors of it (judgement: the usual 3-sigma rule) or within
/// 1% of its value when the error is not known.
constexpr double kAttestedSigmas = 3;

std::string Lower(std::string s) {
  for (char& c : s) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return s;
}

bool Alpha(char c) { return std::isalpha(static_cast<unsigned char>(c)) != 0; }

/// `word` stands in `text` as a word of its own or its plural ("day" in
/// "days", not in "daylight").
bool HasWord(const std::string& text, const std::string& word) {
  for (std::size_t at = text.find(word); at != std::string::npos; at = text.find(word, at + 1)) {
    const std::size_t end = at + word.size();
    const bool start_ok = at == 0 || !Alpha(text[at - 1]);
    const bool end_ok = end == text.size() || !Alpha(text[end]) ||
                        (text[end] == 's' && (end + 1 == text.size() || !Alpha(text[end + 1])));
    if (start_ok && end_ok) return true;
  }
  return false;
}

/// The two candidates compute the same value at every entry either
/// explains (within one unit of the tabulated value); where both miss the
/// entry (a copyist's slip) their values may differ: that says nothing about
/// which model the author used.
bool SameValues(const Candidate& a, const Candidate& b) {
  if (a.fit.entries.size() != b.fit.entries.size()) return false;
  for (std::size_t i = 0; i < a.fit.entries.size(); ++i) {
    const auto& ea = a.fit.entries[i];
    const auto& eb = b.fit.entries[i];
    const bool explained = std::fabs(ea.diff_units) <= 1 || std::fabs(eb.diff_units) <= 1;
    if (!explained) continue;
    if (ea.computed.has_value() != eb.computed.has_value() ||
        (ea.computed && !(*ea.computed == *eb.computed)))
      return false;
  }
  return true;
}

/// Position in the registry (built-ins first, in their order).
int RegistryIndex(const model::Model* m) {
  const auto all = model::BuiltinModels();
  const auto it = std::find(all.begin(), all.end(), m);
  return it == all.end() ? static_cast<int>(all.size()) : static_cast<int>(it - all.begin());
}

/// How a table of years' arguments run: single years (the first positive
/// argument is 1: 1, 2, 3 ..., the expanded years), groups (every argument
/// a multiple of the first positive one, at least 2: 20, 40, 60 ..., the
/// collected years), or neither.
std::string YearPattern(const Transcription& table) {
  std::vector<double> args;
  for (std::size_t r = 0; r < table.rows.size(); ++r) {
    if (auto a = model::RowArgument(table, r); a && *a > 0) args.push_back(*a);
  }
  if (args.size() < 3) return {};
  const double first = *std::min_element(args.begin(), args.end());
  if (first == 1) return "single";
  if (first < 2 || first != std::floor(first)) return {};
  for (double a : args) {
    if (std::fmod(a, first) != 0) return {};
  }
  return "groups";
}

/// The argument pattern each model of a table of years is defined for (the
/// models' conventions: single years / collected years in groups).
std::string PatternOf(const model::Model& m) {
  if (m.name() == "mean-motion-years") return "single";
  if (m.name() == "mean-motion-collected") return "groups";
  return {};
}

/// What speaks for one member of a group of equivalents.
struct Evidence {
  const Candidate* c = nullptr;
  std::string arguments;  ///< the arguments run as the model's convention says ("single", "groups")
  std::string kind_word;  ///< the word of the table's kind that names it
  bool in_range = true;   ///< every free parameter within its historical range
  std::string attested;   ///< "r = 5;15 (2nd-century ...)" near an estimate
  int free = 0;
  double width = 0;  ///< summed widths of the free parameters' historical ranges
  int order = 0;
};

Evidence Weigh(const Candidate& c, const Transcription& table,
               const std::vector<CatalogEntry>* catalog) {
  Evidence e;
  e.c = &c;
  const std::string kind = Lower(table.kind + " " + table.table_title + " " + table.argument.name +
                                 " " + table.argument.unit);
  for (const auto& w : c.model->traits().kind_words) {
    if (!w.empty() && HasWord(kind, w)) {
      e.kind_word = w;
      break;
    }
  }
  // A table of years: the word names both models of years, the arguments
  // tell single from collected years.
  if (const std::string own = PatternOf(*c.model); !own.empty() && HasWord(kind, "year")) {
    if (e.kind_word.empty()) e.kind_word = "year";
    if (own == YearPattern(table)) e.arguments = own;
  }
  const auto& specs = c.model->params();
  e.free = c.fit.free_parameters;  // a displacement constant counts (a displaced form is richer)
  for (std::size_t j = 0; j < specs.size() && j < c.fit.params.size(); ++j) {
    const auto& p = c.fit.params[j];
    if (p.fixed) continue;
    e.width += specs[j].high - specs[j].low;
    e.in_range = e.in_range && p.value >= specs[j].low && p.value <= specs[j].high;
    // A value the entries cannot separate is arbitrary: its nearness to an
    // attested value says nothing.
    if (!catalog || !e.attested.empty() || !p.separable) continue;
    for (const auto& m :
         NearestAttested(*catalog, c.model->name(), p.name, p.value, p.stderr_, 1)) {
      const bool near = std::isfinite(m.distance_se) && p.stderr_ > 0
                            ? m.distance_se <= kAttestedSigmas
                            : std::fabs(m.distance) <= 0.01 * std::fabs(p.value);
      if (near)
        e.attested = p.name + " = " + m.entry.value.ToString() + " (" + m.entry.tradition + ")";
    }
  }
  e.order = RegistryIndex(c.model);
  return e;
}

/// The member the evidence names: the table's kind, the arguments as the
/// model's convention has them (single or collected years), then the historical
/// ranges, then an attested value, then the simpler model, then the more
/// specific model (narrower historical ranges that still hold the
/// estimates: a moon's epicycle rather than any epicycle; judgement), then
/// the registry's order.
bool Before(const Evidence& a, const Evidence& b) {
  if (a.kind_word.empty() != b.kind_word.empty()) return !a.kind_word.empty();
  if (a.arguments.empty() != b.arguments.empty()) return !a.arguments.empty();
  if (a.in_range != b.in_range) return a.in_range;
  if (a.attested.empty() != b.attested.empty()) return !a.attested.empty();
  if (a.free != b.free) return a.free < b.free;
  if (a.in_range && a.width != b.width) return a.width < b.width;
  return a.order < b.order;
}

/// The sentence saying why `shown` was named rather than the others.
std::string NamingText(const Evidence& shown, const std::vector<Evidence>& others) {
  std::string names;
  for (const auto& o : others) names += (names.empty() ? "" : ", ") + o.c->model->name();
  std::string s = "named " + shown.c->model->name() + " rather than " + names +
                  " (they compute the same value at every entry they explain): ";
  const Evidence& rival = others.front();
  if (!shown.kind_word.empty() && rival.kind_word.empty()) {
    s += "the table's kind, title or argument says \"" + shown.kind_word + "\"";
  } else if (!shown.arguments.empty() && rival.arguments.empty()) {
    s += shown.arguments == "single"
             ? "the arguments are single years (1, 2, 3 ...)"
             : "the arguments are collected years, multiples of the first (20, 40, 60 ...)";
  } else if (shown.in_range && !rival.in_range) {
    s += "its estimates lie in its historical ranges, " + rival.c->model->name() + "'s do not";
  } else if (!shown.attested.empty() && rival.attested.empty()) {
    s += "the estimate is near the attested " + shown.attested;
  } else if (shown.free < rival.free) {
    s += "the simpler model (" + std::to_string(shown.free) + " parameter" +
         (shown.free == 1 ? "" : "s") + " against " + std::to_string(rival.free) +
         ") explains as much";
  } else if (shown.in_range && shown.width < rival.width) {
    if (!shown.kind_word.empty())
      s += "the table's kind, title or argument says \"" + shown.kind_word + "\", and ";
    s +=
        "its historical ranges, narrower than " + rival.c->model->name() + "'s, hold the estimates";
  } else {
    s += "nothing in the table's kind, the historical ranges or the attested values tells "
         "them apart; the first in the list of models is shown";
  }
  return s + ".";
}

}  // namespace

std::string Implausible(const Candidate& c) {
  const auto& specs = c.model->params();
  for (std::size_t j = 0; j < specs.size() && j < c.fit.params.size(); ++j) {
    const auto& p = c.fit.params[j];
    const double width = specs[j].high - specs[j].low;
    if (p.fixed || !(width > 0)) continue;
    if (p.value < specs[j].low - width || p.value > specs[j].high + width) {
      return p.name + " = " + NumberText(p.value) + ", far outside its historical range " +
             NumberText(specs[j].low) + " .. " + NumberText(specs[j].high);
    }
  }
  return {};
}

void SetAsideImplausible(std::vector<Candidate>& all, std::vector<std::string>& notes) {
  std::vector<Candidate> plausible, aside;
  for (auto& c : all) {
    const std::string why = Implausible(c);
    if (why.empty()) {
      plausible.push_back(std::move(c));
      continue;
    }
    if (plausible.empty()) {
      std::ostringstream o;
      o.precision(4);
      o << c.model->name() << " (" << c.PracticeText() << ") scores " << c.score << " but with "
        << why << "; ranked after the explanations with historical values.";
      notes.push_back(o.str());
    }
    aside.push_back(std::move(c));
  }
  if (plausible.empty()) {  // nothing better: keep the order and say so
    all = std::move(aside);
    return;
  }
  for (auto& c : aside) plausible.push_back(std::move(c));
  all = std::move(plausible);
}

void FoldEquivalents(std::vector<Candidate>& ranked, const Transcription& table,
                     const std::vector<CatalogEntry>* catalog) {
  std::vector<bool> folded(ranked.size(), false);
  std::vector<Candidate> out;
  for (std::size_t i = 0; i < ranked.size(); ++i) {
    if (folded[i]) continue;
    std::vector<std::size_t> group = {i};
    for (std::size_t j = i + 1; j < ranked.size(); ++j) {
      bool model_seen = false;
      for (std::size_t g : group) model_seen = model_seen || ranked[g].model == ranked[j].model;
      if (!folded[j] && !model_seen && SameValues(ranked[i], ranked[j])) {
        group.push_back(j);
        folded[j] = true;
      }
    }
    if (group.size() == 1) {
      out.push_back(std::move(ranked[i]));
      continue;
    }
    std::vector<Evidence> ev;
    for (std::size_t g : group) ev.push_back(Weigh(ranked[g], table, catalog));
    std::stable_sort(ev.begin(), ev.end(), Before);
    Candidate shown = *ev.front().c;
    std::vector<Evidence> others(ev.begin() + 1, ev.end());
    for (const auto& o : others) shown.equivalents.push_back({o.c->model, o.c->fit.params});
    shown.naming = NamingText(ev.front(), others);
    out.push_back(std::move(shown));
  }
  ranked = std::move(out);
}

namespace {

/// What tells two candidates apart, in words.
std::string Difference(const Candidate& a, const Candidate& b, const Transcription& table) {
  std::vector<std::string> parts;
  if (a.model != b.model)
    parts.push_back("the model (" + a.model->name() + " / " + b.model->name() + ")");
  if (a.PracticeText() != b.PracticeText())
    parts.push_back("the practice (" + a.PracticeText() + " / " + b.PracticeText() + ")");
  std::vector<std::string> args;
  for (std::size_t i = 0; i < a.fit.entries.size() && i < b.fit.entries.size(); ++i) {
    const auto& x = a.fit.entries[i].computed;
    const auto& y = b.fit.entries[i].computed;
    if (x.has_value() != y.has_value() || (x && !(*x == *y)))
      args.push_back(ArgumentText(table, a.fit.entries[i].row));
  }
  std::string s;
  for (std::size_t i = 0; i < parts.size(); ++i) s += (i ? " and " : "") + parts[i];
  if (args.empty())
    return s +
           "; they compute the same value at every entry, so the entries cannot tell them apart";
  s += "; their computed values differ at " + std::to_string(args.size()) + " entries (argument";
  s += args.size() > 1 ? "s " : " ";
  for (std::size_t i = 0; i < args.size() && i < 8; ++i) s += (i ? ", " : "") + args[i];
  if (args.size() > 8) s += ", ...";
  return s + ")";
}

}  // namespace

void NearTieNotes(const std::vector<Candidate>& ranked, const Transcription& table, int top,
                  std::vector<std::string>& notes) {
  for (std::size_t i = 1; i < ranked.size() && i < static_cast<std::size_t>(top); ++i) {
    if (ranked[0].score - ranked[i].score >= kNearTie) break;
    std::ostringstream o;
    o.precision(4);
    o << ranked[0].model->name() << " (" << ranked[0].PracticeText() << ") and "
      << ranked[i].model->name() << " (" << ranked[i].PracticeText()
      << ") explain the column about equally well (score " << ranked[0].score << " vs "
      << ranked[i].score << "); they differ in " << Difference(ranked[0], ranked[i], table) << ".";
    notes.push_back(o.str());
  }
}

}  // namespace apograph::estimate::internal
