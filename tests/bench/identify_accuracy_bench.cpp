// Accuracy of identification and estimation on the shared generator
// (tests/synth), built with -DAPOGRAPH_BENCH=ON:
//   ./build-bench/identify_accuracy_bench [draws=300] [first_seed=1] [max_rate=0.2]
// (BENCH_VERBOSE=1: every column's reference, =2 with the generator's key
// below, =3 also each parameter missed; BENCH_SEEDS=a,b: those draws only;
// BENCH_DUMP=DIR: each witness written to DIR/SEED.apo, to run the command
// line on it)
//
// Each draw: an author's table of one family (synth::DrawTable, families in
// turn, every other option at the generator's defaults: round, attested and
// non-round parameters, rounding or truncation, grids, signed / magnitude /
// displaced forms, derived columns from rounded or exact values, the
// author's one- and two-unit departures, columns no model explains), copied
// once by a manuscript hand (synth::CopyTable: the generator's own slips,
// a quarter outside every look-alike list) at a corruption rate of 0.02,
// 0.07, 0.13 or 0.2 of the entries (in turn; scaled by max_rate / 0.2);
// then every column identified from that one witness with the model
// estimated, not given (pipeline::ResolveReferences, automatic, with the
// shipped catalog). Per family of the column:
//  - identified: the name shown is one of the models that compute the
//    column's values (synth::EquivalentModels; for the columns of the
//    composite tables the model named below) and the column is said to be
//    explained; derived columns: identified as derived from the right
//    source with the right basis (rounded entries or exact values);
//  - parameters: each parameter of an identified column equals the value
//    the author used (a round or attested value adopted) or lies within 2
//    standard errors of it (1 standard error in brackets);
//  - round adopted: of the parameters the author took round or attested,
//    those adopted at exactly that value;
//  - nothing fits: said for the columns no model explains / said for
//    columns a model explains.
#include <chrono>
#include <cmath>
#include <cstdio>
#include <ctime>
#include <fstream>
#include <map>
#include <string>

#include "estimate/catalog.hpp"
#include "estimate/derived_model.hpp"
#include "pipeline/reference.hpp"
#include "support/input_error.hpp"
#include "synth/copying.hpp"
#include "synth/tables.hpp"
#include "transcription/writer.hpp"

using namespace apograph;

