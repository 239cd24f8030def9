// Fuzz target: ordered categories: Mantel's test of linear association with row and column scores
// (ordinal_test), Goodman–Kruskal's gamma and Kendall's tau-b.
// Input: section 1 is the range; sections 2 and 3, if present, the row and the column scores.
// Checks: only assoc::Error leaves the core; the p-value in [0, 1]; the statistic ≥ 0 and (n − 1) r²
// with r in [−1, 1]; gamma and tau-b in [−1, 1] with |tau-b| ≤ |gamma|; scores moved and stretched
// (2s + 1) change nothing; counts multiplied by a power of 4 leave r, gamma and tau-b.
#include <cmath>

#include "assoc/count_table.hpp"
#include "assoc/ordinal_measures.hpp"
#include "assoc/ordinal_test.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

namespace {

struct Figures {
    double correlation = NAN, gamma = NAN, tau_b = NAN;
};

CellGrid stretched(const CellGrid& scores) {
    CellGrid result = scores;
    for (std::size_t r = 0; r < scores.rows(); ++r)
        for (std::size_t c = 0; c < scores.columns(); ++c)
            if (scores.at(r, c).is_number()) result.at(r, c) = Cell::number(2 * scores.at(r, c).as_number() + 1);
    return result;
}

Figures check_ordinal(const CellGrid& range, const CellGrid& row_scores, const CellGrid& column_scores) {
    Figures figures;
    attempt("ordinal_test", [&] {
        const OrdinalResult result = ordinal_test(range, row_scores, column_scores);
        check_probability(result.p_value, "ordinal p-value");
        check_nonnegative(result.statistic, "ordinal statistic");
        check_between(result.correlation, -1 - 1e-12, 1 + 1e-12, "correlation");
        figures.correlation = result.correlation;
    });
    CountTable table;
    if (!attempt("read_count_table", [&] { table = read_count_table(range); })) return figures;
    attempt("gamma", [&] { figures.gamma = goodman_kruskal_gamma(table); check_between(figures.gamma, -1, 1, "gamma"); });
    attempt("tau-b", [&] { figures.tau_b = kendall_tau_b(table); check_between(figures.tau_b, -1, 1, "tau-b"); });
    // Equal when nothing is tied; with one cell of 1e11 beside a few small ones, pair counts near 1e22
    // carry rounding of about 1e-8 of the difference, so the check allows 1e-7.
    if (std::isfinite(figures.gamma) && std::isfinite(figures.tau_b) &&
        std::fabs(figures.tau_b) > std::fabs(figures.gamma) * (1 + 1e-7) + 1e-15)
        finding("tau-b (" + std::to_string(figures.tau_b) + ") is further from 0 than gamma (" +
                std::to_string(figures.gamma) + ")");
    return figures;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& range = section(sections, 0);
    const CellGrid& row_scores = section(sections, 1);
    const CellGrid& column_scores = section(sections, 2);
    const Figures figures = check_ordinal(range, row_scores, column_scores);
    if (!std::isfinite(figures.correlation)) return 0;
    const CellGrid row_stretched = stretched(row_scores), column_stretched = stretched(column_scores);
    const Figures moved = check_ordinal(range, row_stretched, column_stretched);
    if (std::isfinite(moved.correlation) && !close(moved.correlation, figures.correlation, 1e-7))
        finding("scores 2s + 1 change the correlation");
    const double k = scale_factor(data, size);
    const CellGrid bigger = scaled(range, k);
    const Figures scaled_figures = check_ordinal(bigger, row_scores, column_scores);
    const std::string times = " of the table times " + std::to_string(k) + " differs";
    if (std::isfinite(scaled_figures.correlation) && !close(scaled_figures.correlation, figures.correlation, 1e-7))
        finding("the correlation" + times);
    if (std::isfinite(figures.gamma) && std::isfinite(scaled_figures.gamma) && !close(scaled_figures.gamma, figures.gamma, 1e-9))
        finding("gamma" + times);
    if (std::isfinite(figures.tau_b) && std::isfinite(scaled_figures.tau_b) && !close(scaled_figures.tau_b, figures.tau_b, 1e-9))
        finding("tau-b" + times);
    return 0;
}
