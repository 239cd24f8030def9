#include "assoc/levels.hpp"

#include <cstdio>

#include "ascii_case.hpp"
#include "assoc/error.hpp"
#include "level_index.hpp"

namespace assoc {

LevelOrder parse_level_order(const std::string& word) {
    if (word.empty() || detail::equals_ignoring_case(word, "sorted")) return LevelOrder::sorted;
    if (detail::equals_ignoring_case(word, "first")) return LevelOrder::first_seen;
    throw Error("the order must be \"sorted\" or \"first\", not \"" + word + "\"");
}

bool level_before(const Cell& a, const Cell& b) {
    if (a.is_number() != b.is_number()) return a.is_number();
    if (a.is_number()) return a.as_number() < b.as_number();
    const int folded = detail::compare_ignoring_case(a.as_text(), b.as_text());
    if (folded != 0) return folded < 0;
    return a.as_text() < b.as_text();
}

std::string level_text(const Cell& level) {
    if (level.is_text()) return level.as_text();
    if (level.is_blank()) return "";
    char buffer[32];
    std::snprintf(buffer, sizeof buffer, "%.15g", level.as_number() + 0.0);
    return buffer;
}

std::vector<Cell> distinct_levels(const CodedLabels& labels, LevelOrder order) {
    detail::CodedLevels levels(labels, "labels");
    for (std::size_t i = 0; i < levels.records(); ++i) levels.level(i);
    require(levels.index().size() > 0, "the labels are all blank");
    return levels.index().listed(order);
}

std::vector<Cell> distinct_levels(const CellGrid& labels, LevelOrder order) {
    return distinct_levels(code_labels(labels), order);
}

}  // namespace assoc
