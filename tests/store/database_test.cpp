// The database connection's transactions (store/database.hpp).
#include <doctest/doctest.h>

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
