// The texts of a tradition, copied down its tree: a copy starts from its
// exemplar (or two, when contaminated), a corrector checks entries against
// computation, then the copy's own slips; a digitised witness's
// transcription adds the recognition slips of its own.
#include <algorithm>
#include <cmath>
#include <numeric>

#include "table_build.hpp"
#include "tradition_build.hpp"

namespace apograph::synth::internal {
namespace {

const Node& At(const Tradition& t, int i) { return t.nodes[static_cast<std::size_t>(i)]; }

// Rows of `a` standing for archetype rows before `from`, then rows of `b`.
TableText Merge(const TableText& a, const TableText& b, int from) {
  TableText out = a;
  out.text.rows.clear();
  out.origin.clear();
  for (const TableText* part : {&a, &b}) {
    for (std::size_t i = 0; i < part->origin.size(); ++i) {
      if ((part == &a) != (part->origin[i] < from)) continue;
      out.text.rows.push_back(part->text.rows[i]);
      out.origin.push_back(part->origin[i]);
    }
  }
  return out;
}

std::vector<TableText> Exemplar(const Tradition& t, const Node& n) {
  std::vector<TableText> out = At(t, n.parent).text;
  if (!n.contamination) return out;
  const Contamination& c = *n.contamination;
  const auto& second = At(t, c.second).text;
  for (std::size_t k = 0; k < out.size(); ++k) {
    const int table = static_cast<int>(k);
    if (table > c.table || (table == c.table && c.between_tables)) out[k] = second[k];
    if (table == c.table && !c.between_tables) out[k] = Merge(out[k], second[k], c.row);
  }
  return out;
}

Cell ValueCell(const Sexagesimal& v, const Cell& like) {
  Cell cell = like;
  cell.raw = v.ToString();
  cell.value = v;
  cell.state = CellState::kRead;
  return cell;
}

// Off by more than one unit of the last place, or unreadable.
bool LooksWrong(const Cell& cell, const Sexagesimal& computed, int places) {
  if (cell.state != CellState::kRead || !cell.value) return true;
  return std::fabs((*cell.value - computed).ToDouble()) * std::pow(60.0, places) > 1.0 + 1e-9;
}

void Check(const AuthorTable& author, TableText& text, Node& n, Rng& rng) {
  const TableKey& key = author.key;
  for (std::size_t i = 0; i < text.text.rows.size(); ++i) {
    Row& row = text.text.rows[i];
    const auto o = static_cast<std::size_t>(text.origin[i]);
    const std::string arg = text.archetype_args[o];
    auto record = [&](const std::string& column, const std::string& before,
                      const std::string& after, bool author_value) {
      n.corrections.push_back(
          {key.id, static_cast<int>(o), arg, column, before, after, author_value});
    };
    if (row.argument.raw != arg && rng.Chance(n.correction_share)) {
      record("@argument", row.argument.raw, arg, true);
      row.argument = author.text.rows[o].argument;
    }
    for (std::size_t c = 0; c < row.cells.size(); ++c) {
      const ColumnKey& k = key.columns[c];
      if (k.role == ColumnKey::Role::kUnexplained ||
          !LooksWrong(row.cells[c], k.computed[o], k.places) || !rng.Chance(n.correction_share))
        continue;
      record(k.name, row.cells[c].raw, k.computed[o].ToString(),
             k.computed[o].Identical(k.tabulated[o]));
      row.cells[c] = ValueCell(k.computed[o], row.cells[c]);
    }
  }
}

// Every entry recomputed: model columns as computed (the author's
// departures gone), derived columns from the recomputed entries or from
// exact values; a column of no model kept as the exemplar has it.
TableText Recompute(const AuthorTable& author, const TableText& base, Node& n) {
  TableKey key = author.key;
  for (auto& c : key.columns) {
    if (c.role == ColumnKey::Role::kModel) c.tabulated = c.computed;
  }
  for (auto& c : key.columns) {
    if (c.role != ColumnKey::Role::kDerived) continue;
    c.derived->from_exact = n.derived_basis == "exact";
    ComputeDerived(c, key);
  }
  TableText out = FromAuthor(author);
  for (std::size_t o = 0; o < out.text.rows.size(); ++o) {
    const auto from_base = std::find(base.origin.begin(), base.origin.end(), static_cast<int>(o));
    for (std::size_t c = 0; c < key.columns.size(); ++c) {
      Cell& cell = out.text.rows[o].cells[c];
      if (key.columns[c].role == ColumnKey::Role::kUnexplained) {
        if (from_base != base.origin.end())
          cell = base.text.rows[static_cast<std::size_t>(from_base - base.origin.begin())].cells[c];
        continue;
      }
      cell = ValueCell(key.columns[c].tabulated[o], cell);
      const std::string before =
          from_base == base.origin.end()
              ? ""
              : base.text.rows[static_cast<std::size_t>(from_base - base.origin.begin())]
                    .cells[c]
                    .raw;
      if (before != cell.raw) {
        n.corrections.push_back({key.id, static_cast<int>(o), out.archetype_args[o],
                                 key.columns[c].name, before, cell.raw,
                                 cell.value->Identical(author.key.columns[c].tabulated[o])});
      }
    }
  }
  return out;
}

CopyOptions OptionsFor(const Tradition& t, const Node& n, const TraditionOptions& o) {
  CopyOptions c = o.copy;
  c.rate = n.rate;
  const bool reprint =
      n.kind == WitnessKind::kModernEdition && At(t, n.parent).kind == WitnessKind::kModernEdition;
  if (reprint && c.weights.empty()) {  // later editions differ by one-unit variants (judgement)
    c.weights = {{SlipClass::kLastPlace, 0.7},
                 {SlipClass::kLookAlike, 0.15},
                 {SlipClass::kTransposition, 0.15}};
  }
  return c;
}

void CopyNode(Tradition& t, int index, const TraditionOptions& o, Rng& rng) {
  Node& n = t.nodes[static_cast<std::size_t>(index)];
  std::vector<TableText> base = Exemplar(t, n);
  for (std::size_t k = 0; k < base.size(); ++k) {
    if (n.corrector == CorrectorMode::kRecompute) base[k] = Recompute(t.tables[k], base[k], n);
    if (n.corrector == CorrectorMode::kCheck) Check(t.tables[k], base[k], n, rng);
  }
  const CopyOptions copy = OptionsFor(t, n, o);
  n.text.clear();
  for (const auto& b : base) n.text.push_back(CopyTable(b, n.hand, copy, rng, n.slips));
  if (!n.surviving) return;
  n.transcribed = n.text;
  if (!n.digitised) return;
  CopyOptions rec = o.copy;
  rec.weights.clear();
  rec.rate = rng.Uniform(o.recognition_rate_min, o.recognition_rate_max);
  for (auto& table : n.transcribed)
    table = CopyTable(table, {HandKind::kDigitised, Script::kPrinted}, rec, rng, n.recognition);
}

}  // namespace

void CopyTexts(Tradition& t, const TraditionOptions& o, Rng& rng) {
  std::vector<int> order(t.nodes.size());
  std::iota(order.begin(), order.end(), 0);
  std::stable_sort(order.begin(), order.end(),
                   [&](int a, int b) { return At(t, a).date.year < At(t, b).date.year; });
  Node& root = t.nodes[0];
  root.text.clear();
  for (const auto& table : t.tables) root.text.push_back(FromAuthor(table));
  for (int i : order) {
    if (i != 0) CopyNode(t, i, o, rng);
  }
}

}  // namespace apograph::synth::internal

namespace apograph::synth {

std::vector<Transcription> Tradition::WitnessTables(int index) const {
  const Node& n = nodes[static_cast<std::size_t>(index)];
  std::vector<Transcription> out;
  for (const auto& table : n.surviving ? n.transcribed : n.text) {
    Transcription t = table.text;
    t.work = work;
    t.witness = {n.name,
                 n.library,
                 n.shelfmark,
                 n.date.text,
                 ApographScriptName(n.hand.script),
                 "",
                 WitnessKindName(n.kind)};
    if (n.kind == WitnessKind::kModernEdition) t.witness.note = "modern edition (invented)";
    if (n.digitised)
      t.witness.note +=
          std::string(t.witness.note.empty() ? "" : "; ") + "transcribed by text recognition";
    t.hand = n.kind == WitnessKind::kManuscript ? "main hand" : "";
    out.push_back(std::move(t));
  }
  return out;
}

}  // namespace apograph::synth
