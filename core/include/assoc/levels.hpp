#pragma once
// The distinct labels ("levels") of a range of records, and the order in which tables list them.
//
// Two labels are the same level when they are the same number, or exactly the same text:
// case, spaces and accents all count, so "Sales", "sales" and "Sales " are three levels
// (the feedback of counts_from_records points out labels that differ only in capitals).
// The number 5 and the text "5" are different levels too. A blank cell, or a text of no
// characters (what a formula like ="" leaves), is no label at all: the record is skipped.
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/coded_labels.hpp"

namespace assoc {

enum class LevelOrder {
    sorted,      // numbers ascending, then texts alphabetically (A–Z and a–z read alike)
    first_seen,  // the order in which each label first appears in the range
};

// Reads the option word: "sorted" or "first", in any case; "" (omitted) gives sorted.
LevelOrder parse_level_order(const std::string& word);

// Whether level a is listed before level b in sorted order. Numbers come first, ascending;
// texts follow, compared with the letters A–Z read as a–z (other characters by their
// Unicode code); texts that differ only in capitals are ordered by their exact characters.
bool level_before(const Cell& a, const Cell& b);

// A level written as text for headers and messages: "Sales", "3", "0.25".
std::string level_text(const Cell& level);

// The distinct labels of a single row or column, blanks skipped, listed in `order`.
std::vector<Cell> distinct_levels(const CellGrid& labels, LevelOrder order = LevelOrder::sorted);
std::vector<Cell> distinct_levels(const CodedLabels& labels, LevelOrder order = LevelOrder::sorted);

}  // namespace assoc
