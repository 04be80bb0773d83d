#pragma once
/// The model library's public face: what recomputation, estimation and the
/// deviation stage call. A model maps parameters and a row's arguments to the
/// exact (double) value of an entry; computing practice (rounding,
/// truncation, interpolation grid, displacement) is applied separately.

#include <cstddef>
#include <cstdint>
#include <memory>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "edition/transcription.hpp"
#include "number/sexagesimal.hpp"

namespace apograph::model {

/// What a parameter stands for, so that estimation can find "the rate" or
/// "the modulus" of a model without knowing its parameters' names.
enum class ParamRole : std::uint8_t {
  kOther,
  kRadix,         ///< value at argument 0 of a mean motion (mod 360)
  kRate,          ///< motion per unit of the argument
  kModulus,       ///< a convention, not a quantity: never estimated unless asked
  kAnomalyRadix,  ///< anomaly on the epicycle at argument 0
  kAnomalyRate,   ///< motion in anomaly per unit of the argument
  kApogee,        ///< longitude of the apogee (deg)
};

/// One parameter of a model.
struct ParamSpec {
  std::string name;  ///< e.g. "e"
  std::string unit;  ///< e.g. "parts of 60", "deg"
  std::string description;
  double default_value = 0;
  double low = 0;  ///< typical historical range, used as search bounds
  double high = 0;
  ParamRole role = ParamRole::kOther;
};

/// What kind of table a model computes; stages that treat kinds
/// differently ask this, never a parameter's name.
enum class ModelKind : std::uint8_t {
  kFunction,    ///< a function of the argument (trigonometry, equations, spherical astronomy)
  kMeanMotion,  ///< radix + rate x argument, reduced by a modulus
  kPosition,    ///< a mean motion plus periodic corrections: true positions by date
};
/// "function", "mean motion", "position".
const char* ToString(ModelKind kind);

/// How a table prints a quantity that the geometry makes negative in part of
/// the argument's range (the equations in the second half, the southern
/// declinations). The sign form belongs to the computing practice (how the
/// author presented the values), not to the model: one model, three
/// presentations.
enum class SignForm : std::uint8_t {
  kConventional,  ///< the form the model's convention states (Model::traits().conventional)
  kSigned,        ///< as the geometry gives it: e.g. positive for 0..180, negative beyond
  kNegated,       ///< the opposite sign (an equation printed as subtracted in the first half)
  kMagnitude,     ///< the amount only; the rubric says add or subtract by the argument's half
};
/// "conventional", "signed", "negated", "magnitude".
const char* ToString(SignForm form);
/// The inverse of ToString; nullopt for anything else.
std::optional<SignForm> SignFormFromString(std::string_view text);
/// `signed_value` presented in `form` (kConventional must be resolved first).
double ApplySign(double signed_value, SignForm form);

/// A combination of parameters that the model's values determine when the
/// parameters themselves are not separately determined (e.g. an epicycle's
/// radius and the distance of its centre enter only as their ratio).
struct ParamCombination {
  std::string text;                                 ///< "60 r/(60 + e)"
  std::vector<std::string> params;                  ///< the parameters it combines, by name
  double (*value)(const double* params) = nullptr;  ///< in the model's parameter order
  /// The parameter of a simpler model whose value the combination is, as
  /// "model:param" (the greatest-distance form's 60 r/(60 + e) is the r of
  /// epicycle-anomaly): round values of this model's own parameters then
  /// give values to try for that one (estimate/round_values.cpp).
  std::string same_as;
};

/// Fixed facts about a model that identification and naming use.
struct ModelTraits {
  ModelKind kind = ModelKind::kFunction;
  /// The formula takes negative values somewhere in the argument's range, so
  /// that a table may print it signed, as magnitudes or displaced.
  bool signed_values = false;
  /// The form meant when a practice says kConventional (kSigned or kMagnitude).
  SignForm conventional = SignForm::kSigned;
  /// Words of a table's `kind` attribute that name what this model computes
  /// ("sun", "lunar", "declination"), lower case: among models that compute
  /// the same values, the one the table's kind names is shown.
  std::vector<std::string> kind_words;
  /// Combinations to report when the entries cannot separate their parameters.
  std::vector<ParamCombination> combinations;
};

/// Most parameters a built-in model may have and still get exact
/// derivatives by dual numbers (a fixed-size array of duals per evaluation).
inline constexpr std::size_t kDualParameterLimit = 8;

/// What a model may look at when it computes one entry.
struct RowContext {
  double arg = 0;                           ///< the row argument (expected, or as written)
  std::optional<double> arg2;               ///< column argument of a double-argument table
  const Transcription* table = nullptr;     ///< the whole table, for formulas that
  std::size_t row = 0;                      ///< refer to other columns or rows
  int column = -1;                          ///< the column being computed
  SignForm sign = SignForm::kConventional;  ///< the presentation asked for (Practice::sign)
};

/// A model of one column. Built-in models and user formulas both implement it.
class Model {
 public:
  virtual ~Model() = default;
  virtual const std::string& name() const = 0;
  /// The published formula it implements, in one or two sentences.
  virtual const std::string& description() const = 0;
  virtual const std::vector<ParamSpec>& params() const = 0;
  /// The exact value for one row; NaN where the model is undefined.
  virtual double Evaluate(const std::vector<double>& params, const RowContext& row) const = 0;
  /// The exact value (as Evaluate) and its partial derivatives with respect
  /// to the parameters params()[wrt[j]], written to gradient[j]. Estimation
  /// needs them for every entry at every step. The default takes forward
  /// differences (step 1e-7 max(|p|, 0.01)), so user formulas need nothing
  /// more; built-in models give exact derivatives by dual numbers at about
  /// the cost of one evaluation.
  virtual double EvaluateWithGradient(const std::vector<double>& params, const RowContext& row,
                                      const std::vector<int>& wrt, double* gradient) const;
  /// Whether EvaluateWithGradient is exact rather than forward differences
  /// (a caller comparing values modulo 360 must difference the wrapped
  /// residuals itself when it is not).
  virtual bool ExactGradient() const { return false; }
  /// Defaults of all parameters, in order.
  std::vector<double> Defaults() const;
  /// The argument convention in words: what the argument is, how arguments
  /// beyond 90/180/360 are treated (symmetry, sign) and whether a constant is
  /// added. Empty when the model says nothing (user formulas).
  virtual const std::string& convention() const;
  /// Index of a parameter by name, or -1.
  int ParamIndex(std::string_view param_name) const;
  /// Index of the first parameter with `role`, or -1.
  int ParamIndex(ParamRole role) const;
  /// Kind, sign behaviour and naming words. The default: a function of the
  /// argument, used as its formula gives it (user formulas).
  virtual const ModelTraits& traits() const;
  /// `form` with kConventional replaced by this model's conventional form.
  SignForm ResolvedSign(SignForm form) const;
};

/// How the table's author brought exact values into the table.
///
/// The order of operations for one entry at argument x is:
///  1. v = model(x) in the practice's sign form, or, with a grid g > 0 and x not a node, the
///  straight
///     line between the nodes n0 = origin + g*floor((x-origin)/g) and n0 + g:
///     v = f(n0) + (f(n0+g) - f(n0)) * (x - n0) / g, where f is the model
///     value at a node, itself brought to `places` places first when
///     `round_nodes` is set (the author tabulated the nodes, then filled in
///     between from the rounded nodes); a node's own entry is f(node);
///  2. v += displacement;
///  3. the entry is v brought to `places` places by `rounding`.
struct Practice {
  Rounding rounding = Rounding::kNearest;
  std::optional<int> places;  ///< default: the column's places
  /// Interpolation grid in argument units: exact values at arguments that are
  /// multiples of `grid` (counted from `grid_origin`), linear in between,
  /// then rounded. 0 = none.
  double grid = 0;
  double displacement = 0;  ///< constant added to every entry (before rounding)
  /// How values the geometry makes negative are printed (applied to the
  /// model's value before displacement and rounding).
  SignForm sign = SignForm::kConventional;
  /// With a grid: bring the node values to `places` places (with `rounding`)
  /// before interpolating between them. Default: exact nodes.
  bool round_nodes = false;
  double grid_origin = 0;  ///< nodes at grid_origin + k * grid
};

/// "nearest" or "truncate".
const char* ToString(Rounding rounding);
/// The inverse of ToString; nullopt for anything else.
std::optional<Rounding> RoundingFromString(std::string_view text);

/// The recomputation of one column of a table.
struct ColumnRecomputation {
  std::vector<double> exact;                         ///< model value per row (NaN: none)
  std::vector<std::optional<Sexagesimal>> computed;  ///< after the practice
};

/// Evaluates `model` on every row of column `column`. The argument used is
/// Transcription::ArgumentInUse: the written one when it fits the sequence,
/// repaired from its neighbours when it was miscopied; rows with no usable
/// argument get no value.
ColumnRecomputation Recompute(const Model& model, const std::vector<double>& params,
                              const Transcription& table, int column, const Practice& practice);

/// The argument a model should use for row `row` (see Recompute).
std::optional<double> RowArgument(const Transcription& table, std::size_t row);

/// The exact value for one row under `practice`, before the final rounding
/// (steps 1 and 2 above); NaN where the model is undefined.
double PracticeValue(const Model& model, const std::vector<double>& params, const RowContext& row,
                     const Practice& practice, int places);

/// PracticeValue and its partial derivatives with respect to
/// params[wrt[j]] (see Model::EvaluateWithGradient). With rounded nodes the
/// rounding counts as the identity in the derivatives (it is flat almost
/// everywhere, which would tell a solver nothing about where to go).
double PracticeValueWithGradient(const Model& model, const std::vector<double>& params,
                                 const RowContext& row, const Practice& practice, int places,
                                 const std::vector<int>& wrt, double* gradient);

/// Built-in models, by name; nullptr when unknown.
const Model* FindBuiltinModel(std::string_view name);
/// All built-in models in a stable order.
std::vector<const Model*> BuiltinModels();

}  // namespace apograph::model
