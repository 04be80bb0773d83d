// What a column tells about its author and copyist, the cells of a finding,
// blank and illegible cells, the author's departures and smooth runs.
#include <algorithm>
#include <cmath>
#include <cstdio>

#include "deviation/explain_internal.hpp"

namespace apograph::deviation::internal {
namespace {

double Shrunk(int count, int entries, double prior) {
  return (count + prior * kPriorEntries) / (entries + kPriorEntries);
}

const Cell& CellAt(const Transcription& t, std::size_t row, int column) {
  return t.rows[row].cells[static_cast<std::size_t>(column)];
}

const TraditionCell* TraditionAt(const ColumnValues& values, std::size_t row) {
  return row < values.tradition.size() && values.tradition[row].witnesses > 0
             ? &values.tradition[row]
             : nullptr;
}

/// Departures of 1 and 2 units (or grid steps) in the table's readings (the
/// others' consensus where there is one, else this copy's): the author's habit.
AuthorProfile MeasureAuthor(const ColumnValues& values, const ExplainOptions& options,
                            const ColumnContext& column, int places) {
  const DiffColumn& diffs = column.diffs;
  int compared = 0, one = 0, two = 0;
  for (std::size_t r = 0; r < diffs.diff.size() && r < values.computed.size(); ++r) {
    double d = column.departure[r];
    const TraditionCell* t = TraditionAt(values, r);
    if (t && t->consensus && values.computed[r])
      d = DepartureDiff(*t->consensus, *values.computed[r], places, column.grid);
    if (!std::isfinite(d)) continue;
    ++compared;
    const int k = UnitsOff(d, options.tolerance);
    one += k == 1;
    two += k == 2;
  }
  AuthorProfile a;
  a.rate1 = Shrunk(one, compared, kAuthorRate1Prior);
  a.rate2 = Shrunk(two, compared, kAuthorRate2Prior);
  if (compared == 0) return a;
  const bool twos = two >= 2 && static_cast<double>(two) / compared >= kAuthorTwoUnitsShare;
  a.typical = std::min(twos ? 2 : 1, static_cast<int>(std::floor(options.computational_units)));
  return a;
}

std::string UnitsWord(double units) { return std::fabs(units) == 1 ? " unit" : " units"; }

/// Fractional places up to the last that is not 0.
int UsedPlaces(const Sexagesimal& v) {
  const auto digits = v.FractionDigits();
  int used = static_cast<int>(digits.size());
  while (used > 0 && digits[static_cast<std::size_t>(used - 1)] == 0) --used;
  return used;
}

}  // namespace

double CoarseDiff(const Sexagesimal& reading, const Sexagesimal& computed, int places) {
  const int used = std::max(UsedPlaces(AtPlaces(reading, places)), UsedPlaces(computed));
  return DiffUnits(reading, computed, std::min(used, places));
}

std::string Signed(double units) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%+g", std::round(units * 100) / 100);
  return buf;
}

std::string SignedUnits(double units) { return Signed(units) + UnitsWord(units); }

DiffColumn Diffs(const Transcription& table, const ColumnValues& values, int places) {
  DiffColumn out;
  out.diff.assign(table.rows.size(), NAN);
  for (std::size_t r = 0; r < table.rows.size() && r < values.computed.size(); ++r) {
    const Cell& cell = CellAt(table, r, values.column);
    if (cell.state != CellState::kRead || !cell.value || !values.computed[r]) continue;
    out.diff[r] = DiffUnits(*cell.value, *values.computed[r], places);
  }
  return out;
}

