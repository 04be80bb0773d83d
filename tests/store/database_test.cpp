// The database connection's transactions and its idle statements (store/database.hpp).
#include <doctest/doctest.h>

#include <optional>

#include "cli_runner.hpp"
#include "store/database.hpp"

namespace store = apograph::store;

TEST_CASE("a transaction inside another is a savepoint the outer one can undo") {
  apograph::testing::ScratchDir dir("nested");
  store::Database db((dir / "n.sqlite").string());
  db.Execute("CREATE TABLE t (x INTEGER)");
  {
    store::Transaction outer(db);
    {
      store::Transaction inner(db);
      db.Execute("INSERT INTO t VALUES (1)");
      inner.Commit();
    }
    {
      store::Transaction dropped(db);  // rolled back to its savepoint
      db.Execute("INSERT INTO t VALUES (2)");
    }
    CHECK(db.InTransaction());
  }  // the outer one is not committed: nothing stays
  CHECK_FALSE(db.InTransaction());
  auto count = db.Prepare("SELECT count(*) FROM t");
  REQUIRE(count.Step());
  CHECK(count.Int(0) == 0);
  {
    store::Transaction outer(db);
    store::Transaction inner(db);
    db.Execute("INSERT INTO t VALUES (3)");
    inner.Commit();
    outer.Commit();
  }
  auto again = db.Prepare("SELECT sum(x) FROM t");
  REQUIRE(again.Step());
  CHECK(again.Int(0) == 3);
}

TEST_CASE("a statement given back and prepared again starts afresh, and two at once are distinct") {
  apograph::testing::ScratchDir dir("cache");
  store::Database db((dir / "c.sqlite").string());
  db.Execute("CREATE TABLE t (x INTEGER)");
  db.Execute("INSERT INTO t VALUES (1), (2), (3)");
  const char* const sql = "SELECT x FROM t WHERE x >= ?1 ORDER BY x";
  {
    auto first = db.Prepare(sql);
    first.Bind(1, 2);
    REQUIRE(first.Step());
    CHECK(first.Int(0) == 2);
    // The same SQL while the first is still stepping: its own statement.
    auto second = db.Prepare(sql);
    second.Bind(1, 1);
    REQUIRE(second.Step());
    CHECK(second.Int(0) == 1);
    REQUIRE(first.Step());
    CHECK(first.Int(0) == 3);
  }  // both go back half-stepped and bound
  auto again = db.Prepare(sql);
  // Bindings cleared: NULL compares as unknown, so no row.
  CHECK_FALSE(again.Step());
  again.Reset();
  again.Bind(1, 3);
  REQUIRE(again.Step());
  CHECK(again.Int(0) == 3);
  CHECK_FALSE(again.Step());
  // A write after statements went back idle is not blocked by them.
  store::Transaction tx(db);
  db.Execute("DELETE FROM t");
  tx.Commit();
}

TEST_CASE("a statement outliving its database is finalized, not given back") {
  apograph::testing::ScratchDir dir("outlive");
  std::optional<store::Statement> kept;
  {
    store::Database db((dir / "o.sqlite").string());
    db.Execute("CREATE TABLE t (x INTEGER)");
    kept.emplace(db.Prepare("SELECT count(*) FROM t"));
  }
  kept.reset();  // must neither crash nor leak (the ASan build checks)
  CHECK_FALSE(kept.has_value());
}

namespace {

/// Whether a second connection to `path` can commit a write now (it gives up
/// at once when the file is locked).
bool OtherCanWrite(const std::string& path) {
  const int saved = store::BusyTimeout();
  store::SetBusyTimeout(0);
  bool wrote = true;
  try {
    store::Database other(path);
    other.Execute("INSERT INTO t VALUES (9)");
  } catch (const store::StoreError&) {
    wrote = false;
  }
  store::SetBusyTimeout(saved);
  return wrote;
}

}  // namespace

TEST_CASE("a read transaction holds one view across statements until it ends") {
  apograph::testing::ScratchDir dir("read");
  const std::string path = (dir / "r.sqlite").string();
  store::Database db(path);
  db.Execute("CREATE TABLE t (x INTEGER)");
  db.Execute("INSERT INTO t VALUES (1)");
  {
    store::ReadTransaction read(db);
    CHECK(db.InTransaction());
    auto first = db.Prepare("SELECT count(*) FROM t");
    REQUIRE(first.Step());
    CHECK(first.Int(0) == 1);
    first.Reset();
    // The shared lock stays between statements: no writer commits meanwhile.
    CHECK_FALSE(OtherCanWrite(path));
    read.End();
    CHECK_FALSE(db.InTransaction());
    CHECK(OtherCanWrite(path));
  }
  {
    store::ReadTransaction dropped(db);  // ended by its destructor
    auto s = db.Prepare("SELECT count(*) FROM t");
    REQUIRE(s.Step());
  }
  CHECK_FALSE(db.InTransaction());
  CHECK(OtherCanWrite(path));
  {
    // Inside a write transaction it does nothing: the writer's changes stay
    // the writer's to commit.
    store::Transaction write(db);
    db.Execute("INSERT INTO t VALUES (2)");
    {
      store::ReadTransaction read(db);
      read.End();
    }
    CHECK(db.InTransaction());
    write.Commit();
  }
  auto total = db.Prepare("SELECT sum(x) FROM t");
  REQUIRE(total.Step());
  CHECK(total.Int(0) == 1 + 9 + 9 + 2);
}

TEST_CASE("a connection keeps at most 4 MiB of page cache (an import reuses its buffers)") {
  apograph::testing::ScratchDir dir("cache-size");
  store::Database db((dir / "c.sqlite").string());
  auto s = db.Prepare("PRAGMA cache_size");
  REQUIRE(s.Step());
  CHECK(s.Int(0) == -4096);  // negative: KiB (database.cpp says why this size)
}
