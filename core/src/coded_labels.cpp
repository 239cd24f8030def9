#include "assoc/coded_labels.hpp"

#include <string_view>
#include <unordered_map>

#include "level_index.hpp"

namespace assoc {

CodedLabels code_labels(const CellGrid& range) {
    CodedLabels coded;
    coded.rows = range.rows();
    coded.columns = range.columns();
    coded.whole_line = is_whole_line(range.given_rows(), range.given_columns());
    // A single row or column that lost its trailing blanks is coded at its given length, the blanks
    // restored, so that it stays as long as the other ranges of its call.
    const bool single_line = range.given_rows() == 1 || range.given_columns() == 1;
    if (single_line && !range.empty()) {
        coded.rows = range.given_rows();
        coded.columns = range.given_columns();
    }
    coded.codes.reserve(coded.rows * coded.columns);
    // Equal cells share one spelling (exactly equal: "No" and "No " are two spellings of one level,
    // which the readers merge and point out). Texts are keyed by views into `range`, which outlives
    // the maps.
    std::unordered_map<std::string_view, std::uint32_t> texts;
    std::unordered_map<double, std::uint32_t> numbers;
    for (std::size_t r = 0; r < range.rows(); ++r)
        for (std::size_t c = 0; c < range.columns(); ++c) {
            const Cell& cell = range.at(r, c);
            if (detail::is_blank_label(cell)) {
                coded.codes.push_back(CodedLabels::blank);
                continue;
            }
            const auto next = static_cast<std::uint32_t>(coded.spellings.size());
            std::uint32_t code = next;
            if (cell.is_text()) code = texts.try_emplace(std::string_view(cell.as_text()), next).first->second;
            else code = numbers.try_emplace(cell.as_number() + 0.0, next).first->second;
            if (code == next) coded.spellings.push_back(cell);
            coded.codes.push_back(code);
        }
    coded.codes.resize(coded.rows * coded.columns, CodedLabels::blank);
    return coded;
}

}  // namespace assoc
