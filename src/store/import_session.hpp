#pragma once
/// An import in progress, table by table, in one transaction: what
/// `apograph import` uses so that a thousand sheets are never held in
/// memory at once (store::Import in edition_store.hpp is the same for a
/// list already read).

#include <memory>

#include "edition/transcription.hpp"
#include "store/database.hpp"
#include "store/edition_store.hpp"

namespace apograph::store {

/// An import in progress, one table at a time, in ONE transaction: a batch
/// of sheets need not be held in memory at once. Each Add() checks its
/// table as Import() does (and that no (table, witness) pair came earlier in
/// the session) and writes it; nothing is kept unless Commit() is reached
/// (destroying an uncommitted session rolls every table back).
class ImportSession {
 public:
  explicit ImportSession(Database& db);
  ~ImportSession();
  ImportSession(const ImportSession&) = delete;
  ImportSession& operator=(const ImportSession&) = delete;

  /// Throws InputError for an inconsistent table, StoreError from the
  /// database; the session must then be dropped (not committed).
  void Add(const Transcription& t);
  /// Commits; the tables in the order added, with the warnings.
  ImportResult Commit();

 private:
  struct State;
  std::unique_ptr<State> state_;
};

}  // namespace apograph::store
