#pragma once
/// The schema migrations compiled in from schema/NNN_*.sql (see
/// schema/embed_schema.cmake). Version N is recorded as PRAGMA user_version.

#include <string>
#include <vector>

namespace apograph::store {

struct Migration {
  int version;
  const char* file;
  const char* sql;
};

/// All migrations in ascending version order.
const std::vector<Migration>& Migrations();

/// The schema every migration leaves, in one script (schema/fresh.sql,
/// made by schema/make_fresh.sh); `version` is the last migration it holds.
/// A new database is created from it.
const Migration& FreshSchema();

}  // namespace apograph::store
