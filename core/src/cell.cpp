#include "assoc/cell.hpp"

#include <cmath>
#include <cstdio>

#include "assoc/error.hpp"

namespace assoc {

std::string Cell::describe() const {
    switch (kind_) {
    case Kind::blank: return "a blank";
    case Kind::text: {
        // Shown as typed (its spaces are part of what is wrong), but never more than 40 characters.
        if (text_.size() <= 40) return "the text \"" + text_ + "\"";
        std::size_t cut = 40;
        while (cut > 0 && (static_cast<unsigned char>(text_[cut]) & 0xC0) == 0x80) --cut;  // a UTF-8 boundary
        return "the text \"" + text_.substr(0, cut) + "…\"";
    }
    case Kind::number:
        if (std::isnan(number_)) return "a value that is not a number";
        if (std::isinf(number_)) return "an infinite value";
        char buffer[32];
        std::snprintf(buffer, sizeof buffer, "%.15g", number_);
        return std::string("the number ") + buffer;
    }
    return "an unknown value";
}

CellGrid CellGrid::from_rows(const std::vector<std::vector<Cell>>& rows) {
    const std::size_t columns = rows.empty() ? 0 : rows.front().size();
    CellGrid grid(rows.size(), columns);
    for (std::size_t r = 0; r < rows.size(); ++r) {
        require(rows[r].size() == columns, "the rows of the range have different lengths");
        for (std::size_t c = 0; c < columns; ++c) grid.at(r, c) = rows[r][c];
    }
    return grid;
}

}  // namespace assoc
