// Reading a count table from a range of cells: headers, body, empty rows and columns.
#include <algorithm>
#include <cmath>
#include <iterator>
#include <limits>
#include <string>
#include <vector>

#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/wording.hpp"
#include "total_lines.hpp"

namespace assoc {
namespace {

std::string cell_name(std::size_t row, std::size_t column) {
    return "row " + std::to_string(row + 1) + ", column " + std::to_string(column + 1);
}

// A header line holds only labels: every cell text or blank, one at least text.
template <class CellAt>
bool is_header_line(std::size_t length, CellAt cell_at) {
    bool any_text = false;
    for (std::size_t i = 0; i < length; ++i) {
        const Cell& cell = cell_at(i);
        if (cell.is_number()) return false;
        any_text = any_text || cell.is_text();
    }
    return any_text;
}

// Whole numbers from `low` to `high` rising along a first row or column: years (1900 to 2100) or
// dates (a spreadsheet hands a date over as its day count) most likely meant as labels; read as counts
// they would silently change the test.
template <class CellAt>
bool looks_like_labels(std::size_t length, CellAt cell_at, double low, double high) {
    if (length < 2) return false;
    double previous = 0;
    for (std::size_t i = 0; i < length; ++i) {
        const Cell& cell = cell_at(i);
        if (!cell.is_number()) return false;
        const double v = cell.as_number();
        if (v != std::floor(v) || v < low || v > high || (i > 0 && v <= previous)) return false;
        previous = v;
    }
    return true;
}

// Dates from 1 January 1990 to 31 December 2099 as spreadsheets store them: days since 30 December 1899.
constexpr double first_date_serial = 32874, last_date_serial = 73050;

// "1 January 2024" for the day count 45292 (days since 30 December 1899; civil calendar from days
// since 1970 after H. Hinnant's days_from_civil inverse, exact for every day of the range).
std::string date_of_serial(double serial) {
    const long z = static_cast<long>(serial) - 25569 + 719468;  // 25569: 1 January 1970
    const long era = z / 146097, day_of_era = z - era * 146097;
    const long year_of_era = (day_of_era - day_of_era / 1460 + day_of_era / 36524 - day_of_era / 146096) / 365;
    const long day_of_year = day_of_era - (365 * year_of_era + year_of_era / 4 - year_of_era / 100);
    const long shifted_month = (5 * day_of_year + 2) / 153;
    const long day = day_of_year - (153 * shifted_month + 2) / 5 + 1;
    const long month = shifted_month < 10 ? shifted_month + 3 : shifted_month - 9;
    const long year = year_of_era + era * 400 + (month <= 2 ? 1 : 0);
    static const char* const names[] = {"January", "February", "March",     "April",   "May",      "June",
                                        "July",    "August",   "September", "October", "November", "December"};
    return std::to_string(day) + " " + names[month - 1] + " " + std::to_string(year);
}

// The step by which whole numbers of 0 or more rise along a first row or column of at least 3
// (start, start + step, start + 2·step, …; the step whole and positive), or 0 when they do not.
template <class CellAt>
double equal_step(std::size_t length, CellAt cell_at) {
    if (length < 3 || !cell_at(0).is_number() || !cell_at(1).is_number()) return 0;
    const double start = cell_at(0).as_number(), step = cell_at(1).as_number() - start;
    if (!(start >= 0 && start < 1e15) || start != std::floor(start) || !(step >= 1) || step != std::floor(step))
        return 0;
    for (std::size_t i = 2; i < length; ++i) {
        const Cell& cell = cell_at(i);
        if (!cell.is_number() || cell.as_number() != start + static_cast<double>(i) * step) return 0;
    }
    return step;
}

// Whole numbers that count up by one: 0, 1, 2, … or 1, 2, 3, … (the numbers of ordered categories,
// such as courses taken, or a rating) or 101, 102, 103, … (codes of departments or cost centres),
// typed as numbers; or counts that happen to rise by one.
template <class CellAt>
bool counts_up_by_one(std::size_t length, CellAt cell_at) {
    return equal_step(length, cell_at) == 1;
}

// Whole numbers that rise in equal steps of 2 or more: the lower bounds of bands (ages 20, 30, 40,
// 50; salaries 1000, 2000, 3000) or the points of a scale, typed as numbers over their columns.
// Counts seldom do: at least 4 numbers, or 3 that are all multiples of 5; and only a line that has a
// label in the corner cell is doubted (by the caller), since a range of numbers alone is counts
// selected without their labels (invented examples often hold 10, 20, 30).
template <class CellAt>
bool rises_in_equal_steps(std::size_t length, CellAt cell_at) {
    const double step = equal_step(length, cell_at);
    if (step < 2) return false;
    return length >= 4 || (std::fmod(cell_at(0).as_number(), 5.0) == 0 && std::fmod(step, 5.0) == 0);
}

template <class CellAt>
bool all_whole_numbers(std::size_t length, CellAt cell_at) {
    if (length < 2) return false;
    for (std::size_t i = 0; i < length; ++i) {
        const Cell& cell = cell_at(i);
        if (!cell.is_number() || cell.as_number() != std::floor(cell.as_number())) return false;
    }
    return true;
}

// A label that names codes or numbered categories ("Code", "ID", "Dept no.", "Cost centre #", "Year",
// "Grade", "Age band"): over a first row or column of whole numbers it says those numbers are labels.
// Whole words only; "No" alone is an answer, so "no" counts only after another word. A label with a
// number or a single letter in it ("Grade A", "Level 1") names one category instead, as does one
// whose word comes back in another label of its header line ("Level 1", "Level 2", …): those
// numbers are counts of that category.
bool names_codes(std::string_view label, const std::vector<std::string>& other_labels) {
    static const char* const words[] = {
        "code", "codes", "id", "ids", "nr", "num", "#", "year", "years", "month", "week", "quarter", "grade",
        "level", "band", "age", "score", "rating", "rank", "zip", "postcode", "kennung", "nummer", "jahr", "monat",
        "stufe", "année", "annee", "mois", "año", "ano", "anno", "jaar", "år", "rok", "kod", "código", "codigo",
        "codice", "cod", "niveau", "nivel", "livello"};
    const auto is_word_char = [](char c) {
        return (c >= 'a' && c <= 'z') || (c >= '0' && c <= '9') || c == '#' || static_cast<unsigned char>(c) >= 0x80;
    };
    const auto tokens_of = [&](std::string_view text) {
        std::vector<std::string> tokens;
        for (std::size_t k = 0; k < text.size();) {
            if (!is_word_char(text[k])) {
                ++k;
                continue;
            }
            std::size_t end = k;
            while (end < text.size() && is_word_char(text[end])) ++end;
            tokens.emplace_back(text.substr(k, end - k));
            k = end;
        }
        return tokens;
    };
    const std::vector<std::string> tokens = tokens_of(folded_label(label));
    std::string code;
    for (std::size_t i = 0; i < tokens.size(); ++i) {
        const std::string& token = tokens[i];
        if (token.find_first_of("0123456789") != std::string::npos || (token.size() == 1 && token != "#")) return false;
        const bool names = (token == "no" && i > 0) ||
                           std::any_of(std::begin(words), std::end(words), [&](const char* w) { return token == w; });
        if (names && code.empty()) code = token;
    }
    if (code.empty()) return false;
    for (const std::string& other : other_labels) {
        const std::vector<std::string> others = tokens_of(folded_label(other));
        if (std::find(others.begin(), others.end(), code) != others.end()) return false;
    }
    return true;
}

// A whole number as typed, without separators ("4711", not "4,711"): how codes are written.
std::string as_typed(double whole) {
    return std::fabs(whole) < 1e15 ? std::to_string(static_cast<long long>(whole)) : format_count(whole);
}

std::string plural(std::size_t n, const char* word) {
    return std::to_string(n) + " " + word + (n == 1 ? "" : "s");
}

std::string label_of(const Cell& cell) { return cell.is_text() ? std::string(trimmed_label(cell.as_text())) : std::string(); }

}  // namespace

CountTable read_count_table(const CellGrid& range, const ReadOptions& options) {
    require(!range.empty(), "the range is empty; select a table of counts");

    const bool header_row = is_header_line(range.columns(), [&](std::size_t c) -> const Cell& { return range.at(0, c); });
    const std::size_t first_body_row = header_row ? 1 : 0;
    const bool header_column = first_body_row < range.rows() &&
        is_header_line(range.rows() - first_body_row,
                       [&](std::size_t r) -> const Cell& { return range.at(first_body_row + r, 0); });
    const std::size_t first_body_column = header_column ? 1 : 0;

    const std::size_t body_rows = range.rows() - first_body_row;
    const std::size_t body_columns = range.columns() - first_body_column;
    require(body_rows > 0 && body_columns > 0, "the range holds only labels and no counts");
    if (body_rows > options.max_body_cells / body_columns)
        throw Error("the table has " + format_count(static_cast<double>(body_rows) * static_cast<double>(body_columns)) +
                    " count cells; Assoc reads at most " + format_count(static_cast<double>(options.max_body_cells)));

    // Blank rows above a row of labels (or blank columns left of a column of labels): a range drawn
    // from above the table, a whole-column reference to a table that starts lower down. Only the
    // blanks after a table are left out (the adapter trims them); read from above, the header would be
    // taken for counts, so this is said instead.
    const auto blank_row = [&](std::size_t r) {
        for (std::size_t c = 0; c < range.columns(); ++c)
            if (!range.at(r, c).is_blank()) return false;
        return true;
    };
    const auto blank_column = [&](std::size_t c) {
        for (std::size_t r = 0; r < range.rows(); ++r)
            if (!range.at(r, c).is_blank()) return false;
        return true;
    };
    const auto refuse_blanks_before_labels = [](const char* word, std::size_t blanks) {
        std::vector<std::size_t> numbers;
        for (std::size_t i = 1; i <= blanks; ++i) numbers.push_back(i);
        const std::string labels = std::string(word) + " " + std::to_string(blanks + 1);
        throw Error(numbered_lines(word, numbers) + " of the range " + (blanks == 1 ? "is" : "are") + " blank and " +
                    labels + " holds only labels; a table is read from its first " + word + ", so select it from its " +
                    word + " of labels, " + labels + " (blank " + word + "s after a table are left out, not those before "
                    "it)");
    };
    std::size_t top = 0, left = 0;
    while (top + 1 < range.rows() && blank_row(top)) ++top;
    while (left + 1 < range.columns() && blank_column(left)) ++left;
    if (top > 0 && is_header_line(range.columns(), [&](std::size_t c) -> const Cell& { return range.at(top, c); }))
        refuse_blanks_before_labels("row", top);
    if (left > 0 && is_header_line(range.rows(), [&](std::size_t r) -> const Cell& { return range.at(r, left); }))
        refuse_blanks_before_labels("column", left);

    // Without a header row, text in row 1 next to numbers is a mistake to report as such:
    // a header row must hold only labels.
    if (!header_row) {
        for (std::size_t c = first_body_column; c < range.columns(); ++c) {
            if (range.at(0, c).is_text())
                throw Error("row 1 mixes labels and numbers (" + cell_name(0, c) + " holds " + range.at(0, c).describe() +
                            "); a header row must hold only labels and a row of counts only numbers");
        }
    }

    // Every count a number stored as text (imported or pasted data): each row under the header would
    // read as another row of labels, and the refusals below would speak of titles and row fields.
    if (header_row || header_column) {
        std::size_t text_row = 0, text_column = 0, texts = 0;
        bool only_number_texts = true;
        for (std::size_t r = first_body_row; r < range.rows() && only_number_texts; ++r)
            for (std::size_t c = first_body_column; c < range.columns() && only_number_texts; ++c) {
                const Cell& cell = range.at(r, c);
                if (cell.is_blank()) continue;
                only_number_texts = detail::is_number_as_text(cell);
                if (texts++ == 0) {
                    text_row = r;
                    text_column = c;
                }
            }
        if (only_number_texts && texts > 0)
            throw Error("the counts are numbers stored as text (as imported or pasted data often is; " +
                        cell_name(text_row, text_column) + " holds " + range.at(text_row, text_column).describe() +
                        "); counts must be numbers: enter them again as numbers, or convert those cells to numbers");
    }

    // A second row of labels under the header row (blank rows between them or not): a title above the
    // table's header, or the field row of a pivot table ("Count - Employee", "Outcome") above its row of
    // labels. Which row names the columns is the author's to say, so it is refused with words rather
    // than guessed.
    std::size_t next = 1;
    while (header_row && next < range.rows() && blank_row(next)) ++next;
    if (header_row && next < range.rows() &&
        is_header_line(body_columns, [&](std::size_t c) -> const Cell& { return range.at(next, first_body_column + c); })) {
        std::vector<std::string> texts;
        for (std::size_t c = 0; c < range.columns(); ++c)
            if (range.at(next, c).is_text()) texts.push_back(quoted_label(range.at(next, c).as_text()));
        const std::string row = "row " + std::to_string(next + 1);
        throw Error("rows 1 and " + std::to_string(next + 1) + " both hold only labels (" + row + ": " +
                    name_list(texts, 3) + "), but a table has one row of labels above its counts; select the table from "
                    "its row of column labels down, leaving out a title or a pivot table's field row above it");
    }

    // A second column of labels beside the first: two row variables (region and department, a pivot
    // table with two row fields). The table needs one; said as such rather than as text among counts.
    if (header_column && body_columns > 0 &&
        is_header_line(body_rows, [&](std::size_t r) -> const Cell& { return range.at(first_body_row + r, 1); })) {
        std::vector<std::string> texts;
        for (std::size_t r = first_body_row; r < range.rows(); ++r)
            if (range.at(r, 1).is_text()) {
                std::string text = quoted_label(range.at(r, 1).as_text());
                if (std::find(texts.begin(), texts.end(), text) == texts.end()) texts.push_back(std::move(text));
            }
        throw Error("columns 1 and 2 both hold only labels (column 2: " + name_list(texts, 3) + "), but a table has one "
                    "column of row labels beside its counts; put the two in one column (for example =A2&\" \"&B2), or "
                    "select the table from its column of row labels on");
    }

    CountTable table;
    Matrix body(body_rows, body_columns);
    for (std::size_t r = 0; r < body_rows; ++r) {
        for (std::size_t c = 0; c < body_columns; ++c) {
            const std::size_t range_row = first_body_row + r, range_column = first_body_column + c;
            const Cell& cell = range.at(range_row, range_column);
            if (cell.is_blank()) {
                ++table.blank_cells_;
                continue;
            }
            // The message is built only on failure: tables can have a million cells.
            auto fail = [&](const std::string& reason) {
                // Rows and columns of the range as selected, with their labels where the range has them.
                const auto label = [](const Cell& header) {
                    return header.is_text() && !trimmed_label(header.as_text()).empty()
                               ? " (" + quoted_label(header.as_text()) + ")"
                               : std::string();
                };
                const std::string row = "row " + std::to_string(range_row + 1) + (header_column ? label(range.at(range_row, 0)) : "");
                const std::string column = "column " + std::to_string(range_column + 1) + (header_row ? label(range.at(0, range_column)) : "");
                throw Error(row + ", " + column + " holds " + cell.describe() + reason);
            };
            if (!cell.is_number()) fail(detail::text_among_counts_reason(cell));
            const double value = cell.as_number();
            if (!std::isfinite(value)) fail("; counts must be ordinary numbers");
            if (value < 0) fail("; counts cannot be negative");
            body(r, c) = value;
        }
    }

    // Numbers that look like labels, read as counts: doubts (never "Sound"), said after the totals'.
    // The words are put together only when said (a string built here would cost allocations on every
    // call, and thousands of ASSOC.PVALUE cells each read a small table).
    std::vector<std::string> label_doubts;
    // `label`: the line's own label (the corner cell), or blank; `other_labels()`: the rest of its header
    // line, read only when the label may name codes.
    const auto doubt_numbers_as_labels = [&](const char* line, const Cell& label, auto other_labels, std::size_t length,
                                             auto cell_at) {
        if (looks_like_labels(length, cell_at, 1900, 2100)) {
            label_doubts.push_back(std::string(line) +
                                   " holds whole numbers that look like years, and they were read as counts; if they "
                                   "are labels, enter them as text (type an apostrophe first: '2024) or add a text header.");
        } else if (looks_like_labels(length, cell_at, first_date_serial, last_date_serial)) {
            // A date arrives as its day count whatever the cell shows, so the doubt names the day it stands for.
            const double first = cell_at(0).as_number();
            label_doubts.push_back(std::string(line) + " holds whole numbers that look like dates (a spreadsheet stores "
                                   "a date as its day count: " + format_count(first) + " is " + date_of_serial(first) +
                                   "), and they were read as counts; if they are labels, enter them as text or add a "
                                   "text header.");
        } else if (label.is_text() && all_whole_numbers(length, cell_at) && names_codes(label.as_text(), other_labels())) {
            label_doubts.push_back(std::string(line) + " (" + quoted_label(label.as_text()) + ") holds whole numbers under "
                                   "a label that names codes or numbered categories, and they were read as counts; if "
                                   "they are labels, enter them as text (type an apostrophe first: '" +
                                   as_typed(cell_at(0).as_number()) + ") so that they are read as labels.");
        } else if (counts_up_by_one(length, cell_at)) {
            const double start = cell_at(0).as_number();
            const std::string list = as_typed(start) + ", " + as_typed(start + 1) + ", " + as_typed(start + 2) +
                                     (length > 3 ? ", …" : "");
            const bool ordinal = start <= 1;
            label_doubts.push_back(std::string(line) + " holds the whole numbers " + list + ", which " +
                                   (ordinal ? "look like the numbers of ordered categories (0, 1, 2, … or 1, 2, 3, …)"
                                            : "count up by one as codes of departments or numbered categories do") +
                                   ", and they were read as counts; if they are labels, enter them as text (type an "
                                   "apostrophe first: '" + (ordinal ? std::string("1") : as_typed(start)) +
                                   (label.is_text() ? ") so that they are read as labels." : ") or add a text header."));
        } else if (label.is_text() && rises_in_equal_steps(length, cell_at)) {
            const double start = cell_at(0).as_number(), step = cell_at(1).as_number() - start;
            label_doubts.push_back(std::string(line) + " holds the whole numbers " + as_typed(start) + ", " +
                                   as_typed(start + step) + ", " + as_typed(start + 2 * step) + (length > 3 ? ", …" : "") +
                                   ", which rise in equal steps as the bounds of bands (ages, pay) or the points of a "
                                   "scale do, and they were read as counts; if they are labels, enter them as text (type "
                                   "an apostrophe first: '" + as_typed(start) + ") so that they are read as labels.");
        }
    };
    // The corner cell labels the first row when there is a header column, and the first column when
    // there is a header row.
    const Cell& corner = range.at(0, 0);
    const Cell no_label;
    // The other labels of the header line, built only when asked for (a sheet reads thousands of small tables).
    const auto header_line = [&](std::size_t length, auto cell_at) {
        return [=]() {
            std::vector<std::string> labels;
            for (std::size_t i = 1; i < length; ++i) labels.push_back(label_of(cell_at(i)));
            return labels;
        };
    };
    if (!header_row)
        doubt_numbers_as_labels("Row 1", header_column ? corner : no_label,
                                header_line(range.rows(), [&](std::size_t r) -> const Cell& { return range.at(r, 0); }),
                                body_columns,
                                [&](std::size_t c) -> const Cell& { return range.at(0, first_body_column + c); });
    if (!header_column)
        doubt_numbers_as_labels("Column 1", header_row ? corner : no_label,
                                header_line(range.columns(), [&](std::size_t c) -> const Cell& { return range.at(0, c); }),
                                body_rows,
                                [&](std::size_t r) -> const Cell& { return range.at(first_body_row + r, 0); });

    table.has_column_labels_ = header_row;
    table.has_row_labels_ = header_column;
    table.body_column_labels_.assign(body_columns, "");
    table.body_row_labels_.assign(body_rows, "");
    if (header_row)
        for (std::size_t c = 0; c < body_columns; ++c) table.body_column_labels_[c] = label_of(range.at(0, first_body_column + c));
    if (header_column)
        for (std::size_t r = 0; r < body_rows; ++r) table.body_row_labels_[r] = label_of(range.at(first_body_row + r, 0));

    // Totals and percentages: what the author did not mean as counts.
    detail::TotalLines totals;
    if (!options.find_totals) {
        totals.rows.assign(body_rows, 0);
        totals.columns.assign(body_columns, 0);
    } else {
        const detail::BodySide rows{"row", "column", &table.body_row_labels_, header_column, first_body_row + 1};
        const detail::BodySide columns{"column", "row", &table.body_column_labels_, header_row, first_body_column + 1};
        totals = detail::find_total_lines(body, rows, columns, options.distinct_labels, options.counts_only);
        table.doubts_ = totals.doubts;
    }
    for (std::string& doubt : label_doubts) table.doubts_.push_back(std::move(doubt));
    detail::LineSums sums = detail::line_sums(body, totals.rows, totals.columns);
    if (options.counts_only)
        for (std::string& doubt : detail::refuse_percentages(body, sums)) table.doubts_.push_back(std::move(doubt));
    table.finish(std::move(body), options, totals.rows, totals.columns, std::move(sums.sums), sums.all_whole);
    return table;
}

CountTable CountTable::from_counts(const Matrix& counts, const ReadOptions& options) {
    require(counts.size() > 0, "the range is empty; select a table of counts");
    for (std::size_t r = 0; r < counts.rows(); ++r)
        for (std::size_t c = 0; c < counts.columns(); ++c) {
            const double value = counts(r, c);
            if (!(std::isfinite(value) && value >= 0))
                throw Error(
                    "row " + std::to_string(r + 1) + ", column " + std::to_string(c + 1) +
                        " holds " + Cell::number(value).describe() + "; counts must be numbers of zero or more");
        }
    CountTable table;
    table.body_row_labels_.assign(counts.rows(), "");
    table.body_column_labels_.assign(counts.columns(), "");
    const std::vector<char> no_rows(counts.rows(), 0), no_columns(counts.columns(), 0);
    detail::LineSums sums = detail::line_sums(counts, no_rows, no_columns);
    table.finish(counts, options, no_rows, no_columns, std::move(sums.sums), sums.all_whole);
    return table;
}

// Sets aside total lines and all-zero rows and columns, then fills the totals of what is kept.
void CountTable::finish(Matrix body, const ReadOptions& options, const std::vector<char>& total_rows,
                        const std::vector<char>& total_columns, std::vector<double> body_totals, bool whole) {
    body_ = std::move(body);  // kept, not copied: a sheet may read thousands of small tables
    body_rows_ = body_.rows();
    body_columns_ = body_.columns();
    whole_counts_ = whole;
    const double* const body_row_totals = body_totals.data();
    const double* const body_column_totals = body_totals.data() + body_rows_;
    // Room for everything at once, and nothing built twice: a sheet may read thousands of small tables
    // per recalculation. When no line is set aside (the usual table), the kept lines are the
    // categories and the counts are the body, so the accessors hand out those and no copy is made.
    category_rows_.reserve(body_rows_);
    category_columns_.reserve(body_columns_);
    for (std::size_t r = 0; r < body_rows_; ++r) {
        if (!total_rows[r]) category_rows_.push_back(r);
        if (total_rows[r]) set_aside_rows_.push_back({r, body_row_labels_[r], SetAside::Why::total, range_row(r)});
        else if (!(body_row_totals[r] > 0))
            set_aside_rows_.push_back({r, body_row_labels_[r], SetAside::Why::no_counts, range_row(r)});
    }
    for (std::size_t c = 0; c < body_columns_; ++c) {
        if (!total_columns[c]) category_columns_.push_back(c);
        if (total_columns[c]) set_aside_columns_.push_back({c, body_column_labels_[c], SetAside::Why::total, range_column(c)});
        else if (!(body_column_totals[c] > 0))
            set_aside_columns_.push_back({c, body_column_labels_[c], SetAside::Why::no_counts, range_column(c)});
    }
    every_row_kept_ = set_aside_rows_.empty();
    every_column_kept_ = set_aside_columns_.empty();
    if (!every_row_kept_) {
        kept_rows_.reserve(body_rows_);
        for (std::size_t r : category_rows_)
            if (body_row_totals[r] > 0) kept_rows_.push_back(r);
    }
    if (!every_column_kept_) {
        kept_columns_.reserve(body_columns_);
        for (std::size_t c : category_columns_)
            if (body_column_totals[c] > 0) kept_columns_.push_back(c);
    }
    const std::vector<std::size_t>& rows_kept = kept_rows();
    const std::vector<std::size_t>& columns_kept = kept_columns();

    if (options.require_two_by_two) {
        auto shortfall = [](std::size_t kept, const std::vector<SetAside>& aside, const char* word) {
            std::string message = "the table has " + std::string(kept == 0 ? "no" : "only 1") + " " + word +
                                  " with counts";
            const auto totals = static_cast<std::size_t>(std::count_if(
                aside.begin(), aside.end(), [](const SetAside& line) { return line.why == SetAside::Why::total; }));
            const std::size_t empty = aside.size() - totals;
            std::vector<std::string> parts;
            if (empty > 0) parts.push_back(plural(empty, word) + " with all zeros");
            if (totals > 0) parts.push_back(plural(totals, word) + " of totals");
            if (!parts.empty()) message += " (" + name_list(parts) + " set aside)";
            return message + "; a test of association needs at least 2 rows and 2 columns with counts";
        };
        if (rows_kept.size() < 2) throw Error(shortfall(rows_kept.size(), set_aside_rows_, "row"));
        if (columns_kept.size() < 2) throw Error(shortfall(columns_kept.size(), set_aside_columns_, "column"));
    }

    if (!(every_row_kept_ && every_column_kept_)) {
        counts_ = Matrix(rows_kept.size(), columns_kept.size());
        for (std::size_t r = 0; r < rows_kept.size(); ++r)
            for (std::size_t c = 0; c < columns_kept.size(); ++c) counts_(r, c) = body_(rows_kept[r], columns_kept[c]);
    }
    if (!every_row_kept_) {
        row_labels_.reserve(rows_kept.size());
        for (std::size_t r : rows_kept) row_labels_.push_back(body_row_labels_[r]);
    }
    if (!every_column_kept_) {
        column_labels_.reserve(columns_kept.size());
        for (std::size_t c : columns_kept) column_labels_.push_back(body_column_labels_[c]);
    }
    column_totals_.resize(columns_kept.size());
    for (std::size_t c = 0; c < columns_kept.size(); ++c) column_totals_[c] = body_column_totals[columns_kept[c]];
    // The row totals take over the body's sums (rows first) in place.
    for (std::size_t r = 0; r < rows_kept.size(); ++r) body_totals[r] = body_row_totals[rows_kept[r]];
    body_totals.resize(rows_kept.size());
    row_totals_ = std::move(body_totals);
    total_ = 0.0;
    for (double t : row_totals_) total_ += t;
    require(std::isfinite(total_), "the counts add up to more than a spreadsheet number can hold");
    // The smallest expected count must be an ordinary double, or E underflows to 0 and the
    // statistics turn into 0/0: only counts near 1e-308, or spanning over 300 orders of
    // magnitude, get here.
    if (!row_totals_.empty() && !column_totals_.empty()) {
        const double smallest_row = *std::min_element(row_totals_.begin(), row_totals_.end());
        const double smallest_column = *std::min_element(column_totals_.begin(), column_totals_.end());
        require(smallest_row / total_ * smallest_column >= std::numeric_limits<double>::min(),
                "the counts are too small, or too far apart in size, to compute with (an expected count falls "
                "below 1e-308); multiply them all by a common factor or round the smallest to 0");
    }
}

Matrix CountTable::category_counts() const {
    Matrix counts(category_rows_.size(), category_columns_.size());
    for (std::size_t r = 0; r < category_rows_.size(); ++r)
        for (std::size_t c = 0; c < category_columns_.size(); ++c) counts(r, c) = body_(category_rows_[r], category_columns_[c]);
    return counts;
}

Matrix CountTable::to_body_shape(const Matrix& kept, double fill) const {
    Matrix body(body_rows_, body_columns_, fill);
    const std::vector<std::size_t>& rows_kept = kept_rows();
    const std::vector<std::size_t>& columns_kept = kept_columns();
    for (std::size_t r = 0; r < rows_kept.size(); ++r)
        for (std::size_t c = 0; c < columns_kept.size(); ++c) body(rows_kept[r], columns_kept[c]) = kept(r, c);
    return body;
}

}  // namespace assoc
