#pragma once
// Checks of the plain-number arguments that worksheet functions pass on (confidence levels,
// whole numbers, option words), each with a message the person at the spreadsheet understands.
#include <cctype>
#include <cmath>
#include <string>

#include "assoc/error.hpp"
#include "assoc/format.hpp"

namespace assoc::detail {

inline void check_confidence(double confidence) {
    require(confidence > 0 && confidence < 1,
            "the confidence level must lie between 0 and 1 (for example 0.95), not " + format_number(confidence));
}

// A whole number from `low` to `high`; `name` says what it is ("the number of trials").
inline double whole_number(double value, double low, double high, const std::string& name) {
    require(std::isfinite(value) && value == std::floor(value),
            name + " must be a whole number, not " + format_number(value, 15));
    require(value >= low && value <= high,
            name + " must be from " + format_count(low) + " to " + format_count(high) + ", not " + format_count(value));
    return value;
}

// An option word as typed, without surrounding spaces and in lower case, so "Holm " reads as "holm".
inline std::string normalized_word(const std::string& word) {
    std::size_t first = 0, last = word.size();
    while (first < last && std::isspace(static_cast<unsigned char>(word[first]))) ++first;
    while (last > first && std::isspace(static_cast<unsigned char>(word[last - 1]))) --last;
    std::string result = word.substr(first, last - first);
    for (char& c : result) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    return result;
}

}  // namespace assoc::detail
