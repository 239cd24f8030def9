// A confidence interval for Cramér's V from the noncentral chi-squared distribution.
#include <gtest/gtest.h>

#include "assoc/cramers_v_interval.hpp"
#include "assoc/effect_size.hpp"
#include "small_sample_values.hpp"
#include "published_tables.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;
using assoc::test::table;
namespace ref = assoc::reference;

// Reference values: mpmath 1.2.1 at 50 digits (Poisson mixture + findroot), with scipy 1.10.1
// ncx2.sf + brentq agreeing to about 1e-15 (small_sample_generate.py).

using assoc::test::published::party;

namespace {
// Invented: training course taken by job level at a fictional firm.
CountTable training() { return table({{25, 12, 8}, {10, 20, 9}, {6, 11, 24}}); }
}  // namespace

TEST(CramersVInterval, MatchesTheInvertedNoncentralChiSquaredForThePartyTable) {
    const CramersVInterval v = cramers_v_interval(party());
    EXPECT_NEAR_REL(v.noncentrality_lower, ref::party_lambda_lower, 1e-9);
    EXPECT_NEAR_REL(v.noncentrality_upper, ref::party_lambda_upper, 1e-9);
    EXPECT_NEAR_REL(v.lower, ref::party_v_lower, 1e-9);
    EXPECT_NEAR_REL(v.upper, ref::party_v_upper, 1e-9);
    EXPECT_NEAR_REL(v.estimate, 0.10443580236, 1e-10);  // published_values.md section 3
}

TEST(CramersVInterval, IsTheSameForARangeWithLabelsAndATotalRowAsTheWorksheetReadsIt) {
    // What ASSOC.VINTERVAL computes: the range read as the worksheet functions read it (headers, a
    // labelled total row set aside), then the interval; the reference values are the bare table's.
    const CountTable labelled = read_count_table(grid({{"Job level / Course", "Safety", "Software", "Leadership"},
                                                       {"Operator", 25, 12, 8},
                                                       {"Specialist", 10, 20, 9},
                                                       {"Manager", 6, 11, 24},
                                                       {"Total", 41, 43, 41}}));
    const CramersVInterval v = cramers_v_interval(labelled);
    EXPECT_NEAR_REL(v.lower, ref::training_v_lower, 1e-9);
    EXPECT_NEAR_REL(v.upper, ref::training_v_upper, 1e-9);
    const CramersVInterval v90 = cramers_v_interval(labelled, 0.90);
    EXPECT_NEAR_REL(v90.lower, ref::training_v_lower_90, 1e-9);
    EXPECT_NEAR_REL(v90.upper, ref::training_v_upper_90, 1e-9);
}

TEST(CramersVInterval, NarrowsForALowerConfidence) {
    const CramersVInterval v = cramers_v_interval(party(), 0.90);
    EXPECT_NEAR_REL(v.lower, ref::party_v_lower_90, 1e-9);
    EXPECT_NEAR_REL(v.upper, ref::party_v_upper_90, 1e-9);
}

TEST(CramersVInterval, MatchesForAThreeByThreeTable) {
    const CramersVInterval v = cramers_v_interval(training());
    EXPECT_NEAR_REL(v.lower, ref::training_v_lower, 1e-9);
    EXPECT_NEAR_REL(v.upper, ref::training_v_upper, 1e-9);
    const CramersVInterval v90 = cramers_v_interval(training(), 0.90);
    EXPECT_NEAR_REL(v90.lower, ref::training_v_lower_90, 1e-9);
    EXPECT_NEAR_REL(v90.upper, ref::training_v_upper_90, 1e-9);
}

TEST(CramersVInterval, MatchesForALargeTableWithAWeakAssociation) {
    // Agresti (2007) alcohol × malformation (published_values.md section 4), n = 32,574.
    const CramersVInterval v = cramers_v_interval(table({{48, 38, 5, 1, 1}, {17066, 14464, 788, 126, 37}}));
    EXPECT_NEAR_REL(v.noncentrality_lower, ref::alcohol_lambda_lower, 1e-8);
    EXPECT_NEAR_REL(v.lower, ref::alcohol_v_lower, 1e-8);
    EXPECT_NEAR_REL(v.upper, ref::alcohol_v_upper, 1e-9);
}

TEST(CramersVInterval, StartsAtZeroWhenTheTestIsNotSignificant) {
    // [[5, 3, 2], [4, 6, 1]]: X² = 1.4, p = 0.50 ≥ α/2, so λ_L = 0 (published_values.md section 11 table).
    const CramersVInterval v = cramers_v_interval(table({{5, 3, 2}, {4, 6, 1}}));
    EXPECT_EQ(v.noncentrality_lower, 0.0);
    EXPECT_EQ(v.lower, 0.0);
    EXPECT_NEAR_REL(v.upper, ref::small_v_upper, 1e-9);
    EXPECT_NEAR_REL(v.noncentrality_upper, ref::small_lambda_upper, 1e-9);
}

TEST(CramersVInterval, IsZeroToZeroForATableExactlyAtIndependence) {
    // X² = 0: P(X ≥ 0 | λ) = 1 for every λ, above both targets.
    const CramersVInterval v = cramers_v_interval(table({{10, 20}, {5, 10}}));
    EXPECT_EQ(v.estimate, 0.0);
    EXPECT_EQ(v.lower, 0.0);
    EXPECT_EQ(v.upper, 0.0);
}

TEST(CramersVInterval, ContainsTheEstimateForAnAssociatedTable) {
    const CramersVInterval v = cramers_v_interval(training());
    EXPECT_NEAR_REL(v.estimate, cramers_v(training()), 1e-15);
    EXPECT_LT(v.lower, v.estimate);
    EXPECT_GT(v.upper, v.estimate);
}

TEST(CramersVInterval, CapsTheUpperBoundAtOne) {
    // A perfectly associated small table: λ_U / (n (k − 1)) exceeds 1, and V cannot.
    const CramersVInterval v = cramers_v_interval(table({{4, 0}, {0, 4}}));
    EXPECT_EQ(v.estimate, 1.0);
    EXPECT_GT(v.noncentrality_upper, 8.0);
    EXPECT_EQ(v.upper, 1.0);
}

TEST(CramersVInterval, RejectsAConfidenceLevelOutsideZeroAndOne) {
    expect_error([] { cramers_v_interval(party(), 1.5); },
                 "the confidence level must lie between 0 and 1 (for example 0.95), not 1.5");
}
