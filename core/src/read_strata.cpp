#include <string>

#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/strata.hpp"

namespace assoc {

Strata read_strata(const CellGrid& range) {
    ReadOptions options;
    options.require_two_by_two = false;  // the shape is checked here, per layout
    const CountTable read = read_count_table(range, options);
    const Matrix body = read.to_body_shape(read.counts());

    // Labels of every body row, including rows that were all zero and set aside.
    std::vector<std::string> row_labels(read.body_rows());
    for (std::size_t i = 0; i < read.kept_rows().size(); ++i) row_labels[read.kept_rows()[i]] = read.row_labels()[i];
    for (const SetAside& aside : read.set_aside_rows()) row_labels[aside.index] = aside.label;

    Strata result;
    result.blank_cells = read.blank_cells();
    const std::size_t rows = body.rows();
    if (body.columns() == 4) {
        result.layout = StrataLayout::one_row_each;
        for (std::size_t k = 0; k < rows; ++k)
            result.tables.push_back({body(k, 0), body(k, 1), body(k, 2), body(k, 3), row_labels[k]});
    } else if (body.columns() == 2) {
        require(rows % 2 == 0, "stacked 2×2 tables need an even number of rows of counts; this range has " +
                                   std::to_string(rows));
        result.layout = StrataLayout::stacked_blocks;
        for (std::size_t k = 0; k < rows / 2; ++k) {
            // A block is named by its first row's label when the second row has none.
            const std::string label = row_labels[2 * k + 1].empty() ? row_labels[2 * k] : std::string();
            result.tables.push_back({body(2 * k, 0), body(2 * k, 1), body(2 * k + 1, 0), body(2 * k + 1, 1), label});
        }
    } else {
        throw Error("strata must be given as one row of 4 counts (a, b, c, d) per stratum, or as 2×2 tables "
                    "stacked in 2 columns; this range has " +
                    std::to_string(body.columns()) + " columns of counts");
    }
    require(result.tables.size() >= 2, "a stratified test needs at least 2 strata; this range holds " +
                                           std::to_string(result.tables.size()));
    return result;
}

std::string stratum_name(const Strata& strata, std::size_t index) {
    const std::string& label = strata.tables[index].label;
    return "stratum " + std::to_string(index + 1) + (label.empty() ? "" : " (" + label + ")");
}

}  // namespace assoc
