#include "publish/report.hpp"

#include <cstdio>
#include <set>
#include <sstream>

#include "estimate/report.hpp"
#include "lineage/lineage_text.hpp"
#include "lineage/stemma.hpp"
#include "publish/apparatus.hpp"
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
    if (!p.fixed || !p.held.empty()) parts.push_back(estimate::ParamWithError(p));
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

/// Who follows which computation, when witnesses computed a column
/// differently.
void Computations(const pipeline::ColumnReference& r, std::ostream& out) {
  if (r.variants.empty()) return;
  for (const auto& v : r.variants) {
    out << "  - " << Join(v.followers, ", ") << (v.followers.size() == 1 ? " follows " : " follow ")
        << "another computation: " << v.description << " (" << v.exact << " of " << v.entries
        << " entries exact)\n";
  }
  out << "  - the others follow " << r.description << "\n";
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
    if (!r.adoption.empty()) out << "  - round values: " << r.adoption << "\n";
    if (!r.naming.empty()) out << "  - " << r.naming << "\n";
    if (!r.explains)
      out << "  - " << r.verdict
          << "; its entries are screened without a model and no reading is proposed from it\n";
    Computations(r, out);
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

/// The arguments and current readings of a finding's cells in the witness.
struct FoundCell {
  std::string arg;
  std::string reading;
};

std::vector<FoundCell> FoundCells(const Transcription& t, const deviation::Finding& f) {
  std::vector<FoundCell> out;
  for (const auto& c : f.cells) {
    const auto arg = t.ArgumentInUse(c.row);
    out.push_back({arg ? arg->ToString() : c.arg, c.tabulated});
  }
  return out;
}

}  // namespace

std::string DecidedBy(const pipeline::Decision& d) {
  std::string out = d.editor + " on " + d.decided_at.substr(0, 10);
  return d.note.empty() ? out : out + ": " + d.note;
}

std::string DecisionWords(const pipeline::TableAnalysis& a, const std::string& siglum,
                          const deviation::Finding& f) {
  const Transcription* t = nullptr;
  for (const auto& x : a.transcriptions) {
    if (x.witness.siglum == siglum) t = &x;
  }
  if (!t) return "";
  const auto cells = FoundCells(*t, f);
  std::string out;
  if (const auto* w = a.decisions.At(siglum, f.column_name, cells.front().arg)) {
    const auto& first = f.cells.front().emendation;
    const bool same = first && first->ToString() == w->cell.proposed;
    out = w->decision.action == pipeline::Action::kAccept
              ? "accepted by " + DecidedBy(w->decision) +
                    (same ? "" : " (adopting " + w->cell.proposed + ")")
              : "rejected by " + DecidedBy(w->decision) + "; the reading is kept";
  } else {
    out = "undecided";
    for (const auto& w : a.decisions.witness_cells) {
      if (w.applies || w.cell.witness != siglum || w.cell.column != f.column_name ||
          w.cell.arg != cells.front().arg)
        continue;
      out = "review: " + std::string(pipeline::ToString(w.decision.action)) + "ed by " +
            DecidedBy(w.decision) + " when " + siglum + " read " + w.cell.reading +
            "; it now reads " + (w.now.empty() ? "nothing" : w.now);
    }
  }
  if (const auto* e = a.decisions.EditedAt(cells.front().arg, f.column_name)) {
    out += "; the edited text reads " + e->reading + " (" + pipeline::ToString(e->decision.action) +
           " by " + DecidedBy(e->decision) + ")";
  }
  return out;
}

namespace {

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
      const std::string decided = departure ? "" : DecisionWords(a, w.siglum, f);
      out << "- " << f.Note(w.siglum) << (decided.empty() ? "" : " - " + decided) << "\n";
      ++shown;
    }
    if (hidden) {
      out << "- ... and " << hidden << " more (apograph errors --table " << a.table_id
          << " --witness " << w.siglum << " --auto)\n";
    }
    out << "\n";
  }
}

