#include "assoc/monte_carlo.hpp"

#include <algorithm>
#include <chrono>
#include <boost/math/special_functions/gamma.hpp>
#include <cmath>
#include <numeric>
#include <random>
#include <vector>

#include "argument_checks.hpp"
#include "assoc/error.hpp"
#include "assoc/exact_test.hpp"
#include "assoc/format.hpp"
#include "boost_policy.hpp"

namespace assoc {
namespace {

using Count = std::int64_t;

// Simulated statistics within this relative distance below the observed one count as ties.
constexpr double tie_tolerance = 1e-7;
// log k! is tabulated up to here (8 MB at most) and computed beyond.
constexpr Count log_factorial_table_size = Count{1} << 20;

// Uniform on [0, 1) from the top 53 bits of one output. Not std::uniform_real_distribution,
// whose algorithm the standard leaves to each library: this keeps results the same everywhere.
double uniform01(std::mt19937_64& engine) { return static_cast<double>(engine() >> 11) * 0x1.0p-53; }

// ln k!, from Boost's lgamma (std::lgamma differs between libraries in its last bits).
class LogFactorial {
public:
    explicit LogFactorial(Count largest)
        : table_(static_cast<std::size_t>(std::min(largest + 1, log_factorial_table_size))) {
        for (std::size_t k = 0; k < table_.size(); ++k) table_[k] = compute(static_cast<Count>(k));
    }
    double operator()(Count k) const {
        return k < static_cast<Count>(table_.size()) ? table_[static_cast<std::size_t>(k)] : compute(k);
    }

private:
    static double compute(Count k) { return boost::math::lgamma(static_cast<double>(k) + 1, detail::Policy()); }
    std::vector<double> table_;
};

// Hypergeometric draws by inversion, searching outwards from the mode: the number of steps
// grows with the standard deviation, not with the counts, and every step is one multiplication
// by the ratio of neighbouring probabilities.
class HypergeometricSampler {
public:
    explicit HypergeometricSampler(const LogFactorial& log_factorial) : log_factorial_(log_factorial) {}

    // The number of marked items among `draws` items taken at random, without replacement,
    // from `pool` items of which `marked` are marked.
    Count draw(Count pool, Count marked, Count draws, std::mt19937_64& engine) {
        const Count unmarked = pool - marked;
        const Count low = std::max<Count>(0, draws - unmarked), high = std::min(draws, marked);
        if (low == high) return low;
        const Count mode = std::clamp((draws + 1) * (marked + 1) / (pool + 2), low, high);
        const LogFactorial& lf = log_factorial_;
        const double p_mode = std::exp(lf(marked) - lf(mode) - lf(marked - mode) + lf(unmarked) - lf(draws - mode) -
                                       lf(unmarked - draws + mode) - lf(pool) + lf(draws) + lf(pool - draws));
        double u = uniform01(engine);
        if (u < p_mode) return mode;
        u -= p_mode;
        Count up = mode, down = mode;
        double p_up = p_mode, p_down = p_mode;
        for (;;) {
            bool moved = false;
            if (up < high) {  // P(x + 1) / P(x) = (K − x)(n − x) / ((x + 1)(N − K − n + x + 1))
                p_up *= static_cast<double>(marked - up) * static_cast<double>(draws - up) /
                        (static_cast<double>(up + 1) * static_cast<double>(unmarked - draws + up + 1));
                ++up;
                if (u < p_up) return up;
                u -= p_up;
                moved = true;
            }
            if (down > low) {  // P(x − 1) / P(x) = x (N − K − n + x) / ((K − x + 1)(n − x + 1))
                p_down *= static_cast<double>(down) * static_cast<double>(unmarked - draws + down) /
                          (static_cast<double>(marked - down + 1) * static_cast<double>(draws - down + 1));
                --down;
                if (u < p_down) return down;
                u -= p_down;
                moved = true;
            }
            // Rounding can leave a sliver of probability unassigned (ln k! of counts near 1e9 carries
            // errors of about 1e-7): once both sides' terms are negligible the draw ends at the mode, so
            // that a draw never walks the whole support.
            if (!moved || ((up == high || p_up < 1e-20) && (down == low || p_down < 1e-20))) return mode;
        }
    }

private:
    const LogFactorial& log_factorial_;
};

// The table with its rows and columns in ascending order of their totals: the last row and
// the last column, the largest, are then filled by subtraction and never searched.
struct SimulationTable {
    std::size_t rows = 0, columns = 0;
    std::vector<Count> row_totals, column_totals, observed;
    std::vector<double> expected, inverse_expected;
    Count total = 0;
};

std::vector<std::size_t> ascending_order(const std::vector<double>& totals) {
    std::vector<std::size_t> order(totals.size());
    std::iota(order.begin(), order.end(), 0);
    std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) { return totals[a] < totals[b]; });
    return order;
}

