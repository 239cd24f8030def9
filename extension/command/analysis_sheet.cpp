#include "analysis_sheet.hpp"

#include <algorithm>
#include <cmath>
#include <functional>

#include "assoc/effect_size.hpp"
#include "assoc/error.hpp"
#include "assoc/exact_test.hpp"
#include "assoc/format.hpp"
#include "assoc/outcome_column.hpp"
#include "assoc/pairwise_comparisons.hpp"
#include "assoc/residuals.hpp"
#include "assoc/validity.hpp"
#include "worksheet_limits.hpp"

namespace assoc::command {
namespace {

// Widths in millimetres; text wraps at about this many millimetres per character (10 pt Liberation
// Sans, measured on the samples' rendering: common practice for a first estimate of row heights).
constexpr double label_width = 50.0;
constexpr double column_width = 24.0;  // with min_text_columns, 170 mm: an A4 page's width inside its margins
constexpr double millimetres_per_character = 1.8;
constexpr std::size_t min_text_columns = 5;  // text blocks span column A and at least this many more

// Everything the blocks share: the plan they write, the reading, and where things are.
struct Layout {
    SheetPlan plan;
    const Reading& reading;
    const CommandOptions& options;
    bool exact_live = false;
    std::string table;        // the reference the functions get
    std::string table_shown;  // the same as people write it: 'HR'.A4:C9
    std::size_t row = 0;      // the next free row
    std::size_t last_column;  // the rightmost column that text blocks span
    std::size_t body_rows;
    std::size_t body_columns;
    std::size_t section = 0;  // sections are numbered as they are laid out
    // The observed block on this sheet (filled by counts_block).
    Area observed;
    std::vector<std::string> row_label;     // the address of each body row's label on this sheet
    std::vector<std::string> column_label;  // and of each body column's
    std::vector<std::string> row_total;     // the address of each body row's total
    // Body rows and columns that the functions set aside as totals (labelled "Total" in the source):
    // the sheet's own totals leave them out.
    std::vector<bool> total_row, total_column;

    Layout(const Reading& r, const CommandOptions& o) : reading(r), options(o) {}

    std::string ref(const std::string& name) const { return SheetPlan::placeholder(name); }

    void heading(const std::string& title) {
        ++section;
        plan.text(row, 0, std::to_string(section) + ". " + title, Look::section);
        ++row;
    }
    void gap() { ++row; }

    // A sentence (text or formula) in column B spanning to the last column, wrapped.
    void sentence_line(const std::string& label, const std::string& content, bool is_formula, std::size_t length,
                       Look look = Look::text) {
        if (!label.empty()) plan.text(row, 0, label, Look::label);
        const Area area{row, 1, 1, last_column};
        if (is_formula) plan.formula(row, 1, content, look);
        else plan.text(row, 1, content, look);
        plan.merge(area, lines_for(length, area));
        ++row;
    }
    // A sentence over the whole width, from column A.
    void wide_line(const std::string& content, Look look, bool is_formula = false, std::size_t length = 0) {
        const Area area{row, 0, 1, last_column + 1};
        if (is_formula) plan.formula(row, 0, content, look);
        else plan.text(row, 0, content, look);
        plan.merge(area, lines_for(length > 0 ? length : content.size(), area));
        ++row;
    }
    std::size_t lines_for(std::size_t characters, const Area& area) const {
        const double width = (area.column == 0 ? label_width + (area.columns - 1) * column_width
                                               : area.columns * column_width) - 2.0;
        const double per_line = std::max(10.0, width / millimetres_per_character);
        return static_cast<std::size_t>(std::ceil(static_cast<double>(characters) / per_line));
    }

