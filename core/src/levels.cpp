#include "assoc/levels.hpp"

#include <algorithm>
#include <cstdio>
#include <string_view>

#include "ascii_case.hpp"
#include "assoc/error.hpp"
#include "level_index.hpp"

namespace assoc {

LevelOrder parse_level_order(const std::string& word) {
    if (word.empty() || detail::equals_ignoring_case(word, "sorted")) return LevelOrder::sorted;
    if (detail::equals_ignoring_case(word, "first")) return LevelOrder::first_seen;
    throw Error("the order must be \"sorted\" or \"first\", not \"" + word + "\"");
}

std::vector<std::size_t> sorted_order(const std::vector<const Cell*>& levels, const TextCollation& collation) {
    std::vector<std::size_t> order;
    std::vector<std::size_t> text_positions;
    std::vector<std::string_view> texts;
    for (std::size_t i = 0; i < levels.size(); ++i) {
        if (levels[i]->is_text()) {
            text_positions.push_back(i);
            texts.emplace_back(levels[i]->as_text());
        } else {
            order.push_back(i);
        }
    }
    std::sort(order.begin(), order.end(),
              [&](std::size_t a, std::size_t b) { return levels[a]->as_number() < levels[b]->as_number(); });
    for (std::size_t t : collated_order(texts, collation)) order.push_back(text_positions[t]);
    return order;
}

std::string level_text(const Cell& level) {
    if (level.is_text()) return level.as_text();
    if (level.is_blank()) return "";
    char buffer[32];
    std::snprintf(buffer, sizeof buffer, "%.15g", level.as_number() + 0.0);
    return buffer;
}

std::vector<Cell> distinct_levels(const CodedLabels& labels, LevelOrder order, const TextCollation& collation) {
    detail::CodedLevels levels(labels, "labels");
    for (std::size_t i = 0; i < levels.records(); ++i) levels.level(i);
    require(levels.index().size() > 0, "the labels are all blank");
    return levels.index().listed(order, collation);
}

std::vector<Cell> distinct_levels(const CellGrid& labels, LevelOrder order, const TextCollation& collation) {
    return distinct_levels(code_labels(labels), order, collation);
}

}  // namespace assoc
