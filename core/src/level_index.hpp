#pragma once
// Interning of labels: each distinct label gets a small index in one hash lookup, so that
// counting a million records costs the same whether they hold 4 levels or 4,000.
// Texts are keyed by a view into the cell that holds them: no string is copied per record.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <string>
#include <string_view>
#include <unordered_map>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/coded_labels.hpp"
#include "assoc/error.hpp"
#include "assoc/levels.hpp"
#include "assoc/text_collation.hpp"

namespace assoc::detail {

// A blank cell, or a text of no characters, is no label: its record is skipped.
inline bool is_blank_label(const Cell& cell) {
    return cell.is_blank() || (cell.is_text() && cell.as_text().empty());
}

class LevelIndex {
public:
    // The index of `label` (a finite number or a non-empty text), adding it when it is new.
    // The cell must outlive the index: texts are keyed by views into it.
    std::uint32_t intern(const Cell& label) {
        const auto next = static_cast<std::uint32_t>(levels_.size());
        if (label.is_text()) {
            const auto [where, added] = texts_.try_emplace(std::string_view(label.as_text()), next);
            if (added) levels_.push_back(&label);
            return where->second;
        }
        // + 0.0 turns −0 into +0, so both land on one level.
        const auto [where, added] = numbers_.try_emplace(label.as_number() + 0.0, next);
        if (added) levels_.push_back(&label);
        return where->second;
    }

    std::size_t size() const { return levels_.size(); }

    // For each index, the level's position when the levels are listed in `order` (texts in the
    // order of `collation` when sorted).
    std::vector<std::uint32_t> positions(LevelOrder order, const TextCollation& collation) const;
    // The levels, listed in `order`.
    std::vector<Cell> listed(LevelOrder order, const TextCollation& collation) const;
    // Sentences about labels that look alike but are counted apart: texts that differ only in
    // capitals, and a text that reads like one of the numbers. `what` is e.g. "row labels".
    std::vector<std::string> lookalike_remarks(const std::string& what) const;

private:
    std::unordered_map<std::string_view, std::uint32_t> texts_;
    std::unordered_map<double, std::uint32_t> numbers_;
    std::vector<const Cell*> levels_;  // in order of first appearance
};

// Throws the Error for a label that is an infinite or not-a-number value.
[[noreturn]] void throw_unusable_label(const Cell& cell, std::size_t position, std::size_t length,
                                       const std::string& what);

// Throws Error unless `cell` can be a label: a blank, a text or a finite number.
// `position` is 1-based, `what` names the range ("row labels"). Inline: it runs once per record.
inline void require_usable_label(const Cell& cell, std::size_t position, std::size_t length, const char* what) {
    if (cell.is_number() && !std::isfinite(cell.as_number())) throw_unusable_label(cell, position, length, what);
}

// The levels of a single row or column of coded labels, record by record. A spelling becomes a
// level the first time a record uses it (one hash lookup per spelling, an array lookup per record),
// so levels are numbered in order of first appearance, and two spellings of one level merge.
class CodedLevels {
public:
    static constexpr std::uint32_t skipped = CodedLabels::blank;

    // `what` names the range in messages, e.g. "row labels". Checks the shape of the range.
    CodedLevels(const CodedLabels& labels, const char* what);

    std::size_t records() const { return labels_.codes.size(); }
    // The level of record `i` (0-based), or `skipped` when its label is blank. Throws Error for a
    // label that cannot be one (an infinite number). Inline: it runs once per record.
    std::uint32_t level(std::size_t i) {
        const std::uint32_t code = labels_.codes[i];
        if (code == CodedLabels::blank) return skipped;
        require(code < level_of_.size(), "the labels are not coded consistently");
        std::uint32_t& level = level_of_[code];
        if (level == unassigned) level = first_use(code, i);
        return level;
    }
    const LevelIndex& index() const { return index_; }

private:
    static constexpr std::uint32_t unassigned = CodedLabels::blank - 1;
    std::uint32_t first_use(std::uint32_t code, std::size_t record);

    const CodedLabels& labels_;
    const char* what_;
    std::vector<std::uint32_t> level_of_;  // per spelling: its level, skipped, or unassigned
    LevelIndex index_;
};

}  // namespace assoc::detail
