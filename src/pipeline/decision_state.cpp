// Which decision holds where: findings matched to decisions cell by cell,
// across revisions (see decisions.hpp for the rules).
#include "pipeline/decision_state.hpp"

#include <algorithm>

#include "store/edition_store.hpp"

namespace apograph::pipeline::internal {
namespace {

using store::DecisionRow;

bool OnFinding(const DecisionRow& d) { return d.action == "accept" || d.action == "reject"; }

std::int64_t Head(const store::EmendationRecord& e) { return e.finding.value_or(e.id); }

/// The cells of a finding as one comparable key.
std::vector<std::string> Key(const FindingState& f) {
  std::vector<std::string> key{f.witness};
  for (const auto& c : f.cells)
    key.push_back(f.column + "\n" + c.arg + "\n" + c.tabulated + "\n" + c.proposed);
  return key;
}

std::string ChangedWords(const FindingState& f) {
  std::string out;
  for (const auto& c : f.cells) {
    if (!c.now) continue;
    out += (out.empty() ? "" : "; ") + std::string("at ") + c.arg + " " + f.witness + " read " +
           c.tabulated + " in revision " + std::to_string(f.revision) + ", revision " +
           std::to_string(f.current_revision) +
           (c.now->empty() ? " has no reading there" : " reads " + *c.now);
  }
  return out;
}

}  // namespace

std::optional<std::string> Canonical(const std::string& text) {
  auto v = Sexagesimal::Parse(text);
  if (!v) return std::nullopt;
  return v->ToString();
}

std::string StateToken(FindingStatus status, const std::optional<Decision>& decision) {
  std::string out = ToString(status);
  if (decision && status != FindingStatus::kProposed && status != FindingStatus::kSuperseded)
    out += ":" + std::to_string(decision->id);
  return out;
}

Decision ToDecision(const DecisionRow& row) {
  Decision d;
  d.id = row.id;
  d.action = ActionFromString(row.action).value_or(Action::kUndo);
  d.table_id = row.table_id;
  d.editor = row.editor;
  d.decided_at = row.decided_at;
  d.note = row.note;
  d.finding = row.finding;
  d.witness = row.siglum;
  d.revision = row.revision;
  for (const auto& c : row.cells)
    d.cells.push_back({c.siglum, c.column_name, c.argument, c.reading, c.proposed});
  d.arg = row.argument;
  d.column = row.column_name;
  d.reading = row.reading;
  d.undoes = row.undoes;
  return d;
}

DecisionContext::DecisionContext(store::Database& db, const std::string& table_id,
                                 const std::vector<Transcription>* given)
    : db_(db), table_id_(table_id), rows_(store::LoadDecisions(db, table_id)) {
  for (const auto& d : rows_) {
    if (d.undoes) undone_[*d.undoes] = d.id;
  }
  for (const auto& d : rows_) {
    if (d.action != "undo" && !undone_.count(d.id)) in_force_.push_back(&d);
  }
  const auto loaded = given ? std::vector<Transcription>{} : store::LoadTable(db, table_id);
  for (const auto& t : given ? *given : loaded) {
    auto& rows = row_of_[t.witness.siglum];
    for (std::size_t r = 0; r < t.rows.size(); ++r) {
      if (auto arg = t.ArgumentInUse(r)) rows.emplace(arg->ToString(), static_cast<int>(r));
    }
    current_.emplace(t.witness.siglum, t);
  }
}

std::optional<int> DecisionContext::RowAt(const std::string& siglum, const std::string& arg) const {
  auto w = row_of_.find(siglum);
  if (w == row_of_.end()) return std::nullopt;
  auto r = w->second.find(arg);
  if (r == w->second.end()) return std::nullopt;
  return r->second;
}

std::optional<std::string> DecisionContext::ReadingAt(const std::string& siglum,
                                                      const std::string& column,
                                                      const std::string& arg) const {
  const auto row = RowAt(siglum, arg);
  if (!row) return std::nullopt;
  const Transcription& t = current_.at(siglum);
  const int c = t.ColumnIndex(column);
  if (c < 0) return std::nullopt;
  return t.rows[static_cast<std::size_t>(*row)].cells[static_cast<std::size_t>(c)].raw;
}

int DecisionContext::CurrentRevision(const std::string& siglum) {
  auto it = current_revision_.find(siglum);
  if (it == current_revision_.end())
    it = current_revision_.emplace(siglum, store::CurrentRevision(db_, table_id_, siglum)).first;
  return it->second;
}

const DecisionRow* DecisionContext::Find(std::int64_t id) const {
  for (const auto& d : rows_) {
    if (d.id == id) return &d;
  }
  return nullptr;
}

std::optional<std::int64_t> DecisionContext::WithdrawnBy(std::int64_t id) const {
  auto it = undone_.find(id);
  if (it == undone_.end()) return std::nullopt;
  return it->second;
}

std::string DecisionContext::ArgumentOf(const store::EmendationRecord& e) {
  const auto cur = current_.find(e.siglum);
  const Transcription* t = nullptr;
  if (cur != current_.end() && CurrentRevision(e.siglum) == e.revision) {
    t = &cur->second;
  } else {
    auto key = std::make_pair(e.siglum, e.revision);
    auto it = revisions_.find(key);
    if (it == revisions_.end())
      it = revisions_.emplace(key, store::Load(db_, table_id_, e.siglum, e.revision)).first;
    t = &it->second;
  }
  if (e.row >= 0 && static_cast<std::size_t>(e.row) < t->rows.size()) {
    if (auto arg = t->ArgumentInUse(static_cast<std::size_t>(e.row))) return arg->ToString();
  }
  return Canonical(e.arg).value_or(e.arg);
}

FindingCell DecisionContext::MakeCell(const store::EmendationRecord& e) {
  FindingCell c;
  c.emendation = e.id;
  c.row = e.row;
  c.written_arg = e.arg;
  c.arg = ArgumentOf(e);
  c.tabulated = e.tabulated;
  c.proposed = e.proposed;
  const auto now = ReadingAt(e.siglum, e.column_name, c.arg);
  if (now != e.tabulated) c.now = now.value_or("");
  return c;
}

const DecisionRow* DecisionContext::Match(const std::string& siglum, const std::string& column,
                                          const FindingCell& c) const {
  const DecisionRow* best = nullptr;
  for (const auto* d : InForce()) {
    if (!OnFinding(*d)) continue;
    for (const auto& x : d->cells) {
      if (x.siglum == siglum && x.argument == c.arg && x.reading == c.tabulated &&
          x.proposed == c.proposed && x.column_name == column)
        best = d;
    }
  }
  return best;
}

const DecisionRow* DecisionContext::EarlierOnCell(const std::string& siglum,
                                                  const std::string& column,
                                                  const FindingCell& c) const {
  for (const auto* d : InForce()) {
    if (!OnFinding(*d)) continue;
    for (const auto& x : d->cells) {
      if (x.siglum == siglum && x.column_name == column && x.argument == c.arg &&
          x.reading != c.tabulated)
        return d;
    }
  }
  return nullptr;
}

void DecisionContext::Judge(FindingState& f, const std::vector<const DecisionRow*>& per_cell) {
  const bool changed =
      std::any_of(f.cells.begin(), f.cells.end(), [](const FindingCell& c) { return c.now; });
  const DecisionRow* latest = nullptr;
  bool uniform = true;
  for (const auto* d : per_cell) {
    if (!d || (latest && d != latest)) uniform = false;
    if (d && (!latest || d->id > latest->id)) latest = d;
  }
  if (latest) {
    f.decision = ToDecision(*latest);
    f.carried = latest->finding != f.id;
    f.status = latest->action == "accept" ? FindingStatus::kAccepted : FindingStatus::kRejected;
    if (changed) {
      f.status = FindingStatus::kReview;
      f.review = "decided (" + latest->action + ") when " + ChangedWords(f);
    } else if (!uniform) {
      f.status = FindingStatus::kReview;
      f.review = "the cells of this finding carry different decisions: decide it again";
    }
    return;
  }
  if (changed) {
    f.status = FindingStatus::kSuperseded;
    f.review = "proposed when " + ChangedWords(f);
    return;
  }
  for (const auto& c : f.cells) {
    if (const auto* d = EarlierOnCell(f.witness, f.column, c)) {
      f.review = "decision " + std::to_string(d->id) + " (" + d->action + " by " + d->editor +
                 ") was made on another reading of this cell and no longer applies";
      break;
    }
  }
}

FindingState DecisionContext::Evaluate(const std::vector<store::EmendationRecord>& group) {
  const auto& e = group.front();
  FindingState f;
  f.id = Head(e);
  f.table_id = e.table_id;
  f.witness = e.siglum;
  f.revision = e.revision;
  f.current_revision = CurrentRevision(e.siglum);
  f.column = e.column_name;
  f.cls = e.cls;
  f.evidence = e.evidence;
  f.score = e.score;
  f.model = e.model;
  f.proposed_at = e.proposed_at;
  std::vector<const DecisionRow*> per_cell;
  for (const auto& x : group) {
    f.cells.push_back(MakeCell(x));
    per_cell.push_back(Match(e.siglum, e.column_name, f.cells.back()));
  }
  Judge(f, per_cell);
  f.state = StateToken(f.status, f.decision);
  return f;
}

std::vector<FindingState> DecisionContext::EvaluateAll(const std::optional<std::string>& witness) {
  store::EmendationFilter filter;
  filter.table_id = table_id_;
  filter.siglum = witness;
  std::vector<std::vector<store::EmendationRecord>> groups;
  std::map<std::int64_t, std::size_t> group_of;
  for (auto& e : store::ListEmendations(db_, filter)) {
    auto [it, fresh] = group_of.emplace(Head(e), groups.size());
    if (fresh) groups.emplace_back();
    groups[it->second].push_back(std::move(e));
  }
  std::vector<FindingState> out;
  for (const auto& g : groups) out.push_back(Evaluate(g));
  // The same proposal made again for a later revision replaces the earlier one.
  std::map<std::vector<std::string>, std::size_t> newest;
  for (std::size_t i = 0; i < out.size(); ++i) {
    auto [it, fresh] = newest.emplace(Key(out[i]), i);
    if (fresh) continue;
    std::size_t& kept = it->second;
    const bool later = out[i].revision > out[kept].revision;
    std::size_t old = later ? kept : i;
    if (later) kept = i;
    out[old].review = "proposed again as emendation " + std::to_string(out[kept].id);
    out[old].status = FindingStatus::kSuperseded;
    out[old].state = StateToken(out[old].status, out[old].decision);
  }
  return out;
}

std::vector<EditedCellDecision> DecisionContext::EditedCells() const {
  std::map<std::pair<std::string, std::string>, const DecisionRow*> latest;
  for (const auto* d : InForce()) {
    if (d->action == "override" || d->action == "conjecture")
      latest[{d->argument, d->column_name}] = d;
  }
  std::vector<EditedCellDecision> out;
  for (const auto& [key, d] : latest) {
    out.push_back({table_id_, d->argument, d->column_name, d->reading, ToDecision(*d),
                   d->action + ":" + std::to_string(d->id)});
  }
  return out;
}

void DecisionContext::RefreshMirrors(const std::optional<std::string>& witness) {
  for (const auto& f : EvaluateAll(witness)) {
    std::string status = "proposed";
    if (f.decision) status = f.decision->action == Action::kAccept ? "accepted" : "rejected";
    const std::optional<std::string> at =
        f.decision ? std::optional<std::string>(f.decision->decided_at) : std::nullopt;
    const std::string note = f.decision ? f.decision->note : "";
    for (const auto& c : f.cells)
      store::MirrorEmendationStatus(db_, c.emendation, status, at, note);
  }
}

}  // namespace apograph::pipeline::internal
