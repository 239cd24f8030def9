#include "assoc/expected_counts.hpp"

#include "extended_arithmetic.hpp"

namespace assoc {

Matrix expected_counts(const CountTable& table) {
    Matrix expected(table.rows(), table.columns());
    for (std::size_t r = 0; r < table.rows(); ++r)
        for (std::size_t c = 0; c < table.columns(); ++c)
            expected(r, c) = table.row_total(r) * table.column_total(c) / table.total();
    return expected;
}

Matrix deviations_from_expected(const CountTable& table) {
    using namespace detail;
    const double n = table.total();
    Matrix deviations(table.rows(), table.columns());
    for (std::size_t r = 0; r < table.rows(); ++r)
        for (std::size_t c = 0; c < table.columns(); ++c) {
            const DoubleDouble scaled = exact_product(table.count(r, c), n) -
                                        exact_product(table.row_total(r), table.column_total(c));
            deviations(r, c) = scaled.hi / n + scaled.lo / n;
        }
    return deviations;
}

}  // namespace assoc
