// The transcription parser's directives (@work, @witness, @table,
// @argument, @column, @rows): each one's attributes checked and applied to
// the parser's state (parser_internal.hpp).
#include <initializer_list>

#include "edition/names.hpp"
#include "transcription/parser_internal.hpp"
#include "transcription/witness_attributes.hpp"

namespace apograph::transcription {

void Parser::RequireId(const DirectiveAst& d, std::string_view line, const char* what) {
  if (!d.id.empty()) return;
  const std::size_t at = d.attributes.empty() ? d.end_offset : d.attributes[0].name_offset;
  Fail(line, at,
       std::string("expected ") + what + " after @" + d.keyword + ", found " +
           (d.attributes.empty() ? FoundChar(line, at) : FoundToken(line, at)));
}

void Parser::RequireSafeId(const DirectiveAst& d, std::string_view line, const char* what) {
  RequireId(d, line, what);
  if (!IsSafeId(d.id)) {
    Fail(line, d.id_offset,
         std::string("expected ") + what + " of " + kSafeIdRule + ", found " + QuotedText(d.id));
  }
}

void Parser::CheckAttributes(const DirectiveAst& d, std::string_view line,
                             std::initializer_list<std::string_view> allowed) {
  for (std::size_t i = 0; i < d.attributes.size(); ++i) {
    const AttributeAst& a = d.attributes[i];
    bool known = false;
    std::string list;
    for (std::string_view name : allowed) {
      known = known || a.name == name;
      list += (list.empty() ? "" : ", ") + std::string(name);
    }
    if (!known) {
      Fail(line, a.name_offset,
           "expected an attribute of @" + d.keyword + " (" + list + "), found " + Quote(a.name));
    }
    for (std::size_t j = 0; j < i; ++j) {
      if (d.attributes[j].name == a.name) {
        Fail(line, a.name_offset, "expected each attribute once, found a second " + Quote(a.name));
      }
    }
  }
}

int Parser::Places(const AttributeAst& a, std::string_view line) {
  const std::string& v = a.value;
  const bool digits =
      !v.empty() && v.size() <= 2 && v.find_first_not_of("0123456789") == std::string::npos;
  const int n = digits ? std::stoi(v) : -1;
  if (n < 0 || n > Sexagesimal::kMaxPlaces) {
    Fail(line, a.value_offset,
         "expected places from 0 to " + std::to_string(Sexagesimal::kMaxPlaces) + ", found " +
             Quote(v));
  }
  return n;
}

Sexagesimal Parser::Number(const AttributeAst& a, std::string_view line) {
  NumberSyntaxError error;
  auto value = Sexagesimal::Parse(a.value, &error);
  if (!value) {
    Fail(line, a.value_offset,
         "expected a number such as 0;30 for " + a.name + "=, found " + Quote(a.value));
  }
  return *value;
}

void Parser::SetWork(const DirectiveAst& d, std::string_view line) {
  RequireSafeId(d, line, "a work id");
  CheckAttributes(d, line, {"title", "author"});
  work_ = WorkInfo{};
  work_.id = d.id;
  for (const auto& a : d.attributes) (a.name == "title" ? work_.title : work_.author) = a.value;
  have_work_ = true;
}

void Parser::SetWitness(const DirectiveAst& d, std::string_view line) {
  RequireSafeId(d, line, "a siglum");
  CheckAttributes(d, line, {"library", "shelfmark", "date", "script", "note", "kind"});
  witness_ = WitnessInfo{};
  witness_.siglum = d.id;
  for (const auto& a : d.attributes) {
    if (std::string problem = ApplyWitnessAttribute(witness_, a, options_); !problem.empty())
      Fail(line, a.value_offset, problem);
    if (a.name == "date" && !a.value.empty() && !ParseWitnessDate(a.value)) {
      out_.warnings.push_back(Make(Severity::kWarning, line_no_, line, a.value_offset,
                                   "expected a date such as 1461, c. 1420, 1450-1475 or late 15th "
                                   "century, found " +
                                       Quote(a.value) +
                                       "; kept as written, but no date order is inferred from it"));
    }
  }
  have_witness_ = true;
}

void Parser::OpenTable(const DirectiveAst& d, std::string_view line) {
  if (!have_work_ || !have_witness_) {
    Fail(line, d.keyword_offset,
         std::string("expected ") + (have_work_ ? "@witness" : "@work") +
             " before @table, found '@table'");
  }
  RequireSafeId(d, line, "a table id");
  CheckAttributes(d, line, {"title", "kind", "folios", "hand"});
  table_ = Transcription{};
  table_.work = work_;
  table_.witness = witness_;
  table_.table_id = d.id;
  for (const auto& a : d.attributes) {
    if (a.name == "title") table_.table_title = a.value;
    if (a.name == "kind") table_.kind = a.value;
    if (a.name == "folios") table_.folios = a.value;
    if (a.name == "hand") table_.hand = a.value;
  }
  table_.source_file = file_;
  phase_ = Phase::kLayout;
  have_argument_ = false;
  table_line_ = line_no_;
  table_line_text_ = std::string(line);
  table_start_ = line_start_;
  seen_arguments_.clear();
}

void Parser::RequireLayout(const DirectiveAst& d, std::string_view line) {
  const std::string found = "'@" + d.keyword + "'";
  if (phase_ == Phase::kOutside) {
    Fail(line, d.keyword_offset, "expected @table before @" + d.keyword + ", found " + found);
  }
  if (phase_ == Phase::kRows) {
    Fail(line, d.keyword_offset,
         "expected a row, @table, @work or @witness after the rows of table '" + table_.table_id +
             "', found " + found);
  }
}

void Parser::SetArgument(const DirectiveAst& d, std::string_view line, bool second) {
  const bool again = second ? table_.argument2.has_value() : have_argument_;
  if (again)
    Fail(line, d.keyword_offset, "expected one @" + d.keyword + " per table, found a second one");
  if (second && !table_.columns.empty()) {
    Fail(line, d.keyword_offset,
         "expected @argument2 before the @column lines, found '@argument2'");
  }
  RequireId(d, line, "an argument name");
  if (second) {
    CheckAttributes(d, line, {"unit", "places"});
  } else {
    CheckAttributes(d, line, {"unit", "places", "start", "step"});
  }
  ArgumentSpec spec;
  spec.name = d.id;
  for (const auto& a : d.attributes) {
    if (a.name == "unit") spec.unit = a.value;
    if (a.name == "places") spec.places = Places(a, line);
    if (a.name == "start") spec.start = Number(a, line);
    if (a.name == "step" && a.value == kListedStep) spec.listed = true;
    if (a.name == "step" && a.value != kListedStep) spec.step = Number(a, line);
  }
  if (spec.listed && spec.start) {
    for (const auto& a : d.attributes) {
      if (a.name == "start") {
        Fail(line, a.name_offset,
             "expected no start= for arguments declared step=list (they are taken as written), "
             "found 'start'");
      }
    }
  }
  if (second) {
    table_.argument2 = spec;
  } else {
    table_.argument = spec;
    have_argument_ = true;
  }
}

void Parser::AddColumn(const DirectiveAst& d, std::string_view line) {
  RequireId(d, line, "a column name");
  CheckAttributes(d, line, {"unit", "places", "title", "arg2"});
  if (table_.ColumnIndex(d.id) >= 0 || (have_argument_ && table_.argument.name == d.id)) {
    Fail(line, d.id_offset, "expected a new column name, found " + Quote(d.id) + " again");
  }
  ColumnSpec column;
  column.name = d.id;
  for (const auto& a : d.attributes) {
    if (a.name == "unit") column.unit = a.value;
    if (a.name == "places") column.places = Places(a, line);
    if (a.name == "title") column.title = a.value;
    if (a.name == "arg2") {
      if (!table_.argument2) {
        Fail(line, a.name_offset, "expected @argument2 before a column with arg2=, found 'arg2'");
      }
      column.arg2 = Number(a, line);
    }
  }
  if (table_.argument2 && !column.arg2) {
    Fail(line, d.end_offset,
         "expected arg2=VALUE on each column of a table with @argument2, found " +
             FoundChar(line, d.end_offset));
  }
  table_.columns.push_back(std::move(column));
}

void Parser::StartRows(const DirectiveAst& d, std::string_view line) {
  if (!d.id.empty() || !d.attributes.empty()) {
    const std::size_t at = d.id.empty() ? d.attributes[0].name_offset : d.id_offset;
    Fail(line, at, "expected nothing after @rows, found " + FoundToken(line, at));
  }
  if (!have_argument_)
    Fail(line, d.keyword_offset, "expected @argument before @rows, found '@rows'");
  if (table_.columns.empty()) {
    Fail(line, d.keyword_offset, "expected at least one @column before @rows, found '@rows'");
  }
  phase_ = Phase::kRows;
  rows_line_ = line_no_;
  rows_line_text_ = std::string(line);
  table_end_ = line_start_ + line.size();
}

}  // namespace apograph::transcription
