#include "assoc/cochrans_q.hpp"

#include <algorithm>
#include <cmath>
#include <string>

#include "ascii_case.hpp"
#include "assoc/chi_squared_distribution.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"

namespace assoc {
namespace {

std::string cell_name(std::size_t row, std::size_t column) {
    return "row " + std::to_string(row + 1) + ", column " + std::to_string(column + 1);
}

std::string quoted(const std::string& text) { return "\"" + text + "\""; }

// "rows 4, 9 and 12" (at most `shown` of them, then "…").
std::string row_list(const std::vector<std::size_t>& rows, std::size_t shown = 6) {
    std::string text = rows.size() == 1 ? "row " : "rows ";
    for (std::size_t i = 0; i < rows.size() && i < shown; ++i) {
        if (i > 0) text += (i + 1 == rows.size() ? " and " : ", ");
        text += std::to_string(rows[i] + 1);
    }
    if (rows.size() > shown) text += ", …";
    return text;
}

// A header names the occasions: a first row of texts (and blanks) none of which is an answer below it.
bool first_row_is_header(const CellGrid& range) {
    if (range.rows() < 2) return false;
    bool any_text = false;
    for (std::size_t c = 0; c < range.columns(); ++c) {
        const Cell& cell = range.at(0, c);
        if (cell.is_number()) return false;
        any_text = any_text || cell.is_text();
    }
    if (!any_text) return false;
    for (std::size_t r = 1; r < range.rows(); ++r)
        for (std::size_t k = 0; k < range.columns(); ++k) {
            const Cell& answer = range.at(r, k);
            if (!answer.is_text()) continue;
            for (std::size_t c = 0; c < range.columns(); ++c)
                if (range.at(0, c) == answer) return false;
        }
    return true;
}

// A first column that names the people (an ID or a name per row): its entries, below the header,
// are all filled and all different, while the other columns hold answers (1 and 0, or at most two
// texts), and it holds something that is no answer. Read as answers, employee numbers were refused
// as answers other than 1 and 0, and names as a third label.
bool first_column_names_people(const CellGrid& range, std::size_t first_row) {
    if (range.columns() < 3 || range.rows() < first_row + 2) return false;
    std::vector<const Cell*> names;
    for (std::size_t r = first_row; r < range.rows(); ++r) {
        const Cell& cell = range.at(r, 0);
        if (cell.is_blank()) return false;
        for (const Cell* seen : names)
            if (*seen == cell) return false;
        names.push_back(&cell);
    }
    std::vector<const Cell*> answers;  // the distinct answers of the other columns
    for (std::size_t r = first_row; r < range.rows(); ++r)
        for (std::size_t c = 1; c < range.columns(); ++c) {
            const Cell& cell = range.at(r, c);
            if (cell.is_blank()) continue;
            if (cell.is_number() && cell.as_number() != 0 && cell.as_number() != 1) return false;
            if (std::none_of(answers.begin(), answers.end(), [&](const Cell* a) { return *a == cell; })) {
                answers.push_back(&cell);
                if (answers.size() > 2) return false;
            }
        }
    if (answers.empty()) return false;
    return std::any_of(names.begin(), names.end(), [&](const Cell* name) {
        return std::none_of(answers.begin(), answers.end(), [&](const Cell* a) { return *a == *name; }) &&
               !(name->is_number() && (name->as_number() == 0 || name->as_number() == 1));
    });
}

}  // namespace

RepeatedResult cochrans_q_test(const Matrix& answers) {
    const std::size_t people = answers.rows(), k = answers.columns();
    require(k >= 2, "Cochran's Q needs at least 2 occasions (columns of answers); this range has " + std::to_string(k));
    require(people >= 1, "there are no complete rows of answers to test");
    std::vector<double> occasion_yes(k, 0.0);
    double total = 0.0, person_spread = 0.0;  // T and Σ R_i (k − R_i), exact for whole counts
    for (std::size_t i = 0; i < people; ++i) {
        double person = 0.0;
        for (std::size_t j = 0; j < k; ++j) {
            const double answer = answers(i, j);
            if (answer != 0 && answer != 1)  // the message is built only on failure: 10,000 people × 10 occasions
                throw Error(cell_name(i, j) + " holds " + Cell::number(answer).describe() +
                            "; answers must be 1 (yes) or 0 (no)");
            person += answer;
            occasion_yes[j] += answer;
        }
        total += person;
        person_spread += person * (static_cast<double>(k) - person);
    }
    require(person_spread > 0, "no one's answers differ from one occasion to another (each person answered the same "
                               "every time), so there is no change to test");
    // k Σ C_j² − T² = k Σ (C_j − T/k)², in whole numbers: exact below 2^53.
    double squares = 0.0;
    for (double yes : occasion_yes) squares += yes * yes;
    const double kd = static_cast<double>(k);
    RepeatedResult result;
    result.people = people;
    result.occasions = k;
    result.statistic = (kd - 1) * (kd * squares - total * total) / person_spread;
    result.df = kd - 1;
    result.p_value = chi_squared_p_value(result.statistic, result.df);
    return result;
}

RepeatedResult cochrans_q_test(const CellGrid& range, const Cell& yes) {
    require(!range.empty(), "the range is empty; select the answers, one row per person and one column per occasion");
    const std::size_t first = first_row_is_header(range) ? 1 : 0;
    // c0: the first column of answers (1 when column 1 names the people).
    const std::size_t c0 = first_column_names_people(range, first) ? 1 : 0;
    const std::size_t k = range.columns();
    require(k >= 2, "Cochran's Q needs at least 2 occasions (columns of answers); this range has 1 column");

    // The labels: numbers (1 and 0) or texts, not both.
    std::vector<std::string> labels;  // distinct texts, in order of first appearance
    std::size_t number_row = 0, number_column = 0, text_row = 0, text_column = 0;
    bool numbers = false;
    for (std::size_t r = first; r < range.rows(); ++r)
        for (std::size_t c = c0; c < k; ++c) {
            const Cell& cell = range.at(r, c);
            if (cell.is_number()) {
                if (cell.as_number() != 0 && cell.as_number() != 1)
                    throw Error(cell_name(r, c) + " holds " + cell.describe() +
                                "; answers must be 1 (yes) or 0 (no), or two text labels");
                if (!numbers) number_row = r, number_column = c;
                numbers = true;
            } else if (cell.is_text() && std::find(labels.begin(), labels.end(), cell.as_text()) == labels.end()) {
                if (labels.empty()) text_row = r, text_column = c;
                labels.push_back(cell.as_text());
            }
        }
    require(!(numbers && !labels.empty()),
            "the answers mix numbers and texts (" + cell_name(number_row, number_column) + " holds " +
                range.at(number_row, number_column).describe() + ", " + cell_name(text_row, text_column) + " " +
                range.at(text_row, text_column).describe() + "); use 1 and 0, or two text labels");
    if (labels.size() > 2) {
        std::string message = "the answers hold more than two labels (" + quoted(labels[0]) + ", " + quoted(labels[1]) +
                              " and " + quoted(labels[2]) + (labels.size() > 3 ? ", …" : "") + "); a yes/no test needs exactly two";
        for (std::size_t i = 0; i < labels.size(); ++i)
            for (std::size_t j = i + 1; j < labels.size(); ++j)
                if (detail::equals_ignoring_case(labels[i], labels[j]))
                    throw Error(message + " (labels are compared exactly: " + quoted(labels[i]) + " and " +
                                quoted(labels[j]) + " are two labels)");
        throw Error(message);
    }

    // Which answer counts as yes.
    RepeatedResult reading;
    if (c0 == 1)
        reading.remarks.push_back("Column 1 holds a different entry on every row and no answer, so it was read as "
                                  "the people's names or numbers and left out of the answers.");
    Cell yes_cell = Cell::number(1);
    if (!labels.empty()) {
        std::size_t chosen = labels.size();
        if (yes.is_text()) {
            for (std::size_t i = 0; i < labels.size() && chosen == labels.size(); ++i)
                if (labels[i] == yes.as_text()) chosen = i;
            for (std::size_t i = 0; i < labels.size() && chosen == labels.size(); ++i)
                if (detail::equals_ignoring_case(labels[i], yes.as_text())) chosen = i;
            require(chosen < labels.size(), "the yes label " + quoted(yes.as_text()) + " is not among the answers, which are " +
                                                quoted(labels[0]) + (labels.size() > 1 ? " and " + quoted(labels[1]) : ""));
        } else if (!yes.is_blank()) {
            throw Error("the yes label must be one of the answers' texts (" + quoted(labels[0]) +
                        (labels.size() > 1 ? " or " + quoted(labels[1]) : "") + "), not " + yes.describe() +
                        (yes.as_number() == 0 ? " (an empty cell arrives as 0; leave the argument out)" : ""));
        } else {
            chosen = 0;
            for (std::size_t i = 0; i < labels.size(); ++i)
                if (detail::equals_ignoring_case(labels[i], "yes")) chosen = i;
            const std::string other = labels.size() > 1 ? labels[1 - chosen] : std::string();
            reading.remarks.push_back("The answers are " + quoted(labels[chosen]) +
                                      (other.empty() ? "" : " and " + quoted(other)) + "; " + quoted(labels[chosen]) +
                                      " was counted as yes (the yes argument chooses; Cochran's Q is the same either way).");
        }
        yes_cell = Cell::text(labels[chosen]);
    } else if (!yes.is_blank()) {
        require(yes.is_number() && (yes.as_number() == 1 || yes.as_number() == 0),
                "the answers are 1 and 0, so the yes label must be 1 or 0 (or left out: 1 counts as yes), not " +
                    yes.describe());
        yes_cell = yes;
    }

    // Complete rows only.
    std::vector<std::size_t> kept, incomplete;
    std::size_t empty = 0;
    for (std::size_t r = first; r < range.rows(); ++r) {
        std::size_t blanks = 0;
        for (std::size_t c = c0; c < k; ++c) blanks += range.at(r, c).is_blank();
        if (blanks == k - c0) ++empty;
        else if (blanks > 0) incomplete.push_back(r);
        else kept.push_back(r);
    }
    Matrix answers(kept.size(), k - c0);
    for (std::size_t i = 0; i < kept.size(); ++i)
        for (std::size_t c = c0; c < k; ++c) answers(i, c - c0) = range.at(kept[i], c) == yes_cell ? 1.0 : 0.0;
    if (!incomplete.empty())
        reading.remarks.push_back(std::to_string(incomplete.size()) +
                                  (incomplete.size() == 1 ? " person with a blank answer was" : " people with a blank answer were") +
                                  " set aside (" + row_list(incomplete) + " of the range); Cochran's Q uses only people "
                                  "who answered on every occasion.");
    if (empty > 0)
        reading.remarks.push_back(std::to_string(empty) + (empty == 1 ? " empty row was" : " empty rows were") + " skipped.");
    require(!kept.empty(), "no row has an answer on every occasion, so there is nothing to test");

    RepeatedResult result = cochrans_q_test(answers);
    result.set_aside = incomplete.size();
    result.remarks = reading.remarks;
    return result;
}

}  // namespace assoc
