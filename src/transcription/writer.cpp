#include "transcription/writer.hpp"

#include "support/input_error.hpp"

namespace apograph {
namespace {

/// An id as a bare word, or an InputError naming what it is.
std::string Bare(const std::string& id, const char* what) {
  const bool ok = !id.empty() && id.find_first_of(" \t\r\n\"#{}|=") == std::string::npos;
  if (!ok) {
    throw InputError::ForFile(
        "transcription",
        std::string("expected ") + what + " without blanks, quotes or #{}|=, found '" + id + "'");
  }
  return id;
}

void Attribute(std::string& out, const char* name, const std::string& value) {
  if (value.empty()) return;
  out += ' ';
  out += name;
  out += '=';
  out += QuoteValue(value);
}

void NumberAttribute(std::string& out, const char* name, const std::optional<Sexagesimal>& value) {
  if (value) out += std::string(" ") + name + "=" + value->ToString();
}

void WriteWork(std::string& out, const WorkInfo& work) {
  out += "@work " + Bare(work.id, "a work id");
  Attribute(out, "title", work.title);
  Attribute(out, "author", work.author);
  out += '\n';
}

void WriteWitness(std::string& out, const WitnessInfo& witness) {
  out += "@witness " + Bare(witness.siglum, "a siglum");
  Attribute(out, "library", witness.library);
  Attribute(out, "shelfmark", witness.shelfmark);
  Attribute(out, "date", witness.date);
  Attribute(out, "script", witness.script);
  Attribute(out, "note", witness.note);
  Attribute(out, "kind", witness.kind);
  out += '\n';
}

void WriteLayout(std::string& out, const Transcription& t) {
  out += "@table " + Bare(t.table_id, "a table id");
  Attribute(out, "title", t.table_title);
  Attribute(out, "kind", t.kind);
  Attribute(out, "folios", t.folios);
  Attribute(out, "hand", t.hand);
  out += "\n@argument " + Bare(t.argument.name, "an argument name");
  Attribute(out, "unit", t.argument.unit);
  out += " places=" + std::to_string(t.argument.places);
  NumberAttribute(out, "start", t.argument.start);
  NumberAttribute(out, "step", t.argument.step);
  if (t.argument.listed) out += std::string(" step=") + kListedStep;
  out += '\n';
  if (t.argument2) {
    out += "@argument2 " + Bare(t.argument2->name, "an argument name");
    Attribute(out, "unit", t.argument2->unit);
    out += " places=" + std::to_string(t.argument2->places) + '\n';
  }
  for (const auto& c : t.columns) {
    out += "@column " + Bare(c.name, "a column name");
    Attribute(out, "unit", c.unit);
    out += " places=" + std::to_string(c.places);
    Attribute(out, "title", c.title);
    NumberAttribute(out, "arg2", c.arg2);
    out += '\n';
  }
}

std::string Reading(const Cell& cell) {
  if (!cell.raw.empty()) return cell.raw;
  switch (cell.state) {
    case CellState::kBlank:
      return "_";
    case CellState::kIllegible:
      return "?";
    case CellState::kRead:
      return cell.value ? cell.value->ToString() : "?";
    case CellState::kPartial:
      return "?";
  }
  return "?";
}

void WriteCell(std::string& out, const Cell& cell) {
  out += Reading(cell);
  if (cell.corrected_from) out += " {was " + *cell.corrected_from + "}";
  if (cell.damaged) out += " {damaged}";
  if (cell.doubtful) out += " {doubt}";
  if (cell.addition == Addition::kMargin) out += " {margin}";
  if (cell.addition == Addition::kInterlinear) out += " {interlinear}";
  if (!cell.note.empty()) out += " {note " + QuoteValue(cell.note) + "}";
}

void WriteTable(std::string& out, const Transcription& t) {
  WriteLayout(out, t);
  out += "@rows\n";
  for (const auto& row : t.rows) {
    WriteCell(out, row.argument);
    for (const auto& cell : row.cells) {
      out += " | ";
      WriteCell(out, cell);
    }
    out += '\n';
  }
}

}  // namespace

std::string QuoteValue(const std::string& text) {
  std::string out = "\"";
  for (char c : text) {
    if (c == '"' || c == '\\') out += '\\';
    const bool control = (static_cast<unsigned char>(c) < 0x20 && c != '\t') || c == 0x7F;
    out += control ? ' ' : c;
  }
  return out + "\"";
}

std::string WriteTranscription(const std::vector<Transcription>& tables) {
  std::string out;
  const WorkInfo* work = nullptr;
  const WitnessInfo* witness = nullptr;
  for (const auto& t : tables) {
    if (!out.empty()) out += '\n';
    if (!work || !(*work == t.work)) WriteWork(out, t.work);
    if (!witness || !(*witness == t.witness)) WriteWitness(out, t.witness);
    work = &t.work;
    witness = &t.witness;
    WriteTable(out, t);
  }
  return out;
}

std::string WriteTranscription(const Transcription& table) {
  return WriteTranscription(std::vector<Transcription>{table});
}

}  // namespace apograph
