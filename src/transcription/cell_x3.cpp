// The cells of a row, written with Spirit X3: readings (numbers in the
// trade's notation, degree form or blank-separated places, `_`, `?`) and
// editorial marks. See grammar/transcription.ebnf, rules `cell` to `mark`.
#include "transcription/syntax.hpp"

#include <cstdint>

#include "transcription/x3_common.hpp"

namespace apograph::transcription {
namespace {

namespace x3 = boost::spirit::x3;
using x3g::Iterator;

constexpr int kMaxTokens = 24;
constexpr int kMaxIntegerDigits = 13;

/// One place as written: digits or `?`, with its offset in the reading.
struct PlaceToken {
  std::uint64_t value;
  std::uint32_t offset;
  std::uint16_t digits;
  bool unknown;
  bool fraction;
};

enum class Form { kTrade, kDegree, kColumns };

/// What the grammar saw, filled by the semantic actions (no allocation).
struct NumberScan {
  Iterator begin;
  bool negative = false;
  Form form = Form::kTrade;
  bool in_fraction = false;
  bool too_many = false;
  int count = 0;
  PlaceToken places[kMaxTokens];  // left uninitialised: only [0, count) is read

  void Add(PlaceToken token) {
    if (count == kMaxTokens) {
      too_many = true;
      return;
    }
    token.fraction = in_fraction;
    places[count++] = token;
  }
};
struct scan_tag;

const auto on_digits = [](auto& ctx) {
  NumberScan& scan = x3::get<scan_tag>(ctx);
  const auto& range = x3::_attr(ctx);
  PlaceToken token{0, static_cast<std::uint32_t>(range.begin() - scan.begin), 0, false, false};
  for (char c : range) {
    if (token.digits < 18) token.value = token.value * 10 + static_cast<std::uint64_t>(c - '0');
    if (token.digits < UINT16_MAX) ++token.digits;
  }
  scan.Add(token);
};
const auto on_unknown = [](auto& ctx) {
  NumberScan& scan = x3::get<scan_tag>(ctx);
  scan.Add(PlaceToken{0, static_cast<std::uint32_t>(x3::_where(ctx).begin() - scan.begin), 1, true,
                      false});
};
const auto on_negative = [](auto& ctx) { x3::get<scan_tag>(ctx).negative = true; };
const auto on_fraction = [](auto& ctx) { x3::get<scan_tag>(ctx).in_fraction = true; };
const auto on_degree = [](auto& ctx) {
  NumberScan& scan = x3::get<scan_tag>(ctx);
  scan.form = Form::kDegree;
  scan.in_fraction = true;
};
const auto on_columns = [](auto& ctx) { x3::get<scan_tag>(ctx).form = Form::kColumns; };

// grammar/transcription.ebnf: number, place, sign, *-tail, *-mark.
const auto kPlace = x3::rule<class place_id>{"a place (digits or '?')"} =
    x3::raw[+x3::char_('0', '9')][on_digits] | x3::lit('?')[on_unknown];
const auto kSign = x3::lit('-')[on_negative] | x3::lit("\xE2\x88\x92")[on_negative] | x3::lit('+');
const auto kMinuteMark = x3::rule<class minute_id>{"a minute mark (')"} =
    x3::lit('\'') | x3::lit("\xE2\x80\xB2");
const auto kSecondMark = x3::rule<class second_id>{"a second mark (\")"} =
    x3::lit("''") | x3::lit('"') | x3::lit("\xE2\x80\xB3");
const auto kDegreeTail = x3::lit("\xC2\xB0")[on_degree] >>
                         -(kPlace > kMinuteMark > -(kPlace > kSecondMark));
const auto kColumnsTail = +(x3::raw[+x3::char_(" \t")][on_columns] > kPlace);
const auto kTradeTail = *(x3::lit(',') > kPlace) >>
                        -(x3::lit(';')[on_fraction] > kPlace > *(x3::lit(',') > kPlace));
const auto kNumber = (-kSign > kPlace) >> (kDegreeTail | kColumnsTail | kTradeTail);

const auto kMarkHead = x3::lit('{') >> x3::omit[*x3::char_(" \t")] >> x3::raw[*x3::char_("a-zA-Z")];
const auto kMarkClose = x3::rule<class close_id>{"'}' closing the mark"} = x3::lit('}');

/// First of '{', '|', '#' from `pos`, or the end of the line.
std::size_t CellEnd(std::string_view line, std::size_t pos) {
  while (pos < line.size() && line[pos] != '{' && line[pos] != '|' && line[pos] != '#') ++pos;
  return pos;
}

[[noreturn]] void Fail(std::size_t offset, std::string message) {
  throw LineError{offset, std::move(message)};
}

std::string FoundInReading(std::string_view text, std::size_t at) {
  return at >= text.size() ? "end of cell" : FoundChar(text, at);
}

/// What may follow where the grammar stopped short of the end.
std::string ExpectedAfter(const NumberScan& scan) {
  switch (scan.form) {
    case Form::kDegree:
      return "the end of the reading";
    case Form::kColumns:
      return "a blank or the end of the reading";
    case Form::kTrade:
      break;
  }
  if (scan.in_fraction) return "',' or the end of the reading";
  if (scan.count > 1) return "',', ';' or the end of the reading";
  return "';', ',', '\xC2\xB0', a blank or the end of the reading";
}

NumberScan ScanNumber(std::string_view text, std::size_t base) {
  NumberScan scan;
  scan.begin = text.begin();
  Iterator first = text.begin();
  try {
    x3::parse(first, text.end(), x3::with<scan_tag>(scan)[kNumber]);
  } catch (const x3::expectation_failure<Iterator>& failure) {
    const auto at = static_cast<std::size_t>(failure.where() - text.begin());
    Fail(base + at, "expected " + failure.which() + ", found " + FoundInReading(text, at));
  }
  if (first != text.end()) {
    auto at = static_cast<std::size_t>(first - text.begin());
    while (at < text.size() && IsBlank(text[at])) ++at;  // point at what stands there
    Fail(base + at, "expected " + ExpectedAfter(scan) + ", found " + FoundInReading(text, at));
  }
  if (scan.too_many) {
    Fail(base, "expected at most " + std::to_string(kMaxTokens) + " places, found more");
  }
  return scan;
}

/// Splits blank-separated places into integer and fractional ones.
void AssignColumns(NumberScan& scan, std::string_view text, int places, std::size_t base) {
  if (places < 0) {
    Fail(base,
         "expected a number in the trade's notation such as 0;4,10 (places separated by "
         "blanks need the column's places), found " +
             QuotedText(text));
  }
  if (scan.count < places + 1) {
    Fail(base, "expected " + std::to_string(places + 1) +
                   " places separated by blanks (the column has " + std::to_string(places) +
                   " fractional places), found " + std::to_string(scan.count));
  }
  for (int i = scan.count - places; i < scan.count; ++i) scan.places[i].fraction = true;
}

std::string TokenText(std::string_view text, const PlaceToken& token) {
  return QuotedText(text.substr(token.offset, token.digits));
}

/// Checks every place and builds the exact value.
ReadingInfo Evaluate(const NumberScan& scan, std::string_view text, std::size_t base) {
  ReadingInfo info;
  Sexagesimal::Units units = 0;
  int integer_places = 0;
  bool unknown = false;
  for (int i = 0; i < scan.count; ++i) {
    const PlaceToken& token = scan.places[i];
    if (token.fraction) {
      ++info.fraction_places;
      if (info.fraction_places > Sexagesimal::kMaxPlaces) {
        Fail(base + token.offset, "expected at most " + std::to_string(Sexagesimal::kMaxPlaces) +
                                      " fractional places, found more");
      }
    } else {
      ++integer_places;
    }
    if (token.unknown) {
      unknown = true;
      continue;
    }
    const bool leading = !token.fraction && integer_places == 1;
    if (leading && (token.digits > kMaxIntegerDigits ||
                    token.value >= static_cast<std::uint64_t>(Sexagesimal::kIntegerLimit))) {
      Fail(base + token.offset,
           "expected an integer part below 10^12, found " + TokenText(text, token));
    }
    if (!leading && token.value > 59) {
      Fail(base + token.offset, "expected a place from 0 to 59, found " + TokenText(text, token));
    }
    units = (i == 0 ? 0 : units * 60) + static_cast<Sexagesimal::Units>(token.value);
    if (!token.fraction && units >= Sexagesimal::kIntegerLimit) {
      Fail(base + scan.places[0].offset,
           "expected an integer part below 10^12, found " + QuotedText(text));
    }
  }
  if (unknown) {
    info.state = CellState::kPartial;
  } else {
    info.value = Sexagesimal::FromUnits(scan.negative ? -units : units, info.fraction_places);
  }
  return info;
}

/// The common reading, `[-+]D(,D)*(;D(,D)*)?` with every place written in
/// digits, read without the grammar in one pass over its characters: a
/// sheet of 360 rows holds 720 of them, and the grammar's general machinery
/// was a third of reading one (perf, 1,000 sheets). It reads this form as
/// the number stage's reader (Sexagesimal::Parse) does: a leading run of at
/// most 13 digits, later places of 1 to 3 digits from 0 to 59. Anything
/// else, and anything the grammar would refuse (a place above 59, more
/// than 24 places or 12 fractional ones, too many digits, an integer part
/// of 10^12 or more), is left to the grammar, which answers with its own
/// error: nullopt. Equal to the grammar's result wherever it answers
/// (tests/transcription/reading_fast_test.cpp compares them).
std::optional<ReadingInfo> ScanPlainTrade(std::string_view text) {
  constexpr int kMaxLeadingDigits = 13;
  constexpr int kMaxPlaceDigits = 3;
  const auto digit = [](char c) { return c >= '0' && c <= '9'; };
  const std::size_t n = text.size();
  std::size_t i = 0;
  bool negative = false;
  if (n > 0 && (text[0] == '-' || text[0] == '+')) negative = text[i++] == '-';
  Sexagesimal::Units units = 0;
  const std::size_t lead = i;
  for (; i < n && digit(text[i]); ++i) {
    if (i - lead == kMaxLeadingDigits) return std::nullopt;
    units = units * 10 + (text[i] - '0');
  }
  if (i == lead || units >= Sexagesimal::kIntegerLimit) return std::nullopt;
  int places = 1, fraction_places = 0;
  bool in_fraction = false;
  while (i < n) {
    const char separator = text[i++];
    if (separator == ';' && !in_fraction) {
      in_fraction = true;
    } else if (separator != ',') {
      return std::nullopt;
    }
    int place = 0;
    const std::size_t first = i;
    for (; i < n && digit(text[i]) && i - first < kMaxPlaceDigits; ++i) {
      place = place * 10 + (text[i] - '0');
    }
    if (i == first || place > 59 || ++places > kMaxTokens) return std::nullopt;
    units = units * 60 + place;
    if (in_fraction && ++fraction_places > Sexagesimal::kMaxPlaces) return std::nullopt;
    if (!in_fraction && units >= Sexagesimal::kIntegerLimit) return std::nullopt;
  }
  ReadingInfo info;
  info.fraction_places = fraction_places;
  info.value = Sexagesimal::FromUnits(negative ? -units : units, fraction_places);
  return info;
}

}  // namespace

ReadingInfo ParseReading(std::string_view text, int places, std::size_t base) {
  if (auto plain = ScanPlainTrade(text)) return *plain;
  return ParseReadingByGrammar(text, places, base);
}

ReadingInfo ParseReadingByGrammar(std::string_view text, int places, std::size_t base) {
  ReadingInfo info;
  if (text == "_") {
    info.state = CellState::kBlank;
    return info;
  }
  if (text == "?") {
    info.state = CellState::kIllegible;
    return info;
  }
  const char c = text.empty() ? '\0' : text[0];
  const bool can_start = (c >= '0' && c <= '9') || c == '?' || c == '-' || c == '+' ||
                         text.substr(0, 3) == "\xE2\x88\x92";
  if (!can_start) {
    Fail(base, "expected a reading (a number such as 0;4,10, '_' or '?'), found " +
                   FoundInReading(text, 0));
  }
  NumberScan scan = ScanNumber(text, base);
  if (scan.form == Form::kColumns) AssignColumns(scan, text, places, base);
  return Evaluate(scan, text, base);
}

std::string ParseQuoted(std::string_view line, std::size_t& pos) {
  std::string out;
  if (!x3g::Run(line, pos, x3g::kQuoted, out)) {
    throw LineError{
        pos, "expected a quoted string such as \"ink faded\", found " + FoundChar(line, pos)};
  }
  return out;
}

namespace {

void SkipBlanks(std::string_view line, std::size_t& pos) {
  while (pos < line.size() && IsBlank(line[pos])) ++pos;
}

void RequireBlank(std::string_view line, std::size_t& pos, const char* after) {
  if (pos >= line.size() || !IsBlank(line[pos])) {
    Fail(pos, std::string("expected a blank after '") + after + "', found " + FoundChar(line, pos));
  }
  SkipBlanks(line, pos);
}

/// `{was READING}`: the reading before the scribe's correction.
void ParseWas(std::string_view line, std::size_t& pos, int places, Cell& cell) {
  RequireBlank(line, pos, "was");
  std::size_t end = line.find_first_of("}|#{", pos);
  if (end == std::string_view::npos) end = line.size();
  if (end >= line.size() || line[end] != '}') {
    Fail(end, "expected '}' closing the mark, found " + FoundChar(line, end));
  }
  std::size_t last = end;
  while (last > pos && IsBlank(line[last - 1])) --last;
  if (last == pos) Fail(pos, "expected the reading before the correction, found '}'");
  ParseReading(line.substr(pos, last - pos), places, pos);
  cell.corrected_from = std::string(line.substr(pos, last - pos));
  pos = end;
}

/// One `{...}`; `pos` stands on '{' and is left after '}'.
void ParseMark(std::string_view line, std::size_t& pos, int places, Cell& cell) {
  boost::iterator_range<Iterator> word;
  x3g::Run(line, pos, kMarkHead, word);
  const auto word_offset = static_cast<std::size_t>(word.begin() - line.begin());
  const std::string_view kind = line.substr(word_offset, static_cast<std::size_t>(word.size()));
  auto once = [&](bool already) {
    if (already) {
      Fail(word_offset,
           "expected each mark once per cell, found a second {" + std::string(kind) + "}");
    }
  };
  if (kind == "damaged") {
    once(cell.damaged);
    cell.damaged = true;
  } else if (kind == "doubt") {
    once(cell.doubtful);
    cell.doubtful = true;
  } else if (kind == "margin" || kind == "interlinear") {
    once(cell.addition != Addition::kNone);
    cell.addition = kind == "margin" ? Addition::kMargin : Addition::kInterlinear;
  } else if (kind == "was") {
    once(cell.corrected_from.has_value());
    ParseWas(line, pos, places, cell);
  } else if (kind == "note") {
    once(!cell.note.empty());
    RequireBlank(line, pos, "note");
    cell.note = ParseQuoted(line, pos);
  } else {
    Fail(word_offset,
         "expected a mark (damaged, doubt, margin, interlinear, was READING or note \"TEXT\"), "
         "found " +
             FoundToken(line, word_offset));
  }
  x3g::Run(line, pos, *x3::char_(" \t") > kMarkClose);
}

}  // namespace

ReadingInfo ParseCell(std::string_view line, std::size_t& pos, int places, Cell& cell,
                      std::size_t& reading_offset, bool argument) {
  SkipBlanks(line, pos);
  const std::size_t start = pos;
  const std::size_t end = CellEnd(line, pos);
  std::size_t last = end;
  while (last > start && IsBlank(line[last - 1])) --last;
  if (last == start) {
    Fail(start, "expected a reading (a number such as 0;4,10, '_' or '?'), found " +
                    FoundChar(line, start));
  }
  const std::string_view text = line.substr(start, last - start);
  ReadingInfo info =
      argument ? ParseArgumentReading(text, places, start) : ParseReading(text, places, start);
  cell.raw.assign(text.data(), text.size());
  cell.state = info.state;
  cell.value = info.value;
  reading_offset = start;
  pos = end;
  for (;;) {
    SkipBlanks(line, pos);
    if (pos >= line.size() || line[pos] != '{') break;
    ParseMark(line, pos, places, cell);
  }
  if (pos < line.size() && line[pos] != '|' && line[pos] != '#') {
    Fail(pos,
         "expected '|', a mark in braces or the end of the row, found " + FoundToken(line, pos));
  }
  return info;
}

}  // namespace apograph::transcription
