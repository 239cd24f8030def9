// Stacked strata read by their labels: which rows form a stratum, refused when a stratum has more or fewer
// than 2 rows, matched by group labels, totals left out.
#include <gtest/gtest.h>

#include <string>

#include "assoc/mantel_haenszel.hpp"
#include "assoc/strata.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;

TEST(StrataLabels, RefuseAStratumColumnWithThreeRowsPerStratumNamingWhatWasFound) {
    expect_error(
        [] {
            read_strata(grid({{"Office", "Group", "Promoted", "Not"},
                              {"North", "Women", 5, 10},
                              {nullptr, "Men", 7, 9},
                              {nullptr, "Not stated", 1, 2},
                              {"South", "Women", 4, 11},
                              {nullptr, "Men", 6, 8},
                              {nullptr, "Not stated", 1, 3}}));
        },
        "the strata are told apart by the first label column, and \"North\" has 3 rows (\"Women\", \"Men\" and \"Not "
        "stated\") and \"South\" has 3 rows (\"Women\", \"Men\" and \"Not stated\"); each stratum needs exactly 2 rows, "
        "one per group (a 2×2 table): leave out or combine the other rows");
}

TEST(StrataLabels, RefuseGroupLabelsThatRepeatEveryThreeRows) {
    expect_error(
        [] {
            read_strata(grid({{"", "Promoted", "Not"},
                              {"Women", 5, 10},
                              {"Men", 7, 9},
                              {"Not stated", 1, 2},
                              {"Women", 4, 11},
                              {"Men", 6, 8},
                              {"Not stated", 1, 3}}));
        },
        "the row labels repeat every 3 rows (\"Women\", \"Men\" and \"Not stated\"), so each stratum has 3 rows; each "
        "stratum needs exactly 2 rows, one per group (a 2×2 table): leave out or combine the other rows, or give a "
        "label column that names the strata");
}

TEST(StrataLabels, ReadTwoRowsPerStratumFromAStratumColumn) {
    const Strata strata = read_strata(grid({{"Office", "Group", "Promoted", "Not"},
                                            {"North", "Women", 5, 10},
                                            {nullptr, "Men", 7, 9},
                                            {"South", "Women", 4, 11},
                                            {nullptr, "Men", 6, 8}}));
    ASSERT_EQ(strata.tables.size(), 2u);
    EXPECT_EQ(strata.tables[1].label, "South");
    EXPECT_EQ(strata.tables[1].a, 4);
    EXPECT_EQ(strata.tables[1].d, 8);
}

// The stratum's name on every row, as a sorted or filtered list has it.
TEST(StrataLabels, ReadAStratumColumnThatNamesTheStratumOnEveryRow) {
    const Strata every = read_strata(grid({{"Office", "Group", "Promoted", "Not"},
                                           {"North", "Women", 5, 10},
                                           {"North", "Men", 7, 9},
                                           {"South", "Women", 4, 11},
                                           {"South", "Men", 6, 8}}));
    const Strata once = read_strata(grid({{"Office", "Group", "Promoted", "Not"},
                                          {"North", "Women", 5, 10},
                                          {nullptr, "Men", 7, 9},
                                          {"South", "Women", 4, 11},
                                          {nullptr, "Men", 6, 8}}));
    ASSERT_EQ(every.tables.size(), 2u);
    EXPECT_EQ(every.tables[1].label, "South");
    EXPECT_EQ(mantel_haenszel_test(every).p_value, mantel_haenszel_test(once).p_value);
}

TEST(StrataLabels, LeaveOutATotalRowInEveryStratumNamedOnEveryRow) {
    const Strata strata = read_strata(grid({{"Office", "Group", "Promoted", "Not"},
                                            {"North", "Women", 5, 10},
                                            {"North", "Men", 7, 9},
                                            {"North", "Total", 12, 19},
                                            {"South", "Women", 4, 11},
                                            {"South", "Men", 6, 8},
                                            {"South", "Total", 10, 19}}));
    ASSERT_EQ(strata.tables.size(), 2u);
    EXPECT_EQ(strata.tables[1].c, 6);
    // The Total row of every stratum: named once, and counted.
    EXPECT_EQ(strata.remarks, (std::vector<std::string>{"The 2 rows \"Total\" are totals and were set aside."}));
}

