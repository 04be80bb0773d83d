#include "options.hpp"

#include <functional>
#include <utility>

namespace apograph::synth {
namespace {

using Setter = std::function<void(TraditionOptions&, double)>;

#define SYNTH_TABLE(field)                                            \
  {                                                                   \
#field, [](TraditionOptions & o, double v) { o.table.field = v; } \
  }
#define SYNTH_COPY(field)                                            \
  {                                                                  \
#field, [](TraditionOptions & o, double v) { o.copy.field = v; } \
  }
#define SYNTH_TRADITION(field)                                  \
  {                                                             \
#field, [](TraditionOptions & o, double v) { o.field = v; } \
  }

const std::vector<std::pair<std::string, Setter>>& Setters() {
  static const std::vector<std::pair<std::string, Setter>> kSetters = {
      SYNTH_TABLE(share_unexplained_table),
      SYNTH_TABLE(share_nonround),
      SYNTH_TABLE(share_attested),
      SYNTH_TABLE(share_truncation),
      SYNTH_TABLE(share_grid),
      SYNTH_TABLE(share_round_nodes),
      SYNTH_TABLE(share_full_range),
      SYNTH_TABLE(share_signed),
      SYNTH_TABLE(share_displaced),
      SYNTH_TABLE(share_negated),
      SYNTH_TABLE(share_double_argument),
      SYNTH_TABLE(share_derived),
      SYNTH_TABLE(share_derived_exact),
      SYNTH_TABLE(share_derived_extra_place),
      SYNTH_TABLE(share_derived_divided),
      SYNTH_TABLE(share_derived_span),
      SYNTH_TABLE(share_sum_exact),
      SYNTH_TABLE(departure_rate),
      SYNTH_TABLE(share_departure_two),
      {"departures_in_derived",
       [](TraditionOptions& o, double v) { o.table.departures_in_derived = v != 0; }},
      SYNTH_TABLE(share_unexplained_column),
      SYNTH_TABLE(share_irregular_mean_motion),
      SYNTH_TABLE(share_addition),
      SYNTH_TABLE(share_from_entries),
      {"max_rows", [](TraditionOptions& o, double v) { o.table.max_rows = static_cast<int>(v); }},
      SYNTH_COPY(rate),
      SYNTH_COPY(share_outside_list),
      SYNTH_COPY(share_systematic),
      SYNTH_COPY(share_run_at_start),
      {"max_run", [](TraditionOptions& o, double v) { o.copy.max_run = static_cast<int>(v); }},
      {"witnesses", [](TraditionOptions& o, double v) { o.witnesses = static_cast<int>(v); }},
      {"tables", [](TraditionOptions& o, double v) { o.tables = static_cast<int>(v); }},
      SYNTH_TRADITION(manuscript_rate_min),
      SYNTH_TRADITION(manuscript_rate_max),
      SYNTH_TRADITION(print_rate_min),
      SYNTH_TRADITION(print_rate_max),
      SYNTH_TRADITION(edition_rate_min),
      SYNTH_TRADITION(edition_rate_max),
      SYNTH_TRADITION(recognition_rate_min),
      SYNTH_TRADITION(recognition_rate_max),
      SYNTH_TRADITION(share_copy_of_surviving),
      SYNTH_TRADITION(share_new_lost),
      SYNTH_TRADITION(share_contaminated),
      SYNTH_TRADITION(share_between_tables),
      SYNTH_TRADITION(share_corrector),
      SYNTH_TRADITION(corrector_share_min),
      SYNTH_TRADITION(corrector_share_max),
      SYNTH_TRADITION(share_with_prints),
      SYNTH_TRADITION(share_with_editions),
      SYNTH_TRADITION(share_edition_recomputed),
      SYNTH_TRADITION(share_edition_from_edition),
      SYNTH_TRADITION(share_edition_checks),
      SYNTH_TRADITION(share_digitised),
      SYNTH_TRADITION(share_script_change),
  };
  return kSetters;
}

#undef SYNTH_TABLE
#undef SYNTH_COPY
#undef SYNTH_TRADITION

}  // namespace

bool SetOption(TraditionOptions& options, const std::string& name, double value) {
  for (const auto& [n, set] : Setters()) {
    if (n != name) continue;
    set(options, value);
    return true;
  }
  return false;
}

std::vector<std::string> OptionNames() {
  std::vector<std::string> out;
  for (const auto& entry : Setters()) out.push_back(entry.first);
  return out;
}

}  // namespace apograph::synth
