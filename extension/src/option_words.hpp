#pragma once
// Option words ("pearson", "g", "yates"...): read case-insensitively; an omitted word gives the
// omitted value (usually the first word's), a word of another function that the argument refuses
// on purpose is an error with its reason, and an unknown word an error that lists the accepted ones.
#include <com/sun/star/uno/Any.hxx>
#include <initializer_list>
#include <string>
#include <utility>
#include <vector>

#include "assoc/error.hpp"
#include "assoc/wording.hpp"
#include "uno_values.hpp"

namespace assoc::calc {

// "a", "b" and "c" (each quoted), for messages.
std::string quoted_list(const std::vector<std::string>& words, const char* last_joiner = "and");
// Lower case (ASCII letters only) without surrounding spaces: how option words are compared.
std::string normalized_word(const std::string& text);

template <class Value>
class OptionWords {
public:
    // `omitted`: the value of an omitted argument (usually the first word's). `refused`: words of
    // other functions that this argument turns down with a reason rather than as unknown.
    OptionWords(std::string what, std::initializer_list<std::pair<const char*, Value>> words, Value omitted,
                std::initializer_list<std::pair<const char*, const char*>> refused = {})
        : what_(std::move(what)), words_(words.begin(), words.end()), omitted_(std::move(omitted)),
          refused_(refused.begin(), refused.end()) {}

    // The value of an optional option argument: omitted or empty text gives the omitted value.
    Value read(const css::uno::Any& argument) const {
        const Cell cell = to_cell(argument);
        if (cell.is_blank()) return omitted_;
        // Calc passes a reference to an empty cell as the number 0, so say how to get the default.
        const bool empty_cell = cell.is_number() && cell.as_number() == 0;
        require(cell.is_text(), "the " + what_ + " must be one of the words " + accepted() + ", not " + cell.describe() +
                                    (empty_cell ? " (an empty cell arrives as 0; leave the argument out for the default)" : ""));
        return parse(cell.as_text());
    }

    // The same, for an argument that also takes a range instead of a word (the order of ASSOC.LEVELS):
    // a range (or an inline array) goes to `from_range`, read as to_cell_grid reads ranges.
    template <class FromRange>
    Value read(const css::uno::Any& argument, FromRange from_range) const {
        AnyTable range;
        if (argument >>= range) return from_range(to_cell_grid(range));
        return read(argument);
    }

    Value parse(const std::string& text) const {
        const std::string word = normalized_word(text);
        if (word.empty()) return omitted_;
        for (const auto& [known, value] : words_)
            if (word == known) return value;
        for (const auto& [turned_down, reason] : refused_)
            if (word == turned_down) throw Error("the " + what_ + " \"" + text + "\" cannot be used here: " + reason);
        std::vector<std::string> words;
        for (const auto& entry : words_) words.emplace_back(entry.first);
        const std::vector<std::string> nearest = nearest_words(text, words);
        throw Error("the " + what_ + " " + quoted_label(text) + " is unknown" +
                    (nearest.empty() ? std::string() : " (did you mean " + quoted_list(nearest, "or") + "?)") +
                    "; the accepted words are " + accepted());
    }

private:
    std::string accepted() const {
        std::vector<std::string> words;
        for (const auto& entry : words_) words.emplace_back(entry.first);
        return quoted_list(words);
    }

    std::string what_;
    std::vector<std::pair<const char*, Value>> words_;
    Value omitted_;
    std::vector<std::pair<const char*, const char*>> refused_;
};

}  // namespace assoc::calc