TEST(StrataLabels, RefuseAStratumNameThatComesBackAfterAnotherStratum) {
    expect_error(
        [] {
            read_strata(grid({{"Office", "Group", "Promoted", "Not"},
                              {"North", "Women", 5, 10},
                              {"South", "Women", 4, 11},
                              {"North", "Men", 7, 9},
                              {"South", "Men", 6, 8}}));
        },
        "the stratum \"North\" comes back at row 4 after rows of another stratum; keep each stratum's rows together "
        "(sort the range by its first column)");
}

TEST(StrataLabels, MatchAStratumWhoseGroupsComeInTheOtherOrderAndSaySo) {
    const Strata strata = read_strata(grid({{"Office", "Group", "Promoted", "Not"},
                                            {"North", "Women", 5, 10},
                                            {nullptr, "Men", 7, 9},
                                            {"South", "Men", 6, 8},
                                            {nullptr, "Women", 4, 11}}));
    EXPECT_EQ(strata.tables[1].a, 4);
    EXPECT_EQ(strata.tables[1].c, 6);
    ASSERT_EQ(strata.remarks.size(), 1u);
    EXPECT_EQ(strata.remarks[0], "The rows of \"South\" come in the other order (\"Men\" first); they were matched to "
                                 "\"Women\" and \"Men\" by their labels.");
}

// Groups labelled otherwise in one stratum ("Female" and "Male") are read in their order, and said.
TEST(StrataLabels, ReadAStratumWhoseGroupsCarryOtherLabelsInItsOrderAndSaySo) {
    const Strata strata = read_strata(grid({{"Office", "Group", "Promoted", "Not"},
                                            {"North", "Women", 5, 10},
                                            {nullptr, "Men", 7, 9},
                                            {"South", "Female", 4, 11},
                                            {nullptr, "Male", 6, 8}}));
    EXPECT_EQ(strata.tables[1].a, 4);
    EXPECT_EQ(strata.tables[1].c, 6);
    ASSERT_EQ(strata.remarks.size(), 1u);
    EXPECT_EQ(strata.remarks[0], "The rows of \"South\" (\"Female\" and \"Male\") carry other labels than those of "
                                 "\"North\" (\"Women\" and \"Men\"); they were read in their order, the first as "
                                 "\"Women\". If they are the same groups, give them the same labels.");
}

// "Men" first and a group called otherwise: which row is which group cannot be told.
TEST(StrataLabels, RefuseAStratumThatSharesAGroupLabelInTheOtherPlace) {
    expect_error(
        [] {
            read_strata(grid({{"Office", "Group", "Promoted", "Not"},
                              {"North", "Women", 5, 10},
                              {nullptr, "Men", 7, 9},
                              {"South", "Men", 6, 8},
                              {nullptr, "Female", 4, 11}}));
        },
        "the rows of \"South\" (\"Men\" and \"Female\") match the groups of \"North\" (\"Women\" and \"Men\") "
        "neither in their order nor the other way round, so which row is which group cannot be told; give every "
        "stratum the same 2 group labels");
}

TEST(StrataLabels, FindStrataNamedOnEachOfTheirRows) {
    const Strata strata = read_strata(grid({{"North", 5, 10}, {"North", 7, 9}, {"South", 4, 11}, {"South", 6, 8}}));
    ASSERT_EQ(strata.tables.size(), 2u);
    EXPECT_EQ(strata.tables[0].label, "North");
    EXPECT_EQ(strata.tables[1].b, 11);
    EXPECT_TRUE(strata.remarks.empty());
}

