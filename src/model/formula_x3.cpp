// The formula language's parser (grammar/formula.ebnf), with Boost.Spirit X3.
// The only translation unit of the model library that includes Spirit.
//
// The grammar is built so that no rule backtracks after a semantic action
// has run: every alternative is decided by its first token, and actions
// push and pop nodes on the builder's stack.
#include "model/formula_ast.hpp"

#include <functional>

#include <boost/spirit/home/x3.hpp>

namespace apograph::model::internal {
namespace {

namespace x3 = boost::spirit::x3;
using It = std::string_view::const_iterator;

struct Frame {
  std::string name;
  std::size_t offset = 0;
  std::size_t base = 0;  ///< stack size when the frame opened
  bool call = false;
};

struct Builder {
  It begin;
  int nesting = 0;  ///< parentheses, calls and signs open at the parser's position
  std::vector<Expr> stack;
  std::vector<Frame> frames;
  FormulaAst ast;
  ParamDecl decl;
  std::string column;
  std::size_t column_offset = 0;
  int row_offset = 0;

  std::size_t Offset(It it) const { return static_cast<std::size_t>(it - begin); }
  Expr Pop() {
    Expr e = std::move(stack.back());
    stack.pop_back();
    return e;
  }
  /// One level deeper (a parenthesis, a call or a sign opened at `at`).
  void Enter(It at) {
    if (++nesting > kMaxNesting) {
      throw FormulaSyntaxError{Offset(at),
                               "at most " + std::to_string(kMaxNesting) +
                                   " parentheses, calls and signs nested in one another"};
    }
  }
  void Leave() { --nesting; }
  /// Pushes `e` with its depth, refusing a tree deeper than kMaxTreeDepth
  /// (positioned at `at`, the operand that makes it too deep).
  void Push(Expr e, std::size_t at) {
    for (const auto& a : e.args) e.depth = std::max(e.depth, a.depth + 1);
    if (e.depth > kMaxTreeDepth) {
      throw FormulaSyntaxError{
          at, "at most " + std::to_string(kMaxTreeDepth) + " operations in one chain or nesting"};
    }
    stack.push_back(std::move(e));
  }
  void Binary(Expr::Kind kind) {
    Expr rhs = Pop(), lhs = Pop();
    const std::size_t at = rhs.offset;
    Expr e{kind, "", {}, 0, lhs.offset};
    e.args.push_back(std::move(lhs));
    e.args.push_back(std::move(rhs));
    Push(std::move(e), at);
  }
};

struct builder_tag;

Builder& Get(auto& ctx) { return x3::get<builder_tag>(ctx).get(); }
std::string Text(auto& ctx) {
  auto const& r = x3::_attr(ctx);
  return std::string(r.begin(), r.end());
}
std::size_t Start(auto& ctx) { return Get(ctx).Offset(x3::_attr(ctx).begin()); }

// ---- semantic actions
auto const push_number = [](auto& ctx) {
  Get(ctx).stack.push_back({Expr::Kind::kNumber, Text(ctx), {}, 0, Start(ctx)});
};
auto const open_frame = [](auto& ctx) {
  Builder& b = Get(ctx);
  b.frames.push_back({Text(ctx), Start(ctx), b.stack.size(), false});
};
auto const mark_call = [](auto& ctx) {
  Get(ctx).Enter(std::prev(x3::_where(ctx).begin()));
  Get(ctx).frames.back().call = true;
};
auto const close_frame = [](auto& ctx) {
  Builder& b = Get(ctx);
  Frame f = std::move(b.frames.back());
  b.frames.pop_back();
  if (f.call) b.Leave();
  Expr e{f.call ? Expr::Kind::kCall : Expr::Kind::kName, f.name, {}, 0, f.offset};
  for (std::size_t i = f.base; i < b.stack.size(); ++i) e.args.push_back(std::move(b.stack[i]));
  b.stack.resize(f.base);
  b.Push(std::move(e), f.offset);
};
auto const enter = [](auto& ctx) { Get(ctx).Enter(std::prev(x3::_where(ctx).begin())); };
auto const leave = [](auto& ctx) { Get(ctx).Leave(); };
auto const col_begin = [](auto& ctx) { Get(ctx).row_offset = 0; };
auto const col_name = [](auto& ctx) {
  Get(ctx).column = Text(ctx);
  Get(ctx).column_offset = Start(ctx);
};
auto const col_row = [](auto& ctx) { Get(ctx).row_offset = x3::_attr(ctx); };
auto const col_end = [](auto& ctx) {
  Builder& b = Get(ctx);
  b.stack.push_back({Expr::Kind::kColumn, b.column, {}, b.row_offset, b.column_offset});
};
auto const negate = [](auto& ctx) {
  Builder& b = Get(ctx);
  b.Leave();
  Expr operand = b.Pop();
  const std::size_t at = operand.offset;
  Expr e{Expr::Kind::kNeg, "", {}, 0, operand.offset};
  e.args.push_back(std::move(operand));
  b.Push(std::move(e), at);
};
auto const make_pow = [](auto& ctx) {
  Get(ctx).Leave();
  Get(ctx).Binary(Expr::Kind::kPow);
};
auto const make_mul = [](auto& ctx) { Get(ctx).Binary(Expr::Kind::kMul); };
auto const make_div = [](auto& ctx) { Get(ctx).Binary(Expr::Kind::kDiv); };
auto const make_add = [](auto& ctx) { Get(ctx).Binary(Expr::Kind::kAdd); };
auto const make_sub = [](auto& ctx) { Get(ctx).Binary(Expr::Kind::kSub); };
auto const decl_begin = [](auto& ctx) { Get(ctx).decl = ParamDecl{}; };
auto const decl_name = [](auto& ctx) {
  Get(ctx).decl.name = Text(ctx);
  Get(ctx).decl.offset = Start(ctx);
};
auto const decl_value = [](auto& ctx) {
  Get(ctx).decl.value_text = Text(ctx);
  Get(ctx).decl.value_offset = Start(ctx);
};
auto const decl_low = [](auto& ctx) {
  Get(ctx).decl.low_text = Text(ctx);
  Get(ctx).decl.low_offset = Start(ctx);
};
auto const decl_high = [](auto& ctx) {
  Get(ctx).decl.high_text = Text(ctx);
  Get(ctx).decl.high_offset = Start(ctx);
};
auto const decl_description = [](auto& ctx) {
  const std::string t = Text(ctx);
  Get(ctx).decl.description = t.substr(1, t.size() - 2);
};
auto const decl_end = [](auto& ctx) { Get(ctx).ast.params.push_back(Get(ctx).decl); };

// ---- tokens
using x3::lexeme;
using x3::lit;
auto const digits = +x3::char_('0', '9');
auto const number_body = digits >>
                         -((lit('.') >> digits) | (lit(';') >> digits >> *(lit(',') >> digits)));
auto const word = (x3::char_("a-zA-Z") | lit('_')) >> *(x3::char_("a-zA-Z0-9") | lit('_'));
auto kw(char const* w) { return lexeme[lit(w) >> !(x3::char_("a-zA-Z0-9") | lit('_'))]; }

x3::rule<class number_r, x3::unused_type> const number = "a number";
x3::rule<class signed_number_r, x3::unused_type> const signed_number = "a number";
x3::rule<class name_r, x3::unused_type> const param_name = "a parameter name";
x3::rule<class column_r, x3::unused_type> const column_name = "a column name";
x3::rule<class row_r, x3::unused_type> const row_shift = "a row offset such as +1 or -1";
x3::rule<class value_r, x3::unused_type> const default_value = "a number";
x3::rule<class low_r, x3::unused_type> const low_value = "a number";
x3::rule<class high_r, x3::unused_type> const high_value = "a number";
x3::rule<class rparen_r, x3::unused_type> const rparen = "an operator or ')'";
x3::rule<class col_rparen_r, x3::unused_type> const col_rparen = "',' or ')'";
x3::rule<class equals_r, x3::unused_type> const equals = "'='";
x3::rule<class dots_r, x3::unused_type> const dots = "'..'";
x3::rule<class expr_r, x3::unused_type> const expr = "an expression";
x3::rule<class term_r, x3::unused_type> const term = "an expression";
x3::rule<class unary_r, x3::unused_type> const unary = "an expression";
x3::rule<class power_r, x3::unused_type> const power = "an expression";
x3::rule<class primary_r, x3::unused_type> const primary = "an expression";
x3::rule<class colref_r, x3::unused_type> const colref = "col(...)";
x3::rule<class call_r, x3::unused_type> const call = "a name";
x3::rule<class decl_r, x3::unused_type> const decl = "a parameter declaration";
x3::rule<class end_r, x3::unused_type> const end = "an operator or end of formula";
x3::rule<class formula_r, x3::unused_type> const formula = "a formula";

auto const number_def = x3::raw[lexeme[number_body]][push_number];
auto const signed_number_def = lexeme[-lit('-') >> number_body];
auto const param_name_def = x3::raw[lexeme[word]][decl_name];
auto const column_name_def =
    x3::raw[lexeme[(x3::char_("a-zA-Z") | lit('_')) >>
                   *(x3::char_("a-zA-Z0-9") | lit('_') | lit('-') | lit('.'))] |
            lexeme[lit('"') >> +(x3::char_ - '"') >> lit('"')]][col_name];
auto const row_shift_def = x3::int_[col_row];
auto const default_value_def = x3::raw[signed_number][decl_value];
auto const low_value_def = x3::raw[signed_number][decl_low];
auto const high_value_def = x3::raw[signed_number][decl_high];
auto const rparen_def = lit(')');
auto const col_rparen_def = lit(')');
auto const equals_def = lit('=');
auto const dots_def = lit("..");

auto const colref_def = (kw("col") >> lit('('))[col_begin] > column_name >
                        -(lit(',') > row_shift) > col_rparen[col_end];
auto const call_def = x3::raw[lexeme[word]][open_frame] >>
                      -(lit('(')[mark_call] > -(expr % ',') > rparen) >> x3::eps[close_frame];
auto const primary_def = number | colref | call | (lit('(')[enter] > expr > rparen[leave]);
auto const power_def = primary >> -((lit('^')[enter] > unary)[make_pow]);
auto const unary_def = (lit('-')[enter] > unary)[negate] | (lit('+')[enter] > unary)[leave] | power;
auto const term_def = unary >> *((lit('*') > unary)[make_mul] | (lit('/') > unary)[make_div]);
auto const expr_def = term >> *((lit('+') > term)[make_add] | (lit('-') > term)[make_sub]);
auto const decl_def =
    kw("param")[decl_begin] > param_name > equals > default_value >
    -(kw("range") > low_value > dots > high_value) >
    -(x3::raw[lexeme[lit('"') >> *(x3::char_ - '"') >> lit('"')]][decl_description]) >
    -lit(';') >> x3::eps[decl_end];
auto const end_def = x3::eoi;
auto const formula_def = *decl > expr > end;

BOOST_SPIRIT_DEFINE(number, signed_number, param_name, column_name, row_shift, default_value,
                    low_value, high_value, rparen, col_rparen, equals, dots, expr, term, unary,
                    power, primary, colref, call, decl, end, formula)

auto const skipper = x3::char_(" \t\r\n") | lexeme[lit('#') >> *(x3::char_ - x3::eol)];

/// The parser reports a failure before the blanks and comments that precede
/// the offending symbol; the editor wants the caret on the symbol.
std::size_t SkipBlanks(std::string_view text, std::size_t at) {
  while (at < text.size()) {
    const char c = text[at];
    if (c == ' ' || c == '\t' || c == '\n' || c == '\r') {
      ++at;
    } else if (c == '#') {
      while (at < text.size() && text[at] != '\n') ++at;
    } else {
      break;
    }
  }
  return at;
}

}  // namespace

FormulaAst ParseFormulaAst(std::string_view text) {
  Builder b;
  b.begin = text.begin();
  It first = text.begin();
  const auto parser = x3::with<builder_tag>(std::ref(b))[formula];
  try {
    const bool ok = x3::phrase_parse(first, text.end(), parser, skipper);
    if (!ok || b.stack.size() != 1) {
      throw FormulaSyntaxError{SkipBlanks(text, b.Offset(first)), "an expression"};
    }
  } catch (const x3::expectation_failure<It>& e) {
    throw FormulaSyntaxError{SkipBlanks(text, b.Offset(e.where())), e.which()};
  }
  b.ast.body = b.Pop();
  return std::move(b.ast);
}

}  // namespace apograph::model::internal
