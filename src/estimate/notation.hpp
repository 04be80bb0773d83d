#pragma once
/// Numbers as the estimate stage writes them for an editor: the trade's
/// sexagesimal notation (2;4,48), the decimal beside it where the notation
/// alone would hide something, arguments as the table writes them (88;30,
/// not 88.5).

#include <cstddef>
#include <string>

#include "edition/transcription.hpp"
#include "model/model.hpp"

namespace apograph::estimate {

/// A value in the trade's notation with the places it needs, at most
/// `max_places` (rounded there); values beyond 10^9 in magnitude, or not
/// finite, in decimal ("3.4e+11").
std::string NumberText(double value, int max_places = 4);

/// "2;4,48 (2.08)": the trade's notation to `places` and the decimal in
/// parentheses (omitted when the decimal says nothing more: 60, 2;30).
std::string NumberWithDecimal(double value, int places);

/// "74%".
std::string Percent(double share);

/// The sign form in words: "signed", "negated (negative where the
/// geometry is positive)", "magnitudes (sign by the rubric)".
std::string SignText(model::SignForm form);

/// The argument row `row` stands for (Transcription::ArgumentInUse) as the
/// table writes it; "-" when there is none.
std::string ArgumentText(const Transcription& table, std::size_t row);

/// An argument value in the notation of the table's argument (its places,
/// more when the value needs them).
std::string ArgumentText(const Transcription& table, double argument);

}  // namespace apograph::estimate
