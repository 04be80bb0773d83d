#include "publish/html_report.hpp"

#include <cstdio>
#include <set>
#include <sstream>

#include "estimate/report.hpp"
#include "publish/html_plots.hpp"
#include "publish/html_tables.hpp"
#include "publish/report.hpp"
#include "publish/svg_stemma.hpp"

namespace apograph::publish {
namespace {

void Witnesses(const pipeline::TableAnalysis& a, std::ostream& out) {
  out << "<ul class=\"witnesses\">";
  for (const auto& t : a.transcriptions) {
    const auto& w = t.witness;
    out << "<li><b>" << Html(w.siglum) << "</b> " << Html(w.library)
        << (w.shelfmark.empty() ? "" : ", " + Html(w.shelfmark))
        << (t.folios.empty() ? "" : ", fols. " + Html(t.folios))
        << (w.date.empty() ? "" : " (" + Html(w.date) + ")") << "</li>";
  }
  out << "</ul>";
}

/// What an editor should see first: per witness its slips, displaced
/// runs and the author's departures; per column whether it was
/// interpolated.
void Overview(const pipeline::TableAnalysis& a, std::ostream& out) {
  out << "<ul class=\"overview\">";
  for (const auto& r : a.references) {
    if (r.practice.grid > 0)
      out << "<li><span class=\"badge interp\">interpolated</span> " << Html(r.column_name) << ": "
          << Html(pipeline::DescribePractice(r.practice, r.practice.places.value_or(0))) << "</li>";
  }
  for (const auto& w : a.witnesses) {
    int runs = 0;
    for (const auto& f : w.findings) runs += f.best().cls == deviation::SlipClass::kDisplacedRun;
    out << "<li><b>" << Html(w.siglum) << "</b>: " << w.CopyingSlips() << " copying slips";
    if (runs) out << " <span class=\"badge run\">" << runs << " displaced run(s)</span>";
    out << ", " << w.Departures() << " of the author's departures</li>";
  }
  out << "</ul>";
}

void Estimates(const pipeline::ColumnReference& r, std::ostream& out) {
  for (const auto& p : r.estimates) {
    if (!p.held.empty()) {
      out << "<li>estimate from witness " << Html(r.witness) << ": "
          << Html(estimate::ParamWithError(p)) << "</li>";
      continue;
    }
    if (p.fixed) continue;
    char buf[64];
    std::snprintf(buf, sizeof buf, " (%.6g &plusmn; %.2g)", p.value, p.stderr_);
    out << "<li>estimate from witness " << Html(r.witness) << ": " << Html(p.name) << " = "
        << Html(estimate::TradeValue(p.value, p.stderr_)) << buf << "</li>";
  }
  std::istringstream lines(r.attested);
  for (std::string line; std::getline(lines, line);)
    if (line.find_first_not_of(' ') != std::string::npos)
      out << "<li>" << Html(line.substr(line.find_first_not_of(' '))) << "</li>";
}

void Model(const pipeline::TableAnalysis& a, std::ostream& out) {
  out << "<h3>How the table was computed</h3>";
  if (a.references.empty()) out << "<p>No model explains the table yet.</p>";
  for (const auto& r : a.references) {
    out << "<div class=\"model\"><p><b>" << Html(r.column_name) << "</b>: " << Html(r.description)
        << "<br><small>" << Html(r.how) << "</small></p><ul>";
    for (std::size_t i = 0; i < r.ties.size() && i < 3; ++i)
      out << "<li>" << Html(r.ties[i]) << "</li>";
    if (!r.naming.empty()) out << "<li>" << Html(r.naming) << "</li>";
    Estimates(r, out);
    if (r.mean_motion) out << "<li>" << Html(r.mean_motion->verdict) << "</li>";
    out << "</ul></div>";
  }
}

void Plots(const pipeline::TableAnalysis& a, std::ostream& out) {
  out << "<h3>Each witness against the model</h3>";
  for (const auto& r : a.references) out << ColumnPlots(a, r);
}

const char* FindingClass(deviation::SlipClass cls) {
  switch (KindOf(cls)) {
    case PointKind::kDeparture:
      return "departure";
    case PointKind::kDisplaced:
      return "run";
    case PointKind::kFlagged:
      return "flagged";
    default:
      return "slip";
  }
}

/// The editor's decision on a finding, in the Markdown report's words, with
/// a class of its status for the style sheet.
void DecisionSpan(const pipeline::TableAnalysis& a, const std::string& siglum,
                  const deviation::Finding& f, std::ostream& out) {
  const std::string words = DecisionWords(a, siglum, f);
  if (words.empty()) return;
  const char* cls = words.rfind("accepted", 0) == 0   ? "accepted"
                    : words.rfind("rejected", 0) == 0 ? "rejected"
                    : words.rfind("review", 0) == 0   ? "review"
                                                      : "undecided";
  out << " <span class=\"decision " << cls << "\">&mdash; " << Html(words) << "</span>";
}

void Findings(const pipeline::TableAnalysis& a, std::ostream& out) {
  out << "<h3>Deviations explained (suggestions: the editor decides)</h3>";
  for (const auto& w : a.witnesses) {
    out << "<h4>" << Html(w.siglum) << "</h4><ol class=\"findings\">";
    for (const auto& f : w.findings) {
      const int row = AlignedRow(a, w.siglum, static_cast<int>(f.cells.front().row));
      const int col = CollationColumn(a, f.column_name);
      out << "<li class=\"" << FindingClass(f.best().cls) << "\">";
      if (row >= 0 && col >= 0)
        out << "<a href=\"#" << CellAnchor(a.table_id, row, col) << "\">" << Html(f.Note(w.siglum))
            << "</a>";
      else
        out << Html(f.Note(w.siglum));
      if (f.best().cls != deviation::SlipClass::kComputational) DecisionSpan(a, w.siglum, f, out);
      out << "</li>";
    }
    out << "</ol>";
  }
}

void Stemma(const lineage::LineageReport& l, const std::string& id, std::ostream& out) {
  const std::string svg = StemmaSvg(l, id);
  if (svg.empty()) {
    out << "<p>No stemma: fewer than three witnesses or no shared errors.</p>";
    return;
  }
  out << "<figure>" << svg
      << "<figcaption>Boxes: witnesses; small circles: lost copies; percentages: bootstrap "
         "support; dashed arrows: contamination.</figcaption></figure><ul>";
  for (const auto& g : l.results.front().groups) {
    std::string sigla;
    for (const auto& s : g.witnesses) sigla += (sigla.empty() ? "" : " ") + s;
    out << "<li>group {" << Html(sigla) << "}</li>";
  }
  for (const auto& c : l.copies) out << "<li>copy? " << Html(c.text) << "</li>";
  for (const auto& c : l.contamination) out << "<li>contamination? " << Html(c.text) << "</li>";
  out << "</ul>";
}

}  // namespace

std::string Html(const std::string& text) { return EscapeXml(text); }

std::string HtmlTableSection(const pipeline::TableAnalysis& a) {
  std::ostringstream out;
  out << "<article class=\"table\" id=\"table-" << Html(a.table_id) << "\"><h2>" << Html(a.table_id)
      << (a.table_title.empty() ? "" : ": " + Html(a.table_title)) << "</h2>";
  Witnesses(a, out);
  Overview(a, out);
  Plots(a, out);
  Model(a, out);
  Findings(a, out);
  out << "<h3>Stemma of this table</h3>";
  Stemma(a.lineage, a.table_id, out);
  const Apparatus app = BuildApparatus(a);  // the edited table, with the editor's decisions
  out << EditedTable(a, app) << CellViews(a, app) << "</article>";
  return out.str();
}

std::string HtmlWorkSection(const std::string& work_id, const lineage::LineageReport& lineage) {
  std::ostringstream out;
  out << "<article class=\"work\"><h2>Stemma of the work " << Html(work_id)
      << " (all its tables together)</h2>";
  Stemma(lineage, "work-" + work_id, out);
  out << "</article>";
  return out.str();
}

std::string HtmlDocument(const std::string& title, const std::string& body) {
  return "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">"
         "<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; "
         "style-src 'unsafe-inline'; img-src data:\">"
         "<meta name=\"viewport\" content=\"width=device-width\"><title>" +
         Html(title) + "</title><style>" + HtmlStyle() + "</style></head><body><header><h1>" +
         Html(title) +
         "</h1><p class=\"note\">Everything below is a suggestion with its evidence: the editor "
         "decides.</p></header>" +
         body + "</body></html>\n";
}

}  // namespace apograph::publish
