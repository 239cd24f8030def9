#include "record_span.hpp"

#include <algorithm>
#include <iterator>
#include <set>
#include <string_view>
#include <unordered_map>

#include "ascii_case.hpp"
#include "assoc/error.hpp"
#include "assoc/wording.hpp"
#include "total_lines.hpp"

namespace assoc::detail {
namespace {

bool is_text_code(const CodedLabels& labels, std::uint32_t code) {
    return code != CodedLabels::blank && code < labels.spellings.size() && labels.spellings[code].is_text();
}

// What a record is in ranges shaped like `labels`: a row, or a column of ranges laid along a row.
const char* record_word(const CodedLabels& labels) { return labels.rows == 1 && labels.columns > 1 ? "column" : "row"; }

bool blank_at(const CodedLabels& labels, std::size_t at) {
    return at >= labels.codes.size() || labels.codes[at] == CodedLabels::blank;
}

// Whether the cell of `labels` at position `at` is a text found nowhere else in positions at + 1 to
// end − 1 (the positions above it are blank or headers).
bool unique_text_at(const CodedLabels& labels, std::size_t at, std::size_t end) {
    if (at >= labels.codes.size() || !is_text_code(labels, labels.codes[at])) return false;
    const std::string_view first = trimmed_label(labels.spellings[labels.codes[at]].as_text());
    // Two spellings may hold the same text (copies of one text that the host did not share).
    std::vector<bool> same(labels.spellings.size(), false);
    for (std::size_t s = 0; s < labels.spellings.size(); ++s)
        same[s] = labels.spellings[s].is_text() && trimmed_label(labels.spellings[s].as_text()) == first;
    for (std::size_t i = at + 1; i < end && i < labels.codes.size(); ++i) {
        const std::uint32_t code = labels.codes[i];
        if (code != CodedLabels::blank && code < same.size() && same[code]) return false;
    }
    return true;
}

// Whether some label comes twice among positions at + 1 to end − 1.
// Texts are compared as texts, as unique_text_at does: the host may hand equal texts over as
// different spellings (the records fuzz target found the remark below given by one route and not the other).
bool repeats_below(const CodedLabels& labels, std::size_t at, std::size_t end) {
    std::set<std::string_view> texts;
    std::set<double> numbers;
    for (std::size_t i = at + 1; i < end && i < labels.codes.size(); ++i) {
        const std::uint32_t code = labels.codes[i];
        if (code == CodedLabels::blank || code >= labels.spellings.size()) continue;
        const Cell& spelling = labels.spellings[code];
        const bool fresh = spelling.is_text() ? texts.insert(trimmed_label(spelling.as_text())).second
                                              : numbers.insert(spelling.as_number()).second;
        if (!fresh) return true;
    }
    return false;
}

// Whether a range drawn with its header looks so at position `at`: the cell there is a text found
// nowhere else below it, above at least 3 records that are all numbers or among which some label
// repeats (records under a column's name do; a short list of distinct names does not).
bool header_like(const CodedLabels& labels, std::size_t at, std::size_t end) {
    if (!unique_text_at(labels, at, end)) return false;
    std::size_t records = 0, numbers = 0;
    for (std::size_t i = at + 1; i < end && i < labels.codes.size(); ++i) {
        const std::uint32_t code = labels.codes[i];
        if (code == CodedLabels::blank) continue;
        ++records;
        if (!is_text_code(labels, code)) ++numbers;
    }
    return records >= 3 && (numbers == records || repeats_below(labels, at, end));
}

std::string cell_text_at(const CodedLabels& labels, std::size_t at) {
    if (at >= labels.codes.size() || !is_text_code(labels, labels.codes[at])) return "";
    return quoted_label(labels.spellings[labels.codes[at]].as_text());
}

// The texts of the ranges at position `at`: "" when none, the text when one, " (…)" of them all otherwise.
std::vector<std::string> texts_at(const std::vector<const CodedLabels*>& labels, std::size_t at) {
    std::vector<std::string> texts;
    for (const CodedLabels* range : labels) {
        const std::string text = cell_text_at(*range, at);
        if (!text.empty()) texts.push_back(text);
    }
    return texts;
}

}  // namespace

std::string record_place(const CodedLabels& labels, std::size_t i) {
    return std::string(record_word(labels)) + " " + std::to_string(i + 1);
}

namespace {

RecordSpan records_and_header(const std::vector<const CodedLabels*>& labels, const Cell* first_weight,
                              std::size_t weights_end) {
    RecordSpan span;
    for (const CodedLabels* range : labels) {
        std::size_t end = range->codes.size();
        while (end > 0 && range->codes[end - 1] == CodedLabels::blank) --end;
        span.end = std::max(span.end, end);
    }
    span.end = std::max(span.end, weights_end);
    if (span.end < 2 || labels.empty()) return span;

    // Positions blank in every range before the first label (a range drawn from above the records, a
    // whole column whose records start lower down) are no records either, as those after the last.
    const auto all_blank_at = [&](std::size_t at) {
        return std::all_of(labels.begin(), labels.end(), [&](const CodedLabels* range) { return blank_at(*range, at); });
    };
    const bool first_weight_given = first_weight != nullptr && !first_weight->is_blank();
    std::size_t at = 0;
    while (at + 1 < span.end && all_blank_at(at) && !(at == 0 && first_weight_given)) ++at;
    span.first = at;

    const CodedLabels& shape = *labels.front();
    const bool along_row = shape.rows == 1 && shape.columns > 1;
    const std::string word = record_word(shape);
    const std::string line = (along_row ? "Column " : "Row ") + std::to_string(at + 1);
    const std::vector<std::string> firsts = texts_at(labels, at);
    const std::string what = firsts.size() > 1 ? " (" + name_list(firsts) + ")" : "";

    // A title above the header (a text in some ranges, blank in the others, or one followed by blank
    // rows) and below it a header (a text found nowhere else in every range, above records whose
    // labels repeat): both look like headers, and which one is the author's to say, so it is refused.
    // The cheap test first: the scans of header_like run over every record, on every call.
    std::size_t next = at + 1;
    while (next < span.end && all_blank_at(next)) ++next;
    const bool title_like = !firsts.empty() && next < span.end && (firsts.size() < labels.size() || next > at + 1);
    if (title_like &&
        std::all_of(labels.begin(), labels.end(), [&](const CodedLabels* range) {
            return blank_at(*range, at) || unique_text_at(*range, at, span.end);
        }) &&
        std::all_of(labels.begin(), labels.end(), [&](const CodedLabels* range) { return header_like(*range, next, span.end); }))
        throw Error(word + " " + std::to_string(at + 1) + " (" + name_list(firsts) + ") and " + word + " " +
                    std::to_string(next + 1) + " (" + name_list(texts_at(labels, next)) + ") both look like headers: "
                    "texts found nowhere else in their " + (labels.size() > 1 ? "ranges" : "range") + ", above the "
                    "records; start every range at its " + word + " " + std::to_string(next + 2) + ", below the "
                    "header, leaving out the title above it");

    for (const CodedLabels* range : labels) {
        if (!range->whole_line || !unique_text_at(*range, at, span.end)) continue;
        span.first = at + 1;
        span.header = true;
        span.remarks.push_back(line + what + " was read as a header and left out, since " + cell_text_at(*range, at) +
                               " is a text found nowhere else in its whole " + (along_row ? "row" : "column") +
                               "; if it is a record, select the records as a range (for example " +
                               (along_row ? "A1:Z1" : "A1:A500") + ") instead of the whole " +
                               (along_row ? "row." : "column."));
        return span;
    }
    if (at == 0 && first_weight != nullptr && first_weight->is_text() &&
        std::all_of(labels.begin(), labels.end(), [](const CodedLabels* range) {
            return range->codes.empty() || range->codes[0] == CodedLabels::blank || is_text_code(*range, range->codes[0]);
        })) {
        span.first = 1;
        span.header = true;
        span.remarks.push_back(line + what + " was read as a header and left out, since its weight is the text " +
                               quoted_label(first_weight->as_text()) + ".");
        return span;
    }
    // Ranges drawn with their header (A1:A500): the first row is a header when every range looks drawn
    // with its header (header_like). ASSOC.LEVELS decides so for its one range, so ranges that disagree
    // are refused: either choice would misalign the counts with the levels of one range.
    std::size_t headers = 0;
    for (const CodedLabels* range : labels)
        if (header_like(*range, at, span.end)) ++headers;
    if (headers == labels.size()) {
        span.first = at + 1;
        span.header = true;
        span.remarks.push_back(line + what + " was read as a header and left out, since " +
                               (labels.size() > 1 ? std::string("each is a text found nowhere else in its range")
                                                  : cell_text_at(shape, at) + " is a text found nowhere else in its range") +
                               " above records whose labels repeat; if it is a record, move it to another " + word +
                               " of the range.");
        return span;
    }
    if (headers > 0)
        throw Error(word + " " + std::to_string(at + 1) + what + " may be a header or a record: in some ranges it looks "
                    "like a header (a text found nowhere else, above records whose labels repeat), in others it does "
                    "not; if " + word + " " + std::to_string(at + 1) + " is a header, start every range one " + word +
                    " later; if it is a record, move it to another " + word + " of the ranges");
    return span;
}

// Whether, in every range but `range`, the last record holds a number where the records above hold a
// text: "Count | 250" under records of departments and answers. A count word alone is no sign, since
// "N" may be an answer (and a line with a blank beside it is skipped, and said, as any record with a
// blank label).
bool others_hold_a_stray_number(const std::vector<const CodedLabels*>& labels, const CodedLabels* range,
                                const RecordSpan& span) {
    if (labels.size() < 2) return false;
    const std::size_t last = span.end - 1;
    for (const CodedLabels* other : labels) {
        if (other == range) continue;
        if (blank_at(*other, last) || is_text_code(*other, other->codes[last])) return false;
        bool text_above = false;
        for (std::size_t i = span.first; i < last && !text_above; ++i)
            text_above = !blank_at(*other, i) && is_text_code(*other, other->codes[i]);
        if (!text_above) return false;
    }
    return true;
}

// A list of records that ends in a line such as "Total | 250" or "Count | 250" (the count of the
// records above, typed under them): that line is no record, and counting it would add a level of one person. It is refused
// rather than left out, since ASSOC.LEVELS on another range of the same records cannot see it and
// would list its other cells as a level. A total word counts only when it comes once in its range,
// last: an answer "All" given by several people is a record.
void refuse_total_line_at_end(const std::vector<const CodedLabels*>& labels, const RecordSpan& span) {
    if (span.end <= span.first + 1) return;
    const std::size_t last = span.end - 1;
    for (const CodedLabels* range : labels) {
        if (last >= range->codes.size() || !is_text_code(*range, range->codes[last])) continue;
        const std::string& text = range->spellings[range->codes[last]].as_text();
        if (!is_total_label(text) && !(names_a_count(text) && others_hold_a_stray_number(labels, range, span)))
            continue;
        const std::string_view trimmed = trimmed_label(text);
        bool once = true;
        for (std::size_t i = span.first; i < last && once; ++i) {
            const std::uint32_t code = range->codes[i];
            once = !(is_text_code(*range, code) && trimmed_label(range->spellings[code].as_text()) == trimmed);
        }
        if (!once) continue;
        const bool several = labels.size() > 1;
        throw Error("the last record, " + record_place(*range, last) + ", holds " + quoted_label(text) +
                    ", which reads as a total line under the records rather than a record: leave it out of the " +
                    (several ? "ranges" : "range") + " (Assoc counts the records itself); if it is a record, "
                    "move it up among the others");
    }
}

// Records whose every cell is a text found nowhere else in its range but in records identical to
// them: a header repeated among the records (a report pasted page by page) or a note. The same texts
// on top of the records and again further down are such a header, counted as records: refused,
// naming them (set aside, they would misalign the counts with ASSOC.LEVELS on one of the ranges, which
// cannot tell). Found lower down, they may be a small group of their own (the one person of a
// department who gave an answer no one else gave), so they are counted and said. Only with two ranges
// or more, among at least 6 records whose labels repeat in every range, and at most 3 such groups.
void look_for_repeated_headers(const std::vector<const CodedLabels*>& labels, RecordSpan& span) {
    if (labels.size() < 2 || span.end < span.first + 6) return;
    const std::size_t ranges = labels.size();
    constexpr std::size_t none = static_cast<std::size_t>(-1);
    // Every range's spellings as levels (equal texts one level, each number its own) and their counts.
    std::vector<std::vector<std::size_t>> level(ranges), count(ranges);
    for (std::size_t r = 0; r < ranges; ++r) {
        const CodedLabels& range = *labels[r];
        std::unordered_map<std::string_view, std::size_t> texts;
        level[r].resize(range.spellings.size());
        for (std::size_t s = 0; s < range.spellings.size(); ++s)
            level[r][s] = range.spellings[s].is_text()
                              ? texts.emplace(trimmed_label(range.spellings[s].as_text()), texts.size()).first->second
                              : range.spellings.size() + s;
        std::vector<std::size_t> by_code(range.spellings.size(), 0);
        const std::size_t end = std::min(span.end, range.codes.size());
        for (std::size_t i = span.first; i < end; ++i)
            if (range.codes[i] != CodedLabels::blank) ++by_code[range.codes[i]];
        count[r].assign(2 * range.spellings.size(), 0);
        for (std::size_t s = 0; s < by_code.size(); ++s) count[r][level[r][s]] += by_code[s];
    }
    // The cheap test first (it runs on every call): such a line's texts come equally often in every
    // range, so some count of a text must be found in every range.
    std::vector<std::size_t> shared_counts;
    for (std::size_t r = 0; r < ranges; ++r) {
        std::vector<std::size_t> counts;
        for (std::size_t s = 0; s < labels[r]->spellings.size(); ++s)
            if (labels[r]->spellings[s].is_text() && count[r][level[r][s]] > 0) counts.push_back(count[r][level[r][s]]);
        std::sort(counts.begin(), counts.end());
        if (r == 0) {
            shared_counts = std::move(counts);
        } else {
            std::vector<std::size_t> both;
            std::set_intersection(shared_counts.begin(), shared_counts.end(), counts.begin(), counts.end(), std::back_inserter(both));
            shared_counts = std::move(both);
        }
        if (shared_counts.empty()) return;
    }
    const auto level_at = [&](std::size_t r, std::size_t i) { return level[r][labels[r]->codes[i]]; };
    // A candidate holds texts in every range, each as often as the others: the group of its level in
    // the first range, if every record of it is identical, is such a line.
    std::vector<std::size_t> first_of(count[0].size(), none);
    std::vector<bool> identical(count[0].size(), true);
    for (std::size_t i = span.first; i < span.end; ++i) {
        bool candidate = true;
        for (std::size_t r = 0; r < ranges && candidate; ++r)
            candidate = is_text_code(*labels[r], blank_at(*labels[r], i) ? CodedLabels::blank : labels[r]->codes[i]) &&
                        count[r][level_at(r, i)] == count[0][level_at(0, i)];
        const std::size_t group = blank_at(*labels[0], i) ? none : level_at(0, i);
        if (group == none) continue;
        if (!candidate) {
            identical[group] = false;
            continue;
        }
        if (first_of[group] == none) {
            first_of[group] = i;
            continue;
        }
        for (std::size_t r = 1; r < ranges && identical[group]; ++r)
            identical[group] = level_at(r, i) == level_at(r, first_of[group]);
    }
    std::vector<std::size_t> groups;
    for (std::size_t g = 0; g < first_of.size(); ++g)
        if (first_of[g] != none && identical[g]) groups.push_back(g);
    if (groups.empty() || groups.size() > 3) return;

    // The other records: at least 6, and in every range some label that repeats and two labels or more.
    std::vector<bool> in_group(span.end, false);
    std::size_t others = 0;
    for (std::size_t i = span.first; i < span.end; ++i) {
        const bool member = !blank_at(*labels[0], i) && first_of[level_at(0, i)] != none && identical[level_at(0, i)];
        in_group[i] = member;
        if (!member && std::any_of(labels.begin(), labels.end(), [&](const CodedLabels* range) { return !blank_at(*range, i); }))
            ++others;
    }
    if (others < 6) return;
    for (std::size_t r = 0; r < ranges; ++r) {
        std::vector<std::size_t> left(count[r].size(), 0);
        for (std::size_t i = span.first; i < span.end; ++i)
            if (!in_group[i] && !blank_at(*labels[r], i)) ++left[level_at(r, i)];
        const std::size_t distinct = static_cast<std::size_t>(std::count_if(left.begin(), left.end(), [](std::size_t n) { return n > 0; }));
        if (distinct < 2 || *std::max_element(left.begin(), left.end()) < 2) return;
    }

    const std::string word = record_word(*labels.front());
    for (std::size_t g : groups) {
        std::vector<std::size_t> places;
        for (std::size_t i = first_of[g]; i < span.end; ++i)
            if (in_group[i] && level_at(0, i) == g) places.push_back(i);
        std::vector<std::string> named;
        for (std::size_t i : places) named.push_back(std::to_string(i + 1));
        const std::string where = word + (places.size() > 1 ? "s " + name_list(named, 8) : " " + named.front());
        const std::string what = name_list(texts_at(labels, places.front()));
        if (places.front() == span.first && places.size() > 1 && !span.header)
            throw Error(where + " hold the same texts (" + what + "), found nowhere else in the ranges: a header "
                        "repeated among the records (as in a report pasted page by page), which would be counted as "
                        "records; leave the header out of the ranges and delete its repeats from the records (if they "
                        "are records, sort the records so that another one comes first)");
        span.remarks.push_back(capitalised(where) + (places.size() > 1 ? " hold the same texts (" : " holds texts (") + what +
                               "), found nowhere else in the ranges, and " +
                               (places.size() > 1 ? "were counted as records" : "was counted as a record") +
                               ": if " + (places.size() > 1 ? "they are a header" : "it is a header") +
                               " repeated among the records (as in a report pasted page by page) or a note, leave " +
                               (places.size() > 1 ? "them" : "it") + " out.");
    }
}

}  // namespace

RecordSpan record_span(const std::vector<const CodedLabels*>& labels, const Cell* first_weight, std::size_t weights_end) {
    RecordSpan span = records_and_header(labels, first_weight, weights_end);
    refuse_total_line_at_end(labels, span);
    look_for_repeated_headers(labels, span);
    return span;
}

}  // namespace assoc::detail
