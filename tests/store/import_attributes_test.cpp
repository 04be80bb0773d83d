// What an import does with attributes shared by every transcription of a
// witness, work or table: a change is said and gives a new revision; an
// attribute not given keeps the stored one. Also: ids checked by the store,
// argument lists stored, a second writer told what is going on.
#include <doctest/doctest.h>

#include "store/edition_store.hpp"
#include "store_test_util.hpp"

using apograph::Sexagesimal;
using apograph::Transcription;
namespace store = apograph::store;
using apograph::testing::MakeTranscription;
using apograph::testing::TempDb;

TEST_CASE("a later import that changes a witness's attributes warns and adds a revision") {
  TempDb tmp("attributes");
  store::Database db(tmp.path());
  Transcription t = MakeTranscription("sun-eq", "K");
  store::Import(db, {t});
  t.witness.library = "Harbour Hall";
  t.table_title = "Solar equation";
  const auto result = store::Import(db, {t});
  REQUIRE(result.tables.size() == 1);
  CHECK(result.tables[0].changed);
  CHECK(result.tables[0].revision == 2);
  REQUIRE(result.warnings.size() == 2);
  CHECK(result.warnings[0].Render() ==
        "sun-eq-K.apo: warning: table 'sun-eq': title changed from 'Equation of the sun' to "
        "'Solar equation' (earlier revisions keep the earlier value)");
  CHECK(result.warnings[1].Render() ==
        "sun-eq-K.apo: warning: witness 'K': library changed from 'Nordhafen, Town Library' to "
        "'Harbour Hall' (earlier revisions keep the earlier value)");
  CHECK(store::Load(db, "sun-eq", "K", 1).witness.library == "Nordhafen, Town Library");
  CHECK(store::Load(db, "sun-eq", "K").witness.library == "Harbour Hall");
}

TEST_CASE("an attribute not given keeps the stored one: a bare sheet imported again is unchanged") {
  TempDb tmp("attributes-kept");
  store::Database db(tmp.path());
  Transcription t = MakeTranscription("sun-eq", "K");
  store::Import(db, {t});
  Transcription bare = t;
  bare.witness = {};
  bare.witness.siglum = "K";
  bare.table_title.clear();
  bare.work.title.clear();
  const auto result = store::Import(db, {bare});
  CHECK_FALSE(result.tables.at(0).changed);
  CHECK(result.warnings.empty());
  CHECK(store::Load(db, "sun-eq", "K").witness.date == "c. 1420");
  // Another table of the same witness, given without attributes, gets them.
  const auto other = store::Import(db, {[&] {
                                     Transcription o = bare;
                                     o.table_id = "decl";
                                     return o;
                                   }()});
  CHECK(other.tables.at(0).changed);
  CHECK(store::Load(db, "decl", "K").witness.library == "Nordhafen, Town Library");
}

TEST_CASE("one import of many tables of a witness: its row read and written as each table says") {
  // The session writes a witness's row once for a run of tables that give
  // it alike; a table that gives it otherwise is still reconciled with the
  // row as the tables before left it, in order.
  TempDb tmp("attributes-batch");
  store::Database db(tmp.path());
  Transcription first = MakeTranscription("t1", "K");
  store::Import(db, {first});
  std::vector<Transcription> batch;
  for (const char* id : {"t2", "t3", "t4", "t5", "t6"}) batch.push_back(MakeTranscription(id, "K"));
  for (auto& t : batch) t.witness.library = "Harbour Hall";
  batch[2].witness = {};  // t4 gives the siglum alone: it takes what t2 and t3 left
  batch[2].witness.siglum = "K";
  batch[3].witness.library = "Bay Abbey";  // t5 changes it again, t6 back
  const auto result = store::Import(db, batch);
  REQUIRE(result.warnings.size() == 3);
  CHECK(result.warnings[0].Render() ==
        "t2-K.apo: warning: witness 'K': library changed from 'Nordhafen, Town Library' to "
        "'Harbour Hall' (earlier revisions keep the earlier value)");
  CHECK(result.warnings[1].Render() ==
        "t5-K.apo: warning: witness 'K': library changed from 'Harbour Hall' to 'Bay Abbey' "
        "(earlier revisions keep the earlier value)");
  CHECK(result.warnings[2].Render() ==
        "t6-K.apo: warning: witness 'K': library changed from 'Bay Abbey' to 'Harbour Hall' "
        "(earlier revisions keep the earlier value)");
  CHECK(store::Load(db, "t1", "K").witness.library == "Nordhafen, Town Library");
  CHECK(store::Load(db, "t3", "K").witness.library == "Harbour Hall");
  const Transcription t4 = store::Load(db, "t4", "K");
  CHECK(t4.witness.library == "Harbour Hall");
  CHECK(t4.witness.date == "c. 1420");  // kept from the row, not given by t4
  CHECK(store::Load(db, "t5", "K").witness.library == "Bay Abbey");
  CHECK(store::Load(db, "t6", "K").witness.library == "Harbour Hall");
  auto row = db.Prepare("SELECT library, date FROM witness WHERE siglum = 'K'");
  REQUIRE(row.Step());
  CHECK(row.Text(0) == "Harbour Hall");
  CHECK(row.Text(1) == "c. 1420");
}

TEST_CASE("the store refuses ids that could reach outside a folder, whoever built them") {
  TempDb tmp("ids");
  store::Database db(tmp.path());
  Transcription t = MakeTranscription("../x", "K");
  CHECK_THROWS_WITH_AS(store::Import(db, {t}),
                       "../x-K.apo: error: expected a table id of letters, digits, '-', '_' or '.' "
                       "(starting with a letter or digit, no '..', at most 64 characters), found "
                       "'../x'",
                       apograph::InputError);
  t = MakeTranscription("sun", "K");
  t.witness.script = "../../secret";
  CHECK_THROWS_WITH_AS(store::Import(db, {t}),
                       "sun-K.apo: error: expected a numeral script name, found '../../secret'",
                       apograph::InputError);
}

TEST_CASE("an argument declared as a list is stored and loaded as such") {
  TempDb tmp("listed");
  store::Database db(tmp.path());
  Transcription t = MakeTranscription("mean-sun", "K");
  t.argument.start.reset();
  t.argument.step.reset();
  t.argument.listed = true;
  store::Import(db, {t});
  const Transcription back = store::Load(db, "mean-sun", "K");
  CHECK(back.argument.listed);
  CHECK(back.SameContent(t));
}

TEST_CASE("a second writer is told that another process holds the database") {
  TempDb tmp("busy");
  store::Database first(tmp.path());
  const int before = store::BusyTimeout();
  store::SetBusyTimeout(100);
  store::Database second(tmp.path());
  store::Transaction holding(first);
  std::string message;
  try {
    store::Transaction t(second);
  } catch (const store::StoreError& e) {
    message = e.what();
  }
  store::SetBusyTimeout(before);
  CHECK(message ==
        "database " + tmp.path() +
            ": database is locked: another process is using the database (waited 0.1 s); retry "
            "when it has finished, or wait longer with --wait SECONDS");
}
