#pragma once
/// The answer key of a tradition as JSON (fields in tests/synth/README.md):
/// the tables' keys, the true tree (Newick with lost nodes), every node with
/// its slips and corrections, the groups, direct copies, contaminated
/// witnesses and correctors.

#include <nlohmann/json.hpp>

#include "copying.hpp"
#include "tradition.hpp"

namespace apograph::synth {

nlohmann::json ToJson(const Slip& slip);
nlohmann::json TraditionJson(const Tradition& tradition);

}  // namespace apograph::synth
