// Sheet manifests: directive lines (the transcription format's syntax, read
// by ParseDirective) naming CSV sheets and what they cannot say.
#include "transcription/sheet_manifest.hpp"

#include <filesystem>
#include <initializer_list>

#include "edition/names.hpp"
#include "support/input_error.hpp"
#include "transcription/syntax.hpp"
#include "transcription/witness_attributes.hpp"

namespace apograph {
namespace {

using transcription::ApplyWitnessAttribute;
using transcription::AttributeAst;
using transcription::DirectiveAst;
using transcription::LineError;

class ManifestReader {
 public:
  ManifestReader(std::string_view text, const std::string& file, const std::string& folder,
                 const CsvOptions& common)
      : text_(text), file_(file), folder_(folder), common_(common) {}
  std::vector<SheetEntry> Run();

 private:
  void Line(std::string_view line);
  void Work(const DirectiveAst& d);
  void Witness(const DirectiveAst& d);
  void Table(const DirectiveAst& d);
  void Argument(const DirectiveAst& d);
  void Column(const DirectiveAst& d);
  void Allow(const DirectiveAst& d, std::initializer_list<std::string_view> names);
  void RequireSafe(const DirectiveAst& d, const char* what);
  [[noreturn]] void Fail(std::size_t offset, std::string message) const;

