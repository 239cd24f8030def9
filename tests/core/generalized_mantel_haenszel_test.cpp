// The generalized Cochran–Mantel–Haenszel test of general association across r×c strata
// (ASSOC.WITHIN). Expected values: R 4.2.2 mantelhaen.test on the r×c×K arrays
// (tests/reference/ordered_generate.py) and, for 2×2 strata, the Mantel–Haenszel statistic without
// continuity correction (exact identity; R's value for the admissions data in workflow_r_values.hpp,
// Bickel et al. 1975, published_values.md section 7).
#include <gtest/gtest.h>

#include "assoc/generalized_mantel_haenszel.hpp"
#include "assoc/mantel_haenszel.hpp"
#include "ordered_values.hpp"
#include "published_tables.hpp"
#include "test_support.hpp"
#include "workflow_r_values.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;
namespace ref = assoc::reference::ordered_values;
namespace r = assoc::reference::r_values;

namespace {

// The long layout of K strata of R×C counts: stratum label, row label, counts; with a header row.
template <std::size_t K, std::size_t R, std::size_t C>
CellGrid long_layout(const double (&counts)[K][R][C]) {
    CellGrid range(1 + K * R, 2 + C);
    range.at(0, 0) = Cell::text("Stratum");
    range.at(0, 1) = Cell::text("Row");
    for (std::size_t c = 0; c < C; ++c) range.at(0, 2 + c) = Cell::text("Column " + std::to_string(c + 1));
    for (std::size_t k = 0; k < K; ++k)
        for (std::size_t r = 0; r < R; ++r) {
            const std::size_t row = 1 + k * R + r;
            range.at(row, 0) = Cell::text("Stratum " + std::to_string(k + 1));
            range.at(row, 1) = Cell::text("Row " + std::to_string(r + 1));
            for (std::size_t c = 0; c < C; ++c) range.at(row, 2 + c) = Cell::number(counts[k][r][c]);
        }
    return range;
}

// Bickel et al. (1975), one stratum per department: rows men, women; columns admitted, rejected.
CellGrid admissions_long() {
    const CellGrid wide = test::published::admissions();
    CellGrid range(1 + 2 * (wide.rows() - 1), 4);
    range.at(0, 2) = Cell::text("admitted");
    range.at(0, 3) = Cell::text("rejected");
    for (std::size_t k = 1; k < wide.rows(); ++k) {
        for (std::size_t sex = 0; sex < 2; ++sex) {
            const std::size_t row = 1 + 2 * (k - 1) + sex;
            range.at(row, 0) = wide.at(k, 0);
            range.at(row, 1) = Cell::text(sex == 0 ? "men" : "women");
            range.at(row, 2) = wide.at(k, 1 + 2 * sex);
            range.at(row, 3) = wide.at(k, 2 + 2 * sex);
        }
    }
    return range;
}

}  // namespace

TEST(GeneralAssociation, MatchesRsMantelhaenTestOnThreeByFourStrata) {
    const GeneralAssociationResult result = general_association_test(long_layout(ref::office_counts));
    EXPECT_NEAR_REL(result.statistic, ref::office_within_statistic, 1e-10);
    EXPECT_NEAR_REL(result.p_value, ref::office_within_p, 1e-10);
    EXPECT_EQ(result.df, ref::office_within_df);
    EXPECT_EQ(result.strata_used, 3u);
}

TEST(GeneralAssociation, MatchesRsMantelhaenTestOnTwoByThreeStrata) {
    const GeneralAssociationResult result = general_association_test(long_layout(ref::channel_counts));
    EXPECT_NEAR_REL(result.statistic, ref::channel_within_statistic, 1e-10);
    EXPECT_NEAR_REL(result.p_value, ref::channel_within_p, 1e-10);
    EXPECT_EQ(result.df, ref::channel_within_df);
}

