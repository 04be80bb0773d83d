#pragma once
/// Parameter values attested in the historical literature, to place an
/// estimate in its tradition: the file corpora/catalog/parameters.tsv
/// (shipped) plus rows the editor adds to the database (`apograph catalog
/// add`, stored by store/estimate_store.hpp).
///
/// File format: tab-separated, `#` starts a comment line, a header line
/// `kind applies_to value tradition source from_memory`, then one row per
/// value. `applies_to` lists model:parameter pairs separated by blanks
/// (`solar-eccentric:e solar-epicycle:r`); `value` is in trade notation;
/// `from_memory` is yes or no (yes: recalled, not read in the source).

#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "number/sexagesimal.hpp"

namespace apograph::estimate {

struct CatalogEntry {
  std::string kind;  ///< obliquity, solar-eccentricity, mean-motion, ...
  std::vector<std::pair<std::string, std::string>> applies_to;  ///< (model, parameter)
  Sexagesimal value;
  std::string tradition;
  std::string source;
  bool from_memory = false;
  std::string origin;  ///< "parameters.tsv:12" or "database #3"

  bool AppliesTo(const std::string& model, const std::string& param) const;
  std::string AppliesToText() const;
};

/// The shipped catalog file (APOGRAPH_DATA environment variable, else the
/// data folder compiled in) + "/catalog/parameters.tsv".
std::string DefaultCatalogPath();

/// Reads a catalog file; InputError with file, line and column for a bad row.
std::vector<CatalogEntry> ReadCatalogFile(const std::string& path);

/// Builds one entry from its fields as typed (command line); InputError
/// naming `option` for a bad value, an empty kind or source, or a
/// malformed applies_to.
CatalogEntry MakeCatalogEntry(const std::string& kind, const std::string& applies_to,
                              const std::string& value, const std::string& tradition,
                              const std::string& source, bool from_memory);

/// Parses "model:param model:param"; nullopt when malformed.
std::optional<std::vector<std::pair<std::string, std::string>>> ParseAppliesTo(
    const std::string& text);

/// An attested value near an estimate.
struct AttestedMatch {
  CatalogEntry entry;
  double distance = 0;     ///< attested - estimate
  double distance_se = 0;  ///< |distance| / standard error (infinity when the error is 0)
};

/// The `count` attested values for (model, param) nearest to `value`.
std::vector<AttestedMatch> NearestAttested(const std::vector<CatalogEntry>& catalog,
                                           const std::string& model, const std::string& param,
                                           double value, double stderr_, int count = 3);

}  // namespace apograph::estimate
