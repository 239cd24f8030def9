// Fuzz target: ASSOC.REPORT's lines (association_report) for a range, with the variable names read
// from its corner and a small cap on the exact test.
// Input: section 1 is the range; section 2 may give alpha in its first cell.
// Checks: only assoc::Error leaves the core; every line has a label and a finite number or a text
// in Assoc's words; p-value lines lie in [0, 1]; the total line is the table's total; the report
// keeps within its exact test's cap.
#include <cmath>

#include "assoc/count_table.hpp"
#include "assoc/report.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& range = section(sections, 0);
    CountTable table;
    if (!attempt("read_count_table", [&] { table = read_count_table(range); })) return 0;
    ReportOptions options;
    options.alpha = number_at(section(sections, 1), 0, 0.05);
    options.exact_limits = {0.05, 20'000'000};
    attempt("variable names", [&] { options.variables = variable_names_from_corner(range, table); });
    attempt(
        "association_report",
        [&] {
            const std::vector<ReportLine> lines = association_report(table, options);
            if (lines.empty()) finding("the report has no lines");
            for (const ReportLine& line : lines) {
                if (line.label.empty()) finding("a report line has no label");
                if (line.value.is_number()) {
                    check_finite(line.value.as_number(), line.label);
                    if (line.label.rfind("p-value", 0) == 0) check_probability(line.value.as_number(), line.label);
                    if (line.label == "Total count (n)" && line.value.as_number() != table.total())
                        finding("the report's total is not the table's");
                } else if (line.value.is_text()) {
                    check_message(line.value.as_text(), line.label);
                } else {
                    finding("the report line " + line.label + " is blank");
                }
            }
        },
        2.0);
    return 0;
}
