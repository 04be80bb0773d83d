#pragma once
/// What `apograph errors` prints for one witness: text, one JSON object, or
/// CSV rows (one per cell of each finding). Shared by the one-table and the
/// batch forms of the command.

#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "cli/command.hpp"
#include "deviation/explain.hpp"
#include "pipeline/reference.hpp"
#include "pipeline/witness_findings.hpp"

namespace apograph::cli {

/// The references in a line: "solar-eccentric e=2.5 (2;30)", with how each
/// was found and the practice when it is not plain rounding.
std::string ModelText(const std::vector<pipeline::ColumnReference>& refs, const Transcription& t);

/// One witness's findings, references and the guard's verdicts (README,
/// "errors --format json").
nlohmann::json ErrorsJson(double tolerance, const Transcription& t,
                          const std::vector<pipeline::ColumnReference>& refs,
                          const pipeline::WitnessFindings& explained);

/// The CSV columns of CsvRows.
extern const std::vector<std::string> kCsvHeaders;

/// One CSV row per cell of each finding.
std::vector<std::vector<std::string>> CsvRows(const std::vector<deviation::Finding>& findings);

/// The text form: the identified references (when `with_references`), a
/// line per finding, and each refused reference with the model-free screen.
void PrintText(const Transcription& t, const std::vector<pipeline::ColumnReference>& refs,
               const pipeline::WitnessFindings& explained, bool with_references, Io& io);

}  // namespace apograph::cli
