#include "assoc/wording.hpp"

#include <algorithm>
#include <limits>

#include "ascii_case.hpp"
#include "assoc/format.hpp"

namespace assoc {
namespace {

// The width of a space character at `text[i]` (0 when there is none): ASCII white space and the
// no-break space U+00A0 (bytes C2 A0), which text pasted from web pages often carries.
std::size_t space_at_start(std::string_view text) {
    if (text.empty()) return 0;
    const char c = text.front();
    if (c == ' ' || c == '\t' || c == '\n' || c == '\r') return 1;
    if (text.size() >= 2 && static_cast<unsigned char>(text[0]) == 0xC2 && static_cast<unsigned char>(text[1]) == 0xA0)
        return 2;
    return 0;
}

std::size_t space_at_end(std::string_view text) {
    if (text.empty()) return 0;
    const char c = text.back();
    if (c == ' ' || c == '\t' || c == '\n' || c == '\r') return 1;
    if (text.size() >= 2 && static_cast<unsigned char>(text[text.size() - 2]) == 0xC2 &&
        static_cast<unsigned char>(text.back()) == 0xA0)
        return 2;
    return 0;
}

std::string lower(std::string_view text) {
    std::string result(text);
    for (char& c : result) c = detail::ascii_lower(c);
    return result;
}

// Optimal string alignment distance: insertions, deletions, substitutions and swaps of neighbours.
std::size_t edit_distance(const std::string& a, const std::string& b) {
    std::vector<std::vector<std::size_t>> d(a.size() + 1, std::vector<std::size_t>(b.size() + 1, 0));
    for (std::size_t i = 0; i <= a.size(); ++i) d[i][0] = i;
    for (std::size_t j = 0; j <= b.size(); ++j) d[0][j] = j;
    for (std::size_t i = 1; i <= a.size(); ++i)
        for (std::size_t j = 1; j <= b.size(); ++j) {
            const std::size_t change = a[i - 1] == b[j - 1] ? 0 : 1;
            d[i][j] = std::min({d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + change});
            if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1])
                d[i][j] = std::min(d[i][j], d[i - 2][j - 2] + 1);
        }
    return d[a.size()][b.size()];
}

}  // namespace

std::string_view trimmed_label(std::string_view text) {
    while (std::size_t width = space_at_start(text)) text.remove_prefix(width);
    while (std::size_t width = space_at_end(text)) text.remove_suffix(width);
    return text;
}

std::string folded_label(std::string_view label) { return lower(trimmed_label(label)); }

std::string short_label(std::string_view label, std::size_t longest) {
    std::string_view text = trimmed_label(label);
    if (text.size() <= longest) return std::string(text);
    // Cut at a character boundary: UTF-8 continuation bytes are 10xxxxxx.
    std::size_t cut = longest;
    while (cut > 0 && (static_cast<unsigned char>(text[cut]) & 0xC0) == 0x80) --cut;
    return std::string(text.substr(0, cut)) + "…";
}

std::string quoted_label(std::string_view label) { return "\"" + short_label(label) + "\""; }

std::string name_list(const std::vector<std::string>& items, std::size_t shown) {
    const std::size_t named = std::min(items.size(), std::max<std::size_t>(shown, 1));
    const std::size_t rest = items.size() - named;
    std::string text;
    for (std::size_t i = 0; i < named; ++i) {
        const bool last_named = i + 1 == named;
        text += (i == 0 ? "" : (last_named && rest == 0) ? " and " : ", ") + items[i];
    }
    if (rest > 0) text += " and " + format_count(static_cast<double>(rest)) + " more";
    return text;
}

std::string number_runs(std::vector<std::size_t> numbers, std::size_t shown) {
    std::sort(numbers.begin(), numbers.end());
    numbers.erase(std::unique(numbers.begin(), numbers.end()), numbers.end());
    std::vector<std::string> runs;
    std::size_t counted_past = 0;  // numbers in runs beyond the ones shown
    for (std::size_t i = 0; i < numbers.size();) {
        std::size_t j = i;
        while (j + 1 < numbers.size() && numbers[j + 1] == numbers[j] + 1) ++j;
        if (runs.size() < shown)
            runs.push_back(j == i ? format_count(static_cast<double>(numbers[i]))
                                  : format_count(static_cast<double>(numbers[i])) + "–" +
                                        format_count(static_cast<double>(numbers[j])));
        else
            counted_past += j - i + 1;
        i = j + 1;
    }
    std::string text = name_list(runs, runs.size());
    if (counted_past > 0) {
        // "7–9, 12 and 40 more" rather than "7–9 and 12 and 40 more".
        text.clear();
        for (std::size_t i = 0; i < runs.size(); ++i) text += (i == 0 ? "" : ", ") + runs[i];
        text += " and " + format_count(static_cast<double>(counted_past)) + " more";
    }
    return text;
}

std::string numbered_lines(const char* singular, const std::vector<std::size_t>& numbers) {
    return std::string(singular) + (numbers.size() == 1 ? " " : "s ") + number_runs(numbers);
}

std::vector<std::string> nearest_words(const std::string& typed, const std::vector<std::string>& candidates) {
    const std::string word = lower(trimmed_label(typed));
    if (word.empty()) return {};
    const std::size_t allowed = word.size() <= 4 ? 1 : word.size() <= 8 ? 2 : 3;
    std::size_t best = std::numeric_limits<std::size_t>::max();
    std::vector<std::string> nearest;
    for (const std::string& candidate : candidates) {
        const std::string folded = lower(candidate);
        std::size_t distance = edit_distance(word, folded);
        // A beginning of at least 3 letters ("cram", "bonf") is as good as one letter off.
        if (word.size() >= 3 && folded.size() > word.size() && folded.compare(0, word.size(), word) == 0)
            distance = std::min<std::size_t>(distance, 1);
        if (distance > allowed || distance > best) continue;
        if (distance < best) {
            best = distance;
            nearest.clear();
        }
        if (std::find(nearest.begin(), nearest.end(), candidate) == nearest.end()) nearest.push_back(candidate);
    }
    if (nearest.size() > 3) nearest.resize(3);
    return nearest;
}

}  // namespace assoc