namespace {

/// The tradition's firm reading of row r (every other witness but perhaps one
/// in four, two at least); nullopt without one.
std::optional<Sexagesimal> FirmReading(const ColumnValues& values, std::size_t r, int places) {
  // Judgement, as ColumnContext::shared and TraditionKeptCandidate: two
  // other witnesses at least, all but perhaps one in four agreeing.
  constexpr int kLeastWitnesses = 2;
  const TraditionCell* t = TraditionAt(values, r);
  if (!t || !t->consensus || t->witnesses < kLeastWitnesses || 4 * t->agree < 3 * t->witnesses ||
      r >= values.computed.size() || !values.computed[r])
    return std::nullopt;
  return AtPlaces(*t->consensus, places);
}

/// The tradition's value of row r (its firm reading, else the model's).
std::optional<Sexagesimal> TraditionValue(const ColumnValues& values, std::size_t r, int places) {
  if (auto firm = FirmReading(values, r, places)) return firm;
  if (r < values.computed.size() && values.computed[r])
    return AtPlaces(*values.computed[r], places);
  return std::nullopt;
}

/// The model's second difference at row r is smaller than the tradition's:
/// the roughness is the tradition's (a line repeated), not the model's (a
/// derived model spiking where its source misses a row).
bool ModelSmoother(const ColumnValues& values, std::size_t r, int places) {
  if (r == 0 || r + 1 >= values.computed.size()) return true;
  const auto m0 = values.computed[r - 1], m1 = values.computed[r], m2 = values.computed[r + 1];
  const auto t0 = TraditionValue(values, r - 1, places), t1 = TraditionValue(values, r, places),
             t2 = TraditionValue(values, r + 1, places);
  if (!m0 || !m1 || !m2 || !t0 || !t1 || !t2) return true;
  const double model = DiffUnits(*m2, *m1, places) - DiffUnits(*m1, *m0, places);
  const double tradition = DiffUnits(*t2, *t1, places) - DiffUnits(*t1, *t0, places);
  return std::fabs(model) < std::fabs(tradition);
}

/// The firm reading of row r is the reading (firm, else the model's) of the
/// row above or below where the model is smoother than the tradition there:
/// a line repeated, whose departure a repetition of the same line on the
/// other side can cancel (the middle entry of a smooth column written into
/// both its neighbours: -14, 0, +15). A column constant over the rows (a
/// mean motion's step) repeats by nature; there the model spikes.
bool RepeatsNeighbour(const ColumnValues& values, std::size_t r, int places) {
  const auto firm = FirmReading(values, r, places);
  if (!firm || !ModelSmoother(values, r, places)) return false;
  for (std::ptrdiff_t off : {-1, 1}) {
    const std::ptrdiff_t j = static_cast<std::ptrdiff_t>(r) + off;
    if (j < 0 || j >= static_cast<std::ptrdiff_t>(values.computed.size())) continue;
    const auto at = static_cast<std::size_t>(j);
    const auto other = FirmReading(values, at, places);
    if (other && *other == *firm) return true;
    if (values.computed[at] && AtPlaces(*values.computed[at], places) == *firm) return true;
  }
  return false;
}

}  // namespace

