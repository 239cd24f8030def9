#pragma once
// The rate of an outcome in each row of a table with its Wilson score interval, and the difference
// between the rates of two rows with Newcombe's hybrid score interval: the figures a memo quotes
// ("29.7% of Design staff were promoted, 95% interval 24.3% to 35.7%").
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"

namespace assoc {

// A rate count / total with the ends of its confidence interval.
struct RateInterval {
    double rate = 0.0;
    double lower = 0.0;
    double upper = 1.0;
};

// The Wilson (1927) score interval: the rates p that the score test |x − n p| ≤ z √(n p (1 − p)) does
// not reject, z the two-sided normal quantile of `confidence`. Its ends are
//   lower = 2x² / (n (A + B)),  upper = (A + B) / (2 (n + z²)),  A = 2x + z²,  B = z √(z² + 4x(n − x)/n),
// the textbook (A ∓ B) / (2 (n + z²)) written without cancellation. The interval always lies inside
// [0, 1] and holds the rate: a rate of 0 gives lower = 0 exactly and upper = z² / (n + z²); a rate of 1
// gives upper = 1 exactly and lower = n / (n + z²). `count` (whole or not) must lie from 0 to `total`,
// and `total` must be above 0.
RateInterval wilson_interval(double count, double total, double confidence = 0.95);

// One row of a table: its total and the rate of column 1 with the Wilson interval.
struct RowRate {
    std::string name;         // the row's label, or "row k" (k its place among the rows of the body)
    bool has_counts = false;  // false: every count of the row is 0 (or blank), so it has no rate
    double total = 0.0;       // the row total n
    RateInterval rate;        // column 1 / n, with its interval; meaningless without counts
};

struct RowRates {
    std::vector<RowRate> rows;         // one per row of the range's body, in order
    double confidence = 0.95;
    std::vector<std::string> remarks;  // rows without counts, and how the range was read
};

// Reads a range of counts (a header row and a label column allowed, blanks read as 0): column 1 is
// the outcome of interest, the other columns together the rest. Every row of the body gets a line;
// a row of zeros has no rate and says so in `remarks`. A table of one row is allowed; fewer than 2
// columns of counts, or no row with counts, is an error.
RowRates row_rates(const CellGrid& range, double confidence = 0.95);

// The rate of row 1 minus the rate of row 2.
struct RateDifference {
    double difference = 0.0;
    double lower = 0.0, upper = 0.0;  // Newcombe's hybrid score interval, inside [−1, 1]
    RateInterval first, second;       // each row's rate with its Wilson interval
    double confidence = 0.95;
    std::vector<std::string> remarks;  // from a range: how it was read (table_notes)
};

// Newcombe (1998, Statistics in Medicine 17:873–890, method 10), built from the Wilson intervals
// (l1, u1) and (l2, u2) of the two rates p1 and p2:
//   lower = (p1 − p2) − √((p1 − l1)² + (u2 − p2)²),  upper = (p1 − p2) + √((u1 − p1)² + (p2 − l2)²).
// Rates of 0 or 1 need no correction: the Wilson intervals stay inside [0, 1], and so does the
// difference's inside [−1, 1].
RateDifference rate_difference(double count1, double total1, double count2, double total2, double confidence = 0.95);

// The same for a 2×2 range (headers allowed): rows are the two groups, column 1 the outcome of
// interest. A column of zeros is allowed (both rates 0, or both 1); a row of zeros is an error,
// since that group has no rate.
RateDifference rate_difference(const CellGrid& range, double confidence = 0.95);

}  // namespace assoc
