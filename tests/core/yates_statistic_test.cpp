// Yates' continuity-corrected X² = Σ max(0, |O − E| − ½)²/E, 2×2 tables only.
#include <gtest/gtest.h>

#include "assoc/statistics.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::counts_table;
using assoc::test::expect_error;

TEST(YatesStatistic, IsZeroWhenEveryDeviationIsBelowOneHalf) {
    // [[5, 5], [5, 6]]: |O − E| = |ad − bc|/n = 5/21 < ½ in every cell, so the capped correction
    // leaves nothing. scipy 1.10.1 chi2_contingency(correction=True) gives 0.0 and p = 1.0;
    // an uncapped (|O − E| − ½)² would give a positive statistic.
    const TestResult yates = independence_test(counts_table({{5, 5}, {5, 6}}), Method::yates);
    EXPECT_EQ(yates.statistic, 0.0);
    EXPECT_EQ(yates.p_value, 1.0);
}

TEST(YatesStatistic, SubtractsOneHalfFromEachDeviation) {
    // Exact identity for 2×2 tables with |ad − bc| ≥ n/2: n(|ad − bc| − n/2)²/(r1 r2 c1 c2).
    // [[12, 5], [3, 10]]: 30·(105 − 15)²/(17·13·15·15) = 243000/49725; scipy 1.10.1
    // chi2_contingency(correction=True): 4.886877828054299, p 0.027061581911647092.
    const TestResult yates = independence_test(counts_table({{12, 5}, {3, 10}}), Method::yates);
    EXPECT_NEAR_REL(yates.statistic, 243000.0 / 49725.0, 4e-16);
    EXPECT_NEAR_REL(yates.p_value, 0.027061581911647092, 1e-12);
}

TEST(YatesStatistic, OfTheTeaTastingTableIsOneHalf) {
    // Fisher's tea-tasting table [[3, 1], [1, 3]] (published_values.md section 2): E = 2, |O − E| = 1,
    // so Σ (1 − ½)²/2 = 4·0.125 = 0.5 (exact arithmetic); scipy 1.10.1 gives 0.5, p 0.47950012218695337.
    const TestResult yates = independence_test(counts_table({{3, 1}, {1, 3}}), Method::yates);
    EXPECT_EQ(yates.statistic, 0.5);
    EXPECT_NEAR_REL(yates.p_value, 0.47950012218695337, 1e-12);
}

TEST(YatesStatistic, IsNeverAbovePearsonsStatistic) {
    for (const CountTable& t : {counts_table({{12, 5}, {3, 10}}), counts_table({{0, 10}, {5, 5}}),
                                counts_table({{189, 10845}, {104, 10933}}), counts_table({{5, 5}, {5, 6}})})
        EXPECT_LE(yates_statistic(t), pearson_statistic(t));
}

TEST(YatesStatistic, RejectsATableLargerThanTwoByTwo) {
    expect_error([] { yates_statistic(counts_table({{1, 2, 3}, {4, 5, 6}})); },
                 "Yates' correction applies to 2×2 tables only; this table has 2 rows and 3 columns with counts");
}

TEST(YatesStatistic, JudgesTheShapeAfterSettingAsideEmptyRows) {
    // A 3×2 range whose middle row is empty is a 2×2 table.
    EXPECT_EQ(yates_statistic(counts_table({{3, 1}, {0, 0}, {1, 3}})), 0.5);
}
