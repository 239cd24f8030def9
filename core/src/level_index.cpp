#include "level_index.hpp"

#include <algorithm>
#include <numeric>
#include <unordered_map>

#include "ascii_case.hpp"
#include "cell_line.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/wording.hpp"
#include "total_lines.hpp"

namespace assoc::detail {

std::uint32_t LevelIndex::find(const Cell& label) const {
    if (label.is_text()) {
        const auto where = texts_.find(trimmed_label(label.as_text()));
        return where == texts_.end() ? none : where->second;
    }
    const auto where = numbers_.find(label.as_number() + 0.0);
    return where == numbers_.end() ? none : where->second;
}

bool LevelIndex::any_listed(const LevelOrdering& order) const {
    for (const Cell& label : order.listed)
        if (find(label) != none) return true;
    return false;
}

std::string LevelIndex::add_listed(const LevelOrdering& order, const std::string& what) {
    if (order.order != LevelOrder::listed) return "";
    LevelIndex list;
    for (const Cell& label : order.listed) list.intern(label);
    std::vector<std::string> missing, hints;
    for (std::size_t i = 0; i < levels_.size(); ++i) {
        if (list.find(levels_[i]) != none) continue;
        missing.push_back(levels_[i].is_text() ? quoted_label(levels_[i].as_text()) : level_text(levels_[i]));
        if (levels_[i].is_text() && hints.empty())
            for (const Cell& listed : order.listed)
                if (listed.is_text() && folded_label(listed.as_text()) == folded_label(levels_[i].as_text()))
                    hints.push_back(" (the order has " + quoted_label(listed.as_text()) + ", which differs in capitals)");
    }
    if (!missing.empty())
        throw Error("the order lists " + format_count(static_cast<double>(order.listed.size())) + " labels but not " +
                    name_list(missing) + (hints.empty() ? "" : hints.front()) + ", found in the " + what +
                    "; list every label in the order's range");
    std::vector<std::string> unused;
    for (const Cell& label : order.listed)
        if (find(label) == none) {
            intern(label);
            unused.push_back(label.is_text() ? quoted_label(label.as_text()) : level_text(label));
        }
    if (unused.empty()) return "";
    return "The order lists " + name_list(unused) + ", which no record of the " + what + " holds; " +
           (unused.size() == 1 ? "its line holds" : "their lines hold") + " zeros.";
}

std::vector<std::uint32_t> LevelIndex::positions(const LevelOrdering& order, const TextCollation& collation) const {
    std::vector<std::size_t> by_position(levels_.size());
    std::iota(by_position.begin(), by_position.end(), std::size_t{0});
    if (order.order == LevelOrder::sorted) {
        std::vector<const Cell*> levels;
        for (const Cell& level : levels_) levels.push_back(&level);
        by_position = sorted_order(levels, collation);
    }
    std::vector<std::uint32_t> position_of(levels_.size());
    if (order.order == LevelOrder::listed) {
        // add_listed made the levels and the list the same set.
        for (std::size_t p = 0; p < order.listed.size(); ++p) {
            const std::uint32_t level = find(order.listed[p]);
            require(level != none && order.listed.size() == levels_.size(), "the order does not match the labels");
            position_of[level] = static_cast<std::uint32_t>(p);
        }
        return position_of;
    }
    for (std::size_t p = 0; p < by_position.size(); ++p) position_of[by_position[p]] = static_cast<std::uint32_t>(p);
    return position_of;
}

std::vector<Cell> LevelIndex::listed(const LevelOrdering& order, const TextCollation& collation) const {
    const std::vector<std::uint32_t> position_of = positions(order, collation);
    std::vector<Cell> levels(levels_.size());
    for (std::size_t i = 0; i < levels_.size(); ++i) levels[position_of[i]] = levels_[i];
    return levels;
}

std::vector<std::string> LevelIndex::lookalike_remarks(const std::string& what) const {
    std::vector<std::string> remarks;

    // Texts merged because they differ only by spaces at their ends.
    if (space_merges_ > 0) {
        // The spaces are what the reader must see, so both spellings are shown as typed (when short).
        const auto as_typed = [](const std::string& typed) {
            return typed.size() <= 40 ? "\"" + typed + "\"" : quoted_label(typed);
        };
        std::string remark = "The " + what + " " + as_typed(first_space_merge_.first) + " and " +
                             as_typed(first_space_merge_.second) +
                             " differ only by spaces at the start or end and were counted as one label, " +
                             quoted_label(first_space_merge_.first);
        if (space_merges_ > 1)
            remark += space_merges_ == 2 ? "; so was 1 other spelling with spaces at the start or end"
                                         : "; so were " + format_count(static_cast<double>(space_merges_ - 1)) +
                                               " other spellings with spaces at the start or end";
        remarks.push_back(remark + ".");
    }

    // Texts that differ only in capitals: the first pair found is named, the rest counted.
    std::unordered_map<std::string, const std::string*> by_lower_case;
    std::size_t case_pairs = 0;
    std::string first_pair;
    for (const Cell& level : levels_) {
        if (!level.is_text()) continue;
        std::string lower = level.as_text();
        for (char& c : lower) c = ascii_lower(c);
        const auto [where, added] = by_lower_case.try_emplace(std::move(lower), &level.as_text());
        if (added) continue;
        if (case_pairs++ == 0) first_pair = quoted_label(*where->second) + " and " + quoted_label(level.as_text());
    }
    if (case_pairs > 0) {
        std::string remark = "The " + what + " " + first_pair + " differ only in capitals and are counted apart";
        if (case_pairs > 1)
            remark += "; so are " + format_count(static_cast<double>(case_pairs - 1)) +
                      (case_pairs == 2 ? " other label" : " other labels") + " that differ from another only in capitals";
        remarks.push_back(remark + ".");
    }

    // A single letter beside a word it begins ("Y" and "Yes", "f" and "Female"): the first pair is named,
    // the rest counted.
    const auto letter = [](char c) { return ascii_lower(c) >= 'a' && ascii_lower(c) <= 'z'; };
    std::unordered_map<char, const std::string*> word_of;
    for (const Cell& level : levels_) {
        if (!level.is_text()) continue;
        const std::string& text = level.as_text();
        if (text.size() >= 2 && std::all_of(text.begin(), text.end(), letter))
            word_of.try_emplace(ascii_lower(text[0]), &text);
    }
    std::size_t letter_pairs = 0;
    std::string first_letter_pair;
    for (const Cell& level : levels_) {
        if (!level.is_text() || level.as_text().size() != 1 || !letter(level.as_text()[0])) continue;
        const auto found = word_of.find(ascii_lower(level.as_text()[0]));
        if (found == word_of.end()) continue;
        if (letter_pairs++ == 0) first_letter_pair = quoted_label(level.as_text()) + " and " + quoted_label(*found->second);
    }
    if (letter_pairs > 0)
        remarks.push_back("The " + what + " " + first_letter_pair + " may be one label written two ways (a letter and "
                          "the word it begins), and are counted apart" +
                          (letter_pairs == 1   ? std::string()
                           : letter_pairs == 2 ? std::string("; so is 1 other letter")
                                               : "; so are " + format_count(static_cast<double>(letter_pairs - 1)) +
                                                     " other letters") +
                          "; if they are one, write them one way.");

    // Texts that mark a missing value ("n/a", "-", "(empty)"): the first one found is named, the rest counted.
    std::size_t missing = 0;
    const std::string* first_missing = nullptr;
    for (const Cell& level : levels_)
        if (level.is_text() && detail::names_a_missing_value(level.as_text()) && missing++ == 0)
            first_missing = &level.as_text();
    if (first_missing != nullptr)
        remarks.push_back("The " + what + " include " + quoted_label(*first_missing) +
                          (missing == 1 ? ", which reads" : " and " + format_count(static_cast<double>(missing - 1)) +
                                                                (missing == 2 ? " other label that reads" : " other labels that read")) +
                          " as a missing value, and " + (missing == 1 ? "its" : "their") + " records were counted as " +
                          (missing == 1 ? "a level of their own" : "levels of their own") + "; if they have no answer, "
                          "clear those cells (records with a blank label are skipped, and said); " +
                          (missing == 1 ? "if it is" : "if one is") + " an answer (\"Not applicable\"), write it in "
                          "words.");

    // A text that reads like one of the numbers, e.g. "5" typed as text next to the number 5.
    for (const Cell& level : levels_) {
        if (!level.is_number()) continue;
        const std::string text = level_text(level);
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
