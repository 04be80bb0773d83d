// CSV records cut into fields that point into the text (RFC 4180 quoting;
// only a quoted field with a doubled quote is copied), with positions kept
// for messages.
#include "transcription/csv_internal.hpp"

namespace apograph::transcription::csv {

std::string_view CsvReader::LineAt(std::size_t line_start) const {
  std::size_t end = text_.find('\n', line_start);
  if (end == std::string_view::npos) end = text_.size();
  std::string_view line = text_.substr(line_start, end - line_start);
  if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
  return line;
}

void CsvReader::Fail(int line, std::size_t line_start, std::size_t offset,
                     std::string message) const {
  Diagnostic d;
  d.where.file = file_;
  d.where.line = line;
  const std::string_view text = LineAt(line_start);
  d.where.line_text = std::string(text);
  d.where.column = ColumnCounter(text).At(offset);
  d.message = std::move(message);
  throw InputError(d);
}

void CsvReader::FailEmpty(std::string message) const {
  Diagnostic d;
  d.where = {file_, 1, 1, std::string(LineAt(0))};
  d.message = std::move(message);
  throw InputError(d);
}

void CsvReader::ReadQuoted(Field& field) {
  const int open_line = line_;
  const std::size_t open_start = line_start_;
  const std::size_t open = pos_ - line_start_;
  const std::size_t begin = ++pos_;
  bool escaped = false;
  for (;; ++pos_) {
    if (pos_ >= text_.size())
      Fail(open_line, open_start, open,
           "expected a closing '\"' for this field, found end of file");
    const char c = text_[pos_];
    if (c == '"' && pos_ + 1 < text_.size() && text_[pos_ + 1] == '"') {
      escaped = true;
      ++pos_;
    } else if (c == '"') {
      break;
    } else if (c == '\n') {
      ++line_;
      line_start_ = pos_ + 1;
    }
  }
  field.text = text_.substr(begin, pos_ - begin);
  if (escaped) {
    std::string& s = unquoted_.emplace_back();
    for (std::size_t i = 0; i < field.text.size(); ++i) {
      s += field.text[i];
      if (field.text[i] == '"') ++i;  // the second of a doubled quote
    }
    field.text = s;
  }
  ++pos_;  // the closing quote
  while (pos_ < text_.size() && IsBlankHere(text_[pos_])) ++pos_;
  if (pos_ < text_.size() && text_[pos_] != delimiter_ && text_[pos_] != '\n' &&
      text_[pos_] != '\r') {
    Fail(line_, line_start_, pos_ - line_start_,
         std::string("expected '") + (delimiter_ == '\t' ? "\\t" : std::string(1, delimiter_)) +
             "' or the end of the line after a quoted field, found " +
             FoundChar(LineAt(line_start_), pos_ - line_start_));
  }
}

/// The next non-empty record; false at the end of the text.
bool CsvReader::NextRecord(std::vector<Field>& record) {
  record.clear();
  unquoted_.clear();
  bool after_delimiter = false;  // a delimiter at the very end still opens a field
  while (pos_ < text_.size() || after_delimiter) {
    after_delimiter = false;
    Field& field = record.emplace_back();
    field.line = line_;
    field.line_start = line_start_;
    std::size_t quote = pos_;  // blanks around a quoted field are forgiven
    while (quote < text_.size() && IsBlankHere(text_[quote])) ++quote;
    if (quote < text_.size() && text_[quote] == '"') {
      pos_ = quote;
      field.offset = pos_ + 1 - line_start_;
      ReadQuoted(field);
    } else {
      field.offset = pos_ - line_start_;
      const std::size_t start = pos_;
      for (char c; pos_ < text_.size() && (c = text_[pos_]) != delimiter_ && c != '\n' && c != '\r';
           ++pos_) {
        if (c == '"') {
          Fail(line_, line_start_, pos_ - line_start_,
               "expected a field without '\"' (quote the whole field and double the quote), "
               "found '\"'");
        }
      }
      field.text = text_.substr(start, pos_ - start);
    }
    if (pos_ < text_.size() && text_[pos_] == delimiter_) {
      ++pos_;
      after_delimiter = true;
      continue;
    }
    if (pos_ < text_.size() && text_[pos_] == '\r') ++pos_;
    if (pos_ < text_.size()) {
      ++pos_;  // the '\n'
      ++line_;
      line_start_ = pos_;
    }
    if (record.size() == 1 && Trimmed(record[0].text).empty()) {
      record.clear();  // an empty line
      continue;
    }
    return true;
  }
  return false;
}

}  // namespace apograph::transcription::csv
