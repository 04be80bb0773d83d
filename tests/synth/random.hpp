#pragma once
/// The one source of randomness of a draw: a 64-bit Mersenne Twister seeded
/// from the draw's seed, with the few distributions the generator needs
/// written out here (the standard library's distributions differ between
/// implementations, and a seed must give the same bytes everywhere).

#include <cmath>
#include <cstddef>
#include <cstdint>
#include <random>
#include <stdexcept>
#include <vector>

namespace apograph::synth {

class Rng {
 public:
  explicit Rng(std::uint64_t seed) : engine_(seed) {}

  /// Uniform in [0, 1), 53 random bits.
  double Uniform() { return static_cast<double>(engine_() >> 11) * 0x1.0p-53; }
  /// Uniform in [lo, hi).
  double Uniform(double lo, double hi) { return lo + (hi - lo) * Uniform(); }
  /// Uniform integer in [lo, hi] (inclusive), without modulo bias.
  int Int(int lo, int hi) {
    if (hi < lo) throw std::logic_error("Rng::Int: empty range");
    const std::uint64_t span = static_cast<std::uint64_t>(hi - lo) + 1;
    const std::uint64_t limit = UINT64_MAX - UINT64_MAX % span;
    std::uint64_t x = engine_();
    while (x >= limit) x = engine_();
    return lo + static_cast<int>(x % span);
  }
  /// True with probability p.
  bool Chance(double p) { return Uniform() < p; }
  /// +1 or -1 with equal probability.
  int Sign() { return Chance(0.5) ? 1 : -1; }
  /// An index drawn with probability proportional to its weight.
  std::size_t Weighted(const std::vector<double>& weights) {
    double total = 0;
    for (double w : weights) total += w > 0 ? w : 0;
    if (total <= 0) throw std::logic_error("Rng::Weighted: no positive weight");
    double x = Uniform() * total;
    for (std::size_t i = 0; i < weights.size(); ++i) {
      if (weights[i] <= 0) continue;
      if (x < weights[i]) return i;
      x -= weights[i];
    }
    for (std::size_t i = weights.size(); i-- > 0;) {
      if (weights[i] > 0) return i;
    }
    return 0;
  }
  /// One element, uniformly.
  template <typename T>
  const T& Pick(const std::vector<T>& items) {
    if (items.empty()) throw std::logic_error("Rng::Pick: empty list");
    return items[static_cast<std::size_t>(Int(0, static_cast<int>(items.size()) - 1))];
  }
  /// The items in a random order (Fisher-Yates).
  template <typename T>
  void Shuffle(std::vector<T>& items) {
    for (std::size_t i = items.size(); i > 1; --i) {
      const auto j = static_cast<std::size_t>(Int(0, static_cast<int>(i) - 1));
      std::swap(items[i - 1], items[j]);
    }
  }
  /// Number of successes in n trials of probability p.
  int Binomial(int n, double p) {
    int k = 0;
    for (int i = 0; i < n; ++i) k += Chance(p) ? 1 : 0;
    return k;
  }
  /// A fresh seed for a sub-draw (so that one part's draws do not shift
  /// another's when its options change).
  std::uint64_t Fork() { return engine_(); }

 private:
  std::mt19937_64 engine_;
};

}  // namespace apograph::synth
