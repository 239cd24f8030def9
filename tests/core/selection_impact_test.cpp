// Selection rates and the four-fifths rule of the US Uniform Guidelines on Employee Selection
// Procedures (1978), 29 CFR 1607.4(D) (rule text read; see tests/reference/published_values.md section 9,
// whose worked example uses invented numbers). Rates and ratios are exact fractions.
#include <gtest/gtest.h>

#include "assoc/selection_impact.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;

namespace {
// published_values.md section 9: G1 48/80, G2 12/30, G3 30/60.
SelectionImpact worked_example() { return selection_impact(grid({{48}, {12}, {30}}), grid({{80}, {30}, {60}})); }
}  // namespace

TEST(SelectionImpact, GivesEachGroupsSelectionRate) {
    const SelectionImpact impact = worked_example();
    ASSERT_EQ(impact.groups.size(), 3u);
    EXPECT_NEAR_REL(impact.groups[0].selection_rate, 0.6, 1e-15);
    EXPECT_NEAR_REL(impact.groups[1].selection_rate, 0.4, 1e-15);
    EXPECT_NEAR_REL(impact.groups[2].selection_rate, 0.5, 1e-15);
}

TEST(SelectionImpact, DividesEachRateByTheHighestRate) {
    const SelectionImpact impact = worked_example();
    EXPECT_EQ(impact.highest_group, 0u);
    EXPECT_NEAR_REL(impact.groups[0].impact_ratio, 1.0, 1e-15);
    EXPECT_NEAR_REL(impact.groups[1].impact_ratio, 2.0 / 3.0, 1e-15);
    EXPECT_NEAR_REL(impact.groups[2].impact_ratio, 5.0 / 6.0, 1e-15);
}

TEST(SelectionImpact, FlagsOnlyTheGroupBelowFourFifths) {
    const SelectionImpact impact = worked_example();
    EXPECT_FALSE(impact.groups[0].below_threshold);
    EXPECT_TRUE(impact.groups[1].below_threshold);
    EXPECT_EQ(impact.groups[1].flag, "below four-fifths of the highest rate");
    EXPECT_FALSE(impact.groups[2].below_threshold);
    EXPECT_EQ(impact.groups[2].flag, "");
}

// The rule says "less than four-fifths": 40/100 against 50/100 is exactly 0.8 and is not flagged.
TEST(SelectionImpact, DoesNotFlagARatioOfExactlyTheThreshold) {
    const SelectionImpact impact = selection_impact(std::vector<double>{50, 40}, std::vector<double>{100, 100});
    EXPECT_FALSE(impact.groups[1].below_threshold);
    // (3/5) / (3/4) is exactly 0.8 too, but the rounded rates give 0.7999999999999999 in doubles.
    const SelectionImpact rounded = selection_impact(std::vector<double>{3, 3}, std::vector<double>{4, 5});
    EXPECT_LT(rounded.groups[1].impact_ratio, 0.8);
    EXPECT_FALSE(rounded.groups[1].below_threshold);
}

TEST(SelectionImpact, UsesAnotherThresholdWithItsOwnWords) {
    const SelectionImpact impact = selection_impact(grid({{48, 12, 30}}), grid({{80, 30, 60}}), 0.9);
    EXPECT_TRUE(impact.groups[2].below_threshold);
    EXPECT_EQ(impact.groups[2].flag, "below 90% of the highest rate");
}

TEST(SelectionImpact, ComesWithACaution) {
    EXPECT_NE(selection_impact_caution().find("not proof of discrimination"), std::string::npos);
}

TEST(SelectionImpact, LeavesAGroupWithNobodyConsideredEmptyAndComparesTheOthers) {
    const SelectionImpact impact = selection_impact(grid({{5}, {0}, {3}}), grid({{10}, {0}, {12}}));
    ASSERT_EQ(impact.groups.size(), 3u);
    EXPECT_FALSE(impact.groups[1].has_rate);
    EXPECT_EQ(impact.groups[1].flag, "no one considered: no selection rate");
    EXPECT_EQ(impact.groups[0].impact_ratio, 1.0);
    EXPECT_EQ(impact.groups[2].impact_ratio, 0.5);  // (3/12) / (5/10), exact
    EXPECT_EQ(impact.remarks, (std::vector<std::string>{
                                  "No one is considered in the group in row 2, so its row of the result is left empty "
                                  "(no selection rate); the other groups were compared."}));
}

TEST(SelectionImpact, RejectsFewerThanTwoGroupsWithPeopleConsidered) {
    expect_error([] { selection_impact(grid({{5}, {0}}), grid({{10}, {0}})); },
                 "comparing selection rates needs at least 2 groups with people considered; only 1 group has any");
}

TEST(SelectionImpact, RejectsAllRatesZero) {
    expect_error([] { selection_impact(grid({{0}, {0}}), grid({{10}, {12}})); },
                 "no one was selected in any group, so there is no highest rate to compare with");
}

