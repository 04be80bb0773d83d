#include "tables.hpp"

#include <stdexcept>

#include "arguments.hpp"
#include "parameters.hpp"
#include "table_build.hpp"

namespace apograph::synth {
namespace {

// The table's kind in the trade's words (written as the table's `kind`).
std::string KindText(const Function& f) {
  switch (f.family) {
    case Family::kChord:
      return "chords";
    case Family::kSine:
      return "sines";
    case Family::kCosine:
      return "cosines";
    case Family::kVersedSine:
      return "versed sines";
    case Family::kShadow:
      return "shadows";
    case Family::kReversedShadow:
      return "reversed shadows";
    case Family::kDeclination:
      return "declination";
    case Family::kRightAscension:
      return "right ascension";
    case Family::kObliqueAscension:
      return "oblique ascension";
    case Family::kAscensionalDifference:
      return "ascensional difference";
    case Family::kDaylight:
      return "length of daylight";
    case Family::kSolarEquation:
      return "equation of the sun";
    case Family::kEquationOfCentre:
      return "equation of centre";
    case Family::kEquationOfAnomaly:
      return "equation of anomaly";
    case Family::kLunarAnomaly:
      return "equation of the moon's anomaly";
    case Family::kMeanMotion:
      return "mean motion";
    case Family::kTrueSun:
      return "true sun";
    case Family::kPlanetPosition:
      return "positions of a planet";
    case Family::kUnexplained:
      return "auxiliary table";
  }
  return "";
}

Family DrawFamily(Rng& rng, const TableOptions& o) {
  if (!o.families.empty()) return rng.Pick(o.families);
  if (rng.Chance(o.share_unexplained_table)) return Family::kUnexplained;
  std::vector<Family> pool;
  for (Family f : AllFamilies()) {
    if (f != Family::kUnexplained) pool.push_back(f);
  }
  return rng.Pick(pool);
}

void Compute(TableKey& t, Rng& rng, const TableOptions& o) {
  for (auto& c : t.columns) {
    switch (c.role) {
      case ColumnKey::Role::kModel:
        if (c.mean_motion) {
          internal::ComputeMeanMotion(c, t.argument);
        } else {
          internal::ComputeModelColumn(c, t.argument);
        }
        internal::AddDepartures(c, rng, o);
        break;
      case ColumnKey::Role::kDerived:
        internal::ComputeDerived(c, t);
        if (o.departures_in_derived) internal::AddDepartures(c, rng, o);
        break;
      case ColumnKey::Role::kUnexplained:
        internal::ComputeModelColumn(c, t.argument);
        break;
    }
  }
}

Cell ValueCell(const Sexagesimal& v, int places) {
  Cell cell;
  cell.raw = v.ToString();
  cell.value = v;
  cell.places = places;
  return cell;
}

Transcription ToTranscription(const TableKey& t) {
  Transcription out;
  out.work.id = "work";
  out.witness.siglum = "archetype";
  out.table_id = t.id;
  out.table_title = t.title;
  out.kind = t.kind;
  out.argument = {t.argument.name, t.argument.unit, t.argument.places, t.argument.start,
                  t.argument.step};
  if (t.argument2) {
    out.argument2 = ArgumentSpec{t.argument2->name, t.argument2->unit, t.argument2->places,
                                 std::nullopt, std::nullopt};
  }
  for (const auto& c : t.columns)
    out.columns.push_back({c.name, c.unit, c.places, c.title, c.arg2});
  for (std::size_t i = 0; i < t.argument.values.size(); ++i) {
    Row row;
    row.argument = ValueCell(t.argument.values[i], t.argument.places);
    for (const auto& c : t.columns) row.cells.push_back(ValueCell(c.tabulated[i], c.places));
    out.rows.push_back(std::move(row));
  }
  return out;
}

}  // namespace

const char* ToString(SignForm form) {
  switch (form) {
    case SignForm::kAsComputed:
      return "as-computed";
    case SignForm::kSigned:
      return "signed";
    case SignForm::kMagnitude:
      return "magnitude";
    case SignForm::kDisplaced:
      return "displaced";
  }
  return "";
}

int TableKey::ColumnIndex(const std::string& name) const {
  for (std::size_t i = 0; i < columns.size(); ++i) {
    if (columns[i].name == name) return static_cast<int>(i);
  }
  return -1;
}

AuthorTable DrawTable(Rng& rng, const TableOptions& o, const std::string& id) {
  TableKey t;
  t.family = o.family ? *o.family : DrawFamily(rng, o);
  const Function f = DrawFunction(t.family, rng, o);
  t.id = id.empty() ? FamilyName(t.family) : id;
  t.kind = KindText(f);
  t.title = t.kind;
  t.title[0] = static_cast<char>(t.title[0] - 'a' + 'A');
  const bool full = CanChangeSign(t.family) && rng.Chance(o.share_full_range);
  t.argument = DrawArgument(f, full, rng, o);
  internal::DrawColumns(t, f, rng, o);
  Compute(t, rng, o);
  return {ToTranscription(t), t};
}

AuthorTable DrawTable(std::uint64_t seed, const TableOptions& o, const std::string& id) {
  Rng rng(seed);
  return DrawTable(rng, o, id);
}

}  // namespace apograph::synth
