#include "option_words.hpp"

namespace assoc::calc {

std::string quoted_list(const std::vector<std::string>& words, const char* last_joiner) {
    std::string text;
    for (std::size_t i = 0; i < words.size(); ++i) {
        if (i > 0) text += i + 1 == words.size() ? std::string(" ") + last_joiner + " " : std::string(", ");
        text += "\"" + words[i] + "\"";
    }
    return text;
}

std::string normalized_word(const std::string& text) {
    const std::size_t first = text.find_first_not_of(" \t");
    if (first == std::string::npos) return "";
    const std::size_t last = text.find_last_not_of(" \t");
    std::string word = text.substr(first, last - first + 1);
    for (char& ch : word)
        if (ch >= 'A' && ch <= 'Z') ch = static_cast<char>(ch - 'A' + 'a');
    return word;
}

}  // namespace assoc::calc
