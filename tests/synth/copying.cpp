// Copying a table with slips: the driver. Slips are drawn by class weight
// until the drawn number of entries is corrupted; whole-row slips are
// applied last so that every keyed cell slip stays visible in the copy.
#include "copying.hpp"

#include <array>
#include <stdexcept>

#include "copier.hpp"

namespace apograph::synth {
namespace {

constexpr std::array<std::pair<SlipClass, const char*>, 16> kNames = {{
    {SlipClass::kLookAlike, "look-alike"},
    {SlipClass::kOtherSymbol, "other-symbol"},
    {SlipClass::kTransposition, "transposition"},
    {SlipClass::kPlaceDropped, "place-dropped"},
    {SlipClass::kPlaceAdded, "place-added"},
    {SlipClass::kPlaceShifted, "place-shifted"},
    {SlipClass::kRepetition, "repetition"},
    {SlipClass::kEyeSkip, "eye-skip"},
    {SlipClass::kConstantRun, "constant-run"},
    {SlipClass::kBlank, "blank"},
    {SlipClass::kIllegible, "illegible"},
    {SlipClass::kPartlyIllegible, "partly-illegible"},
    {SlipClass::kRowOmitted, "row-omitted"},
    {SlipClass::kRowDuplicated, "row-duplicated"},
    {SlipClass::kArgumentMiswritten, "argument-miswritten"},
    {SlipClass::kLastPlace, "last-place"},
}};

}  // namespace

const char* SlipName(SlipClass slip) {
  for (const auto& [k, name] : kNames) {
    if (k == slip) return name;
  }
  return "";
}

std::vector<SlipClass> AllSlipClasses() {
  std::vector<SlipClass> out;
  for (const auto& entry : kNames) out.push_back(entry.first);
  return out;
}

std::map<SlipClass, double> DefaultWeights(HandKind kind) {
  using S = SlipClass;
  switch (kind) {
    case HandKind::kManuscript:
      return {{S::kLookAlike, 0.32},     {S::kTransposition, 0.08},     {S::kPlaceDropped, 0.05},
              {S::kPlaceAdded, 0.03},    {S::kPlaceShifted, 0.04},      {S::kRepetition, 0.09},
              {S::kEyeSkip, 0.06},       {S::kConstantRun, 0.03},       {S::kBlank, 0.05},
              {S::kIllegible, 0.04},     {S::kPartlyIllegible, 0.03},   {S::kRowOmitted, 0.02},
              {S::kRowDuplicated, 0.01}, {S::kArgumentMiswritten, 0.03}};
    case HandKind::kPrint:
      return {{S::kLookAlike, 0.35},
              {S::kTransposition, 0.2},
              {S::kPlaceDropped, 0.05},
              {S::kPlaceAdded, 0.02},
              {S::kPlaceShifted, 0.03},
              {S::kRepetition, 0.05},
              {S::kEyeSkip, 0.03},
              {S::kBlank, 0.02},
              {S::kRowOmitted, 0.02},
              {S::kRowDuplicated, 0.01},
              {S::kArgumentMiswritten, 0.03},
              {S::kLastPlace, 0.15}};
    case HandKind::kDigitised:
      return {{S::kLookAlike, 0.7},      {S::kTransposition, 0.02},     {S::kPlaceDropped, 0.05},
              {S::kBlank, 0.05},         {S::kIllegible, 0.05},         {S::kRowOmitted, 0.05},
              {S::kRowDuplicated, 0.02}, {S::kArgumentMiswritten, 0.06}};
  }
  return {};
}

TableText FromAuthor(const AuthorTable& table) {
  TableText out{table.text, {}, {}};
  for (std::size_t i = 0; i < table.text.rows.size(); ++i) {
    out.origin.push_back(static_cast<int>(i));
    out.archetype_args.push_back(table.text.rows[i].argument.raw);
  }
  return out;
}

TableText CopyTable(const TableText& exemplar, const Hand& hand, const CopyOptions& options,
                    Rng& rng, std::vector<Slip>& slips) {
  if (options.rate < 0 || options.rate > 0.5)
    throw std::invalid_argument("CopyOptions::rate outside 0..0.5");
  internal::Copier copier(exemplar, hand, options, rng);
  TableText out = copier.Run();
  for (auto& s : copier.slips()) slips.push_back(std::move(s));
  return out;
}

}  // namespace apograph::synth
