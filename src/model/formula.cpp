// The formula evaluator: a compiled formula's tree (formula_node.hpp, built
// by formula_compile.cpp) evaluated at a row, with the neighbouring rows and
// columns it names.
#include "model/formula.hpp"

#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <limits>
#include <stdexcept>

#include "model/builtin.hpp"
#include "model/formula_node.hpp"

namespace apograph::model {
namespace {

using internal::Node;
using internal::Op;
constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();

double ColumnValue(const RowContext& row, const std::string& column, int shift) {
  if (!row.table) return kNaN;
  const int c = row.table->ColumnIndex(column);
  const long r = static_cast<long>(row.row) + shift;
  if (c < 0 || r < 0 || r >= static_cast<long>(row.table->rows.size())) return kNaN;
  const auto& cells = row.table->rows[static_cast<std::size_t>(r)].cells;
  if (static_cast<std::size_t>(c) >= cells.size() || !cells[static_cast<std::size_t>(c)].value)
    return kNaN;
  return cells[static_cast<std::size_t>(c)].value->ToDouble();
}

/// The context of the row `shift` rows away, or nullopt when there is none.
std::optional<RowContext> Shifted(const RowContext& row, int shift) {
  if (shift == 0) return row;
  if (!row.table) return std::nullopt;
  const long r = static_cast<long>(row.row) + shift;
  if (r < 0 || r >= static_cast<long>(row.table->rows.size())) return std::nullopt;
  auto a = RowArgument(*row.table, static_cast<std::size_t>(r));
  if (!a) return std::nullopt;
  RowContext out = row;
  out.row = static_cast<std::size_t>(r);
  out.arg = *a;
  return out;
}

double RoundTo(double v, double places, Rounding rounding) {
  if (!std::isfinite(v) || places < 0 || places > 12) return kNaN;
  const int p = static_cast<int>(places);
  return RoundUnits(v, p, rounding) / std::pow(60.0, p);
}

}  // namespace

FormulaModel::~FormulaModel() = default;

double FormulaModel::Evaluate(const std::vector<double>& params, const RowContext& row) const {
  if (params.size() != params_.size()) {
    throw std::invalid_argument("formula " + name_ + ": expected " +
                                std::to_string(params_.size()) + " parameters, got " +
                                std::to_string(params.size()));
  }
  return ApplySign(EvaluateAt(params, row, 0), ResolvedSign(row.sign));
}

double FormulaModel::EvaluateAt(const std::vector<double>& p, const RowContext& row,
                                int depth) const {
  using namespace internal;
  struct Eval {
    const FormulaModel& self;
    const std::vector<double>& p;
    const RowContext& row;
    int depth;
    double operator()(const Node& n) const {
      auto a = [&](std::size_t i) { return (*this)(n.args[i]); };
      switch (n.op) {
        case Op::kConst:
          return n.value;
        case Op::kParam:
          return p[static_cast<std::size_t>(n.index)];
        case Op::kArg:
          return row.arg;
        case Op::kArg2:
          return row.arg2.value_or(kNaN);
        case Op::kArgOf: {
          auto r = Shifted(row, n.index);
          return r ? r->arg : kNaN;
        }
        case Op::kSelf: {
          auto r = Shifted(row, n.index);
          // self() inside self() would never end: it has no value there.
          return r && depth == 0 ? self.EvaluateAt(p, *r, depth + 1) : kNaN;
        }
        case Op::kColumn:
          return ColumnValue(row, n.column, n.index);
        case Op::kNeg:
          return -a(0);
        case Op::kAdd:
          return a(0) + a(1);
        case Op::kSub:
          return a(0) - a(1);
        case Op::kMul:
          return a(0) * a(1);
        case Op::kDiv:
          return a(1) == 0 ? kNaN : a(0) / a(1);
        case Op::kPow:
          return std::pow(a(0), a(1));
        case Op::kSin:
          return SinDeg(a(0));
        case Op::kCos:
          return CosDeg(a(0));
        case Op::kTan:
          return CosDeg(a(0)) == 0 ? kNaN : TanDeg(a(0));
        case Op::kAsin:
          return AsinDeg(a(0));
        case Op::kAcos:
          return AcosDeg(a(0));
        case Op::kAtan:
          return AtanDeg(a(0));
        case Op::kAtan2:
          return Atan2Deg(a(0), a(1));
        case Op::kSqrt:
          return std::sqrt(a(0));
        case Op::kAbs:
          return std::fabs(a(0));
        case Op::kFloor:
          return std::floor(a(0));
        case Op::kMod:
          return a(1) == 0 ? kNaN : ReduceModulo(a(0), a(1));
        case Op::kMin:
        case Op::kMax: {
          double v = a(0);
          for (std::size_t i = 1; i < n.args.size(); ++i)
            v = n.op == Op::kMin ? std::fmin(v, a(i)) : std::fmax(v, a(i));
          return v;
        }
        case Op::kCrd: {
          const double radius = n.args.size() > 1 ? a(1) : 60.0;
          return 2 * radius * std::fabs(SinDeg(a(0) / 2));
        }
        case Op::kRound:
          return RoundTo(a(0), a(1), Rounding::kNearest);
        case Op::kTrunc:
          return RoundTo(a(0), a(1), Rounding::kTruncate);
      }
      return kNaN;
    }
  };
  return Eval{*this, p, row, depth}(*body_);
}

}  // namespace apograph::model
