#pragma once
/// The estimate stage's tables (schema/003_estimate.sql): catalog rows the
/// editor adds and stored identifications.

#include <cstdint>
#include <string>
#include <vector>

#include "estimate/catalog.hpp"
#include "estimate/identify.hpp"
#include "store/database.hpp"

namespace apograph::store {

/// Adds one attested value; returns its id.
std::int64_t AddCatalogEntry(Database& db, const estimate::CatalogEntry& entry);

/// Every attested value added to the database (origin "database #ID").
std::vector<estimate::CatalogEntry> CatalogEntries(Database& db);

/// The whole catalog: the shipped file's rows, then the database's.
std::vector<estimate::CatalogEntry> LoadCatalog(Database& db);

/// What identify found for one column of one witness's table.
struct IdentifyRecord {
  std::string table_id;
  std::string siglum;
  int revision = 1;
  std::string column;
  estimate::Identification identification;
};

/// Stores the runs (each with its ranked candidates) in one transaction.
void SaveIdentifications(Database& db, const std::vector<IdentifyRecord>& records);

/// Number of stored identify runs (for tests and summaries).
std::int64_t CountIdentifyRuns(Database& db);

}  // namespace apograph::store
