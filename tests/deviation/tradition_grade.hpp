#pragma once
// Grades the deviation stage on a tradition drawn by the shared generator
// (tests/synth): every table's references identified automatically from the
// witnesses (pipeline::ResolveReferences with `automatic`, as `--auto`
// does), every witness explained with the tradition's view
// (pipeline::ExplainTradition), and each cell's findings compared with the
// answer key (the author's reading, the slips that made the witness's one).
// The generator's confusions are its own (tests/synth/numerals.cpp), not the
// lists the explainer reads. Used by tests/bench/deviation_bench.cpp and by
// the tests that assert rates over a few seeds.
#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <map>
#include <optional>
#include <set>
#include <string>
#include <vector>

#include "deviation/explain.hpp"
#include "pipeline/reference.hpp"
#include "pipeline/witness_findings.hpp"
#include "support/input_error.hpp"
#include "synth/tradition.hpp"

namespace apograph::testing {

/// Counts of one group of cells (a script, a slip class, or all).
struct GradeCounts {
  long erroneous = 0;    ///< cells whose reading is not the author's, by a keyed slip
  long caught = 0;       ///< of them, flagged (a copying slip proposed or unexplained)
  long right_class = 0;  ///< of those, with the class the slip calls for
  long restored = 0;     ///< of those, with the author's reading as the emendation
  long flagged = 0;      ///< every flagged cell (precision = caught / flagged)
  /// Of the caught, with the class the slip calls for as the best's or as one
  /// the finding names undecided beside it (Finding::Undecided).
  long right_either = 0;

  void Add(const GradeCounts& o) {
    erroneous += o.erroneous;
    caught += o.caught;
    right_class += o.right_class;
    restored += o.restored;
    flagged += o.flagged;
    right_either += o.right_either;
  }
};

struct Grade {
  GradeCounts all;
  std::map<std::string, GradeCounts> by_script;  ///< the witness's script (as apograph reads it)
  std::map<std::string, GradeCounts> by_class;   ///< the generator's slip class
  long departures = 0, departures_kept = 0;      ///< author's departures read by a witness
  long unkeyed = 0;     ///< cells off the author's reading with no keyed slip (recomputed...)
  long misaligned = 0;  ///< rows whose argument in use is not the archetype's (not graded)
  long right_columns = 0, right_refused = 0;  ///< witness columns with a right reference
  long wrong_columns = 0, wrong_refused = 0;  ///< witness columns with a wrong reference
  long wrong_emendations = 0;                 ///< emendations proposed against a wrong reference
  long wrong_false = 0;  ///< of them, not the author's reading (false findings)
  /// Of the false ones, on an entry that reads the author's value (a right
  /// entry changed); the rest are slips given another reading or none.
  long wrong_false_right = 0;
  /// Of those restoring the author's reading, the ones the other witnesses
  /// (modern editions left out) read too, more than half of those reading
  /// the row: evidence that does not hang on the reference. The rest restore
  /// it on the model's word alone.
  long wrong_by_witnesses = 0;
  long unreferenced = 0;  ///< table columns without a reference
  /// With `debug` set before grading: one line per slip missed, misnamed or
  /// wrongly emended, and per false flag.
  bool debug = false;
  std::vector<std::string> notes;

