#include "lineage/relations.hpp"

#include <algorithm>
#include <limits>
#include <sstream>

namespace apograph::lineage {

namespace {

CopyCandidate Compare(const CharacterMatrix& m, int a, int b, bool& contained) {
  CopyCandidate c;
  c.exemplar = m.taxa[a];
  c.copy = m.taxa[b];
  contained = true;
  for (const auto& ch : m.characters) {
    const int sa = ch.states[a], sb = ch.states[b];
    if (sa == 1) {
      if (sb == 1)
        ++c.exemplar_errors;
      else if (sb == -1)
        ++c.unreadable;
      else if (ch.omission)
        ++c.filled;
      else
        contained = false;
    } else if (sa == 0 && sb == 1) {
      ++c.own_errors;
    }
  }
  return c;
}

std::string CopyText(const CopyCandidate& c) {
  std::ostringstream o;
  if (c.twins) {
    o << c.copy << " and " << c.exemplar << " carry the same " << c.exemplar_errors
      << " errors: one may be a copy of the other, or both of a lost exemplar";
  } else {
    o << c.copy << " may be a copy of " << c.exemplar << ": " << c.copy << " has all "
      << c.exemplar_errors << " of " << c.exemplar << "'s errors and " << c.own_errors
      << " of its own";
  }
  if (c.filled) {
    o << "; " << c.copy << " fills in " << c.filled << (c.filled == 1 ? " entry " : " entries ")
      << c.exemplar << " leaves blank";
  }
  if (c.unreadable) {
    o << " (at " << c.unreadable << " more of " << c.exemplar << "'s errors " << c.copy
      << " cannot be compared: illegible there, or with an error of its own)";
  }
  return o.str();
}

}  // namespace

std::vector<CopyCandidate> FindCopies(const CharacterMatrix& m, int min_errors) {
  std::vector<CopyCandidate> out;
  const int n = static_cast<int>(m.taxa.size());
  for (int b = 0; b < n; ++b) {
    std::optional<CopyCandidate> best;
    for (int a = 0; a < n; ++a) {
      if (a == b) continue;
      bool contained = false;
      CopyCandidate c = Compare(m, a, b, contained);
      if (!contained || c.exemplar_errors < min_errors) continue;
      if (c.own_errors == 0) {
        c.twins = true;
        if (a < b) continue;  // reported once, from the other side
      }
      if (!best || c.exemplar_errors > best->exemplar_errors) best = c;
    }
    if (best) {
      best->text = CopyText(*best);
      out.push_back(*best);
    }
  }
  std::stable_sort(out.begin(), out.end(), [](const CopyCandidate& x, const CopyCandidate& y) {
    return x.exemplar_errors > y.exemplar_errors;
  });
  return out;
}

namespace {

constexpr double kSwitchPenalty = 4;  // in weight units: a change of exemplar must pay for itself

// Agreement of witness c with relative x on one character.
double Score(const Character& ch, int c, int x) {
  const int sc = ch.states[c], sx = ch.states[x];
  if (sc < 0 || sx < 0 || (sc == 0 && sx == 0)) return 0;
  return sc == sx ? ch.weight : -ch.weight;
}

struct Segment {
  int relative;
  std::size_t first, last;  // indices into the character list
};

// A witness that carries every error of c (two or more) probably descends
// from c; it cannot have been c's exemplar, so it is no candidate.
std::vector<bool> Excluded(const CharacterMatrix& m, int c) {
  std::vector<bool> out(m.taxa.size(), false);
  out[c] = true;
  for (std::size_t x = 0; x < m.taxa.size(); ++x) {
    int mine = 0, missed = 0;
    for (const auto& ch : m.characters) {
      if (ch.states[c] != 1) continue;
      ++mine;
      missed += ch.states[x] == 0 ? 1 : 0;
    }
    if (mine >= 2 && missed == 0) out[x] = true;
  }
  return out;
}

std::vector<Segment> Viterbi(const CharacterMatrix& m, int c) {
  const int n = static_cast<int>(m.taxa.size());
  const std::size_t k = m.characters.size();
  const std::vector<bool> excluded = Excluded(m, c);
  std::vector<double> dp(n, 0);
  std::vector<std::vector<int>> from(k, std::vector<int>(n, -1));
  for (int x = 0; x < n; ++x) {
    if (excluded[x]) dp[x] = -std::numeric_limits<double>::infinity();
  }
  if (std::count(excluded.begin(), excluded.end(), false) < 2) return {};
  for (std::size_t i = 0; i < k; ++i) {
    const int lead = static_cast<int>(std::max_element(dp.begin(), dp.end()) - dp.begin());
    std::vector<double> next(n, -std::numeric_limits<double>::infinity());
    for (int x = 0; x < n; ++x) {
      if (excluded[x]) continue;
      const bool stay = dp[x] >= dp[lead] - kSwitchPenalty;
      next[x] = (stay ? dp[x] : dp[lead] - kSwitchPenalty) + Score(m.characters[i], c, x);
      from[i][x] = stay ? x : lead;
    }
    dp = std::move(next);
  }
  std::vector<Segment> segs;
  if (k == 0) return segs;
  int x = static_cast<int>(std::max_element(dp.begin(), dp.end()) - dp.begin());
  for (std::size_t i = k; i-- > 0;) {
    if (segs.empty() || segs.back().relative != x) segs.push_back({x, i, i});
    segs.back().first = i;
    x = from[i][x];
  }
  std::reverse(segs.begin(), segs.end());
  return segs;
}

// Weighted errors c shares with x and y lacks, over characters [first, last].
double Evidence(const CharacterMatrix& m, int c, int x, int y, std::size_t first, std::size_t last,
                int* count) {
  double w = 0;
  int n = 0;
  for (std::size_t i = first; i <= last; ++i) {
    const auto& s = m.characters[i].states;
    if (s[c] == 1 && s[x] == 1 && s[y] == 0) w += m.characters[i].weight, ++n;
  }
  if (count) *count = n;
  return w;
}

// Merges neighbouring stretches until each is backed by its own evidence.
void Validate(const CharacterMatrix& m, int c, std::vector<Segment>& segs, double min_evidence) {
  bool changed = true;
  while (changed && segs.size() > 1) {
    changed = false;
    for (std::size_t i = 0; i + 1 < segs.size(); ++i) {
      Segment &a = segs[i], &b = segs[i + 1];
      const double ea = Evidence(m, c, a.relative, b.relative, a.first, a.last, nullptr);
      const double eb = Evidence(m, c, b.relative, a.relative, b.first, b.last, nullptr);
      if (ea >= min_evidence && eb >= min_evidence) continue;
      // Keep the relative that fits the joined stretch better.
      double sa = 0, sb = 0;
      for (std::size_t k = a.first; k <= b.last; ++k) {
        sa += Score(m.characters[k], c, a.relative);
        sb += Score(m.characters[k], c, b.relative);
      }
      a.relative = sa >= sb ? a.relative : b.relative;
      a.last = b.last;
      segs.erase(segs.begin() + i + 1);
      changed = true;
      break;
    }
    for (std::size_t i = 0; i + 1 < segs.size(); ++i) {  // neighbours now equal
      if (segs[i].relative == segs[i + 1].relative) {
        segs[i].last = segs[i + 1].last;
        segs.erase(segs.begin() + i + 1);
        changed = true;
        break;
      }
    }
  }
}

Contamination Describe(const CharacterMatrix& m, int c, const std::vector<Segment>& segs) {
  Contamination out;
  out.witness = m.taxa[c];
  std::ostringstream text, why;
  text << out.witness << " follows ";
  for (std::size_t i = 0; i < segs.size(); ++i) {
    const Segment& s = segs[i];
    const int other = segs[i == 0 ? 1 : i - 1].relative;
    ContaminationSegment seg;
    seg.relative = m.taxa[s.relative];
    // The stretch is reported from its first to its last shared error.
    std::size_t first = s.last, last = s.first;
    for (std::size_t k = s.first; k <= s.last; ++k) {
      if (m.characters[k].states[c] != 1 || m.characters[k].states[s.relative] != 1) continue;
      ++seg.shared;
      first = std::min(first, k);
      last = std::max(last, k);
    }
    if (seg.shared == 0) first = s.first, last = s.last;
    seg.first_row = m.characters[first].row_label;
    seg.last_row = m.characters[last].row_label;
    seg.first_position = m.characters[first].position;
    seg.last_position = m.characters[last].position;
    Evidence(m, c, s.relative, other, s.first, s.last, &seg.against);
    text << (i == 0 ? "" : (i + 1 == segs.size() ? " and " : ", ")) << seg.relative << " in rows "
         << seg.first_row << " to " << seg.last_row;
    why << (i ? "; " : "") << "rows " << seg.first_row << " to " << seg.last_row << ": shares "
        << seg.shared << " errors with " << seg.relative << ", " << seg.against
        << " of them absent from " << m.taxa[other];
    out.segments.push_back(std::move(seg));
  }
  out.text = text.str() + " (" + why.str() + "); rows between the stretches cannot be assigned";
  return out;
}

}  // namespace

std::vector<Contamination> FindContamination(const CharacterMatrix& m, double min_evidence) {
  std::vector<Contamination> out;
  if (m.taxa.size() < 3) return out;
  for (int c = 0; c < static_cast<int>(m.taxa.size()); ++c) {
    auto segs = Viterbi(m, c);
    Validate(m, c, segs, min_evidence);
    if (segs.size() >= 2) out.push_back(Describe(m, c, segs));
  }
  return out;
}

}  // namespace apograph::lineage
