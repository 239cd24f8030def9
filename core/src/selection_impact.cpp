#include "assoc/selection_impact.hpp"

#include <cmath>

#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "cell_line.hpp"

namespace assoc {
namespace {

std::string group_name(std::size_t i) { return "group " + std::to_string(i + 1); }

}  // namespace

std::string impact_flag(double threshold) {
    if (threshold == 0.8) return "below four-fifths of the highest rate";
    return "below " + format_number(100 * threshold, 6) + "% of the highest rate";
}

std::string selection_impact_caution() {
    return "An impact ratio below the threshold calls for a closer look; it is not proof of discrimination. "
           "With small groups a low ratio can arise by chance, and a ratio above the threshold does not rule out "
           "adverse impact. Check whether the difference is statistically significant, and follow local law, "
           "policy and qualified advice.";
}

SelectionImpact selection_impact(const std::vector<double>& selected, const std::vector<double>& considered,
                                 double threshold) {
    require(std::isfinite(threshold) && threshold > 0 && threshold <= 1,
            "the threshold must be above 0 and at most 1 (0.8 for four-fifths), not " + format_number(threshold));
    require(selected.size() == considered.size(),
            "there are " + std::to_string(selected.size()) + " selected counts and " + std::to_string(considered.size()) +
                " considered counts; give both for every group");
    require(selected.size() >= 2, "comparing selection rates needs at least 2 groups");

    SelectionImpact result;
    result.threshold = threshold;
    for (std::size_t i = 0; i < selected.size(); ++i) {
        const double chosen = selected[i], pool = considered[i];
        // Messages are built only on failure: there may be many groups.
        if (!(std::isfinite(chosen) && chosen >= 0 && std::isfinite(pool) && pool >= 0))
            throw Error(group_name(i) + " has " + format_number(chosen, 15) + " selected of " +
                        format_number(pool, 15) + " considered; both must be numbers of 0 or more");
        if (pool == 0) throw Error(group_name(i) + " has 0 people considered, so it has no selection rate; leave it out");
        if (chosen > pool)
            throw Error(group_name(i) + " has more selected (" + format_number(chosen, 15) + ") than considered (" +
                        format_number(pool, 15) + ")");
        GroupImpact group;
        group.selection_rate = chosen / pool;
        if (group.selection_rate > result.highest_rate) {
            result.highest_rate = group.selection_rate;
            result.highest_group = i;
        }
        result.groups.push_back(group);
    }
    require(result.highest_rate > 0, "no one was selected in any group, so there is no highest rate to compare with");

    for (GroupImpact& group : result.groups) {
        group.impact_ratio = group.selection_rate / result.highest_rate;
        group.below_threshold = group.impact_ratio < threshold * (1 - 1e-12);
        if (group.below_threshold) group.flag = impact_flag(threshold);
    }
    return result;
}

SelectionImpact selection_impact(const CellGrid& selected, const CellGrid& considered, double threshold) {
    // `what` names the range ("selected counts"), `each` one of its cells ("selected count").
    const auto numbers = [](const CellGrid& grid, const std::string& what, const std::string& each) {
        const detail::CellLine line(grid, what);
        std::vector<double> values;
        for (std::size_t i = 0; i < line.size(); ++i) {
            const Cell& cell = line[i];
            if (!cell.is_number())
                throw Error("the " + each + " of " + group_name(i) + " is " +
                            (cell.is_blank() ? std::string("blank") : cell.describe()) + "; give a number of 0 or more");
            values.push_back(cell.as_number());
        }
        return values;
    };
    return selection_impact(numbers(selected, "selected counts", "selected count"),
                            numbers(considered, "considered counts", "considered count"), threshold);
}

}  // namespace assoc
