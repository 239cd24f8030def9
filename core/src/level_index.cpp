#include "level_index.hpp"

#include <numeric>

#include "ascii_case.hpp"
#include "cell_line.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"

namespace assoc::detail {

std::vector<std::uint32_t> LevelIndex::positions(LevelOrder order, const TextCollation& collation) const {
    std::vector<std::size_t> by_position(levels_.size());
    std::iota(by_position.begin(), by_position.end(), std::size_t{0});
    if (order == LevelOrder::sorted) by_position = sorted_order(levels_, collation);
    std::vector<std::uint32_t> position_of(levels_.size());
    for (std::size_t p = 0; p < by_position.size(); ++p) position_of[by_position[p]] = static_cast<std::uint32_t>(p);
    return position_of;
}

std::vector<Cell> LevelIndex::listed(LevelOrder order, const TextCollation& collation) const {
    const std::vector<std::uint32_t> position_of = positions(order, collation);
    std::vector<Cell> levels(levels_.size());
    for (std::size_t i = 0; i < levels_.size(); ++i) {
        const Cell& level = *levels_[i];
        // Normalise −0 to 0 so the table never shows "-0" as a label.
        levels[position_of[i]] = level.is_number() ? Cell::number(level.as_number() + 0.0) : level;
    }
    return levels;
}

std::vector<std::string> LevelIndex::lookalike_remarks(const std::string& what) const {
    std::vector<std::string> remarks;

    // Texts that differ only in capitals: the first pair found is named, the rest counted.
    std::unordered_map<std::string, const std::string*> by_lower_case;
    std::size_t case_pairs = 0;
    std::string first_pair;
    for (const Cell* level : levels_) {
        if (!level->is_text()) continue;
        std::string lower = level->as_text();
        for (char& c : lower) c = ascii_lower(c);
        const auto [where, added] = by_lower_case.try_emplace(std::move(lower), &level->as_text());
        if (added) continue;
        if (case_pairs++ == 0) first_pair = "\"" + *where->second + "\" and \"" + level->as_text() + "\"";
    }
    if (case_pairs > 0) {
        std::string remark = "The " + what + " " + first_pair + " differ only in capitals and are counted apart";
        if (case_pairs > 1)
            remark += "; so are " + format_count(static_cast<double>(case_pairs - 1)) +
                      (case_pairs == 2 ? " other label" : " other labels") + " that differ from another only in capitals";
        remarks.push_back(remark + ".");
    }

    // A text that reads like one of the numbers, e.g. "5" typed as text next to the number 5.
    for (const Cell* level : levels_) {
        if (!level->is_number()) continue;
        const std::string text = level_text(*level);
        if (texts_.count(std::string_view(text)) > 0) {
            remarks.push_back("The " + what + " hold both the number " + text + " and the text \"" + text +
                              "\"; they are counted apart.");
            break;
        }
    }
    return remarks;
}

void throw_unusable_label(const Cell& cell, std::size_t position, std::size_t length, const std::string& what) {
    throw Error("label " + format_count(static_cast<double>(position)) + " of " + format_count(static_cast<double>(length)) +
                " in the " + what + " holds " + cell.describe() + "; labels must be texts or ordinary numbers");
}

CodedLevels::CodedLevels(const CodedLabels& labels, const char* what)
    : labels_(labels), what_(what), level_of_(labels.spellings.size(), unassigned) {
    require_single_line(labels.rows, labels.columns, what);
    require(labels.codes.size() == labels.rows * labels.columns, "the labels are not coded consistently");
}

std::uint32_t CodedLevels::first_use(std::uint32_t code, std::size_t record) {
    const Cell& spelling = labels_.spellings[code];
    if (is_blank_label(spelling)) return skipped;
    require_usable_label(spelling, record + 1, records(), what_);
    return index_.intern(spelling);
}

}  // namespace assoc::detail
