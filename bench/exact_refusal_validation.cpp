// Validation of the exact test's early refusal (ExactLimits::forecast, freeman_halton.cpp): does it
// refuse at once the tables that cannot finish within the worksheet limits, and never a table that
// can? Every table of bench/exact_suite.txt, and random tables of the suite's sizes, is computed
// twice, back to back, with the limits of ASSOC.EXACT: once with the forecast off (the truth: does
// it finish within the limits, as before the forecast existed) and once with it on. Prints every
// table and the confusion figures.
//
// Usage: exact_refusal_validation SUITE [--per-shape K] [--seed S] [--seconds X] [--megabytes M] [--list]
//   K random tables per suite size (default 4), drawn with seed S (default 20240611); --list prints
//   the tables in the suite's format instead (to study one of them with other tools).
//
// The truth is measured by the clock, so a table whose time is close to the limit may fall either
// way from one run to the next (more so on a loaded machine): a refused table that finished within
// 20% of the limit without the forecast is marked so.
#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <fstream>
#include <random>
#include <sstream>
#include <string>
#include <vector>

#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/exact_test.hpp"
#include "exact_suite.hpp"
#include "worksheet_limits.hpp"  // extension/src: the caps of the worksheet functions

namespace {

using Table = assoc::bench::SuiteTable;
using assoc::bench::read_suite;

double total_of(const assoc::Matrix& m) {
    double n = 0;
    for (double v : m.values()) n += v;
    return n;
}

// A random table of the given size and total, with a mild association: margins drawn from a
// Dirichlet(3) distribution, each cell's probability then shaken by a factor exp(0.3 z), z normal;
// the counts a multinomial draw. Redrawn until no row or column is empty (so the shape is kept).
assoc::Matrix random_table(std::size_t rows, std::size_t columns, unsigned total, std::mt19937_64& generator) {
    std::gamma_distribution<double> gamma(3.0, 1.0);
    std::normal_distribution<double> normal;
    for (;;) {
        std::vector<double> a(rows), b(columns), p(rows * columns);
        for (double& x : a) x = gamma(generator);
        for (double& x : b) x = gamma(generator);
        double sum = 0;
        for (std::size_t r = 0; r < rows; ++r)
            for (std::size_t c = 0; c < columns; ++c) sum += p[r * columns + c] = a[r] * b[c] * std::exp(0.3 * normal(generator));
        assoc::Matrix counts(rows, columns);
        unsigned left = total;
        double mass_left = sum;
        for (std::size_t i = 0; i < p.size(); ++i) {
            const double share = i + 1 == p.size() ? 1.0 : std::min(1.0, p[i] / mass_left);
            const unsigned x = left == 0 ? 0 : std::binomial_distribution<unsigned>(left, share)(generator);
            counts(i / columns, i % columns) = x;
            left -= x;
            mass_left -= p[i];
        }
        bool full = true;
        for (std::size_t r = 0; r < rows; ++r) {
            double s = 0;
            for (std::size_t c = 0; c < columns; ++c) s += counts(r, c);
            full = full && s > 0;
        }
        for (std::size_t c = 0; c < columns; ++c) {
            double s = 0;
            for (std::size_t r = 0; r < rows; ++r) s += counts(r, c);
            full = full && s > 0;
        }
        if (full) return counts;
    }
}

struct Run {
    bool finished = false;
    double p = NAN;
    double seconds = 0;
    std::string refusal;  // "time" or "memory" when it stopped
};

Run run(const assoc::Matrix& counts, assoc::ExactLimits limits, bool forecast) {
    limits.forecast = forecast;
    Run result;
    const auto start = std::chrono::steady_clock::now();
    try {
        result.p = assoc::exact_p_value(assoc::CountTable::from_counts(counts), assoc::Side::two_sided, limits);
        result.finished = true;
    } catch (const assoc::Error& error) {
        const std::string message = error.what();
        result.refusal = message.find("more memory") != std::string::npos ? "memory"
                         : message.find("more time") != std::string::npos  ? "time"
                                                                           : message.substr(0, 40);
    }
    result.seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
    return result;
}

double load_average() {
    std::ifstream in("/proc/loadavg");
    double load = NAN;
    in >> load;
    return load;
}

}  // namespace