TEST(SelectionImpact, RejectsMoreSelectedThanConsidered) {
    expect_error([] { selection_impact(grid({{5}, {13}}), grid({{10}, {12}})); },
                 "the group in row 2 has more selected (13) than considered (12)");
}

TEST(SelectionImpact, SuggestsTheRangesAreSwappedWhenEveryGroupHasMoreSelected) {
    expect_error([] { selection_impact(grid({{80}, {120}}), grid({{12}, {30}})); },
                 "the group in row 1 has more selected (80) than considered (12); every group does, so the ranges may "
                 "be the wrong way round: the selected counts come first, then the considered");
}

// Selection rates typed instead of the number selected (0.15 of 80) gave an impact ratio of rates of
// rates, with no word of doubt.
TEST(SelectionImpact, RejectsRatesOrPercentagesInsteadOfNumbersOfPeople) {
    expect_error([] { selection_impact(grid({{0.15}, {0.25}}), grid({{80}, {120}})); },
                 "the group in row 1 has 0.15 selected of 80 considered; both are numbers of people and must be "
                 "whole: a rate or a percentage (0.15, 15%) goes in neither range, give the number selected and the "
                 "number considered");
}

TEST(SelectionImpact, RejectsRangesOfDifferentLengths) {
    expect_error([] { selection_impact(grid({{5}, {3}, {2}}), grid({{10}, {12}})); },
                 "there are 3 selected counts and 2 considered counts; give both for every group");
}

TEST(SelectionImpact, RejectsTextWhereACountIsNeeded) {
    expect_error([] { selection_impact(grid({{5}, {"few"}}), grid({{10}, {12}})); },
                 "the selected count of the group in row 2 is the text \"few\"; give a number of 0 or more (leave "
                 "both cells blank for a group without counts)");
}

TEST(SelectionImpact, RejectsAThresholdAboveOne) {
    expect_error([] { selection_impact(grid({{5}, {3}}), grid({{10}, {12}}), 80); },
                 "the threshold must be above 0 and at most 1 (0.8 for four-fifths), not 80");
}

// Workbook ranges: a header in row 1, whole columns ending in blanks, a group without counts.
TEST(SelectionImpact, ReadsHeadersAndLeavesOutTheBlanksAfterTheLastGroup) {
    CellGrid selected = grid({{"Selected"}, {12}, {nullptr}, {5}, {9}});
    CellGrid considered = grid({{"Considered"}, {40}, {nullptr}, {30}, {20}});
    selected.set_given_shape(1'048'576, 1);
    considered.set_given_shape(1'048'576, 1);
    const SelectionImpact impact = selection_impact(selected, considered);
    ASSERT_EQ(impact.groups.size(), 4u);
    EXPECT_FALSE(impact.groups[1].has_rate);
    EXPECT_EQ(impact.groups[1].flag, "no counts: no selection rate");
    EXPECT_EQ(impact.highest_group, 3u);  // 9/20 = 0.45 is the highest rate
    EXPECT_EQ(impact.remarks.front(), "Row 1 holds text and was read as a header; the result has one row per group "
                                      "below it.");
}

TEST(SelectionImpact, RefusesAGroupWithOnlyOneOfItsCountsNamingItsRow) {
    expect_error([] { selection_impact(grid({{"Selected"}, {12}, {nullptr}}), grid({{"Considered"}, {40}, {30}})); },
                 "the selected count of the group in row 3 is blank; give a number of 0 or more (leave both cells "
                 "blank for a group without counts)");
}

// Invented: the company's row under its two groups.
TEST(SelectionImpact, RefusesAGroupThatHoldsTheSumsOfTheOthers) {
    expect_error([] { selection_impact(grid({{"Selected"}, {12}, {30}, {42}}), grid({{"Considered"}, {80}, {120}, {200}})); },
                 "the group in row 4 holds the sums of the other groups (42 selected of 200), so it looks like a total, "
                 "and a total is no group to compare with its own parts; leave it out of the ranges");
}

// Invented: offers by office beside the candidates who got none, typed where everyone considered
// belongs; the rates would be offers over the others.
TEST(SelectionImpact, RefusesConsideredCountsHeadedAsThoseNotSelected) {
    for (const char* header : {"Not selected", "Rejected", "non-hired", "Others"}) {
        expect_error([&] { selection_impact(grid({{"Offers"}, {12}, {5}}), grid({{header}, {30}, {25}})); },
                     "the considered counts are headed \"" + std::string(header) + "\", which reads as the people not "
                     "selected; considered means everyone in the group, those selected and the others, so give those "
                     "numbers (the two counts added together)");
    }
    EXPECT_NO_THROW(selection_impact(grid({{"Offers"}, {12}, {5}}), grid({{"Applicants"}, {42}, {30}})));
}
