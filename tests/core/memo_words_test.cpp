// Words a memo can use: the strength in words, rows named as the range counts them, short summaries of
// what was set aside, and the degenerate interval of Cramér's V explained.
#include <gtest/gtest.h>

#include <string>
#include <vector>

#include "assoc/effect_size.hpp"
#include "assoc/report.hpp"
#include "assoc/validity.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::grid;

namespace {

std::string line_text(const std::vector<ReportLine>& lines, const std::string& label) {
    for (const ReportLine& line : lines)
        if (line.label == label) return line.value.as_text();
    ADD_FAILURE() << "no line " << label;
    return "";
}

bool contains(const std::string& text, const std::string& part) { return text.find(part) != std::string::npos; }

}  // namespace

// Invented: two branches with a million invoices each. X² = 5.78 gives p = 0.016, but V = 0.0017 (exact
// arithmetic on the counts): significant and very weak.
TEST(MemoWords, CallASignificantButTinyAssociationVeryWeak) {
    const CountTable table = read_count_table(grid({{"", "Yes", "No"}, {"A", 500000, 500300}, {"B", 498000, 501700}}));
    const std::string conclusion = line_text(association_report(table), "Conclusion");
    EXPECT_TRUE(contains(conclusion, "appear associated (p = 0.0162), but the association is very weak: Cramér's V is "
                                     "0.0017 (Cohen's bands for w = V·√(min(rows, columns) − 1): below 0.1 very weak, "
                                     "from 0.1 weak, from 0.3 moderate, from 0.5 strong)."))
        << conclusion;
}

// Cohen's w = V·√(min(r, c) − 1): V = 0.25 is w = 0.25 for two rows (weak) but w = 0.43 for three rows and
// three columns (moderate).
TEST(MemoWords, TurnVIntoCohensWBeforeChoosingTheWord) {
    const CountTable two_rows = read_count_table(grid({{10, 20}, {20, 10}}));
    const CountTable three_by_three = read_count_table(grid({{10, 20, 30}, {20, 20, 20}, {30, 20, 10}}));
    EXPECT_EQ(strength_in_words(0.25, two_rows), "weak");
    EXPECT_EQ(strength_in_words(0.25, three_by_three), "moderate");
    EXPECT_EQ(strength_in_words(0.05, two_rows), "very weak");
    EXPECT_EQ(strength_in_words(0.6, two_rows), "strong");
}

// X² = n (ad − bc)² / (r1 r2 c1 c2) = 8002 / 4001² = 0.0005 (exact arithmetic), and P(X² ≥ 0.0005 | 1 df) is
// about 0.98 ≥ 0.975, so both limits of the interval are 0 (cramers_v_interval.hpp).
TEST(MemoWords, ExplainAnIntervalOfVFromZeroToZero) {
    const CountTable table = read_count_table(grid({{2000, 2001}, {2001, 2000}}));
    const std::vector<ReportLine> lines = association_report(table);
    EXPECT_TRUE(contains(line_text(lines, "Conclusion"),
                         "Cramér's V's 95% interval is 0 to 0 because X² is smaller than independence itself gives in "
                         "97.5% of samples"));
}

TEST(MemoWords, NameUnlabelledRowsByTheirRowInTheRangeBelowAHeaderRow) {
    // Invented; rows without labels below a header row of outcomes: the second data row is row 3 of the range.
    const CountTable table = read_count_table(grid({{"Yes", "No"}, {60, 10}, {10, 60}, {35, 35}}));
    const std::string standouts = line_text(association_report(table), "Cells that stand out");
    EXPECT_TRUE(contains(standouts, "row 2 × Yes: more than expected")) << standouts;
    EXPECT_TRUE(contains(standouts, "row 3 × Yes: fewer than expected")) << standouts;
    EXPECT_FALSE(contains(standouts, "× No")) << standouts;
}

TEST(MemoWords, SummariseManyEmptyRowsAsRuns) {
    std::vector<std::vector<Cell>> rows = {{Cell::number(20), Cell::number(30)}, {Cell::number(25), Cell::number(35)}};
    for (int i = 0; i < 500; ++i) rows.push_back({Cell::number(0), Cell::number(0)});
    const std::string summary = check_validity(read_count_table(CellGrid::from_rows(rows))).summary();
    EXPECT_TRUE(contains(summary, "Rows 3–502 have no counts and were set aside.")) << summary;
    EXPECT_LT(summary.size(), 300u);
}

TEST(MemoWords, NameAHandfulOfEmptyLabelledRowsAndCountTheRest) {
    std::vector<std::vector<Cell>> rows = {{Cell::blank(), Cell::text("Yes"), Cell::text("No")},
                                           {Cell::text("Sales"), Cell::number(20), Cell::number(30)},
                                           {Cell::text("Legal"), Cell::number(25), Cell::number(35)}};
    for (int i = 0; i < 40; ++i)
        rows.push_back({Cell::text("Office " + std::to_string(i) + std::string(60, '.')), Cell::number(0), Cell::number(0)});
    const std::string summary = check_validity(read_count_table(CellGrid::from_rows(rows))).summary();
    EXPECT_TRUE(contains(summary, "and 35 more have no counts and were set aside.")) << summary;
    EXPECT_LT(summary.size(), 500u);
}

TEST(MemoWords, EchoLabelsTrimmed) {
    const CountTable table = read_count_table(grid({{"", " Yes ", "No"}, {"  Sales", 20, 5}, {"Legal ", 25, 7}}));
    EXPECT_EQ(table.column_labels(), (std::vector<std::string>{"Yes", "No"}));
    EXPECT_EQ(table.row_labels(), (std::vector<std::string>{"Sales", "Legal"}));
}
