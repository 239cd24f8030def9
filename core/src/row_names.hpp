#pragma once
// Names of the rows of a table's body for results and messages: the row's label, or "row k" when
// the range has no label for it (k its 1-based place in the body, counting rows of zeros too).
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/count_table.hpp"

namespace assoc::detail {

// One name per row of the body (kept and set-aside rows alike), in the order of the range.
inline std::vector<std::string> body_row_names(const CountTable& table) {
    std::vector<std::string> names(table.body_rows());
    for (std::size_t i = 0; i < table.kept_rows().size(); ++i) names[table.kept_rows()[i]] = table.row_labels()[i];
    for (const SetAside& aside : table.set_aside_rows()) names[aside.index] = aside.label;
    for (std::size_t r = 0; r < names.size(); ++r)
        if (names[r].empty()) names[r] = "row " + std::to_string(r + 1);
    return names;
}

// "row 3" or "row 3 (Legal)": a row named in a message by its place and its name from body_row_names.
inline std::string row_reference(std::size_t body_row, const std::string& name) {
    const std::string place = "row " + std::to_string(body_row + 1);
    return name == place ? place : place + " (" + name + ")";
}

}  // namespace assoc::detail
