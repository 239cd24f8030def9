// Evaluates core functions on the inputs of the precision battery (tests/precision/battery.py):
// one case per line on standard input,
//     <id> <function> <rows> <columns> <rows × columns numbers, row by row>
// and one line per case on standard output, `<id> <values…>` with 17 significant digits, or
// `<id> error <message>`. The functions are called as the worksheet functions call them (the core's
// CellGrid entry points, which read ranges as the add-in passes them), so the digits are the cells'.
#include <cstdio>
#include <cstdlib>
#include <iostream>
#include <sstream>
#include <string>
#include <vector>

#include "assoc/assoc.hpp"

namespace {

using namespace assoc;

struct Case {
    std::string id, function;
    std::size_t rows = 0, columns = 0;
    std::vector<double> values;
    double at(std::size_t r, std::size_t c) const { return values[r * columns + c]; }
    CellGrid grid() const {
        CellGrid cells(rows, columns);
        for (std::size_t r = 0; r < rows; ++r)
            for (std::size_t c = 0; c < columns; ++c) cells.at(r, c) = Cell::number(at(r, c));
        return cells;
    }
    std::vector<double> row(std::size_t r) const {
        return std::vector<double>(values.begin() + static_cast<std::ptrdiff_t>(r * columns),
                                   values.begin() + static_cast<std::ptrdiff_t>((r + 1) * columns));
    }
};

void append(std::vector<double>& out, const Matrix& m) { out.insert(out.end(), m.values().begin(), m.values().end()); }

std::vector<double> evaluate(const Case& k) {
    const std::string& f = k.function;
    if (f == "pearson" || f == "g" || f == "yates") {
        const Method method = f == "pearson" ? Method::pearson : f == "g" ? Method::likelihood_ratio : Method::yates;
        const TestResult t = independence_test(read_count_table(k.grid()), method);
        return {t.statistic, t.p_value};
    }
    if (f == "expected") return expected_counts(read_count_table(k.grid())).values();
    if (f == "residuals") {
        const CountTable table = read_count_table(k.grid());
        std::vector<double> out;
        append(out, residuals(table, ResidualKind::pearson));
        append(out, residuals(table, ResidualKind::adjusted));
        return out;
    }
    if (f == "strength") {
        const CountTable table = read_count_table(k.grid());
        std::vector<double> out{cramers_v(table), cramers_v_corrected(table), contingency_coefficient(table),
                                cohens_w(table)};
        if (table.is_two_by_two()) out.push_back(phi_coefficient(table));
        return out;
    }
    if (f == "exact") {
        const CountTable table = read_count_table(k.grid());
        std::vector<double> out{exact_p_value(table, Side::two_sided)};
        if (table.is_two_by_two()) {
            out.push_back(exact_p_value(table, Side::lower));
            out.push_back(exact_p_value(table, Side::upper));
        }
        return out;
    }
    if (f == "ratios") {
        const CountTable table = read_count_table(k.grid());
        const RatioEstimate odds = odds_ratio(table), risk = risk_ratio(table);
        return {odds.estimate, odds.lower, odds.upper, risk.estimate, risk.lower, risk.upper};
    }
    if (f == "celltest") return cell_p_values(read_count_table(k.grid()), PAdjustment::holm).values();
    if (f == "vinterval") {
        const CramersVInterval v = cramers_v_interval(read_count_table(k.grid()));
        return {v.lower, v.upper};
    }
    if (f == "fit") {
        const GoodnessOfFit fit = goodness_of_fit(k.row(0), k.row(1));
        return {fit.p_value, fit.statistic};
    }
    if (f == "critical") return {chi_squared_critical_value(k.at(0, 0), k.at(0, 1))};
    if (f == "power") return {chi_squared_power(k.at(0, 0), k.at(0, 1), k.at(0, 2), k.at(0, 3))};
    if (f == "samplesize") return {chi_squared_sample_size(k.at(0, 0), k.at(0, 1), k.at(0, 2), k.at(0, 3))};
    if (f == "strata") {
        const MantelHaenszelResult corrected = mantel_haenszel_test(k.grid(), Continuity::corrected);
        const MantelHaenszelResult plain = mantel_haenszel_test(k.grid(), Continuity::uncorrected);
        return {corrected.p_value, corrected.statistic, plain.p_value, plain.statistic, corrected.common_odds_ratio,
                corrected.lower, corrected.upper};
    }
    if (f == "homogeneity") {
        const HomogeneityResult h = breslow_day_test(k.grid());
        return {h.p_value, h.statistic};
    }
    if (f == "paired") {
        if (k.rows == 2) {
            const PairedResult corrected = paired_test(k.grid(), PairedMethod::corrected);
            const PairedResult plain = paired_test(k.grid(), PairedMethod::uncorrected);
            const PairedResult exact = paired_test(k.grid(), PairedMethod::exact);
            return {corrected.p_value, corrected.statistic, plain.p_value, plain.statistic, exact.p_value};
        }
        const PairedResult bowker = paired_test(k.grid());
        return {bowker.p_value, bowker.statistic, bowker.df};
    }
    if (f == "trend") {
        CellGrid table(2, k.columns), scores(1, k.columns);
        for (std::size_t c = 0; c < k.columns; ++c) {
            table.at(0, c) = Cell::number(k.at(0, c));
            table.at(1, c) = Cell::number(k.at(1, c));
            scores.at(0, c) = Cell::number(k.at(2, c));
        }
        const TrendResult t = trend_test(table, scores);
        return {t.p_value, t.z};
    }
    throw Error("unknown function " + f);
}

}  // namespace

int main() {
    std::string line;
    while (std::getline(std::cin, line)) {
        if (line.empty()) continue;
        std::istringstream in(line);
        Case k;
        in >> k.id >> k.function >> k.rows >> k.columns;
        k.values.resize(k.rows * k.columns);
        // strtod, not >>: it reads subnormal numbers (an alpha of 1e-310) instead of failing on them.
        std::string token;
        for (double& v : k.values) {
            in >> token;
            char* end = nullptr;
            v = std::strtod(token.c_str(), &end);
            if (end == token.c_str() || *end != '\0') in.setstate(std::ios::failbit);
        }
        if (!in) {
            std::printf("%s error unreadable case\n", k.id.c_str());
            continue;
        }
        try {
            const std::vector<double> out = evaluate(k);
            std::printf("%s", k.id.c_str());
            for (double v : out) std::printf(" %.17g", v);
            std::printf("\n");
        } catch (const std::exception& e) {
            std::printf("%s error %s\n", k.id.c_str(), e.what());
        }
    }
    return 0;
}
