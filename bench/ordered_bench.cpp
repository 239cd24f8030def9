// Times the core of ASSOC.ORDINAL, ASSOC.STRENGTH "gamma"/"taub", ASSOC.WITHIN and ASSOC.REPEATED on
// the largest inputs their speed goal names, and prints milliseconds per call against the goal of
// 50 ms: tables up to 20×20 with n up to 1,000,000 (for ASSOC.WITHIN, strata of 20×20 whose counts
// add up to 1,000,000), and 10,000 people × 10 occasions. Each call starts from the cells (a CellGrid
// as the add-in hands it over), so reading the range is included; converting Calc's values into
// cells is not (bench/calc/ordered_in_calc.py times the whole call in Calc). Also the cost of
// ordering simulated tables by probability ("exact") beside ordering them by X².
// Times are CPU time of this process (std::clock), the mean of several calls.
#include <cmath>
#include <cstdio>
#include <ctime>
#include <random>
#include <string>
#include <utility>
#include <vector>

#include "assoc/cochrans_q.hpp"
#include "assoc/count_table.hpp"
#include "assoc/generalized_mantel_haenszel.hpp"
#include "assoc/monte_carlo.hpp"
#include "assoc/ordinal_measures.hpp"
#include "assoc/ordinal_test.hpp"

namespace {

constexpr double goal_ms = 50.0;

// CPU milliseconds per call of `action`, over enough calls to last about a quarter of a second.
template <class Action>
double milliseconds(Action action) {
    int calls = 0;
    const std::clock_t start = std::clock();
    double elapsed = 0;
    do {
        action();
        ++calls;
        elapsed = static_cast<double>(std::clock() - start) / CLOCKS_PER_SEC;
    } while (elapsed < 0.25 && calls < 1000);
    return elapsed * 1000 / calls;
}

int misses = 0;

void report(const std::string& what, double ms, bool has_goal = true) {
    std::printf("  %-62s %9.3f ms", what.c_str(), ms);
    if (has_goal) {
        std::printf("   %s", ms < goal_ms ? "under 50 ms" : "MISS (over 50 ms)");
        misses += ms >= goal_ms;
    }
    std::printf("\n");
}

// Counts of a table with a mild ordered association, adding up to about `n`.
std::vector<double> ordered_counts(std::size_t rows, std::size_t columns, double n, std::mt19937& generator) {
    std::vector<double> weights(rows * columns);
    std::uniform_real_distribution<double> noise(0.5, 1.5);
    double sum = 0;
    for (std::size_t r = 0; r < rows; ++r)
        for (std::size_t c = 0; c < columns; ++c) {
            const double w = noise(generator) * (1.0 + 0.02 * static_cast<double>(r * c));
            weights[r * columns + c] = w;
            sum += w;
        }
    for (double& w : weights) w = std::floor(w / sum * n);
    return weights;
}

// A labelled table as a range: header row, label column, counts.
assoc::CellGrid table_range(std::size_t rows, std::size_t columns, const std::vector<double>& counts) {
    assoc::CellGrid range(rows + 1, columns + 1);
    for (std::size_t c = 0; c < columns; ++c) range.at(0, c + 1) = assoc::Cell::text("Answer " + std::to_string(c + 1));
    for (std::size_t r = 0; r < rows; ++r) {
        range.at(r + 1, 0) = assoc::Cell::text("Band " + std::to_string(r + 1));
        for (std::size_t c = 0; c < columns; ++c) range.at(r + 1, c + 1) = assoc::Cell::number(counts[r * columns + c]);
    }
    return range;
}

// K strata of rows × columns in the long layout, counts adding up to about n over all strata.
assoc::CellGrid long_range(std::size_t strata, std::size_t rows, std::size_t columns, double n, std::mt19937& generator) {
    assoc::CellGrid range(1 + strata * rows, 2 + columns);
    range.at(0, 0) = assoc::Cell::text("Office");
    range.at(0, 1) = assoc::Cell::text("Band");
    for (std::size_t c = 0; c < columns; ++c) range.at(0, c + 2) = assoc::Cell::text("Answer " + std::to_string(c + 1));
    for (std::size_t k = 0; k < strata; ++k) {
        const std::vector<double> counts = ordered_counts(rows, columns, n / static_cast<double>(strata), generator);
        for (std::size_t r = 0; r < rows; ++r) {
            const std::size_t row = 1 + k * rows + r;
            range.at(row, 0) = assoc::Cell::text("Office " + std::to_string(k + 1));
            range.at(row, 1) = assoc::Cell::text("Band " + std::to_string(r + 1));
            for (std::size_t c = 0; c < columns; ++c) range.at(row, c + 2) = assoc::Cell::number(counts[r * columns + c]);
        }
    }
    return range;
}

// People × occasions of yes/no answers (texts or 1/0) with a header row; yes becomes rarer over time.
assoc::CellGrid answers_range(std::size_t people, std::size_t occasions, bool texts, std::mt19937& generator) {
    assoc::CellGrid range(people + 1, occasions);
    std::uniform_real_distribution<double> uniform(0, 1);
    for (std::size_t j = 0; j < occasions; ++j) range.at(0, j) = assoc::Cell::text("Wave " + std::to_string(j + 1));
    for (std::size_t i = 0; i < people; ++i) {
        const double leaning = uniform(generator);
        for (std::size_t j = 0; j < occasions; ++j) {
            const bool yes = uniform(generator) < 0.3 + 0.5 * leaning - 0.01 * static_cast<double>(j);
            range.at(i + 1, j) = texts ? assoc::Cell::text(yes ? "Yes" : "No") : assoc::Cell::number(yes ? 1 : 0);
        }
    }
    return range;
}

}  // namespace

