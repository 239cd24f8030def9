#include "assoc/ordinal_measures.hpp"

#include <cmath>
#include <vector>

#include "assoc/error.hpp"

namespace assoc {
namespace {

struct Pairs {
    double concordant = 0.0;
    double discordant = 0.0;
};

// Every count is multiplied by 2^-scale, a power of two (exact), so that n² cannot overflow for
// huge weights; both measures are ratios of pair counts, which the scale leaves unchanged.
int pair_scale(const CountTable& table) { return table.total() > 0x1p400 ? std::ilogb(table.total()) : 0; }

// C and D in one pass over the cells, from the sums of the cells below and to the right (left):
// below[j] holds Σ_{k>i, l≥j} n_kl for the rows after the current one. For whole counts with
// n below about 9·10⁷ every product and sum is an exact integer in a double.
Pairs pairs(const CountTable& table) {
    const std::size_t rows = table.rows(), columns = table.columns();
    const int scale = pair_scale(table);
    std::vector<double> below(columns + 1, 0.0);  // below[columns] = 0
    Pairs result;
    for (std::size_t i = rows; i-- > 0;) {
        for (std::size_t j = 0; j < columns; ++j) {
            const double count = std::ldexp(table.count(i, j), -scale);
            if (count == 0) continue;
            result.concordant += count * below[j + 1];
            result.discordant += count * (below[0] - below[j]);
        }
        // Add row i to the suffix sums for the rows above it.
        double suffix = 0.0;
        for (std::size_t j = columns; j-- > 0;) {
            suffix += std::ldexp(table.count(i, j), -scale);
            below[j] += suffix;
        }
    }
    return result;
}

// n² − Σ T² over one side's totals T (twice the pairs not tied on that side), as Σ T_i·(Σ_{k≠i} T_k):
// when one total dwarfs the others, n² and Σ T² share their leading digits and their difference
// loses them (2.5% off for 1e15 beside a few ones); the sum of products loses none.
double untied_pairs(const std::vector<double>& totals, int scale) {
    std::vector<double> after(totals.size() + 1, 0.0);
    for (std::size_t i = totals.size(); i-- > 0;) after[i] = after[i + 1] + std::ldexp(totals[i], -scale);
    double before = 0.0, untied = 0.0;
    for (std::size_t i = 0; i < totals.size(); ++i) {
        const double total = std::ldexp(totals[i], -scale);
        untied += total * (before + after[i + 1]);
        before += total;
    }
    return untied;
}

void require_ordered_table(const CountTable& table, const char* measure) {
    require(table.rows() >= 2 && table.columns() >= 2,
            std::string(measure) + " needs at least 2 rows and 2 columns with counts");
}

}  // namespace

double goodman_kruskal_gamma(const CountTable& table) {
    require_ordered_table(table, "gamma");
    const Pairs p = pairs(table);
    // With 2 rows and 2 columns holding counts some pair differs on both; the check guards weights near 0.
    require(p.concordant + p.discordant > 0,
            "gamma is undefined: no two counts differ in both their row and their column");
    return (p.concordant - p.discordant) / (p.concordant + p.discordant);
}

double kendall_tau_b(const CountTable& table) {
    require_ordered_table(table, "tau-b");
    const Pairs p = pairs(table);
    const int scale = pair_scale(table);
    const double untied_rows = untied_pairs(table.row_totals(), scale);
    const double untied_columns = untied_pairs(table.column_totals(), scale);
    require(untied_rows > 0 && untied_columns > 0, "tau-b is undefined: every pair of counts is tied on the rows or the columns");
    const double tau = 2 * (p.concordant - p.discordant) / (std::sqrt(untied_rows) * std::sqrt(untied_columns));
    return std::fmax(-1.0, std::fmin(1.0, tau));
}

}  // namespace assoc
