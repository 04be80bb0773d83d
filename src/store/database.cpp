#include "store/database.hpp"

#include <sqlite3.h>

#include <algorithm>
#include <atomic>
#include <unordered_map>

#include "store/schema.hpp"

namespace apograph::store {
namespace {

std::atomic<int> busy_timeout_ms{5000};

/// SQLite's message, or for a lock held by someone else what to do about it.
std::string Reason(sqlite3* db, int code) {
  if (!db) return "out of memory";
  const int primary = code & 0xFF;
  if (primary == SQLITE_BUSY || primary == SQLITE_LOCKED) {
    const int ms = busy_timeout_ms.load();
    return std::string(sqlite3_errmsg(db)) + ": another process is using the database (" +
           "waited " + std::to_string(ms / 1000) + "." + std::to_string(ms % 1000 / 100) +
           " s); retry when it has finished, or wait longer with --wait SECONDS";
  }
  return sqlite3_errmsg(db);
}

[[noreturn]] void Fail(sqlite3* db, const std::string& what) {
  throw StoreError(what + ": " + Reason(db, db ? sqlite3_extended_errcode(db) : SQLITE_NOMEM));
}

}  // namespace

/// The idle statements of one connection, keyed by their SQL.
class StatementCache {
 public:
  /// Judgement: far more than the distinct queries of any one command
  /// (a few dozen), small enough that the prepared programs stay a few MiB.
  static constexpr std::size_t kMostIdle = 256;

  ~StatementCache() { Clear(); }

  sqlite3_stmt* Take(const std::string& sql) {
    auto it = idle_.find(sql);
    if (it == idle_.end()) return nullptr;
    sqlite3_stmt* stmt = it->second;
    idle_.erase(it);
    return stmt;
  }

  /// Keeps `stmt` for the next Prepare of `sql`, reset and unbound.
  void Give(std::string sql, sqlite3_stmt* stmt) {
    sqlite3_reset(stmt);
    sqlite3_clear_bindings(stmt);
    if (idle_.size() >= kMostIdle) {
      sqlite3_finalize(stmt);
      return;
    }
    idle_.emplace(std::move(sql), stmt);
  }

  void Clear() {
    for (auto& [sql, stmt] : idle_) sqlite3_finalize(stmt);
    idle_.clear();
  }

