#include "publish/html_tables.hpp"

#include <cstdio>
#include <set>
#include <sstream>
#include <utility>

#include "publish/html_plots.hpp"
#include "publish/html_report.hpp"
#include "publish/report.hpp"

namespace apograph::publish {
namespace {

using Place = std::pair<int, int>;  // aligned row, collation column

/// The cells a finding of any witness covers.
std::set<Place> FoundCells(const pipeline::TableAnalysis& a) {
  std::set<Place> cells;
  for (const auto& w : a.witnesses) {
    for (const auto& f : w.findings) {
      const int col = CollationColumn(a, f.column_name);
      for (const auto& c : f.cells) {
        const int row = AlignedRow(a, w.siglum, static_cast<int>(c.row));
        if (row >= 0 && col >= 0) cells.insert({row, col});
      }
    }
  }
  return cells;
}

std::string Sigla(const std::vector<std::string>& sigla) {
  std::string out;
  for (const auto& s : sigla) out += (out.empty() ? "" : " ") + s;
  return out;
}

/// Who reads the lemma: its sigla, or where it comes from when no witness
/// does ("conjecture A. Editor", "restored").
std::string LemmaWitnesses(const ApparatusEntry& e) {
  if (e.source == LemmaSource::kWitnesses) return Sigla(e.lemma_sigla);
  std::string out = std::string("(") + ToString(e.source);
  if (!e.resp.empty()) out += " " + e.resp;
  if (!e.lemma_sigla.empty()) out += "; " + Sigla(e.lemma_sigla);
  return out + ")";
}

/// "0;14 A B] 0;44 C" as the apparatus reads.
std::string EntryText(const ApparatusEntry& e) {
  std::string out =
      Html(e.lemma.empty() ? "(illegible)" : e.lemma) + " " + Html(LemmaWitnesses(e)) + "]";
  for (const auto& v : e.variants)
    out += " " + Html(v.text) + " <i>" + Html(Sigla(v.sigla)) + "</i>" +
           (v.why.empty() ? "" : " (" + Html(v.why) + ")");
  return out;
}

void TableCell(const pipeline::TableAnalysis& a, const Apparatus& app, const std::set<Place>& found,
               int r, int c, std::ostream& out) {
  const ApparatusEntry& e = app.cells[r][c];
  const bool ed = e.Editorial();
  const bool view = e.HasVariants() || ed || found.count({r, c});
  out << "<td class=\"" << (ed ? "ed " : "") << (e.HasVariants() ? "var" : "") << "\">";
  if (view) out << "<a href=\"#" << CellAnchor(a.table_id, r, c) << "\">";
  out << Html(e.lemma);
  if (e.HasVariants()) out << "<sup>&dagger;</sup>";
  if (ed) out << "<sup>ed.</sup>";
  if (view) out << "</a>";
  out << "</td>";
}

std::string Judgement(const collate::Reading& r) {
  if (!r.Comparable()) return "not compared";
  std::string out = r.error ? "error" : "right";
  if (!r.slip.empty()) out += ": " + r.slip;
  if (r.units_off) {
    char buf[48];
    std::snprintf(buf, sizeof buf, " (%+.0f units from the model)", *r.units_off);
    out += buf;
  }
  return out;
}

/// The editor's decisions at a cell: the edited text's override or
/// conjecture, and every witness's accepted or rejected emendation there.
void CellDecisions(const pipeline::TableAnalysis& a, const Apparatus& app, int r, int c,
                   std::ostream& out) {
  const std::string arg = app.arguments[r].ToString();
  const std::string& column = app.columns[c].name;
  std::string items;
  if (const auto* e = a.decisions.EditedAt(arg, column)) {
    items += "<li class=\"" + std::string(pipeline::ToString(e->decision.action)) + "\">" +
             (e->decision.action == pipeline::Action::kConjecture ? "conjecture " : "reading ") +
             Html(e->reading) + " adopted by " + Html(DecidedBy(e->decision)) + "</li>";
  }
  for (const auto& t : a.transcriptions) {
    const auto* w = a.decisions.At(t.witness.siglum, column, arg);
    if (!w) continue;
    const bool accept = w->decision.action == pipeline::Action::kAccept;
    items += "<li>" + Html(t.witness.siglum) + " " + Html(w->cell.reading) +
             (accept ? ": emended to " + Html(w->cell.proposed) + ", accepted by "
                     : ": emendation rejected (the reading is kept) by ") +
             Html(DecidedBy(w->decision)) + "</li>";
  }
  if (!items.empty()) out << "<ul class=\"decisions\">" << items << "</ul>";
}

void CellView(const pipeline::TableAnalysis& a, const Apparatus& app, int r, int c,
              std::ostream& out) {
  const auto& cell = a.collation.rows[r].cells[c];
  const ApparatusEntry& e = app.cells[r][c];
  out << "<section class=\"cell\" id=\"" << CellAnchor(a.table_id, r, c) << "\"><h4>"
      << Html(app.arguments[r].ToString()) << " &middot; " << Html(app.columns[c].name)
      << "</h4><p>model: " << (cell.computed ? Html(cell.computed->ToString()) : "none")
      << "</p><table><tr><th>reading"
      << "</th><th>witnesses</th><th>judgement</th></tr>";
  for (const auto& reading : cell.readings) {
    out << "<tr class=\"" << (reading.error ? "err" : "ok") << "\"><td>" << Html(reading.text)
        << "</td><td>" << Html(Sigla(reading.sigla)) << "</td><td>" << Html(Judgement(reading))
        << "</td></tr>";
  }
  out << "</table>";
  CellDecisions(a, app, r, c, out);
  out << "<p class=\"app\">" << EntryText(e) << "</p>";
  if (!e.reason.empty()) out << "<p class=\"app-note\">" << Html(e.reason) << "</p>";
  for (const auto& m : e.marks)
    out << "<p class=\"app-note\">" << Html(m.siglum) << ": " << Html(m.text) << "</p>";
  out << "</section>";
}

}  // namespace

std::string EditedTable(const pipeline::TableAnalysis& a, const Apparatus& app) {
  const auto found = FoundCells(a);
  std::ostringstream out;
  out << "<h3>The edited table</h3><p>&dagger; variant readings in the apparatus (click for the "
         "cell); <sup>ed.</sup> the editor's reading.</p><table class=\"edited\"><thead><tr><th>"
      << Html(app.argument.name.empty() ? "argument" : app.argument.name) << "</th>";
  for (const auto& c : app.columns) out << "<th>" << Html(c.name) << "</th>";
  out << "</tr></thead><tbody>";
  for (std::size_t r = 0; r < app.cells.size(); ++r) {
    out << "<tr><th>" << Html(app.arguments[r].ToString()) << "</th>";
    for (std::size_t c = 0; c < app.cells[r].size(); ++c)
      TableCell(a, app, found, static_cast<int>(r), static_cast<int>(c), out);
    out << "</tr>";
  }
  out << "</tbody></table>";
  return out.str();
}

std::string CellViews(const pipeline::TableAnalysis& a, const Apparatus& app) {
  auto cells = FoundCells(a);
  for (std::size_t r = 0; r < app.cells.size(); ++r)
    for (std::size_t c = 0; c < app.cells[r].size(); ++c)
      if (app.cells[r][c].HasVariants() || app.cells[r][c].Editorial())
        cells.insert({static_cast<int>(r), static_cast<int>(c)});
  std::ostringstream out;
  out << "<h3>Apparatus, cell by cell</h3><div class=\"cells\">";
  for (const auto& [r, c] : cells) {
    if (static_cast<std::size_t>(r) < a.collation.rows.size() &&
        static_cast<std::size_t>(r) < app.cells.size())
      CellView(a, app, r, c, out);
  }
  out << "</div>";
  return out.str();
}

const char* HtmlStyle() {
  return R"(body{font:15px/1.45 Georgia,'DejaVu Serif',serif;margin:1.5em auto;max-width:64em;
color:#111;background:#fff;padding:0 1em}
h1,h2,h3,h4{font-family:'DejaVu Sans',Arial,sans-serif}h2{border-top:3px solid #1d3557;
padding-top:.4em}.note{font-style:italic}
.badge{font:12px 'DejaVu Sans',sans-serif;padding:1px 6px;border:1.5px solid #111;border-radius:3px}
.badge.interp{border-style:dashed}.badge.run{background:#111;color:#fff}
svg{max-width:100%;height:auto;display:block}svg text{font:11px 'DejaVu Sans',sans-serif}
.plot .grid{stroke:#ddd}.plot .zero{stroke:#555;stroke-width:1}.plot .tick{fill:#444}
.node{stroke:#777;stroke-dasharray:1 3;stroke-width:1.2}
.m-flag{stroke:#000;stroke-width:2;fill:none}.m-slip{fill:#000}.m-run{fill:#000;stroke:#fff;stroke-width:.8}
.m-author{fill:#fff;stroke:#000;stroke-width:2}
figure{margin:1em 0}.plots{display:flex;flex-wrap:wrap;gap:.5em 1em;align-items:flex-start}
.panels{flex:1 1 560px;min-width:0}.key{flex:0 0 250px}
figcaption{font-size:13px;color:#333;flex-basis:100%}
.stemma .branch{stroke:#222;stroke-width:1.4}.stemma .wit{fill:#fff;stroke:#111;stroke-width:1.5}
.stemma .arch{fill:#eee;stroke:#111;stroke-dasharray:3 2}.stemma .lost{fill:#888}
.stemma .contam{fill:none;stroke:#d17a22;stroke-width:1.6;stroke-dasharray:6 4}
.stemma .support{fill:#333}
.findings li.departure{list-style-type:circle}.findings li.run{font-weight:bold}
table{border-collapse:collapse}td,th{padding:1px 8px;border-bottom:1px solid #ddd;text-align:right}
.edited td.var{background:#eee}.edited td.ed{outline:2px solid #111}
.cell{border-left:4px solid #1d3557;padding-left:.8em;margin:1em 0}.cell tr.err td{font-weight:bold}
.cell:target{background:#fff6d5}a{color:#1d3557}
.review td,.review th{text-align:left;vertical-align:top;font-size:13px}.review .evidence{min-width:16em}
.review tr.accepted{background:#eef3ee}.review tr.rejected{background:#f3eeee}.review form{margin:2px 0}
.done,.stale{border:2px solid #111;padding:.3em .6em}
.decision{font-size:13px}.decision.accepted,.decision.rejected{font-weight:bold}
.decision.review{border-bottom:2px dotted #111}.decisions li.conjecture{font-style:italic}
@media print{.cell,.plots,figure{break-inside:avoid}a{color:#000;text-decoration:none}})";
}

}  // namespace apograph::publish