std::vector<std::optional<std::pair<std::size_t, std::size_t>>> CompensatingRows(
    const ColumnValues& values, const ExplainOptions& options, const AuthorProfile& author,
    int places) {
  // Judgement: a source entry enters two differences (three rows cover one
  // row's neighbours both sides); wider windows would pair unrelated slips.
  constexpr std::size_t kWindow = 3;
  const std::size_t n = values.computed.size();
  // Each row's departure in units of the column's last place, and the last
  // place its reading or the model uses (the window's sum is counted as the
  // author departs, in the finest of them: CoarseDiff).
  std::vector<double> units(n, NAN);
  std::vector<int> used(n, 0);
  for (std::size_t r = 0; r < n; ++r) {
    const auto firm = FirmReading(values, r, places);
    if (!firm) continue;
    used[r] = std::min(places, std::max(UsedPlaces(*firm), UsedPlaces(*values.computed[r])));
    units[r] = DiffUnits(*firm, *values.computed[r], places);
  }
  // Beyond the author's departure in units of the column's last place, as
  // MeasureColumn counts the tradition's reading (a +1/-1 pair of seconds in
  // a column written to thirds is beyond it there).
  const auto beyond = [&](std::size_t r) {
    return std::isfinite(units[r]) && UnitsOff(units[r], options.tolerance) > author.typical;
  };
  std::vector<std::optional<std::pair<std::size_t, std::size_t>>> out(n);
  for (std::size_t r = 0; r < n; ++r) {
    if (!beyond(r)) continue;
    const std::size_t lo = r + 1 >= kWindow ? r + 1 - kWindow : 0;
    for (std::size_t a = lo; a <= r && !out[r]; ++a) {
      for (std::size_t b = std::max(a + 1, r); b < a + kWindow && b < n && !out[r]; ++b) {
        double sum = 0;
        int finest = 0;
        bool finite = true, opposite = false;
        for (std::size_t j = a; j <= b; ++j) {
          finite = finite && std::isfinite(units[j]);
          sum += std::isfinite(units[j]) ? units[j] : 0;
          finest = std::max(finest, used[j]);
          opposite = opposite || (j != r && beyond(j) && (units[j] > 0) != (units[r] > 0));
        }
        sum /= std::pow(60.0, places - finest);
        if (!finite || !opposite || UnitsOff(sum, options.tolerance) > author.typical) continue;
        // Lines repeated or exchanged (each the other's value): a slip.
        bool copied = false;
        for (std::size_t j = a; j <= b; ++j)
          copied = copied || (beyond(j) && RepeatsNeighbour(values, j, places));
        if (copied) continue;
        out[r] = std::make_pair(a, b);
      }
    }
  }
  return out;
}

ColumnContext MeasureColumn(const Transcription& table, const ColumnValues& values,
                            const ExplainOptions& options, int places) {
  ColumnContext out;
  out.diffs = Diffs(table, values, places);
  out.grid = MeasureGrid(table, values, places);
  out.departure = out.diffs.diff;
  for (std::size_t r = 0; r < out.departure.size(); ++r) {
    const Cell& cell = CellAt(table, r, values.column);
    if (std::isfinite(out.departure[r]))
      out.departure[r] = DepartureDiff(*cell.value, *values.computed[r], places, out.grid);
  }
  out.author = MeasureAuthor(values, options, out, places);
  const std::size_t n = table.rows.size();
  out.deviant.assign(n, false);
  out.shared.assign(n, false);
  out.contradicted.assign(n, false);
  out.tradition_reading.assign(n, std::nullopt);
  out.consensus.assign(n, std::nullopt);
  out.compensating = CompensatingRows(values, options, out.author, places);
  out.compensating.resize(n);
  int compared = 0, deviant = 0;
  for (std::size_t r = 0; r < n; ++r) {
    const TraditionCell* t = TraditionAt(values, r);
    // Shared: by every other witness but perhaps one in four (a corrector,
    // or a slip of its own there); judgement.
    out.shared[r] = t && t->same > 0 && 4 * t->same >= 3 * t->witnesses;
    // A modern edition may have recomputed the column: where every other
    // witness reads otherwise, it may be the one that reads the model's value
    // (the others sharing an ancestor's slip), so it is not "contradicted".
    out.contradicted[r] = t && t->consensus && t->witnesses >= 2 && t->agree == t->witnesses &&
                          t->same == 0 && table.witness.Kind() != WitnessKind::kModernEdition;
    const double d = out.departure[r];
    if (std::isfinite(d)) {
      ++compared;
      const int k = UnitsOff(d, options.tolerance);
      // A departure every other witness reads too stays the author's up to
      // computational_units, whatever the column's habit (counted in grid
      // steps, or in the last place the reading or the model uses).
      const Cell& read = CellAt(table, r, values.column);
      const int coarse =
          out.shared[r] ? UnitsOff(AuthorDiff(*read.value, *values.computed[r], places, out.grid),
                                   options.tolerance)
                        : k;
      const bool authors = k <= out.author.typical ||
                           (out.shared[r] && coarse <= std::floor(options.computational_units));
      // A reading the tradition keeps where the model misses a compensating
      // window is not this copy's departure; where it is within the author's
      // departure already (on his grid, or shared), that story stands.
      const bool as_tradition = out.compensating[r] && t && t->consensus &&
                                AtPlaces(*read.value, places) == AtPlaces(*t->consensus, places);
      if (as_tradition && authors) out.compensating[r].reset();
      out.deviant[r] = !authors && !as_tradition;
      deviant += out.deviant[r];
    }
    if (!t || !t->consensus || r >= values.computed.size() || !values.computed[r]) continue;
    const Sexagesimal consensus = AtPlaces(*t->consensus, places);
    out.consensus[r] = consensus;
    const Cell& cell = CellAt(table, r, values.column);
    if (cell.value && AtPlaces(*cell.value, places) == consensus) continue;
    // Counted in units, not grid steps, as a systematic run's restored
    // readings are: a branch's constant error of one step (a degree where the
    // column writes whole degrees as "9;0") would pass for the author's
    // departure, and a copy keeping the author's reading against it be
    // emended to the branch's (seeds 1-20 of deviation_bench: 30 false flags
    // on one witness with both counted in steps; DEVELOPERS.md, fifth round).
    const int k = UnitsOff(DiffUnits(consensus, *values.computed[r], places), options.tolerance);
    if (k <= out.author.typical || out.compensating[r]) out.tradition_reading[r] = consensus;
  }
  out.slip_rate = std::min(kSlipRateCeiling, Shrunk(deviant, compared, kSlipRatePrior));
  out.off_curve = ModelOffCurve(table, values, out, places);
  return out;
}

