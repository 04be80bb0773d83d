// Reading a collation: names of its enums, a cell's readings by witness,
// the slides found, the bases counted (collation.hpp). Building one is in
// collation.cpp.
#include "collate/collation.hpp"

namespace apograph::collate {

const char* ToString(Basis basis) {
  switch (basis) {
    case Basis::kCaller:
      return "judgement";
    case Basis::kEditor:
      return "editor";
    case Basis::kRecomputation:
      return "recomputation";
    case Basis::kMajority:
      return "majority";
    case Basis::kUndetermined:
      return "undetermined";
  }
  return "?";
}

const char* ToString(ReadingKind kind) {
  switch (kind) {
    case ReadingKind::kValue:
      return "value";
    case ReadingKind::kBlank:
      return "blank";
    case ReadingKind::kPartial:
      return "partial";
    case ReadingKind::kIllegible:
      return "illegible";
    case ReadingKind::kOmitted:
      return "omitted";
  }
  return "?";
}

bool CollatedCell::Varies() const {
  int n = 0;
  for (const auto& r : readings) n += r.Comparable() ? 1 : 0;
  return n >= 2;
}

const Reading* CollatedCell::ReadingOf(const std::string& siglum) const {
  for (const auto& r : readings) {
    if (std::find(r.sigla.begin(), r.sigla.end(), siglum) != r.sigla.end()) return &r;
  }
  return nullptr;
}

int Collation::WitnessIndex(const std::string& siglum) const {
  for (std::size_t i = 0; i < witnesses.size(); ++i) {
    if (witnesses[i].siglum == siglum) return static_cast<int>(i);
  }
  return -1;
}

const Slide* Collation::SlideAt(const std::string& siglum, int row, int column) const {
  for (const auto& s : slides) {
    if (s.Covers(siglum, row, column)) return &s;
  }
  return nullptr;
}

std::map<Basis, int> Collation::BasisCounts() const {
  std::map<Basis, int> counts;
  for (const auto& r : rows) {
    for (const auto& c : r.cells) {
      if (c.Varies()) ++counts[c.basis];
    }
  }
  return counts;
}

}  // namespace apograph::collate
