// The order of texts: the Unicode Collation Algorithm's default order (through ICU), ties by code
// points. Expected orders come from an independent implementation of the algorithm, Perl's
// Unicode::Collate 1.31 (tests/reference/collation_generate.pl wrote collation_values.hpp).
#include <gtest/gtest.h>

#include <algorithm>
#include <string>
#include <string_view>
#include <vector>

#include "assoc/counts_from_records.hpp"
#include "assoc/levels.hpp"
#include "assoc/text_collation.hpp"
#include "collation_values.hpp"
#include "test_support.hpp"

using namespace assoc;
namespace expected = assoc::reference::collation;

namespace {

CellGrid column_of(const std::vector<std::string>& labels) {
    CellGrid column(labels.size(), 1);
    for (std::size_t i = 0; i < labels.size(); ++i) column.at(i, 0) = Cell::text(labels[i]);
    return column;
}

std::vector<std::string> sorted_texts(const std::vector<std::string>& labels,
                                      const TextCollation& collation = unicode_collation()) {
    // Each label twice, so that no first label stands alone above the others as a header does.
    std::vector<std::string> twice = labels;
    twice.insert(twice.end(), labels.begin(), labels.end());
    std::vector<std::string> texts;
    for (const Cell& level : distinct_levels(column_of(twice), LevelOrder::sorted, collation))
        texts.push_back(level.as_text());
    return texts;
}

// A stand-in for a host's collation: reverse code-point order, with "a" and "A" tied.
class ReverseCollation final : public TextCollation {
public:
    std::vector<std::size_t> ranks(const std::vector<std::string_view>& texts) const override {
        ++calls;
        return ranks_by_comparison(texts.size(), [&](std::size_t i, std::size_t j) {
            const std::string a = folded(texts[i]), b = folded(texts[j]);
            return a == b ? 0 : (a > b ? -1 : 1);
        });
    }
    mutable int calls = 0;

private:
    static std::string folded(std::string_view text) { return text == "A" ? "a" : std::string(text); }
};

}  // namespace

TEST(TextOrder, SortsAccentedLettersWithTheirBaseLettersNotAfterZ) {
    EXPECT_EQ(sorted_texts(expected::accented_latin_labels), expected::accented_latin_sorted);
}

TEST(TextOrder, SortsGreekCyrillicHebrewArabicAndHanAfterLatinEachInItsOwnOrder) {
    EXPECT_EQ(sorted_texts(expected::non_latin_labels), expected::non_latin_sorted);
}

TEST(TextOrder, PutsLowerCaseFirstAmongTextsThatDifferOnlyInCase) {
    EXPECT_EQ(sorted_texts(expected::case_variants_labels), expected::case_variants_sorted);
}

TEST(TextOrder, LetsAccentsDecideBeforeCase) {
    EXPECT_EQ(sorted_texts(expected::accents_before_case_labels), expected::accents_before_case_sorted);
}

TEST(TextOrder, PutsSpacesAndPunctuationBeforeLettersAndDigits) {
    EXPECT_EQ(sorted_texts(expected::spaces_and_punctuation_labels), expected::spaces_and_punctuation_sorted);
}

TEST(TextOrder, OrdersEquivalentSpellingsOfOneWordByCodePoints) {
    EXPECT_EQ(sorted_texts(expected::equivalent_spellings_labels), expected::equivalent_spellings_sorted);
}

TEST(TextOrder, FollowsALanguagesTailoringWhenGivenItsLocale) {
    EXPECT_EQ(sorted_texts(expected::swedish_labels, UnicodeCollation("sv")), expected::swedish_sorted);
    EXPECT_EQ(sorted_texts(expected::swedish_labels), expected::swedish_in_default_order_sorted);
}

TEST(TextOrder, GivesTheSameOrderWhateverTheOrderOfTheRecords) {
    std::vector<std::string> labels = expected::accented_latin_labels;
    for (const auto& more : {expected::non_latin_labels, expected::equivalent_spellings_labels})
        labels.insert(labels.end(), more.begin(), more.end());
    const std::vector<std::string> first = sorted_texts(labels);
    std::reverse(labels.begin(), labels.end());
    EXPECT_EQ(sorted_texts(labels), first);
    std::rotate(labels.begin(), labels.begin() + 7, labels.end());
    EXPECT_EQ(sorted_texts(labels), first);
}

TEST(TextOrder, ListsNumbersBeforeTexts) {
    const auto levels = distinct_levels(test::grid({{"Éclair"}, {3}, {"apple"}, {-1}}));
    EXPECT_EQ(levels, (std::vector<Cell>{Cell::number(-1), Cell::number(3), Cell::text("apple"), Cell::text("Éclair")}));
}

TEST(TextOrder, ReadsBytesThatAreNotUtf8AsReplacementCharactersWithoutFailing) {
    const std::vector<std::string> labels{"b", std::string("\xff\xfe", 2), "a", std::string("a\x80", 2)};
    const std::vector<std::string> sorted = sorted_texts(labels);
    EXPECT_EQ(sorted.size(), 4u);
    EXPECT_EQ(sorted[0], "a");
}

TEST(TextOrder, RefusesALocaleThatIsNotALanguageTag) {
    test::expect_error([] { UnicodeCollation("not a tag!"); },
                       "texts cannot be put in order: \"not a tag!\" is not a language tag such as \"sv\" or \"de-DE\"");
}

TEST(TextOrder, UsesTheCollationAHostGivesAndBreaksItsTiesByCodePoints) {
    const ReverseCollation reverse;
    EXPECT_EQ(sorted_texts({"a", "b", "A", "c"}, reverse), (std::vector<std::string>{"c", "b", "A", "a"}));
    EXPECT_EQ(reverse.calls, 1);  // one call for the whole list
}

TEST(TextOrder, ListsTheRowsAndColumnsOfCountedRecordsInTheSameOrderAsTheLevels) {
    const CellGrid rows = column_of({"Zoll", "Éditions", "archiv", "Éditions"});
    const CellGrid columns = column_of({"Ω", "b", "Ä", "b"});
    const ReverseCollation reverse;
    for (const TextCollation* collation : {&unicode_collation(), static_cast<const TextCollation*>(&reverse)}) {
        const RecordCounts counted = counts_from_records(rows, columns, CellGrid(), LevelOrder::sorted, *collation);
        EXPECT_EQ(counted.row_levels, distinct_levels(rows, LevelOrder::sorted, *collation));
        EXPECT_EQ(counted.column_levels, distinct_levels(columns, LevelOrder::sorted, *collation));
    }
}

TEST(TextOrder, GivesTiedTextsOneRank) {
    const std::vector<int> keys{3, 1, 3, 2};
    const auto ranks = ranks_by_comparison(keys.size(), [&](std::size_t i, std::size_t j) { return keys[i] - keys[j]; });
    EXPECT_EQ(ranks, (std::vector<std::size_t>{2, 0, 2, 1}));
}
