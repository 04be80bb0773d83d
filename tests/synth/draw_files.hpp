#pragma once
/// Writing a draw to a folder, as `synth_draw` does: one transcription per
/// witness (`SIGLUM.apo`, every table of the work), one CSV sheet per
/// witness and table (`SIGLUM-TABLE.csv`, in a drawn messy style) and the
/// answer key `truth.json` (the tradition key, plus `seed`, `kind` and
/// `sheets[{file, witness, table, ...sheet key}]`).

#include <cstdint>
#include <filesystem>
#include <string>

#include <nlohmann/json.hpp>

#include "copying.hpp"
#include "tradition.hpp"

namespace apograph::synth {

/// A one-witness draw for table benchmarks: the author's table and one
/// copy of it (siglum A) made from the archetype under `hand` with
/// `copy.rate` (0: the author's table itself).
Tradition DrawTableWitness(Rng& rng, const TableOptions& table, const Hand& hand,
                           const CopyOptions& copy);

struct DrawFilesOptions {
  bool csv = true;                 ///< write the sheets
  std::string kind = "tradition";  ///< recorded in truth.json
};

/// Writes the draw into `dir` (created if missing); the files' text is a
/// function of the tradition and of `rng` (sheet styles) only. Returns the
/// key written as truth.json.
nlohmann::json WriteDraw(const std::filesystem::path& dir, const Tradition& tradition,
                         std::uint64_t seed, Rng& rng, const DrawFilesOptions& options = {});

/// Every witness's transcription file text (with a banner comment saying
/// the data are invented and how to make them again).
std::string WitnessFile(const Tradition& tradition, int node, std::uint64_t seed);

}  // namespace apograph::synth
