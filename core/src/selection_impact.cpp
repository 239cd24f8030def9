#include "assoc/selection_impact.hpp"

#include <algorithm>
#include <cmath>
#include <cstring>
#include <iterator>
#include <optional>

#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/wording.hpp"
#include "cell_line.hpp"

namespace assoc {
namespace {

// A group's two counts; nullopt for a group whose cells are both blank (no counts given).
struct GroupCounts {
    std::optional<double> selected, considered;
    std::string name;  // for messages: "group 2", "the group in row 3"
};

SelectionImpact impact_of(const std::vector<GroupCounts>& groups, double threshold) {
    require(std::isfinite(threshold) && threshold > 0 && threshold <= 1,
            "the threshold must be above 0 and at most 1 (0.8 for four-fifths), not " + format_number(threshold));
    SelectionImpact result;
    result.threshold = threshold;
    std::size_t with_rate = 0;
    for (std::size_t i = 0; i < groups.size(); ++i) {
        const GroupCounts& counts = groups[i];
        GroupImpact group;
        if (!counts.selected || !counts.considered) {
            group.has_rate = false;
            group.flag = "no counts: no selection rate";
            result.groups.push_back(group);
            continue;
        }
        const double chosen = *counts.selected, pool = *counts.considered;
        // Messages are built only on failure: there may be many groups.
        if (!(std::isfinite(chosen) && chosen >= 0 && std::isfinite(pool) && pool >= 0))
            throw Error(counts.name + " has " + format_number(chosen, 15) + " selected of " + format_number(pool, 15) +
                        " considered; both must be numbers of 0 or more");
        if (chosen != std::floor(chosen) || pool != std::floor(pool))
            throw Error(counts.name + " has " + format_number(chosen, 15) + " selected of " + format_number(pool, 15) +
                        " considered; both are numbers of people and must be whole: a rate or a percentage (0.15, "
                        "15%) goes in neither range, give the number selected and the number considered");
        if (chosen > pool) {
            const bool all_above = std::all_of(groups.begin(), groups.end(), [](const GroupCounts& g) {
                return !g.selected || !g.considered || *g.selected > *g.considered;
            });
            throw Error(counts.name + " has more selected (" + format_number(chosen, 15) + ") than considered (" +
                        format_number(pool, 15) + ")" +
                        (all_above ? std::string("; every group does, so the ranges may be the wrong way round: the "
                                                 "selected counts come first, then the considered")
                                   : std::string()));
        }
        if (pool == 0) {
            group.has_rate = false;
            group.flag = "no one considered: no selection rate";
            result.groups.push_back(group);
            continue;
        }
        ++with_rate;
        group.selection_rate = chosen / pool;
        if (group.selection_rate > result.highest_rate) {
            result.highest_rate = group.selection_rate;
            result.highest_group = i;
        }
        result.groups.push_back(group);
    }
    std::vector<std::string> empty;
    for (std::size_t i = 0; i < groups.size(); ++i)
        if (!result.groups[i].has_rate) empty.push_back(groups[i].name);
    if (!empty.empty())
        result.remarks.push_back("No one is considered in " + name_list(empty) + ", so " +
                                 (empty.size() == 1 ? "its row of the result is" : "their rows of the result are") +
                                 " left empty (no selection rate); the other groups were compared.");
    require(with_rate >= 2, "comparing selection rates needs at least 2 groups with people considered; " +
                                std::string(with_rate == 1 ? "only 1 group has" : "no group has") + " any");
    require(result.highest_rate > 0, "no one was selected in any group, so there is no highest rate to compare with");

    for (GroupImpact& group : result.groups) {
        if (!group.has_rate) continue;
        group.impact_ratio = group.selection_rate / result.highest_rate;
        group.below_threshold = group.impact_ratio < threshold * (1 - 1e-12);
        if (group.below_threshold) group.flag = impact_flag(threshold);
    }
    return result;
}

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
    require(selected.size() == considered.size(),
            "there are " + std::to_string(selected.size()) + " selected counts and " + std::to_string(considered.size()) +
                " considered counts; give both for every group");
    std::vector<GroupCounts> groups;
    for (std::size_t i = 0; i < selected.size(); ++i) groups.push_back({selected[i], considered[i], group_name(i)});
    return impact_of(groups, threshold);
}

namespace {

// A total row among the groups (the company as a whole under its departments) is no group: it would be
// compared with its own parts. The first or last group that holds, in both ranges, the sums of at
// least 2 other groups with people considered is refused; the ranges carry no labels to set it aside by.
// A header over the considered counts that names the people not selected ("Not selected",
// "Rejected"): the rates would divide by the others instead of by everyone considered.
bool names_the_rest(const std::string& header) {
    static const char* const words[] = {"rejected", "declined",  "unsuccessful", "refused", "turned down", "others",
                                        "the rest", "remaining", "rest",         "abgelehnt", "rechazados", "rejetés",
                                        "rejetes",  "respinti",  "afgewezen"};
    const std::string text = folded_label(header);
    for (const char* start : {"not ", "non-", "non ", "nicht ", "no ", "niet "})
        if (text.compare(0, std::strlen(start), start) == 0) return true;
    return std::any_of(std::begin(words), std::end(words), [&](const char* w) { return text == w; });
}

void refuse_total_group(const std::vector<GroupCounts>& groups, const std::string& place, std::size_t first) {
    if (groups.size() < 3) return;
    for (std::size_t candidate : {groups.size() - 1, std::size_t{0}}) {
        const GroupCounts& total = groups[candidate];
        if (!total.selected || !total.considered || *total.considered <= 0) continue;
        double selected = 0, considered = 0;
        std::size_t others = 0;
        for (std::size_t i = 0; i < groups.size(); ++i) {
            if (i == candidate) continue;
            selected += groups[i].selected.value_or(0.0);
            considered += groups[i].considered.value_or(0.0);
            if (groups[i].considered.value_or(0.0) > 0) ++others;
        }
        if (others < 2 || *total.selected != selected || *total.considered != considered) continue;
        throw Error("the group in " + place + std::to_string(candidate + first + 1) + " holds the sums of the other groups (" +
                    format_number(*total.selected, 15) + " selected of " + format_number(*total.considered, 15) +
                    "), so it looks like a total, and a total is no group to compare with its own parts; leave it "
                    "out of the ranges");
    }
}

}  // namespace

SelectionImpact selection_impact(const CellGrid& selected, const CellGrid& considered, double threshold) {
    // Each range as given (its trailing blanks may have been left out): cells past those that arrived are blank.
    struct Line {
        const CellGrid& grid;
        bool along_row;
        std::size_t length;
        const Cell& operator[](std::size_t i) const {
            static const Cell blank;
            const std::size_t present = along_row ? grid.columns() : grid.rows();
            if (i >= present) return blank;
            return along_row ? grid.at(0, i) : grid.at(i, 0);
        }
    };
    const auto line_of = [](const CellGrid& grid, const std::string& what) {
        detail::require_single_line(grid.given_rows(), grid.given_columns(), what);
        const bool along_row = grid.given_rows() == 1 && grid.given_columns() > 1;
        return Line{grid, along_row, along_row ? grid.given_columns() : grid.given_rows()};
    };
    const Line chosen = line_of(selected, "selected counts"), pool = line_of(considered, "considered counts");
    require(chosen.length == pool.length, "there are " + std::to_string(chosen.length) + " selected counts and " +
                                              std::to_string(pool.length) +
                                              " considered counts; give both for every group");
    const std::string place = chosen.along_row ? "column " : "row ";

    // The groups end with the last cell that holds anything; a text header may come first.
    std::size_t end = chosen.length;
    while (end > 0 && chosen[end - 1].is_blank() && pool[end - 1].is_blank()) --end;
    std::size_t first = 0;
    if (end > 0 && (chosen[0].is_text() || pool[0].is_text()) && !chosen[0].is_number() && !pool[0].is_number())
        first = 1;

    std::vector<GroupCounts> groups;
    for (std::size_t i = first; i < end; ++i) {
        GroupCounts group;
        group.name = "the group in " + place + std::to_string(i + 1);
        const Cell& a = chosen[i];
        const Cell& b = pool[i];
        if (!(a.is_blank() && b.is_blank())) {
            // `what` names the count, `cell` holds it.
            const auto number = [&](const Cell& cell, const char* what) {
                if (cell.is_number()) return cell.as_number();
                throw Error("the " + std::string(what) + " count of " + group.name + " is " +
                            (cell.is_blank() ? std::string("blank") : cell.describe()) +
                            "; give a number of 0 or more (leave both cells blank for a group without counts)");
            };
            group.selected = number(a, "selected");
            group.considered = number(b, "considered");
        }
        groups.push_back(group);
    }
    require(!groups.empty(), "the ranges hold no counts");
    if (first == 1 && pool[0].is_text() && names_the_rest(pool[0].as_text()))
        throw Error("the considered counts are headed " + quoted_label(pool[0].as_text()) + ", which reads as the "
                    "people not selected; considered means everyone in the group, those selected and the others, so "
                    "give those numbers (the two counts added together)");
    refuse_total_group(groups, place, first);
    SelectionImpact result = impact_of(groups, threshold);
    if (first == 1)
        result.remarks.insert(result.remarks.begin(), std::string(chosen.along_row ? "Column" : "Row") +
                                                          " 1 holds text and was read as a header; the result has one "
                                                          "row per group below it.");
    return result;
}

}  // namespace assoc
