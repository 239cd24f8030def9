#include "shared_words.hpp"

#include <algorithm>
#include <string>
#include <vector>

#include "assoc/wording.hpp"

namespace assoc::detail {

std::vector<std::string> without_shared_words(const std::vector<std::string>& labels) {
    std::vector<std::vector<std::string>> words(labels.size());
    for (std::size_t i = 0; i < labels.size(); ++i) {
        const std::string folded = folded_label(labels[i]);
        std::size_t at = 0;
        while (at < folded.size()) {
            const std::size_t space = folded.find(' ', at);
            const std::size_t end = space == std::string::npos ? folded.size() : space;
            if (end > at) words[i].push_back(folded.substr(at, end - at));
            at = end + 1;
        }
        if (words[i].empty()) return {};
    }
    const std::size_t shortest =
        std::min_element(words.begin(), words.end(), [](const auto& a, const auto& b) { return a.size() < b.size(); })->size();
    const auto shared = [&](std::size_t from_start, std::size_t from_end) {
        return std::all_of(words.begin(), words.end(), [&](const std::vector<std::string>& w) {
            const std::size_t i = from_start ? from_start - 1 : w.size() - from_end;
            const std::size_t j = from_start ? from_start - 1 : words.front().size() - from_end;
            return w[i] == words.front()[j];
        });
    };
    std::size_t leading = 0, trailing = 0;
    while (leading + trailing + 1 < shortest && shared(leading + 1, 0)) ++leading;
    while (leading + trailing + 1 < shortest && shared(0, trailing + 1)) ++trailing;
    if (leading + trailing == 0) return {};
    std::vector<std::string> stems;
    for (const std::vector<std::string>& w : words) {
        std::string stem;
        for (std::size_t i = leading; i + trailing < w.size(); ++i) stem += (stem.empty() ? "" : " ") + w[i];
        stems.push_back(stem);
    }
    return stems;
}

std::vector<std::string> label_keys(const std::vector<std::string>& labels) {
    std::vector<std::string> keys = without_shared_words(labels);
    if (keys.empty())
        for (const std::string& label : labels) keys.push_back(folded_label(label));
    return keys;
}

}  // namespace assoc::detail
