#pragma once
/// How the program's heap gives memory back to the system.

namespace apograph {

/// Keeps up to kKeptFreeHeap bytes of freed memory at the top of each heap
/// for reuse rather than returning it to the system at once (glibc's
/// M_TRIM_THRESHOLD; elsewhere nothing is done). Called once by `main`
/// before any thread starts. Returns whether the setting was taken.
///
/// Why: a batch command loads, fits and drops one table after another on
/// several threads; glibc gave the freed top of each heap back after every
/// table (its default threshold is 128 KiB) and then page-faulted it in
/// afresh for the next one. `fit --all` over 1,000 tables of 360 rows spent
/// a quarter of its CPU time so (perf: page faults under the fit's entry
/// vectors; 0.48 -> 0.35 s user+system, 5 interleaved runs, peak memory
/// 28.4 -> 29.0 MiB; DEVELOPERS.md, issue 15).
bool KeepFreedMemory();

/// The amount kept: 1 MiB already gave the whole gain on the measurement
/// above; 4 MiB leaves room for wider tables (a judgement), and stays a
/// small bound on memory a process holds without using.
inline constexpr long kKeptFreeHeap = 4L << 20;

}  // namespace apograph
