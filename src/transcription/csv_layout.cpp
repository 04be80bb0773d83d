// The layout of a CSV sheet read off its header: names checked, joins and
// places options applied, degree/minute/second columns recognised.
#include "transcription/csv_layout.hpp"

#include <algorithm>
#include <cctype>

#include "support/input_error.hpp"
#include "transcription/syntax.hpp"

namespace apograph {
namespace transcription::csv {
namespace {

std::string Trimmed(std::string_view s) {
  std::size_t a = 0, b = s.size();
  while (a < b && IsBlank(s[a])) ++a;
  while (b > a && IsBlank(s[b - 1])) --b;
  return std::string(s.substr(a, b - a));
}

bool IsWord(std::string_view s) {
  return !s.empty() && s.find_first_of(" \t\r\n\"#{}|=") == std::string_view::npos;
}

std::string NameList(const std::vector<std::string>& names) {
  std::string out;
  for (const auto& n : names) out += (out.empty() ? "" : ", ") + n;
  return out;
}

std::vector<std::string> HeaderNames(const std::vector<Field>& header) {
  std::vector<std::string> names;
  for (const auto& f : header) names.push_back(Trimmed(f.text));
  return names;
}

void CheckNames(const std::vector<Field>& header, const std::vector<std::string>& names) {
  if (names.size() < 2) {
    throw HeaderError{0, header[0].text.size(),
                      "expected a header naming the argument and at least one column, found " +
                          std::to_string(names.size()) + " field"};
  }
  for (std::size_t i = 0; i < names.size(); ++i) {
    if (!IsWord(names[i])) {
      throw HeaderError{
          i, 0,
          "expected a column name without blanks, quotes or #{}|=, found " + QuotedText(names[i])};
    }
    for (std::size_t j = 0; j < i; ++j) {
      if (names[j] == names[i])
        throw HeaderError{i, 0, "expected a new column name, found '" + names[i] + "' again"};
    }
  }
}

std::size_t IndexOf(const std::vector<std::string>& names, const std::string& name,
                    const std::string& option) {
  const auto it = std::find(names.begin(), names.end(), name);
  if (it == names.end()) {
    throw InputError::ForOption(option, "expected a column of the header (" + NameList(names) +
                                            "), found " + QuotedText(name));
  }
  return static_cast<std::size_t>(it - names.begin());
}

/// Applies the joins: each becomes one column at its first part's place.
std::vector<PlannedColumn> JoinColumns(const std::vector<std::string>& names,
                                       const std::vector<ColumnJoin>& joins) {
  std::vector<int> join_of(names.size(), -1);
  for (std::size_t j = 0; j < joins.size(); ++j) {
    for (const auto& part : joins[j].parts) {
      const std::size_t i = IndexOf(names, part, "--join");
      if (join_of[i] >= 0) {
        throw InputError::ForOption(
            "--join", "expected each column in one join, found " + QuotedText(part) + " twice");
      }
      join_of[i] = static_cast<int>(j);
    }
  }
  std::vector<PlannedColumn> out;
  std::vector<bool> placed(joins.size(), false);
  for (std::size_t i = 0; i < names.size(); ++i) {
    if (join_of[i] < 0) {
      out.push_back({names[i], {i}, std::nullopt});
      continue;
    }
    const ColumnJoin& join = joins[static_cast<std::size_t>(join_of[i])];
    if (placed[static_cast<std::size_t>(join_of[i])]) continue;
    placed[static_cast<std::size_t>(join_of[i])] = true;
    PlannedColumn c{join.name, {}, static_cast<int>(join.parts.size()) - 1};
    for (const auto& part : join.parts) c.sources.push_back(IndexOf(names, part, "--join"));
    out.push_back(std::move(c));
  }
  return out;
}

void CheckPlanned(const std::vector<PlannedColumn>& columns) {
  if (columns.size() < 2) {
    throw InputError::ForOption("--join",
                                "expected the argument and at least one column after joining, "
                                "found " +
                                    std::to_string(columns.size()) + " column");
  }
  for (std::size_t i = 0; i < columns.size(); ++i) {
    for (std::size_t j = 0; j < i; ++j) {
      if (columns[i].name == columns[j].name) {
        throw InputError::ForOption("--join",
                                    "expected a new column name for the joined value, "
                                    "found '" +
                                        columns[i].name + "' again");
      }
    }
  }
}

void ApplyPlaces(std::vector<PlannedColumn>& columns, const CsvOptions& options) {
  auto check = [](int places) {
    if (places < 0 || places > Sexagesimal::kMaxPlaces) {
      throw InputError::ForOption("--places",
                                  "expected places from 0 to 12, found " + std::to_string(places));
    }
  };
  if (options.places) check(*options.places);
  for (std::size_t i = 1; i < columns.size(); ++i) {
    if (options.places && columns[i].sources.size() == 1) columns[i].places = options.places;
  }
  std::vector<std::string> names;
  for (const auto& c : columns) names.push_back(c.name);
  for (const auto& [name, places] : options.column_places) {
    check(places);
    columns[IndexOf(names, name, "--places")].places = places;
  }
}

enum class Part { kNone, kDegrees, kMinutes, kSeconds };

/// What a header name says it holds, and the stem before that word.
Part PartOf(const std::string& name, std::string& stem) {
  std::string lower = name;
  for (char& c : lower) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  struct Word {
    const char* text;
    Part part;
  };
  static const Word kWords[] = {
      {"degrees", Part::kDegrees},  {"degree", Part::kDegrees},  {"deg", Part::kDegrees},
      {"\xC2\xB0", Part::kDegrees}, {"d", Part::kDegrees},       {"minutes", Part::kMinutes},
      {"minute", Part::kMinutes},   {"min", Part::kMinutes},     {"'", Part::kMinutes},
      {"m", Part::kMinutes},        {"seconds", Part::kSeconds}, {"second", Part::kSeconds},
      {"sec", Part::kSeconds},      {"''", Part::kSeconds},      {"s", Part::kSeconds}};
  for (const Word& w : kWords) {
    const std::string_view word = w.text;
    if (lower.size() < word.size() ||
        lower.compare(lower.size() - word.size(), word.size(), word) != 0) {
      continue;
    }
    std::string rest = name.substr(0, lower.size() - word.size());
    const bool separated =
        !rest.empty() && std::string_view("_-.").find(rest.back()) != std::string_view::npos;
    if (separated) rest.pop_back();
    // A one-letter word counts only alone or after a separator ("eq_m", not "sum").
    if (rest.empty() || separated || word.size() > 1) {
      stem = rest;
      return w.part;
    }
  }
  return Part::kNone;
}

}  // namespace

Plan PlanColumns(const std::vector<Field>& header, const CsvOptions& options) {
  const std::vector<std::string> names = HeaderNames(header);
  CheckNames(header, names);
  Plan plan;
  plan.fields = names.size();
  plan.columns = JoinColumns(names, options.joins);
  CheckPlanned(plan.columns);
  ApplyPlaces(plan.columns, options);
  return plan;
}

std::vector<PartGroup> FindPartGroups(const std::vector<Field>& header) {
  const std::vector<std::string> names = HeaderNames(header);
  std::vector<PartGroup> groups;
  for (std::size_t i = 0; i + 1 < names.size(); ++i) {
    std::string stem, stem_m, stem_s;
    if (PartOf(names[i], stem) != Part::kDegrees ||
        PartOf(names[i + 1], stem_m) != Part::kMinutes || stem_m != stem) {
      continue;
    }
    const bool seconds =
        i + 2 < names.size() && PartOf(names[i + 2], stem_s) == Part::kSeconds && stem_s == stem;
    groups.push_back({i, seconds ? 3u : 2u, stem.empty() ? names[i] : stem});
    i += seconds ? 2 : 1;
  }
  return groups;
}

}  // namespace transcription::csv

ColumnJoin ParseColumnJoin(const std::string& text, const std::string& option) {
  const auto fail = [&]() -> ColumnJoin {
    throw InputError::ForOption(
        option, ExpectedFound("NAME=A+B[+C] (the columns of one value, integer part first)",
                              QuotedText(text)));
  };
  const std::size_t eq = text.find('=');
  if (eq == std::string::npos || eq == 0) return fail();
  ColumnJoin join;
  join.name = text.substr(0, eq);
  std::size_t from = eq + 1;
  for (;;) {
    const std::size_t plus = text.find('+', from);
    join.parts.push_back(text.substr(from, plus == std::string::npos ? plus : plus - from));
    if (join.parts.back().empty()) return fail();
    if (plus == std::string::npos) break;
    from = plus + 1;
  }
  if (join.parts.size() < 2 || join.parts.size() > 1 + Sexagesimal::kMaxPlaces) return fail();
  if (!transcription::csv::IsWord(join.name)) return fail();
  return join;
}

}  // namespace apograph
