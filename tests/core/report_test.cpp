// The report behind ASSOC.REPORT: which lines, in which order, with which values and words.
#include <gtest/gtest.h>

#include <cmath>
#include <string>
#include <vector>

#include "assoc/report.hpp"
#include "assoc/validity.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;

namespace {

// Agresti (2007), An Introduction to Categorical Data Analysis, 2nd ed., gender × party
// identification (counts read in R's ?chisq.test example, "From Agresti(2007) p.39").
CellGrid party_range(const char* corner) {
    return grid({{corner, "Democrat", "Independent", "Republican"},
                 {"Females", 762, 327, 468},
                 {"Males", 484, 239, 477}});
}

// Fisher's tea-tasting table [[3,1],[1,3]] (Fisher 1935, ch. II; R's ?fisher.test example).
// E = 2 in every cell, so X² = 4·1²/2 = 2 and Yates X² = 4·0.5²/2 = 0.5 exactly, and for
// 1 df P(X² ≥ x) = erfc(√(x/2)) (exact identity).
CountTable tea_table() { return read_count_table(grid({{3, 1}, {1, 3}})); }

std::vector<ReportLine> report_of(const CellGrid& range, double alpha = 0.05) {
    const CountTable table = read_count_table(range);
    ReportOptions options;
    options.alpha = alpha;
    options.variables = variable_names_from_corner(range, table);
    return association_report(table, options);
}

const ReportLine& line(const std::vector<ReportLine>& lines, const std::string& label) {
    for (const ReportLine& l : lines)
        if (l.label == label) return l;
    static const ReportLine missing{"(missing)", Cell::text("no line with this label")};
    ADD_FAILURE() << "no report line labelled " << label;
    return missing;
}

double number(const std::vector<ReportLine>& lines, const std::string& label) {
    const Cell& value = line(lines, label).value;
    EXPECT_TRUE(value.is_number()) << label << " holds " << value.describe();
    return value.as_number();
}

std::string text(const std::vector<ReportLine>& lines, const std::string& label) {
    const Cell& value = line(lines, label).value;
    EXPECT_TRUE(value.is_text()) << label << " holds " << value.describe();
    return value.as_text();
}

}  // namespace

TEST(AssociationReport, ListsItsLinesInAFixedOrder) {
    std::vector<std::string> labels;
    for (const ReportLine& l : report_of(party_range(""))) labels.push_back(l.label);
    EXPECT_EQ(labels, (std::vector<std::string>{
                          "Total count (n)", "Rows with counts", "Columns with counts", "Degrees of freedom",
                          "Pearson X²", "p-value, Pearson X²", "Likelihood-ratio G²", "p-value, G²",
                          "Yates-corrected X²", "p-value, Yates-corrected X²", "p-value, exact test",
                          "Critical X² at 5%", "Decision at 5%", "Cramér's V", "Cramér's V, lower 95% limit",
                          "Cramér's V, upper 95% limit", "Smallest expected count",
                          "Share of cells expecting fewer than 5", "Validity", "Cells that stand out", "Conclusion",
                          "Caution"}));
}

TEST(AssociationReport, GivesTheSizesOfTheAgrestiPartyTable) {
    const auto lines = report_of(party_range(""));
    EXPECT_EQ(number(lines, "Total count (n)"), 2757);
    EXPECT_EQ(number(lines, "Rows with counts"), 2);
    EXPECT_EQ(number(lines, "Columns with counts"), 3);
    EXPECT_EQ(number(lines, "Degrees of freedom"), 2);
}

TEST(AssociationReport, GivesPearsonAndLikelihoodRatioTestsOfTheAgrestiPartyTable) {
    // Agresti (2007) quotes X² ≈ 30.1 and G² ≈ 30.0; full values from scipy 1.10.1
    // chi2_contingency (R 4.2.2 chisq.test agrees), see tests/reference/published_values.md section 3.
    const auto lines = report_of(party_range(""));
    EXPECT_NEAR_REL(number(lines, "Pearson X²"), 30.070149095754672, 1e-12);
    EXPECT_NEAR_REL(number(lines, "p-value, Pearson X²"), 2.9535891832e-07, 1e-9);
    EXPECT_NEAR_REL(number(lines, "Likelihood-ratio G²"), 30.016692613239655, 1e-12);
    EXPECT_NEAR_REL(number(lines, "p-value, G²"), 3.0335979106e-07, 1e-9);
}

