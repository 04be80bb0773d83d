#pragma once
/// The answer key as JSON (field names documented in tests/synth/README.md).
/// Values are written in the trade's notation as text ("2;30") with their
/// decimal beside them where a benchmark compares numbers.

#include <nlohmann/json.hpp>

#include "tables.hpp"

namespace apograph::synth {

nlohmann::json ToJson(const Parameter& parameter);
nlohmann::json ToJson(const Function& function);
nlohmann::json ToJson(const ArgumentKey& argument);
/// One column: role, function, equivalents, form, practice, derived
/// definition, departures and per-row exact / computed / tabulated values.
nlohmann::json ToJson(const ColumnKey& column, const ArgumentKey& argument);
nlohmann::json ToJson(const TableKey& table);

}  // namespace apograph::synth
