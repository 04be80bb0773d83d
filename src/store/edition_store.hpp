#pragma once
/// The edition database seen as plain values: import transcriptions as
/// revisions, load any revision back, list what is there.
///
/// Every later stage reads its input through this header (never through
/// SQL): `LoadTable()` gives all current transcriptions of a table,
/// `Load()` one witness's copy (current or an earlier revision).
///
/// Revisions: importing a transcription whose content differs from its
/// current revision (Transcription::SameContent) adds revision N+1 with its
/// own layout, cells, metadata and source text; an unchanged one adds
/// nothing. Nothing is overwritten, so every revision stays loadable.

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "edition/transcription.hpp"
#include "store/database.hpp"

namespace apograph::store {

/// What an import did with one table of one witness.
struct TableImport {
  std::string table_id;
  std::string siglum;
  std::string source_file;
  int revision = 0;      ///< the current revision after the import
  bool changed = false;  ///< false: identical to the current revision, nothing added
  std::size_t rows = 0;
  std::size_t cells = 0;  ///< value cells (argument cells not counted)
};

struct ImportResult {
  std::vector<TableImport> tables;  ///< in the order given
  std::size_t cells_written = 0;    ///< value and argument cells actually inserted
  /// A work's, table's or witness's attribute that this import changed
  /// (library, date, script, title ...): said once per change, naming the
  /// file that brought it.
  std::vector<Diagnostic> warnings;
};

/// Imports every transcription in ONE transaction: on any error (an
/// InputError for inconsistent input, a StoreError from the database)
/// nothing is written. Checks that each row has one cell per column, that a
/// table keeps its work, and that no (table, witness) pair occurs twice in
/// one import. Descriptive rows (work, table, witness) take the latest
/// non-empty values: an attribute not given (empty) keeps the value in the
/// database, and the transcription's new revision records it too (so a CSV
/// sheet imported again without its witness's date is unchanged); a value
/// that differs from the one stored replaces it with a warning in
/// ImportResult::warnings, and the transcription gets a new revision.
ImportResult Import(Database& db, const std::vector<Transcription>& tables);

/// Reconstructs one witness's copy of a table: the current revision, or
/// revision `revision` (1-based). The result is SameContent with what was
/// imported, with cell provenance (line, column), source_file and
/// source_text as stored. Row::line is the line of the row's argument cell.
/// Throws InputError when there is no such transcription or revision.
Transcription Load(Database& db, const std::string& table_id, const std::string& siglum,
                   std::optional<int> revision = std::nullopt);

/// All current transcriptions of a table, ordered by siglum.
std::vector<Transcription> LoadTable(Database& db, const std::string& table_id);

/// The sigla of the witnesses that have a transcription of a table, sorted.
std::vector<std::string> Sigla(Database& db, const std::string& table_id);

/// The ids of the tables of a work, sorted.
std::vector<std::string> TablesOfWork(Database& db, const std::string& work_id);

/// The number of the current revision of a transcription, 0 when there is none.
int CurrentRevision(Database& db, const std::string& table_id, const std::string& siglum);

/// True when the database holds a transcription of this table by this witness.
bool HasTranscription(Database& db, const std::string& table_id, const std::string& siglum);

struct WorkSummary {
  WorkInfo work;
  int tables = 0;
  int witnesses = 0;       ///< distinct witnesses with a transcription of one of its tables
  std::int64_t cells = 0;  ///< current value cells over all its tables and witnesses
};

struct TableSummary {
  std::string id;
  std::string work_id;
  std::string title;
  std::string kind;
  int witnesses = 0;
  std::int64_t cells = 0;
};

struct WitnessSummary {
  WitnessInfo witness;
  int tables = 0;
  std::int64_t cells = 0;
};

/// One revision of a transcription (ListRevisions), or the current revision
/// with the number of revisions (ListTranscriptions).
struct RevisionSummary {
  std::string table_id;
  std::string siglum;
  int number = 0;
  int revisions = 0;  ///< how many revisions the transcription has
  std::int64_t rows = 0;
  std::int64_t cells = 0;
  std::string imported_at;  ///< UTC, ISO 8601
  std::string source_file;
};

std::vector<WorkSummary> ListWorks(Database& db);
/// Tables of every work, or of one work.
std::vector<TableSummary> ListTables(Database& db, const std::optional<std::string>& work_id = {});
/// Every witness, or those with a transcription of one table.
std::vector<WitnessSummary> ListWitnesses(Database& db,
                                          const std::optional<std::string>& table_id = {});
/// The current revision of every transcription (optionally of one table).
std::vector<RevisionSummary> ListTranscriptions(Database& db,
                                                const std::optional<std::string>& table_id = {});
/// Every revision (optionally of one table, optionally of one witness), oldest first.
std::vector<RevisionSummary> ListRevisions(Database& db,
                                           const std::optional<std::string>& table_id = {},
                                           const std::optional<std::string>& siglum = {});

}  // namespace apograph::store
