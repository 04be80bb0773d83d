// The formula compiler: resolves the names of a parsed formula
// (formula_x3.cpp), checks arities, literals and row offsets, and builds the
// expression tree (formula_node.hpp) that formula.cpp evaluates.
#include <algorithm>
#include <cctype>
#include <charconv>
#include <cmath>
#include <map>

#include "model/formula.hpp"
#include "model/formula_ast.hpp"
#include "model/formula_node.hpp"
#include "support/input_error.hpp"

namespace apograph::model {
namespace {

using internal::Expr;
using internal::Node;
using internal::Op;
/// Largest decimal literal (judgement: above any quantity of the trade, and
/// still exact to a unit in a double).
constexpr double kMaxLiteral = 1e15;
/// Largest row offset of arg(k) and self(k) (judgement: longer than any
/// table, small enough for the row arithmetic).
constexpr long long kMaxRowShift = 1000000;

struct FunctionSpec {
  const char* name;
  Op op;
  int min_args, max_args;  ///< max -1: any number from min
};

const FunctionSpec kFunctions[] = {
    {"sin", Op::kSin, 1, 1},     {"cos", Op::kCos, 1, 1},   {"tan", Op::kTan, 1, 1},
    {"asin", Op::kAsin, 1, 1},   {"acos", Op::kAcos, 1, 1}, {"atan", Op::kAtan, 1, 1},
    {"atan2", Op::kAtan2, 2, 2}, {"sqrt", Op::kSqrt, 1, 1}, {"abs", Op::kAbs, 1, 1},
    {"floor", Op::kFloor, 1, 1}, {"mod", Op::kMod, 2, 2},   {"min", Op::kMin, 2, -1},
    {"max", Op::kMax, 2, -1},    {"crd", Op::kCrd, 1, 2},   {"round", Op::kRound, 2, 2},
    {"trunc", Op::kTrunc, 2, 2}, {"arg", Op::kArgOf, 1, 1}, {"self", Op::kSelf, 1, 1},
};

/// The first symbol at `offset`, quoted, for "found ...".
std::string FoundAt(const std::string& text, std::size_t offset) {
  if (offset >= text.size()) return "end of formula";
  auto is_word = [](char c) { return std::isalnum(static_cast<unsigned char>(c)) || c == '_'; };
  auto is_number = [](char c) {
    return std::isdigit(static_cast<unsigned char>(c)) || c == ';' || c == ',' || c == '.';
  };
  std::size_t end = offset;
  const char c = text[offset];
  if (std::isdigit(static_cast<unsigned char>(c))) {
    while (end < text.size() && is_number(text[end])) ++end;
  } else if (is_word(c)) {
    while (end < text.size() && is_word(text[end])) ++end;
  } else if (c == '\n') {
    return "end of line";
  } else {
    const auto u = static_cast<unsigned char>(c);
    end = offset + (u >= 0xF0 ? 4 : u >= 0xE0 ? 3 : u >= 0xC0 ? 2 : 1);
  }
  return "'" + text.substr(offset, end - offset) + "'";
}

[[noreturn]] void Fail(const std::string& source, const std::string& text, std::size_t offset,
                       const std::string& message) {
  std::size_t line_start = text.rfind('\n', offset == 0 ? 0 : offset - 1);
  line_start = (line_start == std::string::npos || offset == 0) ? 0 : line_start + 1;
  if (offset > 0 && text[offset - 1] == '\n') line_start = offset;
  std::size_t line_end = text.find('\n', line_start);
  if (line_end == std::string::npos) line_end = text.size();
  int line = 1;
  for (std::size_t i = 0; i < line_start; ++i) line += text[i] == '\n';
  int column = 1;
  for (std::size_t i = line_start; i < offset && i < text.size(); ++i) {
    column += (static_cast<unsigned char>(text[i]) & 0xC0) != 0x80;
  }
  Diagnostic d;
  d.where = {source, line, column, text.substr(line_start, line_end - line_start)};
  d.message = message;
  throw InputError(d);
}

class Compiler {
 public:
  Compiler(const std::string& text, const std::string& source) : text_(text), source_(source) {}

  double Number(const std::string& literal, std::size_t offset) {
    if (literal.find(';') == std::string::npos) {
      // Digits, an optional point and digits (the grammar's): a value
      // beyond a double's range is refused where it stands.
      const double v = std::strtod(literal.c_str(), nullptr);
      if (!std::isfinite(v) || std::fabs(v) > kMaxLiteral) {
        Fail(source_, text_, offset, ExpectedFound("a number below 10^15", FoundAt(text_, offset)));
      }
      return v;
    }
    const bool negative = !literal.empty() && literal[0] == '-';
    NumberSyntaxError error;
    auto v = Sexagesimal::Parse(negative ? literal.substr(1) : literal, &error);
    if (!v) {
      const std::size_t at = offset + error.column + (negative ? 1 : 0);
      Fail(source_, text_, at, ExpectedFound(error.expected, FoundAt(text_, at)));
    }
    return negative ? -v->ToDouble() : v->ToDouble();
  }