std::optional<Sexagesimal> ColumnContext::Original(std::size_t row, const ColumnValues& values,
                                                   const ExplainOptions& options,
                                                   int places) const {
  if (row >= values.computed.size() || !values.computed[row]) return std::nullopt;
  if (consensus[row] && row < compensating.size() && compensating[row]) return consensus[row];
  if (consensus[row]) {
    // In units, as the tradition's reading (see MeasureColumn).
    const int k =
        UnitsOff(DiffUnits(*consensus[row], *values.computed[row], places), options.tolerance);
    if (k <= author.typical) return consensus[row];
  }
  return AtPlaces(*values.computed[row], places);
}

CellContext MakeContext(const Transcription& table, const ColumnValues& values,
                        const NumeralScript& script, const ExplainOptions& options,
                        const ColumnContext& column, std::size_t row, int places) {
  CellContext c;
  c.table = &table;
  c.script = &script;
  c.options = &options;
  c.author = &column.author;
  c.tradition = TraditionAt(values, row);
  c.row = row;
  c.column = values.column;
  c.places = places;
  c.unit = table.columns[static_cast<std::size_t>(values.column)].unit;
  const Cell& cell = CellAt(table, row, values.column);
  if (cell.value) c.tabulated = AtPlaces(*cell.value, places);
  c.computed = *values.computed[row];
  c.model_reading = AtPlaces(c.computed, places);
  c.tradition_reading = column.tradition_reading[row];
  if (row < values.exact.size()) c.exact = values.exact[row];
  c.diff = column.diffs.diff[row];
  c.author_diff = AuthorDiff(c.tabulated, c.computed, places, column.grid);
  c.grid = column.grid;
  c.slip_rate = column.slip_rate;
  c.deviant = &column.deviant;
  c.shared = column.shared[row];
  if (row > 0) c.exemplar_above = column.Original(row - 1, values, options, places);
  c.exemplar_below = column.Original(row + 1, values, options, places);
  const Digits digits = ToDigits(c.tabulated, places);
  c.symbols = 0;
  for (std::size_t p = 0; p < digits.d.size(); ++p) {
    c.symbols += static_cast<int>(PlaceSymbols(script, digits.d[p], static_cast<int>(p)).size());
  }
  c.symbols = std::max(1, c.symbols);
  for (std::ptrdiff_t off : {-1, 1}) {
    const std::ptrdiff_t j = static_cast<std::ptrdiff_t>(row) + off;
    if (j < 0 || j >= static_cast<std::ptrdiff_t>(column.diffs.diff.size())) continue;
    const double d = column.departure[static_cast<std::size_t>(j)];
    const int k = std::isfinite(d) ? UnitsOff(d, options.tolerance) : 0;
    if (k > 0 && k <= column.author.typical && (d > 0) == (c.diff > 0)) c.shared_neighbour = true;
  }
  return c;
}

