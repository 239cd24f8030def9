#include "assoc/expected_counts.hpp"

#include "exact_margins.hpp"

namespace assoc {

Matrix expected_counts(const CountTable& table) {
    const detail::TableMargins margins = detail::table_margins(table);
    Matrix expected(table.rows(), table.columns());
    for (std::size_t r = 0; r < table.rows(); ++r)
        for (std::size_t c = 0; c < table.columns(); ++c) expected(r, c) = margins.expected(r, c);
    return expected;
}

Matrix deviations_from_expected(const CountTable& table) {
    const detail::TableMargins margins = detail::table_margins(table);
    Matrix deviations(table.rows(), table.columns());
    for (std::size_t r = 0; r < table.rows(); ++r)
        for (std::size_t c = 0; c < table.columns(); ++c)
            // The difference is formed exactly (or to about 2^-104); one rounding of it and one
            // division leave O − E accurate to about 1.5 ulp.
            deviations(r, c) = margins.deviation(table.count(r, c), r, c);
    return deviations;
}

}  // namespace assoc
