// The words of the evidence: place names, confusion steps, the model clause,
// and the one-line note of a finding.
#include "deviation/explain_internal.hpp"

#include <cstdio>
#include <iterator>

namespace apograph::deviation {

std::string PlaceName(int place, const std::string& unit) {
  static const char* kNames[] = {"minutes", "seconds", "thirds", "fourths", "fifths", "sixths"};
  if (place == 0) {
    const bool degrees = unit.rfind("deg", 0) == 0 || unit == "\u00b0";
    return degrees ? "degrees" : "units";
  }
  if (place <= 6) return kNames[place - 1];
  return "place " + std::to_string(place);
}

namespace {

std::string Score(double s) {
  char buf[16];
  std::snprintf(buf, sizeof buf, "%.2f", s);
  return buf;
}

std::string CellRange(const Finding& f) {
  const auto& first = f.cells.front();
  if (f.cells.size() == 1) return first.arg;
  return first.arg + "-" + f.cells.back().arg;
}

std::string Readings(const Finding& f, bool emended) {
  std::string out;
  for (const auto& c : f.cells) {
    std::string r = emended ? (c.emendation ? c.emendation->ToString() : "?") : c.tabulated;
    out += (out.empty() ? "" : " ") + r;
  }
  return out;
}

}  // namespace

std::string Finding::Note(const std::string& siglum) const {
  const Explanation& e = best();
  std::string out =
      CellRange(*this) + " " + column_name + ": " + Readings(*this, false) + " " + siglum + "]";
  if (IsCopyingSlip(e.cls) && e.emendation) {
    out += " read " + Readings(*this, true) + " -";
  } else if (e.cls == SlipClass::kComputational) {
    out += " keep (the author's) -";
  } else {
    out += " -";
  }
  return out + " " + e.evidence + " [" + ToString(e.cls) + " " + Score(e.score) + "]";
}

namespace internal {

std::string ToleranceWords(double tolerance) {
  if (tolerance == 0.5) return "within half a unit";
  if (tolerance == 1) return "within 1 unit";
  char buf[32];
  std::snprintf(buf, sizeof buf, "within %g units", tolerance);
  return buf;
}

std::string ModelText(const Sexagesimal& computed, double exact, int places) {
  if (std::isfinite(exact)) return Sexagesimal::FromDouble(exact, places + 1).ToString();
  return computed.ToString();
}

std::string StepWords(const ConfusionStep& step, const NumeralScript& script) {
  auto glyph = [&](const std::string& g) -> std::string {
    if (script.writing() == Writing::kPositional) return g;
    auto v = script.Read({g});
    return v ? g + " (" + std::to_string(*v) + ")" : g;
  };
  if (step.written.empty()) return "a " + glyph(step.intended) + " dropped";
  if (step.intended.empty()) return "a " + glyph(step.written) + " added";
  return glyph(step.intended) + " read as " + glyph(step.written);
}

std::string DigitPlaceWords(const NumeralScript& script, int from, int to, int place,
                            const std::string& unit) {
  const std::string name = PlaceName(place, unit);
  if (script.writing() != Writing::kPositional) return name;
  std::string a = std::to_string(from), b = std::to_string(to);
  if (place >= 1 && from < 60 && to < 60) {  // fractional places are written with two digits
    if (a.size() < 2) a.insert(a.begin(), '0');
    if (b.size() < 2) b.insert(b.begin(), '0');
  }
  if (a.size() != b.size() || a.size() < 2) return name;
  int differing = -1, count = 0;
  for (std::size_t i = 0; i < a.size(); ++i) {
    if (a[i] != b[i]) {
      differing = static_cast<int>(a.size() - 1 - i);
      ++count;
    }
  }
  if (count != 1) return name;
  static const char* kDigit[] = {"units", "tens", "hundreds", "thousands", "ten thousands"};
  if (differing >= static_cast<int>(std::size(kDigit))) return name;
  return std::string(kDigit[differing]) + " of " + name;
}

}  // namespace internal
}  // namespace apograph::deviation