  ParamSpec Param(const internal::ParamDecl& d) {
    if (d.name == "arg" || d.name == "arg2" || FindFunction(d.name)) {
      Fail(source_, text_, d.offset,
           ExpectedFound("a parameter name other than arg, arg2 and the functions",
                         "'" + d.name + "'"));
    }
    for (const auto& p : params_) {
      if (p.name == d.name) {
        Fail(source_, text_, d.offset,
             ExpectedFound("a new parameter name", "'" + d.name + "' again"));
      }
    }
    ParamSpec p{d.name, "", d.description, Number(d.value_text, d.value_offset), 0, 0};
    if (d.low_text) {
      p.low = Number(*d.low_text, d.low_offset);
      p.high = Number(*d.high_text, d.high_offset);
      if (p.low > p.default_value || p.default_value > p.high) {
        Fail(source_, text_, d.low_offset,
             ExpectedFound("a range around the default " + d.value_text,
                           "'" + *d.low_text + " .. " + *d.high_text + "'"));
      }
    } else {
      // No range given: from half to twice the default (or +-1 around 0).
      const double v = p.default_value;
      p.low = v == 0 ? -1 : std::min(v / 2, v * 2);
      p.high = v == 0 ? 1 : std::max(v / 2, v * 2);
    }
    params_.push_back(p);
    return p;
  }

  Node Compile(const Expr& e) {
    switch (e.kind) {
      case Expr::Kind::kNumber:
        return Node{Op::kConst, Number(e.text, e.offset), 0, "", {}};
      case Expr::Kind::kName:
        return Name(e);
      case Expr::Kind::kCall:
        return Call(e);
      case Expr::Kind::kColumn: {
        std::string name = e.text;
        if (name.size() >= 2 && name.front() == '"') name = name.substr(1, name.size() - 2);
        if (std::find(columns_.begin(), columns_.end(), name) == columns_.end())
          columns_.push_back(name);
        return Node{Op::kColumn, 0, e.row_offset, name, {}};
      }
      case Expr::Kind::kNeg:
        return Unary(Op::kNeg, e);
      case Expr::Kind::kAdd:
        return Binary(Op::kAdd, e);
      case Expr::Kind::kSub:
        return Binary(Op::kSub, e);
      case Expr::Kind::kMul:
        return Binary(Op::kMul, e);
      case Expr::Kind::kDiv:
        return Binary(Op::kDiv, e);
      case Expr::Kind::kPow:
        return Binary(Op::kPow, e);
    }
    return {};
  }

  std::vector<ParamSpec>& params() { return params_; }
  std::vector<std::string>& columns() { return columns_; }

  static const FunctionSpec* FindFunction(const std::string& name) {
    for (const auto& f : kFunctions) {
      if (name == f.name) return &f;
    }
    return nullptr;
  }