FindingCell MakeCell(const Transcription& table, const ColumnValues& values, std::size_t row,
                     int places) {
  FindingCell out;
  out.row = row;
  const Cell& arg = table.rows[row].argument;
  if (!arg.raw.empty()) {
    out.arg = arg.raw;
  } else if (auto expected = table.ExpectedArgument(row)) {
    out.arg = expected->ToString();
  } else {
    out.arg = "row " + std::to_string(row + 1);
  }
  const Cell& cell = CellAt(table, row, values.column);
  out.value = cell.value;
  out.tabulated = !cell.raw.empty() ? cell.raw : (cell.value ? cell.value->ToString() : "");
  if (row < values.computed.size()) out.computed = values.computed[row];
  out.diff_units = NAN;
  if (out.value && out.computed) out.diff_units = DiffUnits(*out.value, *out.computed, places);
  return out;
}

Finding NewFinding(const Transcription& table, const ColumnValues& values, int places) {
  Finding f;
  f.column = values.column;
  f.column_name = table.columns[static_cast<std::size_t>(values.column)].name;
  f.places = places;
  return f;
}

namespace {

std::string TraditionWords(const TraditionCell& t) {
  return t.witnesses == 1 ? "the other witness"
                          : "every other witness (" + std::to_string(t.witnesses) + ")";
}

/// "a departure of +1 unit"; on a grid "a departure of -10 units (one step of
/// the author's grid: he writes the last place in multiples of 10)".
std::string DepartureWords(const CellContext& c) {
  if (!GridSteps(c.tabulated, c.computed, c.places, c.grid))
    return "a departure of " + SignedUnits(c.author_diff);
  const double steps = std::round(std::fabs(c.author_diff) * 100) / 100;
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g", steps);
  return "a departure of " + SignedUnits(c.diff) + " (" + buf + (steps == 1 ? " step" : " steps") +
         " of the author's grid: he writes the last place in multiples of " +
         std::to_string(c.grid) + ")";
}

}  // namespace

std::optional<Candidate> AuthorCandidate(const CellContext& c) {
  const int k = UnitsOff(c.author_diff, c.options->tolerance);
  const bool size =
      k <= c.author->typical || (c.shared && k <= std::floor(c.options->computational_units));
  if (k < 1 || !size) return std::nullopt;
  double likelihood = c.author->Rate(k) / 2;  // one sign of the two
  const bool boundary =
      std::isfinite(c.exact) && k == 1 &&
      std::fabs(c.tabulated.ToDouble() - c.exact) * std::pow(60.0, c.places) <= 0.75 + 1e-9;
  if (boundary) likelihood *= kBoundaryFactor;
  if (c.shared_neighbour) likelihood *= kNeighbourFactor;
  const TraditionCell* t = c.tradition;
  const bool shared = c.shared;
  const bool against = t && !shared && t->model > 0;
  if (shared) likelihood *= kTraditionSharesFactor;
  if (against)
    likelihood *= std::pow(k == 1 ? kCorrectionOneUnit : kCorrectionLarger, std::min(t->model, 2));
  Candidate out;
  Explanation& e = out.explanation;
  e.cls = SlipClass::kComputational;
  const std::string what = DepartureWords(c);
  const std::string model = "the model gives " + ModelText(c.computed, c.exact, c.places);
  if (shared) {
    e.evidence = what + ", read by " + TraditionWords(*t) +
                 " too: the author's computation, not a copyist's slip; " + model +
                 "; keep the reading";
  } else if (against) {
    e.evidence = "perhaps the author's " + what.substr(2) + ", though " + std::to_string(t->model) +
                 " of the " + std::to_string(t->witnesses) + " other witnesses read the model's " +
                 c.model_reading.ToString() + "; " + model;
  } else if (c.shared_neighbour) {
    e.evidence = what +
                 ", shared by a neighbouring entry: the author's computation, not a copyist's "
                 "slip; " +
                 model + "; keep the reading";
  } else if (boundary) {
    e.evidence = what + "; " + model +
                 ", close to the rounding boundary, so a slightly different computation by the "
                 "author explains it; keep the reading";
  } else {
    e.evidence = "a small " + what.substr(2) + ", perhaps the author's computation; " + model;
  }
  out.likelihood = likelihood;
  return out;
}

