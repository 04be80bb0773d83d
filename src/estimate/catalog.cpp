#include "estimate/catalog.hpp"

#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <fstream>
#include <limits>
#include <sstream>

#include "support/data_dir.hpp"
#include "support/input_error.hpp"

namespace apograph::estimate {

bool CatalogEntry::AppliesTo(const std::string& model, const std::string& param) const {
  for (const auto& [m, p] : applies_to) {
    if (m == model && p == param) return true;
  }
  return false;
}

std::string CatalogEntry::AppliesToText() const {
  std::string s;
  for (const auto& [m, p] : applies_to) s += (s.empty() ? "" : " ") + m + ":" + p;
  return s;
}

std::string DefaultCatalogPath() { return DataDir() + "/catalog/parameters.tsv"; }

std::optional<std::vector<std::pair<std::string, std::string>>> ParseAppliesTo(
    const std::string& text) {
  std::vector<std::pair<std::string, std::string>> out;
  std::istringstream in(text);
  std::string word;
  while (in >> word) {
    const auto colon = word.find(':');
    if (colon == std::string::npos || colon == 0 || colon + 1 == word.size()) return std::nullopt;
    out.emplace_back(word.substr(0, colon), word.substr(colon + 1));
  }
  if (out.empty()) return std::nullopt;
  return out;
}

namespace {

std::vector<std::string> SplitTabs(const std::string& line) {
  std::vector<std::string> out;
  std::size_t start = 0;
  while (true) {
    const auto tab = line.find('\t', start);
    out.push_back(line.substr(start, tab == std::string::npos ? std::string::npos : tab - start));
    if (tab == std::string::npos) break;
    start = tab + 1;
  }
  return out;
}

/// 1-based column of field `i` in a tab-separated line.
int FieldColumn(const std::string& line, std::size_t i) {
  std::size_t pos = 0;
  for (std::size_t k = 0; k < i; ++k) pos = line.find('\t', pos) + 1;
  return static_cast<int>(pos) + 1;
}

InputError RowError(const std::string& path, int line_no, const std::string& line,
                    std::size_t field, const std::string& expected, const std::string& found) {
  Diagnostic d;
  d.where = {path, line_no, FieldColumn(line, field), line};
  d.message = ExpectedFound(expected, found);
  return InputError(d);
}

}  // namespace

std::vector<CatalogEntry> ReadCatalogFile(const std::string& path) {
  std::ifstream in(path);
  if (!in) throw InputError::ForFile(path, "cannot read the parameter catalog");
  std::vector<CatalogEntry> out;
  std::string line;
  int line_no = 0;
  bool header = false;
  const std::string file = path.substr(path.find_last_of('/') + 1);
  while (std::getline(in, line)) {
    ++line_no;
    if (!line.empty() && line.back() == '\r') line.pop_back();
    if (line.empty() || line[0] == '#') continue;
    const auto f = SplitTabs(line);
    if (!header) {
      if (f.empty() || f[0] != "kind")
        throw RowError(path, line_no, line, 0, "the header line starting 'kind'",
                       f.empty() ? "" : f[0]);
      header = true;
      continue;
    }
    if (f.size() != 6)
      throw RowError(path, line_no, line, std::min<std::size_t>(f.size(), 5),
                     "6 tab-separated fields", std::to_string(f.size()) + " fields");
    CatalogEntry e;
    e.kind = f[0];
    auto applies = ParseAppliesTo(f[1]);
    if (!applies)
      throw RowError(path, line_no, line, 1, "model:parameter pairs separated by blanks", f[1]);
    e.applies_to = *applies;
    auto v = Sexagesimal::Parse(f[2]);
    if (!v)
      throw RowError(path, line_no, line, 2, "a value in trade notation such as 23;51,20", f[2]);
    e.value = *v;
    e.tradition = f[3];
    e.source = f[4];
    if (f[5] != "yes" && f[5] != "no") throw RowError(path, line_no, line, 5, "yes or no", f[5]);
    e.from_memory = f[5] == "yes";
    e.origin = file + ":" + std::to_string(line_no);
    out.push_back(std::move(e));
  }
  return out;
}

CatalogEntry MakeCatalogEntry(const std::string& kind, const std::string& applies_to,
                              const std::string& value, const std::string& tradition,
                              const std::string& source, bool from_memory) {
  if (kind.empty())
    throw InputError::ForOption("--kind",
                                ExpectedFound("a kind such as obliquity", "an empty value"));
  if (source.empty())
    throw InputError::ForOption("--source",
                                ExpectedFound("where the value was read", "an empty value"));
  auto applies = ParseAppliesTo(applies_to);
  if (!applies)
    throw InputError::ForOption(
        "--applies-to",
        ExpectedFound("model:parameter pairs such as solar-eccentric:e", applies_to));
  auto v = Sexagesimal::Parse(value);
  if (!v)
    throw InputError::ForOption("--value",
                                ExpectedFound("a value in trade notation such as 23;51,20", value));
  CatalogEntry e;
  e.kind = kind;
  e.applies_to = *applies;
  e.value = *v;
  e.tradition = tradition;
  e.source = source;
  e.from_memory = from_memory;
  return e;
}

std::vector<AttestedMatch> NearestAttested(const std::vector<CatalogEntry>& catalog,
                                           const std::string& model, const std::string& param,
                                           double value, double se, int count) {
  std::vector<AttestedMatch> out;
  for (const auto& e : catalog) {
    if (!e.AppliesTo(model, param)) continue;
    AttestedMatch m;
    m.entry = e;
    m.distance = e.value.ToDouble() - value;
    m.distance_se = se > 0 ? std::fabs(m.distance) / se : std::numeric_limits<double>::infinity();
    out.push_back(std::move(m));
  }
  std::sort(out.begin(), out.end(), [](const AttestedMatch& a, const AttestedMatch& b) {
    return std::fabs(a.distance) < std::fabs(b.distance);
  });
  if (static_cast<int>(out.size()) > count) out.resize(static_cast<std::size_t>(count));
  return out;
}

}  // namespace apograph::estimate
