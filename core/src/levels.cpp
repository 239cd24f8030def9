#include "assoc/levels.hpp"

#include <cstdio>

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

LevelList level_list(const CodedLabels& labels, const LevelOrdering& order) {
    detail::CodedLevels levels(labels, "labels");
    const detail::RecordSpan span = detail::record_span({&labels});
    for (std::size_t i = span.first; i < span.end; ++i) levels.level(i);
    require(levels.index().size() > 0, "the labels are all blank");
    LevelList list;
    list.remarks = span.remarks;
    const std::string unused = levels.index().add_listed(order, "labels");
    if (!unused.empty()) list.remarks.push_back(unused);
    for (std::string& remark : levels.index().lookalike_remarks("labels")) list.remarks.push_back(std::move(remark));
    list.levels = levels.index().listed(order);
    return list;
}

std::vector<Cell> distinct_levels(const CodedLabels& labels, const LevelOrdering& order) {
    return level_list(labels, order).levels;
}

std::vector<Cell> distinct_levels(const CellGrid& labels, const LevelOrdering& order) {
    return distinct_levels(code_labels(labels), order);
}

}  // namespace assoc
