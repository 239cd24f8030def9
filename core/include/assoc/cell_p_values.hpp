#pragma once
// Which cells depart from independence: a test of each cell's adjusted residual.
#include "assoc/count_table.hpp"
#include "assoc/matrix.hpp"
#include "assoc/p_value_adjustment.hpp"

namespace assoc {

// For each kept cell (the shape of table.counts()), the two-sided p-value 2·P(Z ≥ |z|) of its
// adjusted residual z, which is standard normal under independence (Haberman 1973), adjusted
// across all kept cells by `adjustment`. Computed as erfc(|z|/√2), accurate for tiny p-values.
// Cells of set-aside rows and columns are not tested and do not count towards the adjustment;
// table.to_body_shape() spreads the result back to the range's shape.
Matrix cell_p_values(const CountTable& table, PAdjustment adjustment = PAdjustment::holm);

}  // namespace assoc
