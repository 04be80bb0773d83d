#pragma once
/// Internal to the formula language: the syntax tree the X3 parser
/// (formula_x3.cpp, the only file that includes Spirit) hands to the
/// compiler (formula.cpp). Names are not resolved yet; every node keeps the
/// byte offset where it starts, for positioned errors.

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace apograph::model::internal {

struct Expr {
  enum class Kind { kNumber, kName, kCall, kNeg, kAdd, kSub, kMul, kDiv, kPow, kColumn };
  Kind kind = Kind::kNumber;
  std::string text;        ///< number as written, name, function or column name
  std::vector<Expr> args;  ///< operands or call arguments
  int row_offset = 0;      ///< kColumn: 0 this row, +1 next row, -1 previous
  std::size_t offset = 0;  ///< byte offset in the formula text
  int depth = 1;           ///< levels of the tree below and including this node
};

/// At most this many parentheses, calls and signs nested in one another:
/// the parser descends once per level (judgement: real formulas nest a few
/// levels; 200 keeps the descent within a small stack).
inline constexpr int kMaxNesting = 200;
/// At most this many levels in the tree a formula compiles to (a sum of
/// many terms is as deep as it is long): the compiler and the evaluator
/// recurse once per level (judgement: 2000 levels use well under a
/// megabyte of stack).
inline constexpr int kMaxTreeDepth = 2000;

struct ParamDecl {
  std::string name;
  std::string value_text;  ///< the default as written
  std::optional<std::string> low_text, high_text;
  std::string description;
  std::size_t offset = 0;        ///< of the name
  std::size_t value_offset = 0;  ///< of the default
  std::size_t low_offset = 0, high_offset = 0;
};

struct FormulaAst {
  std::vector<ParamDecl> params;
  Expr body;
};

/// A syntax error: what the parser expected at `offset` (found text is
/// worked out by the caller from the offset).
struct FormulaSyntaxError {
  std::size_t offset = 0;
  std::string expected;
};

/// Parses the text; throws FormulaSyntaxError (also beyond kMaxNesting or
/// kMaxTreeDepth).
FormulaAst ParseFormulaAst(std::string_view text);

}  // namespace apograph::model::internal
