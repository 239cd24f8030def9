#pragma once
// What every fuzz target shares: the fuzzer's bytes read as spreadsheet input, and the invariants.
//
// Input format (text, so that the seed corpora in fuzz/corpus/ can be read and written by hand):
// sections separated by a line "---"; each section is a block of cells, one line per row, cells
// separated by ';' (short rows are padded with blanks). A cell is
//   - empty: a blank;
//   - a token that strtod reads to its end ("3", "1e308", "-0", "nan", "inf", "0x1p-1074"): a number;
//   - a token starting with an apostrophe: the text after it ("'12" is the text "12");
//   - anything else: that text.
// Each target says what its sections mean.
#include <cstddef>
#include <cstdint>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/matrix.hpp"

namespace assoc::fuzz {

// Cells read from one input at most; keeps a single run short (the core's own caps are far larger).
inline constexpr std::size_t max_input_cells = 4096;

std::vector<CellGrid> read_sections(const std::uint8_t* data, std::size_t size);

// The section `i`, or an empty grid when the input has fewer.
const CellGrid& section(const std::vector<CellGrid>& sections, std::size_t i);
// The cell (0, i) of a section as a number, or `fallback` when it is missing or not a number.
double number_at(const CellGrid& grid, std::size_t i, double fallback);
// The cell (0, i) of a section as a word, or "" when it is missing or not a text.
std::string word_at(const CellGrid& grid, std::size_t i);

// A broken invariant: prints what and where, then aborts so that libFuzzer saves the input.
[[noreturn]] void finding(const std::string& what);
// The invariants. `what` names the value in the finding's message; a value that is not finite is a
// finding everywhere (the numerics of issue 9 have landed: no known finding is skipped any more).
void check_probability(double p, const std::string& what);      // finite, in [0, 1]
void check_nonnegative(double x, const std::string& what);      // finite, ≥ 0
void check_finite(double x, const std::string& what);           // finite
void check_between(double x, double low, double high, const std::string& what);  // finite, in [low, high]
// A message for the user: not empty, no library's words, no number with more than 17 significant digits.
void check_message(const std::string& message, const std::string& what);
void check_finite(const Matrix& values, const std::string& what);

// Process CPU time in seconds (robust to a loaded machine, unlike the wall clock the core's caps use:
// a computation that stops at its wall-clock cap has used at most that much CPU time).
double cpu_seconds();
// CPU seconds spent so far in check_message (left out of attempt's time limit: they are the harness's).
double message_checking_seconds();

// CPU seconds any call may take under the sanitizers before it counts as a hang (the core's work caps
// are wall-clock times of at most a few seconds; the targets give the capped computations far less).
inline constexpr double max_call_seconds = 5.0;

// Runs `compute`, which calls the core and checks its answer. An assoc::Error is a refusal, which is
// fine when its message reads as Assoc's own; any other exception, or a call that runs past
// `max_seconds` of CPU time (the checks of messages left out), is a finding. Returns whether
// `compute` finished without an Error.
template <class Compute>
bool attempt(const std::string& what, Compute compute, double max_seconds = max_call_seconds) {
    const double start = cpu_seconds(), checking = message_checking_seconds();
    bool answered = false;
    try {
        compute();
        answered = true;
    } catch (const Error& error) {
        check_message(error.what(), what);
    } catch (const std::exception& error) {
        finding(what + " threw something other than assoc::Error: " + error.what());
    } catch (...) {
        finding(what + " threw something other than assoc::Error");
    }
    const double used = cpu_seconds() - start - (message_checking_seconds() - checking);
    if (used > max_seconds)
        finding(what + " took " + std::to_string(used) + " s of CPU time, more than " + std::to_string(max_seconds) + " s");
    return answered;
}

}  // namespace assoc::fuzz

namespace assoc::fuzz {

// Every number of the grid times `factor`.
CellGrid scaled(const CellGrid& grid, double factor);
// A power of 4 (so that square roots scale exactly) from 4^-8 to 4^8, chosen by the input.
double scale_factor(const std::uint8_t* data, std::size_t size);
// Whether a and b agree to a relative `tolerance` (or both are within `tolerance` of 0).
bool close(double a, double b, double tolerance = 1e-9);

}  // namespace assoc::fuzz
