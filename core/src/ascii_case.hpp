#pragma once
// Case-insensitive comparison of option words (and of labels in the remark on labels that differ
// only in capitals), for the letters A–Z only; other characters compare by their code. The order
// of texts is not decided here but by a collation (assoc/text_collation.hpp).
#include <cstddef>
#include <string>
#include <string_view>

namespace assoc::detail {

inline char ascii_lower(char c) { return (c >= 'A' && c <= 'Z') ? static_cast<char>(c - 'A' + 'a') : c; }

// A sentence's first letter made a capital ("row 3 …" → "Row 3 …").
inline std::string capitalised(std::string text) {
    if (!text.empty() && text[0] >= 'a' && text[0] <= 'z') text[0] = static_cast<char>(text[0] - 'a' + 'A');
    return text;
}

// A word that starts a sentence, put inside one: "Department" → "department", while "HR band" (a
// capital followed by another) keeps its capitals.
inline std::string in_sentence(std::string text) {
    if (text.size() >= 2 && text[0] >= 'A' && text[0] <= 'Z' && text[1] >= 'a' && text[1] <= 'z')
        text[0] = static_cast<char>(text[0] - 'A' + 'a');
    return text;
}

inline bool equals_ignoring_case(std::string_view a, std::string_view b) {
    if (a.size() != b.size()) return false;
    for (std::size_t i = 0; i < a.size(); ++i)
        if (ascii_lower(a[i]) != ascii_lower(b[i])) return false;
    return true;
}

}  // namespace assoc::detail
