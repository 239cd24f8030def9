#pragma once
// Tests for paired answers: the same people classified twice (before and after a change, by two
// raters). Rows are the first classification, columns the second, in the same category order.
// McNemar's test (2×2) and Bowker's test of symmetry (k×k) ask whether changes in one direction
// outnumber changes in the other.
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/matrix.hpp"

namespace assoc {

enum class PairedMethod {
    corrected,    // McNemar with continuity correction, max(0, |b − c| − 1)² / (b + c): the default for 2×2
    uncorrected,  // (b − c)² / (b + c); for k×k, Bowker's Σ_{i<j} (n_ij − n_ji)² / (n_ij + n_ji)
    exact,        // two-sided binomial test of b against b + c with probability ½ (2×2, whole counts)
};

// Reads the option word: "corrected", "uncorrected" or "exact", in any case; "" (omitted)
// gives no method, which paired_test reads as corrected for 2×2 and Bowker's test for k×k.
std::optional<PairedMethod> parse_paired_method(const std::string& word);

struct PairedResult {
    double p_value = 1.0;
    // Chi-squared methods: the statistic. Exact: the smaller discordant count, min(b, c).
    double statistic = 0.0;
    // Chi-squared methods: the pairs of cells compared. Exact: 0 (no chi-squared distribution).
    double df = 0.0;
    PairedMethod method = PairedMethod::corrected;  // the method applied
    // How the table was read, for ASSOC.CHECK (e.g. columns matched to the rows by their labels).
    std::vector<std::string> remarks;
};

// The paired test of a square table of counts (k ≥ 2 categories). The continuity correction never
// exceeds |b − c| (for whole counts this is R's mcnemar.test exactly). For k ≥ 3 only Bowker's
// test applies: asking for "corrected" or "exact" there is an error, not a silent change of
// method. Pairs of cells with n_ij + n_ji = 0 are skipped and not counted in df; if no pair
// holds counts there is nothing to test (an error).
PairedResult paired_test(const Matrix& square, std::optional<PairedMethod> method = std::nullopt);

// Reads the table as read_count_table does (a header row and label column are allowed; empty
// rows and columns are kept, since row i and column i must stay the same category; total lines are
// left out), then tests it. A table that is not square is an error: a corner of a larger table is
// never used. When both the rows and the columns carry labels, the columns are matched to the rows
// by their labels (trimmed, A–Z read as a–z), whatever their order; labels that do not match, or a
// label missing or given twice, are an error that names them.
PairedResult paired_test(const CellGrid& table, std::optional<PairedMethod> method = std::nullopt);

}  // namespace assoc
