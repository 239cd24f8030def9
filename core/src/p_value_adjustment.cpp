#include "assoc/p_value_adjustment.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>

#include "argument_checks.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"

namespace assoc {

PAdjustment p_adjustment_from_word(const std::string& word) {
    const std::string normalized = detail::normalized_word(word);
    if (normalized == "holm") return PAdjustment::holm;
    if (normalized == "bonferroni") return PAdjustment::bonferroni;
    if (normalized == "none") return PAdjustment::none;
    throw Error("the adjustment must be \"holm\", \"bonferroni\" or \"none\", not \"" + word + "\"");
}

std::vector<double> adjust_p_values(const std::vector<double>& p_values, PAdjustment adjustment) {
    for (double p : p_values)
        require(p >= 0 && p <= 1, "a p-value must lie between 0 and 1, not " + format_number(p));
    const double m = static_cast<double>(p_values.size());
    std::vector<double> adjusted(p_values);
    switch (adjustment) {
    case PAdjustment::none: break;
    case PAdjustment::bonferroni:
        for (double& p : adjusted) p = std::min(1.0, m * p);
        break;
    case PAdjustment::holm: {
        std::vector<std::size_t> order(p_values.size());
        std::iota(order.begin(), order.end(), 0);
        // A stable sort keeps tied p-values in their given order, so the result does not
        // depend on the sorting routine.
        std::stable_sort(order.begin(), order.end(),
                         [&](std::size_t i, std::size_t j) { return p_values[i] < p_values[j]; });
        double running_max = 0.0;
        for (std::size_t rank = 0; rank < order.size(); ++rank) {
            const double factor = m - static_cast<double>(rank);
            running_max = std::max(running_max, std::min(1.0, factor * p_values[order[rank]]));
            adjusted[order[rank]] = running_max;
        }
        break;
    }
    }
    return adjusted;
}

}  // namespace assoc
