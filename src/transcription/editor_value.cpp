#include "transcription/editor_value.hpp"

#include "support/input_error.hpp"
#include "transcription/syntax.hpp"

namespace apograph {
namespace {

[[noreturn]] void Refuse(const std::string& option, const std::string& text,
                         const std::string& message) {
  throw InputError::ForOption(option, "in the reading '" + text + "': " + message);
}

}  // namespace

std::string ParseEditorReading(const std::string& option, const std::string& text, int places) {
  transcription::ReadingInfo info;
  try {
    info = transcription::ParseReading(text, places, 0);
  } catch (const transcription::LineError& e) {
    Refuse(option, text, "at character " + std::to_string(e.offset + 1) + ": " + e.message);
  }
  if (info.state != CellState::kRead || !info.value) {
    Refuse(option, text, ExpectedFound("a value read in full", "'" + text + "'"));
  }
  if (info.value->places() != places) {
    Refuse(option, text,
           ExpectedFound("a value of " + std::to_string(places) + " places, as its column has",
                         std::to_string(info.value->places())));
  }
  return info.value->ToString();
}

}  // namespace apograph
