#include "cli/estimate_options.hpp"

#include <cmath>
#include <cstdlib>

#include <ostream>

#include "support/input_error.hpp"

namespace apograph::cli {

double ParseNumber(const std::string& option, const std::string& text) {
  if (auto v = Sexagesimal::Parse(text)) return v->ToDouble();
  // A plain decimal only: strtod alone would also take hexadecimal, blanks and "infinity".
  const bool decimal = text.find_first_not_of("0123456789+-.eE") == std::string::npos;
  char* end = nullptr;
  const double d = std::strtod(text.c_str(), &end);
  if (decimal && !text.empty() && end && *end == '\0' && std::isfinite(d)) return d;
  throw InputError::ForOption(option,
                              ExpectedFound("a number such as 2;4,48 or 2.08", "'" + text + "'"));
}

pipeline::ModelLibrary LoadModels(store::Database& db, Io& io) {
  pipeline::ModelLibrary lib = pipeline::LoadModelLibrary(db);
  for (const auto& s : lib.skipped) io.err << "warning: " << s << "\n";
  return lib;
}

}  // namespace apograph::cli