 private:
  Node Unary(Op op, const Expr& e) {
    Node n{op, 0, 0, "", {}};
    n.args.push_back(Compile(e.args[0]));
    return n;
  }
  Node Binary(Op op, const Expr& e) {
    Node n{op, 0, 0, "", {}};
    n.args.push_back(Compile(e.args[0]));
    n.args.push_back(Compile(e.args[1]));
    return n;
  }
  Node Name(const Expr& e) {
    if (e.text == "arg") return Node{Op::kArg, 0, 0, "", {}};
    if (e.text == "arg2") return Node{Op::kArg2, 0, 0, "", {}};
    for (std::size_t i = 0; i < params_.size(); ++i) {
      if (params_[i].name == e.text) return Node{Op::kParam, 0, static_cast<int>(i), "", {}};
    }
    if (FindFunction(e.text)) {
      Fail(source_, text_, e.offset + e.text.size(),
           ExpectedFound("'(' after " + e.text,
                         FoundAt(text_, NextSymbol(e.offset + e.text.size()))));
    }
    Fail(source_, text_, e.offset,
         ExpectedFound("a declared parameter, arg, arg2 or a function", "'" + e.text + "'"));
  }
  std::size_t NextSymbol(std::size_t at) const {
    while (at < text_.size() && (text_[at] == ' ' || text_[at] == '\t')) ++at;
    return at;
  }
  Node Call(const Expr& e) {
    const FunctionSpec* f = FindFunction(e.text);
    if (!f) {
      Fail(source_, text_, e.offset,
           ExpectedFound("a function (sin, cos, tan, asin, acos, atan, "
                         "atan2, sqrt, abs, floor, mod, min, max, crd, "
                         "round, trunc, arg, self, col)",
                         "'" + e.text + "'"));
    }
    const int n = static_cast<int>(e.args.size());
    if (n < f->min_args || (f->max_args >= 0 && n > f->max_args)) {
      std::string want =
          f->max_args < 0 ? std::to_string(f->min_args) + " or more arguments"
          : f->min_args == f->max_args
              ? std::to_string(f->min_args) + " argument" + (f->min_args > 1 ? "s" : "")
              : std::to_string(f->min_args) + " or " + std::to_string(f->max_args) + " arguments";
      std::string hint;
      for (const auto& a : e.args) {
        if (a.kind == Expr::Kind::kNumber && a.text.find(',') != std::string::npos) {
          hint =
              " (" + a.text + " is one number; put a blank after a comma that separates arguments)";
        }
      }
      Fail(source_, text_, e.offset,
           ExpectedFound(want + " to " + e.text, std::to_string(n) + hint));
    }
    if (f->op == Op::kArgOf || f->op == Op::kSelf) return RowShift(*f, e);
    Node node{f->op, 0, 0, "", {}};
    for (const auto& a : e.args) node.args.push_back(Compile(a));
    return node;
  }
  /// arg(k) and self(k) take a whole-number row offset, written as a literal.
  Node RowShift(const FunctionSpec& f, const Expr& e) {
    const Expr& a = e.args[0];
    const bool neg = a.kind == Expr::Kind::kNeg && a.args[0].kind == Expr::Kind::kNumber;
    const Expr& lit = neg ? a.args[0] : a;
    if (lit.kind != Expr::Kind::kNumber || lit.text.find_first_of(".;") != std::string::npos) {
      Fail(source_, text_, a.offset,
           ExpectedFound("a whole-number row offset such as 1 or -1", FoundAt(text_, a.offset)));
    }
    // Digits only (checked above); a row offset beyond kMaxRowShift rows is
    // refused where it stands.
    long long k = 0;
    const auto r = std::from_chars(lit.text.data(), lit.text.data() + lit.text.size(), k);
    if (r.ec != std::errc() || k > kMaxRowShift) {
      Fail(source_, text_, a.offset,
           ExpectedFound("a row offset between -" + std::to_string(kMaxRowShift) + " and " +
                             std::to_string(kMaxRowShift),
                         FoundAt(text_, a.offset)));
    }
    return Node{f.op, 0, static_cast<int>(neg ? -k : k), "", {}};
  }

  const std::string& text_;
  const std::string& source_;
  std::vector<ParamSpec> params_;
  std::vector<std::string> columns_;
};

}  // namespace

std::unique_ptr<FormulaModel> CompileFormula(const std::string& text, const std::string& name,
                                             const std::string& source) {
  internal::FormulaAst ast;
  try {
    ast = internal::ParseFormulaAst(text);
  } catch (const internal::FormulaSyntaxError& e) {
    Fail(source, text, e.offset, ExpectedFound(e.expected, FoundAt(text, e.offset)));
  }
  Compiler c(text, source);
  for (const auto& d : ast.params) c.Param(d);
  Node body = c.Compile(ast.body);
  std::unique_ptr<FormulaModel> m(new FormulaModel());
  m->name_ = name;
  m->text_ = text;
  m->convention_ = "a user formula: the argument is used as the table gives it";
  m->params_ = std::move(c.params());
  // The formula language's convention for a mean motion's parameters.
  for (auto& p : m->params_) {
    if (p.name == "radix") p.role = ParamRole::kRadix;
    if (p.name == "rate") p.role = ParamRole::kRate;
    if (p.name == "modulus") p.role = ParamRole::kModulus;
  }
  if (m->ParamIndex(ParamRole::kRate) >= 0 && m->ParamIndex(ParamRole::kModulus) >= 0)
    m->traits_.kind = ModelKind::kMeanMotion;
  m->columns_ = std::move(c.columns());
  m->body_ = std::make_unique<Node>(std::move(body));
  return m;
}

const std::vector<std::string>& FormulaFunctions() {
  static const std::vector<std::string> kAll = {
      "sin(x) cos(x) tan(x) (degrees)",
      "asin(x) acos(x) atan(x) atan2(y, x) (degrees)",
      "sqrt(x) abs(x) floor(x) mod(x, m) min(a, b, ...) max(a, b, ...)",
      "crd(x) = 120 sin(x/2), crd(x, R) = 2R sin(x/2)",
      "round(x, places) trunc(x, places) (sexagesimal places)",
      "arg, arg2, arg(k): the argument of the row k rows away",
      "col(NAME), col(NAME, k): the tabulated value of column NAME in this row or k rows away",
      "self(k): this formula's exact value at the row k rows away"};
  return kAll;
}

}  // namespace apograph::model