// Exact identity: with 2×2 strata the statistic is the Mantel–Haenszel χ² without the continuity correction.
TEST(GeneralAssociation, IsTheUncorrectedMantelHaenszelStatisticForTwoByTwoStrata) {
    const GeneralAssociationResult result = general_association_test(admissions_long());
    const MantelHaenszelResult mh = mantel_haenszel_test(test::published::admissions(), Continuity::uncorrected);
    EXPECT_NEAR_REL(result.statistic, mh.statistic, 1e-12);
    EXPECT_NEAR_REL(result.statistic, r::ucb_mh_statistic_uncorrected, 1e-10);
    EXPECT_NEAR_REL(result.p_value, r::ucb_mh_p_uncorrected, 1e-10);
    EXPECT_EQ(result.df, 1.0);
}

TEST(GeneralAssociation, SetsAsideAndNamesAStratumWithOneRow) {
    CellGrid range = long_layout(ref::channel_counts);
    CellGrid extended(range.rows() + 2, range.columns());
    for (std::size_t r = 0; r < range.rows(); ++r)
        for (std::size_t c = 0; c < range.columns(); ++c) extended.at(r, c) = range.at(r, c);
    // A fifth channel with only North staff: it adds nothing, and the result is unchanged.
    const std::vector<Cell> north = {Cell::text("Stratum 5"), Cell::text("Row 1"), Cell::number(4), Cell::number(2),
                                     Cell::number(1)};
    const std::vector<Cell> south = {Cell::text("Stratum 5"), Cell::text("Row 2"), Cell(), Cell(), Cell()};
    for (std::size_t c = 0; c < 5; ++c) {
        extended.at(range.rows(), c) = north[c];
        extended.at(range.rows() + 1, c) = south[c];
    }
    const GeneralAssociationResult result = general_association_test(extended);
    EXPECT_NEAR_REL(result.statistic, ref::channel_within_statistic, 1e-10);
    EXPECT_EQ(result.strata_used, 4u);
    EXPECT_EQ(result.remarks, (std::vector<std::string>{
                                  "The stratum \"Stratum 5\" has fewer than 2 rows or 2 columns with counts and adds "
                                  "nothing to the test."}));
}

TEST(GeneralAssociation, SetsAsideAColumnWithoutCounts) {
    const GeneralAssociationResult result = general_association_test(grid({{"S", "R", "Low", "Mid", "High"},
                                                                          {"A", "x", 5, 0, 3},
                                                                          {"A", "y", 2, 0, 6},
                                                                          {"B", "x", 4, 0, 4},
                                                                          {"B", "y", 1, 0, 7}}));
    EXPECT_EQ(result.df, 1.0);
    EXPECT_EQ(result.remarks, (std::vector<std::string>{"The column of counts 2 (\"Mid\") has no counts in the strata "
                                                        "used and takes no part in the test."}));
}

TEST(GeneralAssociation, RefusesStrataThatCannotCompareEveryRowWithEveryColumn) {
    // Each office has only two of the three departments and two of the three ratings, and they
    // share only one of each: the summed variance is singular.
    expect_error([] {
        general_association_test(grid({{"A", "x", 3, 4, nullptr}, {"A", "y", 5, 1, nullptr},
                                       {"B", "y", nullptr, 2, 6}, {"B", "z", nullptr, 7, 3}}));
    },
                 "the strata together cannot compare every row with every column (each stratum compares only the rows "
                 "and columns that hold counts in it, and here they do not overlap enough); combine sparse categories "
                 "or strata");
}

TEST(GeneralAssociation, RefusesRangesWithoutAnInformativeStratum) {
    expect_error([] { general_association_test(grid({{"A", "x", 3, 4}, {"B", "x", 5, 1}})); },
                 "no stratum has counts in at least 2 rows and 2 columns, so there is nothing to test");
}

TEST(GeneralAssociation, StopsWithAMessageBeyondItsLimits) {
    GeneralAssociationLimits limits;
    limits.max_dimension = 5;
    expect_error([&] { general_association_test(long_layout(ref::office_counts), limits); },
                 "the test across strata compares (rows − 1) × (columns − 1) = 6 cells at once, and it handles at most "
                 "5; combine categories");
}
