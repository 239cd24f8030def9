#pragma once
// The distinct labels ("levels") of a range of records, and the order in which tables list them.
//
// Two labels are the same level when they are the same number, or the same text once the spaces at
// its start and end are left out: "No" and "No " are one level, "No" (an invisible trailing space is
// never meant as a category of its own; the feedback of counts_from_records says when it merged
// such labels). Case and accents count, so "Sales" and "sales" are two levels (the feedback points
// them out). The number 5 and the text "5" are different levels too. A blank cell, or a text of no
// characters or only spaces (what a formula like ="" leaves), is no label at all: the record is
// skipped.
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
    listed,      // the order of a list of labels the user gives (an answer scale: Poor … Excellent)
};

// How levels are ordered: one of the orders above, with the list for LevelOrder::listed.
struct LevelOrdering {
    LevelOrder order = LevelOrder::sorted;
    std::vector<Cell> listed;  // trimmed labels, each once, in the wanted order

    LevelOrdering(LevelOrder how = LevelOrder::sorted) : order(how) {}  // NOLINT: a word's order converts
    // The labels of a single row or column in the wanted order (blanks skipped, texts trimmed). Errors:
    // a range of several rows and columns, no label, a label listed twice.
    static LevelOrdering from_range(const CellGrid& labels);
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
// order of `collation` when sorted). A whole sheet column (or row) is read without its trailing blanks
// and without a header in its first cell (see record_span.hpp). With a listed order, every listed label
// is a level, also one no record holds, and a label that the list lacks is an error naming it.
std::vector<Cell> distinct_levels(const CellGrid& labels, const LevelOrdering& order = LevelOrder::sorted,
                                  const TextCollation& collation = unicode_collation());
std::vector<Cell> distinct_levels(const CodedLabels& labels, const LevelOrdering& order = LevelOrder::sorted,
                                  const TextCollation& collation = unicode_collation());

// The same, with the sentences the feedback gives about how the labels were read (a header left
// out, labels merged or told apart, listed labels that no record holds).
struct LevelList {
    std::vector<Cell> levels;
    std::vector<std::string> remarks;
};
LevelList level_list(const CodedLabels& labels, const LevelOrdering& order = LevelOrder::sorted,
                     const TextCollation& collation = unicode_collation());

}  // namespace assoc
