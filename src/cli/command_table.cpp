#include "cli/command.hpp"

namespace apograph::cli {

// Each usage text lives beside its handler in cmd_<name>.cpp.
extern const char kInitUsage[];
extern const char kImportUsage[];
extern const char kExportUsage[];
extern const char kListUsage[];
extern const char kDemoUsage[];
extern const char kCheckUsage[];
extern const char kFormulaUsage[];
extern const char kFitUsage[];
extern const char kIdentifyUsage[];
extern const char kCatalogUsage[];
extern const char kErrorsUsage[];
extern const char kScreenUsage[];
extern const char kEmendationUsage[];
extern const char kCollateUsage[];
extern const char kStemmaUsage[];
extern const char kApparatusUsage[];
extern const char kReportUsage[];
extern const char kServeUsage[];

const std::vector<Command>& Commands() {
  static const std::vector<Command> kCommands = {
      {"init", "Create or migrate an edition database", kInitUsage, RunInit},
      {"import", "Import transcriptions and CSV sheets (one or many) into the database",
       kImportUsage, RunImport},
      {"export", "Write a witness's table back as a transcription, CSV or JSON", kExportUsage,
       RunExport},
      {"list", "List works, tables and witnesses with cell counts", kListUsage, RunList},
      {"demo", "Run the whole pipeline on the bundled demo tradition", kDemoUsage, RunDemo},
      {"check", "Recompute every entry of a witness from a model", kCheckUsage, RunCheck},
      {"formula", "Save, show and list user formulas", kFormulaUsage, RunFormula},
      {"fit", "Estimate a model's parameters from a witness's entries", kFitUsage, RunFit},
      {"identify", "Rank models and computing practices that explain a column", kIdentifyUsage,
       RunIdentify},
      {"catalog", "List or add attested parameter values", kCatalogUsage, RunCatalog},
      {"errors", "Explain deviations: copyist's slip or author's inaccuracy", kErrorsUsage,
       RunErrors},
      {"screen", "Find suspect entries without a model", kScreenUsage, RunScreen},
      {"emendation", "The editor's decisions: accept, reject, override, conjecture, undo, log",
       kEmendationUsage, RunEmendation},
      {"collate", "Align the witnesses of a table and list their readings", kCollateUsage,
       RunCollate},
      {"stemma", "Work out which witness copied which", kStemmaUsage, RunStemma},
      {"apparatus", "Write the edited table with its apparatus of variants", kApparatusUsage,
       RunApparatus},
      {"report", "Report on a table or a work: everything found, with its evidence", kReportUsage,
       RunReport},
      {"serve", "Review findings and decide them in a browser (local, with a token)", kServeUsage,
       RunServe},
  };
  return kCommands;
}

}  // namespace apograph::cli
