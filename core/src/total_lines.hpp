#pragma once
// Totals and percentages inside a range of counts: a workbook's author often selects a table with
// its total row or column, or types percentages instead of counts. Read as counts, either gives a
// confident wrong answer, so read_count_table sets labelled totals aside, refuses what it cannot
// tell apart from counts, and reports what stays ambiguous.
#include <algorithm>
#include <cmath>
#include <cstddef>
#include <string>
#include <string_view>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/matrix.hpp"

namespace assoc::detail {

// Whether a label names a total line: one of the words for a total in English, German, French,
// Spanish, Italian, Dutch, Portuguese, the Scandinavian languages and Polish ("Total", "Totals",
// "Grand total", "Subtotal", "Sum", "All", "Overall", "Summe", "Gesamt", "Insgesamt", "Somme",
// "Ensemble", "Suma", "Totale", "Totaal", "Soma", "Totalt", "Summa", "I alt", "Razem", "Ogółem", "Σ", …),
// in any case (A–Z), with a trailing colon allowed; a label that ends in " total", " totals" or
// " subtotal" ("Row total", "Office subtotal"); or a label that begins with "Total",
// "Grand total", "Subtotal", "Gesamt", "Summe", "Totale", "Totaal" or "Totalt" followed by a space
// ("Total staff", "Total 2024"). Exact words only otherwise: "Allowances" or "Summer" are no totals.
bool is_total_label(std::string_view label);

// Whether a label names everyone ("All staff", "All offices", "Overall figure", "Whole company",
// "Company", "Everyone") or how many they are ("N", "Count", "Headcount", "Number of staff",
// "Respondents", "Base", "Anzahl", "Effectif"): not a total by the label alone ("All of the time" may
// be an answer, "Staff" a group), but a line or a stratum so labelled that holds the sums of the
// others is one.
bool names_the_whole_group(std::string_view label);

// Whether a label names a number as such ("N", "Count", "Headcount", "Number of staff", "Anzahl"): the
// words of names_the_whole_group that name no group of people. A line so labelled that holds no sum
// of the others is doubted by find_total_lines.
bool names_a_count(std::string_view label);

// Whether a label says its numbers are percentages: a "%" that follows no digit ("% promoted",
// "Yes (%)"; "0-2%" names a band of pay rises) or the word itself ("Percent", "Prozent", "pct").
bool names_percentages(std::string_view label);

// Whether a label marks a missing value rather than naming a group or an answer: "n/a", "NA", "#N/A",
// "-", "?", "null", "NaN", "missing", and the "(empty)" or "(blank)" a summary of records shows for blank
// cells. "N/A" may also mean "not applicable", an answer of its own: the messages say how to keep it.
bool names_a_missing_value(std::string_view label);

// What a refusal of a text among the counts adds after "… holds the text "…"": why counts must be
// numbers, and what to do where the text is a number stored as text ("12", " 1,200 ") or a dash that
// a report uses for zero.
std::string text_among_counts_reason(const Cell& cell);

// Whether a cell is a number stored as text: digits with a sign, separators of thousands and decimals
// (, . ' and spaces) or a final percent sign, and nothing else ("12", " 1,200 ", "-3").
bool is_number_as_text(const Cell& cell);

// Whether two sums are the same amount, to 1e-9 relative (rounding of sums of non-whole counts):
// how a total line, a subtotal or a stratum of totals is recognised. Inline: the searches for total
// lines call it for every position of every line of every table read.
inline bool same_amount(double a, double b) { return std::fabs(a - b) <= 1e-9 * std::max(std::fabs(a), std::fabs(b)); }

// One side of a table body: its rows (or its columns), how they are labelled and numbered.
struct BodySide {
    const char* word;                   // "row" or "column"
    const char* other_word;             // "column" or "row"
    const std::vector<std::string>* labels;  // trimmed labels, "" where none
    bool labelled;                      // the range has labels on this side
    std::size_t first_number;           // the range's 1-based number of body line 0
};

struct TotalLines {
    std::vector<char> rows, columns;  // non-zero: a total line, set aside (char: see CountTable::finish)
    std::vector<std::string> doubts;  // sentences for the verdict
};

// Finds the total lines of `body`. A line is a total when its label is a total word (set aside; a
// doubt when it holds neither the sum of the other lines nor that of the lines since the previous
// total); or when it is the first or last of the lines that are not labelled totals and holds, in
// every position, the sum of at least 2 other non-empty lines. Such a line without a label is
// refused (an Error that says what was found and what to do); with a label that is not a total
// word it is kept as counts and doubted.
// Also: a line inside the table that holds the sum of the lines just above it (a subtotal) is refused
// without a label and doubted with one that is not a total word; a line labelled as a percentage, an
// average or a rate ("% promoted", "Average") that holds a number that is not whole is refused when
// `counts_only` (expected shares may be percentages); and, with `distinct_labels`, lines that share a
// label are doubted (stacked strata repeat their labels).
TotalLines find_total_lines(const Matrix& body, const BodySide& rows, const BodySide& columns,
                            bool distinct_labels = true, bool counts_only = true);

// The sums of a body's rows and columns with its total lines left out, in one block (rows first),
// whether every entry counted is whole, and their grand sum. Read once per table, by
// refuse_percentages and CountTable alike.
struct LineSums {
    std::vector<double> sums;  // body rows, then body columns
    bool all_whole = true;
    double grand = 0;
};
LineSums line_sums(const Matrix& body, const std::vector<char>& total_rows, const std::vector<char>& total_columns);

// Refuses percentages and shares typed instead of counts: the lines of one side (at least 2 with
// counts) that each add up to 100 (within 1) or to 1 (within 0.01), or a body that adds up to 100 or
// 1, when some entry is not a whole number. Lines of whole numbers that each add up to 100 (or to 99
// to 101, as rounded percentages do) give a doubt instead (they may be percentages, or 100 people
// each). Total lines are left out:
// `sums` are line_sums of the body.
std::vector<std::string> refuse_percentages(const Matrix& body, const LineSums& sums);

}  // namespace assoc::detail
