#include "assoc/levels.hpp"

#include <algorithm>
#include <cstdio>
#include <string_view>

#include "ascii_case.hpp"
#include "assoc/error.hpp"
#include "assoc/wording.hpp"
#include "cell_line.hpp"
#include "level_index.hpp"
#include "record_span.hpp"

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

LevelOrdering LevelOrdering::from_range(const CellGrid& labels) {
    detail::require_single_line(labels.rows(), labels.columns(), "order");
    LevelOrdering ordering(LevelOrder::listed);
    detail::LevelIndex seen;
    for (std::size_t r = 0; r < labels.rows(); ++r)
        for (std::size_t c = 0; c < labels.columns(); ++c) {
            const Cell& cell = labels.at(r, c);
            if (detail::is_blank_label(cell)) continue;
            detail::require_usable_label(cell, r + c + 1, labels.rows() * labels.columns(), "order");
            const Cell label = cell.is_text() ? Cell::text(std::string(trimmed_label(cell.as_text()))) : cell;
            require(seen.find(label) == detail::LevelIndex::none,
                    "the order lists " + (label.is_text() ? quoted_label(label.as_text()) : level_text(label)) +
                        " twice; list each label once, in the wanted order");
            seen.intern(cell);
            ordering.listed.push_back(label);
        }
    require(!ordering.listed.empty(), "the range of the order holds no labels");
    return ordering;
}

LevelList level_list(const CodedLabels& labels, const LevelOrdering& order, const TextCollation& collation) {
    detail::CodedLevels levels(labels, "labels");
    const detail::RecordSpan span = detail::record_span({&labels});
    for (std::size_t i = span.first; i < span.end; ++i) levels.level(i);
    require(levels.index().size() > 0, "the labels are all blank");
    LevelList list;
    list.remarks = span.remarks;
    const std::string unused = levels.index().add_listed(order, "labels");
    if (!unused.empty()) list.remarks.push_back(unused);
    for (std::string& remark : levels.index().lookalike_remarks("labels")) list.remarks.push_back(std::move(remark));
    list.levels = levels.index().listed(order, collation);
    return list;
}

std::vector<Cell> distinct_levels(const CodedLabels& labels, const LevelOrdering& order, const TextCollation& collation) {
    return level_list(labels, order, collation).levels;
}

std::vector<Cell> distinct_levels(const CellGrid& labels, const LevelOrdering& order, const TextCollation& collation) {
    return distinct_levels(code_labels(labels), order, collation);
}

}  // namespace assoc
