// Every witness of a table explained against the references, each cell with
// what the other witnesses read there; the guard on the references (the
// author's departures as a pattern: authors_departures.cpp).
#include <algorithm>
#include <cmath>
#include <map>

#include "estimate/derived_model.hpp"
#include "pipeline/witness_findings.hpp"
#include "pipeline/witness_internal.hpp"

namespace apograph::pipeline {
namespace {

using internal::ForWitness;

Sexagesimal AtPlaces(const Sexagesimal& v, int places) {
  return v.places() <= places ? v.Extended(places) : v.Rounded(places);
}

/// One witness's column against its reference.
struct ColumnRun {
  std::size_t witness = 0;
  ColumnReference ref;  ///< column index moved to the witness
  int places = 0;
  int written = 0;  ///< the places its column is written to
  deviation::ColumnValues values;
  std::map<std::string, std::size_t> rows;  ///< argument in use -> row
  std::vector<deviation::Finding> found;
  deviation::ReferenceVerdict verdict;
};

std::optional<Sexagesimal> ReadValue(const Transcription& w, std::size_t row, int column,
                                     int places) {
  const Cell& cell = w.rows[row].cells[static_cast<std::size_t>(column)];
  if (cell.state != CellState::kRead || !cell.value) return std::nullopt;
  return AtPlaces(*cell.value, places);
}

/// Arguments in use of a table with a declared step, and that step; empty
/// without one (or with arguments listed).
struct ArgumentSteps {
  std::vector<std::optional<Sexagesimal>> in_use;
  std::optional<Sexagesimal> step;
  /// (a[j] - a[i]) in steps; NaN when either is unknown.
  double Steps(std::size_t i, std::size_t j) const {
    if (!in_use[i] || !in_use[j]) return NAN;
    return (*in_use[j] - *in_use[i]).ToDouble() / step->ToDouble();
  }
  std::string Text(std::size_t r) const {
    return in_use[r] ? in_use[r]->ToString() : std::string("none");
  }
};

ArgumentSteps StepsOf(const Transcription& t) {
  ArgumentSteps out;
  if (!t.argument.step || t.argument.step->is_zero() || t.argument.listed) return out;
  out.step = t.argument.step;
  for (std::size_t r = 0; r < t.rows.size(); ++r) out.in_use.push_back(t.ArgumentInUse(r));
  return out;
}

/// Per row, why its own argument in use is doubtful (empty: it is not): the
/// row lies in a short run of rows in step with each other between two
/// breaks of the table's step that cancel (+1 and -1 step, +600 and -600:
/// 256, 258, 259, 259 or 191, 192, 793, 194), so the run stands for other
/// arguments than it reads. A single break (a row omitted or repeated) says
/// nothing of which rows are right.
std::vector<std::string> ShiftedRows(const ArgumentSteps& a) {
  // Judgement: a miscopied argument, or one taken from a miscopied
  // neighbour, spoils a row or two; longer runs between cancelling breaks
  // are rows omitted and added, whose arguments are right.
  constexpr std::size_t kMaxShifted = 4;
  const std::size_t n = a.in_use.size();
  std::vector<std::string> out(n);
  std::vector<std::size_t> breaks;  // r: rows r and r + 1 not one step apart
  for (std::size_t r = 0; r + 1 < n; ++r) {
    if (!(std::fabs(a.Steps(r, r + 1) - 1) < 1e-9)) breaks.push_back(r);
  }
  for (std::size_t i = 0; i + 1 < breaks.size(); ++i) {
    const std::size_t first = breaks[i] + 1, last = breaks[i + 1];
    const double jump = a.Steps(breaks[i], first) + a.Steps(last, last + 1) - 2;
    if (last - first + 1 > kMaxShifted || !(std::fabs(jump) < 1e-9)) continue;
    const std::string why = "the arguments in use of rows " + std::to_string(first) + " to " +
                            std::to_string(last + 2) + " (" + a.Text(first - 1) + ", ..., " +
                            a.Text(last + 1) + ") leave the table's step at row " +
                            std::to_string(first + 1) + " and come back to it at row " +
                            std::to_string(last + 2) + ", so row " + std::to_string(first + 1) +
                            (last > first ? " to " + std::to_string(last + 1) : "") +
                            " (argument " + a.Text(first) + (last > first ? ", ..." : "") +
                            ") stands for another argument than it reads";
    for (std::size_t r = first; r <= last; ++r) out[r] = why;
  }
  return out;
}

/// For a difference of entries k rows apart, k; else 0 (the model at a row
/// reads that row's argument alone).
int DifferenceSpan(const ColumnReference& ref) {
  const auto* derived = dynamic_cast<const estimate::DerivedModel*>(ref.model.get());
  if (!derived || derived->relation().kind != estimate::DerivedRelation::Kind::kDifference)
    return 0;
  return derived->relation().rows;
}

/// Per row, why the model's value there rests on a doubtful argument (see
/// deviation::ColumnValues::argument_doubt); empty where it does not: the
/// row's own argument (ShiftedRows), or, for a difference of entries k
/// rows apart, the row k away whose argument is doubtful or not k steps
/// from this one's.
std::vector<std::string> ArgumentDoubt(const Transcription& t, const ColumnReference& ref) {
  const ArgumentSteps a = StepsOf(t);
  if (!a.step) return {};
  auto out = ShiftedRows(a);
  const int k = DifferenceSpan(ref);
  if (k == 0) return out;
  const auto own = out;
  for (std::size_t r = 0; r < out.size(); ++r) {
    const auto j = static_cast<std::ptrdiff_t>(r) + k;
    if (!out[r].empty() || j < 0 || j >= static_cast<std::ptrdiff_t>(out.size())) continue;
    const auto o = static_cast<std::size_t>(j);
    const std::string from = "the model here is a difference with row " + std::to_string(o + 1);
    if (!own[o].empty())
      out[r] = from + ", and " + own[o];
    else if (!(std::fabs(a.Steps(r, o) - k) < 1e-9))
      out[r] = from + ", whose argument in use (" + a.Text(o) + ") is not " +
               std::to_string(std::abs(k)) + " step(s) of " + a.step->ToString() +
               " from this row's (" + a.Text(r) + ")";
  }
  return out;
}

ColumnRun MakeRun(const std::vector<const Transcription*>& ws, std::size_t w,
                  const ColumnReference& ref) {
  ColumnRun run;
  run.witness = w;
  run.ref = ref;
  const Transcription& t = *ws[w];
  run.places = ref.practice.places.value_or(t.columns[static_cast<std::size_t>(ref.column)].places);
  const auto re = ref.Recompute(t);
  run.values = {ref.column, re.computed, re.exact, {}, ArgumentDoubt(t, ref)};
  run.written = t.columns[static_cast<std::size_t>(ref.column)].places;
  for (std::size_t r = 0; r < t.rows.size(); ++r) {
    if (auto a = t.ArgumentInUse(r)) run.rows.emplace(a->ToString(), r);
  }
  return run;
}

/// A derived column's model is computed from the witness's own entries of
/// the columns it derives from, slips and all; the original's was computed
/// from the original's. Where most witnesses (modern editions left out, two
/// at least) compute one value for an argument and this witness another,
/// its own entries are off, not the derived column: it is compared with the
/// tradition's value.
void UseTraditionsModel(ColumnRun& run, const std::vector<ColumnRun>& all,
                        const std::vector<const Transcription*>& ws) {
  if (run.ref.derived.empty()) return;
  for (const auto& [arg, r] : run.rows) {
    std::map<std::string, std::pair<int, const ColumnRun*>> tally;
    int n = 0;
    for (const auto& other : all) {
      if (other.ref.column_name != run.ref.column_name ||
          ws[other.witness]->witness.Kind() == WitnessKind::kModernEdition)
        continue;
      auto it = other.rows.find(arg);
      if (it == other.rows.end() || !other.values.computed[it->second]) continue;
      ++n;
      auto& entry = tally[AtPlaces(*other.values.computed[it->second], run.places).ToString()];
      ++entry.first;
      entry.second = &other;
    }
    const auto& mine = run.values.computed[r];
    for (const auto& [text, entry] : tally) {
      if (n < 2 || 2 * entry.first <= n || (mine && AtPlaces(*mine, run.places).ToString() == text))
        continue;
      const std::size_t o = entry.second->rows.at(arg);
      run.values.computed[r] = entry.second->values.computed[o];
      if (r < run.values.exact.size() && o < entry.second->values.exact.size())
        run.values.exact[r] = entry.second->values.exact[o];
    }
  }
}

/// Another witness's reading `v`, written to fewer places than this one's
/// (`places`), as a reading at `places`: one that agrees at the places they
/// share with this copy (or with the model) reads it; extended by zeros it
/// would "contradict" every last place.
Sexagesimal CommonReading(const Sexagesimal& v, const std::optional<Sexagesimal>& own,
                          const std::optional<Sexagesimal>& model, bool same, bool as_model,
                          int places) {
  if (same) return *own;
  if (as_model) return *model;
  return AtPlaces(v, places);
}

/// What the runs of the same column in the other witnesses read at each row
/// of `run`.
void FillTradition(ColumnRun& run, const std::vector<ColumnRun>& all,
                   const std::vector<const Transcription*>& ws) {
  const Transcription& t = *ws[run.witness];
  run.values.tradition.assign(t.rows.size(), {});
  // At the places this witness writes, as its column is explained.
  const int places = run.written;
  for (const auto& [arg, r] : run.rows) {
    const auto own = ReadValue(t, r, run.ref.column, places);
    const auto& computed = run.values.computed[r];
    const std::optional<Sexagesimal> model =
        computed ? std::optional(AtPlaces(*computed, places)) : std::nullopt;
    deviation::TraditionCell cell;
    std::map<std::string, std::pair<int, Sexagesimal>> tally;
    for (const auto& other : all) {
      if (other.witness == run.witness || other.ref.column_name != run.ref.column_name) continue;
      auto it = other.rows.find(arg);
      if (it == other.rows.end()) continue;
      // A modern edition is no evidence of the author's text: it may have
      // recomputed the table (and not with the reference's model).
      if (ws[other.witness]->witness.Kind() == WitnessKind::kModernEdition) continue;
      // Witnesses are compared at the places they share. One that writes
      // fewer places says nothing of the places it lacks: where this copy
      // and the model differ only there, it is left out.
      const int common = std::min(places, other.written);
      if (common < places && own && model && AtPlaces(*own, common) == AtPlaces(*model, common))
        continue;
      const auto v = ReadValue(*ws[other.witness], it->second, other.ref.column, common);
      if (!v) continue;
      ++cell.witnesses;
      const bool same = own && AtPlaces(*own, common) == *v;
      const bool as_model = model && AtPlaces(*model, common) == *v;
      cell.same += same;
      cell.model += as_model;
      const Sexagesimal reading = CommonReading(*v, own, model, same, as_model, places);
      auto& entry = tally.try_emplace(reading.ToString(), 0, reading).first->second;
      ++entry.first;
    }
    for (const auto& [text, entry] : tally) {
      if (2 * entry.first > cell.witnesses) {
        cell.consensus = entry.second;
        cell.agree = entry.first;
      }
    }
    run.values.tradition[r] = cell;
  }
}

int Compared(const ColumnRun& run, const Transcription& t) {
  int n = 0;
  for (std::size_t r = 0; r < t.rows.size() && r < run.values.computed.size(); ++r)
    n += run.values.computed[r] && ReadValue(t, r, run.ref.column, run.places).has_value();
  return n;
}

/// Rows of `run` that its findings flag (copying slips and unexplained
/// deviations; blanks and illegible cells left out), or with `unexplained`
/// only those that no listed slip explains.
std::vector<bool> FlaggedRows(const ColumnRun& run, std::size_t rows, bool unexplained = false) {
  std::vector<bool> out(rows, false);
  for (const auto& f : run.found) {
    const auto cls = f.best().cls;
    // A reading kept against the model counts as a row the model does not
    // explain, as it did when it was flagged unexplained; not one kept for
    // a doubtful argument (the argument, not the reference, is the suspect).
    const bool kept = f.kept_against_model && !f.argument_doubted;
    if ((!deviation::IsCopyingSlip(cls) && !kept) || cls == deviation::SlipClass::kBlank ||
        cls == deviation::SlipClass::kIllegible ||
        (unexplained && cls != deviation::SlipClass::kUnexplained && !kept))
      continue;
    for (const auto& c : f.cells) {
      if (c.row < rows) out[c.row] = true;
    }
  }
  return out;
}

/// The tradition's test: rows that every witness having the column flags,
/// modern editions left out (a copy's slips, even a lost ancestor's, are in some witnesses only; an
/// archetype's error or a wrong reference is in all).
std::optional<deviation::ReferenceVerdict> ConsensusVerdict(
    const std::vector<ColumnRun>& runs, const std::string& column,
    const std::vector<const Transcription*>& ws, const deviation::GuardOptions& guard) {
  std::map<std::string, std::pair<int, int>> by_arg;  // readers, flaggers
  int witnesses = 0;
  for (const auto& run : runs) {
    const Transcription& t = *ws[run.witness];
    // A modern edition may have recomputed the table (and not with the
    // reference's model): its agreement with the reference says nothing of
    // the author's text, as in the tradition's view.
    if (run.ref.column_name != column || t.witness.Kind() == WitnessKind::kModernEdition) continue;
    ++witnesses;
    const auto flagged = FlaggedRows(run, t.rows.size());
    for (const auto& [arg, r] : run.rows) {
      if (!run.values.computed[r] || !ReadValue(t, r, run.ref.column, run.places)) continue;
      auto& [readers, flaggers] = by_arg[arg];
      ++readers;
      flaggers += flagged[r];
    }
  }
  if (witnesses < 2) return std::nullopt;
  int rows = 0, flagged = 0;
  for (const auto& [arg, counts] : by_arg) {
    ++rows;
    flagged += counts.first >= 2 && counts.second == counts.first;
  }
  return deviation::GuardReference(rows, flagged, guard, true);
}

/// The trend test's rows: per argument (in its numeric order), the median
/// over the witnesses of reading minus model, how many flag it and how many
/// of them with no listed slip. Modern editions are left out, as in the
/// tradition's view. The trend test, then the agreed-run test.
std::optional<deviation::ReferenceVerdict> TrendVerdict(const std::vector<ColumnRun>& runs,
                                                        const std::string& column,
                                                        const std::vector<const Transcription*>& ws,
                                                        const deviation::GuardOptions& guard) {
  struct Acc {
    std::string arg;
    std::vector<double> diffs;
    int flaggers = 0;
    int unexplained = 0;
  };
  std::map<double, Acc> by_arg;
  int witnesses = 0;
  for (const auto& run : runs) {
    const Transcription& t = *ws[run.witness];
    if (run.ref.column_name != column || t.witness.Kind() == WitnessKind::kModernEdition) continue;
    ++witnesses;
    const auto flagged = FlaggedRows(run, t.rows.size());
    const auto unexplained = FlaggedRows(run, t.rows.size(), true);
    for (const auto& [arg, r] : run.rows) {
      const auto v = ReadValue(t, r, run.ref.column, run.places);
      const auto& computed = run.values.computed[r];
      const auto a = t.ArgumentInUse(r);
      if (!v || !computed || !a) continue;
      auto& acc = by_arg[a->ToDouble()];
      acc.arg = arg;
      acc.diffs.push_back(DiffUnits(*v, *computed, run.places));
      acc.flaggers += flagged[r];
      acc.unexplained += flagged[r] && unexplained[r];
    }
  }
  if (witnesses < 2) return std::nullopt;
  std::vector<deviation::TrendRow> rows;
  for (auto& [x, acc] : by_arg) {
    auto& d = acc.diffs;
    std::sort(d.begin(), d.end());
    const std::size_t m = d.size() / 2;
    const double median = d.size() % 2 ? d[m] : (d[m - 1] + d[m]) / 2;
    rows.push_back({acc.arg, median, static_cast<int>(d.size()), acc.flaggers, x, acc.unexplained});
  }
  auto trend = deviation::GuardTrend(rows, guard);
  if (!trend.explains) return trend;
  return deviation::GuardAgreedRun(rows, guard);
}

std::vector<WitnessFindings> Explain(const std::vector<const Transcription*>& ws,
                                     const std::vector<const deviation::NumeralScript*>& scripts,
                                     const std::vector<ColumnReference>& references,
                                     const deviation::ExplainOptions& options,
                                     double check_tolerance, const deviation::GuardOptions& guard,
                                     bool tradition) {
  std::vector<ColumnRun> runs;
  for (std::size_t w = 0; w < ws.size(); ++w) {
    for (const auto& any : references) {
      if (auto ref = ForWitness(any, *ws[w])) runs.push_back(MakeRun(ws, w, *ref));
    }
  }
  if (tradition) {
    std::vector<ColumnRun> own = runs;  // each witness's model before the tradition's
    for (auto& run : runs) UseTraditionsModel(run, own, ws);
    for (auto& run : runs) FillTradition(run, runs, ws);
  }
  for (auto& run : runs) {
    const Transcription& t = *ws[run.witness];
    run.found = deviation::ExplainColumn(
        t, run.values, *scripts[run.witness], options,
        tradition ? scripts : std::vector<const deviation::NumeralScript*>{});
    run.verdict = deviation::GuardReference(
        Compared(run, t), deviation::FlaggedCells(run.found, run.ref.column), guard);
  }
  for (const auto& ref : references) {
    auto consensus = ConsensusVerdict(runs, ref.column_name, ws, guard);
    if (consensus && consensus->explains)
      consensus = TrendVerdict(runs, ref.column_name, ws, guard);
    if (!consensus || consensus->explains) continue;
    for (auto& run : runs) {
      if (run.ref.column_name == ref.column_name) run.verdict = *consensus;
    }
  }
  std::vector<WitnessFindings> out(ws.size());
  for (std::size_t w = 0; w < ws.size(); ++w) {
    out[w].siglum = ws[w]->witness.siglum;
    out[w].script = scripts[w]->name();
  }
  for (auto& run : runs) {
    const Transcription& t = *ws[run.witness];
    WitnessFindings& wf = out[run.witness];
    const auto check = model::Check(t, *run.ref.model, run.ref.params, run.ref.practice,
                                    check_tolerance, run.ref.column);
    wf.checks.push_back({run.ref.column, run.ref.column_name, check.summary});
    ColumnVerdict v{run.ref.column, run.ref.column_name, run.verdict, {}};
    if (run.verdict.explains) {
      wf.findings.insert(wf.findings.end(), run.found.begin(), run.found.end());
    } else {
      v.screen = deviation::ScreenColumn(t, run.ref.column, scripts[run.witness]);
    }
    wf.verdicts.push_back(std::move(v));
  }
  return out;
}

}  // namespace

const ColumnVerdict* WitnessFindings::VerdictOf(const std::string& column) const {
  for (const auto& v : verdicts) {
    if (v.column_name == column) return &v;
  }
  return nullptr;
}

bool WitnessFindings::Refused(const std::string& column) const {
  const auto* v = VerdictOf(column);
  return v && !v->verdict.explains;
}

WitnessFindings ExplainWitness(const Transcription& witness,
                               const std::vector<ColumnReference>& references,
                               const deviation::NumeralScript& script,
                               const deviation::ExplainOptions& options, double check_tolerance,
                               const deviation::GuardOptions& guard) {
  return Explain({&witness}, {&script}, references, options, check_tolerance, guard, false).front();
}

std::vector<WitnessFindings> ExplainTradition(const std::vector<Transcription>& witnesses,
                                              const std::vector<ColumnReference>& references,
                                              const std::string& scripts_dir,
                                              const deviation::ExplainOptions& options,
                                              double check_tolerance,
                                              const deviation::GuardOptions& guard) {
  std::vector<deviation::NumeralScript> scripts;
  std::map<std::string, std::size_t> loaded;
  std::vector<std::size_t> index;
  for (const auto& w : witnesses) {
    const std::string name = deviation::ScriptNameFor(w.witness);
    auto it = loaded.find(name);
    if (it == loaded.end()) {
      it = loaded.emplace(name, scripts.size()).first;
      scripts.push_back(deviation::FindNumeralScript(name, scripts_dir));
    }
    index.push_back(it->second);
  }
  std::vector<const Transcription*> ws;
  std::vector<const deviation::NumeralScript*> ss;
  for (std::size_t w = 0; w < witnesses.size(); ++w) {
    ws.push_back(&witnesses[w]);
    ss.push_back(&scripts[index[w]]);
  }
  return Explain(ws, ss, references, options, check_tolerance, guard, true);
}

}  // namespace apograph::pipeline
