#pragma once
// Case-insensitive comparison of option words (and of labels in the remark on labels that differ
// only in capitals), for the letters A–Z only; other characters compare by their code. The order
// of texts is not decided here but by a collation (assoc/text_collation.hpp).
#include <cstddef>
#include <string_view>

namespace assoc::detail {

inline char ascii_lower(char c) { return (c >= 'A' && c <= 'Z') ? static_cast<char>(c - 'A' + 'a') : c; }

inline bool equals_ignoring_case(std::string_view a, std::string_view b) {
    if (a.size() != b.size()) return false;
    for (std::size_t i = 0; i < a.size(); ++i)
        if (ascii_lower(a[i]) != ascii_lower(b[i])) return false;
    return true;
}

}  // namespace assoc::detail
