// Holm and Bonferroni adjustment of a family of p-values.
#include <gtest/gtest.h>

#include <iterator>

#include "assoc/p_value_adjustment.hpp"
#include "small_sample_values.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
namespace ref = assoc::reference;

namespace {
std::vector<double> raw() { return {std::begin(ref::adjustment_raw), std::end(ref::adjustment_raw)}; }
}  // namespace

TEST(AdjustPValues, MatchesHolmFromStatsmodelsIncludingTies) {
    // statsmodels 0.13.5 multipletests(method="holm"); the two 0.04 are tied.
    const std::vector<double> adjusted = adjust_p_values(raw(), PAdjustment::holm);
    ASSERT_EQ(adjusted.size(), std::size(ref::adjustment_holm));
    for (std::size_t i = 0; i < adjusted.size(); ++i) EXPECT_NEAR_REL(adjusted[i], ref::adjustment_holm[i], 1e-15);
}

TEST(AdjustPValues, MatchesBonferroniFromStatsmodelsCappedAtOne) {
    // statsmodels 0.13.5 multipletests(method="bonferroni").
    const std::vector<double> adjusted = adjust_p_values(raw(), PAdjustment::bonferroni);
    for (std::size_t i = 0; i < adjusted.size(); ++i)
        EXPECT_NEAR_REL(adjusted[i], ref::adjustment_bonferroni[i], 1e-15);
}

TEST(AdjustPValues, LeavesThePValuesAloneWithNone) {
    EXPECT_EQ(adjust_p_values(raw(), PAdjustment::none), raw());
}

TEST(AdjustPValues, NeverGivesHolmAboveBonferroni) {
    // Holm's factors m − i + 1 never exceed Bonferroni's m (Holm 1979).
    const std::vector<double> holm = adjust_p_values(raw(), PAdjustment::holm);
    const std::vector<double> bonferroni = adjust_p_values(raw(), PAdjustment::bonferroni);
    for (std::size_t i = 0; i < holm.size(); ++i) EXPECT_LE(holm[i], bonferroni[i]);
}

TEST(AdjustPValues, ReturnsAnEmptyListForNoPValues) {
    EXPECT_TRUE(adjust_p_values({}, PAdjustment::holm).empty());
}

TEST(AdjustPValues, RejectsAValueOutsideZeroAndOne) {
    expect_error([] { adjust_p_values({0.2, 1.5}, PAdjustment::holm); }, "a p-value must lie between 0 and 1, not 1.5");
}

TEST(PAdjustmentFromWord, ReadsTheThreeWordsInAnyCase) {
    EXPECT_EQ(p_adjustment_from_word("holm"), PAdjustment::holm);
    EXPECT_EQ(p_adjustment_from_word(" Bonferroni "), PAdjustment::bonferroni);
    EXPECT_EQ(p_adjustment_from_word("NONE"), PAdjustment::none);
}

TEST(PAdjustmentFromWord, RejectsAnUnknownWordNamingTheChoices) {
    expect_error([] { p_adjustment_from_word("fdr"); },
                 "the adjustment must be \"holm\", \"bonferroni\" or \"none\", not \"fdr\"");
}