int main() {
    std::mt19937 generator(13);
    double sink = 0;  // results are added up so that no call can be left out

    std::printf("ASSOC.ORDINAL and ASSOC.STRENGTH (gamma, taub): from the cells of a labelled table\n");
    for (const auto& [rows, columns] : {std::pair<std::size_t, std::size_t>{5, 5}, {20, 20}}) {
        const std::vector<double> counts = ordered_counts(rows, columns, 1e6, generator);
        const assoc::CellGrid range = table_range(rows, columns, counts);
        const std::string shape = std::to_string(rows) + "x" + std::to_string(columns) + ", n = 1,000,000";
        report("ORDINAL " + shape, milliseconds([&] { sink += assoc::ordinal_test(range).statistic; }));
        report("STRENGTH gamma " + shape,
               milliseconds([&] { sink += assoc::goodman_kruskal_gamma(assoc::read_count_table(range)); }));
        report("STRENGTH taub " + shape,
               milliseconds([&] { sink += assoc::kendall_tau_b(assoc::read_count_table(range)); }));
    }

    std::printf("\nASSOC.WITHIN: strata of 20x20 in the long layout, n = 1,000,000 in all\n");
    for (std::size_t strata : {2, 5, 10, 20, 50}) {
        const assoc::CellGrid range = long_range(strata, 20, 20, 1e6, generator);
        report(std::to_string(strata) + " strata (" + std::to_string(range.rows() - 1) + " rows of the range)",
               milliseconds([&] { sink += assoc::general_association_test(range).statistic; }), strata <= 20);
    }
    const assoc::CellGrid small_strata = long_range(200, 3, 4, 1e6, generator);
    report("200 strata of 3x4", milliseconds([&] { sink += assoc::general_association_test(small_strata).statistic; }),
           false);

    std::printf("\nASSOC.REPEATED: 10,000 people x 10 occasions, with a header row\n");
    const assoc::CellGrid texts = answers_range(10'000, 10, true, generator);
    const assoc::CellGrid numbers = answers_range(10'000, 10, false, generator);
    report("text labels Yes/No", milliseconds([&] { sink += assoc::cochrans_q_test(texts).statistic; }));
    report("1 and 0", milliseconds([&] { sink += assoc::cochrans_q_test(numbers).statistic; }));
    const assoc::CellGrid many = answers_range(100'000, 10, true, generator);
    report("100,000 people x 10 occasions, text labels", milliseconds([&] {
               sink += assoc::cochrans_q_test(many).statistic;
           }), false);

    std::printf("\nASSOC.SIMULATE, 100,000 trials of a 5x5 table of n = 450: ordering tables by X^2 or by probability\n");
    const assoc::CountTable five = assoc::read_count_table(table_range(5, 5, ordered_counts(5, 5, 450, generator)));
    assoc::SimulationOptions by_statistic;
    assoc::SimulationOptions by_probability;
    by_probability.order = assoc::SimulationOrder::probability;
    const double statistic_ms = milliseconds([&] { sink += assoc::monte_carlo_test(five, by_statistic).p_value; });
    const double probability_ms = milliseconds([&] { sink += assoc::monte_carlo_test(five, by_probability).p_value; });
    report("by X^2 (\"pearson\")", statistic_ms, false);
    report("by probability (\"exact\")", probability_ms, false);
    std::printf("  ratio exact / pearson: %.2f\n", probability_ms / statistic_ms);

    std::printf("\n%s (checksum %g)\n", misses == 0 ? "All within the goal of 50 ms." : "Some figures MISS the goal.", sink);
    return 0;
}