TEST(AssociationReport, SaysTheYatesLinesNeedATwoByTwoTable) {
    const auto lines = report_of(party_range(""));
    EXPECT_EQ(text(lines, "Yates-corrected X²"), "2×2 tables only");
    EXPECT_EQ(text(lines, "p-value, Yates-corrected X²"), "2×2 tables only");
}

TEST(AssociationReport, GivesTheYatesTestForATwoByTwoTable) {
    const auto lines = association_report(tea_table());
    EXPECT_NEAR_REL(number(lines, "Yates-corrected X²"), 0.5, 1e-14);
    EXPECT_NEAR_REL(number(lines, "p-value, Yates-corrected X²"), std::erfc(0.5), 1e-12);
    EXPECT_NEAR_REL(number(lines, "Pearson X²"), 2.0, 1e-14);
    EXPECT_NEAR_REL(number(lines, "p-value, Pearson X²"), std::erfc(1.0), 1e-12);
}

TEST(AssociationReport, TakesTheCriticalValueAtTheGivenAlpha) {
    // NIST/SEMATECH e-Handbook 1.3.6.7.4: df 2, upper tail 0.01 → 9.210; scipy 1.10.1 chi2.isf.
    const auto lines = report_of(party_range(""), 0.01);
    EXPECT_NEAR_REL(number(lines, "Critical X² at 1%"), 9.210340371976182, 1e-12);
    EXPECT_EQ(lines[12].label, "Decision at 1%");
}

TEST(AssociationReport, RejectsIndependenceWhenThePValueIsBelowAlpha) {
    const auto lines = report_of(party_range(""));
    EXPECT_EQ(text(lines, "Decision at 5%"),
              "Independence rejected: Pearson X² is above the critical value (p below 5%)");
}

TEST(AssociationReport, KeepsIndependenceWhenThePValueIsAtLeastAlpha) {
    // Tea table: p = erfc(1) ≈ 0.157, so not rejected at 5% but rejected at 20%.
    EXPECT_EQ(text(association_report(tea_table()), "Decision at 5%"),
              "Independence not rejected: Pearson X² is not above the critical value (p of 5% or more)");
    ReportOptions at_twenty_percent;
    at_twenty_percent.alpha = 0.2;
    EXPECT_EQ(text(association_report(tea_table(), at_twenty_percent), "Decision at 20%"),
              "Independence rejected: Pearson X² is above the critical value (p below 20%)");
}

TEST(AssociationReport, GivesCramersVAndTheExpectedCountChecks) {
    // V: scipy 1.10.1 scipy.stats.contingency.association (published_values.md section 3).
    // Smallest E = 1200 · 566 / 2757 (males × independents), an exact identity.
    const auto lines = report_of(party_range(""));
    EXPECT_NEAR_REL(number(lines, "Cramér's V"), 0.10443580236, 1e-10);
    EXPECT_NEAR_REL(number(lines, "Smallest expected count"), 1200.0 * 566.0 / 2757.0, 1e-14);
    EXPECT_EQ(number(lines, "Share of cells expecting fewer than 5"), 0.0);
    EXPECT_EQ(number(association_report(tea_table()), "Share of cells expecting fewer than 5"), 1.0);
}

TEST(AssociationReport, CarriesTheValidityVerdictOfTheCheck) {
    const CountTable table = tea_table();
    EXPECT_EQ(text(association_report(table), "Validity"), check_validity(table).summary());
}

// Agresti's table: V = 0.1044 (published_values.md section 3), w = V for two rows: weak by Cohen's bands.
const std::string party_strength =
    ", but the association is weak: Cramér's V is 0.10 (Cohen's bands for w = V·√(min(rows, columns) − 1): below "
    "0.1 very weak, from 0.1 weak, from 0.3 moderate, from 0.5 strong).";

TEST(AssociationReport, NamesTheVariablesOfTheCornerCellInTheConclusion) {
    EXPECT_EQ(text(report_of(party_range("Gender / Party")), "Conclusion"),
              "At the 5% level, gender and party appear associated (p = 3.0e-07)" + party_strength);
}

