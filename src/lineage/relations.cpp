#include "lineage/relations.hpp"

#include <algorithm>
#include <cmath>
#include <optional>
#include <sstream>

namespace apograph::lineage {

namespace {

bool Usable(const Character& ch) { return ch.Directed() && ch.weight > 0 && !ch.tie_break; }

// Whether b cannot be a copy of a because of the dates or the kinds.
bool Anachronism(const CharacterMatrix& m, int a, int b) {
  if (m.witnesses.size() != m.taxa.size()) return false;
  const WitnessInfo &wa = m.witnesses[a], &wb = m.witnesses[b];
  const auto da = wa.Dates(), db = wb.Dates();
  if (da && db && db->WhollyBefore(*da)) return true;
  return wa.Kind() == WitnessKind::kModernEdition && wb.Kind() != WitnessKind::kModernEdition;
}

// Whether a's dates lie wholly before b's.
bool Older(const CharacterMatrix& m, int a, int b) {
  if (m.witnesses.size() != m.taxa.size()) return false;
  const auto da = m.witnesses[a].Dates(), db = m.witnesses[b].Dates();
  return da && db && da->WhollyBefore(*db);
}

std::string DateOf(const CharacterMatrix& m, int t) {
  return m.witnesses.size() == m.taxa.size() ? m.witnesses[t].date : "";
}

// `strong`: the exemplar's errors found in the copy that are more than a
// unit off (one-unit differences arise independently too often to show a copy).
CopyCandidate Compare(const CharacterMatrix& m, int a, int b, bool corrector, bool& contained,
                      int& strong) {
  int weak = 0;
  CopyCandidate c;
  c.exemplar = m.taxa[a];
  c.copy = m.taxa[b];
  contained = true;
  for (const auto& ch : m.characters) {
    if (!Usable(ch)) continue;
    const int sa = ch.states[a], sb = ch.states[b];
    if (sa == 1) {
      if (sb == 1)
        ++c.exemplar_errors;
      else if (sb == -1)
        ++c.unreadable;
      else if (ch.omission)
        ++c.filled;
      else if (corrector && ch.base_is_right)
        ++c.corrected;
      else
        contained = false;
    } else if (sa == 0 && sb == 1) {
      ++c.own_errors;
    }
    if (sa == 1 && sb == 1 && ch.one_unit) ++weak;
  }
  strong = c.exemplar_errors - weak;
  return c;
}

std::string CopyText(const CharacterMatrix& m, const CopyCandidate& c) {
  std::ostringstream o;
  if (c.twins) {
    o << c.copy << " and " << c.exemplar << " carry the same " << c.exemplar_errors
      << " errors: one may be a copy of the other, or both of a lost exemplar";
  } else if (c.dated) {
    o << c.copy << " may be a copy of " << c.exemplar << ": they carry the same "
      << c.exemplar_errors << " errors and " << c.exemplar << " is the older";
  } else {
    o << c.copy << " may be a copy of " << c.exemplar << ": " << c.copy << " has all "
      << c.exemplar_errors << " of " << c.exemplar << "'s errors and " << c.own_errors
      << " of its own";
  }
  if (c.corrected) {
    o << "; " << c.copy << " reads the recomputed value at " << c.corrected << " of them (it "
      << "corrects against the model)";
  }
  if (c.filled) {
    o << "; " << c.copy << " fills in " << c.filled << (c.filled == 1 ? " entry " : " entries ")
      << c.exemplar << " leaves blank";
  }
  if (c.unreadable) {
    o << " (at " << c.unreadable << " more of " << c.exemplar << "'s errors " << c.copy
      << " cannot be compared: illegible there, or with an error of its own)";
  }
  const std::string da = DateOf(m, m.TaxonIndex(c.exemplar)), db = DateOf(m, m.TaxonIndex(c.copy));
  if (!da.empty() && !db.empty())
    o << " [dates: " << c.exemplar << " " << da << ", " << c.copy << " " << db << "]";
  return o.str();
}

}  // namespace

std::vector<CopyCandidate> FindCopies(const CharacterMatrix& m,
                                      const std::vector<std::string>& correctors, int min_errors) {
  std::vector<CopyCandidate> out;
  const int n = static_cast<int>(m.taxa.size());
  for (int b = 0; b < n; ++b) {
    const bool corrector =
        std::find(correctors.begin(), correctors.end(), m.taxa[b]) != correctors.end();
    std::optional<CopyCandidate> best;
    for (int a = 0; a < n; ++a) {
      if (a == b || Anachronism(m, a, b)) continue;
      bool contained = false;
      int strong = 0;
      CopyCandidate c = Compare(m, a, b, corrector, contained, strong);
      if (!contained || strong < min_errors) continue;
      if (c.own_errors == 0) {
        bool back = false;  // does a hold all of b's errors too?
        int ignored = 0;
        Compare(m, b, a, false, back, ignored);
        if (back && Older(m, a, b)) {
          c.dated = true;
        } else if (back && !Older(m, b, a)) {
          c.twins = true;
        }
      }
      if (!best || c.exemplar_errors > best->exemplar_errors) best = c;
    }
    // Twins are reported once, from the side of the first; a witness
    // whose closest relative is its twin is no candidate copy of another.
    if (best && best->twins && m.TaxonIndex(best->exemplar) < b) continue;
    if (best) {
      best->text = CopyText(m, *best);
      out.push_back(*best);
    }
  }
  std::stable_sort(out.begin(), out.end(), [](const CopyCandidate& x, const CopyCandidate& y) {
    return x.exemplar_errors > y.exemplar_errors;
  });
  return out;
}

std::vector<std::string> CopiesRefusedByDates(const CharacterMatrix& m, int min_errors) {
  std::vector<std::string> out;
  const int n = static_cast<int>(m.taxa.size());
  for (int b = 0; b < n; ++b) {
    for (int a = 0; a < n; ++a) {
      if (a == b || !Anachronism(m, a, b)) continue;
      bool contained = false;
      int strong = 0;
      const CopyCandidate c = Compare(m, a, b, false, contained, strong);
      if (!contained || strong < min_errors || c.own_errors == 0) continue;
      out.push_back(m.taxa[b] + " holds all " + std::to_string(c.exemplar_errors) + " of " +
                    m.taxa[a] + "'s errors, but cannot be its copy: " + m.taxa[b] + " (" +
                    m.witnesses[b].date + ", " + m.witnesses[b].kind + ") is older than " +
                    m.taxa[a] + " (" + m.witnesses[a].date + ", " + m.witnesses[a].kind +
                    "); both may descend from a lost exemplar");
    }
  }
  return out;
}

namespace {

bool Evidence(const Character& ch) { return Usable(ch) && !ch.one_unit && ch.weight >= 1; }

// C's errors in usable characters (indices). Errors in neighbouring rows
// carried by the same witnesses count once (one slip of the eye can spoil
// two rows).
std::vector<std::size_t> ErrorsOf(const CharacterMatrix& m, int c) {
  std::vector<std::size_t> out;
  for (std::size_t k = 0; k < m.characters.size(); ++k) {
    const Character& ch = m.characters[k];
    if (!Evidence(ch) || ch.states[c] != 1) continue;
    if (!out.empty()) {
      const Character& last = m.characters[out.back()];
      if (ch.position - last.position <= 1 && ch.states == last.states) continue;
    }
    out.push_back(k);
  }
  return out;
}

// Witnesses holding every one of C's errors where they can be read (two or
// more): its descendants.
std::vector<bool> Descendants(const CharacterMatrix& m, int c, const std::vector<std::size_t>& e) {
  std::vector<bool> out(m.taxa.size(), false);
  for (std::size_t x = 0; x < m.taxa.size(); ++x) {
    int held = 0;
    bool all = static_cast<int>(x) != c;
    for (std::size_t k : e) {
      all = all && m.characters[k].states[x] != 0;
      held += m.characters[k].states[x] == 1 ? 1 : 0;
    }
    out[x] = all && held >= 2;
  }
  return out;
}

struct Side {
  double weight = 0;
  int count = 0;
};

struct PairEvidence {
  int x = -1, y = -1;
  Side with_x, with_y;  // C with x against y; C with y against x
  double Score() const {
    return with_x.count >= 2 && with_y.count >= 2 ? std::min(with_x.weight, with_y.weight) : 0;
  }
};

PairEvidence BestPair(const CharacterMatrix& m, int c, const std::vector<std::size_t>& e) {
  const auto below = Descendants(m, c, e);
  const int n = static_cast<int>(m.taxa.size());
  PairEvidence best;
  for (int x = 0; x < n; ++x) {
    if (x == c || below[x]) continue;
    for (int y = x + 1; y < n; ++y) {
      if (y == c || below[y]) continue;
      PairEvidence p{x, y, {}, {}};
      for (std::size_t k : e) {
        const auto& s = m.characters[k].states;
        const double w = m.characters[k].weight;
        if (s[x] == 1 && s[y] == 0) p.with_x.weight += w, ++p.with_x.count;
        if (s[y] == 1 && s[x] == 0) p.with_y.weight += w, ++p.with_y.count;
      }
      if (p.Score() > best.Score()) best = p;
    }
  }
  return best;
}

void Describe(const CharacterMatrix& m, int c, const std::vector<std::size_t>& e,
              const PairEvidence& p, Contamination& out) {
  const bool x_first = p.with_x.weight >= p.with_y.weight;
  out.witness = m.taxa[c];
  out.primary = m.taxa[x_first ? p.x : p.y];
  out.secondary = m.taxa[x_first ? p.y : p.x];
  out.primary_evidence = x_first ? p.with_x.weight : p.with_y.weight;
  out.secondary_evidence = x_first ? p.with_y.weight : p.with_x.weight;
  for (std::size_t k : e) {  // e is in table order
    const auto& s = m.characters[k].states;
    int side = -1;
    if (s[p.x] == 1 && s[p.y] == 0) side = p.x;
    if (s[p.y] == 1 && s[p.x] == 0) side = p.y;
    if (side < 0) continue;
    if (out.segments.empty() || out.segments.back().relative != m.taxa[side]) {
      ContaminationSegment seg;
      seg.relative = m.taxa[side];
      seg.first_row = m.characters[k].row_label;
      seg.first_position = m.characters[k].position;
      out.segments.push_back(seg);
    }
    auto& seg = out.segments.back();
    seg.last_row = m.characters[k].row_label;
    seg.last_position = m.characters[k].position;
    ++seg.shared;
    ++seg.against;
  }
  std::ostringstream text;
  text << out.witness << " follows ";
  for (std::size_t i = 0; i < out.segments.size(); ++i) {
    const auto& seg = out.segments[i];
    text << (i == 0 ? "" : (i + 1 == out.segments.size() ? " and " : ", ")) << seg.relative
         << " in rows " << seg.first_row
         << (seg.first_row == seg.last_row ? "" : " to " + seg.last_row);
  }
  text << " (" << out.witness << " shares " << p.with_x.count << " errors with " << m.taxa[p.x]
       << " that " << m.taxa[p.y] << " lacks, and " << p.with_y.count << " with " << m.taxa[p.y]
       << " that " << m.taxa[p.x] << " lacks; copied along one line it could share only one of "
       << "these sets); rows between the stretches cannot be assigned";
  out.text = text.str();
}

// Whether every one of d's evidence errors is also c's (c descends from d).
bool Holds(const CharacterMatrix& m, int c, int d) {
  const auto e = ErrorsOf(m, d);
  if (e.size() < 2) return false;
  for (std::size_t k : e) {
    if (m.characters[k].states[c] != 1) return false;
  }
  return true;
}

}  // namespace

std::vector<Contamination> FindContamination(const CharacterMatrix& m, double min_evidence,
                                             std::vector<Contamination>* suspected) {
  std::vector<Contamination> found;
  std::vector<int> who;
  std::vector<PairEvidence> pairs;
  if (m.taxa.size() < 3) return found;
  for (int c = 0; c < static_cast<int>(m.taxa.size()); ++c) {
    const auto e = ErrorsOf(m, c);
    const PairEvidence p = BestPair(m, c, e);
    if (p.Score() < min_evidence) {
      if (suspected && p.Score() >= std::min(min_evidence, kSuspectedContaminationEvidence)) {
        Contamination weak;
        Describe(m, c, e, p, weak);
        suspected->push_back(std::move(weak));
      }
      continue;
    }
    Contamination out;
    Describe(m, c, e, p, out);
    found.push_back(std::move(out));
    who.push_back(c);
    pairs.push_back(p);
  }
  // Two witnesses that name each other: the one copied from both lines
  // shows the stronger mixture; the other is one of its exemplars (it
  // shares its own errors with its copy).
  std::vector<bool> drop(found.size(), false);
  for (std::size_t i = 0; i < found.size(); ++i) {
    for (std::size_t j = 0; j < found.size(); ++j) {
      const bool names = pairs[i].x == who[j] || pairs[i].y == who[j];
      const bool named = pairs[j].x == who[i] || pairs[j].y == who[i];
      if (i != j && names && named && pairs[i].Score() < pairs[j].Score()) drop[i] = true;
    }
  }
  for (std::size_t i = found.size(); i-- > 0;) {
    if (!drop[i]) continue;
    found.erase(found.begin() + static_cast<long>(i));
    who.erase(who.begin() + static_cast<long>(i));
    pairs.erase(pairs.begin() + static_cast<long>(i));
  }
  std::vector<Contamination> kept;
  for (std::size_t i = 0; i < found.size(); ++i) {
    int from = -1;
    for (std::size_t j = 0; j < found.size(); ++j) {
      if (i != j && Holds(m, who[i], who[j])) from = static_cast<int>(j);
    }
    if (from >= 0 && !Holds(m, who[from], who[i])) {
      found[from].inherited_by.push_back(found[i].witness);
      continue;
    }
    kept.push_back(found[i]);
  }
  for (auto& k : kept) {  // inherited_by was filled on `found`
    for (const auto& f : found) {
      if (f.witness == k.witness) k.inherited_by = f.inherited_by;
    }
  }
  return kept;
}

CharacterMatrix MaskSecondaryExemplar(const CharacterMatrix& m,
                                      const std::vector<Contamination>& cs) {
  CharacterMatrix out = m;
  for (const auto& c : cs) {
    const int t = m.TaxonIndex(c.witness);
    if (t < 0 || c.segments.empty()) continue;
    for (auto& ch : out.characters) {
      const ContaminationSegment* nearest = nullptr;
      int gap = 0;
      for (const auto& seg : c.segments) {
        const int d = ch.position < seg.first_position  ? seg.first_position - ch.position
                      : ch.position > seg.last_position ? ch.position - seg.last_position
                                                        : 0;
        if (!nearest || d < gap) nearest = &seg, gap = d;
      }
      if (nearest->relative == c.secondary) ch.states[t] = -1;
    }
  }
  return out;
}

}  // namespace apograph::lineage
