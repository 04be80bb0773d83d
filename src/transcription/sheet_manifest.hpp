#pragma once
/// Many CSV sheets in one import: a manifest names each sheet and gives
/// what a sheet cannot say (work, witness, table attributes, the argument's
/// step), in the directive syntax of the transcription format
/// (grammar/transcription.ebnf, "Sheet manifests"). Example:
///
///     @work     lantern  title="The Lantern Tables"
///     @witness  K  library="Marrow Hall" date="c. 1420" script=hindu-arabic
///     @table    sun-eq  sheet=sun-eq.csv  title="Equation of the sun"
///     @argument anomaly unit=deg start=1 step=1
///     @table    mean-sun  sheet=mean-sun.csv  delimiter=";"
///     @argument days step=list
///
/// Without a manifest, `SheetsFromFiles` makes the same entries from file
/// names (the table id is the file name without its extension).

#include <string>
#include <string_view>
#include <vector>

#include "transcription/csv.hpp"

namespace apograph {

/// One sheet to read and everything it is read with.
struct SheetEntry {
  std::string path;    ///< relative paths are taken from the manifest's folder
  CsvOptions options;  ///< the common options, with the manifest's head, delimiter and join
};

/// Parses a manifest's text. `folder` is where relative sheet paths start
/// (the manifest's own folder); `common` gives the options every sheet
/// shares (places, joins, limits), which a manifest's `delimiter=` and
/// `join=` override for its table. Throws InputError positioned in the
/// manifest.
std::vector<SheetEntry> ParseSheetManifest(std::string_view text, const std::string& file,
                                           const std::string& folder, const CsvOptions& common);

/// Reads and parses a manifest file.
std::vector<SheetEntry> ReadSheetManifest(const std::string& path, const CsvOptions& common);

/// One entry per file, all sharing `common` (its head: witness, work and
/// attributes given once). The table id is `common.head.table_id` when
/// there is one file and it is given, else the file's name without its
/// extension, which must then be a safe id (InputError otherwise).
std::vector<SheetEntry> SheetsFromFiles(const std::vector<std::string>& files,
                                        const CsvOptions& common);

}  // namespace apograph