SimulationTable simulation_table(const CountTable& table) {
    SimulationTable t;
    t.rows = table.rows();
    t.columns = table.columns();
    const std::vector<std::size_t> row_order = ascending_order(table.row_totals());
    const std::vector<std::size_t> column_order = ascending_order(table.column_totals());
    const double n = table.total();
    t.total = static_cast<Count>(n);
    for (std::size_t r : row_order) t.row_totals.push_back(static_cast<Count>(table.row_total(r)));
    for (std::size_t c : column_order) t.column_totals.push_back(static_cast<Count>(table.column_total(c)));
    for (std::size_t r : row_order)
        for (std::size_t c : column_order) {
            t.observed.push_back(static_cast<Count>(table.count(r, c)));
            const double e = table.row_total(r) * table.column_total(c) / n;
            t.expected.push_back(e);
            t.inverse_expected.push_back(1 / e);
        }
    return t;
}

// Fills `cells` (row by row) with a random table of the same totals: row by row, each cell
// drawn from its hypergeometric distribution given the cells drawn before it. This is exact:
// it deals the n items of the columns at random to the rows.
void draw_table(const SimulationTable& t, HypergeometricSampler& sampler, std::mt19937_64& engine,
                std::vector<Count>& column_left, std::vector<Count>& cells) {
    column_left = t.column_totals;
    Count pool = t.total;  // items not yet dealt to a row
    for (std::size_t r = 0; r + 1 < t.rows; ++r) {
        Count row_left = t.row_totals[r];
        Count columns_pool = pool;  // undealt items in this column and the ones after it
        for (std::size_t c = 0; c + 1 < t.columns; ++c) {
            const Count x = row_left == 0 ? 0 : sampler.draw(columns_pool, column_left[c], row_left, engine);
            cells[r * t.columns + c] = x;
            columns_pool -= column_left[c];
            column_left[c] -= x;
            row_left -= x;
        }
        cells[r * t.columns + t.columns - 1] = row_left;
        column_left[t.columns - 1] -= row_left;
        pool -= t.row_totals[r];
    }
    for (std::size_t c = 0; c < t.columns; ++c) cells[(t.rows - 1) * t.columns + c] = column_left[c];
}

// The statistic of a table in SimulationTable's order. The observed table goes through the
// same code, so that a simulated table equal to it gets exactly the same value.
double statistic_of(const SimulationTable& t, const std::vector<Count>& cells, Method method) {
    double sum = 0.0;
    if (method == Method::pearson) {
        for (std::size_t i = 0; i < cells.size(); ++i) {
            const double d = static_cast<double>(cells[i]) - t.expected[i];
            sum += d * d * t.inverse_expected[i];
        }
        return sum;
    }
    // G²/2 = Σ [x ln(x/E) − (x − E)]: each term is ≥ 0 (ln y ≤ y − 1), and an empty cell gives E.
    for (std::size_t i = 0; i < cells.size(); ++i) {
        const double x = static_cast<double>(cells[i]), e = t.expected[i];
        sum += cells[i] == 0 ? e : std::max(0.0, x * std::log(x * t.inverse_expected[i]) - (x - e));
    }
    return 2 * sum;
}

// Σ ln x! over the cells: the larger it is, the less probable the table given its margins. The
// observed table goes through the same code, so an identical simulated table gets the same value.
double log_factorial_sum(const std::vector<Count>& cells, const LogFactorial& log_factorial) {
    double sum = 0.0;
    for (Count x : cells) sum += log_factorial(x);
    return sum;
}

// About how many search steps' worth of work one simulated table takes: each drawn cell costs
// about 20 (its probability at the mode: an exp and nine table lookups) plus a search about as
// long as its standard deviation, at most √E; each cell's share of the statistic costs about 2.
double work_per_table(const SimulationTable& t) {
    double work = 2.0 * static_cast<double>(t.rows * t.columns);
    for (std::size_t r = 0; r + 1 < t.rows; ++r)
        for (std::size_t c = 0; c + 1 < t.columns; ++c) work += 20 + std::sqrt(t.expected[r * t.columns + c]);
    return work;
}

}  // namespace