namespace {

struct Tally {
  int columns = 0, identified = 0;
  int params = 0, params_ok = 0, params_1se = 0;
  int round_used = 0, round_adopted = 0;
  int unexplained = 0, unexplained_said = 0;
  int explained = 0, explained_said_none = 0;
  double seconds = 0;
  bool print_misses = false;  ///< BENCH_VERBOSE=3: each parameter missed, with its key
};

/// BENCH_DUMP: `w` written to `path`; false, with the reason on stderr,
/// when the file cannot be opened or written.
bool Dump(const std::string& path, const Transcription& w) {
  std::ofstream out(path, std::ios::binary | std::ios::trunc);
  if (!out) {
    std::fprintf(stderr, "BENCH_DUMP: cannot open %s for writing\n", path.c_str());
    return false;
  }
  out << WriteTranscription(w);
  out.close();
  if (!out) {
    std::fprintf(stderr, "BENCH_DUMP: could not write %s\n", path.c_str());
    return false;
  }
  return true;
}

std::string Pct(int a, int b) {
  if (b == 0) return "-";
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f%% (%d/%d)", 100.0 * a / b, a, b);
  return buf;
}

bool IsAngle(const std::string& name) {
  return name == "radix" || name == "apogee" || name == "anomaly-radix";
}

/// The models that compute a column, with apograph's parameter names.
std::vector<synth::EquivalentModel> Expected(const synth::ColumnKey& c) {
  auto out = synth::EquivalentModels(c);
  if (!out.empty() || c.role != synth::ColumnKey::Role::kModel) return out;
  const synth::Function& f = c.function;
  if (f.family == synth::Family::kTrueSun && f.variant == "mean")
    return {{"mean-motion", {{"radix", f.Param("radix")}, {"rate", f.Param("rate")}}, ""}};
  if (f.family == synth::Family::kTrueSun && f.variant == "equation") {
    const double a = std::fmod(f.Param("radix") - f.Param("apogee") + 720, 360);
    return {
        {"solar-equation-by-date",
         {{"anomaly-radix", a}, {"anomaly-rate", f.Param("rate")}, {"e", f.Param("eccentricity")}},
         ""}};
  }
  if (f.family == synth::Family::kPlanetPosition) {
    if (f.variant == "mean-longitude")
      return {{"mean-motion",
               {{"radix", f.Param("radix-longitude")}, {"rate", f.Param("rate-longitude")}},
               ""}};
    if (f.variant == "anomaly")
      return {{"mean-motion",
               {{"radix", f.Param("radix-anomaly")}, {"rate", f.Param("rate-anomaly")}},
               ""}};
    std::vector<std::pair<std::string, double>> p = {
        {"radix", f.Param("radix-longitude")},       {"rate", f.Param("rate-longitude")},
        {"anomaly-radix", f.Param("radix-anomaly")}, {"anomaly-rate", f.Param("rate-anomaly")},
        {"r", f.Param("epicycle-radius")},           {"e", f.Param("eccentricity")}};
    if (f.Param("eccentricity") > 0) p.push_back({"apogee", f.Param("apogee")});
    return {{"planet-position", p, ""}};
  }
  return {};
}

/// The key's basis of a parameter value ("round", "attested (from memory)",
/// "non-round (near X)", "derived ..."), matched by value.
std::string Basis(const synth::ColumnKey& c, double value) {
  for (const auto& p : c.function.params) {
    if (std::fabs(p.value - value) <= 1e-12 * std::max(1.0, std::fabs(value))) return p.basis;
  }
  return "derived";
}

double Distance(const std::string& name, double a, double b) {
  double d = std::fabs(a - b);
  if (IsAngle(name)) d = std::fmod(d, 360.0), d = std::min(d, 360 - d);
  return d;
}

std::string RowName(const synth::ColumnKey& c);

void ScoreParams(const synth::ColumnKey& c, const synth::EquivalentModel& m,
                 const pipeline::ColumnReference& r, Tally& t) {
  for (const auto& [name, truth] : m.params) {
    if (name == "modulus") continue;
    const int i = r.model->ParamIndex(name);
    if (i < 0) continue;
    const double ours = r.params[static_cast<std::size_t>(i)];
    const estimate::AdoptedValue* adopted = nullptr;
    for (const auto& a : r.adopted) {
      if (a.param == name) adopted = &a;
    }
    double se = NAN, fitted = ours;
    for (const auto& p : r.estimates) {
      if (p.name == name) se = p.stderr_, fitted = p.value;
    }
    const bool equal = Distance(name, ours, truth) <= 1e-9 * std::max(1.0, std::fabs(truth));
    const bool within2 = !adopted && std::isfinite(se) && Distance(name, fitted, truth) <= 2 * se;
    const bool within1 = !adopted && std::isfinite(se) && Distance(name, fitted, truth) <= se;
    ++t.params;
    t.params_ok += equal || within2;
    t.params_1se += equal || within1;
    const std::string basis = Basis(c, truth);
    const bool round = basis.rfind("round", 0) == 0 || basis.rfind("attested", 0) == 0;
    if (round) {
      ++t.round_used;
      t.round_adopted += adopted && equal;
    }
    if (t.print_misses && (!(equal || within2) || (round && !(adopted && equal)))) {
      std::printf(
          "  miss %s/%s %s: truth %.9g (%s), ours %.9g %s, fitted %.9g +- %.3g (%.1f s.e.)\n",
          RowName(c).c_str(), c.name.c_str(), name.c_str(), truth, basis.c_str(), ours,
          adopted ? ("adopted (" + adopted->source + ")").c_str() : "fitted", fitted, se,
          Distance(name, fitted, truth) / se);
    }
  }
}

/// Whether a derived reference has the key's relation and basis.
bool DerivedRight(const synth::ColumnKey& c, const pipeline::ColumnReference& r) {
  const auto* d = dynamic_cast<const estimate::DerivedModel*>(r.model.get());
  if (!d || !c.derived) return false;
  if (d->sources().empty() || d->sources()[0].column != c.derived->from[0]) return false;
  const bool exact = d->basis() == estimate::DerivedBasis::kExact;
  return exact == c.derived->from_exact;
}

/// A derived column's relation as the key gives it ("" for other columns).
std::string DerivedKey(const synth::ColumnKey& c) {
  if (!c.derived) return "";
  const synth::DerivedSpec& d = *c.derived;
  std::string out = d.kind == synth::DerivedSpec::Kind::kSum ? "sum of" : "difference of";
  for (const auto& f : d.from) out += " " + f;
  char buf[128];
  std::snprintf(buf, sizeof buf, ", from %s, span %d %s, divisor %lld%s, %d places",
                d.from_exact ? "exact values" : "tabulated entries", d.span_rows,
                d.forward ? "forward" : "backward", static_cast<long long>(d.divisor),
                d.wrap_360 ? ", wrapped" : "", c.places);
  return out + buf;
}

std::string RowName(const synth::ColumnKey& c) {
  if (c.role == synth::ColumnKey::Role::kUnexplained ||
      c.function.family == synth::Family::kUnexplained)
    return "unexplained";
  if (c.role == synth::ColumnKey::Role::kDerived) return "derived columns";
  return synth::FamilyName(c.function.family);
}

void ScoreColumn(const synth::ColumnKey& c, const pipeline::ColumnReference* r, Tally& t) {
  ++t.columns;
  const bool unexplained = RowName(c) == "unexplained";
  if (unexplained) {
    ++t.unexplained;
    t.unexplained_said += r && !r->explains;
    return;
  }
  ++t.explained;
  if (!r) return;
  t.explained_said_none += !r->explains;
  if (c.role == synth::ColumnKey::Role::kDerived) {
    t.identified += r->explains && (DerivedRight(c, *r) || r->model->name() == "true-sun");
    return;
  }
  for (const auto& m : Expected(c)) {
    if (m.model != r->model->name()) continue;
    t.identified += r->explains;
    ScoreParams(c, m, *r, t);
    return;
  }
}

Transcription Witness(const synth::AuthorTable& author, double rate, synth::Rng& rng) {
  synth::CopyOptions copy;
  copy.rate = rate;
  std::vector<synth::Slip> slips;
  const synth::Hand hand{synth::HandKind::kManuscript, synth::Script::kHinduArabic};
  Transcription w = synth::CopyTable(synth::FromAuthor(author), hand, copy, rng, slips).text;
  w.witness.siglum = "A";
  w.table_id = author.key.id;
  return w;
}

}  // namespace

