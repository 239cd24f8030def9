#pragma once
// Expected counts under independence, E = row total × column total / grand total,
// and the deviations O − E computed without cancellation.
#include "assoc/count_table.hpp"
#include "assoc/matrix.hpp"

namespace assoc {

// E for each kept cell (the shape of table.counts()).
Matrix expected_counts(const CountTable& table);

// O − E for each kept cell, formed as (O·n − R·C)/n in double-double arithmetic, with the
// totals summed in double-double too: with counts near 1e8 the naive O − R·C/n keeps only
// half of its digits. Exactly 0 for a cell exactly at independence (whole counts, total below 2^53).
Matrix deviations_from_expected(const CountTable& table);

}  // namespace assoc
