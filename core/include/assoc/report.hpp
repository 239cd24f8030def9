#pragma once
// The whole account of a test of independence as lines of a label and a value, ready to be shown
// as a two-column block of cells (ASSOC.REPORT). The core decides the content and the words;
// callers only lay the lines out.
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/count_table.hpp"
#include "assoc/exact_test.hpp"

namespace assoc {

struct ReportLine {
    std::string label;
    Cell value;  // a number or a text
};

// What the rows and the columns classify ("department", "promotion outcome"), for the
// conclusion; empty when unknown.
struct VariableNames {
    std::string rows;
    std::string columns;
};

struct ReportOptions {
    double alpha = 0.05;  // significance level of the decision and the critical value
    VariableNames variables;
    // The exact test runs on every recalculation of the report, so it gets a short leash
    // (work_limits.hpp); past it the line says why it was not computed (ASSOC.EXACT allows more).
    ExactLimits exact_limits = default_report_exact_limits;
    // How the exact p-value is computed: exact_p_value, or a caller's equivalent that remembers
    // earlier answers (the add-in's cache); it must give the same answers and the same errors.
    double (*exact_test)(const CountTable&, Side, const ExactLimits&) = exact_p_value;
};

// The lines, always the same ones in the same order so that a sheet can refer to them by
// position: total, rows, columns, df; Pearson X², G² and Yates X² each with its p-value (the
// Yates lines say so when the table is not 2×2); the exact p-value (or why it was not computed);
// critical value and decision at alpha; Cramér's V with its 95% confidence limits; smallest
// expected count and share of cells below 5; validity verdict; the cells that stand out (at most
// 3 with adjusted residuals beyond ±2, named by their labels); conclusion in words; caution.
std::vector<ReportLine> association_report(const CountTable& table, const ReportOptions& options = {});

// The variable names in the corner cell of a range that has a header row and a header column:
// "Department / Outcome" (or with "\") names both; a text without a separator names the rows.
VariableNames variable_names_from_corner(const CellGrid& range, const CountTable& table);

}  // namespace assoc