  std::string_view text_;
  const std::string& file_;
  const std::string& folder_;
  const CsvOptions& common_;
  std::string_view line_;
  int line_no_ = 0;
  WorkInfo work_;
  WitnessInfo witness_;
  bool have_work_ = false, have_witness_ = false;
  std::vector<SheetEntry> out_;
};

void ManifestReader::Fail(std::size_t offset, std::string message) const {
  Diagnostic d;
  d.where.file = file_;
  d.where.line = line_no_;
  d.where.line_text = std::string(line_);
  d.where.column = transcription::ColumnCounter(line_).At(offset);
  d.message = std::move(message);
  throw InputError(d);
}

void ManifestReader::Allow(const DirectiveAst& d, std::initializer_list<std::string_view> names) {
  std::string list;
  for (std::string_view n : names) list += (list.empty() ? "" : ", ") + std::string(n);
  for (std::size_t i = 0; i < d.attributes.size(); ++i) {
    const AttributeAst& a = d.attributes[i];
    bool known = false;
    for (std::string_view n : names) known = known || a.name == n;
    if (!known) {
      Fail(a.name_offset, "expected an attribute of @" + d.keyword + " in a sheet manifest (" +
                              list + "), found " + QuotedText(a.name));
    }
    for (std::size_t j = 0; j < i; ++j) {
      if (d.attributes[j].name == a.name)
        Fail(a.name_offset, "expected each attribute once, found a second " + QuotedText(a.name));
    }
  }
}

void ManifestReader::RequireSafe(const DirectiveAst& d, const char* what) {
  if (d.id.empty()) {
    Fail(d.end_offset, std::string("expected ") + what + " after @" + d.keyword + ", found " +
                           transcription::FoundChar(line_, d.end_offset));
  }
  if (!IsSafeId(d.id)) {
    Fail(d.id_offset,
         std::string("expected ") + what + " of " + kSafeIdRule + ", found " + QuotedText(d.id));
  }
}

void ManifestReader::Work(const DirectiveAst& d) {
  RequireSafe(d, "a work id");
  Allow(d, {"title", "author"});
  work_ = WorkInfo{d.id, "", ""};
  for (const auto& a : d.attributes) (a.name == "title" ? work_.title : work_.author) = a.value;
  have_work_ = true;
}

void ManifestReader::Witness(const DirectiveAst& d) {
  RequireSafe(d, "a siglum");
  Allow(d, {"library", "shelfmark", "date", "script", "note", "kind"});
  witness_ = WitnessInfo{};
  witness_.siglum = d.id;
  for (const auto& a : d.attributes) {
    if (std::string problem = ApplyWitnessAttribute(witness_, a, common_.read); !problem.empty())
      Fail(a.value_offset, problem);
  }
  have_witness_ = true;
}

void ManifestReader::Table(const DirectiveAst& d) {
  if (!have_witness_) Fail(d.keyword_offset, "expected @witness before @table, found '@table'");
  RequireSafe(d, "a table id");
  Allow(d, {"sheet", "title", "kind", "folios", "hand", "delimiter", "join"});
  SheetEntry& e = out_.emplace_back();
  e.options = common_;
  Transcription& h = e.options.head;
  h = Transcription{};
  h.table_id = d.id;
  h.work = have_work_ ? work_ : WorkInfo{};
  h.witness = witness_;
  for (const auto& a : d.attributes) {
    if (a.name == "sheet") e.path = a.value;
    if (a.name == "title") h.table_title = a.value;
    if (a.name == "kind") h.kind = a.value;
    if (a.name == "folios") h.folios = a.value;
    if (a.name == "hand") h.hand = a.value;
    if (a.name == "join") e.options.joins = {ParseColumnJoin(a.value, file_ + " join=")};
    if (a.name == "delimiter") {
      if (a.value != "," && a.value != ";" && a.value != "tab")
        Fail(a.value_offset,
             "expected delimiter=\",\", \";\" or tab, found " + QuotedText(a.value));
      e.options.delimiter = a.value == "tab" ? '\t' : a.value[0];
    }
  }
  if (e.path.empty()) {
    Fail(d.end_offset, "expected sheet=FILE on @table in a sheet manifest, found " +
                           transcription::FoundChar(line_, d.end_offset));
  }
  if (std::filesystem::path(e.path).is_relative() && !folder_.empty()) {
    e.path = (std::filesystem::path(folder_) / e.path).string();
  }
}

void ManifestReader::Argument(const DirectiveAst& d) {
  if (out_.empty()) Fail(d.keyword_offset, "expected @table before @argument, found '@argument'");
  if (d.id.empty()) Fail(d.end_offset, "expected the sheet's argument column after @argument");
  Allow(d, {"unit", "start", "step"});
  ArgumentSpec& a = out_.back().options.head.argument;
  a = ArgumentSpec{};
  a.name = d.id;
  for (const auto& attr : d.attributes) {
    if (attr.name == "unit") a.unit = attr.value;
    if (attr.name == "step" && attr.value == kListedStep) {
      a.listed = true;
      continue;
    }
    if (attr.name == "start" || attr.name == "step") {
      auto v = Sexagesimal::Parse(attr.value);
      if (!v) {
        Fail(attr.value_offset, "expected a number such as 0;30 for " + attr.name + "=, found " +
                                    QuotedText(attr.value));
      }
      (attr.name == "start" ? a.start : a.step) = v;
    }
  }
  if (a.listed && a.start) {
    Fail(d.id_offset, "expected no start= for arguments declared step=list, found one");
  }
}

void ManifestReader::Column(const DirectiveAst& d) {
  if (out_.empty()) Fail(d.keyword_offset, "expected @table before @column, found '@column'");
  if (d.id.empty()) Fail(d.end_offset, "expected a column of the sheet after @column");
  Allow(d, {"unit", "title"});
  ColumnSpec c;
  c.name = d.id;
  for (const auto& a : d.attributes) (a.name == "unit" ? c.unit : c.title) = a.value;
  out_.back().options.head.columns.push_back(std::move(c));
}

void ManifestReader::Line(std::string_view line) {
  line_ = line;
  std::size_t at = 0;
  while (at < line.size() && (line[at] == ' ' || line[at] == '\t')) ++at;
  if (at == line.size() || line[at] == '#') return;
  if (line[at] != '@') {
    Fail(at, "expected a directive (@work, @witness, @table, @argument, @column), found " +
                 transcription::FoundToken(line, at));
  }
  DirectiveAst d;
  try {
    d = transcription::ParseDirective(line, at);
  } catch (const LineError& e) {
    Fail(e.offset, e.message);
  }
  if (d.keyword == "work") return Work(d);
  if (d.keyword == "witness") return Witness(d);
  if (d.keyword == "table") return Table(d);
  if (d.keyword == "argument") return Argument(d);
  if (d.keyword == "column") return Column(d);
  Fail(at,
       "expected a directive of a sheet manifest (@work, @witness, @table, @argument, "
       "@column), found " +
           transcription::FoundToken(line, at));
}

std::vector<SheetEntry> ManifestReader::Run() {
  transcription::CheckText(text_, file_, common_.read.max_line_bytes);
  std::size_t pos = text_.substr(0, 3) == "\xEF\xBB\xBF" ? 3 : 0;
  for (;;) {
    const std::size_t newline = text_.find('\n', pos);
    const std::size_t end = newline == std::string_view::npos ? text_.size() : newline;
    std::string_view line = text_.substr(pos, end - pos);
    if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
    ++line_no_;
    Line(line);
    if (newline == std::string_view::npos) break;
    pos = newline + 1;
  }
  if (out_.empty()) {
    Diagnostic d;
    d.where = {file_, 1, 1, ""};
    d.message = "expected at least one @table ID sheet=FILE line, found none";
    throw InputError(d);
  }
  return std::move(out_);
}

}  // namespace

std::vector<SheetEntry> ParseSheetManifest(std::string_view text, const std::string& file,
                                           const std::string& folder, const CsvOptions& common) {
  return ManifestReader(text, file, folder, common).Run();
}

std::vector<SheetEntry> ReadSheetManifest(const std::string& path, const CsvOptions& common) {
  const std::string text = ReadTextFile(path, common.read.max_file_bytes, "a sheet manifest");
  return ParseSheetManifest(text, path, std::filesystem::path(path).parent_path().string(), common);
}

std::vector<SheetEntry> SheetsFromFiles(const std::vector<std::string>& files,
                                        const CsvOptions& common) {
  if (files.size() > 1 && !common.head.table_id.empty()) {
    throw InputError::ForOption("--table",
                                "expected one CSV sheet with --table (several sheets take their "
                                "table ids from their file names), found " +
                                    std::to_string(files.size()));
  }
  std::vector<SheetEntry> out;
  out.reserve(files.size());  // an entry holds a table's head: grown, they were all copied
  for (const auto& f : files) {
    SheetEntry& e = out.emplace_back();
    e.path = f;
    e.options = common;
    if (!e.options.head.table_id.empty()) continue;
    const std::string stem = std::filesystem::path(f).stem().string();
    if (!IsSafeId(stem)) {
      throw InputError::ForFile(f, "expected a file name that is a table id (" +
                                       std::string(kSafeIdRule) + "), found " + QuotedText(stem) +
                                       " (give --table, or name the sheets in a --manifest)");
    }
    e.options.head.table_id = stem;
  }
  return out;
}

}  // namespace apograph
