#include "assoc/cell_p_values.hpp"

#include <boost/math/special_functions/erf.hpp>
#include <cmath>

#include "assoc/error.hpp"
#include "assoc/residuals.hpp"
#include "boost_policy.hpp"

namespace assoc {

Matrix cell_p_values(const CountTable& table, PAdjustment adjustment) {
    require(table.rows() >= 2 && table.columns() >= 2,
            "testing cells needs at least 2 rows and 2 columns with counts");
    const Matrix z = residuals(table, ResidualKind::adjusted);
    std::vector<double> p_values(z.size());
    for (std::size_t i = 0; i < z.size(); ++i)
        // 2·P(Z ≥ |z|) = erfc(|z| / √2): the complement directly, never 1 − Φ.
        p_values[i] = boost::math::erfc(std::fabs(z.values()[i]) / std::sqrt(2.0), detail::Policy());
    const std::vector<double> adjusted = adjust_p_values(p_values, adjustment);
    Matrix result(z.rows(), z.columns());
    for (std::size_t r = 0; r < z.rows(); ++r)
        for (std::size_t c = 0; c < z.columns(); ++c) result(r, c) = adjusted[r * z.columns() + c];
    return result;
}

}  // namespace assoc
