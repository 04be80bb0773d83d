#include "lineage/mixture_direction.hpp"

#include <algorithm>
#include <cmath>
#include <optional>
#include <sstream>

#include "lineage/contamination_internal.hpp"

namespace apograph::lineage {
namespace {

double Length(const CharacterMatrix& m, const ParsimonyOptions& o) {
  return Parsimony(m, o).length;
}

std::string Number(double x) {
  std::ostringstream o;
  o << std::round(x * 10) / 10;
  return o.str();
}

// The length of the stemma with `siglum` (and its copies) divided; nullopt
// when there is nothing to divide.
std::optional<double> DividedLength(const CharacterMatrix& m, const Contamination& c,
                                    const std::string& siglum, const ParsimonyOptions& options) {
  const int t = m.TaxonIndex(siglum);
  if (t < 0 || c.segments.empty()) return std::nullopt;
  // The witness and those that hold its errors (its copies, which inherit
  // a change of exemplar it made) are divided alike.
  std::vector<int> family;
  for (int x = 0; x < static_cast<int>(m.taxa.size()); ++x)
    if (x == t || contamination::Holds(m, x, t)) family.push_back(x);
  CharacterMatrix divided = m;
  for (int x : family) {
    divided.taxa.push_back(m.taxa[static_cast<std::size_t>(x)] + "'");
    if (divided.witnesses.size() + 1 == divided.taxa.size())
      divided.witnesses.push_back(m.witnesses[static_cast<std::size_t>(x)]);
  }
  for (auto& ch : divided.characters) {
    // The second part: nearest to a stretch that follows the second
    // relative (as MaskSecondaryExemplar assigns it).
    const bool second = NearestSegment(c, ch.position)->relative == c.secondary;
    for (int x : family) {
      const auto ux = static_cast<std::size_t>(x);
      ch.states.push_back(second ? ch.states[ux] : static_cast<signed char>(-1));
      if (second) ch.states[ux] = -1;
    }
  }
  return Length(divided, options);
}

}  // namespace

double DivisionGain(const CharacterMatrix& m, const Contamination& c, const std::string& siglum,
                    const ParsimonyOptions& options) {
  const auto divided = DividedLength(m, c, siglum, options);
  return divided ? Length(m, options) - *divided : 0;
}

std::vector<Contamination> KeepDividingWitnesses(const CharacterMatrix& m,
                                                 std::vector<Contamination> called,
                                                 std::vector<Contamination>* refused) {
  ParsimonyOptions fast;
  fast.exact_limit = 0;  // the same heuristic for every division
  std::vector<Contamination> kept;
  std::optional<double> whole;  // the undivided stemma's length, once
  for (auto& c : called) {
    if (c.primary.empty() || c.secondary.empty()) {  // one line: no relative to divide
      kept.push_back(std::move(c));
      continue;
    }
    if (!whole) whole = Length(m, fast);
    auto gain_of = [&](const std::string& siglum) {
      const auto divided = DividedLength(m, c, siglum, fast);
      return divided ? *whole - *divided : 0.0;
    };
    const double own = gain_of(c.witness);
    std::string better;
    double gain = own;
    for (const auto& relative : {c.primary, c.secondary}) {
      const double g = gain_of(relative);
      if (g > gain) gain = g, better = relative;
    }
    if (!better.empty() && gain > own + kDivisionMargin) {
      c.text += "; but dividing " + better + " at the same rows shortens the stemma more (by " +
                Number(gain) + ", against " + Number(own) + " for " + c.witness + "): " + better +
                " may be the one that changed exemplar, and " + c.witness +
                " is not called contaminated";
      if (refused) refused->push_back(std::move(c));
      continue;
    }
    if (!better.empty()) {  // called, but the editor is told of the other reading
      c.text += "; dividing " + better +
                " at the same rows shortens the stemma a little more (by " + Number(gain) +
                ", against " + Number(own) + "): " + better +
                " may be the one that changed exemplar";
    }
    kept.push_back(std::move(c));
  }
  return kept;
}

}  // namespace apograph::lineage
