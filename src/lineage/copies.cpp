// Direct copies: a witness holding all of another's errors (strong ones
// more than a unit off), later than it by its dates and kind
// (relations.hpp: FindCopies, CopiesRefusedByDates).
#include "lineage/relations.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <functional>
#include <sstream>

#include "lineage/corrections.hpp"

namespace apograph::lineage {

namespace {

bool Usable(const Character& ch) { return ch.Directed() && ch.weight > 0 && !ch.tie_break; }

// Whether b cannot be a copy of a because of the dates or the kinds.
bool Anachronism(const CharacterMatrix& m, int a, int b) { return CannotDescend(m, b, a); }

// Whether a's dates lie wholly before b's.
bool Older(const CharacterMatrix& m, int a, int b) {
  if (m.witnesses.size() != m.taxa.size()) return false;
  const auto da = m.witnesses[a].Dates(), db = m.witnesses[b].Dates();
  return da && db && da->WhollyBefore(*db);
}

std::string DateOf(const CharacterMatrix& m, int t) {
  return m.witnesses.size() == m.taxa.size() ? m.witnesses[t].date : "";
}

// A's errors against B's readings. `strong`: those B holds that are more
// than a unit off (one-unit differences arise independently too often to
// show a copy); `weak_corrected`: A's one-unit errors a corrector B reads
// right.
struct Tally {
  CopyCandidate candidate;
  bool contained = true;
  int strong = 0, weak_corrected = 0;
};

Tally Compare(const CharacterMatrix& m, int a, int b, bool corrector) {
  Tally t;
  CopyCandidate& c = t.candidate;
  c.exemplar = m.taxa[a];
  c.copy = m.taxa[b];
  int weak = 0;
  for (const auto& ch : m.characters) {
    if (!Usable(ch)) continue;
    const int sa = ch.states[a], sb = ch.states[b];
    if (sa == 1) {
      if (sb == 1) {
        ++c.exemplar_errors;
        weak += ch.one_unit;
      } else if (sb == -1) {
        ++c.unreadable;
      } else if (ch.omission) {
        ++c.filled;
      } else if (corrector && ch.base_is_right) {
        ++c.corrected;
        t.weak_corrected += ch.one_unit;
      } else {
        t.contained = false;
      }
    } else if (sa == 0 && sb == 1) {
      ++c.own_errors;
    }
  }
  t.strong = c.exemplar_errors - weak;
  return t;
}

// A corrector checks entries against the model within a tolerance and
// leaves one-unit differences as it finds them (judgement: a unit in the
// last place is what recomputation by hand cannot settle), so a corrected
// copy still holds its exemplar's one-unit errors. One that reads right at least as
// many of A's one-unit errors as it holds most likely never had them: a
// relative of A, not its copy. Measured: DEVELOPERS.md, "Lineage
// accuracy", seventh round.
bool NeverHadThem(const Tally& t) {
  const int weak_held = t.candidate.exemplar_errors - t.strong;
  return t.weak_corrected > 0 && t.weak_corrected >= weak_held;
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
  if (c.corrected >= kMinCorrections) {
    o << "; " << c.copy << " reads the recomputed value at " << c.corrected << " of them (it "
      << "corrects against the model)";
  } else if (c.corrected) {  // too few to call it a corrector (ReviseByExemplars)
    o << "; " << c.copy << " reads the recomputed value at " << c.corrected << " of them (a "
      << "correction, or a slip of " << c.exemplar << "'s transcription that no copy inherits)";
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

// Whether x is the closer exemplar: more of the copy's errors explained.
// (Then fewer of them read right by a corrector was tried: as many false
// claims as right ones more, DEVELOPERS.md "Lineage accuracy", sixth round.)
bool Closer(const CopyCandidate* x, const CopyCandidate* y) {
  return x->exemplar_errors > y->exemplar_errors;
}

std::string TiedText(const std::vector<const CopyCandidate*>& tied) {
  std::string names = tied.front()->exemplar;
  for (std::size_t k = 1; k < tied.size() && !Closer(tied.front(), tied[k]); ++k)
    names += " or " + tied[k]->exemplar;
  return tied.front()->copy + " holds all " + std::to_string(tied.front()->exemplar_errors) +
         " errors of " + names + ", which the errors cannot tell apart: it may be a copy of " +
         "one of them, or of a lost exemplar of theirs";
}

// Two witnesses each named a copy of the other (correctors, each reading
// right the errors of the other it does not hold): at most one claim can be
// right and the errors do not say which, so neither is made; the editor is
// told.
void DropMutual(std::vector<CopyCandidate>& copies, std::vector<std::string>* undecided) {
  std::vector<bool> drop(copies.size(), false);
  for (std::size_t i = 0; i < copies.size(); ++i) {
    for (std::size_t j = i + 1; j < copies.size(); ++j) {
      if (copies[i].copy != copies[j].exemplar || copies[i].exemplar != copies[j].copy) continue;
      drop[i] = drop[j] = true;
      if (undecided) {
        undecided->push_back(copies[i].copy + " and " + copies[i].exemplar +
                             " each hold all the other's errors that they do not read right: "
                             "either may be a copy of the other, or both of a lost exemplar (" +
                             copies[i].text + "; " + copies[j].text + ")");
      }
    }
  }
  std::vector<CopyCandidate> kept;
  for (std::size_t i = 0; i < copies.size(); ++i) {
    if (!drop[i]) kept.push_back(std::move(copies[i]));
  }
  copies = std::move(kept);
}

}  // namespace

std::vector<CopyCandidate> CopyCandidates(const CharacterMatrix& m,
                                          const std::vector<std::string>& correctors,
                                          int min_errors) {
  std::vector<CopyCandidate> out;
  const int n = static_cast<int>(m.taxa.size());
  for (int b = 0; b < n; ++b) {
    const bool corrector =
        std::find(correctors.begin(), correctors.end(), m.taxa[b]) != correctors.end();
    for (int a = 0; a < n; ++a) {
      if (a == b || Anachronism(m, a, b)) continue;
      const Tally t = Compare(m, a, b, corrector);
      CopyCandidate c = t.candidate;
      // min_errors of A's errors held, one of them more than a unit off;
      // all of them so when B reads right more of A's errors than it holds
      // (a corrector). Measured: DEVELOPERS.md, "Lineage accuracy", sixth round.
      const int needed = c.corrected > c.exemplar_errors ? min_errors : std::min(min_errors, 1);
      if (!t.contained || t.strong < needed || c.exemplar_errors < min_errors || NeverHadThem(t))
        continue;
      if (c.own_errors == 0) {
        const bool back = Compare(m, b, a, false).contained;  // a holds all b's errors too
        if (back && Older(m, a, b)) {
          c.dated = true;
        } else if (back && !Older(m, b, a)) {
          c.twins = true;
        }
      }
      c.text = CopyText(m, c);
      out.push_back(c);
    }
  }
  return out;
}

std::vector<CopyCandidate> ChooseCopies(const CharacterMatrix& m,
                                        const std::vector<CopyCandidate>& candidates,
                                        const std::function<bool(const CopyCandidate&)>& admissible,
                                        std::vector<std::string>* undecided) {
  std::vector<CopyCandidate> out;
  for (const auto& copy : m.taxa) {
    std::vector<const CopyCandidate*> mine;
    for (const auto& c : candidates) {
      if (c.copy == copy && (!admissible || admissible(c))) mine.push_back(&c);
    }
    if (mine.empty()) continue;
    std::stable_sort(mine.begin(), mine.end(), Closer);
    const CopyCandidate& best = *mine.front();
    // Twins are reported once, from the side of the first; a witness
    // whose closest relative is its twin is no candidate copy of another.
    if (best.twins && m.TaxonIndex(best.exemplar) < m.TaxonIndex(best.copy)) continue;
    if (mine.size() > 1 && !Closer(mine.front(), mine[1])) {
      if (undecided) undecided->push_back(TiedText(mine));
      continue;
    }
    out.push_back(best);
  }
  DropMutual(out, undecided);
  std::stable_sort(out.begin(), out.end(), [](const CopyCandidate& x, const CopyCandidate& y) {
    return x.exemplar_errors > y.exemplar_errors;
  });
  return out;
}

std::vector<CopyCandidate> FindCopies(const CharacterMatrix& m,
                                      const std::vector<std::string>& correctors, int min_errors) {
  return ChooseCopies(m, CopyCandidates(m, correctors, min_errors));
}

std::vector<std::string> CopiesRefusedByDates(const CharacterMatrix& m, int min_errors) {
  std::vector<std::string> out;
  const int n = static_cast<int>(m.taxa.size());
  for (int b = 0; b < n; ++b) {
    for (int a = 0; a < n; ++a) {
      if (a == b || !Anachronism(m, a, b)) continue;
      const Tally t = Compare(m, a, b, false);
      const CopyCandidate& c = t.candidate;
      if (!t.contained || t.strong < min_errors || c.own_errors == 0) continue;
      out.push_back(m.taxa[b] + " holds all " + std::to_string(c.exemplar_errors) + " of " +
                    m.taxa[a] + "'s errors, but cannot be its copy: " + m.taxa[b] + " (" +
                    m.witnesses[b].date + ", " + m.witnesses[b].kind + ") is older than " +
                    m.taxa[a] + " (" + m.witnesses[a].date + ", " + m.witnesses[a].kind +
                    "); both may descend from a lost exemplar");
    }
  }
  return out;
}

bool CannotDescend(const CharacterMatrix& m, int copy, int exemplar) {
  if (m.witnesses.size() != m.taxa.size()) return false;
  const WitnessInfo &we = m.witnesses[static_cast<std::size_t>(exemplar)],
                    &wc = m.witnesses[static_cast<std::size_t>(copy)];
  const auto de = we.Dates(), dc = wc.Dates();
  if (de && dc && dc->WhollyBefore(*de)) return true;
  return we.Kind() == WitnessKind::kModernEdition && wc.Kind() != WitnessKind::kModernEdition;
}

}  // namespace apograph::lineage
