#include "estimate/derived_model.hpp"

#include <cmath>
#include <limits>

namespace apograph::estimate {

namespace {

constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();

std::string Fraction(int multiplier, int divisor) {
  if (multiplier == divisor) return "";
  if (multiplier == 1) return "1/" + std::to_string(divisor) + " of ";
  if (divisor == 1) return std::to_string(multiplier) + " times ";
  return std::to_string(multiplier) + "/" + std::to_string(divisor) + " of ";
}

/// a x b exactly (places added), when the result keeps within the limits.
std::optional<Sexagesimal> Product(const Sexagesimal& a, const Sexagesimal& b) {
  if (a.places() + b.places() > Sexagesimal::kMaxPlaces) return std::nullopt;
  const double magnitude = std::fabs(a.ToDouble() * b.ToDouble());
  if (!(magnitude < 1e11)) return std::nullopt;
  return Sexagesimal::FromUnits(a.units() * b.units(), a.places() + b.places());
}

}  // namespace

const char* ToString(DerivedBasis basis) {
  switch (basis) {
    case DerivedBasis::kRounded:
      return "rounded entries";
    case DerivedBasis::kOwnEntries:
      return "the witness's own entries";
    case DerivedBasis::kExact:
      return "exact values";
  }
  return "rounded entries";
}

Sexagesimal DerivedRelation::Wrapped(const Sexagesimal& x) const {
  if (!wrap_360) return x;
  const Sexagesimal r = x.Modulo(360);
  if (kind != Kind::kDifference) return r;
  return r > Sexagesimal::FromUnits(180, 0) ? r - Sexagesimal::FromUnits(360, 0) : r;
}

double DerivedRelation::Wrapped(double x) const {
  if (!wrap_360) return x;
  x -= 360 * std::floor(x / 360);
  if (kind != Kind::kDifference) return x;
  return x > 180 ? x - 360 : x;
}

std::string DerivedRelation::Text(const std::string& source, const std::string& other) const {
  const std::string f = Fraction(multiplier, divisor);
  switch (kind) {
    case Kind::kSum:
      return f +
             (other_sign < 0 ? source + " minus " + other
                             : "the sum of " + source + " and " + other) +
             (wrap_360 ? " (within the turn)" : "");
    case Kind::kProduct:
      return f + "the product of " + source + " and " + other;
    case Kind::kDifference:
      break;
  }
  const int k = rows > 0 ? rows : -rows;
  const std::string span = k == 1 ? (rows > 0 ? "the next row" : "the previous row")
                                  : std::to_string(k) + " rows " + (rows > 0 ? "ahead" : "behind");
  return f + "the difference " + (rows > 0 ? "to " : "from ") + span + " of " + source +
         (wrap_360 ? " (within half a turn)" : "");
}

DerivedModel::DerivedModel(std::string name, DerivedRelation relation, DerivedBasis basis,
                           std::vector<DerivedSource> sources, int places, Rounding rounding,
                           double step)
    : name_(std::move(name)),
      relation_(relation),
      basis_(basis),
      sources_(std::move(sources)),
      places_(places),
      rounding_(rounding),
      step_(step) {
  const std::string other = sources_.size() > 1 ? sources_[1].column : "";
  description_ = relation_.Text(sources_.at(0).column, other) + ", from " + ToString(basis_);
}

std::optional<model::RowContext> DerivedModel::Away(const model::RowContext& row, int rows) const {
  model::RowContext out = row;
  if (!row.table) {
    out.arg = row.arg + rows * step_;
    return out;
  }
  const long r = static_cast<long>(row.row) + rows;
  if (r < 0 || r >= static_cast<long>(row.table->rows.size())) return std::nullopt;
  const auto a = model::RowArgument(*row.table, static_cast<std::size_t>(r));
  if (!a) return std::nullopt;
  out.row = static_cast<std::size_t>(r);
  out.arg = *a;
  return out;
}

double DerivedModel::Exact(const DerivedSource& s, const model::RowContext& at) const {
  if (!s.model) return kNaN;
  model::RowContext ctx = at;
  ctx.column = at.table ? at.table->ColumnIndex(s.column) : -1;
  ctx.sign = model::SignForm::kConventional;
  model::Practice p = s.practice;
  // A sum adds the signed quantity, also where the column prints its
  // magnitude and a rubric gives the sign.
  if (relation_.kind != DerivedRelation::Kind::kDifference &&
      s.model->ResolvedSign(p.sign) == model::SignForm::kMagnitude)
    p.sign = model::SignForm::kSigned;
  // Exact values are the function's own: an interpolation grid is a way of
  // filling the source's table, not of computing the quantity differenced.
  if (basis_ == DerivedBasis::kExact) p.grid = 0, p.round_nodes = false;
  return model::PracticeValue(*s.model, s.params, ctx, p, p.places.value_or(0));
}

std::optional<Sexagesimal> DerivedModel::Entry(const DerivedSource& s,
                                               const model::RowContext& at) const {
  if (basis_ == DerivedBasis::kOwnEntries && at.table) {
    const int c = at.table->ColumnIndex(s.column);
    if (c >= 0 && at.row < at.table->rows.size()) {
      const auto& cells = at.table->rows[at.row].cells;
      if (static_cast<std::size_t>(c) < cells.size()) {
        const Cell& cell = cells[static_cast<std::size_t>(c)];
        if (cell.state == CellState::kRead && cell.value) return cell.value;
      }
    }
  }
  const double v = Exact(s, at);
  if (!std::isfinite(v) || std::fabs(v) >= 1e11) return std::nullopt;
  return Sexagesimal::FromDouble(v, s.practice.places.value_or(0), s.practice.rounding);
}

double DerivedModel::Evaluate(const std::vector<double>&, const model::RowContext& row) const {
  using Kind = DerivedRelation::Kind;
  const double scale = static_cast<double>(relation_.multiplier) / relation_.divisor;
  std::optional<Sexagesimal> x;
  if (relation_.kind == Kind::kDifference) {
    const auto there = Away(row, relation_.rows);
    if (!there) return kNaN;
    const model::RowContext& lo = relation_.rows > 0 ? row : *there;
    const model::RowContext& hi = relation_.rows > 0 ? *there : row;
    const DerivedSource& s = sources_.at(0);
    if (basis_ == DerivedBasis::kExact)
      return relation_.Wrapped(Exact(s, hi) - Exact(s, lo)) * scale;
    const auto a = Entry(s, lo), b = Entry(s, hi);
    if (a && b) x = relation_.Wrapped(*b - *a);
  } else {
    const DerivedSource& s = sources_.at(0);
    const DerivedSource& t = sources_.at(1);
    if (basis_ == DerivedBasis::kExact) {
      const double a = Exact(s, row), b = Exact(t, row);
      return relation_.Wrapped(relation_.kind == Kind::kSum ? a + relation_.other_sign * b
                                                            : a * b) *
             scale;
    }
    const auto a = Entry(s, row), b = Entry(t, row);
    if (a && b)
      x = relation_.kind == Kind::kSum ? std::optional(relation_.other_sign < 0 ? *a - *b : *a + *b)
                                       : Product(*a, *b);
    if (x) x = relation_.Wrapped(*x);
  }
  if (!x) return kNaN;
  const Sexagesimal scaled = *x * relation_.multiplier;
  const Sexagesimal target = scaled.Divided(relation_.divisor, places_, rounding_);
  double q = scaled.ToDouble() / relation_.divisor;
  // On the side of the rounding boundary the exact arithmetic gives.
  const double toward = target.ToDouble() > q ? 1 : -1;
  for (int k = 1; k <= 64 && !(Sexagesimal::FromDouble(q, places_, rounding_) == target); ++k)
    q += toward * 1e-13 * std::max(1.0, std::fabs(q));
  return q;
}

}  // namespace apograph::estimate