// X² = 2,000,000 on 1 degree of freedom: the tail, about exp(−10⁶), is far below the smallest
// double (exact identity for this diagonal table: X² = n), so the p-value is 0 and is said as a bound.
TEST(AssociationReport, SaysAPValueBelowTheSmallestDoubleAsABoundNotAsZero) {
    const std::string conclusion = text(report_of(grid({{"", "Yes", "No"}, {"Group A", 1e6, 0}, {"Group B", 0, 1e6}})),
                                        "Conclusion");
    EXPECT_NE(conclusion.find("(p < 1e-300)"), std::string::npos) << conclusion;
    EXPECT_EQ(conclusion.find("p = 0"), std::string::npos) << conclusion;
}

TEST(AssociationReport, NamesTheHeaderLabelsWhenTheCornerIsBlank) {
    EXPECT_EQ(text(report_of(party_range("")), "Conclusion"),
              "At the 5% level, the rows (Females, Males) and the columns (Democrat, Independent, Republican) "
              "appear associated (p = 3.0e-07)" + party_strength);
}

TEST(AssociationReport, ShortensLongListsOfLabels) {
    const CellGrid range = grid({{"", "a", "b", "c", "d", "e"}, {"x", 10, 20, 30, 40, 50}, {"y", 50, 40, 30, 20, 10}});
    EXPECT_NE(text(report_of(range), "Conclusion").find("the columns (a, b, c, d, …)"), std::string::npos);
}

TEST(AssociationReport, SaysWhenNoAssociationIsShownAndWarnsWhenTheApproximationIsDoubtful) {
    EXPECT_EQ(text(association_report(tea_table()), "Conclusion"),
              "At the 5% level, the data do not show an association between the rows and the columns (p = 0.157). "
              "The chi-squared approximation is doubtful for this table (see the validity line), so this p-value "
              "may be unreliable; the exact test gives p = 0.486.");
}

TEST(AssociationReport, GivesTheExactPValueOfTheTeaTable) {
    // Fisher (1935) via R's ?fisher.test (published_values.md section 2): two-sided p = 34/70.
    EXPECT_NEAR_REL(number(association_report(tea_table()), "p-value, exact test"), 34.0 / 70.0, 1e-12);
}

TEST(AssociationReport, GivesTheExactPValueOfTheAgrestiPartyTable) {
    // R 4.2.2 fisher.test(workspace = 2e8): 3.0274798063936933e-07 (tests/calc/make_reference_values.py).
    EXPECT_NEAR_REL(number(report_of(party_range("")), "p-value, exact test"), 3.0274798063936933e-07, 1e-8);
}

