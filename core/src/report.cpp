#include "assoc/report.hpp"

#include <algorithm>
#include <cmath>
#include <optional>
#include <utility>

#include "ascii_case.hpp"
#include "assoc/chi_squared_distribution.hpp"
#include "assoc/cramers_v_interval.hpp"
#include "assoc/effect_size.hpp"
#include "assoc/error.hpp"
#include "assoc/exact_test.hpp"
#include "assoc/format.hpp"
#include "assoc/residuals.hpp"
#include "assoc/statistics.hpp"
#include "assoc/validity.hpp"
#include "assoc/wording.hpp"

namespace assoc {
namespace {

// A figure of the report, or the reason it could not be computed (an Error's message).
template <class Value>
struct Attempt {
    std::optional<Value> value;
    std::string reason;
};

template <class Compute>
auto attempt(Compute compute) -> Attempt<decltype(compute())> {
    try {
        return {compute(), {}};
    } catch (const Error& error) {
        return {std::nullopt, error.what()};
    }
}

// Everything the lines are made of, computed once. A new line that needs a new figure adds
// it here and adds itself to one of the sections below.
struct Findings {
    const CountTable& table;
    const ReportOptions& options;
    TestResult pearson;
    TestResult likelihood_ratio;
    std::optional<TestResult> yates;  // 2×2 tables only
    Attempt<double> exact;            // the exact p-value, within options.exact_limits
    double critical_value;
    bool independence_rejected;
    Attempt<CramersVInterval> v_interval;
    Attempt<Matrix> adjusted_residuals;
    ValidityCheck validity;
};

class Lines {
public:
    void number(std::string label, double value) { lines_.push_back({std::move(label), Cell::number(value)}); }
    // A statistic that may pass the largest double (counts near 1e308 beside tiny expected counts).
    void statistic(std::string label, double value) {
        if (std::isfinite(value)) number(std::move(label), value);
        else text(std::move(label), "Above 1.8e308, too large for a spreadsheet number (its p-value is 0)");
    }
    void text(std::string label, std::string value) { lines_.push_back({std::move(label), Cell::text(std::move(value))}); }
    std::vector<ReportLine> take() { return std::move(lines_); }

private:
    std::vector<ReportLine> lines_;
};

std::string level(double alpha) { return format_number(100.0 * alpha, 3) + "%"; }

std::string sentence(const std::string& text) { return !text.empty() && text.back() == '.' ? text : text + "."; }

void add_size(const Findings& f, Lines& lines) {
    lines.number("Total count (n)", f.table.total());
    lines.number("Rows with counts", static_cast<double>(f.table.rows()));
    lines.number("Columns with counts", static_cast<double>(f.table.columns()));
    lines.number("Degrees of freedom", f.pearson.df);
}

void add_tests(const Findings& f, Lines& lines) {
    lines.statistic("Pearson X²", f.pearson.statistic);
    lines.number("p-value, Pearson X²", f.pearson.p_value);
    lines.statistic("Likelihood-ratio G²", f.likelihood_ratio.statistic);
    lines.number("p-value, G²", f.likelihood_ratio.p_value);
    const std::string only = "2×2 tables only";
    if (f.yates) {
        lines.statistic("Yates-corrected X²", f.yates->statistic);
        lines.number("p-value, Yates-corrected X²", f.yates->p_value);
    } else {
        lines.text("Yates-corrected X²", only);
        lines.text("p-value, Yates-corrected X²", only);
    }
    if (f.exact.value) lines.number("p-value, exact test", *f.exact.value);
    else lines.text("p-value, exact test", "Not computed: " + sentence(f.exact.reason));
}

void add_decision(const Findings& f, Lines& lines) {
    const std::string at = level(f.options.alpha);
    lines.number("Critical X² at " + at, f.critical_value);
    lines.text("Decision at " + at, f.independence_rejected
                                        ? "Independence rejected: Pearson X² is above the critical value (p below " + at + ")"
                                        : "Independence not rejected: Pearson X² is not above the critical value (p of " +
                                              at + " or more)");
}

void add_strength(const Findings& f, Lines& lines) {
    lines.number("Cramér's V", cramers_v(f.table));
    const std::string lower = "Cramér's V, lower 95% limit", upper = "Cramér's V, upper 95% limit";
    if (f.v_interval.value) {
        lines.number(lower, f.v_interval.value->lower);
        lines.number(upper, f.v_interval.value->upper);
    } else {
        lines.text(lower, "Not computed: " + sentence(f.v_interval.reason));
        lines.text(upper, "Not computed: " + sentence(f.v_interval.reason));
    }
}

void add_validity(const Findings& f, Lines& lines) {
    lines.number("Smallest expected count", f.validity.smallest_expected);
    lines.number("Share of cells expecting fewer than 5", f.validity.share_below_five);
    lines.text("Validity", f.validity.summary());
}

// "Sales", or "row 3" (its row in the range as selected, a header row being row 1) when the table has
// no label there.
std::string row_name(const CountTable& table, std::size_t index) {
    if (!table.row_labels()[index].empty()) return short_label(table.row_labels()[index]);
    return "row " + std::to_string(table.range_row(table.kept_rows()[index]));
}

std::string column_name(const CountTable& table, std::size_t index) {
    if (!table.column_labels()[index].empty()) return short_label(table.column_labels()[index]);
    return "column " + std::to_string(table.range_column(table.kept_columns()[index]));
}

// The cells furthest from independence: adjusted residuals beyond ±2 (about the 5% level each,
// common practice), largest first, at most three named.
void add_standouts(const Findings& f, Lines& lines) {
    const std::string label = "Cells that stand out";
    if (!f.adjusted_residuals.value) {
        lines.text(label, "Not computed: " + sentence(f.adjusted_residuals.reason));
        return;
    }
    const Matrix& z = *f.adjusted_residuals.value;
    // With two columns (or two rows) the two cells of a row (or column) have adjusted residuals of
    // equal size and opposite sign, so only the first column (row) is named: it says it all.
    const bool two_columns = z.columns() == 2, two_rows = z.rows() == 2;
    std::vector<std::size_t> beyond;
    for (std::size_t i = 0; i < z.size(); ++i) {
        if ((two_columns && i % z.columns() != 0) || (two_rows && i >= z.columns())) continue;
        if (std::fabs(z.values()[i]) > 2) beyond.push_back(i);
    }
    std::stable_sort(beyond.begin(), beyond.end(),
                     [&](std::size_t a, std::size_t b) { return std::fabs(z.values()[a]) > std::fabs(z.values()[b]); });
    if (beyond.empty()) {
        lines.text(label, "None: no cell's adjusted residual is beyond ±2");
        return;
    }
    const std::size_t named = std::min<std::size_t>(beyond.size(), 3);
    std::string text;
    for (std::size_t k = 0; k < named; ++k) {
        const std::size_t r = beyond[k] / z.columns(), c = beyond[k] % z.columns();
        const double residual = z(r, c);
        text += (k == 0 ? "" : "; ") + row_name(f.table, r) + " × " + column_name(f.table, c) + ": " +
                (residual > 0 ? "more" : "fewer") + " than expected (adjusted residual " + format_statistic(residual) + ")";
    }
    if (beyond.size() > named)
        text += "; and " + format_count(static_cast<double>(beyond.size() - named)) + " more beyond ±2 (see ASSOC.RESIDUALS)";
    lines.text(label, text);
}

// "the rows (Sales, Legal, Support)": how the conclusion names a side that has no variable name.
std::string describe_side(const char* side, bool has_labels, const std::vector<std::string>& labels) {
    std::string text = std::string("the ") + side;
    if (!has_labels) return text;
    std::string names;
    const std::size_t shown = 4;
    for (std::size_t i = 0; i < labels.size() && i < shown; ++i) {
        if (labels[i].empty()) return text;
        names += (i > 0 ? ", " : "") + short_label(labels[i], 24);
    }
    if (labels.size() > shown) names += ", …";
    return text + " (" + names + ")";
}

// Cramér's V as a memo writes it: 0.10, 0.35; below 0.1 with two significant digits (0.0017).
std::string v_in_words(double value) {
    char buffer[32];
    if (value >= 0.1 || value == 0) std::snprintf(buffer, sizeof buffer, "%.2f", value);
    else std::snprintf(buffer, sizeof buffer, "%.2g", value);
    return buffer;
}

// "p = 0.0041", or "p < 1e-300" where the p-value is below the smallest number a double holds (it
// is then 0, which would read as a certainty).
std::string p_equals(double p) { return p == 0 ? "p < 1e-300" : "p = " + format_p_value(p); }

void add_conclusion(const Findings& f, Lines& lines) {
    const VariableNames& names = f.options.variables;
    const std::string rows = names.rows.empty()
                                 ? describe_side("rows", f.table.has_row_labels(), f.table.row_labels())
                                 : names.rows;
    const std::string columns = names.columns.empty()
                                    ? describe_side("columns", f.table.has_column_labels(), f.table.column_labels())
                                    : names.columns;
    const std::string p = "(" + p_equals(f.pearson.p_value) + ")";
    std::string text = "At the " + level(f.options.alpha) + " level, ";
    text += f.independence_rejected ? rows + " and " + columns + " appear associated " + p
                                    : "the data do not show an association between " + rows + " and " + columns +
                                          " " + p + ".";
    if (f.independence_rejected) {
        // A significant result may still be a tiny effect: say how strong it is, in words.
        const double v = cramers_v(f.table);
        const std::string strength = strength_in_words(v, f.table);
        const bool small = strength == "very weak" || strength == "weak";
        text += std::string(small ? ", but the association is " : ", and the association is ") + strength +
                ": Cramér's V is " + v_in_words(v) + " (" + strength_bands() + ").";
    }
    if (f.v_interval.value && f.v_interval.value->upper == 0)
        text += " Cramér's V's 95% interval is 0 to 0 because X² is smaller than independence itself gives in 97.5% of "
                "samples: the counts are closer to independence than chance usually leaves them (check that they "
                "were not balanced on purpose); it does not mean that V is exactly 0.";
    if (f.validity.exact_test_recommended) {
        text += " The chi-squared approximation is doubtful for this table (see the validity line), so this "
                "p-value may be unreliable";
        text += f.exact.value ? "; the exact test gives " + p_equals(*f.exact.value) + "." : ".";
    }
    lines.text("Conclusion", text);
}

void add_caution(const Findings&, Lines& lines) {
    lines.text("Caution",
               "An association is not proof of cause, nor of discrimination, and small samples can mislead. "
               "For decisions about people, follow applicable law and policy and seek qualified advice.");
}

// "Department" reads as "department" inside a sentence; "HR band" keeps its capitals.
std::string in_sentence(const std::string& name) { return detail::in_sentence(short_label(name, 40)); }

}  // namespace

std::vector<ReportLine> association_report(const CountTable& table, const ReportOptions& options) {
    const TestResult pearson = independence_test(table, Method::pearson);
    const double critical = chi_squared_critical_value(pearson.df, options.alpha);
    const Findings findings{table,
                            options,
                            pearson,
                            independence_test(table, Method::likelihood_ratio),
                            table.is_two_by_two() ? std::optional<TestResult>(independence_test(table, Method::yates))
                                                  : std::nullopt,
                            attempt([&] { return options.exact_test(table, Side::two_sided, options.exact_limits); }),
                            critical,
                            pearson.p_value < options.alpha,
                            attempt([&] { return cramers_v_interval(table, 0.95); }),
                            attempt([&] { return residuals(table, ResidualKind::adjusted); }),
                            check_validity(table)};
    Lines lines;
    for (auto section : {add_size, add_tests, add_decision, add_strength, add_validity, add_standouts, add_conclusion,
                         add_caution})
        section(findings, lines);
    return lines.take();
}

VariableNames variable_names_from_corner(const CellGrid& range, const CountTable& table) {
    VariableNames names;
    if (range.empty() || !table.has_row_labels() || !table.has_column_labels() || !range.at(0, 0).is_text())
        return names;
    const std::string& corner = range.at(0, 0).as_text();
    const std::size_t separator = corner.find_first_of("/\\");
    // Without a separator the corner is a title ("Headcount", "2024"), not the names of the variables.
    if (separator == std::string::npos) return names;
    names.rows = in_sentence(corner.substr(0, separator));
    names.columns = in_sentence(corner.substr(separator + 1));
    // Both names, or neither: "Department /" names only one side and would read oddly.
    if (names.rows.empty() || names.columns.empty()) return {};
    return names;
}

}  // namespace assoc
