#include "pipeline/derived_references.hpp"

#include <algorithm>
#include <cmath>
#include <map>

#include "estimate/derived_columns.hpp"
#include "estimate/derived_model.hpp"
#include "estimate/identify.hpp"

namespace apograph::pipeline::internal {

namespace {

using estimate::DerivedBasis;

const ColumnReference* ByName(const std::vector<ColumnReference>& refs, const std::string& name) {
  for (const auto& r : refs) {
    if (r.column_name == name) return &r;
  }
  return nullptr;
}

/// The rounded and exact values of every explained, non-derived reference,
/// recomputed on witness `w` (indexed by w's own columns).
estimate::DerivedInputs Inputs(const Transcription& w, const std::vector<ColumnReference>& refs) {
  estimate::DerivedInputs in;
  in.exact.resize(w.columns.size());
  in.rounded.resize(w.columns.size());
  in.exact_signed.resize(w.columns.size());
  in.rounded_signed.resize(w.columns.size());
  for (const auto& r : refs) {
    const int c = w.ColumnIndex(r.column_name);
    if (c < 0 || !r.explains || !r.derived.empty()) continue;
    const auto re = model::Recompute(*r.model, r.params, w, c, r.practice);
    // Exact values are the function's own, without the interpolation grid
    // that fills the source's table (as DerivedModel computes them).
    model::Practice plain = r.practice;
    plain.grid = 0, plain.round_nodes = false;
    in.exact[static_cast<std::size_t>(c)] = model::Recompute(*r.model, r.params, w, c, plain).exact;
    in.rounded[static_cast<std::size_t>(c)] = re.computed;
    if (r.model->ResolvedSign(r.practice.sign) != model::SignForm::kMagnitude) continue;
    model::Practice p = r.practice;  // a sum adds the signed quantity
    p.sign = model::SignForm::kSigned;
    const auto signed_re = model::Recompute(*r.model, r.params, w, c, p);
    plain.sign = model::SignForm::kSigned;
    in.exact_signed[static_cast<std::size_t>(c)] =
        model::Recompute(*r.model, r.params, w, c, plain).exact;
    in.rounded_signed[static_cast<std::size_t>(c)] = signed_re.computed;
  }
  return in;
}

/// A detection with the witness it was made on.
struct Found {
  estimate::DerivedColumn d;
  const Transcription* witness = nullptr;
  std::string target, source, other;  ///< column names
};

/// For each derived column (by name), the detection that reproduces most.
std::map<std::string, Found> Detect(const std::vector<const Transcription*>& ws,
                                    const std::vector<ColumnReference>& refs) {
  std::map<std::string, Found> out;
  for (const Transcription* w : ws) {
    const auto inputs = Inputs(*w, refs);
    for (const auto& d : estimate::DetectDerivedColumns(*w, &inputs)) {
      const auto name = [&](int c) { return w->columns[static_cast<std::size_t>(c)].name; };
      const int best = std::max({d.matched_tabulated, d.matched_rounded, d.matched_precise});
      auto it = out.find(name(d.column));
      if (it != out.end()) {
        const auto& o = it->second.d;
        if (std::max({o.matched_tabulated, o.matched_rounded, o.matched_precise}) >= best) continue;
      }
      out[name(d.column)] = {d, w, name(d.column), name(d.source),
                             d.other >= 0 ? name(d.other) : ""};
    }
  }
  return out;
}

double StepOf(const Transcription& t) {
  if (t.argument.step) return t.argument.step->ToDouble();
  std::vector<double> args;
  for (std::size_t r = 0; r < t.rows.size() && args.size() < 2; ++r) {
    if (auto a = model::RowArgument(t, r)) args.push_back(*a);
  }
  return args.size() == 2 ? args[1] - args[0] : 1;
}

/// The source columns as the derived model reads them; the models only when
/// every source reference explains its column (rounded and exact bases need
/// them).
std::vector<estimate::DerivedSource> Sources(const Found& f,
                                             const std::vector<ColumnReference>& refs,
                                             bool& modelled) {
  std::vector<estimate::DerivedSource> out;
  modelled = true;
  for (const std::string& name : {f.source, f.other}) {
    if (name.empty()) continue;
    estimate::DerivedSource s;
    s.column = name;
    const ColumnReference* r = ByName(refs, name);
    if (r && r->explains && r->derived.empty()) {
      s.model = r->model;
      s.params = r->params;
      s.practice = r->practice;
    } else {
      modelled = false;
    }
    out.push_back(s);
  }
  return out;
}

/// Entries of a witness's column reproduced exactly and within one unit.
struct Counts {
  int exact = 0, within1 = 0, n = 0;
};

Counts Count(const model::Model& m, const model::Practice& p, const Transcription& w,
             const std::string& column) {
  Counts c;
  const int col = w.ColumnIndex(column);
  if (col < 0) return c;
  const auto re = model::Recompute(m, {}, w, col, p);
  for (std::size_t r = 0; r < w.rows.size(); ++r) {
    const Cell& cell = w.rows[r].cells[static_cast<std::size_t>(col)];
    if (cell.state != CellState::kRead || !cell.value || !re.computed[r]) continue;
    ++c.n;
    const double d = DiffUnits(*cell.value, *re.computed[r],
                               std::max(p.places.value_or(0), cell.value->places()));
    c.exact += d == 0;
    c.within1 += std::fabs(d) <= 1;
  }
  return c;
}

/// The identification score (estimate::Score) of the model identified and
/// of a derived computation, on the rows where both give a value (a
/// difference has none at the table's end). The model pays for the
/// parameters identify counted, the relation for kDerivedPenalised.
struct Scores {
  double model = 0, derived = 0;
};

void AddEntry(estimate::FitResult& f, const Sexagesimal& tabulated, const Sexagesimal& computed,
              int places) {
  estimate::FitEntry e;
  e.tabulated = tabulated;
  e.computed = computed;
  e.diff_units = DiffUnits(tabulated, computed, std::max(places, tabulated.places()));
  f.entries.push_back(e);
}

Scores Compare(const ColumnReference& identified, const model::Model& derived,
               const model::Practice& p, const Transcription& w, const std::string& column) {
  Scores s;
  const int col = w.ColumnIndex(column);
  if (col < 0) return s;
  const auto a =
      model::Recompute(*identified.model, identified.params, w, col, identified.practice);
  const auto b = model::Recompute(derived, {}, w, col, p);
  estimate::FitResult fa, fb;
  for (std::size_t r = 0; r < w.rows.size(); ++r) {
    const Cell& cell = w.rows[r].cells[static_cast<std::size_t>(col)];
    if (cell.state != CellState::kRead || !cell.value || !a.computed[r] || !b.computed[r]) continue;
    AddEntry(fa, *cell.value, *a.computed[r], identified.practice.places.value_or(0));
    AddEntry(fb, *cell.value, *b.computed[r], p.places.value_or(0));
  }
  s.model = estimate::Score(fa, identified.penalised_parameters);
  s.derived = estimate::Score(fb, kDerivedPenalised);
  return s;
}

/// One computation of the derived column.
struct Computation {
  DerivedBasis basis;
  std::shared_ptr<const estimate::DerivedModel> model;
  std::vector<Counts> per_witness;
  int exact = 0;
};

ColumnReference Reference(const ColumnReference& base, const Computation& c, const Found& f,
                          const Counts& on_witness, const std::string& witness) {
  ColumnReference r;
  r.column = base.column;
  r.column_name = base.column_name;
  r.model = c.model;
  r.practice.rounding = f.d.rounding;
  r.practice.places = base.practice.places;
  r.source = ReferenceSource::kIdentified;
  r.witness = witness;
  r.entries = on_witness.n;
  r.exact = on_witness.exact;
  r.within_one = on_witness.within1;
  r.explains = on_witness.n > 0 && on_witness.within1 >= estimate::kExplainedShare * on_witness.n;
  r.derived = c.model->description();
  r.description =
      c.model->description() + ", " + DescribePractice(r.practice, r.practice.places.value_or(0));
  r.how = "derived column, identified from witness " + witness + " (" + std::to_string(r.exact) +
          " of " + std::to_string(r.entries) + " entries exact, " + std::to_string(r.within_one) +
          " within one unit): " + f.d.evidence;
  if (!r.explains)
    r.verdict = "the relation reproduces fewer than " +
                std::to_string(static_cast<int>(100 * estimate::kExplainedShare)) +
                "% of the entries within one unit";
  return r;
}

/// The computations of `f` counted on every witness, in order of
/// preference: the author's (from rounded entries), from exact values, from
/// each witness's own entries.
std::vector<Computation> Computations(const Found& f, const std::vector<ColumnReference>& refs,
                                      const ColumnReference& base,
                                      const std::vector<const Transcription*>& ws) {
  bool modelled = false;
  const auto sources = Sources(f, refs, modelled);
  std::vector<Computation> out;
  for (DerivedBasis b : {DerivedBasis::kRounded, DerivedBasis::kExact, DerivedBasis::kOwnEntries}) {
    if (b != DerivedBasis::kOwnEntries && !modelled) continue;
    Computation c{b,
                  std::make_shared<estimate::DerivedModel>("derived", f.d.spec, b, sources,
                                                           base.practice.places.value_or(0),
                                                           f.d.rounding, StepOf(*ws.front())),
                  {},
                  0};
    model::Practice p;
    p.rounding = f.d.rounding;
    p.places = base.practice.places;
    for (const Transcription* w : ws) {
      c.per_witness.push_back(Count(*c.model, p, *w, f.target));
      c.exact += c.per_witness.back().exact;
    }
    out.push_back(std::move(c));
  }
  return out;
}

/// The computation witness i follows: the first (the preferred) unless
/// another reproduces clearly more of its entries exactly
/// (kVariantEntries, kVariantShare).
std::size_t Follows(const std::vector<Computation>& all, std::size_t i) {
  std::size_t best = 0;
  for (std::size_t k = 1; k < all.size(); ++k) {
    const Counts& base = all[best].per_witness[i];
    const int margin = std::max(kVariantEntries, static_cast<int>(kVariantShare * base.n));
    if (all[k].per_witness[i].exact >= base.exact + margin) best = k;
  }
  return best;
}

/// The derived reference for `f` (the computation most witnesses follow),
/// with a variant for each other computation some witness follows; nullopt
/// when the model identified explains the column and scores higher on its
/// witness (Compare).
std::optional<ColumnReference> Derived(const Found& f, const std::vector<ColumnReference>& refs,
                                       const ColumnReference& identified,
                                       const std::vector<const Transcription*>& ws) {
  const auto all = Computations(f, refs, identified, ws);
  if (all.empty()) return std::nullopt;
  std::vector<std::size_t> follows(ws.size());
  std::vector<int> votes(all.size(), 0);
  for (std::size_t i = 0; i < ws.size(); ++i) ++votes[follows[i] = Follows(all, i)];
  const std::size_t main = static_cast<std::size_t>(std::max_element(votes.begin(), votes.end()) -
                                                    votes.begin());  // ties: the preferred
  // Compared with the model on the witness the model was identified from
  // (a column nothing else explains takes the relation as it is).
  std::size_t at = 0;
  for (std::size_t i = 0; i < ws.size(); ++i) {
    if (ws[i]->witness.siglum == identified.witness) at = i;
  }
  const Counts& here = all[main].per_witness[at];
  if (identified.explains) {
    model::Practice p;
    p.rounding = f.d.rounding;
    p.places = identified.practice.places;
    const Scores s = Compare(identified, *all[main].model, p, *ws[at], f.target);
    if (s.derived < s.model) return std::nullopt;
  }
  ColumnReference r = Reference(identified, all[main], f, here, ws[at]->witness.siglum);
  for (std::size_t k = 0; k < all.size(); ++k) {
    if (k == main || votes[k] == 0) continue;
    std::size_t first = 0;
    while (follows[first] != k) ++first;
    ColumnReference v =
        Reference(identified, all[k], f, all[k].per_witness[first], ws[first]->witness.siglum);
    for (std::size_t i = 0; i < ws.size(); ++i) {
      if (follows[i] == k) v.followers.push_back(ws[i]->witness.siglum);
    }
    r.variants.push_back(std::move(v));
  }
  return r;
}

/// `f` makes its column from a column that is itself made from f's column
/// (true = mean + equation, equation = true - mean): the entries cannot
/// say which was computed first; the column written after its sources is
/// taken as the derived one (judgement: tables write a sum after its terms).
bool Circular(const Found& f, const std::map<std::string, Found>& found, const Transcription& t) {
  for (const std::string& source : {f.source, f.other}) {
    auto it = found.find(source);
    if (source.empty() || it == found.end()) continue;
    const Found& g = it->second;
    if (g.source != f.target && g.other != f.target) continue;
    if (t.ColumnIndex(f.target) < t.ColumnIndex(g.target)) return true;
  }
  return false;
}

}  // namespace

void AddDerivedReferences(const std::vector<const Transcription*>& witnesses,
                          std::vector<ColumnReference>& references) {
  if (witnesses.empty()) return;
  const auto found = Detect(witnesses, references);
  for (const auto& [column, f] : found) {
    if (Circular(f, found, *witnesses.front())) continue;
    const std::string& name = column;  // a structured binding is not captured before C++20
    auto it = std::find_if(references.begin(), references.end(),
                           [&](const ColumnReference& r) { return r.column_name == name; });
    if (it == references.end()) continue;
    if (auto d = Derived(f, references, *it, witnesses)) *it = std::move(*d);
  }
}

}  // namespace apograph::pipeline::internal
