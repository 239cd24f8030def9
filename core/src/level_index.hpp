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
#include "assoc/levels.hpp"

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

    // For each index, the level's position when the levels are listed in `order`.
    std::vector<std::uint32_t> positions(LevelOrder order) const;
    // The levels, listed in `order`.
    std::vector<Cell> listed(LevelOrder order) const;
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

}  // namespace assoc::detail