void Lineage(const lineage::LineageReport& l, std::ostream& out) {
  out << lineage::DescribeLineage(l, {.markdown = true}) << "\n";
}

std::string CellName(const Apparatus& app, std::size_t r, std::size_t c) {
  return app.arguments[r].ToString() + " " + app.columns[c].name;
}

/// The editor's decisions in force, counted.
void DecisionSummary(const pipeline::TableDecisions& d, std::ostream& out) {
  int accepted = 0, rejected = 0, overrides = 0, conjectures = 0;
  std::set<std::int64_t> seen;
  for (const auto& w : d.witness_cells) {
    if (!w.applies || !seen.insert(w.decision.id).second) continue;
    (w.decision.action == pipeline::Action::kAccept ? accepted : rejected)++;
  }
  for (const auto& e : d.edited_cells)
    (e.decision.action == pipeline::Action::kConjecture ? conjectures : overrides)++;
  out << "The editor's decisions in force: " << accepted << " emendations accepted, " << rejected
      << " rejected, " << overrides << " readings adopted, " << conjectures << " conjectures";
  const auto editors = d.Editors();
  if (!editors.empty()) out << " (by " << Join(editors, ", ") << ")";
  out << ".\n";
  for (const auto& w : d.witness_cells) {
    if (w.applies) continue;
    out << "- review: decision " << w.decision.id << " (" << pipeline::ToString(w.decision.action)
        << " by " << DecidedBy(w.decision) << ") on " << w.cell.witness << " " << w.cell.arg << " "
        << w.cell.column << " was made when it read " << w.cell.reading << "; it now reads "
        << (w.now.empty() ? "nothing" : w.now) << "\n";
  }
}

void ApparatusSummary(const pipeline::TableAnalysis& a, std::ostream& out) {
  const Apparatus app = BuildApparatus(a);
  int with_variants = 0, editorial = 0, undetermined = 0;
  std::vector<std::string> restored, deviating;
  for (std::size_t r = 0; r < app.cells.size(); ++r) {
    for (std::size_t c = 0; c < app.cells[r].size(); ++c) {
      const ApparatusEntry& e = app.cells[r][c];
      with_variants += e.HasVariants();
      editorial += e.Editorial();
      undetermined += e.reason.rfind("no model and no majority", 0) == 0;
      if (e.source == LemmaSource::kRestored)
        restored.push_back(CellName(app, r, c) + ": " + e.lemma + " (" + e.reason + ")");
      if (e.lemma_error)
        deviating.push_back(CellName(app, r, c) + ": adopted " + e.lemma + " (" + e.reason + ")");
    }
  }
  out << "### The edited table\n\n"
      << app.cells.size() << " rows; " << with_variants
      << " cells with variant readings in the apparatus; " << editorial
      << " readings decided by the editor";
  if (undetermined) out << "; " << undetermined << " cells undetermined (no model, no majority)";
  out << ".\n";
  DecisionSummary(a.decisions, out);
  if (!restored.empty()) {
    out << "Conjectures restored by recomputation where every witness deviates (the editor "
           "confirms with apograph emendation conjecture, or adopts a reading with apograph "
           "emendation override):\n";
    for (const auto& line : restored) out << "- " << line << "\n";
  }
  for (const auto& line : deviating) out << "- " << line << "\n";
  out << "\n";
}

}  // namespace

std::string TableReport(const pipeline::TableAnalysis& a, const ReportOptions& o) {
  std::ostringstream out;
  out << "## " << a.table_id << (a.table_title.empty() ? "" : ": " + a.table_title);
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
  out << "## Stemma of the work " << work_id;
  if (!lineage.title.empty()) out << ", " << lineage.title;
  out << " (all its tables together)\n\n";
  Lineage(lineage, out);
  return out.str();
}

}  // namespace apograph::publish
