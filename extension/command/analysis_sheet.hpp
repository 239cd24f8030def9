#pragma once
// The analysis sheet that the command "Analyse selection" writes, as a SheetPlan: a title and a
// note on reading it, the counts, expected counts, adjusted residuals with their heat map, the
// test, the strength (Cramér's V with its interval), the validity verdict, the cells that stand
// out, a conclusion, the rates of the outcome of interest by row with their intervals, 2×2 ratios
// and the rate difference when they apply, the comparisons of every pair of rows (3 rows or more),
// row percentages with a chart, the cautions, and (when the exact test is quick for this table) the
// whole ASSOC.REPORT block. Every figure is an ASSOC.* formula on the source cells, so the sheet
// stays live.
//
// The sheet is a list of blocks, laid out top to bottom (analysis_sheet.cpp, `blocks`); a block
// is one function that writes its rows and names the cells other blocks refer to. To add one
// (say for a new worksheet function), write the function and put it in the list.
#include <cstddef>
#include <string>

#include "reading.hpp"
#include "sheet_plan.hpp"

namespace assoc::command {

enum class Placement { after_source, end, before_source };

// What the user chose (the dialog, or the dispatch arguments).
struct CommandOptions {
    double alpha = 0.05;  // significance level of the decision; the sheet holds it in a cell
    ReadAs read_as = ReadAs::automatic;
    Placement placement = Placement::after_source;
    // Which of the columns with counts is the outcome of interest: the rates by row are its rates,
    // and in a 2×2 table the ratios and the rate difference are about it (0 = the first).
    std::size_t outcome_column = 0;
    // 2×2 tables: which of the two rows with counts is the group compared with the other (0 = first,
    // 1 = second).
    std::size_t group_row = 0;
};

// Checks the options a caller filled from outside (dispatch arguments, stored settings); throws
// assoc::Error with a message for the user. plan_analysis_sheet also checks the outcome of interest
// against the table.
void check_options(const CommandOptions& options);

// Whether the exact test is quick enough (command_exact_probe_limits in worksheet_limits.hpp: a few
// hundredths of a second, within a few tens of MB)
// for the sheet to recompute it with every change of the source; otherwise the sheet leaves the
// exact p-value and ASSOC.REPORT out and says why (Cramér's V's interval comes from ASSOC.VINTERVAL,
// on every sheet).
bool exact_test_is_quick(const CountTable& table);

// The plan of the sheet. `exact_live` as exact_test_is_quick gives it (a parameter, so tests can
// lay out both versions).
SheetPlan plan_analysis_sheet(const Reading& reading, const CommandOptions& options, bool exact_live);

// The new sheet's name before it is made unique: the table's variables ("Department × Outcome"),
// or the source sheet and range; without characters sheet names cannot hold, at most 31 long.
std::string sheet_base_name(const Reading& reading);

// Tables with more rows with counts than this get no comparisons of every pair of rows on the sheet
// (20 rows make 190 pairs), only a note on how to get them.
inline constexpr std::size_t max_pairwise_sheet_rows = 20;

// Cell-line numbers (1-based) of ASSOC.REPORT's lines that the sheet refers to (report.hpp keeps
// them in a fixed order so that sheets can).
inline constexpr std::size_t report_lines = 22;
inline constexpr std::size_t report_line_exact = 11;

}  // namespace assoc::command
