#include "pipeline/witness_findings.hpp"

#include <algorithm>
#include <cmath>
#include <map>

#include "pipeline/witness_internal.hpp"

namespace apograph::pipeline {

namespace {

using internal::ForWitness;

/// Sexagesimal places (integer part included) in which two readings differ.
int PlacesDiffering(const Sexagesimal& a, const Sexagesimal& b) {
  const int places = std::max(a.places(), b.places());
  const Sexagesimal x = a.Extended(places), y = b.Extended(places);
  int n = x.IntegerPart() != y.IntegerPart() || x.negative() != y.negative();
  const auto dx = x.FractionDigits(), dy = y.FractionDigits();
  for (std::size_t i = 0; i < dx.size() && i < dy.size(); ++i) n += dx[i] != dy[i];
  return n;
}

bool CommonSlip(const deviation::Finding& f, const deviation::FindingCell& cell) {
  if (std::isfinite(cell.diff_units) && std::fabs(cell.diff_units) <= 1 + 1e-9) return true;
  if (f.best().cls != deviation::SlipClass::kConfusion) return false;
  return cell.value && cell.emendation && PlacesDiffering(*cell.value, *cell.emendation) <= 1;
}

/// "column|argument" of a witness's cell, for matching across witnesses.
std::optional<std::string> PlaceKey(const Transcription& w, std::size_t row, std::size_t column) {
  const auto arg = w.ArgumentInUse(row);
  if (!arg) return std::nullopt;
  return w.columns[column].name + "|" + arg->ToString();
}

/// "column|argument|reading".
std::optional<std::string> CellKey(const Transcription& w, std::size_t row, std::size_t column) {
  const auto place = PlaceKey(w, row, column);
  const Cell& cell = w.rows[row].cells[column];
  if (!place || !cell.value) return std::nullopt;
  return *place + "|" + cell.value->ToString();
}

bool AuthorsDeparture(const collate::CellJudgement& j) { return !j.error && !j.slip.empty(); }

/// Calls `f(witness, row, column, judgement)` for every judged cell.
template <typename F>
void ForEachJudged(const std::vector<Transcription>& ws,
                   std::map<std::string, collate::JudgementGrid>& grids, F f) {
  for (const auto& w : ws) {
    auto& grid = grids[w.witness.siglum];
    for (std::size_t r = 0; r < grid.size(); ++r) {
      for (std::size_t c = 0; c < grid[r].size(); ++c) {
        if (grid[r][c]) f(w, r, c, *grid[r][c]);
      }
    }
  }
}

/// The author's departures were in the archetype: one read by a single
/// witness while two or more others read the model's value there is a
/// copyist's slip of a unit or so (weak evidence of descent).
void LoneDepartures(const std::vector<Transcription>& ws,
                    std::map<std::string, collate::JudgementGrid>& grids) {
  std::map<std::string, int> readers,
      right;  // cell key -> witnesses; place key -> model's readings
  ForEachJudged(
      ws, grids,
      [&](const Transcription& w, std::size_t r, std::size_t c, collate::CellJudgement& j) {
        if (auto key = CellKey(w, r, c)) ++readers[*key];
        if (auto place = PlaceKey(w, r, c); place && !j.error && j.slip.empty()) ++right[*place];
      });
  ForEachJudged(
      ws, grids,
      [&](const Transcription& w, std::size_t r, std::size_t c, collate::CellJudgement& j) {
        const auto key = CellKey(w, r, c);
        if (!AuthorsDeparture(j) || !key || readers[*key] > 1 || right[*PlaceKey(w, r, c)] < 2)
          return;
        j.error = true;
        j.common_slip = true;
        j.slip =
            "a small departure in this witness only, where the others read the model's value: a "
            "copyist's slip (" +
            j.slip + ")";
      });
}

/// A reading explained as the author's departure in one witness is his in
/// every witness that has it: the same value at the same cell cannot be the
/// author's in one copy and a copyist's slip in another (a slip that lands
/// on it, such as a repeated neighbour, is the less likely story).
void UnifyAuthorsReadings(const std::vector<Transcription>& ws,
                          std::map<std::string, collate::JudgementGrid>& grids) {
  std::map<std::string, collate::CellJudgement> authors;
  ForEachJudged(
      ws, grids,
      [&](const Transcription& w, std::size_t r, std::size_t c, collate::CellJudgement& j) {
        if (!AuthorsDeparture(j)) return;
        if (auto key = CellKey(w, r, c)) authors.emplace(*key, j);
      });
  ForEachJudged(
      ws, grids,
      [&](const Transcription& w, std::size_t r, std::size_t c, collate::CellJudgement& j) {
        if (!j.error) return;
        const auto key = CellKey(w, r, c);
        auto it = key ? authors.find(*key) : authors.end();
        if (it != authors.end()) j = it->second;
      });
}

/// The column's reference is refused in every witness that has it.
bool RefusedEverywhere(const std::vector<WitnessFindings>& findings, const std::string& column) {
  bool any = false;
  for (const auto& w : findings) {
    const auto* v = w.VerdictOf(column);
    if (!v) continue;
    if (v->verdict.explains) return false;
    any = true;
  }
  return any;
}

}  // namespace

int WitnessFindings::CopyingSlips() const {
  return static_cast<int>(std::count_if(
      findings.begin(), findings.end(),
      [](const deviation::Finding& f) { return deviation::IsCopyingSlip(f.best().cls); }));
}

int WitnessFindings::Departures() const {
  return static_cast<int>(findings.size()) - CopyingSlips();
}

collate::JudgementGrid JudgementsFromFindings(const Transcription& witness,
                                              const std::vector<ColumnReference>& references,
                                              const std::vector<deviation::Finding>& findings) {
  collate::JudgementGrid grid(
      witness.rows.size(),
      std::vector<std::optional<collate::CellJudgement>>(witness.columns.size()));
  for (const auto& any : references) {
    const auto ref = ForWitness(any, witness);
    if (!ref) continue;
    const auto re = ref->Recompute(witness);
    const int places = *ref->practice.places;
    for (std::size_t r = 0; r < witness.rows.size(); ++r) {
      const Cell& cell = witness.rows[r].cells[static_cast<std::size_t>(ref->column)];
      const bool comparable =
          (cell.state == CellState::kRead && cell.value) || cell.state == CellState::kBlank;
      if (!comparable || !re.computed[r]) continue;
      collate::CellJudgement j;
      j.computed = re.computed[r];
      if (cell.value)
        j.units_off =
            DiffUnits(*cell.value, *re.computed[r], std::max(places, cell.value->places()));
      grid[r][static_cast<std::size_t>(ref->column)] = j;
    }
  }
  for (const auto& f : findings) {
    const bool slip = deviation::IsCopyingSlip(f.best().cls);
    for (const auto& cell : f.cells) {
      if (cell.row >= grid.size()) continue;
      auto& j = grid[cell.row][static_cast<std::size_t>(f.column)];
      if (!j) continue;  // illegible or partial: the collation does not compare it
      j->error = slip;
      j->slip = std::string(deviation::ToString(f.best().cls)) + ": " + f.best().evidence;
      j->common_slip = slip && CommonSlip(f, cell);
    }
  }
  return grid;
}

collate::CollateOptions JudgedCollateOptions(const std::vector<Transcription>& witnesses,
                                             const std::vector<ColumnReference>& references,
                                             const std::vector<WitnessFindings>& findings,
                                             double tolerance_units) {
  collate::CollateOptions o;
  o.tolerance_units = tolerance_units;
  for (std::size_t i = 0; i < witnesses.size() && i < findings.size(); ++i) {
    std::vector<ColumnReference> judged;  // a refused reference judges nothing
    for (const auto& ref : references) {
      if (!findings[i].Refused(ref.column_name)) judged.push_back(ref);
    }
    o.judgements[witnesses[i].witness.siglum] =
        JudgementsFromFindings(witnesses[i], judged, findings[i].findings);
  }
  LoneDepartures(witnesses, o.judgements);
  UnifyAuthorsReadings(witnesses, o.judgements);
  if (witnesses.empty() || references.empty()) return o;
  // The collation's columns: every witness's columns by name, in order of first appearance.
  std::vector<std::string> names;
  for (const auto& w : witnesses) {
    for (const auto& c : w.columns) {
      if (std::find(names.begin(), names.end(), c.name) == names.end()) names.push_back(c.name);
    }
  }
  std::vector<std::optional<ColumnReference>> by_column(names.size());
  std::vector<std::optional<double>> arg2(names.size());
  for (std::size_t k = 0; k < names.size(); ++k) {
    for (const auto& w : witnesses) {
      const int c = w.ColumnIndex(names[k]);
      if (c >= 0 && w.columns[static_cast<std::size_t>(c)].arg2) {
        arg2[k] = w.columns[static_cast<std::size_t>(c)].arg2->ToDouble();
      }
    }
    for (const auto& ref : references) {
      if (ref.column_name == names[k] && !RefusedEverywhere(findings, names[k])) by_column[k] = ref;
    }
  }
  std::string description;
  for (const auto& ref : references) {
    description += (description.empty() ? "" : "; ") + ref.description;
    if (ref.source == ReferenceSource::kIdentified) description += " (" + ref.how + ")";
  }
  o.reference = collate::Reference{
      description,
      [by_column, arg2](const Sexagesimal& argument, int column) -> std::optional<Sexagesimal> {
        if (column < 0 || column >= static_cast<int>(by_column.size()) || !by_column[column])
          return std::nullopt;
        return by_column[column]->ValueAt(argument.ToDouble(), arg2[column]);
      }};
  return o;
}

}  // namespace apograph::pipeline
