// The layout of the analysis sheet, as a plan: what each block writes, and that every figure is a
// formula on the source. (tests/calc/command_test.py checks the sheet Calc makes of it.)
#include "analysis_sheet.hpp"

#include <gtest/gtest.h>

#include "palette.hpp"
#include "command_test_support.hpp"
#include "test_support.hpp"

namespace assoc::command {
namespace {

using assoc::test::expect_error;
using assoc::test::grid;
using test::read;

Reading reading_of(const CellGrid& cells, const std::string& sheet = "HR data") {
    return read(test::block(cells, 3, 0, sheet));
}

const CellGrid branches = grid({{"Branch / Outcome", "Cleared", "Queried", "Returned"},
                                {"Northgate", 12, 7, 3},
                                {"Riverside", 5, 14, 8},
                                {"Hillcrest", 9, 4, 11}});
const CellGrid teams = grid({{"Team / Outcome", "Promoted", "Not promoted"}, {"Team A", 18, 7}, {"Team B", 9, 16}});
const std::string source = "$'HR data'.$A$4:$D$7";

// The entry in the cell right of the label `label` in column A.
const Entry* value_of(const SheetPlan& plan, const std::string& label) {
    for (const Entry& entry : plan.entries())
        if (entry.area.column == 0 && entry.kind == Entry::Kind::text && entry.content == label)
            return plan.entry_at(entry.area.row, 1);
    return nullptr;
}

// The entry with `text` in its formula (or in one of a block's formulas), or nullptr.
const Entry* containing(const SheetPlan& plan, const std::string& text) {
    for (const Entry& entry : plan.entries()) {
        if (entry.content.find(text) != std::string::npos) return &entry;
        for (const std::string& formula : entry.block)
            if (formula.find(text) != std::string::npos) return &entry;
    }
    return nullptr;
}

TEST(AnalysisSheet, CallsTheTestFunctionsOnTheSourceRangeWithAbsoluteReferences) {
    const SheetPlan plan = plan_analysis_sheet(reading_of(branches), {}, true);
    ASSERT_NE(value_of(plan, "Pearson X²"), nullptr);
    EXPECT_EQ(value_of(plan, "Pearson X²")->content, "=ASSOC.STATISTIC(" + source + ")");
    EXPECT_EQ(value_of(plan, "p-value")->content, "=ASSOC.PVALUE(" + source + ")");
    EXPECT_EQ(value_of(plan, "Degrees of freedom")->content, "=ASSOC.DF(" + source + ")");
    EXPECT_EQ(value_of(plan, "Likelihood-ratio G²")->content, "=ASSOC.STATISTIC(" + source + ";\"g\")");
    EXPECT_EQ(value_of(plan, "Cramér's V")->content, "=ASSOC.STRENGTH(" + source + ")");
    EXPECT_EQ(value_of(plan, "Verdict (ASSOC.CHECK)")->content, "=ASSOC.CHECK(" + source + ")");
}

TEST(AnalysisSheet, WritesEveryNumberAsAFormulaExceptTheSignificanceLevel) {
    const SheetPlan plan = plan_analysis_sheet(reading_of(branches), {}, true);
    std::size_t numbers = 0;
    for (const Entry& entry : plan.entries()) numbers += entry.kind == Entry::Kind::number ? 1 : 0;
    EXPECT_EQ(numbers, 1u);
    EXPECT_EQ(value_of(plan, "Significance level (alpha)")->number, 0.05);
}

TEST(AnalysisSheet, MirrorsTheSourceCountsAndLabelsWithAbsoluteReferences) {
    const SheetPlan plan = plan_analysis_sheet(reading_of(branches), {}, true);
    ASSERT_NE(containing(plan, "=$'HR data'.$B$5"), nullptr);
    ASSERT_NE(containing(plan, "=$'HR data'.$D$7"), nullptr);
    ASSERT_NE(containing(plan, "=T($'HR data'.$A$6)"), nullptr);
    ASSERT_NE(containing(plan, "=T($'HR data'.$C$4)"), nullptr);
}

TEST(AnalysisSheet, WritesTheCountsOfATableAsOneBlockOfReferences) {
    const SheetPlan plan = plan_analysis_sheet(reading_of(branches), {}, true);
    const Entry* counts = containing(plan, "=$'HR data'.$B$5");
    ASSERT_NE(counts, nullptr);
    EXPECT_EQ(counts->kind, Entry::Kind::formula_block);
    EXPECT_EQ(counts->area.rows, 3u);
    EXPECT_EQ(counts->area.columns, 3u);
    EXPECT_EQ(counts->at(counts->area.row + 2, counts->area.column + 2), "=$'HR data'.$D$7");
}

TEST(AnalysisSheet, ResolvesEveryReferenceBetweenBlocks) {
    for (bool exact_live : {true, false}) {
        const SheetPlan plan = plan_analysis_sheet(reading_of(teams), {}, exact_live);
        EXPECT_EQ(containing(plan, SheetPlan::placeholder("").substr(0, 1)), nullptr);
    }
}

TEST(AnalysisSheet, PutsTheHeatMapOverTheAdjustedResidualArray) {
    const SheetPlan plan = plan_analysis_sheet(reading_of(branches), {}, true);
    const Entry* residuals = containing(plan, "=ASSOC.RESIDUALS(" + source + ";\"adjusted\")");
    ASSERT_NE(residuals, nullptr);
    EXPECT_EQ(residuals->kind, Entry::Kind::array_formula);
    EXPECT_EQ(residuals->area.rows, 3u);
    EXPECT_EQ(residuals->area.columns, 3u);
    ASSERT_EQ(plan.colour_scales().size(), 1u);
    EXPECT_EQ(absolute_area(plan.colour_scales()[0]), absolute_area(residuals->area));
}

TEST(AnalysisSheet, ChartsTheRowPercentagesWithTheirLabels) {
    const SheetPlan plan = plan_analysis_sheet(reading_of(branches), {}, true);
    ASSERT_TRUE(plan.chart().has_value());
    const Area data = plan.chart()->data;
    EXPECT_EQ(data.rows, 4u);
    EXPECT_EQ(data.columns, 4u);
    EXPECT_EQ(plan.content_at(data.row + 1, 1).rfind("=IF(", 0), 0u);
}

TEST(AnalysisSheet, TakesTheExactPValueFromTheReportWhenTheExactTestIsQuick) {
    const SheetPlan plan = plan_analysis_sheet(reading_of(branches), {}, true);
    const Entry* report = containing(plan, "=ASSOC.REPORT(" + source + ";");
    ASSERT_NE(report, nullptr);
    EXPECT_EQ(report->area.rows, report_lines);
    ASSERT_EQ(plan.collapsed_rows().size(), 1u);
    EXPECT_EQ(plan.collapsed_rows()[0].row, report->area.row);
    EXPECT_EQ(value_of(plan, "Exact p-value")->content, "=" + absolute_cell(report->area.row + 10, 1));
}

TEST(AnalysisSheet, LeavesTheReportOutAndSaysWhyWhenTheExactTestIsSlow) {
    const SheetPlan plan = plan_analysis_sheet(reading_of(branches), {}, false);
    EXPECT_EQ(containing(plan, "ASSOC.REPORT(" + source), nullptr);
    EXPECT_EQ(value_of(plan, "Exact p-value")->kind, Entry::Kind::text);
    EXPECT_EQ(value_of(plan, "Exact p-value")->content.rfind("Not on this sheet", 0), 0u);
    EXPECT_TRUE(plan.collapsed_rows().empty());
}

TEST(AnalysisSheet, GivesTheIntervalOfVFromItsOwnFunctionWhetherOrNotTheExactTestIsQuick) {
    for (bool exact_live : {true, false}) {
        const SheetPlan plan = plan_analysis_sheet(reading_of(branches), {}, exact_live);
        const Entry* lower = value_of(plan, "Cramér's V, 95% interval");
        ASSERT_NE(lower, nullptr);
        EXPECT_EQ(lower->content, "=INDEX(ASSOC.VINTERVAL(" + source + ";0.95);1;2)");
        EXPECT_EQ(plan.content_at(lower->area.row, 2), "=INDEX(ASSOC.VINTERVAL(" + source + ";0.95);1;3)");
    }
}

TEST(AnalysisSheet, GivesTheRatesOfTheFirstColumnStraightFromTheSource) {
    const SheetPlan plan = plan_analysis_sheet(reading_of(branches), {}, true);
    const Entry* rates = containing(plan, "=ASSOC.RATES(" + source + ";0.95)");
    ASSERT_NE(rates, nullptr);
    EXPECT_EQ(rates->kind, Entry::Kind::array_formula);
    EXPECT_EQ(rates->area.rows, 3u);
    EXPECT_EQ(rates->area.columns, 4u);
    // Labelled as the observed block (its header in row 8, Northgate in row 9), and named after Cleared.
    EXPECT_EQ(plan.content_at(rates->area.row, 0), "=$A$9");
    EXPECT_EQ(plan.content_at(rates->area.row - 1, 2), "=\"Rate of \"&$B$8");
}

TEST(AnalysisSheet, ArrangesTheCountsForTheRatesWhenTheOutcomeIsAnotherColumn) {
    CommandOptions options;
    options.outcome_column = 2;  // "Returned"
    const SheetPlan plan = plan_analysis_sheet(reading_of(branches), options, true);
    const Entry* rates = containing(plan, "=ASSOC.RATES(");
    ASSERT_NE(rates, nullptr);
    // ASSOC.RATES reads the arranged block with its header row and labels: 4 rows × 3 columns.
    const std::string range = rates->content.substr(13, rates->content.find(';') - 13);
    const std::size_t header = std::stoul(range.substr(3, range.find(':') - 3)) - 1;
    EXPECT_EQ(range, absolute_area(Area{header, 0, 4, 3}));
    EXPECT_EQ(plan.content_at(header, 0), "Branch");
    EXPECT_EQ(plan.content_at(header, 1), "=$D$8");  // the observed block's header (row 8): Returned
    EXPECT_EQ(plan.content_at(header, 2), "The other columns");
    // Northgate (row 9): its Returned count, and Cleared plus Queried as the rest.
    EXPECT_EQ(plan.content_at(header + 1, 1), "=$D$9");
    EXPECT_EQ(plan.content_at(header + 1, 2), "=SUM($B$9:$C$9)");
}

TEST(AnalysisSheet, RefusesAnOutcomeBeyondTheColumnsWithCounts) {
    CommandOptions options;
    options.outcome_column = 3;
    expect_error([&] { plan_analysis_sheet(reading_of(branches), options, true); },
                 "The outcome of interest must be one of the 3 columns with counts (OutcomeColumn from 1 to 3); it is "
                 "column 4.");
}

TEST(AnalysisSheet, GivesTheRateDifferenceOfA2x2TableOnTheTableArrangedForTheRatios) {
    const SheetPlan plan = plan_analysis_sheet(reading_of(teams), {}, true);
    const Entry* odds = containing(plan, "=ASSOC.ODDSRATIO(");
    const Entry* difference = containing(plan, "=ASSOC.RATEDIFF(");
    ASSERT_NE(odds, nullptr);
    ASSERT_NE(difference, nullptr);
    EXPECT_EQ(difference->content, "=ASSOC.RATEDIFF(" + odds->content.substr(17));
    EXPECT_EQ(difference->area.columns, 3u);
    EXPECT_EQ(containing(plan, "ASSOC.PAIRWISE"), nullptr);
}

TEST(AnalysisSheet, ComparesEveryPairOfRowsOfATableWithThreeRowsAndSaysToReadTheAdjustedPValue) {
    const SheetPlan plan = plan_analysis_sheet(reading_of(branches), {}, true);
    const Entry* pairs = containing(plan, "=ASSOC.PAIRWISE(" + source + ")");
    ASSERT_NE(pairs, nullptr);
    EXPECT_EQ(pairs->kind, Entry::Kind::array_formula);
    EXPECT_EQ(pairs->area.rows, 3u);  // (1,2), (1,3), (2,3)
    EXPECT_EQ(pairs->area.columns, 4u);
    EXPECT_EQ(pairs->area.column, 0u);
    EXPECT_NE(containing(plan, "Read the adjusted p-value: every comparison is another chance of a false alarm"),
              nullptr);
    EXPECT_NE(containing(plan, "A difference between two groups is not proof of discrimination"), nullptr);
    EXPECT_EQ(containing(plan, "ASSOC.RATEDIFF"), nullptr);
}

TEST(AnalysisSheet, LeavesTheSourcesTotalLinesOutOfTheSheetsOwnTotalsAndShares) {
    const SheetPlan plan = plan_analysis_sheet(
        reading_of(grid({{"Team / Outcome", "Promoted", "Not promoted", "Total"},
                         {"Team A", 18, 7, 25},
                         {"Team B", 9, 16, 25},
                         {"Total", 27, 23, 50}})),
        {}, true);
    // The observed block: header in row 8, Team A in row 9, the source's Total row in row 11 and its
    // Total column in D; the sheet's own totals in column E and row 12.
    EXPECT_EQ(plan.content_at(8, 4), "=SUM($B$9:$C$9)");
    EXPECT_EQ(plan.content_at(11, 1), "=SUM($B$9:$B$10)");
    EXPECT_EQ(plan.content_at(11, 4), "=SUM($E$9:$E$10)");
    const Entry* shares = containing(plan, "=IF($E$9=0;\"\";$B$9/$E$9)");
    ASSERT_NE(shares, nullptr);
    EXPECT_EQ(shares->at(shares->area.row, 3), "");  // the Total column has no share
}

TEST(AnalysisSheet, ArrangesA2x2TableWithTheChosenOutcomeFirstAndTheChosenGroupFirst) {
    CommandOptions options;
    options.outcome_column = 1;  // "Not promoted"
    options.group_row = 1;       // "Team B"
    const SheetPlan plan = plan_analysis_sheet(reading_of(teams), options, true);
    const Entry* odds = containing(plan, "=ASSOC.ODDSRATIO(");
    ASSERT_NE(odds, nullptr);
    EXPECT_EQ(odds->area.columns, 3u);
    // The arranged block is the one ASSOC.ODDSRATIO reads; its first cell is Team B × Not promoted.
    const std::string block = odds->content.substr(17, odds->content.find(';') - 17);
    const std::size_t row = std::stoul(block.substr(block.find('$', 1) + 1)) - 1;
    // The observed block: its header in row 8, Team B in row 10, Not promoted in column C.
    EXPECT_EQ(plan.content_at(row, 1), "=$C$10");
    EXPECT_NE(containing(plan, "=ASSOC.RISKRATIO("), nullptr);
}

TEST(AnalysisSheet, NamesTheCellsThatStandOutInTheFirstColumnOnlyWhenTheSecondMirrorsIt) {
    const SheetPlan plan = plan_analysis_sheet(reading_of(teams), {}, true);
    const Entry* residuals = containing(plan, "=ASSOC.RESIDUALS(");
    const Entry* standouts = containing(plan, "TEXTJOIN(");
    ASSERT_NE(residuals, nullptr);
    ASSERT_NE(standouts, nullptr);
    const std::string first_cell = absolute_cell(residuals->area.row, residuals->area.column);
    EXPECT_NE(standouts->content.find("SUMPRODUCT(ABS(" + first_cell + ")>2)"), std::string::npos);
}

TEST(AnalysisSheet, HasNoRatiosForTablesLargerThan2x2) {
    const SheetPlan plan = plan_analysis_sheet(reading_of(branches), {}, true);
    EXPECT_EQ(containing(plan, "ASSOC.ODDSRATIO"), nullptr);
}

TEST(AnalysisSheet, CountsRecordsWithLevelsAndCountsFormulasAndAnalysesTheCounts) {
    SelectionContent content;
    content.ranges.push_back(RangeRef{"Invoices", 0, 1, 6, 2});
    content.values.push_back(grid({{"Region", "Exception"},
                                   {"North", "No"},
                                   {"South", "Yes"},
                                   {"North", "Yes"},
                                   {"South", "No"},
                                   {"North", "No"}}));
    const SheetPlan plan = plan_analysis_sheet(read(content), {}, true);
    const Entry* counts = containing(plan, "=ASSOC.COUNTS($'Invoices'.$B$2:$B$6;$'Invoices'.$C$2:$C$6)");
    ASSERT_NE(counts, nullptr);
    EXPECT_EQ(counts->kind, Entry::Kind::array_formula);
    EXPECT_NE(containing(plan, "=ASSOC.LEVELS($'Invoices'.$B$2:$B$6)"), nullptr);
    EXPECT_NE(containing(plan, "=TRANSPOSE(ASSOC.LEVELS($'Invoices'.$C$2:$C$6))"), nullptr);
    EXPECT_EQ(value_of(plan, "Pearson X²")->content, "=ASSOC.STATISTIC(" + absolute_area(counts->area) + ")");
}

TEST(AnalysisSheet, NamesThePairsOfRecordsByTheirLabelsAndNotByTheirPlaces) {
    SelectionContent content;
    content.ranges.push_back(RangeRef{"Invoices", 0, 1, 7, 2});
    content.values.push_back(grid({{"Region", "Exception"},
                                   {"North", "No"},
                                   {"South", "Yes"},
                                   {"West", "Yes"},
                                   {"North", "Yes"},
                                   {"South", "No"},
                                   {"West", "No"}}));
    const SheetPlan plan = plan_analysis_sheet(read(content), {}, true);
    const Entry* counts = containing(plan, "=ASSOC.COUNTS(");
    const Entry* pairs = containing(plan, "=ASSOC.PAIRWISE(");
    ASSERT_NE(counts, nullptr);
    ASSERT_NE(pairs, nullptr);
    // The counts with the column of ASSOC.LEVELS to their left.
    const Area labelled{counts->area.row, 0, 3, 3};
    EXPECT_EQ(pairs->content, "=ASSOC.PAIRWISE(" + absolute_area(labelled) + ")");
    EXPECT_EQ(plan.content_at(labelled.row, 0), "=ASSOC.LEVELS($'Invoices'.$B$2:$B$7)");
}

TEST(AnalysisSheet, CarriesTheCautions) {
    const SheetPlan plan = plan_analysis_sheet(reading_of(branches), {}, true);
    EXPECT_NE(containing(plan, "A significant association is not proof of discrimination, nor of cause"), nullptr);
    EXPECT_NE(containing(plan, "Small samples mislead"), nullptr);
    EXPECT_NE(containing(plan, "follow applicable law and policy and seek qualified advice"), nullptr);
}

TEST(AnalysisSheet, RefusesASignificanceLevelOutsideZeroToOne) {
    CommandOptions options;
    options.alpha = 1;
    expect_error([&] { plan_analysis_sheet(reading_of(branches), options, true); },
                 "The significance level (alpha) must be between 0 and 1, for example 0.05; it is 1.");
}

TEST(SheetBaseName, JoinsTheVariablesOfTheCorner) {
    EXPECT_EQ(sheet_base_name(reading_of(branches)), "Branch × Outcome");
}

TEST(SheetBaseName, UsesTheSheetAndRangeWithoutCharactersSheetNamesCannotHold) {
    EXPECT_EQ(sheet_base_name(reading_of(grid({{3, 5}, {9, 4}}), "Q1: [draft]")), "Q1- draft A4-B5");
}

TEST(SheetBaseName, CutsLongNamesTo31BytesWithoutSplittingACharacter) {
    const std::string name = sheet_base_name(reading_of(
        grid({{"Département régional / Résultat de l'examen", "Oui", "Non"}, {"Nord", 3, 4}, {"Sud", 5, 1}})));
    EXPECT_LE(name.size(), 31u);
    EXPECT_EQ(name, "Département régional × Résu");
}

TEST(ExactTestIsQuick, HoldsForASmallTableAndNotForA10x10TableWithThousandsOfCounts) {
    EXPECT_TRUE(exact_test_is_quick(reading_of(teams).table));
    Matrix counts(10, 10);
    for (std::size_t r = 0; r < 10; ++r)
        for (std::size_t c = 0; c < 10; ++c) counts(r, c) = static_cast<double>(10 + (r * 7 + c * 3) % 40);
    EXPECT_FALSE(exact_test_is_quick(CountTable::from_counts(counts)));
}

TEST(Palette, IsColorBrewerPuOrWithThreeClassesFromMinusThreeToPlusThree) {
    // ColorBrewer's colorbrewer_schemes.js, PuOr 3: rgb(241,163,64), rgb(247,247,247), rgb(153,142,195).
    EXPECT_EQ(palette::heat_map[0].value, -3);
    EXPECT_EQ(palette::heat_map[0].colour, 0x998EC3u);
    EXPECT_EQ(palette::heat_map[1].colour, 0xF7F7F7u);
    EXPECT_EQ(palette::heat_map[2].value, 3);
    EXPECT_EQ(palette::heat_map[2].colour, 0xF1A340u);
}

}  // namespace
}  // namespace assoc::command
