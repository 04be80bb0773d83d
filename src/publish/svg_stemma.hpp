#pragma once
/// The stemma drawn as inline SVG by the project (no Graphviz needed):
/// the archetype on top, witnesses as labelled boxes, lost copies as small
/// circles, bootstrap support on the branches, and contamination as dashed
/// arrows from the relative a witness follows in part of the table.

#include <string>

#include "lineage/lineage.hpp"

namespace apograph::publish {

/// One stemma with the report's copies and contamination; an empty string
/// when the report has no stemma. `id` makes the drawing's internal ids
/// unique in a page holding several stemmata.
std::string StemmaSvg(const lineage::LineageReport& lineage, const std::string& id = "stemma");

}  // namespace apograph::publish
