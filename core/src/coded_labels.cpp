#include "assoc/coded_labels.hpp"

#include "level_index.hpp"

namespace assoc {

CodedLabels code_labels(const CellGrid& range) {
    CodedLabels coded;
    coded.rows = range.rows();
    coded.columns = range.columns();
    coded.codes.reserve(range.rows() * range.columns());
    // Equal cells share one spelling; the index keys texts by views into `range`, which outlives it.
    detail::LevelIndex index;
    for (std::size_t r = 0; r < range.rows(); ++r)
        for (std::size_t c = 0; c < range.columns(); ++c) {
            const Cell& cell = range.at(r, c);
            if (detail::is_blank_label(cell)) {
                coded.codes.push_back(CodedLabels::blank);
                continue;
            }
            const std::uint32_t code = index.intern(cell);
            if (code == coded.spellings.size()) coded.spellings.push_back(cell);
            coded.codes.push_back(code);
        }
    return coded;
}

}  // namespace assoc
