#include "transcription/witness_attributes.hpp"

#include "support/input_error.hpp"

namespace apograph::transcription {

std::string ApplyWitnessAttribute(WitnessInfo& w, const AttributeAst& a, const ReadOptions& read) {
  if (a.name == "library") w.library = a.value;
  if (a.name == "shelfmark") w.shelfmark = a.value;
  if (a.name == "date") w.date = a.value;
  if (a.name == "note") w.note = a.value;
  if (a.name == "script") {
    std::string problem = CheckScriptName(a.value, read);
    if (!problem.empty()) return problem;
    w.script = a.value;
  }
  if (a.name == "kind") {
    if (!WitnessKindFromString(a.value))
      return "expected kind=manuscript, print or modern-edition, found " + QuotedText(a.value);
    w.kind = a.value;
  }
  return {};
}

}  // namespace apograph::transcription
