// Two-sided p-values of the cells' adjusted residuals, adjusted for the number of cells.
#include <gtest/gtest.h>

#include "assoc/cell_p_values.hpp"
#include "small_sample_values.hpp"
#include "published_tables.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::table;
namespace ref = assoc::reference;

using assoc::test::published::party;

namespace {

void expect_cells(const Matrix& p, const double (&expected)[6], double tolerance) {
    ASSERT_EQ(p.rows(), 2u);
    ASSERT_EQ(p.columns(), 3u);
    for (std::size_t i = 0; i < 6; ++i) EXPECT_NEAR_REL(p.values()[i], expected[i], tolerance) << "cell " << i;
}
}  // namespace

TEST(CellPValues, MatchTwiceTheNormalTailOfTheAdjustedResiduals) {
    // statsmodels 0.13.5 standardized_resids and 2·scipy 1.10.1 norm.sf(|z|).
    expect_cells(cell_p_values(party(), PAdjustment::none), ref::party_cell_p_none, 1e-9);
}

TEST(CellPValues, AdjustAcrossAllCellsByHolmByDefault) {
    // statsmodels 0.13.5 multipletests(method="holm") over the six cells.
    expect_cells(cell_p_values(party()), ref::party_cell_p_holm, 1e-9);
}

TEST(CellPValues, AdjustByBonferroniWhenAsked) {
    expect_cells(cell_p_values(party(), PAdjustment::bonferroni), ref::party_cell_p_bonferroni, 1e-9);
}

TEST(CellPValues, StayAccurateForATinyPValue) {
    // mpmath 1.2.1 erfc(|z|/√2) at 50 digits: about 1e-23, where 1 − Φ would give 0.
    const Matrix p = cell_p_values(table({{60, 2}, {3, 55}}), PAdjustment::none);
    EXPECT_NEAR_REL(p(0, 0), ref::strong_cell_p, 1e-12);
}

TEST(CellPValues, AreEqualInAllFourCellsOfATwoByTwoTable) {
    // Exact identity: the four adjusted residuals of a 2×2 table have the same size.
    const Matrix p = cell_p_values(table({{12, 5}, {7, 14}}), PAdjustment::none);
    for (double value : p.values()) EXPECT_NEAR_REL(value, p(0, 0), 1e-13);
}

TEST(CellPValues, CountOnlyTheKeptCellsAndSpreadBackToTheRangeShape) {
    const CountTable with_empty_row = table({{762, 327, 468}, {0, 0, 0}, {484, 239, 477}});
    const Matrix kept = cell_p_values(with_empty_row);
    expect_cells(kept, ref::party_cell_p_holm, 1e-9);
    const Matrix body = with_empty_row.to_body_shape(kept, 1.0);
    EXPECT_EQ(body.rows(), 3u);
    EXPECT_EQ(body(1, 1), 1.0);
    EXPECT_NEAR_REL(body(2, 0), ref::party_cell_p_holm[3], 1e-9);
}

TEST(CellPValues, RejectATableWithASingleRow) {
    ReadOptions options;
    options.require_two_by_two = false;
    const CountTable one_row = read_count_table(assoc::test::grid({{3, 4, 5}}), options);
    expect_error([&] { cell_p_values(one_row); }, "testing cells needs at least 2 rows and 2 columns with counts");
}
