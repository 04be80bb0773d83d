#pragma once
/// The lineage report rendered once for everyone who shows it: the
/// `stemma` command's text and the editor's Markdown report use
/// DescribeLineage; the drawing files use ToDot (with contamination drawn
/// dashed from the second exemplar, titled from the work's title).

#include <cstddef>
#include <string>

#include "lineage/lineage.hpp"

namespace apograph::lineage {

struct DescribeOptions {
  bool markdown = false;  ///< fence the drawings for Markdown
};

/// Counts and root, each method's stemma with its groups and their support,
/// then copies, contamination, corrections and what is undecided.
std::string DescribeLineage(const LineageReport& report, const DescribeOptions& options = {});

/// "<the report's title>: stemma by maximum parsimony" ("Stemma by ..." when
/// it has none).
std::string StemmaTitle(const LineageReport& report, std::size_t result = 0);

/// Graphviz DOT of one method's stemma, contamination drawn dashed.
std::string ToDot(const LineageReport& report, std::size_t result = 0);

}  // namespace apograph::lineage
