// Building a collation: witnesses aligned row by row (alignment.cpp),
// slides found, each cell's readings grouped and judged (by the caller's
// explanations, a reference, or the majority).
#include "collate/collation.hpp"

#include <algorithm>
#include <cmath>
#include <sstream>

#include "collate/alignment.hpp"
#include "support/input_error.hpp"

namespace apograph::collate {

namespace {

using Grid = std::vector<std::vector<std::optional<Sexagesimal>>>;  // [row][column]

struct Context {
  const std::vector<Transcription>& ws;
  const CollateOptions& options;
  Collation& out;
  std::vector<std::vector<int>> column_map;  // [witness][its column] -> collation column
  std::vector<Grid> values;                  // [witness][aligned row][column]
};

void CheckInput(const std::vector<Transcription>& ws) {
  if (ws.empty())
    throw InputError::ForOption("collate", "expected at least one witness, found none");
  for (const auto& w : ws) {
    if (w.table_id != ws.front().table_id) {
      throw InputError::ForOption("collate",
                                  ExpectedFound("witnesses of table '" + ws.front().table_id + "'",
                                                "'" + w.table_id + "' in " + w.witness.siglum));
    }
  }
}

void CollectColumns(Context& cx) {
  for (const auto& w : cx.ws) {
    std::vector<int> map;
    for (const auto& col : w.columns) {
      int found = -1;
      for (std::size_t k = 0; k < cx.out.columns.size(); ++k) {
        if (cx.out.columns[k].name == col.name) found = static_cast<int>(k);
      }
      if (found < 0) {
        found = static_cast<int>(cx.out.columns.size());
        cx.out.columns.push_back(col);
      }
      map.push_back(found);
    }
    cx.column_map.push_back(std::move(map));
  }
}

std::optional<Sexagesimal> CellValue(const Cell& c) {
  return c.state == CellState::kRead ? c.value : std::nullopt;
}

// The most frequent value in a list (nullopt on a tie or when empty).
std::optional<Sexagesimal> Majority(std::vector<Sexagesimal> vs) {
  auto key = [](const Sexagesimal& v) { return std::pair(v.places(), v.units()); };
  std::sort(vs.begin(), vs.end(), [&](const auto& a, const auto& b) { return key(a) < key(b); });
  std::optional<Sexagesimal> best;
  std::size_t best_n = 0;
  bool tie = false;
  for (std::size_t i = 0; i < vs.size();) {
    std::size_t j = i;
    while (j < vs.size() && vs[j].Identical(vs[i])) ++j;
    if (j - i > best_n)
      best = vs[i], best_n = j - i, tie = false;
    else if (j - i == best_n)
      tie = true;
    i = j;
  }
  return tie ? std::nullopt : best;
}

Grid FillValues(const Context& cx, std::size_t wi, const std::vector<int>& grid_to_source) {
  Grid g(grid_to_source.size(), std::vector<std::optional<Sexagesimal>>(cx.out.columns.size()));
  const auto& w = cx.ws[wi];
  for (std::size_t j = 0; j < grid_to_source.size(); ++j) {
    if (grid_to_source[j] < 0) continue;
    const Row& row = w.rows[grid_to_source[j]];
    for (std::size_t c = 0; c < row.cells.size() && c < cx.column_map[wi].size(); ++c) {
      g[j][cx.column_map[wi][c]] = CellValue(row.cells[c]);
    }
  }
  return g;
}

// Majority value per aligned row and column over the given witnesses (skip = -1: none skipped).
Grid Consensus(const std::vector<Grid>& values, std::size_t rows, std::size_t cols, int skip = -1) {
  Grid g(rows, std::vector<std::optional<Sexagesimal>>(cols));
  for (std::size_t j = 0; j < rows; ++j) {
    for (std::size_t c = 0; c < cols; ++c) {
      std::vector<Sexagesimal> vs;
      for (std::size_t w = 0; w < values.size(); ++w) {
        if (static_cast<int>(w) != skip && values[w][j][c]) vs.push_back(*values[w][j][c]);
      }
      g[j][c] = Majority(vs);
    }
  }
  return g;
}

void Align(Context& cx, const std::vector<Sexagesimal>& grid) {
  std::vector<internal::RowAlignment> pass(cx.ws.size());
  for (std::size_t wi = 0; wi < cx.ws.size(); ++wi) {
    pass[wi] = internal::AlignRows(cx.ws[wi], grid, nullptr);
    cx.values.push_back(FillValues(cx, wi, pass[wi].grid_to_source));
  }
  // Second pass: the values of the other witnesses settle rows whose
  // argument alone leaves the place open.
  const Grid consensus = Consensus(cx.values, grid.size(), cx.out.columns.size());
  for (std::size_t wi = 0; wi < cx.ws.size(); ++wi) {
    const auto& w = cx.ws[wi];
    auto cost = [&](int i, int j) {
      int n = 0, differ = 0;
      for (std::size_t c = 0; c < w.rows[i].cells.size() && c < cx.column_map[wi].size(); ++c) {
        auto v = CellValue(w.rows[i].cells[c]);
        const auto& k = consensus[j][cx.column_map[wi][c]];
        if (!v || !k) continue;
        ++n;
        differ += v->Identical(*k) ? 0 : 1;
      }
      return n ? static_cast<double>(differ) / n : 0.0;
    };
    pass[wi] = internal::AlignRows(w, grid, cost);
    cx.values[wi] = FillValues(cx, wi, pass[wi].grid_to_source);
    for (auto& note : pass[wi].notes) cx.out.notes.push_back(std::move(note));
  }
  for (std::size_t j = 0; j < grid.size(); ++j) {
    CollatedRow row;
    row.argument = grid[j];
    for (std::size_t wi = 0; wi < cx.ws.size(); ++wi)
      row.source_row.push_back(pass[wi].grid_to_source[j]);
    cx.out.rows.push_back(std::move(row));
  }
}

// The value the others (or the model) give at row j, column c.
std::optional<Sexagesimal> OthersAt(const Context& cx, const Grid& others, int j, int c) {
  if (j < 0 || j >= static_cast<int>(others.size())) return std::nullopt;
  if (others[j][c]) return others[j][c];
  if (cx.options.reference) return cx.options.reference->value(cx.out.rows[j].argument, c);
  return std::nullopt;
}

// Whether value v at row j, column c reads the model's value there within
// the tolerance (false without a model).
bool ReadsReference(const Context& cx, int j, int c, const Sexagesimal& v) {
  if (!cx.options.reference) return false;
  const auto computed = cx.options.reference->value(cx.out.rows[j].argument, c);
  if (!computed) return false;
  const int places = std::max(cx.out.columns[c].places, v.places());
  return std::fabs(DiffUnits(v, *computed, places)) <= cx.options.tolerance_units;
}

// A witness's column is slid where it carries the others' value of the
// neighbouring row. Not where it reads the model's own value: the others
// may be one large line that inherited a slide, and the few witnesses
// that kept the right values would each seem slid the other way (seed 23
// of the lineage benchmark: five unrelated witnesses "sharing" a slide).
void FindSlides(Context& cx) {
  constexpr int kMinRun = 3;  // shorter runs are as likely to be separate slips
  const std::size_t rows = cx.out.rows.size(), cols = cx.out.columns.size();
  for (std::size_t wi = 0; wi < cx.ws.size(); ++wi) {
    const Grid others = Consensus(cx.values, rows, cols, static_cast<int>(wi));
    for (std::size_t c = 0; c < cols; ++c) {
      for (int offset : {+1, -1}) {
        int start = -1;
        for (int j = 0; j <= static_cast<int>(rows); ++j) {
          bool slid = false;
          if (j < static_cast<int>(rows) && cx.values[wi][j][c]) {
            const auto& v = *cx.values[wi][j][c];
            auto here = OthersAt(cx, others, j, static_cast<int>(c));
            auto there = OthersAt(cx, others, j + offset, static_cast<int>(c));
            slid = there && there->Identical(v) && !(here && here->Identical(v)) &&
                   !ReadsReference(cx, j, static_cast<int>(c), v);
          }
          if (slid && start < 0) start = j;
          if (!slid && start >= 0) {
            if (j - start >= kMinRun) {
              Slide s{cx.ws[wi].witness.siglum, static_cast<int>(c), start, j - 1, offset, ""};
              std::ostringstream t;
              t << "column " << cx.out.columns[c].name << " of " << s.siglum
                << " is slid by one row in rows " << cx.out.rows[start].argument.ToString()
                << " to " << cx.out.rows[j - 1].argument.ToString() << ": it carries the "
                << (offset > 0 ? "next" : "previous") << " row's values there (" << (j - start)
                << " entries, compared with the other witnesses)";
              s.text = t.str();
              cx.out.slides.push_back(std::move(s));
            }
            start = -1;
          }
        }
      }
    }
  }
}

Reading MakeReading(const Cell* cell, const std::string& siglum) {
  Reading r;
  r.sigla = {siglum};
  if (!cell) {
    r.kind = ReadingKind::kOmitted, r.text = "om.";
  } else if (cell->state == CellState::kRead && cell->value) {
    r.kind = ReadingKind::kValue, r.value = cell->value, r.text = cell->value->ToString();
  } else if (cell->state == CellState::kBlank) {
    r.kind = ReadingKind::kBlank, r.text = "blank";
  } else if (cell->state == CellState::kPartial) {
    r.kind = ReadingKind::kPartial, r.text = cell->raw;
  } else {
    r.kind = ReadingKind::kIllegible, r.text = "illeg.";
  }
  return r;
}

std::string Fmt(double x) {
  std::ostringstream o;
  o << (std::round(x * 100) / 100);
  return o.str();
}

// The caller's slip text without its class repeated ("unexplained: unexplained: ...").
std::string SlipWords(const CellJudgement& j) {
  const std::string prefix = j.cause + ": ";
  if (!j.cause.empty() && j.slip.rfind(prefix, 0) == 0) return j.slip.substr(prefix.size());
  return j.slip;
}

std::string CallerWhy(const Reading& r, const CellJudgement& j) {
  if (!j.decision.empty()) return "the editor (" + j.editor + ") " + j.decision;
  const std::string slip = SlipWords(j);
  if (j.error) {
    const std::string kind =
        j.cause.empty() ? "a copyist's slip" : "a copyist's slip (" + j.cause + ")";
    return slip.empty() ? kind : kind + ": " + slip;
  }
  if (!slip.empty()) return "the author's own value: " + slip;
  if (j.computed && r.value && r.value->Identical(*j.computed)) return "agrees with recomputation";
  if (j.computed)
    return "agrees with recomputation within its rounding (" + j.computed->ToString() + ")";
  return "not judged an error";
}

void JudgeByCaller(Reading& r, const CellJudgement& j) {
  r.error = j.error;
  if (j.computed && r.value) r.units_off = j.units_off;
  r.slip = j.slip;
  r.cause = j.cause;
  r.common_slip = j.common_slip;
  r.emendation = j.emendation;
  r.editor = j.editor;
  r.decision = j.decision;
  r.why = CallerWhy(r, j);
}

void JudgeByReference(Reading& r, const Sexagesimal& computed, int places, double tolerance) {
  if (r.kind == ReadingKind::kBlank) {
    r.error = true, r.why = "no entry where " + computed.ToString() + " is recomputed";
    return;
  }
  const double off = DiffUnits(*r.value, computed, std::max(places, r.value->places()));
  r.units_off = off;
  r.error = std::fabs(off) > tolerance;
  r.why = r.text + " is " + Fmt(off) + " units from the recomputed " + computed.ToString() +
          (r.error ? " (beyond the tolerance of " : " (within the tolerance of ") + Fmt(tolerance) +
          ")";
}

void JudgeByMajority(CollatedCell& cell) {
  std::vector<Reading*> comparable;
  for (auto& r : cell.readings) {
    if (r.Comparable()) comparable.push_back(&r);
  }
  const std::size_t top = comparable.empty() ? 0 : comparable.front()->sigla.size();
  const bool clear = comparable.size() >= 2 && comparable[1]->sigla.size() < top;
  cell.basis =
      comparable.size() < 2 ? Basis::kMajority : (clear ? Basis::kMajority : Basis::kUndetermined);
  if (!clear) return;
  for (std::size_t k = 1; k < comparable.size(); ++k) {
    comparable[k]->error = true;
    comparable[k]->why = "minority reading: " + std::to_string(comparable[k]->sigla.size()) +
                         " against " + std::to_string(top) + " for " + comparable.front()->text;
  }
}

void GroupReadings(std::vector<Reading>& flat, CollatedCell& cell) {
  for (auto& r : flat) {
    auto same = std::find_if(cell.readings.begin(), cell.readings.end(), [&](const Reading& g) {
      return g.kind == r.kind && g.text == r.text && g.error == r.error;
    });
    if (same == cell.readings.end()) {
      cell.readings.push_back(std::move(r));
    } else {
      same->sigla.push_back(r.sigla.front());
      if (same->editor.empty() && !r.editor.empty()) {  // the editor's word is the evidence shown
        same->editor = r.editor;
        same->decision = r.decision;
        same->why = r.why;
      }
    }
  }
  std::stable_sort(cell.readings.begin(), cell.readings.end(),
                   [](const Reading& a, const Reading& b) {
                     if (a.Comparable() != b.Comparable()) return a.Comparable();
                     return a.sigla.size() > b.sigla.size();
                   });
}

CollatedCell BuildCell(const Context& cx, int j, int c) {
  CollatedCell cell;
  cell.column = c;
  const auto& row = cx.out.rows[j];
  if (cx.options.reference) cell.computed = cx.options.reference->value(row.argument, c);
  std::vector<Reading> flat;
  bool any_caller = false, any_editor = false;
  for (std::size_t wi = 0; wi < cx.ws.size(); ++wi) {
    const auto& w = cx.ws[wi];
    const int src = row.source_row[wi];
    const Cell* cellp = nullptr;
    int own_col = -1;
    for (std::size_t k = 0; k < cx.column_map[wi].size(); ++k) {
      if (cx.column_map[wi][k] == c) own_col = static_cast<int>(k);
    }
    if (src >= 0 && own_col >= 0 && own_col < static_cast<int>(w.rows[src].cells.size())) {
      cellp = &w.rows[src].cells[own_col];
    }
    Reading r = MakeReading(cellp, w.witness.siglum);
    auto jt = cx.options.judgements.find(w.witness.siglum);
    if (cellp && r.Comparable() && jt != cx.options.judgements.end() &&
        src < static_cast<int>(jt->second.size()) &&
        own_col < static_cast<int>(jt->second[src].size()) && jt->second[src][own_col]) {
      JudgeByCaller(r, *jt->second[src][own_col]);
      any_caller = true;
      any_editor = any_editor || !r.editor.empty();
    } else if (r.Comparable() && cell.computed) {
      JudgeByReference(r, *cell.computed, cx.out.columns[c].places, cx.options.tolerance_units);
    }
    flat.push_back(std::move(r));
  }
  GroupReadings(flat, cell);
  if (any_editor)
    cell.basis = Basis::kEditor;
  else if (any_caller)
    cell.basis = Basis::kCaller;
  else if (cell.computed)
    cell.basis = Basis::kRecomputation;
  else
    JudgeByMajority(cell);
  return cell;
}

}  // namespace

Collation Collate(const std::vector<Transcription>& ws, const CollateOptions& options) {
  CheckInput(ws);
  Collation out;
  out.table_id = ws.front().table_id;
  out.table_title = ws.front().table_title;
  out.work = ws.front().work;
  out.argument = ws.front().argument;
  out.tolerance_units = options.tolerance_units;
  if (options.reference) out.reference_description = options.reference->description;
  for (const auto& w : ws) out.witnesses.push_back(w.witness);
  Context cx{ws, options, out, {}, {}};
  CollectColumns(cx);
  std::vector<const Transcription*> ptrs;
  for (const auto& w : ws) ptrs.push_back(&w);
  Align(cx, internal::InferGrid(ptrs));
  FindSlides(cx);
  for (std::size_t j = 0; j < out.rows.size(); ++j) {
    for (std::size_t c = 0; c < out.columns.size(); ++c) {
      out.rows[j].cells.push_back(BuildCell(cx, static_cast<int>(j), static_cast<int>(c)));
    }
  }
  return out;
}

}  // namespace apograph::collate