    // A header row: the corner cell ruled, then the column labels (references to the observed header).
    void header_row() {
        plan.look(Area{row, 0}, Look::header);
        plan.formulas(Area{row, 1, 1, body_columns}, references(column_label), Look::header);
        ++row;
    }
    // Row labels (references to the observed labels) for `body_rows` rows from the current row.
    void row_labels() { plan.formulas(Area{row, 0, body_rows, 1}, references(row_label), Look::label); }
    static std::vector<std::string> references(const std::vector<std::string>& cells) {
        std::vector<std::string> formulas;
        for (const std::string& cell : cells) formulas.push_back("=" + cell);
        return formulas;
    }
    Area body_here() const { return Area{row, 1, body_rows, body_columns}; }
};

std::string percent_of(const std::string& alpha) { return "TEXT(" + alpha + "*100;\"0.###\")&\"%\""; }
std::string p_text(const std::string& cell) { return "TEXT(" + cell + ";\"[<0.0001]0.0E+00;0.0000\")"; }

// "department" inside a sentence; "HR band" keeps its capitals.
std::string in_sentence(const std::string& name) {
    if (name.size() >= 2 && name[0] >= 'A' && name[0] <= 'Z' && name[1] >= 'a' && name[1] <= 'z') {
        std::string lower = name;
        lower[0] = static_cast<char>(lower[0] + 32);
        return lower;
    }
    return name;
}

// How sentences name the rows or the columns: the variable's name, or "the rows (A, B, C)".
std::string side_name(const std::string& variable, const char* side, const std::vector<std::string>& names) {
    if (!variable.empty()) return in_sentence(variable);
    std::string text = std::string("the ") + side + " (";
    for (std::size_t i = 0; i < names.size() && i < 4; ++i) text += (i > 0 ? ", " : "") + names[i];
    return text + (names.size() > 4 ? ", …)" : ")");
}

std::string corner_text(const Reading& reading) {
    const VariableNames& v = reading.variables;
    if (!v.rows.empty() && !v.columns.empty()) return v.rows + " / " + v.columns;
    return v.rows;
}

// "SUM($B$9:$C$9;$E$9)": the sum of a row (or column) of cells, leaving out the positions marked in
// `skip` (total lines, the outcome of interest); "0" when none is left.
std::string sum_over(const Area& line, const std::vector<bool>& skip) {
    const bool across = line.rows == 1;
    const std::size_t length = across ? line.columns : line.rows;
    std::string parts;
    for (std::size_t k = 0; k < length;) {
        if (skip[k]) {
            ++k;
            continue;
        }
        std::size_t end = k;
        while (end + 1 < length && !skip[end + 1]) ++end;
        const Area run = across ? Area{line.row, line.column + k, 1, end - k + 1}
                                : Area{line.row + k, line.column, end - k + 1, 1};
        parts += (parts.empty() ? "" : ";") + absolute_area(run);
        k = end + 1;
    }
    return parts.empty() ? "0" : "SUM(" + parts + ")";
}

// ---------------------------------------------------------------------------------------------
// The blocks, top to bottom.

void title_block(Layout& s) {
    const std::string name = sheet_base_name(s.reading);
    s.plan.text(s.row++, 0, "Association analysis: " + name, Look::title);
    const std::string source =
        "Made by Assoc from " + s.reading.description + ". Every figure below is a formula on those cells: change "
        "them and this sheet follows. " +
        (s.reading.is_records() ? "If the records gain new labels, run the command again for a new sheet."
                                : "If the table gains rows or columns, run the command again for a new sheet.");
    s.wide_line(source, Look::note);
    s.wide_line("How to read this sheet: the counts come first, then the counts that independence (no association "
                "between the two classifications) would give, and the adjusted residuals that show where the two "
                "differ: purple cells hold fewer counts than independence predicts, orange cells more, and a cell "
                "beyond ±2 stands out. The test says whether differences this large could be chance, the strength "
                "how large the association is, and the verdict whether the test can be trusted here. Then come the "
                "figures a memo quotes: each row's rate of the outcome of interest with its interval and, where "
                "they apply, the comparisons of rows. Read the cautions at the end before acting on any result.",
                Look::text);
    s.gap();
    s.plan.text(s.row, 0, "Significance level (alpha)", Look::label);
    s.plan.number(s.row, 1, s.options.alpha, Look::input);
    s.plan.name("alpha", absolute_cell(s.row, 1));
    const Area note{s.row, 2, 1, s.last_column - 1};
    s.plan.text(s.row, 2, "Change it here: the decision and the conclusion follow.", Look::note);
    s.plan.merge(note);
    ++s.row;
    s.gap();
}

void counts_block(Layout& s) {
    const Reading& reading = s.reading;
    s.heading(reading.is_records() ? "Counts from the records (ASSOC.LEVELS and ASSOC.COUNTS)" : "Observed counts");
    const std::string corner = corner_text(reading);
    const std::size_t header = s.row;
    if (!corner.empty()) s.plan.text(header, 0, corner, Look::header);
    else s.plan.look(Area{header, 0}, Look::header);
    s.observed = Area{header + 1, 1, s.body_rows, s.body_columns};
    for (std::size_t c = 0; c < s.body_columns; ++c) s.column_label.push_back(absolute_cell(header, 1 + c));
    for (std::size_t r = 0; r < s.body_rows; ++r) s.row_label.push_back(absolute_cell(header + 1 + r, 0));

    if (reading.is_records()) {
        const RecordSource& records = *reading.record_source;
        const std::string rows = absolute_reference(records.row_labels), columns = absolute_reference(records.column_labels);
        s.plan.array_formula(Area{header, 1, 1, s.body_columns}, "=TRANSPOSE(ASSOC.LEVELS(" + columns + "))", Look::header);
        s.plan.array_formula(Area{header + 1, 0, s.body_rows, 1}, "=ASSOC.LEVELS(" + rows + ")", Look::label);
        s.plan.array_formula(s.observed, "=ASSOC.COUNTS(" + rows + ";" + columns + ")", Look::count);
        s.table = absolute_area(s.observed);
        s.table_shown = cell_address(s.observed.row, s.observed.column) + ":" +
                        cell_address(s.observed.last_row(), s.observed.last_column());
    } else {
        const TableSource& table = *reading.table_source;
        const std::size_t top = table.range.row + (table.header_row ? 1 : 0);
        const std::size_t left = table.range.column + (table.header_column ? 1 : 0);
        auto source_cell = [&](std::size_t row, std::size_t column) {
            return absolute_reference(RangeRef{table.range.sheet, row, column, 1, 1});
        };
        // Labels as T(…) of the source's label cells (a blank label shows blank, not 0); without
        // labels, our own "Row 1", "Column 1".
        if (table.header_row) {
            std::vector<std::string> labels;
            for (std::size_t c = 0; c < s.body_columns; ++c)
                labels.push_back("=T(" + source_cell(table.range.row, left + c) + ")");
            s.plan.formulas(Area{header, 1, 1, s.body_columns}, std::move(labels), Look::header);
        } else {
            for (std::size_t c = 0; c < s.body_columns; ++c) s.plan.text(header, 1 + c, reading.column_names[c], Look::header);
        }
        if (table.header_column) {
            std::vector<std::string> labels;
            for (std::size_t r = 0; r < s.body_rows; ++r) labels.push_back("=T(" + source_cell(top + r, table.range.column) + ")");
            s.plan.formulas(Area{header + 1, 0, s.body_rows, 1}, std::move(labels), Look::label);
        } else {
            for (std::size_t r = 0; r < s.body_rows; ++r) s.plan.text(header + 1 + r, 0, reading.row_names[r], Look::label);
        }
        std::vector<std::string> counts;
        for (std::size_t r = 0; r < s.body_rows; ++r)
            for (std::size_t c = 0; c < s.body_columns; ++c) counts.push_back("=" + source_cell(top + r, left + c));
        s.plan.formulas(s.observed, std::move(counts), Look::count);
        s.table = absolute_reference(table.range);
        s.table_shown = qualified_address(table.range);
    }
    // Totals.
    const std::size_t total_column = 1 + s.body_columns, total_row = header + 1 + s.body_rows;
    s.plan.text(header, total_column, "Total", Look::header);
    // Totals of the source (rows or columns labelled "Total") stay in the block, as the functions
    // read it, but the sheet's own totals leave them out.
    std::vector<std::string> row_sums, column_sums;
    for (std::size_t r = 0; r < s.body_rows; ++r) {
        const std::size_t row = header + 1 + r;
        row_sums.push_back("=" + sum_over(Area{row, 1, 1, s.body_columns}, s.total_column));
        s.row_total.push_back(absolute_cell(row, total_column));
    }
    s.plan.formulas(Area{header + 1, total_column, s.body_rows, 1}, std::move(row_sums), Look::count);
    s.plan.text(total_row, 0, "Total", Look::label);
    for (std::size_t c = 0; c <= s.body_columns; ++c)
        column_sums.push_back("=" + sum_over(Area{header + 1, 1 + c, s.body_rows, 1}, s.total_row));
    s.plan.formulas(Area{total_row, 1, 1, s.body_columns + 1}, std::move(column_sums), Look::count);
    s.plan.name("total", absolute_cell(total_row, total_column));
    s.row = total_row + 1;

    if (reading.is_records()) {
        const RecordSource& records = *reading.record_source;
        const std::string rows = absolute_reference(records.row_labels), columns = absolute_reference(records.column_labels);
        const std::string fits = "=IF(AND(ROWS(ASSOC.LEVELS(" + rows + "))=" + std::to_string(s.body_rows) +
                                 ";ROWS(ASSOC.LEVELS(" + columns + "))=" + std::to_string(s.body_columns) +
                                 ");\"These blocks fit the labels of the records.\";\"The records now hold a different "
                                 "number of labels than these blocks show: run the command again for a new sheet.\")";
        s.wide_line("ASSOC.LEVELS lists the distinct labels of each column of records (sorted); ASSOC.COUNTS counts the "
                    "records of each pair of labels. Records with a blank label are left out.",
                    Look::note);
        const Area check{s.row, 0, 1, s.last_column + 1};
        s.plan.array_formula(Area{s.row, 0}, fits, Look::note);
        s.plan.merge(check, s.lines_for(110, check));
        ++s.row;
    }
    s.gap();
}

void expected_block(Layout& s) {
    s.heading("Expected counts if the two were independent (ASSOC.EXPECTED)");
    s.header_row();
    s.row_labels();
    s.plan.array_formula(s.body_here(), "=ASSOC.EXPECTED(" + s.table + ")", Look::decimal);
    s.row += s.body_rows;
    s.gap();
}

// The cells beyond ±2, largest first when there are more than `shown`, as one sentence.
std::string standouts_formula(const Area& residuals, const std::string& row_labels, const std::string& column_labels) {
    const std::string z = absolute_area(residuals);
    const std::string beyond = "SUMPRODUCT(ABS(" + z + ")>2)";
    const std::string threshold = "IF(" + beyond + ">6;LARGE(ABS(" + z + ");6);0)";
    const std::string chosen = "(ABS(" + z + ")>2)*(ABS(" + z + ")>=" + threshold + ")";
    const std::string listed = "TEXTJOIN(\"; \";1;IF(" + chosen + ";" + row_labels + "&\" × \"&" + column_labels +
                               "&\": \"&IF(" + z + ">0;\"more\";\"fewer\")&\" than expected (\"&TEXT(" + z +
                               ";\"+0.0;-0.0\")&\")\";\"\"))";
    const std::string more = "IF(" + beyond + ">SUMPRODUCT(" + chosen + ");\"; and \"&(" + beyond + "-SUMPRODUCT(" +
                             chosen + "))&\" more beyond ±2 (see the heat map)\";\"\")";
    return "=IF(" + beyond + "=0;\"None: no cell's adjusted residual is beyond ±2.\";" + listed + "&" + more + "&\".\")";
}

void residuals_block(Layout& s) {
    s.heading("Adjusted residuals: where the counts depart from independence (ASSOC.RESIDUALS)");
    s.header_row();
    s.row_labels();
    const Area body = s.body_here();
    s.plan.array_formula(body, "=ASSOC.RESIDUALS(" + s.table + ";\"adjusted\")", Look::residual);
    s.plan.colour_scale(body);
    s.row += s.body_rows;

    s.plan.text(s.row, 0, "Heat map key", Look::label);
    s.plan.text(s.row, 1, "−3 or less", Look::key_low);
    s.plan.text(s.row, 2, "0", Look::key_middle);
    s.plan.text(s.row, 3, "+3 or more", Look::key_high);
    ++s.row;
    s.wide_line("Purple: fewer counts than independence predicts; orange: more. An adjusted residual is about standard "
                "normal under independence, so a cell beyond ±2 stands out (about 1 cell in 20 does by chance alone); "
                "with many cells, expect a few.",
                Look::note);

    // An estimate of the sentence's length, for the row height.
    std::size_t beyond = 0;
    const Matrix z = residuals(s.reading.table, ResidualKind::adjusted);
    for (double value : z.values()) beyond += std::fabs(value) > 2 ? 1 : 0;
    std::size_t label_length = 0;
    for (const std::string& name : s.reading.row_names) label_length = std::max(label_length, name.size());
    for (const std::string& name : s.reading.column_names) label_length = std::max(label_length, name.size());
    const std::size_t length = 50 + std::min<std::size_t>(beyond, 6) * (2 * label_length + 35);
    // In a table with two columns the second column's residuals only mirror the first's (the same
    // size, the other sign), and so with two rows: the sentence names the first only.
    Area named = body;
    if (s.body_columns == 2 && s.reading.table.columns() == 2) named.columns = 1;
    if (s.body_rows == 2 && s.reading.table.rows() == 2) named.rows = 1;
    const Area labels_column{named.row, 0, named.rows, 1};
    const Area labels_row{named.row - 1, 1, 1, named.columns};
    s.plan.text(s.row, 0, "Cells that stand out", Look::label);
    const Area sentence{s.row, 1, 1, s.last_column};
    s.plan.array_formula(Area{s.row, 1},
                         standouts_formula(named, absolute_area(labels_column), absolute_area(labels_row)), Look::text);
    s.plan.merge(sentence, s.lines_for(length, sentence));
    ++s.row;
    s.gap();
}

// One line of a figures block: label, value (a formula), and a grey note beside it.
void figure_line(Layout& s, const std::string& label, const std::string& formula, Look look, const std::string& note,
                 const std::string& name = "") {
    s.plan.text(s.row, 0, label, Look::label);
    s.plan.formula(s.row, 1, formula, look);
    if (!name.empty()) s.plan.name(name, absolute_cell(s.row, 1));
    if (!note.empty()) {
        const Area area{s.row, 2, 1, s.last_column - 1};
        s.plan.text(s.row, 2, note, Look::note);
        s.plan.merge(area, s.lines_for(note.size(), area));
    }
    ++s.row;
}

// A line whose value is a sentence why a figure is not on the sheet.
void missing_line(Layout& s, const std::string& label, const std::string& why, const std::string& name) {
    s.plan.text(s.row, 0, label, Look::label);
    const Area area{s.row, 1, 1, s.last_column};
    s.plan.text(s.row, 1, why, Look::note);
    s.plan.merge(area, s.lines_for(why.size(), area));
    s.plan.name(name, absolute_cell(s.row, 1));
    ++s.row;
}

const char* exact_left_out =
    "Not on this sheet: for a table this size the exact test takes more than a moment, and the sheet would repeat it "
    "with every change (see the end of the sheet).";

void test_block(Layout& s) {
    const std::string& t = s.table;
    s.heading("Test of independence (Pearson's chi-squared test)");
    figure_line(s, "Pearson X²", "=ASSOC.STATISTIC(" + t + ")", Look::decimal,
                "How far the counts are from independence, added up over the cells (ASSOC.STATISTIC).", "pearson");
    figure_line(s, "Degrees of freedom", "=ASSOC.DF(" + t + ")", Look::whole,
                "(rows − 1) × (columns − 1), counting rows and columns with counts (ASSOC.DF).", "df");
    figure_line(s, "p-value", "=ASSOC.PVALUE(" + t + ")", Look::p_value,
                "The chance of an X² this large or larger if the two were independent (ASSOC.PVALUE).", "p");
    figure_line(s, "Likelihood-ratio G²", "=ASSOC.STATISTIC(" + t + ";\"g\")", Look::decimal,
                "Another measure of the distance from independence; close to X² when counts are large.", "g");
    figure_line(s, "p-value of G²", "=ASSOC.PVALUE(" + t + ";\"g\")", Look::p_value, "", "p_g");
    if (s.exact_live)
        figure_line(s, "Exact p-value", "=" + s.ref("report_exact"), Look::p_value,
                    "Without the chi-squared approximation: from every table with the same totals (ASSOC.EXACT; here "
                    "from ASSOC.REPORT at the end).",
                    "exact");
    else missing_line(s, "Exact p-value", exact_left_out, "exact");
    const std::string alpha = s.ref("alpha");
    s.plan.formula(s.row, 0, "=\"Critical X² at \"&" + percent_of(alpha), Look::label);
    s.plan.formula(s.row, 1, "=ASSOC.CRITICAL(" + s.ref("df") + ";" + alpha + ")", Look::decimal);
    s.plan.name("critical", absolute_cell(s.row, 1));
    {
        const Area area{s.row, 2, 1, s.last_column - 1};
        s.plan.text(s.row, 2, "X² above this value means p below alpha (ASSOC.CRITICAL).", Look::note);
        s.plan.merge(area);
    }
    ++s.row;
    const std::string p = s.ref("p"), x2 = s.ref("pearson"), critical = s.ref("critical");
    const std::string decision =
        "=IF(" + p + "<" + alpha + ";\"Independence rejected at the \"&" + percent_of(alpha) + "&\" level: p = \"&" +
        p_text(p) + "&\" is below alpha, and X² = \"&TEXT(" + x2 + ";\"0.00\")&\" is above the critical value \"&TEXT(" +
        critical + ";\"0.00\")&\".\";\"Independence not rejected at the \"&" + percent_of(alpha) + "&\" level: p = \"&" +
        p_text(p) + "&\" is not below alpha.\")";
    s.sentence_line("Decision", decision, true, 120);
    s.gap();
}

void strength_block(Layout& s) {
    const std::string& t = s.table;
    s.heading("Strength of the association");
    figure_line(s, "Cramér's V", "=ASSOC.STRENGTH(" + t + ")", Look::strength,
                "From 0 (no association) to 1 (each row's counts all in one column) (ASSOC.STRENGTH).", "v");
    {
        // ASSOC.VINTERVAL's second and third values; it takes a millisecond at most (no exact test).
        const std::string interval = "ASSOC.VINTERVAL(" + t + ";0.95)";
        s.plan.text(s.row, 0, "Cramér's V, 95% interval", Look::label);
        s.plan.formula(s.row, 1, "=INDEX(" + interval + ";1;2)", Look::strength);
        s.plan.formula(s.row, 2, "=INDEX(" + interval + ";1;3)", Look::strength);
        s.plan.name("v_lower", absolute_cell(s.row, 1));
        s.plan.name("v_upper", absolute_cell(s.row, 2));
        const std::string note = "lower and upper limit for the V of the population (ASSOC.VINTERVAL); rough for small "
                                 "tables.";
        const Area area{s.row, 3, 1, s.last_column - 2};
        s.plan.text(s.row, 3, note, Look::note);
        s.plan.merge(area, s.lines_for(note.size(), area));
        ++s.row;
    }
    figure_line(s, "Cohen's w", "=ASSOC.STRENGTH(" + t + ";\"w\")", Look::strength,
                "V × √(min(rows, columns) − 1); Cohen's yardstick: 0.1 small, 0.3 medium, 0.5 large.", "w");
    // Cohen (1988), Statistical Power Analysis for the Behavioral Sciences, 2nd ed., ch. 7: w of
    // 0.1, 0.3 and 0.5 are small, medium and large effects (as ASSOC.POWER's description says).
    const std::string w = s.ref("w");
    const std::string words = "=IF(" + w + "<0.1;\"Very weak: below Cohen's small effect (w < 0.1).\";IF(" + w +
                              "<0.3;\"Weak: Cohen's small effect (w from 0.1 to 0.3).\";IF(" + w +
                              "<0.5;\"Moderate: Cohen's medium effect (w from 0.3 to 0.5).\";\"Strong: Cohen's large "
                              "effect (w of 0.5 or more).\")))";
    s.sentence_line("In words", words, true, 60);
    s.gap();
}

void validity_block(Layout& s) {
    s.heading("Can the test be trusted?");
    const std::size_t length = check_validity(s.reading.table).summary().size();
    s.plan.name("validity", absolute_cell(s.row, 1));
    s.sentence_line("Verdict (ASSOC.CHECK)", "=ASSOC.CHECK(" + s.table + ")", true, length);
    s.gap();
}

void conclusion_block(Layout& s) {
    s.heading("Conclusion");
    const Reading& r = s.reading;
    const std::string rows = side_name(r.variables.rows, "rows", r.row_names);
    const std::string columns = side_name(r.variables.columns, "columns", r.column_names);
    const std::string alpha = s.ref("alpha"), p = s.ref("p"), validity = s.ref("validity"), exact = s.ref("exact");
    const std::string doubtful =
        "IF(LEFT(" + validity + ";9)=\"Doubtful:\";\" The chi-squared approximation is doubtful for this table (see the "
        "verdict above), so this p-value may mislead\"&IF(ISNUMBER(" + exact + ");\"; the exact test gives p = \"&" +
        p_text(exact) + "&\".\";\"; ASSOC.EXACT or ASSOC.SIMULATE give a p-value that does not rely on it.\");\"\")";
    const std::string formula = "=\"At the \"&" + percent_of(alpha) + "&\" level, \"&IF(" + p + "<" + alpha + ";" +
                                string_literal(rows + " and " + columns + " appear associated (p = ") + "&" +
                                p_text(p) + "&\").\";" +
                                string_literal("the data do not show an association between " + rows + " and " +
                                               columns + " (p = ") +
                                "&" + p_text(p) + "&\").\")&" + doubtful + "&\" Read the cautions below.\"";
    s.sentence_line("", formula, true, 120 + rows.size() + columns.size());
    s.gap();
}

// The rates of the outcome of interest in each row, with their Wilson intervals. ASSOC.RATES takes
// column 1 of its range as the outcome: when the outcome is another column, the block first arranges
// the counts (labels, the outcome, the rest) on the sheet and gives ASSOC.RATES that.
void rates_block(Layout& s) {
    const CountTable& table = s.reading.table;
    const std::size_t outcome = table.kept_columns()[s.options.outcome_column];
    const std::string outcome_label = s.column_label[outcome];
    std::vector<bool> rest_skip = s.total_column;  // the columns that make up "the rest"
    rest_skip[outcome] = true;
    std::vector<std::size_t> rest;
    for (std::size_t c = 0; c < s.body_columns; ++c)
        if (!rest_skip[c]) rest.push_back(c);
    const bool one_other = rest.size() == 1;
    s.heading("Rates by row, with 95% intervals (ASSOC.RATES)");
    // ASSOC.RATES refuses a first column whose label reads as the absence of another's ("Not promoted"
    // beside "Promoted"); chosen in the dialog, it is meant, so the arranged block heads the rest in words.
    const std::string& outcome_name = s.reading.column_names[outcome];
    const bool names_an_absence = std::any_of(rest.begin(), rest.end(), [&](std::size_t c) {
        return names_the_absence_of(outcome_name, s.reading.column_names[c]);
    });

    std::string source = s.table;
    if (outcome != 0 || names_an_absence) {
        const std::size_t header = s.row;
        // A text in the corner, so that the block is read with its header row whatever the labels hold.
        s.plan.text(header, 0, s.reading.variables.rows.empty() ? "Rows" : s.reading.variables.rows, Look::header);
        s.plan.formula(header, 1, "=" + outcome_label, Look::header);
        if (one_other && !names_an_absence) s.plan.formula(header, 2, "=" + s.column_label[rest[0]], Look::header);
        else s.plan.text(header, 2, one_other ? "The rest" : "The other columns", Look::header);
        ++s.row;
        s.row_labels();
        std::vector<std::string> counts;
        for (std::size_t r = 0; r < s.body_rows; ++r) {
            const std::size_t row = s.observed.row + r;
            counts.push_back("=" + absolute_cell(row, s.observed.column + outcome));
            counts.push_back("=" + sum_over(Area{row, s.observed.column, 1, s.body_columns}, rest_skip));
        }
        s.plan.formulas(Area{s.row, 1, s.body_rows, 2}, std::move(counts), Look::count);
        source = absolute_area(Area{header, 0, s.body_rows + 1, 3});
        s.row += s.body_rows;
        s.wide_line(std::string("The counts arranged for ASSOC.RATES, which takes its first column as the outcome: the "
                                "outcome of interest (chosen in the command's dialog), then ") +
                        (one_other ? "the other column." : "the other columns added up."),
                    Look::note);
    }

    s.plan.look(Area{s.row, 0}, Look::header);
    s.plan.text(s.row, 1, "Row total", Look::header);
    s.plan.formula(s.row, 2, "=\"Rate of \"&" + outcome_label, Look::header);
    s.plan.text(s.row, 3, "Lower 95%", Look::header);
    s.plan.text(s.row, 4, "Upper 95%", Look::header);
    ++s.row;
    s.row_labels();
    // One look per column, none overlapping (the writer applies looks grouped by kind).
    s.plan.array_formula(Area{s.row, 1, s.body_rows, 4}, "=ASSOC.RATES(" + source + ";0.95)", Look::label);
    s.plan.look(Area{s.row, 1, s.body_rows, 1}, Look::count);
    s.plan.look(Area{s.row, 2, s.body_rows, 3}, Look::percent);
    s.row += s.body_rows;

    std::string words = "=\"The rate of \"&" + outcome_label +
                        "&\" in each row is its count over the row's total" +
                        (one_other ? "" : ", the other columns together being the rest") +
                        ", with the 95% Wilson interval: the rates that the counts are compatible with. The outcome of "
                        "interest is chosen in the command's dialog" +
                        (one_other ? "." : "; the row percentages below give every column's share.");
    if (table.is_two_by_two()) words += " Intervals that overlap do not show that the rows do not differ: the rate "
                                        "difference below compares them.";
    else if (table.rows() >= 3) words += " Intervals that overlap do not show that two rows do not differ: the "
                                         "comparisons of pairs below test that.";
    words += "\"";
    s.wide_line(words, Look::note, true, words.size());
    s.gap();
}

void two_by_two_block(Layout& s) {
    const CountTable& table = s.reading.table;
    if (!table.is_two_by_two()) return;
    s.heading("Odds ratio, risk ratio and rate difference (2×2 table)");
    const std::size_t group = table.kept_rows()[s.options.group_row], other = table.kept_rows()[1 - s.options.group_row];
    const std::size_t outcome = table.kept_columns()[s.options.outcome_column],
                      rest = table.kept_columns()[1 - s.options.outcome_column];
    auto observed = [&](std::size_t r, std::size_t c) { return absolute_cell(s.observed.row + r, s.observed.column + c); };
    const std::size_t header = s.row;
    s.plan.look(Area{header, 0}, Look::header);
    s.plan.formula(header, 1, "=" + s.column_label[outcome], Look::header);
    s.plan.formula(header, 2, "=" + s.column_label[rest], Look::header);
    s.plan.formula(header + 1, 0, "=" + s.row_label[group], Look::label);
    s.plan.formula(header + 2, 0, "=" + s.row_label[other], Look::label);
    s.plan.formula(header + 1, 1, "=" + observed(group, outcome), Look::count);
    s.plan.formula(header + 1, 2, "=" + observed(group, rest), Look::count);
    s.plan.formula(header + 2, 1, "=" + observed(other, outcome), Look::count);
    s.plan.formula(header + 2, 2, "=" + observed(other, rest), Look::count);
    const Area arranged{header + 1, 1, 2, 2};
    s.row = header + 3;
    s.wide_line("The table arranged for the ratios: the outcome of interest in the first column, the group compared in "
                "the first row (both chosen in the command's dialog).",
                Look::note);

    s.plan.look(Area{s.row, 0}, Look::header);
    s.plan.text(s.row, 1, "Estimate", Look::header);
    s.plan.text(s.row, 2, "Lower 95%", Look::header);
    s.plan.text(s.row, 3, "Upper 95%", Look::header);
    ++s.row;
    const std::size_t odds_row = s.row;
    s.plan.text(s.row, 0, "Odds ratio (ASSOC.ODDSRATIO)", Look::label);
    s.plan.array_formula(Area{s.row, 1, 1, 3}, "=ASSOC.ODDSRATIO(" + absolute_area(arranged) + ";0.95)", Look::decimal);
    ++s.row;
    const std::size_t risk_row = s.row;
    s.plan.text(s.row, 0, "Risk ratio (ASSOC.RISKRATIO)", Look::label);
    s.plan.array_formula(Area{s.row, 1, 1, 3}, "=ASSOC.RISKRATIO(" + absolute_area(arranged) + ";0.95)", Look::decimal);
    ++s.row;
    const std::size_t difference_row = s.row;
    s.plan.text(s.row, 0, "Rate difference (ASSOC.RATEDIFF)", Look::label);
    s.plan.array_formula(Area{s.row, 1, 1, 3}, "=ASSOC.RATEDIFF(" + absolute_area(arranged) + ";0.95)", Look::percent);
    ++s.row;

    const std::string a = absolute_cell(header + 1, 1), b = absolute_cell(header + 1, 2), c = absolute_cell(header + 2, 1),
                      d = absolute_cell(header + 2, 2);
    const std::string outcome_name = absolute_cell(header, 1), group_name = absolute_cell(header + 1, 0),
                      other_name = absolute_cell(header + 2, 0);
    auto two = [](const std::string& cell) { return "TEXT(" + cell + ";\"0.00\")"; };
    auto points = [](const std::string& cell) { return "TEXT(" + cell + "*100;\"0.0\")"; };
    const std::string words =
        "=\"The odds of \"&" + outcome_name + "&\" in \"&" + group_name + "&\" are \"&" + two(absolute_cell(odds_row, 1)) +
        "&\" times those in \"&" + other_name + "&\" (95% interval \"&" + two(absolute_cell(odds_row, 2)) + "&\" to \"&" +
        two(absolute_cell(odds_row, 3)) + "&\"). The share with \"&" + outcome_name + "&\" is \"&TEXT(" + a + "/(" + a +
        "+" + b + ");\"0.0%\")&\" in \"&" + group_name + "&\" against \"&TEXT(" + c + "/(" + c + "+" + d +
        ");\"0.0%\")&\" in \"&" + other_name + "&\": \"&" + two(absolute_cell(risk_row, 1)) + "&\" times as high (\"&" +
        two(absolute_cell(risk_row, 2)) + "&\" to \"&" + two(absolute_cell(risk_row, 3)) + "&\"), a difference of \"&" +
        points(absolute_cell(difference_row, 1)) + "&\" percentage points (\"&" + points(absolute_cell(difference_row, 2)) +
        "&\" to \"&" + points(absolute_cell(difference_row, 3)) +
        "&\"). An interval that includes 1 (for a ratio) or 0 (for the difference) is compatible with no difference.\"";
    s.sentence_line("In words", words, true, 380);
    s.gap();
}

// The range ASSOC.PAIRWISE gets, so that it names the pairs by their labels: the source table, or for
// records the counts with the row labels beside them (ASSOC.LEVELS), when ASSOC.PAIRWISE reads those
// as labels (texts, none of them read as a total), otherwise the counts alone (pairs named "row k").
std::string pairwise_range(const Layout& s) {
    if (!s.reading.is_records()) return s.table;
    const std::vector<Cell>& levels = s.reading.record_source->row_levels;
    const Matrix counts = s.reading.table.to_body_shape(s.reading.table.counts());
    CellGrid labelled(s.body_rows, 1 + s.body_columns);
    for (std::size_t r = 0; r < s.body_rows && r < levels.size(); ++r) {
        labelled.at(r, 0) = levels[r];
        for (std::size_t c = 0; c < s.body_columns; ++c) labelled.at(r, 1 + c) = Cell::number(counts(r, c));
    }
    try {
        const CountTable read = read_count_table(labelled);
        const bool totals = std::any_of(read.set_aside_rows().begin(), read.set_aside_rows().end(),
                                        [](const SetAside& line) { return line.why == SetAside::Why::total; });
        if (read.has_row_labels() && !totals) return absolute_area(Area{s.observed.row, 0, s.body_rows, 1 + s.body_columns});
    } catch (const Error&) {
    }
    return s.table;
}

// Every pair of rows compared (3 rows with counts or more; with 2, the test above is the comparison).
void pairwise_block(Layout& s) {
    const std::size_t groups = s.reading.table.rows();
    if (groups < 3) return;
    const std::size_t pairs = groups * (groups - 1) / 2;
    s.heading("Which rows differ from which: every pair compared (ASSOC.PAIRWISE)");
    if (groups > max_pairwise_sheet_rows) {
        s.wide_line("Not on this sheet: the " + std::to_string(groups) + " rows with counts make " +
                        std::to_string(pairs) + " pairs, too many to read here. To see them, enter =ASSOC.PAIRWISE(" +
                        s.table_shown + ") as an array formula over 4 columns and " + std::to_string(pairs) +
                        " rows in a sheet of its own, or compare the rows that matter to you in a table of their own.",
                    Look::note);
        s.gap();
        return;
    }
    s.wide_line("Each pair of rows is tested on its own table of the two rows (Pearson's X²), and its p-value is "
                "adjusted for the " + std::to_string(pairs) + " comparisons (Holm's method). Rows without counts take "
                "no part.",
                Look::note);
    s.plan.text(s.row, 0, s.reading.variables.rows.empty() ? "Row" : s.reading.variables.rows, Look::header);
    s.plan.text(s.row, 1, "Compared with", Look::header);
    s.plan.text(s.row, 2, "p-value", Look::header);
    s.plan.text(s.row, 3, "Adjusted p-value", Look::header);
    ++s.row;
    const std::size_t first = s.row;
    const std::string range = pairwise_range(s);
    s.plan.array_formula(Area{first, 0, pairs, 4}, "=ASSOC.PAIRWISE(" + range + ")", Look::label);
    s.plan.look(Area{first, 1, pairs, 1}, Look::text);  // the second label wraps in its narrow column
    s.plan.look(Area{first, 2, pairs, 2}, Look::p_value);
    s.row += pairs;

    // The pairs whose adjusted p-value is below alpha, the smallest first when there are more than 6.
    const std::string alpha = s.ref("alpha");
    const std::string adjusted = absolute_area(Area{first, 3, pairs, 1});
    const std::string names = absolute_area(Area{first, 0, pairs, 1}) + "&\" and \"&" + absolute_area(Area{first, 1, pairs, 1});
    const std::string below = "SUMPRODUCT(" + adjusted + "<" + alpha + ")";
    const std::string threshold = "IF(" + below + ">6;SMALL(" + adjusted + ";6);1)";
    const std::string chosen = "(" + adjusted + "<" + alpha + ")*(" + adjusted + "<=" + threshold + ")";
    const std::string listed = "TEXTJOIN(\"; \";1;IF(" + chosen + ";" + names + "&\" (adjusted p = \"&" +
                               p_text(adjusted) + "&\")\";\"\"))";
    const std::string more = "IF(" + below + ">SUMPRODUCT(" + chosen + ");\"; and \"&(" + below + "-SUMPRODUCT(" +
                             chosen + "))&\" more pairs (see the table)\";\"\")";
    const std::string formula = "=IF(" + below + "=0;\"None: no pair of rows differs at the \"&" + percent_of(alpha) +
                                "&\" level once the p-values are adjusted.\";" + listed + "&" + more + "&\".\")";
    // Estimates of the sentences' lengths, for the row heights, from the pairs as they are now.
    std::size_t length = 10, listed_now = 0, verdict = check_validity(s.reading.table).summary().size() + 45;
    try {
        const PairwiseComparisons now = pairwise_comparisons(s.reading.table);
        for (const PairComparison& pair : now.pairs)
            if (pair.adjusted_p_value < s.options.alpha && listed_now++ < 6)
                length += pair.first_name.size() + pair.second_name.size() + 30;
        if (listed_now == 0) length = 80;  // "None: …"
        for (const std::string& remark : now.remarks) verdict += remark.size() + 1;
    } catch (const Error&) {
        // The cells will say what is wrong; the estimates stay short.
    }
    s.plan.formula(s.row, 0, "=\"Pairs that differ at \"&" + percent_of(alpha), Look::label);
    const Area sentence{s.row, 1, 1, s.last_column};
    s.plan.array_formula(Area{s.row, 1}, formula, Look::text);
    s.plan.merge(sentence, s.lines_for(length, sentence));
    ++s.row;
    // The verdict on the table, and which pairs have expected counts too small for their p-values.
    s.sentence_line("Verdict on the pairs", "=ASSOC.CHECK(" + range + ";\"pairwise\")", true, verdict);
    s.wide_line("Read the adjusted p-value: every comparison is another chance of a false alarm, so with " +
                    std::to_string(pairs) + " comparisons some unadjusted p-values come out small by chance alone, "
                    "and the adjustment allows for that. A difference between two groups is not proof of "
                    "discrimination, nor does it show what causes it.",
                Look::caution);
    s.gap();
}

void row_percent_block(Layout& s) {
    s.heading("Row percentages: each row's counts as shares of its total");
    const std::size_t header = s.row;
    s.header_row();
    s.row_labels();
    std::vector<std::string> shares;
    for (std::size_t r = 0; r < s.body_rows; ++r)
        for (std::size_t c = 0; c < s.body_columns; ++c) {
            const std::string observed = absolute_cell(s.observed.row + r, s.observed.column + c);
            // A total column of the source has no share of its own.
            shares.push_back(s.total_column[c] ? ""
                                               : "=IF(" + s.row_total[r] + "=0;\"\";" + observed + "/" + s.row_total[r] + ")");
        }
    s.plan.formulas(s.body_here(), std::move(shares), Look::percent);
    s.row += s.body_rows;
    const std::size_t chart_rows = 6 + 2 * s.body_rows;
    ChartPlan chart;
    chart.title = "Row percentages";
    chart.data = Area{header, 0, s.body_rows + 1, s.body_columns + 1};
    chart.anchor = Area{s.row + 1, 0, chart_rows, std::min<std::size_t>(s.last_column + 1, 4)};
    s.plan.chart(chart);
    s.row += chart_rows + 2;
}

void cautions_block(Layout& s) {
    s.heading("Before you act on this");
    s.wide_line("A significant association is not proof of discrimination, nor of cause: other differences between the "
                "groups (role, grade, location, timing, who applied) can produce it, and a result that is not "
                "significant is not proof of fairness.",
                Look::caution);
    s.wide_line("Small samples mislead in both directions, and so do many tests on the same data: some will look "
                "significant by chance.",
                Look::caution);
    s.wide_line("For decisions about people, follow applicable law and policy and seek qualified advice.", Look::caution);
    s.gap();
}

void report_block(Layout& s) {
    s.heading("The whole account in one formula (ASSOC.REPORT)");
    if (!s.exact_live) {
        s.wide_line("Left out of this sheet: ASSOC.REPORT also runs the exact test, which for a table this size takes "
                    "more than a moment, and the sheet would repeat it with every change. To see it, enter =ASSOC.REPORT(" +
                        s.table_shown + ") as an array formula over 2 columns and 22 rows in a sheet of its own (the "
                        "exact test stops after 2 seconds), or use ASSOC.SIMULATE for a simulated p-value.",
                    Look::note);
        return;
    }
    s.wide_line("The exact p-value above comes from this block. It is folded away: click + in the margin at the left "
                "to unfold it.",
                Look::note);
    const Area block{s.row, 0, report_lines, 2};
    s.plan.collapse_rows(s.row, report_lines);
    s.plan.array_formula(block, "=ASSOC.REPORT(" + s.table + ";" + s.ref("alpha") + ")", Look::label);
    s.plan.name("report_exact", absolute_cell(s.row + report_line_exact - 1, 1));
    s.row += report_lines;
}

}  // namespace

// The sheet, top to bottom. A new block goes here (it may refer to the cells others name).
const std::vector<std::function<void(Layout&)>> blocks{
    title_block,    counts_block,     expected_block, residuals_block,  test_block,        strength_block,
    validity_block, conclusion_block, rates_block,    two_by_two_block, pairwise_block,    row_percent_block,
    cautions_block, report_block,
};

void check_options(const CommandOptions& options) {
    require(std::isfinite(options.alpha) && options.alpha > 0 && options.alpha < 1,
            "The significance level (alpha) must be between 0 and 1, for example 0.05; it is " +
                format_number(options.alpha, 6) + ".");
    require(options.group_row <= 1, "The group compared must be the first or the second of the two rows.");
}

bool exact_test_is_quick(const CountTable& table) {
    if (!table.whole_counts()) return false;
    try {
        exact_p_value(table, Side::two_sided, calc::command_exact_probe_limits);
        return true;
    } catch (const Error&) {
        return false;
    }
}

SheetPlan plan_analysis_sheet(const Reading& reading, const CommandOptions& options, bool exact_live) {
    check_options(options);
    Layout layout(reading, options);
    layout.exact_live = exact_live;
    layout.body_rows = reading.table.body_rows();
    layout.body_columns = reading.table.body_columns();
    layout.last_column = std::max(layout.body_columns + 1, min_text_columns);
    const std::size_t outcomes = reading.table.columns();
    require(options.outcome_column < outcomes,
            "The outcome of interest must be one of the " + std::to_string(outcomes) +
                " columns with counts (OutcomeColumn from 1 to " + std::to_string(outcomes) + "); it is column " +
                std::to_string(options.outcome_column + 1) + ".");
    layout.total_row.assign(layout.body_rows, false);
    layout.total_column.assign(layout.body_columns, false);
    for (const SetAside& line : reading.table.set_aside_rows())
        if (line.why == SetAside::Why::total) layout.total_row[line.index] = true;
    for (const SetAside& line : reading.table.set_aside_columns())
        if (line.why == SetAside::Why::total) layout.total_column[line.index] = true;
    for (const auto& block : blocks) block(layout);
    layout.plan.column_width(0, label_width);
    for (std::size_t c = 1; c <= layout.last_column; ++c) layout.plan.column_width(c, column_width);
    layout.plan.resolve();
    return std::move(layout.plan);
}

std::string sheet_base_name(const Reading& reading) {
    const VariableNames& v = reading.variables;
    std::string name;
    if (!v.rows.empty() && !v.columns.empty()) name = v.rows + " × " + v.columns;
    else if (!v.rows.empty()) name = v.rows;
    else if (reading.table_source) name = reading.table_source->range.sheet + " " + range_address(reading.table_source->range);
    else name = reading.record_source->row_labels.sheet + " records";
    std::string clean;
    for (char c : name) {
        if (c == ':') clean += '-';
        else if (std::string("[]*?/\\").find(c) == std::string::npos) clean += c;
    }
    while (!clean.empty() && (clean.front() == '\'' || clean.front() == ' ')) clean.erase(clean.begin());
    while (!clean.empty() && (clean.back() == '\'' || clean.back() == ' ')) clean.pop_back();
    // At most 31 characters (what other spreadsheet files allow), not cutting a UTF-8 sequence.
    if (clean.size() > 31) {
        std::size_t cut = 31;
        while (cut > 0 && (static_cast<unsigned char>(clean[cut]) & 0xC0) == 0x80) --cut;
        clean.resize(cut);
        while (!clean.empty() && clean.back() == ' ') clean.pop_back();
    }
    return clean.empty() ? "Analysis" : clean;
}

}  // namespace assoc::command