SimulationResult monte_carlo_test(const CountTable& table, const SimulationOptions& options) {
    require(options.statistic != Method::yates,
            "the simulated p-value uses Pearson's X² or G²; the Yates correction is for the chi-squared "
            "approximation and has no place in a simulation");
    require(options.trials >= min_simulation_trials && options.trials <= max_simulation_trials,
            "the number of trials must be from " + format_count(static_cast<double>(min_simulation_trials)) + " to " +
                format_count(static_cast<double>(max_simulation_trials)) + ", not " +
                format_count(static_cast<double>(options.trials)));
    require(table.rows() >= 2 && table.columns() >= 2,
            "a simulated p-value needs at least 2 rows and 2 columns with counts");
    require(table.whole_counts(),
            "the simulated p-value needs whole counts; some counts in this table have decimals (weighted data)");
    require(table.total() <= max_simulation_total,
            "the simulated p-value takes tables of up to " + format_count(max_simulation_total) + " counts, and this one has " +
                format_count(table.total()) + "; with so many counts the chi-squared p-value is reliable");

    const SimulationTable t = simulation_table(table);
    const double trials = static_cast<double>(options.trials);
    const double trials_that_fit = std::floor(options.limits.max_work / work_per_table(t));
    require(trials_that_fit >= static_cast<double>(min_simulation_trials),
            "this table is too large to simulate in reasonable time (" + std::to_string(t.rows) + " rows, " +
                std::to_string(t.columns) + " columns, " + format_count(table.total()) +
                " counts); combine sparse categories, or use the chi-squared p-value if the validity check allows");
    require(trials <= trials_that_fit, "simulating " + format_count(trials) + " tables of " +
                                           format_count(table.total()) +
                                           " counts would take too long; use fewer trials (at most about " +
                                           format_count(trials_that_fit) + ")");

    const LogFactorial log_factorial(t.total);
    HypergeometricSampler sampler(log_factorial);
    std::mt19937_64 engine(options.seed);
    std::vector<Count> column_left(t.columns), cells(t.rows * t.columns);
    const bool by_probability = options.order == SimulationOrder::probability;
    // Either the statistic or Σ ln x!: a table counts when its value reaches the threshold.
    const auto value_of = [&](const std::vector<Count>& cells) {
        return by_probability ? log_factorial_sum(cells, log_factorial) : statistic_of(t, cells, options.statistic);
    };
    const double observed = value_of(t.observed);
    // P ≤ P_observed (1 + tolerance)  ⇔  Σ ln x! ≥ Σ ln x_observed! − ln(1 + tolerance).
    const double threshold = by_probability ? observed - std::log1p(exact_tie_tolerance)
                                            : observed - tie_tolerance * observed;
    // The estimate above is for the usual case; the clock stops a run that goes beyond the time
    // limit on any machine. It is read every 64 tables, or after every table when a table takes
    // many search steps (a huge table), so the limit holds to within about a millisecond.
    using Clock = std::chrono::steady_clock;
    const Clock::time_point start = Clock::now();
    const std::uint64_t check_every = work_per_table(t) > 1e5 ? 1 : 64;

    std::uint64_t at_least_as_large = 0;
    for (std::uint64_t trial = 0; trial < options.trials; ++trial) {
        draw_table(t, sampler, engine, column_left, cells);
        if (value_of(cells) >= threshold) ++at_least_as_large;
        if (trial % check_every == 0 &&
            std::chrono::duration<double>(Clock::now() - start).count() > options.limits.max_seconds)
            throw Error("the simulation was stopped at its time limit of " + format_number(options.limits.max_seconds, 3) +
                        " seconds after " + format_count(static_cast<double>(trial + 1)) + " of " +
                        format_count(trials) + " tables; use fewer trials");
    }

    SimulationResult result;
    result.trials = options.trials;
    result.at_least_as_large = at_least_as_large;
    result.p_value = (1 + static_cast<double>(at_least_as_large)) / (trials + 1);
    result.standard_error = std::sqrt(result.p_value * (1 - result.p_value) / trials);
    result.method = options.statistic;
    if (by_probability) {
        double log_margins = -log_factorial(t.total);
        for (Count total : t.row_totals) log_margins += log_factorial(total);
        for (Count total : t.column_totals) log_margins += log_factorial(total);
        result.statistic = std::exp(log_margins - observed);
    } else {
        result.statistic = options.statistic == Method::pearson ? pearson_statistic(table) : likelihood_ratio_statistic(table);
    }
    return result;
}

SimulationOptions simulation_options(std::optional<double> trials, std::optional<double> seed,
                                     const std::optional<std::string>& statistic) {
    SimulationOptions options;
    if (trials)
        options.trials = static_cast<std::uint64_t>(
            detail::whole_number(*trials, static_cast<double>(min_simulation_trials),
                                 static_cast<double>(max_simulation_trials), "the number of trials"));
    if (seed) options.seed = static_cast<std::uint64_t>(detail::whole_number(*seed, 0, 4294967295.0, "the seed"));
    if (statistic) {
        const std::string word = detail::normalized_word(*statistic);
        if (word == "pearson") options.statistic = Method::pearson;
        else if (word == "g") options.statistic = Method::likelihood_ratio;
        else throw Error("the statistic must be \"pearson\" or \"g\", not \"" + *statistic + "\"");
    }
    return options;
}

}  // namespace assoc
