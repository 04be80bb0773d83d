#include "publish/apparatus.hpp"

#include <algorithm>
#include <cctype>

#include "publish/apparatus_words.hpp"
#include "support/input_error.hpp"

namespace apograph::publish {
namespace {

using collate::Reading;

bool Carries(const Reading& r, const std::string& siglum) {
  return std::find(r.sigla.begin(), r.sigla.end(), siglum) != r.sigla.end();
}

// Votes of the independent branches for each comparable reading.
std::vector<int> BranchVotes(const collate::CollatedCell& cell,
                             const std::vector<std::vector<std::string>>& branches) {
  std::vector<int> votes(cell.readings.size(), 0);
  for (const auto& branch : branches) {
    int best = -1, best_n = 0;
    bool tie = false;
    for (std::size_t k = 0; k < cell.readings.size(); ++k) {
      if (!cell.readings[k].Comparable()) continue;
      int n = 0;
      for (const auto& s : branch) n += Carries(cell.readings[k], s) ? 1 : 0;
      if (n > best_n)
        best = static_cast<int>(k), best_n = n, tie = false;
      else if (n == best_n && n > 0)
        tie = true;
    }
    if (best >= 0 && !tie) ++votes[best];
  }
  return votes;
}

int DefaultLemma(const collate::CollatedCell& cell, const std::vector<int>& votes) {
  int best = -1;
  auto better = [&](std::size_t a, std::size_t b) {  // is reading a better than b?
    const auto &ra = cell.readings[a], &rb = cell.readings[b];
    if (ra.error != rb.error) return !ra.error;
    if (votes[a] != votes[b]) return votes[a] > votes[b];
    return ra.sigla.size() > rb.sigla.size();
  };
  for (std::size_t k = 0; k < cell.readings.size(); ++k) {
    if (!cell.readings[k].Comparable()) continue;
    if (best < 0 || better(k, static_cast<std::size_t>(best))) best = static_cast<int>(k);
  }
  return best;
}

std::string Canonical(const std::string& text) {
  auto v = Sexagesimal::Parse(text);
  return v ? v->ToString() : text;
}

int FindReading(const collate::CollatedCell& cell, const std::string& text) {
  for (std::size_t k = 0; k < cell.readings.size(); ++k) {
    const auto& r = cell.readings[k];
    if (r.kind == collate::ReadingKind::kValue && r.text == text) return static_cast<int>(k);
  }
  return -1;
}

/// A reading the editor accepted as an emendation of a witness's cell.
const Reading* AcceptedEmendation(const collate::CollatedCell& cell) {
  for (const auto& r : cell.readings) {
    if (!r.editor.empty() && r.error && r.emendation) return &r;
  }
  return nullptr;
}

/// What the explanations restore where every witness errs: their proposed
/// reading when they agree, else the recomputed value.
std::optional<Sexagesimal> Restoration(const collate::CollatedCell& cell) {
  std::optional<Sexagesimal> agreed;
  for (const auto& r : cell.readings) {
    if (!r.Comparable() || !r.emendation) continue;
    if (agreed && !agreed->Identical(*r.emendation)) return cell.computed;
    agreed = r.emendation;
  }
  return agreed ? agreed : cell.computed;
}

struct CellInput {
  const collate::Collation& collation;
  const collate::CollatedCell& cell;
  const std::vector<std::vector<std::string>>& branches;
  const Override* override;
};

/// The lemma from the editor's override or conjecture; returns the reading chosen (-1: none).
int FromOverride(const CellInput& in, ApparatusEntry& e) {
  const Override& o = *in.override;
  e.lemma = Canonical(o.reading);
  e.resp = o.editor;
  const int chosen = FindReading(in.cell, e.lemma);
  e.source = o.conjecture ? LemmaSource::kConjecture
                          : (chosen >= 0 ? LemmaSource::kEditor : LemmaSource::kEmendation);
  e.reason = internal::EditorReason(e.source, o.editor, o.note);
  return chosen;
}

int FromAccepted(const CellInput& in, const Reading& accepted, ApparatusEntry& e) {
  e.lemma = accepted.emendation->ToString();
  e.resp = accepted.editor;
  const int chosen = FindReading(in.cell, e.lemma);
  e.source = chosen >= 0 ? LemmaSource::kWitnesses : LemmaSource::kEmendation;
  e.reason = internal::AcceptedReason(accepted, chosen >= 0);
  return chosen;
}

int FromWitnesses(const CellInput& in, ApparatusEntry& e) {
  const auto& cell = in.cell;
  const auto votes = BranchVotes(cell, in.branches);
  const int best = DefaultLemma(cell, votes);
  if (best >= 0 && !cell.readings[static_cast<std::size_t>(best)].error) {
    e.reason = internal::RightReason(cell, votes, best);
    return best;
  }
  const auto restored = Restoration(cell);
  if (best >= 0 && (!restored || FindReading(cell, restored->ToString()) >= 0)) {
    e.reason = internal::DeviatesReason(in.collation, cell, false);
    return best;
  }
  if (best >= 0) {
    e.lemma = restored->ToString();
    e.source = LemmaSource::kRestored;
    e.reason = internal::DeviatesReason(in.collation, cell, true);
  } else if (cell.computed) {
    e.lemma = cell.computed->ToString();
    e.source = LemmaSource::kSupplied;
    e.reason = "no witness can be read here: supplied by recomputation";
  } else {
    e.source = LemmaSource::kNone;
    e.reason = "no witness can be read here";
  }
  return -1;
}

ApparatusEntry Entry(const CellInput& in) {
  ApparatusEntry e;
  const Reading* accepted = AcceptedEmendation(in.cell);
  const int chosen = in.override ? FromOverride(in, e)
                     : accepted  ? FromAccepted(in, *accepted, e)
                                 : FromWitnesses(in, e);
  if (chosen >= 0) {
    const Reading& r = in.cell.readings[static_cast<std::size_t>(chosen)];
    e.lemma = r.text;
    e.lemma_sigla = r.sigla;
    e.lemma_kind = r.kind;
    e.lemma_error = r.error && e.source == LemmaSource::kWitnesses;
  }
  for (std::size_t k = 0; k < in.cell.readings.size(); ++k) {
    if (static_cast<int>(k) == chosen) continue;
    const Reading& r = in.cell.readings[k];
    e.variants.push_back(
        {r.text, r.sigla, r.kind, r.error, r.cause, internal::VariantWhy(r), r.editor});
  }
  return e;
}

const Override* FindOverride(const std::vector<Override>& os, const Sexagesimal& arg,
                             const std::string& column) {
  const Override* found = nullptr;
  for (const auto& o : os) {
    auto v = Sexagesimal::Parse(o.row);
    if (v && *v == arg && o.column == column) found = &o;
  }
  return found;
}

void CheckOverrides(const collate::Collation& c, const std::vector<Override>& os) {
  for (const auto& o : os) {
    auto v = Sexagesimal::Parse(o.row);
    const bool row_ok =
        v && std::any_of(c.rows.begin(), c.rows.end(), [&](auto& r) { return r.argument == *v; });
    if (!row_ok) {
      throw InputError::ForOption(
          "--override",
          ExpectedFound("the argument of a row of table " + c.table_id, "'" + o.row + "'"));
    }
    const bool col_ok = std::any_of(c.columns.begin(), c.columns.end(),
                                    [&](auto& k) { return k.name == o.column; });
    if (!col_ok) {
      throw InputError::ForOption(
          "--override", ExpectedFound("a column of table " + c.table_id, "'" + o.column + "'"));
    }
  }
}

/// The witness's cell behind a collated cell, or nullptr.
const Cell* SourceCell(const collate::Collation& c, const std::vector<Transcription>& ts,
                       std::size_t row, std::size_t wi, const std::string& column) {
  const int src = c.rows[row].source_row[wi];
  if (src < 0 || wi >= ts.size()) return nullptr;
  const int col = ts[wi].ColumnIndex(column);
  if (col < 0) return nullptr;
  return &ts[wi].rows[static_cast<std::size_t>(src)].cells[static_cast<std::size_t>(col)];
}

void AddMarks(const collate::Collation& c, const std::vector<Transcription>& ts, std::size_t row,
              std::size_t column, ApparatusEntry& e) {
  for (std::size_t wi = 0; wi < c.witnesses.size(); ++wi) {
    const Cell* cell = SourceCell(c, ts, row, wi, c.columns[column].name);
    if (cell) internal::AppendMarks(c.witnesses[wi].siglum, *cell, e.marks);
  }
}

std::vector<ArgumentVariant> ArgumentVariants(const collate::Collation& c,
                                              const std::vector<Transcription>& ts,
                                              std::size_t row) {
  std::vector<ArgumentVariant> out;
  for (std::size_t wi = 0; wi < c.witnesses.size() && wi < ts.size(); ++wi) {
    const int src = c.rows[row].source_row[wi];
    if (src < 0) continue;
    const Cell& written = ts[wi].rows[static_cast<std::size_t>(src)].argument;
    if (written.value && *written.value == c.rows[row].argument) continue;
    const std::string text = written.raw.empty() ? "blank" : written.raw;
    auto it = std::find_if(out.begin(), out.end(), [&](auto& v) { return v.text == text; });
    if (it == out.end()) it = out.insert(out.end(), {text, {}});
    it->sigla.push_back(c.witnesses[wi].siglum);
  }
  return out;
}

/// The transcriptions in the collation's witness order (marks need them).
std::vector<Transcription> InWitnessOrder(const collate::Collation& c,
                                          const std::vector<Transcription>* given) {
  std::vector<Transcription> out;
  if (!given) return out;
  for (const auto& w : c.witnesses) {
    auto it = std::find_if(given->begin(), given->end(),
                           [&](const Transcription& t) { return t.witness.siglum == w.siglum; });
    if (it == given->end()) return {};
    out.push_back(*it);
  }
  return out;
}

}  // namespace

const char* ToString(LemmaSource source) {
  switch (source) {
    case LemmaSource::kWitnesses:
      return "witnesses";
    case LemmaSource::kEditor:
      return "editor";
    case LemmaSource::kEmendation:
      return "emendation";
    case LemmaSource::kConjecture:
      return "conjecture";
    case LemmaSource::kRestored:
      return "restored";
    case LemmaSource::kSupplied:
      return "supplied";
    case LemmaSource::kNone:
      return "none";
  }
  return "none";
}

bool ApparatusEntry::Editorial() const { return !resp.empty(); }

Apparatus BuildApparatus(const collate::Collation& c, const ApparatusOptions& options) {
  CheckOverrides(c, options.overrides);
  std::vector<std::vector<std::string>> branches = options.branches;
  if (branches.empty()) {
    for (const auto& w : c.witnesses) branches.push_back({w.siglum});
  }
  const auto ts = InWitnessOrder(c, options.transcriptions);
  Apparatus a{
      c.table_id, c.table_title, c.work, c.witnesses, {}, options.editors, c.reference_description,
      c.argument, c.columns,     {},     {},          {}};
  for (const auto& t : ts) a.folios.push_back(t.folios);
  for (std::size_t r = 0; r < c.rows.size(); ++r) {
    const auto& row = c.rows[r];
    a.arguments.push_back(row.argument);
    a.arg_variants.push_back(ts.empty() ? std::vector<ArgumentVariant>{}
                                        : ArgumentVariants(c, ts, r));
    std::vector<ApparatusEntry> entries;
    for (const auto& cell : row.cells) {
      const auto col = static_cast<std::size_t>(cell.column);
      const Override* o = FindOverride(options.overrides, row.argument, c.columns[col].name);
      entries.push_back(Entry({c, cell, branches, o}));
      if (!ts.empty()) AddMarks(c, ts, r, col, entries.back());
    }
    a.cells.push_back(std::move(entries));
  }
  return a;
}

std::vector<Override> OverridesFrom(const pipeline::TableDecisions& decisions) {
  std::vector<Override> out;
  for (const auto& e : decisions.edited_cells) {
    out.push_back({e.arg, e.column, e.reading, e.decision.note,
                   e.decision.action == pipeline::Action::kConjecture, e.decision.editor});
  }
  return out;
}

Apparatus BuildApparatus(const pipeline::TableAnalysis& analysis, const std::string& editor) {
  ApparatusOptions o;
  o.branches = pipeline::ParsimonyBranches(analysis);
  o.overrides = OverridesFrom(analysis.decisions);
  o.transcriptions = &analysis.transcriptions;
  o.editors = analysis.decisions.Editors();
  if (!editor.empty() && std::find(o.editors.begin(), o.editors.end(), editor) == o.editors.end())
    o.editors.insert(o.editors.begin(), editor);
  return BuildApparatus(analysis.collation, o);
}

std::string XmlId(const std::string& siglum) {
  std::string id;
  for (unsigned char ch : siglum) {
    const bool ok = std::isalnum(ch) || ch == '-' || ch == '_' || ch == '.';
    id += ok ? static_cast<char>(ch) : '_';
  }
  if (id.empty() || std::isdigit(static_cast<unsigned char>(id[0])) || id[0] == '-' || id[0] == '.')
    id = "w" + id;
  return id;
}

}  // namespace apograph::publish
