#include "edition/witness_date.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <string>
#include <vector>

namespace apograph {
namespace {

/// Lower case, parenthesised remarks dropped, punctuation other than '-'
/// and '.' turned into blanks, then split into words ("c." stays "c.").
std::vector<std::string> Words(std::string_view original) {
  std::string text;  // en and em dashes (UTF-8) as '-'
  for (std::size_t i = 0; i < original.size(); ++i) {
    if (original.substr(i, 3) == "\xE2\x80\x93" || original.substr(i, 3) == "\xE2\x80\x94") {
      text += '-';
      i += 2;
    } else {
      text += original[i];
    }
  }
  std::string clean;
  int depth = 0;
  for (const char raw : text) {
    const auto c = static_cast<unsigned char>(raw);
    if (c == '(') ++depth;
    if (depth > 0) {
      if (c == ')') --depth;
      continue;
    }
    if (c >= 0x80) {  // an en dash or another non-ASCII sign: a separator
      clean += ' ';
      continue;
    }
    if (c == '-') {
      clean += " to ";
      continue;
    }
    clean += std::isalnum(c) || c == '.' ? static_cast<char>(std::tolower(c)) : ' ';
  }
  std::vector<std::string> words;
  std::string word;
  for (const char c : clean + ' ') {
    if (c != ' ') {
      word += c;
    } else if (!word.empty()) {
      words.push_back(word);
      word.clear();
    }
  }
  return words;
}

std::optional<int> Year(const std::string& w) {
  if (w.empty() || w.size() > 4) return std::nullopt;
  for (const char c : w)
    if (!std::isdigit(static_cast<unsigned char>(c))) return std::nullopt;
  return std::stoi(w);
}

/// "15th" -> 15; "xv" (Roman) -> 15.
std::optional<int> Century(const std::string& w) {
  std::string digits;
  std::size_t i = 0;
  while (i < w.size() && std::isdigit(static_cast<unsigned char>(w[i]))) digits += w[i++];
  if (!digits.empty() && digits.size() <= 2) {
    const std::string suffix = w.substr(i);
    if (suffix == "th" || suffix == "st" || suffix == "nd" || suffix == "rd")
      return std::stoi(digits);
    return std::nullopt;
  }
  int value = 0, last = 0;
  for (auto it = w.rbegin(); it != w.rend(); ++it) {
    const int v = *it == 'i' ? 1 : *it == 'v' ? 5 : *it == 'x' ? 10 : 0;
    if (v == 0) return std::nullopt;
    value += v < last ? -v : v;
    last = std::max(last, v);
  }
  return value > 0 && value <= 30 ? std::optional<int>(value) : std::nullopt;
}

/// The part of a century a qualifier names, as offsets within 0..99.
std::optional<std::array<int, 2>> Part(const std::vector<std::string>& q) {
  auto has = [&](const char* w) {
    for (const auto& x : q)
      if (x == w) return true;
    return false;
  };
  if (q.empty()) return std::array<int, 2>{0, 99};
  if (has("first") && has("half")) return std::array<int, 2>{0, 49};
  if (has("second") && has("half")) return std::array<int, 2>{50, 99};
  if (has("early") || has("in.") || has("in")) return std::array<int, 2>{0, 33};
  // Thirds that part the century without overlapping (judgement; years
  // 0-33, 34-67, 68-99, as the shared generator writes them, whose dates
  // tests/synth checks this reading covers): 33-67 for "mid" shared a year
  // with "early" and with "late", and a copy "mid-14th century" of an
  // exemplar "late 14th century" was allowed (seed 228 of the lineage
  // benchmark).
  if (has("mid") || has("middle") || has("med.") || has("med")) return std::array<int, 2>{34, 67};
  if (has("late") || has("ex.") || has("ex")) return std::array<int, 2>{68, 99};
  if (q.size() == 1 && q[0] == "1") return std::array<int, 2>{0, 49};
  if (q.size() == 1 && q[0] == "2") return std::array<int, 2>{50, 99};
  return std::nullopt;
}

std::optional<YearRange> CenturyRange(const std::vector<std::string>& w) {
  // "s. xv ex.", "late 15th century", "the middle of the 15th century"
  std::vector<std::string> qualifiers;
  std::optional<int> century;
  for (const auto& x : w) {
    if (x == "s." || x == "s" || x == "saec." || x == "century" || x == "cent." || x == "the" ||
        x == "of")
      continue;
    if (!century) {
      if (auto c = Century(x)) {
        century = c;
        continue;
      }
      // "mid-15th", "late-15th": the qualifier joined to the century
      const auto dash = x.find('-');
      if (dash != std::string::npos && dash > 0) {
        if (auto c = Century(x.substr(dash + 1))) {
          century = c;
          qualifiers.push_back(x.substr(0, dash));
          continue;
        }
      }
    }
    qualifiers.push_back(x);
  }
  if (!century) return std::nullopt;
  const auto part = Part(qualifiers);
  if (!part) return std::nullopt;
  const int base = (*century - 1) * 100;
  return YearRange{base + (*part)[0], base + (*part)[1]};
}

}  // namespace

std::optional<YearRange> ParseWitnessDate(std::string_view text) {
  const auto w = Words(text);
  if (w.empty()) return std::nullopt;
  if (w.size() == 1) {
    if (auto y = Year(w[0])) return YearRange{*y, *y};
  }
  const bool approximate = w[0] == "c." || w[0] == "c" || w[0] == "ca." || w[0] == "ca" ||
                           w[0] == "circa" || w[0] == "about";
  if (w.size() == 2 && approximate) {
    // Plus or minus 10 years: a judgement (catalogues use "c." for a decade
    // or two).
    if (auto y = Year(w[1])) return YearRange{*y - 10, *y + 10};
  }
  if (w.size() == 3 && w[1] == "to") {
    auto a = Year(w[0]), b = Year(w[2]);
    if (a && b && *a <= *b) return YearRange{*a, *b};
  }
  if (w.size() == 2 && (w[0] == "before" || w[0] == "after")) {
    if (auto y = Year(w[1]))
      return w[0] == "before" ? YearRange{0, *y - 1} : YearRange{*y + 1, 9999};
  }
  return CenturyRange(w);
}

}  // namespace apograph
