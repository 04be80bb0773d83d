#pragma once
/// A thin RAII layer over sqlite3: the only place that includes sqlite3.h.
/// Stages never use it directly; the store's own files (edition_store.cpp,
/// and one file per later stage) do.

#include <cstdint>
#include <memory>
#include <optional>
#include <stdexcept>
#include <string>
#include <string_view>

struct sqlite3;
struct sqlite3_stmt;

namespace apograph::store {

/// A database failure (locked file, corrupt database, constraint broken).
class StoreError : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

/// How long a connection waits for another process's lock on the file
/// before it fails (milliseconds). 5,000 unless set, for every Database
/// opened after the call (`apograph --wait SECONDS`, `import --wait`).
/// Judgement: long enough for another command's commit, short enough that a
/// forgotten writer does not hang a script.
void SetBusyTimeout(int milliseconds);
int BusyTimeout();

class StatementCache;

/// One prepared statement; bind by 1-based index, step, read columns.
/// Made by Database::Prepare, which hands out a statement of the same SQL
/// prepared earlier when one is idle; on destruction it is reset and goes
/// back to its database's cache (or is finalized when the database is gone).
class Statement {
 public:
  Statement(sqlite3* db, std::string_view sql);
  ~Statement();
  Statement(const Statement&) = delete;
  Statement& operator=(const Statement&) = delete;
  Statement(Statement&& other) noexcept;

  Statement& Bind(int index, std::int64_t value);
  Statement& Bind(int index, int value) { return Bind(index, static_cast<std::int64_t>(value)); }
  Statement& Bind(int index, double value);
  Statement& Bind(int index, std::string_view value);
  Statement& Bind(int index, const char* value) { return Bind(index, std::string_view(value)); }
  Statement& Bind(int index, const std::string& value) {
    return Bind(index, std::string_view(value));
  }
  Statement& BindNull(int index);
  /// Binds text WITHOUT copying it: `value` must stay valid until the next
  /// Step()/Run()/Reset(). For hot loops that insert many rows.
  Statement& BindStatic(int index, std::string_view value);
  /// The same for a string with no NUL inside: SQLite then knows the text
  /// ends in one and reads it in place where a function or CHECK wants a C
  /// string (otherwise it copies each value to terminate it).
  Statement& BindStaticTerminated(int index, const std::string& value);
  template <typename T>
  Statement& Bind(int index, const std::optional<T>& value) {
    return value ? Bind(index, *value) : BindNull(index);
  }

  /// Advances; true while a row is available.
  bool Step();
  /// Runs a statement that returns no rows, then resets it for reuse.
  void Run();
  /// Like Run() but keeps the bindings: for hot loops that rebind every
  /// parameter of every row anyway.
  void RunKeepBindings();
  void Reset();

  bool IsNull(int column) const;
  std::int64_t Int(int column) const;
  double Real(int column) const;
  std::string Text(int column) const;
  /// The text of a column without copying it: valid until the next
  /// Step()/Reset(). For hot loops that decode what they read.
  std::string_view TextView(int column) const;
  std::optional<std::string> OptionalText(int column) const;

 private:
  friend class Database;
  Statement(sqlite3* db, sqlite3_stmt* stmt, std::weak_ptr<StatementCache> cache, std::string sql)
      : db_(db), stmt_(stmt), cache_(std::move(cache)), sql_(std::move(sql)) {}

  sqlite3* db_;
  sqlite3_stmt* stmt_ = nullptr;
  std::weak_ptr<StatementCache> cache_;  ///< where it returns to; empty: finalized
  std::string sql_;                      ///< its key in the cache
};

/// An open database with foreign keys on and the schema migrated. One
/// connection serves one thread at a time (opened without SQLite's mutex).
class Database {
 public:
  /// Opens (creating if needed) and applies pending migrations.
  explicit Database(const std::string& path);
  ~Database();
  Database(const Database&) = delete;
  Database& operator=(const Database&) = delete;

  Statement Prepare(std::string_view sql);
  void Execute(std::string_view sql);
  std::int64_t LastInsertId() const;
  int SchemaVersion();
  const std::string& path() const { return path_; }
  /// True inside BEGIN ... COMMIT (a Transaction is open).
  bool InTransaction() const;

 private:
  void Configure();
  void Migrate();
  /// True when the file holds no table, view, index or trigger yet.
  bool IsEmpty();
  sqlite3* db_ = nullptr;
  std::string path_;
  /// Idle prepared statements by SQL: a batch job loads a thousand tables
  /// with the same few queries, and preparing them (each expands the views
  /// it reads) was a tenth of `fit --all` (perf, 1,000 tables).
  std::shared_ptr<StatementCache> cache_;
};

/// BEGIN IMMEDIATE on construction; ROLLBACK unless Commit() was called.
/// Inside another Transaction it is a savepoint of it: Commit() keeps its
/// changes for the outer one to commit or roll back, so that a command can
/// hold a library step's writes until its own last step (writing an output
/// file) has succeeded.
class Transaction {
 public:
  explicit Transaction(Database& db);
  ~Transaction();
  Transaction(const Transaction&) = delete;
  Transaction& operator=(const Transaction&) = delete;
  void Commit();

 private:
  Database& db_;
  bool done_ = false;
  std::string savepoint_;  ///< empty for the outermost transaction
};

/// Several reads as one consistent view of the database: BEGIN (deferred:
/// the first read takes the shared lock) unless a transaction is open
/// already, in which case it does nothing. End() or the destructor ends it.
/// Why: outside a transaction every statement takes and drops the file lock
/// and revalidates the page cache; loading a transcription runs four
/// statements, and a batch over thousands of tables spent about 7% of its
/// time doing that (perf of `fit --all`, DEVELOPERS.md issue 15).
class ReadTransaction {
 public:
  explicit ReadTransaction(Database& db);
  ~ReadTransaction();
  ReadTransaction(const ReadTransaction&) = delete;
  ReadTransaction& operator=(const ReadTransaction&) = delete;
  /// Ends the read transaction (if this object opened it): the lock is
  /// dropped and later reads see what others have committed since.
  void End();

 private:
  Database& db_;
  bool open_ = false;
};

}  // namespace apograph::store