  void Add(const Grade& o) {
    notes.insert(notes.end(), o.notes.begin(), o.notes.end());
    all.Add(o.all);
    for (const auto& [k, v] : o.by_script) by_script[k].Add(v);
    for (const auto& [k, v] : o.by_class) by_class[k].Add(v);
    departures += o.departures;
    departures_kept += o.departures_kept;
    unkeyed += o.unkeyed;
    misaligned += o.misaligned;
    right_columns += o.right_columns;
    right_refused += o.right_refused;
    wrong_columns += o.wrong_columns;
    wrong_refused += o.wrong_refused;
    wrong_emendations += o.wrong_emendations;
    wrong_false += o.wrong_false;
    wrong_false_right += o.wrong_false_right;
    wrong_by_witnesses += o.wrong_by_witnesses;
    unreferenced += o.unreferenced;
  }
};

namespace grade_internal {

inline Sexagesimal At(const Sexagesimal& v, int places) {
  return v.places() <= places ? v.Extended(places) : v.Rounded(places);
}

/// The generator's class of a slip as graded ("place-dropped (run)" for a
/// systematic one) and the apograph classes that name it rightly.
inline std::string ClassName(const synth::Slip& s) {
  std::string name = synth::SlipName(s.slip);
  if (s.detail.rfind("systematic:", 0) == 0) name += " (run)";
  return name;
}

/// `visible`: cells of the slip's run this witness shows (an eye-skip seen in
/// one cell only is one entry taken from its neighbour: a repetition too; a
/// constant error seen in one cell only, a confusion too).
inline std::set<std::string> Expected(const synth::Slip& s, int visible) {
  using K = synth::SlipClass;
  const bool run = s.detail.rfind("systematic:", 0) == 0;
  switch (s.slip) {
    case K::kLookAlike:
    case K::kOtherSymbol:
    case K::kLastPlace:
      return {"confusion"};
    case K::kTransposition:
      return {"transposition"};
    case K::kPlaceDropped:
    case K::kPlaceAdded:
    case K::kPlaceShifted:
      return {run ? "systematic" : "place"};
    case K::kRepetition:
      return {"repetition"};
    case K::kEyeSkip:
      if (visible == 1) return {"displaced-run", "repetition"};
      return {"displaced-run"};
    case K::kConstantRun:
      // Seen in one cell only, a constant error is one entry a unit off in
      // one place: a slip of one symbol too (as an eye-skip seen once is a
      // repetition); nothing in the copy shows the run.
      if (visible == 1) return {"systematic", "confusion"};
      return {"systematic"};
    case K::kBlank:
      return {"blank"};
    case K::kIllegible:
    case K::kPartlyIllegible:
      return {"illegible"};
    default:
      return {};
  }
}

/// Slips by (table, archetype row, column), in the order they were made,
/// and the node (copy) that made each: run ids are numbered per copy, so a
/// run is one copy's run id.
struct SlipIndex {
  std::map<std::tuple<std::string, int, std::string>, std::vector<const synth::Slip*>> cells;
  std::map<const synth::Slip*, std::size_t> node;
  /// The run a slip belongs to: (the copy that made it, its run id).
  std::pair<std::size_t, int> Run(const synth::Slip& s) const { return {node.at(&s), s.run}; }
};

inline SlipIndex IndexSlips(const synth::Tradition& t) {
  SlipIndex out;
  for (std::size_t i = 0; i < t.nodes.size(); ++i) {
    for (const auto* list : {&t.nodes[i].slips, &t.nodes[i].recognition}) {
      for (const auto& s : *list) {
        out.cells[{s.table, s.origin_row, s.column}].push_back(&s);
        out.node[&s] = i;
      }
    }
  }
  return out;
}

/// The slip that left the witness's reading: the last one made at the cell
/// whose reading after it is the witness's.
inline const synth::Slip* SlipFor(const SlipIndex& index, const std::string& table, int origin,
                                  const std::string& column, const Cell& cell) {
  auto it = index.cells.find({table, origin, column});
  if (it == index.cells.end()) return nullptr;
  const synth::Slip* found = nullptr;
  for (const auto* s : it->second) {
    bool same = s->after == cell.raw;
    if (!same && cell.value) {
      const auto v = Sexagesimal::Parse(s->after);
      same = v && *v == *cell.value;
    }
    if (!same && cell.state != CellState::kRead) {
      same = (s->slip == synth::SlipClass::kBlank && cell.state == CellState::kBlank) ||
             (s->slip == synth::SlipClass::kIllegible && cell.state == CellState::kIllegible) ||
             (s->slip == synth::SlipClass::kPartlyIllegible && cell.state == CellState::kPartial);
    }
    if (same) found = s;
  }
  return found;
}

/// What the findings of one witness column say about each row.
struct Flag {
  std::string cls;
  std::optional<Sexagesimal> emendation;
  std::set<std::string> undecided;  ///< classes named undecided beside `cls`
};

inline std::string NoteOf(const pipeline::WitnessFindings& w, int column, std::size_t row) {
  for (const auto& f : w.findings) {
    if (f.column != column) continue;
    for (const auto& c : f.cells) {
      if (c.row == row) return f.Note(w.siglum);
    }
  }
  return "(no finding)";
}

inline std::map<std::size_t, Flag> Flags(const pipeline::WitnessFindings& w, int column) {
  std::map<std::size_t, Flag> out;
  for (const auto& f : w.findings) {
    if (f.column != column || !deviation::IsCopyingSlip(f.best().cls)) continue;
    for (const auto& c : f.cells) {
      if (c.value && c.emendation && c.emendation->Identical(At(*c.value, f.places))) continue;
      std::set<std::string> undecided;
      for (auto u : f.Undecided()) undecided.insert(deviation::ToString(u));
      out[c.row] = {deviation::ToString(f.best().cls), c.emendation, undecided};
    }
  }
  return out;
}

/// A reference is wrong for a column when it misses the author's computed
/// values by more than one unit at more than 5% of the rows.
inline bool WrongReference(const pipeline::ColumnReference& ref, const synth::AuthorTable& author,
                           const synth::ColumnKey& key) {
  if (key.role == synth::ColumnKey::Role::kUnexplained) return true;
  auto r = ref;
  r.column = author.text.ColumnIndex(key.name);
  if (r.column < 0) return true;
  const auto re = r.Recompute(author.text);
  int off = 0, n = 0;
  for (std::size_t i = 0; i < key.computed.size() && i < re.computed.size(); ++i) {
    ++n;
    off += !re.computed[i] ||
           std::fabs(DiffUnits(*re.computed[i], key.computed[i], key.places)) > 1 + 1e-9;
  }
  return n == 0 || off > 0.05 * n;
}

struct Witness {
  const synth::Node* node = nullptr;
  const synth::TableText* text = nullptr;
  Transcription table;
};

inline std::vector<Witness> Witnesses(const synth::Tradition& t, std::size_t ti) {
  std::vector<Witness> out;
  for (int i : t.Surviving()) {
    const auto& node = t.nodes[static_cast<std::size_t>(i)];
    auto tables = t.WitnessTables(i);
    if (ti >= tables.size() || ti >= node.transcribed.size()) continue;
    Witness w{&node, &node.transcribed[ti], tables[ti]};
    w.table.witness.kind = synth::WitnessKindName(node.kind);  // what the editor declares
    out.push_back(std::move(w));
  }
  return out;
}

inline std::string ScriptOf(const Transcription& t) { return deviation::ScriptNameFor(t.witness); }

/// Grades one witness column against a right reference.
inline void GradeColumn(const Witness& w, const pipeline::WitnessFindings& found,
                        const synth::AuthorTable& author, const synth::ColumnKey& key,
                        const SlipIndex& index, Grade& g) {
  const int column = w.table.ColumnIndex(key.name);
  const auto flags = Flags(found, column);
  // A run (one copy's run id; ids are per copy, so an ancestor's run 0 and
  // this copy's are two runs) -> cells of this column that show it.
  std::map<std::pair<std::size_t, int>, int> visible;
  for (std::size_t r = 0; r < w.table.rows.size() && r < w.text->origin.size(); ++r) {
    const Cell& cell = w.table.rows[r].cells[static_cast<std::size_t>(column)];
    if (const auto* s = SlipFor(index, author.key.id, w.text->origin[r], key.name, cell))
      ++visible[index.Run(*s)];
  }
  std::set<int> seen;
  GradeCounts& script = g.by_script[ScriptOf(w.table)];
  for (std::size_t r = 0; r < w.table.rows.size() && r < w.text->origin.size(); ++r) {
    const int origin = w.text->origin[r];
    const auto arg = w.table.ArgumentInUse(r);
    if (origin < 0 || !seen.insert(origin).second || !arg ||
        !(*arg == author.key.argument.values[static_cast<std::size_t>(origin)])) {
      ++g.misaligned;
      continue;
    }
    const Cell& cell = w.table.rows[r].cells[static_cast<std::size_t>(column)];
    const Sexagesimal want = At(key.tabulated[static_cast<std::size_t>(origin)], key.places);
    const bool right =
        cell.state == CellState::kRead && cell.value && At(*cell.value, key.places) == want;
    const auto flag = flags.find(r);
    const bool flagged = flag != flags.end();
    const bool departed = !(want == At(key.computed[static_cast<std::size_t>(origin)], key.places));
    if (right && flagged && g.debug) {
      g.notes.push_back("FALSE FLAG " + author.key.id + " " + key.name + " want " +
                        want.ToString() + (departed ? " (author's departure)" : "") + " (" +
                        ScriptOf(w.table) + ") | " + NoteOf(found, column, r));
    }
    if (right) {
      if (departed) {
        ++g.departures;
        g.departures_kept += !flagged;
      }
      g.all.flagged += flagged;
      script.flagged += flagged;
      continue;
    }
    const synth::Slip* slip = SlipFor(index, author.key.id, origin, key.name, cell);
    if (g.debug && !slip) {
      g.notes.push_back(std::string("UNKEYED ") + author.key.id + " " + key.name + " want " +
                        want.ToString() + " | " + NoteOf(found, column, r));
    }
    if (!slip) {  // recomputed or corrected, or slips stacked past recognition
      ++g.unkeyed;
      g.all.flagged += flagged;
      script.flagged += flagged;
      continue;
    }
    GradeCounts one;
    one.erroneous = 1;
    one.flagged = flagged;
    one.caught = flagged;
    if (flagged) {
      const auto expected = Expected(*slip, visible[index.Run(*slip)]);
      one.right_class = expected.count(flag->second.cls) > 0;
      one.right_either = one.right_class;
      for (const auto& u : flag->second.undecided) one.right_either |= expected.count(u) > 0;
      one.restored = flag->second.emendation && At(*flag->second.emendation, key.places) == want;
    }
    if (g.debug && (!one.caught || !one.right_class || !one.restored)) {
      g.notes.push_back(std::string(!one.caught        ? "MISSED "
                                    : !one.right_class ? "CLASS "
                                                       : "EMEND ") +
                        ClassName(*slip) + " [" + slip->detail + "] " + slip->pair + " " +
                        slip->before + " -> " + slip->after + " want " + want.ToString() + " (" +
                        ScriptOf(w.table) + ") {vis " + std::to_string(visible[index.Run(*slip)]) +
                        " run " + std::to_string(slip->run) + " row " + std::to_string(r) +
                        " wit " + w.node->name + " col " + key.name + "} | " +
                        NoteOf(found, column, r));
    }
    g.all.Add(one);
    script.Add(one);
    one.flagged = 0;  // precision is not per class (a false flag has no class)
    g.by_class[ClassName(*slip)].Add(one);
  }
}

/// What an emendation against a wrong reference did.
enum class WrongKind {
  kByWitnesses,   ///< the author's reading, read by most other witnesses
  kByModel,       ///< the author's reading, the other witnesses not agreeing on it
  kRightChanged,  ///< not the author's reading, on an entry that read it
  kSlipMissed,    ///< not the author's reading (or none), on an entry off it
};

/// The reading most of the other witnesses (modern editions left out) have
/// at archetype row `origin`, at `places`, when more than half agree.
inline std::optional<Sexagesimal> OthersReading(const std::vector<Witness>& ws, std::size_t self,
                                                const synth::ColumnKey& key, int origin) {
  std::map<std::string, std::pair<int, Sexagesimal>> tally;
  int readers = 0;
  for (std::size_t j = 0; j < ws.size(); ++j) {
    if (j == self || ws[j].node->kind == synth::WitnessKind::kModernEdition) continue;
    const int column = ws[j].table.ColumnIndex(key.name);
    const auto& origins = ws[j].text->origin;
    const auto it = std::find(origins.begin(), origins.end(), origin);
    if (column < 0 || it == origins.end()) continue;
    const auto row = static_cast<std::size_t>(it - origins.begin());
    if (row >= ws[j].table.rows.size()) continue;
    const Cell& cell = ws[j].table.rows[row].cells[static_cast<std::size_t>(column)];
    if (cell.state != CellState::kRead || !cell.value) continue;
    ++readers;
    const Sexagesimal v = At(*cell.value, key.places);
    ++tally.try_emplace(v.ToString(), 0, v).first->second.first;
  }
  for (const auto& [text, entry] : tally) {
    if (2 * entry.first > readers) return entry.second;
  }
  return std::nullopt;
}

/// Sorts one emendation proposed against a wrong reference.
inline WrongKind KindOf(const std::vector<Witness>& ws, std::size_t i, const synth::ColumnKey& key,
                        std::size_t row, const Flag& flag) {
  const Witness& w = ws[i];
  const int origin = row < w.text->origin.size() ? w.text->origin[row] : -1;
  if (origin < 0) return WrongKind::kSlipMissed;
  const Sexagesimal want = At(key.tabulated[static_cast<std::size_t>(origin)], key.places);
  if (flag.emendation && At(*flag.emendation, key.places) == want) {
    const auto others = OthersReading(ws, i, key, origin);
    return others && *others == want ? WrongKind::kByWitnesses : WrongKind::kByModel;
  }
  const Cell& cell =
      w.table.rows[row].cells[static_cast<std::size_t>(w.table.ColumnIndex(key.name))];
  const bool right =
      cell.state == CellState::kRead && cell.value && At(*cell.value, key.places) == want;
  return right ? WrongKind::kRightChanged : WrongKind::kSlipMissed;
}

/// With BENCH_DUMP: rows row-3..row+3 of witness `i`, each with the author's
/// tabulated and computed values, the reference's value for this witness
/// and every witness's reading of the same archetype row.
inline std::vector<std::string> ContextLines(const std::vector<Witness>& ws, std::size_t i,
                                             const synth::ColumnKey& key, std::size_t row,
                                             const pipeline::ColumnReference& ref) {
  const Witness& w = ws[i];
  auto r = ref;
  r.column = w.table.ColumnIndex(key.name);
  const auto re = r.Recompute(w.table);
  std::vector<std::string> out;
  for (std::size_t j = row >= 3 ? row - 3 : 0; j <= row + 3 && j < w.table.rows.size(); ++j) {
    const int oj = j < w.text->origin.size() ? w.text->origin[j] : -1;
    std::string line = "    ctx row " + std::to_string(j) + (j == row ? "*" : " ");
    if (oj >= 0) {
      const auto o = static_cast<std::size_t>(oj);
      line += " author " + At(key.tabulated[o], key.places).ToString() + " comp " +
              At(key.computed[o], key.places).ToString();
    }
    if (j < re.computed.size() && re.computed[j])
      line += " model " + At(*re.computed[j], key.places).ToString();
    line += " |";
    for (const auto& other : ws) {
      const int column = other.table.ColumnIndex(key.name);
      const auto& origins = other.text->origin;
      const auto it = std::find(origins.begin(), origins.end(), oj);
      if (column < 0 || oj < 0 || it == origins.end()) continue;
      const auto at = static_cast<std::size_t>(it - origins.begin());
      const Cell& cell = other.table.rows[at].cells[static_cast<std::size_t>(column)];
      line += " " + other.node->name + "=" +
              (cell.value ? At(*cell.value, key.places).ToString() : cell.raw);
    }
    out.push_back(std::move(line));
  }
  return out;
}

/// Counts the emendations of witness `i` on a column with a wrong reference
/// into `g`; with debug, one line per emendation.
inline void GradeWrongColumn(const std::vector<Witness>& ws, std::size_t i,
                             const pipeline::WitnessFindings& found, const std::string& table,
                             const synth::ColumnKey& key, Grade& g,
                             const pipeline::ColumnReference* ref = nullptr) {
  const Witness& w = ws[i];
  const int column = w.table.ColumnIndex(key.name);
  for (const auto& [row, flag] : Flags(found, column)) {
    const WrongKind kind = KindOf(ws, i, key, row, flag);
    ++g.wrong_emendations;
    g.wrong_by_witnesses += kind == WrongKind::kByWitnesses;
    g.wrong_false += kind == WrongKind::kRightChanged || kind == WrongKind::kSlipMissed;
    g.wrong_false_right += kind == WrongKind::kRightChanged;
    const int origin = row < w.text->origin.size() ? w.text->origin[row] : -1;
    if (!g.debug || origin < 0) continue;
    const auto o = static_cast<std::size_t>(origin);
    static const char* const kTag[] = {"WRONG-REF-OK witnesses ", "WRONG-REF-OK model ",
                                       "WRONG-REF-FALSE right-changed ",
                                       "WRONG-REF-FALSE slip-missed "};
    g.notes.push_back(std::string(kTag[static_cast<int>(kind)]) + table + " " + key.name + " " +
                      w.node->name + " row " + std::to_string(row) + " want " +
                      At(key.tabulated[o], key.places).ToString() + " computed " +
                      At(key.computed[o], key.places).ToString() + " (" + ScriptOf(w.table) +
                      ") | " + NoteOf(found, column, row));
    if (ref && (kind == WrongKind::kRightChanged || kind == WrongKind::kSlipMissed) &&
        std::getenv("BENCH_DUMP")) {
      for (auto& line : ContextLines(ws, i, key, row, *ref)) g.notes.push_back(std::move(line));
    }
  }
}

}  // namespace grade_internal

/// Grades every table of `t` with references identified automatically.
inline Grade GradeTradition(const synth::Tradition& t, const std::string& scripts_dir,
                            bool debug = false) {
  using namespace grade_internal;
  Grade g;
  g.debug = debug;
  const SlipIndex index = IndexSlips(t);
  for (std::size_t ti = 0; ti < t.tables.size(); ++ti) {
    const auto& author = t.tables[ti];
    const auto ws = Witnesses(t, ti);
    std::vector<Transcription> tables;
    for (const auto& w : ws) tables.push_back(w.table);
    pipeline::ReferenceRequest request;
    request.automatic = true;
    std::vector<pipeline::ColumnReference> refs;
    try {
      refs = pipeline::ResolveReferences(tables, request);
    } catch (const InputError&) {
      // nothing identified: every column unreferenced
    }
    const auto found = pipeline::ExplainTradition(tables, refs, scripts_dir);
    for (const auto& key : author.key.columns) {
      auto ref = std::find_if(refs.begin(), refs.end(), [&](const pipeline::ColumnReference& r) {
        return r.column_name == key.name;
      });
      if (ref == refs.end()) {
        ++g.unreferenced;
        continue;
      }
      const bool wrong = WrongReference(*ref, author, key);
      for (std::size_t i = 0; i < ws.size(); ++i) {
        const int column = ws[i].table.ColumnIndex(key.name);
        if (column < 0) continue;
        const bool refused = found[i].Refused(key.name);
        if (wrong) {
          ++g.wrong_columns;
          g.wrong_refused += refused;
          GradeWrongColumn(ws, i, found[i], author.key.id, key, g, &*ref);
          continue;
        }
        ++g.right_columns;
        g.right_refused += refused;
        if (debug && refused)
          g.notes.push_back("RIGHT-REFUSED " + author.key.id + " " + key.name + " " +
                            ws[i].node->name + " | " + found[i].VerdictOf(key.name)->verdict.why);
        GradeColumn(ws[i], found[i], author, key, index, g);
      }
    }
  }
  return g;
}

/// The first table's first column explained against a reference made wrong on
/// purpose (`how`: 0 its first parameter 10% off, 1 another model at its
/// default parameters): counts the witness columns refused and the
/// emendations proposed.
inline Grade GradeWrongReference(const synth::Tradition& t, const std::string& scripts_dir,
                                 int how) {
  using namespace grade_internal;
  Grade g;
  const auto ws = Witnesses(t, 0);
  std::vector<Transcription> tables;
  for (const auto& w : ws) tables.push_back(w.table);
  const auto& key = t.tables[0].key.columns.at(0);
  pipeline::ReferenceRequest request;
  request.automatic = true;
  request.columns = {key.name};
  std::vector<pipeline::ColumnReference> refs;
  try {
    refs = pipeline::ResolveReferences(tables, request);
  } catch (const InputError&) {
    return g;
  }
  if (refs.empty()) return g;
  auto& ref = refs.front();
  if (how == 0) {
    if (ref.params.empty() || ref.params.front() == 0) return g;
    ref.params.front() *= 1.1;
  } else {
    const std::string other = ref.model->name() == "sine" ? "chord" : "sine";
    pipeline::ReferenceRequest given;
    given.model = other;
    given.columns = {key.name};
    refs = pipeline::ResolveReferences(tables, given);
  }
  if (!WrongReference(refs.front(), t.tables[0], key)) return g;
  const auto found = pipeline::ExplainTradition(tables, refs, scripts_dir);
  for (std::size_t i = 0; i < ws.size(); ++i) {
    const int column = ws[i].table.ColumnIndex(key.name);
    if (column < 0) continue;
    ++g.wrong_columns;
    g.wrong_refused += found[i].Refused(key.name);
    GradeWrongColumn(ws, i, found[i], t.tables[0].key.id, key, g);
  }
  return g;
}

}  // namespace apograph::testing
