// How a script writes a place, and which originals a copy's reading may come
// from. Part of NumeralScript (see numeral_script.hpp); the file parser is in
// numeral_script.cpp.
#include "deviation/numeral_script.hpp"

#include <algorithm>
#include <map>
#include <stdexcept>
#include <string>

namespace apograph::deviation {
namespace {

constexpr int kMaxWritten = 1000;  // integer parts up to 999
// A positional script's whole parts beyond 999, digit by digit: as far as
// ValueOf reads (judgement: sines to radii of 3438 or 60,000 stay below it).
constexpr int kMaxPositional = 99999;

struct RomanStep {
  int value;
  int subtract;  // the smaller symbol written before it (0: none)
};

}  // namespace

int NumeralScript::MaxWritten() const {
  return writing_ == Writing::kPositional ? kMaxPositional : kMaxWritten - 1;
}

std::vector<std::string> NumeralScript::Write(int value) const {
  if (value < 0 || value > MaxWritten())
    throw std::out_of_range("place value outside 0.." + std::to_string(MaxWritten()));
  if (writings_.size() != static_cast<std::size_t>(kMaxWritten)) return {};
  if (value < kMaxWritten) return writings_[static_cast<std::size_t>(value)];
  std::vector<std::string> out;  // positional: the digits' own writings
  for (char c : std::to_string(value)) {
    const auto& digit = writings_[static_cast<std::size_t>(c - '0')];
    out.insert(out.end(), digit.begin(), digit.end());
  }
  return out;
}

std::string NumeralScript::WriteText(int value) const {
  std::string out;
  for (const auto& s : Write(value)) out += s;
  return out;
}

std::optional<int> NumeralScript::Read(const std::vector<std::string>& symbols) const {
  auto it = readings_.find(symbols);
  if (it == readings_.end()) return std::nullopt;
  return it->second;
}

void NumeralScript::BuildReadings() {
  std::map<int, std::string> by_value;  // first symbol declared for a value wins
  for (const auto& s : symbols_) by_value.emplace(s.value, s.glyph);
  const std::string zero = !zero_.empty() ? zero_ : (by_value.count(0) ? by_value[0] : "0");
  auto glyph = [&](int v) -> std::string {
    auto it = by_value.find(v);
    return it == by_value.end() ? std::string() : it->second;
  };
  writings_.assign(kMaxWritten, {});
  for (int n = 0; n < kMaxWritten; ++n) {
    std::vector<std::string>& w = writings_[static_cast<std::size_t>(n)];
    if (n == 0) {
      w = {zero};
      readings_.emplace(w, 0);
      continue;
    }
    if (writing_ == Writing::kPositional) {
      for (char c : std::to_string(n)) w.push_back(glyph(c - '0'));
    } else if (writing_ == Writing::kAdditive) {
      int rest = n;
      // Hundreds by the largest symbols (Hebrew writes 500 as 400 + 100).
      while (rest >= 100) {
        int best = 0;
        for (const auto& [v, g] : by_value) {
          if (v >= 100 && v <= rest && v % 100 == 0) best = v;
        }
        if (best == 0) break;
        w.push_back(glyph(best));
        rest -= best;
      }
      auto special = std::find_if(specials_.begin(), specials_.end(),
                                  [&](const auto& s) { return s.first == rest; });
      if (special != specials_.end()) {
        w.insert(w.end(), special->second.begin(), special->second.end());
      } else {
        if (rest >= 10) w.push_back(glyph(rest / 10 * 10));
        if (rest % 10) w.push_back(glyph(rest % 10));
      }
    } else {
      static const RomanStep kSteps[] = {{500, 100}, {100, 10}, {50, 10}, {10, 1}, {5, 1}, {1, 0}};
      int rest = n;
      for (const auto& step : kSteps) {
        while (rest >= step.value) {
          w.push_back(glyph(step.value));
          rest -= step.value;
        }
        if (step.subtract && rest >= step.value - step.subtract) {
          w.push_back(glyph(step.subtract));
          w.push_back(glyph(step.value));
          rest -= step.value - step.subtract;
        }
      }
    }
    // A value the script's symbols cannot write stays unwritable (empty glyphs).
    if (std::any_of(w.begin(), w.end(), [](const std::string& g) { return g.empty(); })) w.clear();
    if (!w.empty()) readings_.emplace(w, n);
  }
}

std::vector<std::vector<std::string>> NumeralScript::Neighbours(
    const std::vector<std::string>& symbols, std::vector<ConfusionStep>& steps_out) const {
  std::vector<std::vector<std::string>> out;
  for (const auto& c : confusions_) {
    const ConfusionStep step{c.intended, c.written, c.weight, c.source};
    if (c.written.empty()) {  // the copy dropped c.intended: put it back anywhere
      for (std::size_t i = 0; i <= symbols.size(); ++i) {
        auto v = symbols;
        v.insert(v.begin() + static_cast<std::ptrdiff_t>(i), c.intended);
        out.push_back(std::move(v));
        steps_out.push_back(step);
      }
      continue;
    }
    for (std::size_t i = 0; i < symbols.size(); ++i) {
      if (symbols[i] != c.written) continue;
      auto v = symbols;
      if (c.intended.empty()) {
        v.erase(v.begin() + static_cast<std::ptrdiff_t>(i));
      } else {
        v[i] = c.intended;
      }
      out.push_back(std::move(v));
      steps_out.push_back(step);
    }
  }
  return out;
}

std::vector<PlaceVariant> NumeralScript::OriginalsOf(int copy, int limit, int max_steps) const {
  std::map<int, PlaceVariant> best;
  struct Node {
    std::vector<std::string> symbols;
    double weight;
    std::vector<ConfusionStep> steps;
  };
  std::vector<Node> frontier = {{Write(copy), 1.0, {}}};
  for (int depth = 0; depth < max_steps; ++depth) {
    std::vector<Node> next;
    for (const Node& node : frontier) {
      std::vector<ConfusionStep> steps;
      auto around = Neighbours(node.symbols, steps);
      for (std::size_t i = 0; i < around.size(); ++i) {
        Node n{around[i], node.weight * steps[i].weight, node.steps};
        n.steps.push_back(steps[i]);
        if (auto v = Read(n.symbols); v && *v != copy && *v < limit) {
          auto it = best.find(*v);
          if (it == best.end() || it->second.weight < n.weight) best[*v] = {*v, n.weight, n.steps};
        }
        next.push_back(std::move(n));
      }
    }
    frontier = std::move(next);
  }
  std::vector<PlaceVariant> out;
  for (auto& [v, variant] : best) out.push_back(std::move(variant));
  std::stable_sort(out.begin(), out.end(), [](const PlaceVariant& a, const PlaceVariant& b) {
    return a.weight > b.weight;
  });
  return out;
}

double NumeralScript::ListedWeight(const std::string& intended, const std::string& written) const {
  double best = 0;
  for (const auto& c : confusions_) {
    if (c.intended == intended && c.written == written) best = std::max(best, c.weight);
  }
  return best;
}

double NumeralScript::MeanConfusionWeight() const {
  double total = 0;
  for (const auto& c : confusions_) total += c.weight;
  const bool zero_declared = std::any_of(symbols_.begin(), symbols_.end(),
                                         [&](const Symbol& s) { return s.glyph == zero_; });
  const std::size_t symbols = symbols_.size() + (zero_.empty() || zero_declared ? 0 : 1);
  return symbols == 0 || total == 0 ? 1 : total / static_cast<double>(symbols);
}

int NumeralScript::SlotSize() const { return static_cast<int>(Glyphs().size()); }

std::vector<std::string> NumeralScript::Glyphs() const {
  std::vector<std::string> out;
  for (const auto& s : symbols_) {
    if (std::find(out.begin(), out.end(), s.glyph) == out.end()) out.push_back(s.glyph);
  }
  if (!zero_.empty() && std::find(out.begin(), out.end(), zero_) == out.end()) out.push_back(zero_);
  return out;
}

std::vector<std::vector<std::string>> NumeralScript::Writings(int value) const {
  std::vector<std::vector<std::string>> out = {Write(value)};
  if (writing_ != Writing::kRoman || value <= 0) return out;
  std::vector<std::string> additive;  // largest symbols first, never subtracting
  int rest = value;
  std::vector<std::pair<int, std::string>> by_value;
  for (const auto& s : symbols_) {
    if (s.value > 0) by_value.emplace_back(s.value, s.glyph);
  }
  std::sort(by_value.rbegin(), by_value.rend());
  for (const auto& [v, g] : by_value) {
    while (rest >= v) {
      additive.push_back(g);
      rest -= v;
    }
  }
  if (rest == 0 && additive != out.front()) out.push_back(additive);
  return out;
}

std::optional<int> NumeralScript::SumOf(const std::vector<std::string>& symbols) const {
  if (symbols.empty() || writing_ == Writing::kPositional) return std::nullopt;
  int total = 0;
  for (const auto& g : symbols) {
    if (g == zero_) continue;
    auto it = std::find_if(symbols_.begin(), symbols_.end(),
                           [&](const Symbol& s) { return s.glyph == g; });
    if (it == symbols_.end()) return std::nullopt;
    total += it->value;
  }
  return total;
}

std::optional<int> NumeralScript::ValueOf(const std::vector<std::string>& symbols) const {
  if (symbols.empty()) return std::nullopt;
  std::vector<int> values;
  for (const auto& g : symbols) {
    if (g == zero_) {
      values.push_back(0);
      continue;
    }
    auto it = std::find_if(symbols_.begin(), symbols_.end(),
                           [&](const Symbol& s) { return s.glyph == g; });
    if (it == symbols_.end()) return std::nullopt;
    values.push_back(it->value);
  }
  long total = 0;
  for (std::size_t i = 0; i < values.size(); ++i) {
    if (writing_ == Writing::kPositional) {
      if (values[i] > 9) return std::nullopt;
      total = total * 10 + values[i];
    } else if (writing_ == Writing::kRoman && i + 1 < values.size() && values[i] < values[i + 1]) {
      total -= values[i];
    } else {
      total += values[i];
    }
    if (total > 100000) return std::nullopt;
  }
  if (total < 0) return std::nullopt;
  return static_cast<int>(total);
}

}  // namespace apograph::deviation
