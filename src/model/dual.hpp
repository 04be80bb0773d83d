#pragma once
/// Internal to the model library: a forward-mode dual number, so that each
/// built-in formula template gives its exact partial derivatives with respect
/// to up to N parameters in the same pass as its value (the estimate stage's
/// solver needs them for every entry at every iteration; forward differences
/// cost one more evaluation per parameter and lose half the digits).
///
/// Only what the formulas use is defined: arithmetic, comparisons (on the
/// value), and the functions of <cmath> they call. A function of an argument
/// whose derivatives are all zero (the row's argument, a constant) skips the
/// derivative's own transcendental call, so sin(a) of a constant argument
/// costs what it costs in double.

#include <array>
#include <cmath>

namespace apograph::model::internal {

template <int N>
struct Dual {
  double v = 0;
  std::array<double, N> d{};

  constexpr Dual() = default;
  constexpr Dual(double value) : v(value) {}  // NOLINT: constants mix freely
  static Dual Variable(double value, int i) {
    Dual x(value);
    x.d[static_cast<std::size_t>(i)] = 1;
    return x;
  }
  bool Constant() const {
    for (double g : d) {
      if (g != 0) return false;
    }
    return true;
  }
  /// f(v) with derivative f'(v) * d.
  Dual Chain(double f, double df) const {
    Dual r(f);
    for (int i = 0; i < N; ++i) r.d[i] = df * d[i];
    return r;
  }

  friend Dual operator-(const Dual& a) { return a.Chain(-a.v, -1); }
  friend Dual operator+(const Dual& a, const Dual& b) {
    Dual r(a.v + b.v);
    for (int i = 0; i < N; ++i) r.d[i] = a.d[i] + b.d[i];
    return r;
  }
  friend Dual operator-(const Dual& a, const Dual& b) {
    Dual r(a.v - b.v);
    for (int i = 0; i < N; ++i) r.d[i] = a.d[i] - b.d[i];
    return r;
  }
  friend Dual operator*(const Dual& a, const Dual& b) {
    Dual r(a.v * b.v);
    for (int i = 0; i < N; ++i) r.d[i] = a.d[i] * b.v + a.v * b.d[i];
    return r;
  }
  friend Dual operator/(const Dual& a, const Dual& b) {
    const double q = a.v / b.v;
    Dual r(q);
    for (int i = 0; i < N; ++i) r.d[i] = (a.d[i] - q * b.d[i]) / b.v;
    return r;
  }
  friend Dual operator*(const Dual& a, double b) { return a.Chain(a.v * b, b); }
  friend Dual operator*(double a, const Dual& b) { return b.Chain(a * b.v, a); }
  friend Dual operator/(const Dual& a, double b) { return a.Chain(a.v / b, 1 / b); }
  Dual& operator+=(const Dual& b) { return *this = *this + b; }
  Dual& operator-=(const Dual& b) { return *this = *this - b; }
  Dual& operator*=(const Dual& b) { return *this = *this * b; }
  Dual& operator/=(const Dual& b) { return *this = *this / b; }

  friend bool operator<(const Dual& a, const Dual& b) { return a.v < b.v; }
  friend bool operator>(const Dual& a, const Dual& b) { return a.v > b.v; }
  friend bool operator<=(const Dual& a, const Dual& b) { return a.v <= b.v; }
  friend bool operator>=(const Dual& a, const Dual& b) { return a.v >= b.v; }
  friend bool operator==(const Dual& a, const Dual& b) { return a.v == b.v; }

  friend Dual sin(const Dual& x) {
    if (x.Constant()) return Dual(std::sin(x.v));
    double s, c;
    SinCos(x.v, s, c);
    return x.Chain(s, c);
  }
  friend Dual cos(const Dual& x) {
    if (x.Constant()) return Dual(std::cos(x.v));
    double s, c;
    SinCos(x.v, s, c);
    return x.Chain(c, -s);
  }
  friend Dual asin(const Dual& x) { return x.Chain(std::asin(x.v), 1 / std::sqrt(1 - x.v * x.v)); }
  friend Dual acos(const Dual& x) { return x.Chain(std::acos(x.v), -1 / std::sqrt(1 - x.v * x.v)); }
  friend Dual atan(const Dual& x) { return x.Chain(std::atan(x.v), 1 / (1 + x.v * x.v)); }
  friend Dual sqrt(const Dual& x) {
    const double s = std::sqrt(x.v);
    return x.Chain(s, 0.5 / s);
  }
  friend Dual fabs(const Dual& x) { return x.v < 0 ? -x : x; }
  /// Piecewise constant: derivative zero (as for every rounding).
  friend Dual floor(const Dual& x) { return Dual(std::floor(x.v)); }
  friend Dual atan2(const Dual& y, const Dual& x) {
    const double r2 = x.v * x.v + y.v * y.v;
    Dual r(std::atan2(y.v, x.v));
    for (int i = 0; i < N; ++i) r.d[i] = (x.v * y.d[i] - y.v * x.d[i]) / r2;
    return r;
  }
  /// x - trunc(x / m) m, differentiated where it is smooth.
  friend Dual fmod(const Dual& x, const Dual& m) {
    if (m.Constant()) return x.Chain(std::fmod(x.v, m.v), 1);  // the usual case: m = 360
    const double q = std::trunc(x.v / m.v);
    Dual r(std::fmod(x.v, m.v));
    for (int i = 0; i < N; ++i) r.d[i] = x.d[i] - q * m.d[i];
    return r;
  }

 private:
  /// Both at once where the C library offers it (one argument reduction).
  static void SinCos(double x, double& s, double& c) {
#if defined(__GLIBC__)
    ::sincos(x, &s, &c);
#else
    s = std::sin(x);
    c = std::cos(x);
#endif
  }
};

/// The plain floating type underneath a formula's number type.
template <typename T>
struct ScalarOfT {
  using type = T;
};
template <int N>
struct ScalarOfT<Dual<N>> {
  using type = double;
};
template <typename T>
using ScalarOf = typename ScalarOfT<T>::type;

}  // namespace apograph::model::internal
