#pragma once
// Internal to tests/synth: one copy being made (copier.cpp, copier_runs.cpp).

#include <set>
#include <utility>
#include <vector>

#include "copying.hpp"
#include "slip_ops.hpp"

namespace apograph::synth::internal {

class Copier {
 public:
  Copier(const TableText& exemplar, const Hand& hand, const CopyOptions& options, Rng& rng);
  /// Draws slips until the drawn number of entries is corrupted.
  TableText Run();
  std::vector<Slip>& slips() { return slips_; }

 private:
  int Rows() const { return static_cast<int>(copy_.text.rows.size()); }
  int Columns() const { return static_cast<int>(copy_.text.columns.size()); }
  Cell& At(int r, int c) {
    return copy_.text.rows[static_cast<std::size_t>(r)].cells[static_cast<std::size_t>(c)];
  }
  const Cell& Exemplar(int r, int c) const {
    return exemplar_.text.rows[static_cast<std::size_t>(r)].cells[static_cast<std::size_t>(c)];
  }
  bool Free(int r, int c) const;
  bool Readable(int r, int c) {
    return At(r, c).state == CellState::kRead && At(r, c).value.has_value();
  }
  std::optional<std::pair<int, int>> PickCell();
  Slip Base(SlipClass k, int r, const std::string& column) const;
  void Record(Slip slip, int row);
  void SetCell(int r, int c, Cell cell, Slip slip);
  void SetValue(int r, int c, const Changed& changed, SlipClass k, int run = -1);
  std::string RowText(int r) const;

  int Draw(SlipClass k, int remaining);
  int Symbol(bool outside);
  int ValueSlip(SlipClass k);
  int Repetition();
  int Unreadable(SlipClass k);
  int RowSlip(SlipClass k);
  int Argument();
  // Runs over consecutive rows of one column (copier_runs.cpp).
  int EyeSkip(int remaining);
  int ConstantRun(int remaining);
  int SystematicRun(SlipClass k, int remaining);
  std::pair<int, int> RunRows(int remaining, bool at_start);
  void ApplyRowOps();

  TableText copy_;
  const TableText& exemplar_;
  Hand hand_;
  const CopyOptions& options_;
  Rng& rng_;
  std::set<std::pair<int, int>> touched_;  // cells with a slip of this copy
  std::set<int> slipped_rows_;             // rows with any slip (no row slip there)
  std::set<int> row_op_rows_;              // rows omitted or duplicated (no slip there)
  std::vector<std::pair<int, SlipClass>> row_ops_;
  std::vector<Slip> slips_;
  std::vector<int> slip_rows_;  // row of each slip before the row slips
  int runs_ = 0;
};

}  // namespace apograph::synth::internal
