#include "fuzz_support.hpp"


#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <ctime>

#include "assoc/wording.hpp"

namespace assoc::fuzz {
namespace {

// Every text of the current input: messages quote them (see check_message).
std::vector<std::string> input_texts;

// A text in the ways messages show it (core/src/wording.cpp): as it is; trimmed; with its first
// capital, or every capital, in small letters; and, in error messages, only up to its first NUL
// (what() ends there). Texts cut short with "…" are found by check_message.
void remember_forms(const std::string& text) {
    // Trimmed as the core trims labels (no-break and other spaces too).
    const std::string trimmed(trimmed_label(text));
    std::string first_small = trimmed, all_small = trimmed;
    if (!first_small.empty() && first_small[0] >= 'A' && first_small[0] <= 'Z') first_small[0] = static_cast<char>(first_small[0] + 32);
    for (char& c : all_small)
        if (c >= 'A' && c <= 'Z') c = static_cast<char>(c + 32);
    for (const std::string& form : {text, trimmed, first_small, all_small})
        if (!form.empty()) input_texts.push_back(form);
}

void remember_text(const std::string& text) {
    const std::size_t nul = text.find('\0');
    if (nul != std::string::npos) remember_text(text.substr(0, nul));
    // The report takes the names of its variables from a corner "Department / Outcome", split at its
    // first separator (report.cpp). Only there: splitting at every one gave a text of 80 slashes 320
    // texts to look for in every message, a minute per input under the sanitizers.
    const std::size_t separator = text.find_first_of("/\\");
    if (separator != std::string::npos) {
        remember_forms(text.substr(0, separator));
        remember_forms(text.substr(separator + 1));
    }
    remember_forms(text);
}

Cell read_cell(const std::string& token) {
    if (token.empty()) return Cell::blank();
    if (token[0] == '\'') return Cell::text(token.substr(1));
    // strtod stops at a NUL; a token with one inside is a text.
    if (token.find('\0') == std::string::npos) {
        char* end = nullptr;
        const double value = std::strtod(token.c_str(), &end);
        if (end == token.c_str() + token.size()) return Cell::number(value);
    }
    return Cell::text(token);
}

}  // namespace

std::vector<CellGrid> read_sections(const std::uint8_t* data, std::size_t size) {
    using Rows = std::vector<std::vector<Cell>>;
    input_texts.clear();
    std::vector<Rows> blocks(1);
    std::size_t cells = 0;
    std::size_t start = 0;
    while (start <= size && cells < max_input_cells) {
        std::size_t end = start;
        while (end < size && data[end] != '\n') ++end;
        const std::string line(reinterpret_cast<const char*>(data) + start, end - start);
        if (line == "---") {
            blocks.emplace_back();
        } else if (!(end == size && line.empty())) {  // no empty row from a final newline
            std::vector<Cell> row;
            std::size_t from = 0;
            for (;;) {
                const std::size_t to = line.find(';', from);
                row.push_back(read_cell(line.substr(from, to == std::string::npos ? std::string::npos : to - from)));
                if (row.back().is_text()) remember_text(row.back().as_text());
                if (++cells >= max_input_cells || to == std::string::npos) break;
                from = to + 1;
            }
            blocks.back().push_back(std::move(row));
        }
        start = end + 1;
    }
    std::vector<CellGrid> grids;
    for (const Rows& rows : blocks) {
        std::size_t columns = 0;
        for (const auto& row : rows) columns = std::max(columns, row.size());
        CellGrid grid(rows.size(), columns);
        for (std::size_t r = 0; r < rows.size(); ++r)
            for (std::size_t c = 0; c < rows[r].size(); ++c) grid.at(r, c) = rows[r][c];
        grids.push_back(std::move(grid));
    }
    return grids;
}

const CellGrid& section(const std::vector<CellGrid>& sections, std::size_t i) {
    static const CellGrid empty;
    return i < sections.size() ? sections[i] : empty;
}

double number_at(const CellGrid& grid, std::size_t i, double fallback) {
    if (grid.rows() == 0 || i >= grid.columns() || !grid.at(0, i).is_number()) return fallback;
    return grid.at(0, i).as_number();
}

std::string word_at(const CellGrid& grid, std::size_t i) {
    if (grid.rows() == 0 || i >= grid.columns() || !grid.at(0, i).is_text()) return "";
    return grid.at(0, i).as_text();
}

void finding(const std::string& what) {
    std::fprintf(stderr, "\n*** Assoc fuzz finding: %s\n", what.c_str());
    std::fflush(stderr);
    std::abort();
}

namespace {

std::string shown(double x) {
    char buffer[40];
    std::snprintf(buffer, sizeof buffer, "%.17g", x);
    return buffer;
}

}  // namespace

void check_finite(double x, const std::string& what) {
    if (!std::isfinite(x)) finding(what + " is " + shown(x) + ", returned as a valid result");
}

void check_probability(double p, const std::string& what) { check_between(p, 0.0, 1.0, what); }

void check_nonnegative(double x, const std::string& what) {
    check_finite(x, what);
    if (x < 0) finding(what + " is " + shown(x) + ", below 0");
}

void check_between(double x, double low, double high, const std::string& what) {
    check_finite(x, what);
    if (x < low || x > high) finding(what + " is " + shown(x) + ", outside [" + shown(low) + ", " + shown(high) + "]");
}

void check_finite(const Matrix& values, const std::string& what) {
    for (std::size_t r = 0; r < values.rows(); ++r)
        for (std::size_t c = 0; c < values.columns(); ++c)
            check_finite(values(r, c), what + " (" + std::to_string(r + 1) + ", " + std::to_string(c + 1) + ")");
}

namespace {
double checking_seconds = 0;  // CPU time spent in check_message, which the time limit of attempt leaves out
}  // namespace

double message_checking_seconds() { return checking_seconds; }

void check_message(const std::string& message, const std::string& what) {
    // The search for the input's texts in the message costs time of its own (long repetitive labels
    // under the sanitizers' memcmp took seconds), which is no time of the core's.
    struct Account {
        double started;
        ~Account() { checking_seconds += cpu_seconds() - started; }
    } account{cpu_seconds()};
    if (message.empty()) finding(what + " gave an empty message");
    // Messages quote the input's texts and join them to words of their own, so only what lies outside
    // every copy of an input text is held against the core.
    std::vector<bool> quoted(message.size(), false);
    for (const std::string& text : input_texts)
        for (std::size_t at = text.empty() ? std::string::npos : message.find(text); at != std::string::npos;
             at = message.find(text, at + 1))
            std::fill(quoted.begin() + static_cast<std::ptrdiff_t>(at),
                      quoted.begin() + static_cast<std::ptrdiff_t>(at + text.size()), true);
    // A label cut short: the longest start of an input text just before the "…" (wording.cpp cuts at
    // 24 or 40 bytes, or earlier at a character boundary).
    const std::string ellipsis = "…";
    for (std::size_t at = message.find(ellipsis); at != std::string::npos; at = message.find(ellipsis, at + 1)) {
        std::size_t longest = 0;
        for (const std::string& text : input_texts)
            for (std::size_t length = std::min({text.size(), at, std::size_t{40}}); length > longest; --length)
                if (message.compare(at - length, length, text, 0, length) == 0) {
                    longest = length;
                    break;
                }
        std::fill(quoted.begin() + static_cast<std::ptrdiff_t>(at - longest), quoted.begin() + static_cast<std::ptrdiff_t>(at),
                  true);
    }
    const auto own = [&](std::size_t at, std::size_t length) {
        return std::none_of(quoted.begin() + static_cast<std::ptrdiff_t>(at),
                            quoted.begin() + static_cast<std::ptrdiff_t>(at + length), [](bool q) { return q; });
    };
    // Words a library or the C++ runtime would write, never Assoc.
    for (const std::string word : {"boost", "Boost", "Error in function", "%1%", "std::", "basic_string", "vector::",
                                   "bad_alloc", "stod", "out_of_range", "_M_"})
        for (std::size_t at = message.find(word); at != std::string::npos; at = message.find(word, at + 1))
            if (own(at, word.size())) finding(what + " gave a library's message: " + message);
    // A number printed with more digits than a double holds is not formatted for reading ("%.30f"; the
    // significant digits of a run count, so 0.000166666666666667, an argument echoed as typed, passes).
    std::size_t digits = 0;
    for (std::size_t i = 0; i < message.size(); ++i) {
        const bool digit = message[i] >= '0' && message[i] <= '9' && !quoted[i];
        const bool point = message[i] == '.' && !quoted[i];
        if (!digit && !point) digits = 0;
        else if (digit && (digits > 0 || message[i] != '0')) ++digits;
        if (digits > 17) finding(what + " gave a number with more than 17 digits: " + message);
    }
}

double cpu_seconds() { return static_cast<double>(std::clock()) / CLOCKS_PER_SEC; }

}  // namespace assoc::fuzz

namespace assoc::fuzz {

CellGrid scaled(const CellGrid& grid, double factor) {
    CellGrid result = grid;
    for (std::size_t r = 0; r < grid.rows(); ++r)
        for (std::size_t c = 0; c < grid.columns(); ++c)
            if (grid.at(r, c).is_number()) result.at(r, c) = Cell::number(grid.at(r, c).as_number() * factor);
    return result;
}

double scale_factor(const std::uint8_t* data, std::size_t size) {
    unsigned hash = 0;
    for (std::size_t i = 0; i < size; ++i) hash = hash * 31 + data[i];
    return std::ldexp(1.0, 2 * static_cast<int>(hash % 17) - 16);
}

bool close(double a, double b, double tolerance) {
    return std::fabs(a - b) <= tolerance * std::max({std::fabs(a), std::fabs(b), 1.0});
}

}  // namespace assoc::fuzz
