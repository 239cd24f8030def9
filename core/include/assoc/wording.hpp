#pragma once
// Words for messages and report lines, so that none grows with the size of a range: labels echoed
// trimmed and cut short, lists that name a handful and count the rest, runs of row numbers
// ("rows 7–40"), and the words nearest to a mistyped one.
#include <cstddef>
#include <string>
#include <string_view>
#include <vector>

namespace assoc {

// A label without the spaces at its start and end (spaces, tabs, line breaks and no-break spaces):
// "No " and " No" are the label "No". Spaces inside a label are kept.
std::string_view trimmed_label(std::string_view text);

// A label as labels are matched: trimmed, with A–Z read as a–z ("Yes " and "yes" match).
std::string folded_label(std::string_view label);

// A label as messages echo it: trimmed, in quotes, cut to at most 40 characters with "…".
std::string quoted_label(std::string_view label);
// The same without quotes, cut to at most `longest` characters.
std::string short_label(std::string_view label, std::size_t longest = 40);

// "a", "a and b", "a, b and c"; past `shown` items: "a, b, c, d, e and 7 more".
std::string name_list(const std::vector<std::string>& items, std::size_t shown = 5);

// 1-based numbers written as runs: {7, 8, 9, 12} gives "7–9 and 12"; past `shown` runs the rest are
// counted ("7–9, 12, 15, 20, 31 and 40 more").
std::string number_runs(std::vector<std::size_t> numbers, std::size_t shown = 5);

// "row 7", "rows 7–40", "rows 3, 5 and 9" (`singular` "row" or "column").
std::string numbered_lines(const char* singular, const std::vector<std::size_t>& numbers);

// The candidates nearest to `typed` (case and surrounding spaces ignored), by the number of letters
// to add, drop, change or swap: those at the smallest distance, if it is small for the word's length
// (at most 1 for words of up to 4 letters, 2 up to 8, 3 beyond); a typed word that starts a candidate
// ("cram" for "cramer") counts as close too. At most 3, in the order of `candidates`.
std::vector<std::string> nearest_words(const std::string& typed, const std::vector<std::string>& candidates);

}  // namespace assoc
