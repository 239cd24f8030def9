// Words for messages: trimmed and shortened labels, short lists, runs of row numbers, nearest words.
#include <gtest/gtest.h>

#include <string>
#include <vector>

#include "assoc/wording.hpp"

using namespace assoc;

TEST(Wording, TrimsSpacesTabsLineBreaksAndNoBreakSpacesAtBothEnds) {
    EXPECT_EQ(trimmed_label("  No \t"), "No");
    EXPECT_EQ(trimmed_label("\xC2\xA0Yes\xC2\xA0"), "Yes");
    EXPECT_EQ(trimmed_label("Sales  team"), "Sales  team");
    EXPECT_EQ(trimmed_label("   "), "");
}

TEST(Wording, QuotesALabelTrimmedAndCutToFortyCharacters) {
    EXPECT_EQ(quoted_label(" Legal "), "\"Legal\"");
    EXPECT_EQ(quoted_label(std::string(100, 'x')), "\"" + std::string(40, 'x') + "…\"");
    // A cut never splits a character: "é" is 2 bytes in UTF-8.
    const std::string accents = std::string(39, 'a') + "éé";
    EXPECT_EQ(quoted_label(accents), "\"" + std::string(39, 'a') + "…\"");
}

TEST(Wording, NamesAHandfulAndCountsTheRest) {
    EXPECT_EQ(name_list({"a"}), "a");
    EXPECT_EQ(name_list({"a", "b"}), "a and b");
    EXPECT_EQ(name_list({"a", "b", "c"}), "a, b and c");
    EXPECT_EQ(name_list({"a", "b", "c", "d", "e", "f", "g"}), "a, b, c, d, e and 2 more");
}

TEST(Wording, WritesNumbersAsRuns) {
    EXPECT_EQ(number_runs({7, 8, 9, 12}), "7–9 and 12");
    EXPECT_EQ(numbered_lines("row", {40, 7, 8}), "rows 7–8 and 40");
    EXPECT_EQ(numbered_lines("row", {3}), "row 3");
    std::vector<std::size_t> many;
    for (std::size_t i = 1; i <= 1000; i += 2) many.push_back(i);
    const std::string runs = number_runs(many);
    EXPECT_EQ(runs, "1, 3, 5, 7, 9 and 495 more");
}

TEST(Wording, SuggestsTheNearestWords) {
    const std::vector<std::string> words = {"pearson", "g", "yates", "exact", "cramer", "holm", "bonferroni", "phi"};
    EXPECT_EQ(nearest_words("pearsn", words), (std::vector<std::string>{"pearson"}));
    EXPECT_EQ(nearest_words(" Exat ", words), (std::vector<std::string>{"exact"}));
    EXPECT_EQ(nearest_words("bonf", words), (std::vector<std::string>{"bonferroni"}));
    EXPECT_EQ(nearest_words("chi", words), (std::vector<std::string>{"phi"}));
    EXPECT_TRUE(nearest_words("studentized", words).empty());
}
