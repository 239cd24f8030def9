#pragma once
// Case-insensitive comparison of option words and labels, for the letters A–Z only.
// Full Unicode case folding would need a locale library the core does not carry;
// other characters (accented letters included) compare by their code.
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

// <0, 0 or >0 as a is before, the same as or after b when A–Z are read as a–z.
inline int compare_ignoring_case(std::string_view a, std::string_view b) {
    const std::size_t common = a.size() < b.size() ? a.size() : b.size();
    for (std::size_t i = 0; i < common; ++i) {
        const unsigned char x = static_cast<unsigned char>(ascii_lower(a[i]));
        const unsigned char y = static_cast<unsigned char>(ascii_lower(b[i]));
        if (x != y) return x < y ? -1 : 1;
    }
    return a.size() == b.size() ? 0 : (a.size() < b.size() ? -1 : 1);
}

}  // namespace assoc::detail
