#pragma once
// A compiled formula's expression tree, shared by the compiler
// (formula_compile.cpp) and the evaluator (formula.cpp) only.

#include <string>
#include <vector>

namespace apograph::model::internal {

enum class Op {
  kConst,
  kParam,
  kArg,
  kArg2,
  kArgOf,
  kSelf,
  kColumn,
  kNeg,
  kAdd,
  kSub,
  kMul,
  kDiv,
  kPow,
  kSin,
  kCos,
  kTan,
  kAsin,
  kAcos,
  kAtan,
  kAtan2,
  kSqrt,
  kAbs,
  kFloor,
  kMod,
  kMin,
  kMax,
  kCrd,
  kRound,
  kTrunc,
};

struct Node {
  Op op = Op::kConst;
  double value = 0;    ///< constant
  int index = 0;       ///< parameter index, row offset
  std::string column;  ///< column name
  std::vector<Node> args;
};

}  // namespace apograph::model::internal
