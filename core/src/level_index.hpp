#pragma once
// Interning of labels: each distinct label gets a small index in one hash lookup, so that
// counting a million records costs the same whether they hold 4 levels or 4,000.
// Texts are keyed by a view into the cell that holds them: no string is copied per record.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <limits>
#include <string>
#include <string_view>
#include <unordered_map>
#include <utility>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/coded_labels.hpp"
#include "assoc/error.hpp"
#include "assoc/levels.hpp"
#include "assoc/wording.hpp"
#include "assoc/text_collation.hpp"

namespace assoc::detail {

// A blank cell, or a text of no characters or only spaces, is no label: its record is skipped.
inline bool is_blank_label(const Cell& cell) {
    return cell.is_blank() || (cell.is_text() && trimmed_label(cell.as_text()).empty());
}

class LevelIndex {
public:
    static constexpr std::uint32_t none = std::numeric_limits<std::uint32_t>::max();

    // The index of `label` (a finite number or a text that is not only spaces), adding it when it is
    // new. Texts are keyed without the spaces at their ends, so "No" and "No " are one level (shown
    // as "No"). The cell must outlive the index: texts are keyed by views into it.
    std::uint32_t intern(const Cell& label) {
        const auto next = static_cast<std::uint32_t>(levels_.size());
        if (label.is_text()) {
            const std::string_view key = trimmed_label(label.as_text());
            const auto [where, added] = texts_.try_emplace(key, next);
            if (added) add(label, key.size() == label.as_text().size() ? label : Cell::text(std::string(key)));
            else if (label.as_text() != spelled_[where->second]->as_text()) note_spaces(where->second, label);
            return where->second;
        }
        // + 0.0 turns −0 into +0, so both land on one level.
        const auto [where, added] = numbers_.try_emplace(label.as_number() + 0.0, next);
        if (added) add(label, Cell::number(label.as_number() + 0.0));
        return where->second;
    }
    // The index of the level `label` would be, or `none`.
    std::uint32_t find(const Cell& label) const;

    std::size_t size() const { return levels_.size(); }

    // Whether any level is among the labels of a listed order.
    bool any_listed(const LevelOrdering& order) const;
    // For a listed order: refuses the levels the list lacks (an Error naming them), then adds the listed
    // labels that no record holds as levels of their own. Returns a sentence naming those (or "").
    // `order` must outlive the index. `what` is e.g. "row labels".
    std::string add_listed(const LevelOrdering& order, const std::string& what);

    // For each index, the level's position when the levels are listed in `order` (texts in the
    // order of `collation` when sorted).
    std::vector<std::uint32_t> positions(const LevelOrdering& order, const TextCollation& collation) const;
    // The levels, listed in `order`.
    std::vector<Cell> listed(const LevelOrdering& order, const TextCollation& collation) const;
    // Sentences about labels that look alike: texts merged because they differ only by spaces at
    // their ends, texts that differ only in capitals (counted apart), and a text that reads like one
    // of the numbers. `what` is e.g. "row labels".
    std::vector<std::string> lookalike_remarks(const std::string& what) const;

private:
    void add(const Cell& spelling, Cell level) {
        spelled_.push_back(&spelling);
        levels_.push_back(std::move(level));
    }
    void note_spaces(std::uint32_t level, const Cell& spelling) {
        if (space_merges_++ == 0) first_space_merge_ = {spelled_[level]->as_text(), spelling.as_text()};
    }

    std::unordered_map<std::string_view, std::uint32_t> texts_;
    std::unordered_map<double, std::uint32_t> numbers_;
    std::vector<Cell> levels_;           // trimmed, in order of first appearance
    std::vector<const Cell*> spelled_;   // each level's first spelling
    std::size_t space_merges_ = 0;       // spellings merged with another that differs only by end spaces
    std::pair<std::string, std::string> first_space_merge_;
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
    LevelIndex& index() { return index_; }

private:
    static constexpr std::uint32_t unassigned = CodedLabels::blank - 1;
    std::uint32_t first_use(std::uint32_t code, std::size_t record);

    const CodedLabels& labels_;
    const char* what_;
    std::vector<std::uint32_t> level_of_;  // per spelling: its level, skipped, or unassigned
    LevelIndex index_;
};

}  // namespace assoc::detail