int main(int argc, char** argv) {
    if (argc < 2) {
        std::fprintf(stderr, "usage: exact_refusal_validation SUITE [--per-shape K] [--seed S] [--seconds X] [--megabytes M] [--list]\n");
        return 2;
    }
    int per_shape = 4;
    unsigned long long seed = 20240611;
    // The limits of ASSOC.EXACT and ASSOC.PVALUE "exact".
    assoc::ExactLimits limits = assoc::calc::worksheet_exact_limits;
    bool list = false;
    for (int i = 2; i < argc; i += 2) {
        const std::string option = argv[i];
        if (option == "--list") {
            list = true;
            --i;
            continue;
        }
        if (i + 1 >= argc) {
            std::fprintf(stderr, "%s needs a value\n", option.c_str());
            return 2;
        }
        if (option == "--per-shape") per_shape = std::atoi(argv[i + 1]);
        else if (option == "--seed") seed = std::strtoull(argv[i + 1], nullptr, 10);
        else if (option == "--seconds") limits.max_seconds = std::atof(argv[i + 1]);
        else if (option == "--megabytes") limits.max_memory_bytes = static_cast<std::size_t>(std::atof(argv[i + 1]) * 1e6);
        else {
            std::fprintf(stderr, "unknown option %s\n", option.c_str());
            return 2;
        }
    }
    std::vector<Table> tables = read_suite(argv[1]);
    const std::size_t suite_size = tables.size();
    std::mt19937_64 generator(seed);
    for (std::size_t i = 0; i < suite_size; ++i)
        for (int k = 0; k < per_shape; ++k)
            tables.push_back({tables[i].name + "_r" + std::to_string(k),
                              random_table(tables[i].counts.rows(), tables[i].counts.columns(),
                                           static_cast<unsigned>(total_of(tables[i].counts)), generator)});

    if (list) {
        for (const Table& t : tables) {
            std::printf("%s %zu %zu", t.name.c_str(), t.counts.rows(), t.counts.columns());
            for (double v : t.counts.values()) std::printf(" %.0f", v);
            std::printf("\n");
        }
        return 0;
    }
    const double near = 0.2;  // "near the limit": within 20% of it
    const double fast = 1.0;  // the goal: a refusal within 1 second
    std::printf("Early refusal of the exact test: %zu suite tables and %d random tables of each size (seed %llu);\n"
                "limits %.3g s and %.0f MB (ASSOC.EXACT's); load average %.1f at the start\n\n",
                suite_size, per_shape, seed, limits.max_seconds, static_cast<double>(limits.max_memory_bytes) / 1e6,
                load_average());
    std::printf("%-15s %-26s %-26s %s\n", "table", "forecast off (truth)", "forecast on", "verdict");
    int finishes = 0, wrongly_refused = 0, near_limit = 0, cannot = 0, refused_fast = 0, refused_late = 0, differ = 0;
    double slowest_refusal = 0;
    for (const Table& t : tables) {
        const Run truth = run(t.counts, limits, false);
        const Run forecast = run(t.counts, limits, true);
        const bool close = truth.finished && truth.seconds > (1 - near) * limits.max_seconds;
        std::string verdict;
        if (truth.finished) {
            ++finishes;
            if (!forecast.finished) {
                verdict = close ? "REFUSED (finished near the limit)" : "REFUSED";
                ++wrongly_refused;
                if (close) ++near_limit;
            } else {
                verdict = "computed";
                if (forecast.p != truth.p) {
                    verdict += " (p DIFFERS)";
                    ++differ;
                }
            }
        } else {
            ++cannot;
            if (forecast.finished) {
                verdict = "computed (stopped near the limit without the forecast)";
            } else if (forecast.seconds <= fast) {
                verdict = "refused at once";
                ++refused_fast;
                slowest_refusal = std::max(slowest_refusal, forecast.seconds);
            } else {
                verdict = "refused late";
                ++refused_late;
                slowest_refusal = std::max(slowest_refusal, forecast.seconds);
            }
        }
        char off[64], on[64];
        std::snprintf(off, sizeof off, "%s %.3f s", truth.finished ? "finished" : ("stopped (" + truth.refusal + ")").c_str(),
                      truth.seconds);
        std::snprintf(on, sizeof on, "%s %.3f s", forecast.finished ? "finished" : ("refused (" + forecast.refusal + ")").c_str(),
                      forecast.seconds);
        std::printf("%-15s %-26s %-26s %s\n", t.name.c_str(), off, on, verdict.c_str());
        std::fflush(stdout);
    }
    std::printf("\nConfusion figures (limits %.3g s, %.0f MB; load average %.1f at the end):\n", limits.max_seconds,
                static_cast<double>(limits.max_memory_bytes) / 1e6, load_average());
    std::printf("  tables that finish within the limits:  %4d; refused with the forecast: %d (of which %d finished "
                "within %.0f%% of the limit)%s\n",
                finishes, wrongly_refused, near_limit, near * 100, differ ? "; some p-values DIFFER" : "");
    std::printf("  tables that cannot finish:             %4d; refused within %.0f s: %d, refused later: %d, "
                "computed with the forecast: %d (slowest refusal %.3f s)\n",
                cannot, fast, refused_fast, refused_late, cannot - refused_fast - refused_late, slowest_refusal);
    std::printf("%s: no table that finishes within the limits is refused\n", wrongly_refused == 0 ? "PASS" : "MISS");
    std::printf("%s: every table that cannot finish is refused within %.0f s\n", refused_late == 0 ? "PASS" : "MISS", fast);
    return wrongly_refused == 0 && differ == 0 ? 0 : 1;
}