TEST(StrataLabels, RefuseARunOfNamesThatIsNotTwoRows) {
    expect_error([] { read_strata(grid({{"North", 5, 10}, {"North", 7, 9}, {"South", 4, 11}, {"South", 6, 8}, {"East", 1, 2}})); },
                 "the strata are told apart by their names in the label column, and \"East\" has 1 row (\"East\"); "
                 "each stratum needs exactly 2 rows, one per group (a 2×2 table): leave out or combine the other rows");
}

TEST(StrataLabels, TakeRowsTwoByTwoWhenTheLabelsAreAllDifferentAndSaySo) {
    const Strata strata =
        read_strata(grid({{"North women", 5, 10}, {"North men", 7, 9}, {"South women", 4, 11}, {"South men", 6, 8}}));
    ASSERT_EQ(strata.tables.size(), 2u);
    ASSERT_EQ(strata.remarks.size(), 1u);
    EXPECT_EQ(strata.remarks[0], "The row labels do not show which rows form a stratum, so the rows were taken two by "
                                 "two in order (rows 1–2 the first stratum, and so on); if that is wrong, give a first "
                                 "label column that names the strata.");
}

TEST(StrataLabels, RefuseLabelsThatRepeatInNoPattern) {
    expect_error([] { read_strata(grid({{"Women", 5, 10}, {"Men", 7, 9}, {"Men", 4, 11}, {"Women", 6, 8}, {"Women", 1, 1}, {"Men", 2, 2}})); },
                 "the row labels repeat, but in no pattern that shows which rows form a stratum; give a first label "
                 "column that names each row's stratum, or put each stratum's 2 rows together in the same order");
}

TEST(StrataLabels, LeaveOutATotalRowAndATotalStratum) {
    const Strata with_total_row = read_strata(grid({{"", "a", "b", "c", "d"},
                                                    {"North", 1, 2, 3, 4},
                                                    {"South", 5, 6, 7, 8},
                                                    {"Total", 6, 8, 10, 12}}));
    EXPECT_EQ(with_total_row.tables.size(), 2u);
    EXPECT_EQ(with_total_row.remarks, (std::vector<std::string>{"The row \"Total\" is a total and was set aside."}));
    // Two offices and a third stratum of their sums, named `name`.
    const auto with_sums_named = [](const char* name) {
        return read_strata(grid({{"Office", "Group", "Promoted", "Not"},
                                 {"North", "Women", 5, 10},
                                 {nullptr, "Men", 7, 9},
                                 {"South", "Women", 4, 11},
                                 {nullptr, "Men", 6, 8},
                                 {name, "Women", 9, 21},
                                 {nullptr, "Men", 13, 17}}));
    };
    // "All offices" is no total word, but it names everyone and its rows hold the sums of the other
    // strata's (each row is a sum of two): set aside, and said. A stratum of another name is kept.
    const Strata with_all_offices = with_sums_named("All offices");
    EXPECT_EQ(with_all_offices.tables.size(), 2u);
    EXPECT_EQ(with_all_offices.remarks, (std::vector<std::string>{"The rows of \"All offices\" hold the sums of the "
                                                                  "other strata and were set aside as totals."}));
    EXPECT_EQ(with_sums_named("East").tables.size(), 3u);
    const Strata with_total_word = with_sums_named("Total");
    EXPECT_EQ(with_total_word.tables.size(), 2u);
    EXPECT_EQ(with_total_word.remarks, (std::vector<std::string>{"The rows of \"Total\" were set aside as totals."}));
}

TEST(StrataLabels, ReachTheRemarksOfTheMantelHaenszelTest) {
    const MantelHaenszelResult result = mantel_haenszel_test(
        grid({{"North women", 5, 10}, {"North men", 7, 9}, {"South women", 4, 11}, {"South men", 6, 8}}));
    ASSERT_FALSE(result.remarks.empty());
    EXPECT_EQ(result.remarks[0].rfind("The row labels do not show which rows form a stratum", 0), 0u);
}