std::optional<Candidate> TraditionKeptCandidate(const CellContext& c) {
  // Judgement: two other witnesses at least, so that one copy agreeing by
  // chance (or copied from this one) is not "the tradition".
  constexpr int kLeastWitnesses = 2;
  const TraditionCell* t = c.tradition;
  if (!t || t->witnesses < kLeastWitnesses || !c.shared) return std::nullopt;
  Candidate out;
  Explanation& e = out.explanation;
  e.cls = SlipClass::kComputational;
  // Judgement: the story is one of two (the reference misses the row, or an
  // archetype's slip outside every list), so the score says undecided.
  e.score = kScoreTraditionKept;
  e.evidence = "read by " + TraditionWords(*t) + " too, " + SignedUnits(c.diff) +
               " from the model (" + ModelText(c.computed, c.exact, c.places) +
               "), beyond the author's usual departure, and no copying slip reaches the model's " +
               "reading from it: the tradition's reading, which the reference misses here (or "
               "the author computed otherwise); no emendation on the model's word alone; keep "
               "the reading";
  return out;
}

Finding CompensatedFinding(const Transcription& table, const ColumnValues& values,
                           const ColumnContext& column, std::size_t row, int places) {
  const auto [first, last] = *column.compensating[row];
  const TraditionCell& t = values.tradition[row];
  std::string departures;
  for (std::size_t j = first; j <= last; ++j) {
    const double d = DiffUnits(*column.consensus[j], *values.computed[j], places);
    departures += (departures.empty() ? "" : ", ") + Signed(d);
  }
  const double exact = row < values.exact.size() ? values.exact[row] : NAN;
  return KeptAgainstModel(
      table, values, row, places,
      "read by " + std::to_string(t.agree) + " of the " + std::to_string(t.witnesses) +
          " other witnesses too, " + SignedUnits(column.diffs.diff[row]) + " from the model (" +
          ModelText(*values.computed[row], exact, places) + "); over rows " +
          std::to_string(first + 1) + "-" + std::to_string(last + 1) +
          " the tradition departs from the model by " + departures +
          " units, which cancel: the model misses these rows (computed from a source entry the "
          "author had otherwise, or fitted off there), not the tradition; no emendation on the "
          "model's word alone; keep the reading");
}

Finding KeptAgainstModel(const Transcription& table, const ColumnValues& values, std::size_t row,
                         int places, std::string evidence) {
  Finding f = NewFinding(table, values, places);
  Explanation e;
  e.cls = SlipClass::kComputational;
  e.score = kScoreTraditionKept;
  e.evidence = std::move(evidence);
  f.explanations.push_back(std::move(e));
  f.kept_against_model = true;
  f.cells.push_back(MakeCell(table, values, row, places));
  return f;
}

