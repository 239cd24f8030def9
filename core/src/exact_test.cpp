// The exact test: 2×2 tables go to Fisher's test (fisher_two_by_two.cpp), larger ones to the
// Freeman–Halton network (freeman_halton.cpp).
#include "assoc/exact_test.hpp"

#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "fisher_two_by_two.hpp"
#include "freeman_halton.hpp"

namespace assoc {

double exact_p_value(const CountTable& table, Side side, const ExactLimits& limits) {
    require(table.whole_counts(), "the exact test needs whole counts; this table holds counts that are not whole numbers");
    if (table.is_two_by_two()) {
        // Below 2^53 every whole number is a double, so the margins and the cells' products are exact.
        require(table.total() < 0x1p53, "the exact test takes totals below 9,007,199,254,740,992 (2^53), and this table's "
                                        "total is " + format_count(table.total()) +
                                            "; at this size use the chi-squared p-value (ASSOC.PVALUE)");
        return detail::fisher_two_by_two_p_value(table.count(0, 0), table.count(0, 1), table.count(1, 0),
                                                 table.count(1, 1), side, limits);
    }
    require(side == Side::two_sided, "one-sided exact tests (\"lower\", \"upper\") apply to 2×2 tables only; this table has " +
                                         std::to_string(table.rows()) + " rows and " + std::to_string(table.columns()) +
                                         " columns with counts");
    return detail::freeman_halton_p_value(table.counts(), limits);
}

}  // namespace assoc
