// A published worked example: Agresti, An Introduction to Categorical Data Analysis, 2nd ed.
// (2007), gender by political party identification. The counts are read in R 4.2.2's
// ?chisq.test example, headed "From Agresti(2007) p.39"; the table numbers (Table 2.5, and
// Table 2.6 for the residuals, section 2.4.5) are (from memory). See published_values.md section 3.
// Each quantity is checked twice: against the figure as published, to the precision printed,
// and against the recomputed value (scipy 1.10.1 chi2_contingency, statsmodels 0.13.5
// Table.standardized_resids, R 4.2.2 chisq.test; pasted from published_values.md section 3 and
// tests/reference/generate_core_values.py) to 1e-10 relative.
#include <gtest/gtest.h>

#include <cmath>

#include "assoc/effect_size.hpp"
#include "assoc/residuals.hpp"
#include "assoc/statistics.hpp"
#include "published_tables.hpp"
#include "test_support.hpp"

using namespace assoc;

// Rows female, male; columns Democrat, Independent, Republican.
using assoc::test::published::party;

TEST(AgrestiPartyIdentification, PearsonStatisticIsThePublishedThirtyPointOne) {
    // Agresti (2007), section 2.4 (p.39, as R's ?chisq.test cites it): X² = 30.1, printed to 1 decimal.
    EXPECT_NEAR(pearson_statistic(party()), 30.1, 0.05);
}

TEST(AgrestiPartyIdentification, PearsonStatisticMatchesTheRecomputedValue) {
    // scipy 1.10.1: 30.070149095754672 (R 4.2.2: 30.0701490957547).
    EXPECT_NEAR_REL(pearson_statistic(party()), 30.070149095754672, 1e-10);
}

TEST(AgrestiPartyIdentification, LikelihoodRatioStatisticIsThePublishedThirtyPointZero) {
    // Agresti (2007), section 2.4: G² = 30.0, printed to 1 decimal.
    EXPECT_NEAR(likelihood_ratio_statistic(party()), 30.0, 0.05);
}

TEST(AgrestiPartyIdentification, LikelihoodRatioStatisticMatchesTheRecomputedValue) {
    // scipy 1.10.1 chi2_contingency(lambda_="log-likelihood"): 30.016692613239655.
    EXPECT_NEAR_REL(likelihood_ratio_statistic(party()), 30.016692613239655, 1e-10);
}

TEST(AgrestiPartyIdentification, HasTwoDegreesOfFreedom) {
    // Agresti (2007): df = (2 − 1)(3 − 1) = 2.
    EXPECT_EQ(degrees_of_freedom(party()), 2.0);
}

TEST(AgrestiPartyIdentification, PValuesMatchTheRecomputedValues) {
    // scipy 1.10.1: 2.9535891832117595e-07 (X²) and 3.0335979106388314e-07 (G²).
    const TestResult pearson = independence_test(party(), Method::pearson);
    const TestResult likelihood = independence_test(party(), Method::likelihood_ratio);
    EXPECT_NEAR_REL(pearson.p_value, 2.9535891832117595e-07, 1e-10);
    EXPECT_NEAR_REL(likelihood.p_value, 3.0335979106388314e-07, 1e-10);
}

TEST(AgrestiPartyIdentification, AdjustedResidualsAreThePublishedOnes) {
    // Agresti (2007) section 2.4.5, p.38 as R's ?chisq.test cites it (Table 2.6, from memory):
    // females 4.50, 0.70, −5.32;
    // males the same with the sign flipped (printed to 2 decimals).
    const Matrix adjusted = residuals(party(), ResidualKind::adjusted);
    const double published[2][3] = {{4.50, 0.70, -5.32}, {-4.50, -0.70, 5.32}};
    for (std::size_t r = 0; r < 2; ++r)
        for (std::size_t c = 0; c < 3; ++c)
            EXPECT_NEAR(adjusted(r, c), published[r][c], 0.005) << "row " << r << ", column " << c;
}

TEST(AgrestiPartyIdentification, AdjustedResidualsMatchTheRecomputedValues) {
    // statsmodels 0.13.5 Table.standardized_resids (= R 4.2.2 chisq.test()$stdres).
    EXPECT_MATRIX_NEAR_REL(residuals(party(), ResidualKind::adjusted),
                           (std::vector<double>{4.502053521086705, 0.6994517329844352, -5.315945542704929,
                                                -4.502053521086705, -0.6994517329844298, 5.315945542704928}),
                           1e-10);
}

TEST(AgrestiPartyIdentification, PearsonResidualsMatchTheRecomputedValues) {
    // statsmodels 0.13.5 Table.resid_pearson (= R 4.2.2 chisq.test()$residuals).
    EXPECT_MATRIX_NEAR_REL(residuals(party(), ResidualKind::pearson),
                           (std::vector<double>{2.198855766015898, 0.41137017005663185, -2.8432397155451494,
                                                -2.504669492560728, -0.46858294710127296, 3.2386734435365825}),
                           1e-10);
}

TEST(AgrestiPartyIdentification, CramersVAndItsBiasCorrectedFormMatchTheRecomputedValues) {
    // scipy 1.10.1 contingency.association(method="cramer"): 0.10443580235646777;
    // Bergsma (2013) corrected V from the formula in numpy 1.24.2: 0.10091998278440886.
    EXPECT_NEAR_REL(cramers_v(party()), 0.10443580235646777, 1e-10);
    EXPECT_NEAR_REL(cramers_v_corrected(party()), 0.10091998278440886, 1e-10);
}