Candidate UnexplainedCandidate(const CellContext& c) {
  Candidate out;
  Explanation& e = out.explanation;
  e.cls = SlipClass::kUnexplained;
  const Sexagesimal& expected = c.Expected();
  e.emendation = expected;
  const Digits copy = ToDigits(c.tabulated, c.places), want = ToDigits(expected, c.places);
  std::string where;
  for (std::size_t p = 0; p < copy.d.size() && p < want.d.size(); ++p) {
    if (copy.d[p] != want.d[p])
      where += (where.empty() ? "" : ", ") + PlaceName(static_cast<int>(p), c.unit);
  }
  if (copy.negative != want.negative) where += (where.empty() ? "" : ", ") + std::string("sign");
  e.evidence = "no listed slip reaches it: the entry differs from the model (" +
               ModelText(c.computed, c.exact, c.places) + ") by " + SignedUnits(c.diff) +
               (where.empty() ? "" : ", in the " + where) + "; " +
               (c.tradition_reading ? "the reading the other witnesses agree on, "
                                    : "the model's reading, ") +
               expected.ToString() + ", proposed (a slip outside the lists of " +
               c.script->title() + ")";
  out.likelihood = c.SlipLikelihood(kShareOther, kOtherOutcome, 1);
  return out;
}

Finding MissingFinding(const Transcription& table, const ColumnValues& values,
                       const ColumnContext& column, std::size_t row, int places) {
  const Cell& cell = CellAt(table, row, values.column);
  Finding f = NewFinding(table, values, places);
  f.cells.push_back(MakeCell(table, values, row, places));
  Explanation e;
  e.cls = cell.state == CellState::kBlank ? SlipClass::kBlank : SlipClass::kIllegible;
  e.score = kScoreBlank;
  const auto& tradition = column.tradition_reading[row];
  e.emendation = tradition ? *tradition : AtPlaces(*values.computed[row], places);
  const std::string what = cell.state == CellState::kBlank ? "nothing written in the witness"
                           : cell.state == CellState::kPartial
                               ? "partly illegible in the witness ('" + cell.raw + "')"
                               : "illegible in the witness ('" + cell.raw + "')";
  const double exact = row < values.exact.size() ? values.exact[row] : NAN;
  e.evidence = what + "; the model gives " + ModelText(*values.computed[row], exact, places) +
               (tradition ? ", the other witnesses read " : ", supplied as ") +
               e.emendation->ToString();
  f.cells.back().emendation = e.emendation;
  f.explanations.push_back(std::move(e));
  return f;
}

void MergeComputationalRuns(std::vector<Finding>& findings) {
  std::sort(findings.begin(), findings.end(), [](const Finding& a, const Finding& b) {
    return a.cells.front().row < b.cells.front().row;
  });
  std::vector<Finding> out;
  for (auto& f : findings) {
    // A reading kept against the model is no smooth departure of the author's.
    const bool comp =
        f.best().cls == SlipClass::kComputational && f.cells.size() == 1 && !f.kept_against_model;
    if (comp && !out.empty()) {
      Finding& last = out.back();
      const bool last_comp =
          last.best().cls == SlipClass::kComputational && !last.kept_against_model;
      const bool next_row = last.cells.back().row + 1 == f.cells.front().row;
      const bool same_sign = (last.cells.back().diff_units > 0) == (f.cells.front().diff_units > 0);
      if (last_comp && next_row && same_sign) {
        last.cells.push_back(f.cells.front());
        std::string diffs;
        for (const auto& c : last.cells)
          diffs += (diffs.empty() ? "" : ", ") + Signed(c.diff_units);
        Explanation& e = last.explanations.front();
        e.score = std::max(e.score, f.best().score);
        e.evidence =
            std::to_string(last.cells.size()) + " consecutive entries depart from the model by " +
            diffs +
            " units, all of one sign: a smooth run left by the author's computation, not a "
            "copyist's slip; keep the readings";
        continue;
      }
    }
    out.push_back(std::move(f));
  }
  findings = std::move(out);
}

}  // namespace apograph::deviation::internal
