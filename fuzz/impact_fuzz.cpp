// Fuzz target: selection rates and impact ratios (the four-fifths rule) from cells.
// Input: section 1, the selected counts; section 2, the counts considered; section 3 may give the
// threshold.
// Checks: only assoc::Error leaves the core; rates and ratios in [0, 1]; the highest group has ratio
// 1; a group is flagged exactly when its ratio is below the threshold, with a flag in Assoc's words;
// a group without a rate says why.
#include <cmath>

#include "assoc/selection_impact.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& selected = section(sections, 0);
    const CellGrid& considered = section(sections, 1);
    const double threshold = number_at(section(sections, 2), 0, 0.8);
    attempt("selection_impact", [&] {
        const SelectionImpact result = selection_impact(selected, considered, threshold);
        if (result.groups.size() < 2) finding("impact ratios for fewer than 2 groups");
        if (result.highest_group >= result.groups.size()) finding("the highest group is not a group");
        check_probability(result.highest_rate, "highest rate");
        for (const GroupImpact& group : result.groups) {
            // A group without a rate (nobody considered) has a flag that says why, and nothing else.
            if (!group.has_rate) {
                if (group.below_threshold || group.flag.empty()) finding("a group without a rate is flagged wrongly");
                check_message(group.flag, "flag of a group without a rate");
                continue;
            }
            check_probability(group.selection_rate, "selection rate");
            check_between(group.impact_ratio, 0, 1 + 1e-12, "impact ratio");
            if (group.selection_rate > result.highest_rate) finding("a group's rate is above the highest rate");
            // A ratio at the threshold but for rounding is not flagged (the core allows 1e-12).
            if (group.below_threshold ? group.impact_ratio >= threshold : group.impact_ratio < threshold * (1 - 1e-9))
                finding("the flag does not follow the threshold");
            if (group.below_threshold == group.flag.empty()) finding("a flag without a ratio below the threshold, or none with one");
            if (!group.flag.empty()) check_message(group.flag, "impact flag");
        }
        if (result.groups[result.highest_group].impact_ratio != 1) finding("the highest group's ratio is not 1");
        for (const std::string& remark : result.remarks) check_message(remark, "impact remark");
    });
    return 0;
}
