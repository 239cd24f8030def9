// Fisher's exact test for 2×2 tables, at a cost that does not grow with the counts (the method is
// described in discrete_tail.hpp).
//
// With both margins fixed, the top-left count x is hypergeometric:
//     P(x) = r1! r2! c1! c2! / (n! a! b! c! d!),   a = x, b = r1 − x, c = c1 − x, d = r2 − c1 + x,
// with expected counts E = row total × column total / n and a − E_a = (x·n − r1·c1)/n.
#include "fisher_two_by_two.hpp"

#include <algorithm>

#include "discrete_tail.hpp"
#include "stirling.hpp"

namespace assoc::detail {

double fisher_two_by_two_p_value(double a, double b, double c, double d, Side side, const ExactLimits& limits) {
    const double row1 = a + b, row2 = c + d, column1 = a + c, column2 = b + d, total = row1 + row2;
    const DiscreteTail<4> h({0.0, row1, column1, row2 - column1}, {+1, -1, -1, +1},
                            {row1 * column1 / total, row1 * column2 / total, row2 * column1 / total, row2 * column2 / total},
                            row1, column1, total,
                            stirling_part(row1) + stirling_part(row2) + stirling_part(column1) + stirling_part(column2) -
                                stirling_part(total),
                            std::max(0.0, column1 - row2), std::min(row1, column1));
    if (h.low() == h.high()) return 1.0;  // one table has these margins
    const Deadline deadline(limits);
    switch (side) {
    case Side::lower: return h.lower(a, deadline);
    case Side::upper: return h.upper(a, deadline);
    case Side::two_sided: break;
    }
    return h.two_sided(a, exact_tie_tolerance, deadline);
}

}  // namespace assoc::detail
