// What a slip does to one value (see slip_ops.hpp). Symbol slips work on a
// place as the hand writes it, so that a Greek scribe confuses letters and a
// compositor digits.
#include "slip_ops.hpp"

namespace apograph::synth::internal {
namespace {

bool Alphabetic(Script s) { return s != Script::kHinduArabic && s != Script::kPrinted; }
bool Digits(Script s) { return !Alphabetic(s); }

// The place's written form, if the script can write it.
std::optional<std::string> Written(const Places& p, int k, Script s) {
  const std::int64_t v = p.Get(k);
  if (Alphabetic(s) && v > 999) return std::nullopt;
  return WriteNumber(s, static_cast<int>(v));
}

std::optional<Changed> WithPlace(const Sexagesimal& v, Places p, int k, std::int64_t x) {
  if (k > 0 && (x < 0 || x > 59)) return std::nullopt;
  p.Set(k, x);
  auto out = FromPlaces(p);
  if (!out || out->Identical(v)) return std::nullopt;
  return Changed{*out, k, "", false, ""};
}

// Replaces one occurrence of `from` in `text` (occurrence chosen at random).
std::string ReplaceOne(const std::string& text, const std::string& from, const std::string& to,
                       Rng& rng) {
  std::vector<std::size_t> at;
  for (std::size_t i = text.find(from); i != std::string::npos; i = text.find(from, i + 1))
    at.push_back(i);
  const std::size_t i = rng.Pick(at);
  return text.substr(0, i) + to + text.substr(i + from.size());
}

std::optional<std::pair<std::string, std::string>> Listed(const std::string& written,
                                                          const Hand& hand, Rng& rng) {
  std::vector<const Confusion*> usable;
  std::vector<double> weights;
  for (const auto& c : Confusions(hand)) {
    if (written.find(c.from) == std::string::npos) continue;
    usable.push_back(&c);
    weights.push_back(c.weight);
  }
  if (usable.empty()) return std::nullopt;
  const Confusion& c = *usable[rng.Weighted(weights)];
  return std::make_pair(ReplaceOne(written, c.from, c.to, rng), c.from + "/" + c.to);
}

std::optional<std::pair<std::string, std::string>> Unlisted(const std::string& written,
                                                            const Hand& hand, Rng& rng) {
  auto glyphs = SplitGlyphs(hand.script, written);
  const auto j = static_cast<std::size_t>(rng.Int(0, static_cast<int>(glyphs.size()) - 1));
  const std::string& g = rng.Pick(Glyphs(hand.script));
  if (g == glyphs[j] || synth::Listed(hand, glyphs[j], g)) return std::nullopt;
  const std::string pair = glyphs[j] + "/" + g;
  glyphs[j] = g;
  std::string out;
  for (const auto& x : glyphs) out += x;
  return std::make_pair(out, pair);
}

}  // namespace

void Places::Set(int k, std::int64_t v) {
  if (k == 0) {
    integer = v;
  } else {
    fractions[static_cast<std::size_t>(k - 1)] = static_cast<int>(v);
  }
}

Places ToPlaces(const Sexagesimal& v) {
  return {v.negative(), v.IntegerPart(), v.FractionDigits()};
}

std::optional<Sexagesimal> FromPlaces(const Places& p) {
  if (p.integer < 0) return std::nullopt;
  for (int f : p.fractions) {
    if (f < 0 || f > 59) return std::nullopt;
  }
  return Sexagesimal::FromParts(p.negative, p.integer, p.fractions);
}

std::optional<Changed> SymbolSlip(const Sexagesimal& v, const Hand& hand, bool outside, Rng& rng) {
  const Places p = ToPlaces(v);
  for (int attempt = 0; attempt < 24; ++attempt) {
    const int k = rng.Int(0, p.Count() - 1);
    const auto written = Written(p, k, hand.script);
    if (!written) continue;
    const auto slip = outside ? Unlisted(*written, hand, rng) : Listed(*written, hand, rng);
    if (!slip) continue;
    const auto read = ReadNumber(hand.script, slip->first);
    if (!read) continue;
    auto out = WithPlace(v, p, k, *read);
    if (!out) continue;
    out->pair = slip->second;
    out->listed = !outside;
    out->detail = *written + " written " + slip->first;
    return out;
  }
  return std::nullopt;
}

std::optional<Changed> Transposed(const Sexagesimal& v, const Hand& hand, Rng& rng) {
  const Places p = ToPlaces(v);
  for (int attempt = 0; attempt < 12; ++attempt) {
    const int k = rng.Int(0, p.Count() - 1);
    const std::string d = std::to_string(p.Get(k));
    if (Digits(hand.script) && d.size() >= 2 && rng.Chance(0.7)) {
      const auto i = static_cast<std::size_t>(rng.Int(0, static_cast<int>(d.size()) - 2));
      std::string s = d;
      std::swap(s[i], s[i + 1]);
      if (auto out = WithPlace(v, p, k, std::stoll(s))) {
        out->detail = "digits " + d + " written " + s;
        return out;
      }
      continue;
    }
    if (k + 1 >= p.Count() || (k == 0 && p.integer > 59)) continue;
    Places q = p;
    q.Set(k, p.Get(k + 1));
    q.Set(k + 1, p.Get(k));
    auto out = FromPlaces(q);
    if (out && !out->Identical(v)) return Changed{*out, k, "", false, "places swapped"};
  }
  return std::nullopt;
}

std::optional<Changed> PlaceDropped(const Sexagesimal& v, Rng& rng) {
  const Places p = ToPlaces(v);
  std::vector<int> nonzero;
  for (int k = 0; k < p.Count(); ++k) {
    if (p.Get(k) != 0) nonzero.push_back(k);
  }
  if (nonzero.empty()) return std::nullopt;
  const int k = rng.Pick(nonzero);
  if (rng.Chance(0.5) || k + 1 >= p.Count()) {
    auto out = WithPlace(v, p, k, 0);
    if (out) out->detail = "place left out";
    return out;
  }
  Places q = p;
  for (int j = k; j + 1 < p.Count(); ++j) q.Set(j, p.Get(j + 1));
  q.Set(p.Count() - 1, 0);
  auto out = FromPlaces(q);
  if (!out || out->Identical(v)) return std::nullopt;
  return Changed{*out, k, "", false, "place dropped, the rest moved up"};
}

std::optional<Changed> PlaceAdded(const Sexagesimal& v, Rng& rng) {
  const Places p = ToPlaces(v);
  if (p.Count() < 2) return std::nullopt;
  const int k = rng.Int(0, p.Count() - 2);
  if (p.Get(k) > 59) return std::nullopt;
  Places q = p;
  for (int j = p.Count() - 1; j > k; --j) q.Set(j, p.Get(j - 1));
  auto out = FromPlaces(q);
  if (!out || out->Identical(v)) return std::nullopt;
  return Changed{*out, k, "", false, "place written twice, the rest pushed down"};
}

std::optional<Changed> ShiftedDown(const Sexagesimal& v) {
  const Places p = ToPlaces(v);
  if (p.Count() < 2 || p.integer > 59) return std::nullopt;
  Places q = p;
  q.Set(0, 0);
  for (int j = 1; j < p.Count(); ++j) q.Set(j, p.Get(j - 1));
  auto out = FromPlaces(q);
  if (!out || out->Identical(v)) return std::nullopt;
  return Changed{*out, 0, "", false, "moved down one place"};
}

std::optional<Changed> PlaceShifted(const Sexagesimal& v, Rng& rng) {
  if (rng.Chance(0.6)) return ShiftedDown(v);
  const Places p = ToPlaces(v);
  if (p.Count() < 2) return std::nullopt;
  Places q = p;
  for (int j = 0; j + 1 < p.Count(); ++j) q.Set(j, p.Get(j + 1));
  q.Set(p.Count() - 1, 0);
  auto out = FromPlaces(q);
  if (!out || out->Identical(v)) return std::nullopt;
  return Changed{*out, 0, "", false, "moved up one place"};
}

std::optional<Changed> LeadingPlaceLeftOut(const Sexagesimal& v) {
  const Places p = ToPlaces(v);
  for (int k = 0; k < p.Count(); ++k) {
    if (p.Get(k) == 0) continue;
    auto out = WithPlace(v, p, k, 0);
    if (out) out->detail = "leading place left out";
    return out;
  }
  return std::nullopt;
}

std::optional<Changed> Added(const Sexagesimal& v, const Sexagesimal& amount,
                             const std::string& detail) {
  const Sexagesimal out = (v + amount).Extended(v.places());
  if (out.negative() != v.negative() && !out.is_zero()) return std::nullopt;
  if (out.is_zero() && !v.is_zero() && v.negative()) return std::nullopt;
  return Changed{out, -1, "", false, detail};
}

std::string PartlyIllegible(const Sexagesimal& v, int k) {
  const Places p = ToPlaces(v);
  std::string out = p.negative ? "-" : "";
  out += k == 0 ? "?" : std::to_string(p.integer);
  for (int j = 1; j < p.Count(); ++j) {
    out += j == 1 ? ";" : ",";
    out += j == k ? "?" : std::to_string(p.Get(j));
  }
  return out;
}

}  // namespace apograph::synth::internal
