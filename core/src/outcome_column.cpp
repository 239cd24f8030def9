#include "assoc/outcome_column.hpp"

#include <algorithm>
#include <cstring>
#include <iterator>
#include <utility>

#include "assoc/error.hpp"
#include "assoc/wording.hpp"

namespace assoc {

namespace {

// Words that answer a yes/no question, folded; a no-word and a yes-word of one language or not.
const char* const no_words[] = {"no", "n", "false", "nein", "non", "nee", "não", "nao", "nej", "nie"};
const char* const yes_words[] = {"yes", "y", "true", "ja", "oui", "si", "sí", "sì", "sim", "tak"};

template <std::size_t N>
bool one_of(std::string_view word, const char* const (&words)[N]) {
    return std::any_of(std::begin(words), std::end(words), [&](const char* w) { return word == w; });
}

bool separator(char c) { return c == ' ' || c == ':' || c == '-' || c == '=' || c == ',' || c == '?' || c == '/'; }

std::string_view without_separators(std::string_view text) {
    while (!text.empty() && separator(text.front())) text.remove_prefix(1);
    while (!text.empty() && separator(text.back())) text.remove_suffix(1);
    return text;
}

// The word at the end (at_end) or the start of `text` after its separators, and the rest before (after)
// it; an empty word when `text` holds one word only or none.
std::pair<std::string_view, std::string_view> split_word(std::string_view text, bool at_end) {
    text = without_separators(text);
    if (at_end) {
        std::size_t start = text.size();
        while (start > 0 && !separator(text[start - 1])) --start;
        if (start == 0) return {};
        return {text.substr(start), without_separators(text.substr(0, start))};
    }
    std::size_t end = 0;
    while (end < text.size() && !separator(text[end])) ++end;
    if (end == text.size()) return {};
    return {text.substr(0, end), without_separators(text.substr(end))};
}

// Whether `absent` is `present` with a negation put before one of its words ("Not promoted",
// "Women not promoted", "Non-manager", "Unsuccessful", "Without overtime" beside "With overtime").
bool negates(std::string_view absent, std::string_view present) {
    if (present.empty()) return false;
    static const char* const negations[] = {"not ",  "non ",   "no ",   "not-",  "non-",  "no-",   "non",
                                            "un",    "in",     "dis",   "without ", "nicht ", "kein ", "keine ",
                                            "sans ", "pas ",   "sin ",  "senza ", "niet ", "geen ", "ohne "};
    for (std::size_t i = 0; i < absent.size(); ++i) {
        if (i > 0 && !separator(absent[i - 1])) continue;  // a negation starts a word
        for (const char* word : negations) {
            const std::string_view n(word);
            if (absent.compare(i, n.size(), n) != 0) continue;
            const std::string_view before = absent.substr(0, i), after = absent.substr(i + n.size());
            if (present.size() == before.size() + after.size() && present.substr(0, i) == before &&
                present.substr(i) == after)
                return true;
            if (n == "without " && present.size() == before.size() + 5 + after.size() &&
                present.substr(0, i) == before && present.compare(i, 5, "with ") == 0 && present.substr(i + 5) == after)
                return true;
        }
    }
    return false;
}

}  // namespace

bool names_the_absence_of(std::string_view label, std::string_view other) {
    const std::string absent = folded_label(label), present = folded_label(other);
    if (absent.empty() || present.empty() || absent == present) return false;
    if (one_of(std::string_view(absent), no_words) && one_of(std::string_view(present), yes_words)) return true;
    if (negates(absent, present)) return true;
    for (bool at_end : {true, false}) {
        const auto [no, rest_no] = split_word(absent, at_end);
        const auto [yes, rest_yes] = split_word(present, at_end);
        if (!no.empty() && !yes.empty() && one_of(no, no_words) && one_of(yes, yes_words) && rest_no == rest_yes)
            return true;
    }
    return false;
}

namespace detail {

void require_outcome_first(const std::string& outcome, const std::vector<std::string>& others, const char* measure,
                           const char* position) {
    for (const std::string& other : others) {
        if (!names_the_absence_of(outcome, other)) continue;
        throw Error("the " + std::string(position) + " column of counts, " + quoted_label(outcome) +
                    ", reads as the absence of the column " + quoted_label(other) + ", and the " + position +
                    " column is the outcome: " + measure + " would measure " + quoted_label(outcome) + ", not " +
                    quoted_label(other) + " (a table in sorted order, as a pivot table is, puts \"No\" before \"Yes\"); "
                    "put the column " + quoted_label(other) + " " + (std::strcmp(position, "first") == 0 ? "first" : "before it") +
                    ". If " + quoted_label(outcome) + " is the outcome you mean, leave the header row out of the range");
    }
}

void require_outcome_first(const Strata& strata, const char* measure) {
    const std::vector<std::string>& labels = strata.column_labels;
    if (labels.size() == 2 || labels.size() == 4) require_outcome_first(labels[0], {labels[1]}, measure);
    if (labels.size() == 4) require_outcome_first(labels[2], {labels[3]}, measure, "third");
}

}  // namespace detail
}  // namespace assoc