 private:
  std::unordered_multimap<std::string, sqlite3_stmt*> idle_;
};

void SetBusyTimeout(int milliseconds) { busy_timeout_ms.store(std::max(0, milliseconds)); }
int BusyTimeout() { return busy_timeout_ms.load(); }

Statement::Statement(sqlite3* db, std::string_view sql) : db_(db) {
  if (sqlite3_prepare_v2(db, sql.data(), static_cast<int>(sql.size()), &stmt_, nullptr) !=
      SQLITE_OK) {
    Fail(db, "preparing '" + std::string(sql.substr(0, 60)) + "'");
  }
}

Statement::~Statement() {
  if (!stmt_) return;
  if (auto cache = cache_.lock()) {
    cache->Give(std::move(sql_), stmt_);
    return;
  }
  sqlite3_finalize(stmt_);
}

Statement::Statement(Statement&& other) noexcept
    : db_(other.db_),
      stmt_(other.stmt_),
      cache_(std::move(other.cache_)),
      sql_(std::move(other.sql_)) {
  other.stmt_ = nullptr;
}

Statement& Statement::Bind(int index, std::int64_t value) {
  sqlite3_bind_int64(stmt_, index, value);
  return *this;
}

Statement& Statement::Bind(int index, double value) {
  sqlite3_bind_double(stmt_, index, value);
  return *this;
}

Statement& Statement::Bind(int index, std::string_view value) {
  sqlite3_bind_text(stmt_, index, value.data(), static_cast<int>(value.size()), SQLITE_TRANSIENT);
  return *this;
}

Statement& Statement::BindStatic(int index, std::string_view value) {
  sqlite3_bind_text(stmt_, index, value.data(), static_cast<int>(value.size()), SQLITE_STATIC);
  return *this;
}

Statement& Statement::BindStaticTerminated(int index, const std::string& value) {
  sqlite3_bind_text(stmt_, index, value.c_str(), -1, SQLITE_STATIC);
  return *this;
}

Statement& Statement::BindNull(int index) {
  sqlite3_bind_null(stmt_, index);
  return *this;
}

bool Statement::Step() {
  const int rc = sqlite3_step(stmt_);
  if (rc == SQLITE_ROW) return true;
  if (rc == SQLITE_DONE) return false;
  Fail(db_, "running statement");
}

void Statement::Run() {
  Step();
  Reset();
}

void Statement::RunKeepBindings() {
  const int rc = sqlite3_step(stmt_);
  if (rc != SQLITE_DONE && rc != SQLITE_ROW) {
    std::string msg = Reason(db_, sqlite3_extended_errcode(db_));
    sqlite3_reset(stmt_);
    throw StoreError("running statement: " + msg);
  }
  sqlite3_reset(stmt_);
}

void Statement::Reset() {
  sqlite3_reset(stmt_);
  sqlite3_clear_bindings(stmt_);
}

bool Statement::IsNull(int column) const {
  return sqlite3_column_type(stmt_, column) == SQLITE_NULL;
}
std::int64_t Statement::Int(int column) const { return sqlite3_column_int64(stmt_, column); }
double Statement::Real(int column) const { return sqlite3_column_double(stmt_, column); }

std::string Statement::Text(int column) const {
  const auto* p = sqlite3_column_text(stmt_, column);
  return p ? std::string(reinterpret_cast<const char*>(p),
                         static_cast<std::size_t>(sqlite3_column_bytes(stmt_, column)))
           : std::string();
}

std::string_view Statement::TextView(int column) const {
  const auto* p = sqlite3_column_text(stmt_, column);
  return p ? std::string_view(reinterpret_cast<const char*>(p),
                              static_cast<std::size_t>(sqlite3_column_bytes(stmt_, column)))
           : std::string_view();
}

std::optional<std::string> Statement::OptionalText(int column) const {
  if (IsNull(column)) return std::nullopt;
  return Text(column);
}

Database::Database(const std::string& path)
    : path_(path), cache_(std::make_shared<StatementCache>()) {
  if (sqlite3_open_v2(path.c_str(), &db_,
                      SQLITE_OPEN_READWRITE | SQLITE_OPEN_CREATE | SQLITE_OPEN_NOMUTEX,
                      nullptr) != SQLITE_OK) {
    std::string msg = db_ ? sqlite3_errmsg(db_) : "out of memory";
    sqlite3_close(db_);
    throw StoreError("cannot open database " + path + ": " + msg);
  }
  try {
    Configure();
  } catch (...) {
    // The destructor does not run for a half-built object: close here, or
    // a refused database (newer schema, not a database) leaks its handle.
    cache_->Clear();
    sqlite3_close_v2(db_);
    throw;
  }
}

void Database::Configure() {
  sqlite3_busy_timeout(db_, busy_timeout_ms.load());
  Execute("PRAGMA foreign_keys = ON");
  // Up to 4 MiB of page cache (memory only, safe). Measured on 1,000 CSV
  // sheets x 360 rows, 7 interleaved runs on the shared 2-core machine,
  // medians of user+system CPU: a fresh import 0.34 s with 32 MiB, 0.25 s
  // with 4 MiB; a second import into that 18 MB database 0.41 -> 0.36 s;
  // `fit --all` unchanged (reads go through the memory map below). Since a
  // revision's cells are one row (schema 014) an import writes mostly
  // overflow pages once; with a large cache every one of them was a fresh
  // buffer (a page fault each), with a small one spilled buffers are
  // reused. (With one row per table row, 32 MiB had measured better: the
  // B-tree's pages were rewritten many times.) The journal stays the
  // default rollback journal with synchronous=FULL: a commit is durable,
  // and new pages appended by an import are not copied into the journal
  // (WAL would write each page twice: measured a third slower, even with
  // synchronous=NORMAL). synchronous=OFF would save only the fsync of the
  // commit (about 0.1 s of wall time for a million cells) at the risk of a
  // corrupt file after a power loss: not worth it. (An import writes with
  // 1 MiB and puts this back after: ImportCache in edition_store.cpp.)
  Execute("PRAGMA cache_size = -4096");
  // Reads through a memory map of up to 256 MiB instead of a read() per
  // page: a batch job (fit --all over 1,000 tables) spent a fifth of its
  // time in the kernel copying pages (measured with perf); writes still go
  // through the journal as before.
  Execute("PRAGMA mmap_size = 268435456");
  Migrate();
}

Database::~Database() {
  cache_.reset();  // finalizes the idle statements; statements still out finalize themselves
  sqlite3_close_v2(db_);
}

Statement Database::Prepare(std::string_view sql) {
  std::string key(sql);
  if (sqlite3_stmt* stmt = cache_->Take(key)) return {db_, stmt, cache_, std::move(key)};
  Statement fresh(db_, sql);
  fresh.cache_ = cache_;
  fresh.sql_ = std::move(key);
  return fresh;
}

void Database::Execute(std::string_view sql) {
  char* err = nullptr;
  if (sqlite3_exec(db_, std::string(sql).c_str(), nullptr, nullptr, &err) != SQLITE_OK) {
    const int primary = sqlite3_extended_errcode(db_) & 0xFF;
    std::string msg = primary == SQLITE_BUSY || primary == SQLITE_LOCKED
                          ? Reason(db_, sqlite3_extended_errcode(db_))
                          : (err ? err : "unknown error");
    sqlite3_free(err);
    throw StoreError("database " + path_ + ": " + msg);
  }
}

std::int64_t Database::LastInsertId() const { return sqlite3_last_insert_rowid(db_); }

int Database::SchemaVersion() {
  auto s = Prepare("PRAGMA user_version");
  s.Step();
  return static_cast<int>(s.Int(0));
}

void Database::Migrate() {
  const int current = SchemaVersion();
  const auto& all = Migrations();
  if (!all.empty() && current > all.back().version) {
    throw StoreError("database " + path_ + " has schema version " + std::to_string(current) +
                     ", newer than this apograph (" + std::to_string(all.back().version) + ")");
  }
  if (all.empty() || all.back().version <= current) return;
  // Every pending migration in ONE transaction: a database is upgraded
  // whole or not at all, and a fresh one costs one commit (one fsync), not
  // one per migration (perf: the commits were half of creating a database,
  // which every import into a new file pays).
  Transaction t(*this);
  const Migration& fresh = FreshSchema();
  if (current == 0 && fresh.version == all.back().version && IsEmpty()) {
    // A new database from one script: running the 14 migrations took 12 ms
    // of CPU (`perf stat -r 30`, the sqlite3 shell), this script 5 ms, of
    // the 13 ms the shell itself takes; about 7 ms saved on every import
    // into a new file (0.21 s for 1,000 sheets). The same schema
    // (tests/store/migration_test.cpp).
    Execute(fresh.sql);
  } else {
    for (const auto& m : all) {
      if (m.version <= current) continue;
      Execute(m.sql);
    }
  }
  Execute("PRAGMA user_version = " + std::to_string(all.back().version));
  t.Commit();
}

bool Database::IsEmpty() {
  auto s = Prepare("SELECT count(*) FROM sqlite_master");
  s.Step();
  return s.Int(0) == 0;
}

bool Database::InTransaction() const { return sqlite3_get_autocommit(db_) == 0; }

Transaction::Transaction(Database& db) : db_(db) {
  if (!db_.InTransaction()) {
    db_.Execute("BEGIN IMMEDIATE");
    return;
  }
  static std::atomic<unsigned> counter{0};
  savepoint_ = "nested_" + std::to_string(++counter);
  db_.Execute("SAVEPOINT " + savepoint_);
}

Transaction::~Transaction() {
  if (done_) return;
  try {
    if (savepoint_.empty())
      db_.Execute("ROLLBACK");
    else
      db_.Execute("ROLLBACK TO " + savepoint_ + "; RELEASE " + savepoint_);
  } catch (const StoreError&) {  // a destructor must not throw; the outer step reports
  }
}

void Transaction::Commit() {
  db_.Execute(savepoint_.empty() ? "COMMIT" : "RELEASE " + savepoint_);
  done_ = true;
}

ReadTransaction::ReadTransaction(Database& db) : db_(db) {
  if (db_.InTransaction()) return;
  db_.Prepare("BEGIN").Run();
  open_ = true;
}

ReadTransaction::~ReadTransaction() {
  if (!open_) return;
  try {
    db_.Prepare("ROLLBACK").Run();  // nothing was written: ROLLBACK and COMMIT both just unlock
  } catch (const StoreError&) {     // a destructor must not throw; the outer step reports
  }
}

void ReadTransaction::End() {
  if (!open_) return;
  open_ = false;
  db_.Prepare("COMMIT").Run();
}

}  // namespace apograph::store
