#include "support/tabular.hpp"

#include <algorithm>

namespace apograph {

std::size_t DisplayWidth(const std::string& text) {
  std::size_t n = 0;
  for (unsigned char c : text) n += (c & 0xC0) != 0x80;
  return n;
}

std::string CsvField(const std::string& field) {
  const bool blank_end = !field.empty() && (field.front() == ' ' || field.front() == '\t' ||
                                            field.back() == ' ' || field.back() == '\t');
  if (field.find_first_of(",;\"\n\r") == std::string::npos && !blank_end) return field;
  std::string out = "\"";
  for (char c : field) {
    if (c == '"') out += '"';
    out += c;
  }
  return out + "\"";
}

std::string Tabular::RenderText() const {
  std::vector<std::size_t> width(headers.size(), 0);
  for (std::size_t i = 0; i < headers.size(); ++i) width[i] = DisplayWidth(headers[i]);
  for (const auto& r : rows) {
    for (std::size_t i = 0; i < r.size() && i < width.size(); ++i)
      width[i] = std::max(width[i], DisplayWidth(r[i]));
  }
  auto line = [&](const std::vector<std::string>& cells) {
    std::string out;
    for (std::size_t i = 0; i < width.size(); ++i) {
      const std::string cell = i < cells.size() ? cells[i] : "";
      const std::string pad(width[i] - DisplayWidth(cell), ' ');
      const bool right = i < right_aligned.size() && right_aligned[i];
      std::string piece = right ? pad + cell : cell + (i + 1 < width.size() ? pad : "");
      out += (i ? "  " : "") + piece;
    }
    while (!out.empty() && out.back() == ' ') out.pop_back();
    return out + "\n";
  };
  std::string out = line(headers);
  std::size_t total = 0;
  for (auto w : width) total += w;
  total += width.empty() ? 0 : 2 * (width.size() - 1);
  out += std::string(total, '-') + "\n";
  for (const auto& r : rows) out += line(r);
  return out;
}

std::string Tabular::RenderCsv() const {
  std::string out;
  auto line = [&](const std::vector<std::string>& cells) {
    for (std::size_t i = 0; i < cells.size(); ++i) out += (i ? "," : "") + CsvField(cells[i]);
    out += "\r\n";
  };
  line(headers);
  for (const auto& r : rows) line(r);
  return out;
}

}  // namespace apograph