TEST(AssociationReport, SaysWhyTheExactTestStoppedAtItsLimitsAndPointsToTheSimulation) {
    ReportOptions options;
    options.exact_limits = ExactLimits{2.0, 1'000};  // 1,000 bytes: far too little for any 3×3 table
    const auto lines = association_report(read_count_table(grid({{5, 3, 2}, {4, 6, 1}, {2, 2, 7}})), options);
    EXPECT_EQ(text(lines, "p-value, exact test"),
              "Not computed: the exact test for this table needs more memory than allowed (the limit is 2 seconds "
              "and 0.001 MB of working memory); use ASSOC.SIMULATE(range; ; ; \"exact\") for a Monte Carlo estimate of "
              "the exact p-value instead.");
}

TEST(AssociationReport, SaysWeightedCountsHaveNoExactPValue) {
    const auto lines = association_report(read_count_table(grid({{3.5, 1}, {1, 3}})));
    EXPECT_EQ(text(lines, "p-value, exact test"),
              "Not computed: the exact test needs whole counts; this table holds counts that are not whole numbers.");
    EXPECT_EQ(text(lines, "Conclusion").find("the exact test gives"), std::string::npos);
}

TEST(AssociationReport, GivesTheNinetyFivePercentLimitsOfCramersV) {
    // scipy 1.10.1: λ with ncx2.sf(X², 2, λ) = 0.025 and 0.975 (brentq), V = √(λ / 2757)
    // (tests/calc/make_reference_values.py, "party_v_interval").
    const auto lines = report_of(party_range(""));
    EXPECT_NEAR_REL(number(lines, "Cramér's V, lower 95% limit"), 0.06490741810255518, 1e-9);
    EXPECT_NEAR_REL(number(lines, "Cramér's V, upper 95% limit"), 0.14026390466568625, 1e-9);
}

TEST(AssociationReport, NamesTheCellsThatStandOutByTheirLabels) {
    // Agresti (2007) section 2.4.5 (R's ?chisq.test): adjusted residuals 4.50, 0.70, −5.32 for
    // females and the opposite for males. With two rows the males' cells would only repeat the
    // females' with the sign turned, so only the first row is named.
    EXPECT_EQ(text(report_of(party_range("")), "Cells that stand out"),
              "Females × Republican: fewer than expected (adjusted residual -5.3); "
              "Females × Democrat: more than expected (adjusted residual 4.5)");
}

TEST(AssociationReport, NamesCellsByPositionWithoutLabelsAndCountsTheRest) {
    // Invented; statsmodels 0.13.5 Table.standardized_resids: 6.8465 on the diagonal, −3.4233 elsewhere.
    const auto lines = association_report(read_count_table(grid({{30, 5, 5}, {5, 30, 5}, {5, 5, 30}})));
    EXPECT_EQ(text(lines, "Cells that stand out"),
              "row 1 × column 1: more than expected (adjusted residual 6.8); "
              "row 2 × column 2: more than expected (adjusted residual 6.8); "
              "row 3 × column 3: more than expected (adjusted residual 6.8); "
              "and 6 more beyond ±2 (see ASSOC.RESIDUALS)");
}

TEST(AssociationReport, SaysWhenNoCellStandsOut) {
    // Tea table: every adjusted residual is ±√2 (exact identity: (O − E)/√(E·½·½) with O − E = ±1, E = 2).
    EXPECT_EQ(text(association_report(tea_table()), "Cells that stand out"),
              "None: no cell's adjusted residual is beyond ±2");
}

TEST(AssociationReport, EndsWithACautionAboutCauseDiscriminationAndAdvice) {
    const auto lines = association_report(tea_table());
    ASSERT_EQ(lines.back().label, "Caution");
    const std::string caution = lines.back().value.as_text();
    EXPECT_NE(caution.find("not proof of cause, nor of discrimination"), std::string::npos);
    EXPECT_NE(caution.find("small samples can mislead"), std::string::npos);
    EXPECT_NE(caution.find("law and policy and seek qualified advice"), std::string::npos);
}

TEST(AssociationReport, RejectsAnAlphaOutsideZeroAndOne) {
    ReportOptions options;
    options.alpha = 1.5;
    expect_error([&] { association_report(tea_table(), options); },
                 "alpha (the significance level) must lie between 0 and 1, not 1.5");
}

TEST(VariableNamesFromCorner, SplitsAtASlashOrABackslash) {
    const CellGrid range = party_range("Gender \\ Party");
    const VariableNames names = variable_names_from_corner(range, read_count_table(range));
    EXPECT_EQ(names.rows, "gender");
    EXPECT_EQ(names.columns, "party");
}

TEST(VariableNamesFromCorner, KeepsTheCapitalsOfAbbreviations) {
    const CellGrid range = party_range("HR band/Promotion outcome");
    const VariableNames names = variable_names_from_corner(range, read_count_table(range));
    EXPECT_EQ(names.rows, "HR band");
    EXPECT_EQ(names.columns, "promotion outcome");
}

// A corner without "/" is a title ("Gender", "Headcount 2024"): reading it as the rows' name garbled the
// conclusion ("headcount 2024 and the columns … appear associated"), so it names nothing.
TEST(VariableNamesFromCorner, NameNothingWithoutASeparator) {
    for (const char* corner : {"Gender", "Headcount 2024"}) {
        const CellGrid range = party_range(corner);
        const VariableNames names = variable_names_from_corner(range, read_count_table(range));
        EXPECT_EQ(names.rows, "");
        EXPECT_EQ(names.columns, "");
    }
}

TEST(VariableNamesFromCorner, NameNothingWhenOneSideOfTheSeparatorIsEmpty) {
    const CellGrid range = party_range("Gender /");
    const VariableNames names = variable_names_from_corner(range, read_count_table(range));
    EXPECT_EQ(names.rows, "");
    EXPECT_EQ(names.columns, "");
}

TEST(VariableNamesFromCorner, AreEmptyWithoutAHeaderColumn) {
    const CellGrid range = grid({{"Democrat", "Independent", "Republican"}, {762, 327, 468}, {484, 239, 477}});
    const VariableNames names = variable_names_from_corner(range, read_count_table(range));
    EXPECT_EQ(names.rows, "");
    EXPECT_EQ(names.columns, "");
}
