#include "edition/transcription.hpp"

#include <algorithm>

namespace apograph {

const char* ToString(CellState state) {
  switch (state) {
    case CellState::kRead:
      return "read";
    case CellState::kPartial:
      return "partial";
    case CellState::kIllegible:
      return "illegible";
    case CellState::kBlank:
      return "blank";
  }
  return "read";
}

const char* ToString(Addition addition) {
  switch (addition) {
    case Addition::kNone:
      return "none";
    case Addition::kMargin:
      return "margin";
    case Addition::kInterlinear:
      return "interlinear";
  }
  return "none";
}

std::optional<CellState> CellStateFromString(const std::string& text) {
  for (auto s : {CellState::kRead, CellState::kPartial, CellState::kIllegible, CellState::kBlank}) {
    if (text == ToString(s)) return s;
  }
  return std::nullopt;
}

std::optional<Addition> AdditionFromString(const std::string& text) {
  for (auto a : {Addition::kNone, Addition::kMargin, Addition::kInterlinear}) {
    if (text == ToString(a)) return a;
  }
  return std::nullopt;
}

const char* ToString(WitnessKind kind) {
  switch (kind) {
    case WitnessKind::kManuscript:
      return "manuscript";
    case WitnessKind::kPrint:
      return "print";
    case WitnessKind::kModernEdition:
      return "modern-edition";
  }
  return "manuscript";
}

std::optional<WitnessKind> WitnessKindFromString(const std::string& text) {
  for (auto k : {WitnessKind::kManuscript, WitnessKind::kPrint, WitnessKind::kModernEdition}) {
    if (text == ToString(k)) return k;
  }
  return std::nullopt;
}

WitnessKind WitnessInfo::Kind() const {
  return WitnessKindFromString(kind).value_or(WitnessKind::kManuscript);
}

std::optional<YearRange> WitnessInfo::Dates() const { return ParseWitnessDate(date); }

bool Cell::SameContent(const Cell& o) const {
  const bool same_value =
      value.has_value() == o.value.has_value() && (!value || value->Identical(*o.value));
  return raw == o.raw && same_value && places == o.places && state == o.state &&
         damaged == o.damaged && doubtful == o.doubtful && addition == o.addition &&
         corrected_from == o.corrected_from && note == o.note;
}

int Transcription::ColumnIndex(const std::string& name) const {
  for (std::size_t i = 0; i < columns.size(); ++i) {
    if (columns[i].name == name) return static_cast<int>(i);
  }
  return -1;
}

std::optional<Sexagesimal> Transcription::ExpectedArgument(std::size_t row) const {
  if (!argument.start || !argument.step) return std::nullopt;
  return *argument.start + *argument.step * static_cast<std::int64_t>(row);
}

std::optional<Sexagesimal> Transcription::ArgumentInUse(std::size_t row) const {
  try {
    return ResolveArgument(row);
  } catch (const std::overflow_error&) {
    return rows[row].argument.value;  // beyond exact range: take it as written
  }
}

std::optional<Sexagesimal> Transcription::ResolveArgument(std::size_t row) const {
  auto written = [&](std::size_t i) -> const std::optional<Sexagesimal>& {
    return rows[i].argument.value;
  };
  const auto& w = written(row);
  const bool has_prev = row > 0 && written(row - 1);
  const bool has_next = row + 1 < rows.size() && written(row + 1);
  if (w) {
    bool on_grid = true;
    if (argument.start && argument.step && !argument.step->is_zero()) {
      const Sexagesimal offset = *w - *argument.start;
      const Sexagesimal step = *argument.step;
      const int p = std::max(offset.places(), step.places());
      on_grid = offset.Extended(p).units() % step.Extended(p).units() == 0;
    }
    const bool after_prev = !has_prev || *w > *written(row - 1);
    const bool before_next = !has_next || *w <= *written(row + 1);  // of two equal, keep the first
    if (on_grid && after_prev && before_next) return w;
  }
  if (argument.step) {
    if (has_prev) return *written(row - 1) + *argument.step;
    if (has_next) return *written(row + 1) - *argument.step;
  }
  if (auto expected = ExpectedArgument(row)) return expected;
  return w;
}

std::size_t Transcription::CellCount() const {
  std::size_t n = 0;
  for (const auto& r : rows) n += r.cells.size();
  return n;
}

bool Transcription::SameContent(const Transcription& o) const {
  if (!(work == o.work && table_id == o.table_id && table_title == o.table_title &&
        kind == o.kind && witness == o.witness && folios == o.folios && hand == o.hand &&
        argument == o.argument && argument2 == o.argument2 && columns == o.columns &&
        rows.size() == o.rows.size())) {
    return false;
  }
  for (std::size_t i = 0; i < rows.size(); ++i) {
    const auto& a = rows[i];
    const auto& b = o.rows[i];
    if (!a.argument.SameContent(b.argument) || a.cells.size() != b.cells.size()) return false;
    for (std::size_t j = 0; j < a.cells.size(); ++j) {
      if (!a.cells[j].SameContent(b.cells[j])) return false;
    }
  }
  return true;
}

}  // namespace apograph
