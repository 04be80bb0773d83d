#include "publish/report.hpp"

#include <cstdio>
#include <sstream>

#include "estimate/report.hpp"
#include "lineage/stemma.hpp"
#include "support/tabular.hpp"

namespace apograph::publish {
namespace {

std::string Join(const std::vector<std::string>& items, const std::string& separator) {
  std::string out;
  for (const auto& s : items) out += (out.empty() ? "" : separator) + s;
  return out;
}

void Witnesses(const pipeline::TableAnalysis& a, std::ostream& out) {
  out << "Witnesses:\n";
  for (const auto& t : a.transcriptions) {
    const auto& w = t.witness;
    std::vector<std::string> parts;
    for (const auto* s : {&w.library, &w.shelfmark}) {
      if (!s->empty()) parts.push_back(*s);
    }
    if (!t.folios.empty()) parts.push_back("fols. " + t.folios);
    std::vector<std::string> about;
    if (!w.date.empty()) about.push_back(w.date);
    if (!w.script.empty()) about.push_back("numerals: " + w.script);
    const std::string tail = Join(about, "; ");
    out << "- **" << w.siglum << "** " << Join(parts, ", ")
        << (tail.empty() ? "" : " (" + tail + ")") << "\n";
  }
  out << "\n";
}

/// The fitted values with their standard errors, and the attested values
/// nearest to them (which tradition the table belongs to).
void Estimates(const pipeline::ColumnReference& r, std::ostream& out) {
  std::vector<std::string> parts;
  for (const auto& p : r.estimates) {
    if (p.fixed) continue;
    char buf[64];
    std::snprintf(buf, sizeof buf, " (%.6g \u00b1 %.2g)", p.value, p.stderr_);
    parts.push_back(p.name + " = " + estimate::TradeValue(p.value, p.stderr_) + buf);
  }
  if (!parts.empty())
    out << "  estimate from witness " << r.witness << ": " << Join(parts, ", ") << "\n";
  std::istringstream lines(r.attested);
  for (std::string line; std::getline(lines, line);) {
    out << "  - " << line.substr(line.find_first_not_of(' ')) << "\n";
  }
}

/// For a mean motion, how its entries were made, as identification read
/// them off the witness the reference comes from.
void MeanMotionVerdict(const pipeline::ColumnReference& r, std::ostream& out) {
  if (!r.mean_motion) return;
  // The simplest account is enough here; `apograph identify` shows every entry.
  const std::string& v = r.mean_motion->verdict;
  out << "  How the entries were made (witness " << r.witness
      << "): " << v.substr(0, v.find(" Entry by entry:")) << "\n";
}

void References(const pipeline::TableAnalysis& a, std::ostream& out) {
  out << "### How the table was computed\n\n";
  if (a.references.empty()) out << "No model explains the table yet (give one with --model).\n";
  for (const auto& r : a.references) {
    out << "- **" << r.column_name << "**: " << r.description << "\n  " << r.how << "\n";
    constexpr std::size_t kTiesShown = 2;
    for (std::size_t i = 0; i < r.ties.size() && i < kTiesShown; ++i)
      out << "  - " << r.ties[i] << "\n";
    if (r.ties.size() > kTiesShown) {
      out << "  - and " << r.ties.size() - kTiesShown
          << " more near-ties (apograph identify --table " << a.table_id << " --witness "
          << r.witness << ")\n";
    }
    Estimates(r, out);
    MeanMotionVerdict(r, out);
  }
  out << "\n";
}

void Checks(const pipeline::TableAnalysis& a, std::ostream& out) {
  out << "### Each witness against the model\n\n";
  Tabular t;
  t.headers = {"witness", "column", "entries", "exact",   "within 1",
               "flagged", "worst",  "slips",   "author's"};
  t.right_aligned = {false, false, true, true, true, true, true, true, true};
  for (const auto& w : a.witnesses) {
    bool first = true;
    for (const auto& c : w.checks) {
      char worst[32];
      std::snprintf(worst, sizeof worst, "%.0f", c.summary.worst);
      t.Add({first ? w.siglum : "", c.column_name, std::to_string(c.summary.compared),
             std::to_string(c.summary.exact), std::to_string(c.summary.within_one),
             std::to_string(c.summary.flagged), worst,
             first ? std::to_string(w.CopyingSlips()) : "",
             first ? std::to_string(w.Departures()) : ""});
      first = false;
    }
  }
  out << "```\n" << t.RenderText() << "```\n";
  out << "(exact, within one unit of the last place, flagged beyond one unit; slips: findings "
         "explained as copying; author's: departures the author's computation explains)\n\n";
}

/// The author's departures as one pattern per column (which rows, how
/// large, in which witnesses), not as slips of each witness.
void AuthorsPattern(const pipeline::TableAnalysis& a, std::ostream& out) {
  const auto patterns = pipeline::AuthorsDepartures(a.witnesses);
  for (const auto& p : patterns) {
    std::size_t everywhere = 0;
    for (const auto& r : p.rows) everywhere += r.sigla.size() == a.witnesses.size();
    out << "The author's departures from the model in **" << p.column_name
        << "** (kept in the edition): " << p.Text() << "; " << everywhere << " of " << p.rows.size()
        << (p.rows.size() == 1 ? " is" : " are") << " read by every witness.\n";
  }
  if (!patterns.empty()) out << "\n";
}

/// A column whose reference the guard refused in a witness: why, and the
/// model-free screen instead of findings.
void Refused(const pipeline::WitnessFindings& w, std::ostream& out) {
  for (const auto& v : w.verdicts) {
    if (v.verdict.explains) continue;
    out << "- " << v.column_name << ": " << v.verdict.why
        << ". Model-free screen: " << v.screen.size() << " suspect"
        << (v.screen.size() == 1 ? "" : "s");
    std::vector<std::string> args;
    for (const auto& s : v.screen) args.push_back(s.arg);
    out << (args.empty() ? "" : " (" + Join(args, ", ") + ")") << "\n";
  }
}

void Deviations(const pipeline::TableAnalysis& a, const ReportOptions& o, std::ostream& out) {
  out << "### Deviations explained (suggestions: the editor decides)\n\n";
  AuthorsPattern(a, out);
  for (const auto& w : a.witnesses) {
    out << "**" << w.siglum << "**: " << w.CopyingSlips() << " copying slip"
        << (w.CopyingSlips() == 1 ? "" : "s") << " or unexplained, " << w.Departures()
        << " of the author's departures\n";
    Refused(w, out);
    std::size_t shown = 0, hidden = 0;
    for (const auto& f : w.findings) {
      const bool departure = f.best().cls == deviation::SlipClass::kComputational;
      if (departure && !o.show_departures) continue;
      if (o.max_findings && shown >= o.max_findings) {
        ++hidden;
        continue;
      }
      out << "- " << f.Note(w.siglum) << "\n";
      ++shown;
    }
    if (hidden) {
      out << "- ... and " << hidden << " more (apograph errors --table " << a.table_id
          << " --witness " << w.siglum << " --auto)\n";
    }
    out << "\n";
  }
}

std::string GroupText(const lineage::GroupInfo& g) {
  std::vector<std::string> sigla(g.witnesses.begin(), g.witnesses.end());
  char buf[96];
  std::snprintf(buf, sizeof buf, "errors on its branch %.3g", g.length);
  std::string out = "{" + Join(sigla, " ") + "}  " + buf;
  if (g.support) {
    std::snprintf(buf, sizeof buf, ", bootstrap support %.0f%%", *g.support * 100);
    out += buf;
  }
  return out;
}

void Lineage(const lineage::LineageReport& l, std::ostream& out) {
  if (l.results.empty()) {
    out << "No stemma: fewer than three witnesses or no shared errors.\n\n";
    return;
  }
  out << l.witnesses.size() << " witnesses, " << l.characters << " error characters";
  if (l.undetermined_cells) out << " (" << l.undetermined_cells << " cells left undetermined)";
  out << ". Shared errors are evidence of common descent; shared right readings are not.\n\n";
  for (const auto& r : l.results) {
    out << "By "
        << (r.method == lineage::Method::kParsimony ? "maximum parsimony" : "neighbour joining");
    if (r.parsimony) {
      char buf[64];
      std::snprintf(buf, sizeof buf, " (length %.4g)", r.parsimony->length);
      out << buf;
    }
    out << ":\n\n```\n" << lineage::ToText(r.stemma) << "```\n";
    for (const auto& g : r.groups) out << "- group " << GroupText(g) << "\n";
    out << "- Newick: `" << lineage::ToNewick(r.stemma) << "`\n\n";
  }
  for (const auto& c : l.copies) out << "- copy? " << c.text << "\n";
  for (const auto& c : l.contamination) out << "- contamination? " << c.text << "\n";
  if (l.copies.empty() && l.contamination.empty())
    out << "- no direct copy and no contamination found\n";
  out << "\n";
}

void ApparatusSummary(const pipeline::TableAnalysis& a, std::ostream& out) {
  int with_variants = 0, overrides = 0, undetermined = 0;
  std::vector<std::string> to_decide;
  const auto& app = a.apparatus;
  for (std::size_t r = 0; r < app.cells.size(); ++r) {
    for (std::size_t c = 0; c < app.cells[r].size(); ++c) {
      const ApparatusEntry& e = app.cells[r][c];
      with_variants += e.HasVariants();
      overrides += e.editor;
      undetermined += e.note.rfind("no model and no majority", 0) == 0;
      if (e.note.rfind("every witness deviates", 0) == 0) {
        std::string model;
        if (r < a.collation.rows.size() && c < a.collation.rows[r].cells.size() &&
            a.collation.rows[r].cells[c].computed) {
          model = "; the model gives " + a.collation.rows[r].cells[c].computed->ToString();
        }
        to_decide.push_back(app.arguments[r].ToString() + " " + app.columns[c].name + ": adopted " +
                            e.lemma + model + " (" + e.note + ")");
      }
    }
  }
  out << "### The edited table\n\n"
      << app.cells.size() << " rows; " << with_variants
      << " cells with variant readings in the apparatus; " << overrides << " editor's overrides";
  if (undetermined) out << "; " << undetermined << " cells undetermined (no model, no majority)";
  out << ".\n";
  if (!to_decide.empty()) {
    out << "Cells where every witness deviates from the model (an archetype error or the author's "
           "own value: the editor decides, apograph apparatus --override):\n";
    for (const auto& line : to_decide) out << "- " << line << "\n";
  }
  out << "\n";
}

}  // namespace

std::string TableReport(const pipeline::TableAnalysis& a, const ReportOptions& o) {
  std::ostringstream out;
  out << "## " << a.table_id << ": " << a.table_title;
  if (!a.work.title.empty()) out << " (" << a.work.title << ")";
  out << "\n\n";
  Witnesses(a, out);
  References(a, out);
  Checks(a, out);
  Deviations(a, o, out);
  out << "### Stemma of this table\n\n";
  Lineage(a.lineage, out);
  ApparatusSummary(a, out);
  return out.str();
}

std::string WorkLineageReport(const std::string& work_id, const lineage::LineageReport& lineage) {
  std::ostringstream out;
  out << "## Stemma of the work " << work_id << " (all its tables together)\n\n";
  Lineage(lineage, out);
  return out.str();
}

}  // namespace apograph::publish
