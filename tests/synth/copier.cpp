// One copy being made: single-cell and whole-row slips.
#include "copier.hpp"

#include <algorithm>

namespace apograph::synth::internal {

Copier::Copier(const TableText& exemplar, const Hand& hand, const CopyOptions& options, Rng& rng)
    : copy_(exemplar), exemplar_(exemplar), hand_(hand), options_(options), rng_(rng) {}

TableText Copier::Run() {
  const int target = rng_.Binomial(Rows() * Columns(), options_.rate);
  const auto weights = options_.weights.empty() ? DefaultWeights(hand_.kind) : options_.weights;
  std::vector<SlipClass> classes;
  std::vector<double> w;
  for (const auto& [k, weight] : weights) {
    classes.push_back(k);
    w.push_back(weight);
  }
  int done = 0;
  for (int failures = 0; done < target && failures < 400;) {
    SlipClass k = classes[rng_.Weighted(w)];
    if (k == SlipClass::kLookAlike && rng_.Chance(options_.share_outside_list))
      k = SlipClass::kOtherSymbol;
    const int got = Draw(k, target - done);
    done += got;
    failures += got == 0 ? 1 : 0;
  }
  ApplyRowOps();
  return copy_;
}

int Copier::Draw(SlipClass k, int remaining) {
  switch (k) {
    case SlipClass::kLookAlike:
      return Symbol(false);
    case SlipClass::kOtherSymbol:
      return Symbol(true);
    case SlipClass::kTransposition:
    case SlipClass::kPlaceAdded:
    case SlipClass::kLastPlace:
      return ValueSlip(k);
    case SlipClass::kPlaceDropped:
    case SlipClass::kPlaceShifted:
      if (remaining >= 3 && rng_.Chance(options_.share_systematic))
        return SystematicRun(k, remaining);
      return ValueSlip(k);
    case SlipClass::kRepetition:
      return Repetition();
    case SlipClass::kEyeSkip:
      return EyeSkip(remaining);
    case SlipClass::kConstantRun:
      return ConstantRun(remaining);
    case SlipClass::kBlank:
    case SlipClass::kIllegible:
    case SlipClass::kPartlyIllegible:
      return Unreadable(k);
    case SlipClass::kRowOmitted:
    case SlipClass::kRowDuplicated:
      return RowSlip(k);
    case SlipClass::kArgumentMiswritten:
      return Argument();
  }
  return 0;
}

bool Copier::Free(int r, int c) const { return !touched_.count({r, c}) && !row_op_rows_.count(r); }

std::optional<std::pair<int, int>> Copier::PickCell() {
  if (Rows() == 0 || Columns() == 0) return std::nullopt;
  for (int attempt = 0; attempt < 40; ++attempt) {
    const int r = rng_.Int(0, Rows() - 1), c = rng_.Int(0, Columns() - 1);
    if (Free(r, c) && Readable(r, c)) return std::make_pair(r, c);
  }
  return std::nullopt;
}

Slip Copier::Base(SlipClass k, int r, const std::string& column) const {
  Slip s;
  s.slip = k;
  s.table = copy_.text.table_id;
  s.origin_row = copy_.origin[static_cast<std::size_t>(r)];
  s.arg = copy_.archetype_args.empty()
              ? ""
              : copy_.archetype_args[static_cast<std::size_t>(s.origin_row)];
  s.column = column;
  return s;
}

void Copier::Record(Slip slip, int row) {
  slips_.push_back(std::move(slip));
  slip_rows_.push_back(row);
  slipped_rows_.insert(row);
}

void Copier::SetCell(int r, int c, Cell cell, Slip slip) {
  slip.before = At(r, c).raw;
  slip.after = cell.raw;
  cell.line = At(r, c).line;
  cell.column = At(r, c).column;
  At(r, c) = std::move(cell);
  touched_.insert({r, c});
  Record(std::move(slip), r);
}

void Copier::SetValue(int r, int c, const Changed& ch, SlipClass k, int run) {
  Slip s = Base(k, r, copy_.text.columns[static_cast<std::size_t>(c)].name);
  s.run = run;
  s.place = ch.place;
  s.pair = ch.pair;
  s.listed = ch.listed;
  s.detail = ch.detail;
  Cell cell = At(r, c);
  cell.value = ch.value;
  cell.raw = ch.value.ToString();
  cell.state = CellState::kRead;
  SetCell(r, c, std::move(cell), std::move(s));
}

int Copier::Symbol(bool outside) {
  const auto cell = PickCell();
  if (!cell) return 0;
  const auto [r, c] = *cell;
  const auto ch = SymbolSlip(*At(r, c).value, hand_, outside, rng_);
  if (!ch) return 0;
  SetValue(r, c, *ch, outside ? SlipClass::kOtherSymbol : SlipClass::kLookAlike);
  return 1;
}

int Copier::ValueSlip(SlipClass k) {
  const auto cell = PickCell();
  if (!cell) return 0;
  const auto [r, c] = *cell;
  const Sexagesimal& v = *At(r, c).value;
  std::optional<Changed> ch;
  switch (k) {
    case SlipClass::kTransposition:
      ch = Transposed(v, hand_, rng_);
      break;
    case SlipClass::kPlaceDropped:
      ch = PlaceDropped(v, rng_);
      break;
    case SlipClass::kPlaceAdded:
      ch = PlaceAdded(v, rng_);
      break;
    case SlipClass::kPlaceShifted:
      ch = PlaceShifted(v, rng_);
      break;
    default: {
      const int sign = rng_.Sign();
      ch = Added(v, Sexagesimal::FromUnits(sign, v.places()),
                 sign > 0 ? "+1 in the last place" : "-1 in the last place");
    }
  }
  if (!ch) return 0;
  SetValue(r, c, *ch, k);
  return 1;
}

int Copier::Repetition() {
  const auto cell = PickCell();
  if (!cell || Rows() < 2) return 0;
  const auto [r, c] = *cell;
  const bool above = r > 0 && (r + 1 >= Rows() || rng_.Chance(0.6));
  const int from = above ? r - 1 : r + 1;
  const Cell& source = Exemplar(from, c);
  if (source.raw == At(r, c).raw) return 0;
  Slip s = Base(SlipClass::kRepetition, r, copy_.text.columns[static_cast<std::size_t>(c)].name);
  s.detail = above ? "the entry of the row above" : "the entry of the row below";
  SetCell(r, c, source, std::move(s));
  return 1;
}

int Copier::Unreadable(SlipClass k) {
  const auto cell = PickCell();
  if (!cell) return 0;
  const auto [r, c] = *cell;
  Cell out = At(r, c);
  out.value.reset();
  Slip s = Base(k, r, copy_.text.columns[static_cast<std::size_t>(c)].name);
  if (k == SlipClass::kPartlyIllegible && out.places > 0) {
    s.place = rng_.Int(0, out.places);
    out.raw = PartlyIllegible(*At(r, c).value, s.place);
    out.state = CellState::kPartial;
  } else {
    if (k == SlipClass::kPartlyIllegible) s.slip = SlipClass::kIllegible;
    out.raw = k == SlipClass::kBlank ? "_" : "?";
    out.state = k == SlipClass::kBlank ? CellState::kBlank : CellState::kIllegible;
  }
  SetCell(r, c, std::move(out), std::move(s));
  return 1;
}

std::string Copier::RowText(int r) const {
  const Row& row = copy_.text.rows[static_cast<std::size_t>(r)];
  std::string out = row.argument.raw;
  for (const auto& cell : row.cells) out += " | " + cell.raw;
  return out;
}

int Copier::RowSlip(SlipClass k) {
  if (Rows() < 3) return 0;
  for (int attempt = 0; attempt < 20; ++attempt) {
    const int r = rng_.Int(0, Rows() - 1);
    if (slipped_rows_.count(r) || row_op_rows_.count(r)) continue;
    Slip s = Base(k, r, "");
    s.before = RowText(r);
    s.after = k == SlipClass::kRowOmitted ? "" : s.before;
    Record(std::move(s), r);
    row_op_rows_.insert(r);
    row_ops_.push_back({r, k});
    return k == SlipClass::kRowOmitted ? Columns() : 1;
  }
  return 0;
}

int Copier::Argument() {
  for (int attempt = 0; attempt < 20; ++attempt) {
    const int r = rng_.Int(0, Rows() - 1);
    Cell& arg = copy_.text.rows[static_cast<std::size_t>(r)].argument;
    if (row_op_rows_.count(r) || !arg.value || touched_.count({r, -1})) continue;
    const bool outside = rng_.Chance(options_.share_outside_list);
    const auto ch = SymbolSlip(*arg.value, hand_, outside, rng_);
    if (!ch) continue;
    Slip s = Base(SlipClass::kArgumentMiswritten, r, "@argument");
    s.place = ch->place;
    s.pair = ch->pair;
    s.listed = ch->listed;
    s.detail = ch->detail;
    s.before = arg.raw;
    arg.value = ch->value;
    arg.raw = ch->value.ToString();
    s.after = arg.raw;
    touched_.insert({r, -1});
    Record(std::move(s), r);
    return 1;
  }
  return 0;
}

void Copier::ApplyRowOps() {
  std::sort(row_ops_.begin(), row_ops_.end(),
            [](const auto& a, const auto& b) { return a.first > b.first; });
  auto& rows = copy_.text.rows;
  auto& origin = copy_.origin;
  for (const auto& [r, k] : row_ops_) {
    const auto at = static_cast<std::ptrdiff_t>(r);
    if (k == SlipClass::kRowOmitted) {
      rows.erase(rows.begin() + at);
      origin.erase(origin.begin() + at);
    } else {
      rows.insert(rows.begin() + at + 1, rows[static_cast<std::size_t>(r)]);
      origin.insert(origin.begin() + at + 1, origin[static_cast<std::size_t>(r)]);
    }
  }
  // Each slip's row in the copy: earlier omissions pull it up, duplications push it down.
  for (std::size_t i = 0; i < slips_.size(); ++i) {
    const int r = slip_rows_[i];
    int post = r;
    for (const auto& [q, k] : row_ops_) {
      if (q < r) post += k == SlipClass::kRowOmitted ? -1 : 1;
    }
    if (slips_[i].slip == SlipClass::kRowOmitted) post = -1;
    if (slips_[i].slip == SlipClass::kRowDuplicated) post += 1;
    slips_[i].copy_row = post;
  }
}

}  // namespace apograph::synth::internal
