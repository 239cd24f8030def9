// The exact-test bench: Assoc's exact p-value on every table of bench/exact_suite.txt, side by side
// with R's fisher.test (timings produced by bench/exact_reference.R; R is only a yardstick).
// Prints, per table, both times, their ratio and the relative difference of the p-values, and for
// tables where the two disagree a Monte Carlo p-value from R as a third opinion.
// Usage: exact_bench bench/exact_suite.txt [build/bench/exact_r.csv]
#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <fstream>
#include <map>
#include <sstream>
#include <string>
#include <vector>

#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/exact_test.hpp"
#include "exact_suite.hpp"

namespace {

using assoc::bench::read_suite;
using assoc::bench::SuiteTable;

struct RRow {
    std::string default_status, large_status;
    double default_seconds = NAN, default_p = NAN, large_seconds = NAN, large_p = NAN, simulated_p = NAN;
};

double number(const std::string& field) { return field == "NA" || field.empty() ? NAN : std::stod(field); }

std::map<std::string, RRow> read_r(const char* path) {
    std::map<std::string, RRow> rows;
    std::ifstream in(path);
    std::string line;
    std::getline(in, line);  // header
    while (std::getline(in, line)) {
        std::vector<std::string> f;
        std::stringstream s(line);
        for (std::string field; std::getline(s, field, ',');) f.push_back(field);
        if (f.size() < 8) continue;
        rows[f[0]] = RRow{f[1], f[4], number(f[2]), number(f[3]), number(f[5]), number(f[6]), number(f[7])};
    }
    return rows;
}

}  // namespace

int main(int argc, char** argv) {
    if (argc < 2) {
        std::fprintf(stderr, "usage: exact_bench SUITE [R_CSV]\n");
        return 2;
    }
    const auto suite = read_suite(argv[1]);
    // The core's memory limit, with more time than its default 20 s (the worksheet function
    // itself stops at 5 s), so that the comparison reaches the larger tables.
    assoc::ExactLimits limits;
    limits.max_seconds = 60;
    const auto r = argc > 2 ? read_r(argv[2]) : std::map<std::string, RRow>{};
    std::printf("Exact test (two-sided), Assoc vs R fisher.test%s; seconds, median of up to 3 runs\n",
                r.empty() ? " (R not run)" : "");
    std::printf("%-11s %10s %10s %12s %8s %11s %s\n", "table", "Assoc s", "R s", "R/Assoc", "p", "|Δp|/p",
                "notes");
    int faster = 0, compared = 0, beyond = 0, assoc_stopped = 0;
    for (const SuiteTable& t : suite) {
        double p = NAN, seconds = 0;
        std::string note;
        std::vector<double> times;
        for (int run = 0; run < 3; ++run) {
            const auto start = std::chrono::steady_clock::now();
            try {
                p = assoc::exact_p_value(assoc::CountTable::from_counts(t.counts), assoc::Side::two_sided, limits);
            } catch (const assoc::Error& e) {
                note = std::string("Assoc stopped at its limit; ");
            }
            times.push_back(std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count());
            if (times.back() > 1 || !note.empty()) break;
        }
        if (!std::isfinite(p)) ++assoc_stopped;
        std::sort(times.begin(), times.end());
        seconds = times[times.size() / 2];

        double r_seconds = NAN, r_p = NAN;
        if (auto found = r.find(t.name); found != r.end()) {
            const RRow& row = found->second;
            if (row.default_status == "ok") {
                r_seconds = row.default_seconds, r_p = row.default_p;
            } else if (row.large_status == "ok") {
                r_seconds = row.large_seconds, r_p = row.large_p;
                note += "R: default workspace too small, ran with 2e8; ";
            } else {
                note += "R: out of workspace even at 2e8; ";
                ++beyond;
            }
            const double difference = std::fabs(p - r_p) / p;
            if (std::isfinite(r_p) && difference > 1e-6) {
                char buffer[160];
                std::snprintf(buffer, sizeof buffer, "p differ: R %.6g, R Monte Carlo (1e6) %.6g; ",
                              r_p, row.simulated_p);
                note += buffer;
            }
        }
        const double ratio = std::isfinite(p) ? r_seconds / seconds : NAN;
        if (std::isfinite(ratio)) {
            ++compared;
            if (ratio >= 1) ++faster;
        }
        std::printf("%-11s %10.4f %10.4f %12.2f %8.4g %11.2g %s\n", t.name.c_str(), seconds, r_seconds, ratio, p,
                    std::fabs(p - r_p) / p, note.c_str());
    }
    if (!r.empty())
        std::printf("Assoc at least as fast as R on %d of %d tables both could do; R could not do %d, Assoc %d "
                    "(limits: %.0f s, %.0f MB of working memory).\n",
                    faster, compared, beyond, assoc_stopped, limits.max_seconds,
                    static_cast<double>(limits.max_memory_bytes) / 1e6);
    return 0;
}
