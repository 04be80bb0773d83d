// The decisions in force brought to the analysis: matched to the current
// transcriptions and turned into the collation's judgements.
#include <algorithm>
#include <map>

#include "pipeline/decision_state.hpp"
#include "pipeline/decisions.hpp"

namespace apograph::pipeline {
namespace {

using collate::CellJudgement;

std::string WithNote(std::string words, const std::string& note) {
  return note.empty() ? words : words + ": " + note;
}

/// The judgement of a witness's cell, created when the analysis made none.
std::optional<CellJudgement>& Slot(collate::CollateOptions& o, const Transcription& t, int row,
                                   int column) {
  auto& grid = o.judgements[t.witness.siglum];
  if (grid.size() < t.rows.size()) grid.resize(t.rows.size());
  auto& cells = grid[static_cast<std::size_t>(row)];
  if (cells.size() < t.columns.size()) cells.resize(t.columns.size());
  return cells[static_cast<std::size_t>(column)];
}

void ApplyOnFinding(const WitnessCellDecision& w, const Transcription& t,
                    collate::CollateOptions& o) {
  auto& j = Slot(o, t, w.row, w.column);
  if (!j) j.emplace();
  j->editor = w.decision.editor;
  if (w.decision.action == Action::kAccept) {
    j->error = true;
    j->emendation = Sexagesimal::Parse(w.cell.proposed);
    j->decision = WithNote("accepted the emendation to " + w.cell.proposed, w.decision.note);
  } else {
    j->error = false;
    j->cause.clear();
    j->slip.clear();
    j->common_slip = false;
    j->emendation.reset();
    j->decision = WithNote("kept this reading, rejecting the emendation to " + w.cell.proposed,
                           w.decision.note);
  }
}

void ApplyOnEditedCell(const EditedCellDecision& e, const Transcription& t,
                       const std::map<std::string, int>& rows, collate::CollateOptions& o) {
  const auto row = rows.find(e.arg);
  const int column = t.ColumnIndex(e.column);
  if (row == rows.end() || column < 0) return;
  const Cell& cell =
      t.rows[static_cast<std::size_t>(row->second)].cells[static_cast<std::size_t>(column)];
  const bool comparable =
      (cell.state == CellState::kRead && cell.value) || cell.state == CellState::kBlank;
  if (!comparable) return;
  const auto adopted = Sexagesimal::Parse(e.reading);
  const bool right = adopted && cell.value && cell.value->Identical(*adopted);
  auto& j = Slot(o, t, row->second, column);
  if (!j) j.emplace();
  j->error = !right;
  j->editor = e.decision.editor;
  if (right) {
    j->cause.clear();
    j->slip.clear();
    j->emendation.reset();
  } else {
    j->emendation = adopted;
  }
  const std::string what = e.decision.action == Action::kConjecture ? "conjectured " : "adopted ";
  j->decision =
      WithNote(right ? what + "this reading" : what + e.reading + " instead", e.decision.note);
}

std::map<std::string, int> RowsByArgument(const Transcription& t) {
  std::map<std::string, int> out;
  for (std::size_t r = 0; r < t.rows.size(); ++r) {
    if (auto arg = t.ArgumentInUse(r)) out.emplace(arg->ToString(), static_cast<int>(r));
  }
  return out;
}

}  // namespace

const WitnessCellDecision* TableDecisions::At(const std::string& witness, const std::string& column,
                                              const std::string& arg) const {
  const WitnessCellDecision* out = nullptr;
  for (const auto& w : witness_cells) {
    if (w.applies && w.cell.witness == witness && w.cell.column == column && w.cell.arg == arg)
      out = &w;
  }
  return out;
}

const EditedCellDecision* TableDecisions::EditedAt(const std::string& arg,
                                                   const std::string& column) const {
  for (const auto& e : edited_cells) {
    if (e.arg == arg && e.column == column) return &e;
  }
  return nullptr;
}

std::vector<std::string> TableDecisions::Editors() const {
  std::vector<std::pair<std::int64_t, std::string>> all;
  for (const auto& w : witness_cells) all.push_back({w.decision.id, w.decision.editor});
  for (const auto& e : edited_cells) all.push_back({e.decision.id, e.decision.editor});
  std::sort(all.begin(), all.end());
  std::vector<std::string> out;
  for (const auto& [id, name] : all) {
    if (std::find(out.begin(), out.end(), name) == out.end()) out.push_back(name);
  }
  return out;
}

TableDecisions LoadTableDecisions(store::Database& db, const std::string& table_id,
                                  const std::vector<Transcription>& transcriptions) {
  internal::DecisionContext cx(db, table_id, &transcriptions);
  TableDecisions out;
  for (const auto* d : cx.InForce()) {
    if (d->action != "accept" && d->action != "reject") continue;
    const Decision decision = internal::ToDecision(*d);
    for (const auto& c : decision.cells) {
      auto t = cx.current().find(c.witness);
      if (t == cx.current().end()) continue;  // a witness not analysed
      WitnessCellDecision w{c, decision};
      const auto row = cx.RowAt(c.witness, c.arg);
      w.row = row.value_or(-1);
      w.column = t->second.ColumnIndex(c.column);
      w.now = cx.ReadingAt(c.witness, c.column, c.arg).value_or("");
      w.applies = row && w.column >= 0 && w.now == c.reading;
      out.witness_cells.push_back(std::move(w));
    }
  }
  out.edited_cells = cx.EditedCells();
  return out;
}

void ApplyDecisions(const TableDecisions& decisions,
                    const std::vector<Transcription>& transcriptions,
                    collate::CollateOptions& options) {
  for (const auto& w : decisions.witness_cells) {
    if (!w.applies) continue;
    for (const auto& t : transcriptions) {
      if (t.witness.siglum == w.cell.witness) ApplyOnFinding(w, t, options);
    }
  }
  for (const auto& t : transcriptions) {
    const auto rows = RowsByArgument(t);
    for (const auto& e : decisions.edited_cells) ApplyOnEditedCell(e, t, rows, options);
  }
}

}  // namespace apograph::pipeline