int main(int argc, char** argv) {
  const int draws = argc > 1 ? std::atoi(argv[1]) : 300;
  const std::uint64_t first = argc > 2 ? std::strtoull(argv[2], nullptr, 10) : 1;
  const double max_rate = argc > 3 ? std::atof(argv[3]) : 0.2;
  const double kRates[] = {0.02, 0.07, 0.13, 0.2};
  pipeline::ModelLibrary library;
  library.catalog = estimate::ReadCatalogFile(estimate::DefaultCatalogPath());
  const auto& families = synth::AllFamilies();
  std::map<std::string, Tally> rows;
  std::map<double, Tally> by_rate;
  const std::clock_t c0 = std::clock();
  // BENCH_SEEDS=76,152: only those draws (each with the family it has in
  // the full run from first_seed), to look at failures one at a time.
  const char* only = std::getenv("BENCH_SEEDS");
  for (int i = 0; i < draws; ++i) {
    const std::uint64_t seed = first + static_cast<std::uint64_t>(i);
    if (only &&
        ("," + std::string(only) + ",").find("," + std::to_string(seed) + ",") == std::string::npos)
      continue;
    synth::TableOptions options;
    options.family = families[static_cast<std::size_t>(i) % families.size()];
    synth::Rng rng(seed);
    const synth::AuthorTable author = synth::DrawTable(rng, options);
    const double rate = kRates[i % 4] * max_rate / 0.2;
    const Transcription w = Witness(author, rate, rng);
    if (const char* dir = std::getenv("BENCH_DUMP")) {
      if (!Dump(std::string(dir) + "/" + std::to_string(seed) + ".apo", w)) return 1;
    }
    pipeline::ReferenceRequest request;
    request.automatic = true;
    std::vector<pipeline::ColumnReference> refs;
    const std::clock_t t0 = std::clock();
    try {
      refs = pipeline::ResolveReferences({w}, request, library);
    } catch (const InputError& e) {
      std::fprintf(stderr, "seed %llu: %s\n", static_cast<unsigned long long>(seed), e.what());
    }
    const double secs = static_cast<double>(std::clock() - t0) / CLOCKS_PER_SEC;
    for (const auto& col : author.key.columns) {
      const pipeline::ColumnReference* r = nullptr;
      for (const auto& x : refs) {
        if (x.column_name == col.name) r = &x;
      }
      ScoreColumn(col, r, rows[RowName(col)]);
      ScoreColumn(col, r, by_rate[rate]);
    }
    rows[RowName(author.key.columns.front())].seconds += secs;
    if (std::getenv("BENCH_VERBOSE")) {
      for (const auto& col : author.key.columns) {
        for (const auto& x : refs) {
          if (x.column_name != col.name) continue;
          const auto e = Expected(col);
          Tally one;
          ScoreColumn(col, &x, one);
          std::printf("seed %llu %s/%s: %s [%s] explains %d; expected %s; identified %d\n",
                      static_cast<unsigned long long>(seed), RowName(col).c_str(), col.name.c_str(),
                      x.description.c_str(), x.how.c_str(), x.explains,
                      e.empty() ? "-" : e.front().model.c_str(), one.identified);
          if (std::getenv("BENCH_VERBOSE")[0] >= '2' && e.empty())
            std::printf("  key: %s%s (%zu rows)\n", col.function.variant.c_str(),
                        DerivedKey(col).c_str(), w.rows.size());
          if (std::getenv("BENCH_VERBOSE")[0] >= '2' && !e.empty()) {
            std::printf("  key:");
            for (const auto& [name, v] : e.front().params)
              std::printf(" %s = %.8g", name.c_str(), v);
            std::printf(" (%zu rows)\n", w.rows.size());
          }
          Tally misses;  // printed under the key
          misses.print_misses = std::getenv("BENCH_VERBOSE")[0] == '3';
          ScoreColumn(col, &x, misses);
        }
      }
    }
  }
  const double total = static_cast<double>(std::clock() - c0) / CLOCKS_PER_SEC;
  std::printf(
      "| family | columns | model identified | parameter equal or within 2 s.e. (1 s.e.) | round "
      "value adopted | nothing fits: said where no model explains | said where one does | CPU "
      "s |\n|---|---|---|---|---|---|---|---|\n");
  auto line = [](const std::string& name, const Tally& t) {
    std::printf("| %s | %d | %s | %s (%s) | %s | %s | %s | %.1f |\n", name.c_str(), t.columns,
                Pct(t.identified, t.explained).c_str(), Pct(t.params_ok, t.params).c_str(),
                Pct(t.params_1se, t.params).c_str(), Pct(t.round_adopted, t.round_used).c_str(),
                Pct(t.unexplained_said, t.unexplained).c_str(),
                Pct(t.explained_said_none, t.explained).c_str(), t.seconds);
  };
  Tally all;
  for (const auto& [name, t] : rows) {
    line(name, t);
    all.columns += t.columns, all.identified += t.identified, all.params += t.params;
    all.params_ok += t.params_ok, all.params_1se += t.params_1se;
    all.round_used += t.round_used, all.round_adopted += t.round_adopted;
    all.unexplained += t.unexplained, all.unexplained_said += t.unexplained_said;
    all.explained += t.explained, all.explained_said_none += t.explained_said_none;
    all.seconds += t.seconds;
  }
  line("all", all);
  for (const auto& [rate, t] : by_rate) {
    char name[32];
    std::snprintf(name, sizeof name, "rate %.2f", rate);
    line(name, t);
  }
  std::printf(
      "%d draws (seeds %llu..%llu), %.1f s CPU\n", draws, static_cast<unsigned long long>(first),
      static_cast<unsigned long long>(first + static_cast<std::uint64_t>(draws) - 1), total);
}
