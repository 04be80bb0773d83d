#pragma once
/// What the batch forms of the per-table commands share (`identify --all`,
/// `fit --all`, `check --all`, `errors --all`, each also `--work W`): the
/// transcriptions in scope, a progress bar on a terminal, and output that
/// streams (CSV rows and JSON lines are written as each table is done, so
/// memory holds only the tables in hand; support::RunInOrder does the work).
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include <boost/program_options.hpp>
#include <nlohmann/json_fwd.hpp>

#include "cli/command.hpp"
#include "store/edition_store.hpp"

namespace apograph::cli {

/// --all, --work and --threads as the batch forms take them.
struct BatchArgs {
  bool all = false;
  std::string work;
  int threads = 1;
  bool Batch() const { return all || !work.empty(); }
};

/// Adds --all, --work and --threads (default: the number of cores).
void AddBatchOptions(boost::program_options::options_description& options, BatchArgs& args);
/// Checks the batch options against --table/--witness (one or the other,
/// InputError otherwise) and --threads.
void CheckBatchOptions(const BatchArgs& args, bool single_given, const std::string& command);
/// The current revision of every transcription, or of those of one work's
/// tables; InputError naming --work when the work is unknown.
std::vector<store::RevisionSummary> BatchScope(store::Database& db, const BatchArgs& args);

/// A progress bar on standard error when it is a terminal (nothing otherwise).
class ProgressBar {
 public:
  ProgressBar(Io& io, std::string label) : io_(io), label_(std::move(label)) {}
  void Show(std::size_t done, std::size_t total);

 private:
  Io& io_;
  std::string label_;
};

/// Writes rows as they come: CSV (the header once, then each row) or aligned
/// text (kept until Finish: alignment needs every row, which are short
/// strings); JSON is written as one object per line (JSON lines).
class StreamingTable {
 public:
  StreamingTable(Io& io, Format format, std::vector<std::string> headers,
                 std::vector<bool> right_aligned = {});
  void Add(const std::vector<std::string>& row);
  void AddJson(const nlohmann::json& object);
  /// Text: prints the aligned rows. Call once at the end.
  void Finish();

 private:
  Io& io_;
  Format format_;
  std::vector<std::string> headers_;
  std::vector<bool> right_aligned_;
  std::vector<std::vector<std::string>> text_rows_;
  bool header_written_ = false;
};

}  // namespace apograph::cli
