#include <algorithm>
#include <string>

#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/strata.hpp"
#include "assoc/validity.hpp"
#include "assoc/wording.hpp"
#include "row_names.hpp"
#include "total_lines.hpp"

namespace assoc {
namespace {

bool is_label_cell(const Cell& cell) { return cell.is_text() || cell.is_blank(); }

// The number of leading columns below the header row that hold only labels (texts or blanks, one
// text at least): a stacked layout may name the stratum in one column and the group in the next.
std::size_t label_columns(const CellGrid& range, std::size_t first_row) {
    std::size_t count = 0;
    for (std::size_t c = 0; c + 1 < range.columns(); ++c) {
        bool any_text = false, only_labels = true;
        for (std::size_t r = first_row; r < range.rows() && only_labels; ++r) {
            only_labels = is_label_cell(range.at(r, c));
            any_text = any_text || range.at(r, c).is_text();
        }
        if (!only_labels || !any_text) break;
        ++count;
    }
    return count;
}

bool header_row(const CellGrid& range) {
    bool any_text = false;
    for (std::size_t c = 0; c < range.columns(); ++c) {
        if (!is_label_cell(range.at(0, c))) return false;
        any_text = any_text || range.at(0, c).is_text();
    }
    return any_text;
}

// One stratum of the stacked layout: its category rows (positions among the rows read) and name.
struct Block {
    std::vector<std::size_t> rows;
    std::string name;
};

// Whether each row of `block` holds, in every column, the sum of the rows of the same group (the
// same label, or the same place in its stratum where the groups have no labels) in the other blocks.
bool holds_the_other_strata(const Block& block, const std::vector<Block>& blocks, const std::vector<std::string>& labels,
                            const Matrix& counts) {
    if (blocks.size() < 3) return false;  // with one other stratum, equal counts are easily a coincidence
    for (std::size_t p = 0; p < block.rows.size(); ++p) {
        const std::size_t i = block.rows[p];
        for (std::size_t c = 0; c < counts.columns(); ++c) {
            double sum = 0.0;
            std::size_t found = 0;
            for (const Block& other : blocks) {
                if (&other == &block) continue;
                for (std::size_t q = 0; q < other.rows.size(); ++q) {
                    const std::size_t j = other.rows[q];
                    const bool same = labels[i].empty() ? q == p : folded_label(labels[j]) == folded_label(labels[i]);
                    if (!same) continue;
                    sum += counts(j, c);
                    ++found;
                }
            }
            if (found + 1 != blocks.size() || !detail::same_amount(sum, counts(i, c))) return false;
        }
    }
    return !block.rows.empty();
}

std::string rows_in_words(const std::vector<std::string>& labels, const Block& block, const std::vector<std::size_t>& numbers) {
    std::vector<std::string> names;
    bool all_labelled = true;
    for (std::size_t i : block.rows) {
        all_labelled = all_labelled && !labels[i].empty();
        names.push_back(quoted_label(labels[i]));
    }
    if (all_labelled) return name_list(names, 4);
    std::vector<std::size_t> rows;
    for (std::size_t i : block.rows) rows.push_back(numbers[i]);
    return numbered_lines("row", rows);
}

// Refuses blocks that are not exactly 2 rows, naming a few of them.
void require_pairs(const std::vector<Block>& blocks, const std::vector<std::string>& labels,
                   const std::vector<std::size_t>& numbers, const std::string& how) {
    std::vector<std::string> wrong;
    std::size_t count = 0;
    for (std::size_t k = 0; k < blocks.size(); ++k) {
        if (blocks[k].rows.size() == 2) continue;
        if (++count > 3) continue;
        const std::string name = blocks[k].name.empty() ? "stratum " + std::to_string(k + 1) : quoted_label(blocks[k].name);
        wrong.push_back(name + " has " + std::to_string(blocks[k].rows.size()) + " row" +
                        (blocks[k].rows.size() == 1 ? "" : "s") + " (" + rows_in_words(labels, blocks[k], numbers) + ")");
    }
    if (count == 0) return;
    std::string found = name_list(wrong, 3);
    if (count > 3) found += ", and " + std::to_string(count - 3) + " more strata do not have 2 rows";
    throw Error(how + ", and " + found + "; each stratum needs exactly 2 rows, one per group (a 2×2 table): leave "
                "out or combine the other rows");
}

// Blocks from names on some rows or on every row: a name starts a stratum, and the rows below it that
// are blank or repeat its name belong to it. A name that comes back after another stratum is refused
// (joining its rows or splitting the stratum would both be a guess).
std::vector<Block> blocks_from_names(const std::vector<std::string>& names, const std::vector<std::size_t>& numbers) {
    std::vector<Block> blocks;
    for (std::size_t i = 0; i < names.size(); ++i) {
        const bool continues = !blocks.empty() && (names[i].empty() || folded_label(names[i]) == folded_label(blocks.back().name));
        if (!continues) {
            if (names[i].empty()) {  // the first rows without a name: a stratum of their own, refused by its size
                blocks.push_back({{}, names[i]});
                blocks.back().rows.push_back(i);
                continue;
            }
            for (const Block& earlier : blocks)
                if (folded_label(earlier.name) == folded_label(names[i]))
                    throw Error("the stratum " + quoted_label(names[i]) + " comes back at row " + std::to_string(numbers[i]) +
                                " after rows of another stratum; keep each stratum's rows together (sort the range by "
                                "its first column)");
            blocks.push_back({{}, names[i]});
        }
        blocks.back().rows.push_back(i);
    }
    return blocks;
}

// Blocks from names on every row: runs of the same name.
std::vector<Block> blocks_from_runs(const std::vector<std::string>& names) {
    std::vector<Block> blocks;
    for (std::size_t i = 0; i < names.size(); ++i) {
        if (blocks.empty() || folded_label(names[i]) != folded_label(names[i - 1])) blocks.push_back({{}, names[i]});
        blocks.back().rows.push_back(i);
    }
    return blocks;
}

// The smallest period p ≥ 2 with which the labels repeat (each label equal to the one p rows above, the
// first p all different), or 0 when they do not repeat so.
std::size_t period(const std::vector<std::string>& labels) {
    const std::size_t n = labels.size();
    for (std::size_t p = 2; p < n; ++p) {
        if (n % p != 0) continue;
        bool repeats = true;
        for (std::size_t i = p; i < n && repeats; ++i) repeats = folded_label(labels[i]) == folded_label(labels[i - p]);
        std::vector<std::string> first;
        for (std::size_t i = 0; i < p; ++i) first.push_back(folded_label(labels[i]));
        std::sort(first.begin(), first.end());
        if (repeats && std::adjacent_find(first.begin(), first.end()) == first.end()) return p;
    }
    return 0;
}

std::vector<Block> blocks_of(std::size_t size, std::size_t rows) {
    std::vector<Block> blocks;
    for (std::size_t i = 0; i < rows; ++i) {
        if (i % size == 0) blocks.push_back({{}, ""});
        blocks.back().rows.push_back(i);
    }
    return blocks;
}

}  // namespace

Strata read_strata(const CellGrid& given) {
    require(!given.empty(), "the range is empty; select the strata's counts");
    // A stratum column before the group labels is read here; the rest as a table.
    const bool headers = header_row(given);
    const std::size_t extra_label_columns = label_columns(given, headers ? 1 : 0) > 1 ? label_columns(given, headers ? 1 : 0) - 1 : 0;
    CellGrid range(given.rows(), given.columns() - extra_label_columns);
    for (std::size_t r = 0; r < given.rows(); ++r)
        for (std::size_t c = 0; c < range.columns(); ++c) range.at(r, c) = given.at(r, c + extra_label_columns);

    ReadOptions options;
    options.require_two_by_two = false;  // the shape is checked here, per layout
    options.distinct_labels = false;     // each stratum repeats the groups' labels
    const CountTable read = read_count_table(range, options);
    const Matrix counts = read.category_counts();

    Strata result;
    result.blank_cells = read.blank_cells();
    result.column_labels = detail::category_labels(read, false);
    result.remarks = table_notes(read);  // doubts, how it was read, total lines set aside
    std::vector<std::string> labels;        // the group (or stratum) label of each category row
    std::vector<std::string> stratum_names;  // from the stratum column(s), "" where blank
    std::vector<std::size_t> numbers;       // each category row's row in the range
    for (std::size_t r : read.category_rows()) {
        labels.push_back(read.body_row_labels()[r]);
        numbers.push_back(read.range_row(r));
        std::string name;
        for (std::size_t c = 0; c < extra_label_columns; ++c) {
            const Cell& cell = given.at(read.range_row(r) - 1, c);
            if (cell.is_text() && !trimmed_label(cell.as_text()).empty())
                name += (name.empty() ? "" : " / ") + std::string(trimmed_label(cell.as_text()));
        }
        stratum_names.push_back(name);
    }
    const std::size_t rows = counts.rows();

    if (counts.columns() == 4) {
        result.layout = StrataLayout::one_row_each;
        for (std::size_t k = 0; k < rows; ++k)
            result.tables.push_back({counts(k, 0), counts(k, 1), counts(k, 2), counts(k, 3),
                                     stratum_names[k].empty() ? labels[k] : stratum_names[k]});
    } else if (counts.columns() == 2) {
        result.layout = StrataLayout::stacked_blocks;
        std::vector<Block> blocks;
        const bool any_label = std::any_of(labels.begin(), labels.end(), [](const std::string& l) { return !l.empty(); });
        const bool all_labelled = std::all_of(labels.begin(), labels.end(), [](const std::string& l) { return !l.empty(); });
        if (extra_label_columns > 0) {
            require(rows == 0 || !stratum_names[0].empty(),
                    "row " + std::to_string(numbers.empty() ? 1 : numbers[0]) +
                        " has no stratum name in the first label column, and there is none above it to go by");
            blocks = blocks_from_names(stratum_names, numbers);
            // A stratum named as a total (the rows of all strata together) is no stratum; nor is one
            // named as everyone ("All offices") whose rows hold the sums of the other strata's.
            // (Decided for every block before any is moved.)
            std::vector<bool> whole(blocks.size(), false);
            for (std::size_t b = 0; b < blocks.size(); ++b)
                whole[b] = !detail::is_total_label(blocks[b].name) && detail::names_the_whole_group(blocks[b].name) &&
                           holds_the_other_strata(blocks[b], blocks, labels, counts);
            std::vector<Block> kept;
            for (std::size_t b = 0; b < blocks.size(); ++b) {
                if (detail::is_total_label(blocks[b].name))
                    result.remarks.push_back("The rows of " + quoted_label(blocks[b].name) + " were set aside as totals.");
                else if (whole[b])
                    result.remarks.push_back("The rows of " + quoted_label(blocks[b].name) +
                                             " hold the sums of the other strata and were set aside as totals.");
                else kept.push_back(std::move(blocks[b]));
            }
            blocks = std::move(kept);
            require_pairs(blocks, labels, numbers, "the strata are told apart by the first label column");
        } else if (any_label && !all_labelled && !labels[0].empty()) {
            blocks = blocks_from_names(labels, numbers);
            require_pairs(blocks, labels, numbers,
                          "the strata are told apart by their names in the label column (a name starts a stratum)");
        } else if (all_labelled) {
            const std::vector<Block> runs = blocks_from_runs(labels);
            const std::size_t repeat = period(labels);
            // Runs of one name name the strata when no name comes back in a later run.
            std::vector<std::string> run_names;
            for (const Block& run : runs) run_names.push_back(folded_label(run.name));
            std::sort(run_names.begin(), run_names.end());
            const bool names_strata = std::adjacent_find(run_names.begin(), run_names.end()) == run_names.end();
            if (runs.size() < rows && names_strata) {
                blocks = runs;
                require_pairs(blocks, labels, numbers, "the strata are told apart by their names in the label column");
            } else if (repeat > 0) {
                std::vector<std::string> groups;
                for (std::size_t i = 0; i < repeat; ++i) groups.push_back(quoted_label(labels[i]));
                require(repeat == 2, "the row labels repeat every " + std::to_string(repeat) + " rows (" +
                                         name_list(groups, 4) + "), so each stratum has " + std::to_string(repeat) +
                                         " rows; each stratum needs exactly 2 rows, one per group (a 2×2 table): leave "
                                         "out or combine the other rows, or give a label column that names the strata");
                blocks = blocks_of(2, rows);
            } else {
                // All different, or repeating in no pattern.
                std::vector<std::string> sorted;
                for (const std::string& label : labels) sorted.push_back(folded_label(label));
                std::sort(sorted.begin(), sorted.end());
                require(std::adjacent_find(sorted.begin(), sorted.end()) == sorted.end(),
                        "the row labels repeat, but in no pattern that shows which rows form a stratum; give a first "
                        "label column that names each row's stratum, or put each stratum's 2 rows together in the "
                        "same order");
                require(rows % 2 == 0, "stacked 2×2 tables need an even number of rows of counts; this range has " +
                                           std::to_string(rows));
                blocks = blocks_of(2, rows);
                // No rows at all (every row set aside as a total) is refused below: fewer than 2 strata.
                if (rows >= 2)
                    result.remarks.push_back("The row labels do not show which rows form a stratum, so the rows were "
                                         "taken two by two in order (" +
                                         numbered_lines("row", {numbers[0], numbers[1]}) + " the first stratum, and so "
                                         "on); if that is wrong, give a first label column that names the strata.");
            }
        } else {
            require(rows % 2 == 0, "stacked 2×2 tables need an even number of rows of counts; this range has " +
                                       std::to_string(rows));
            blocks = blocks_of(2, rows);
        }
        // The same two groups in the same order in every stratum: a stratum given in the other order
        // is turned around, so that its odds ratio compares the same groups.
        // A stratum whose groups carry other labels is read in its order and said; one that shares a label
        // with the first stratum's groups in the other place is refused (which row is which group?).
        std::vector<std::string> turned, relabelled;
        for (Block& block : blocks) {
            const std::size_t first = block.rows[0], second = block.rows[1];
            const Block& reference = blocks.front();  // in the loop: there may be no block at all
            const std::string top = folded_label(labels[reference.rows[0]]), bottom = folded_label(labels[reference.rows[1]]);
            const std::string here_top = folded_label(labels[first]), here_bottom = folded_label(labels[second]);
            if (top.empty() || bottom.empty() || top == bottom || extra_label_columns == 0) {
                // Groups are matched only when a stratum column names the strata and the groups are labelled.
            } else if (here_top == top && here_bottom == bottom) {
                // The same groups in the same order.
            } else if (here_top == bottom && here_bottom == top) {
                std::swap(block.rows[0], block.rows[1]);
                turned.push_back(quoted_label(block.name));
            } else if (here_top == bottom || here_bottom == top) {
                throw Error("the rows of " + quoted_label(block.name) + " (" + quoted_label(labels[first]) + " and " +
                            quoted_label(labels[second]) + ") match the groups of " + quoted_label(reference.name) +
                            " (" + quoted_label(labels[reference.rows[0]]) + " and " +
                            quoted_label(labels[reference.rows[1]]) + ") neither in their order nor the other way "
                            "round, so which row is which group cannot be told; give every stratum the same 2 group "
                            "labels");
            } else {
                relabelled.push_back(quoted_label(block.name) + " (" + quoted_label(labels[first]) + " and " +
                                     quoted_label(labels[second]) + ")");
            }
            const std::size_t a = block.rows[0], b = block.rows[1];
            result.tables.push_back({counts(a, 0), counts(a, 1), counts(b, 0), counts(b, 1), block.name});
        }
        if (!relabelled.empty())
            result.remarks.push_back("The rows of " + name_list(relabelled, 4) + " carry other labels than those of " +
                                     quoted_label(blocks.front().name) + " (" +
                                     quoted_label(labels[blocks.front().rows[0]]) + " and " +
                                     quoted_label(labels[blocks.front().rows[1]]) + "); they were read in their order, "
                                     "the first as " + quoted_label(labels[blocks.front().rows[0]]) + ". If they are "
                                     "the same groups, give them the same labels.");
        if (!turned.empty())
            result.remarks.push_back("The rows of " + name_list(turned, 4) + " come in the other order (" +
                                     quoted_label(labels[blocks.front().rows[1]]) + " first); they were matched to " +
                                     quoted_label(labels[blocks.front().rows[0]]) + " and " +
                                     quoted_label(labels[blocks.front().rows[1]]) + " by their labels.");
    } else {
        throw Error("strata must be given as one row of 4 counts (a, b, c, d) per stratum, or as 2×2 tables "
                    "stacked in 2 columns; this range has " +
                    std::to_string(counts.columns()) + " columns of counts");
    }
    require(result.tables.size() >= 2, "a stratified test needs at least 2 strata; this range holds " +
                                           std::to_string(result.tables.size()));
    return result;
}

std::string stratum_name(const Strata& strata, std::size_t index) {
    const std::string& label = strata.tables[index].label;
    return "stratum " + std::to_string(index + 1) + (label.empty() ? "" : " (" + std::string(trimmed_label(label)) + ")");
}

}  // namespace assoc
