#pragma once
// The distinct labels ("levels") of a range of records, and the order in which tables list them.
//
// Two labels are the same level when they are the same number, or exactly the same text:
// case, spaces and accents all count, so "Sales", "sales" and "Sales " are three levels
// (the feedback of counts_from_records points out labels that differ only in capitals).
// The number 5 and the text "5" are different levels too. A blank cell, or a text of no
// characters (what a formula like ="" leaves), is no label at all: the record is skipped.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/coded_labels.hpp"
#include "assoc/text_collation.hpp"

namespace assoc {

enum class LevelOrder {
    sorted,      // numbers ascending, then texts in the order of a collation (text_collation.hpp)
    first_seen,  // the order in which each label first appears in the range
};

// Reads the option word: "sorted" or "first", in any case; "" (omitted) gives sorted.
LevelOrder parse_level_order(const std::string& word);

// The positions of `levels` (numbers and texts, each once) in sorted order: numbers first,
// ascending; then texts in collated order (text_collation.hpp: letters, then accents, then case,
// then code points).
std::vector<std::size_t> sorted_order(const std::vector<const Cell*>& levels, const TextCollation& collation);

// A level written as text for headers and messages: "Sales", "3", "0.25".
std::string level_text(const Cell& level);

// The distinct labels of a single row or column, blanks skipped, listed in `order` (texts in the
// order of `collation` when sorted).
std::vector<Cell> distinct_levels(const CellGrid& labels, LevelOrder order = LevelOrder::sorted,
                                  const TextCollation& collation = unicode_collation());
std::vector<Cell> distinct_levels(const CodedLabels& labels, LevelOrder order = LevelOrder::sorted,
                                  const TextCollation& collation = unicode_collation());

}  // namespace assoc
