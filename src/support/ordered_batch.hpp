#pragma once
/// Batch work over many items (tables, witnesses) on a few threads, with the
/// results handed back in order on the calling thread and memory bounded by
/// a window of items in hand: what every `--all` command runs on, so that
/// 50,000 tables cost no more memory than a window of them.
///
///     support::RunInOrder<Transcription, Identification>(
///         items.size(), {.threads = 2},
///         [&](std::size_t i) { return store::Load(db, ...); },   // calling thread
///         [&](const Transcription& t) { return Identify(t, ...); },  // any thread
///         [&](std::size_t i, Transcription&& t, Identification&& r) { print; save; },
///         [&](std::size_t done, std::size_t total) { progress bar; });
///
/// `load` and `deliver` run on the calling thread only (a database connection
/// is not shared between threads); `work` must not touch shared state.
#include <algorithm>
#include <atomic>
#include <cstddef>
#include <exception>
#include <functional>
#include <mutex>
#include <optional>
#include <thread>
#include <vector>

namespace apograph::support {

struct BatchOptions {
  unsigned threads = 1;
  /// Items loaded and worked on at once (0: 8 per thread). Judgement: large
  /// enough that a slow item rarely leaves a thread idle at the end of a
  /// window, small enough that a window of identifications (a few MiB
  /// each) stays far below the memory goal.
  std::size_t window = 0;
};

template <class Input, class Result>
void RunInOrder(std::size_t count, const BatchOptions& options,
                const std::function<Input(std::size_t)>& load,
                const std::function<Result(const Input&)>& work,
                const std::function<void(std::size_t, Input&&, Result&&)>& deliver,
                const std::function<void(std::size_t, std::size_t)>& progress = {}) {
  const unsigned threads = std::max(1u, options.threads);
  const std::size_t window = options.window ? options.window : 8 * std::size_t{threads};
  std::vector<std::optional<Input>> inputs;
  std::vector<std::optional<Result>> results;
  for (std::size_t first = 0; first < count; first += window) {
    const std::size_t n = std::min(window, count - first);
    inputs.assign(n, std::nullopt);
    results.assign(n, std::nullopt);
    for (std::size_t k = 0; k < n; ++k) inputs[k].emplace(load(first + k));
    std::atomic<std::size_t> next{0};
    std::exception_ptr failure;
    std::mutex failure_mutex;
    auto worker = [&] {
      for (std::size_t k = next++; k < n; k = next++) {
        try {
          results[k].emplace(work(*inputs[k]));
        } catch (...) {  // rethrown on the calling thread below, the first one wins
          const std::lock_guard lock(failure_mutex);
          if (!failure) failure = std::current_exception();
          next = n;
        }
      }
    };
    std::vector<std::thread> pool;
    for (unsigned t = 1; t < std::min<std::size_t>(threads, n); ++t) pool.emplace_back(worker);
    worker();
    for (auto& t : pool) t.join();
    if (failure) std::rethrow_exception(failure);
    for (std::size_t k = 0; k < n; ++k) {
      deliver(first + k, std::move(*inputs[k]), std::move(*results[k]));
      inputs[k].reset();
      results[k].reset();
    }
    if (progress) progress(first + n, count);
  }
}

}  // namespace apograph::support
