// Times counts_from_records on 1,000,000 synthetic records and prints ns per record.
// Target: well under 100 ns/record, and a cost that does not grow with the number of levels
// (the "vs 5x4" column stays near 1). A naive std::map count is timed once for scale.
// Times are CPU time of this process (std::clock), so that other work on a shared machine
// inflates them less than wall-clock time would; wall time is printed at the end for comparison.
#include <algorithm>
#include <chrono>
#include <cstdio>
#include <ctime>
#include <map>
#include <random>
#include <string>
#include <utility>
#include <vector>

#include "assoc/counts_from_records.hpp"

namespace {

constexpr std::size_t records = 1'000'000;
constexpr int repetitions = 5;
constexpr double target_ns = 100.0;

struct Records {
    assoc::CellGrid rows, columns, weights;
};

// Text labels look like a real export ("Department 017", "Grade 03"); numeric labels are codes.
Records make_records(std::size_t row_levels, std::size_t column_levels, bool text, std::mt19937& generator) {
    Records data{assoc::CellGrid(records, 1), assoc::CellGrid(records, 1), assoc::CellGrid(records, 1)};
    std::uniform_int_distribution<std::size_t> pick_row(0, row_levels - 1), pick_column(0, column_levels - 1);
    std::uniform_int_distribution<int> pick_weight(1, 4);
    char buffer[32];
    for (std::size_t i = 0; i < records; ++i) {
        const std::size_t r = pick_row(generator), c = pick_column(generator);
        if (text) {
            std::snprintf(buffer, sizeof buffer, "Department %03zu", r);
            data.rows.at(i, 0) = assoc::Cell::text(buffer);
            std::snprintf(buffer, sizeof buffer, "Grade %02zu", c);
            data.columns.at(i, 0) = assoc::Cell::text(buffer);
        } else {
            data.rows.at(i, 0) = assoc::Cell::number(1000.0 + static_cast<double>(r));
            data.columns.at(i, 0) = assoc::Cell::number(static_cast<double>(c) * 0.5);
        }
        data.weights.at(i, 0) = assoc::Cell::number(pick_weight(generator));
    }
    return data;
}

double total_wall_seconds = 0, total_cpu_seconds = 0;

// CPU seconds spent in `action` (wall seconds are added up for the summary line).
template <class Action>
double seconds(Action action) {
    const auto wall_start = std::chrono::steady_clock::now();
    const std::clock_t cpu_start = std::clock();
    action();
    const double cpu = static_cast<double>(std::clock() - cpu_start) / CLOCKS_PER_SEC;
    total_cpu_seconds += cpu;
    total_wall_seconds += std::chrono::duration<double>(std::chrono::steady_clock::now() - wall_start).count();
    return cpu;
}

// Best and median of `repetitions` runs, in ns per record.
std::pair<double, double> time_counts(const Records& data, bool weighted, assoc::LevelOrder order, double& check) {
    static const assoc::CellGrid no_weights;
    const assoc::CellGrid& weights = weighted ? data.weights : no_weights;  // a reference: no copy is timed
    std::vector<double> ns;
    for (int i = 0; i < repetitions; ++i) {
        ns.push_back(seconds([&] {
                         const assoc::RecordCounts counts =
                             counts_from_records(data.rows, data.columns, weights, order);
                         check += counts.total;
                     }) *
                     1e9 / static_cast<double>(records));
    }
    std::sort(ns.begin(), ns.end());
    return {ns.front(), ns[ns.size() / 2]};
}

// The plain way, for scale: a std::map keyed by the pair of label texts, copied per record.
double time_naive(const Records& data, double& check) {
    return seconds([&] {
               std::map<std::pair<std::string, std::string>, double> cells;
               for (std::size_t i = 0; i < records; ++i)
                   cells[{data.rows.at(i, 0).as_text(), data.columns.at(i, 0).as_text()}] += 1;
               check += static_cast<double>(cells.size());
           }) *
           1e9 / static_cast<double>(records);
}

}  // namespace

int main() {
    struct Shape {
        std::size_t rows, columns;
    };
    const Shape shapes[] = {{5, 4}, {10, 10}, {100, 50}};
    std::mt19937 generator(12345);
    double check = 0;  // keeps the work observable so it is not optimised away

    std::printf("counts_from_records, %zu records, best (median) of %d runs, CPU ns per record; target < %.0f\n\n",
                records, repetitions, target_ns);
    std::printf("%-8s %-8s %-22s %-22s %-22s %-12s %-12s\n", "labels", "levels", "sorted", "first seen", "weighted",
                "vs target", "vs 5x4");
    for (const bool text : {true, false}) {
        double base = 0;
        for (const Shape& shape : shapes) {
            const Records data = make_records(shape.rows, shape.columns, text, generator);
            const auto sorted = time_counts(data, false, assoc::LevelOrder::sorted, check);
            const auto first = time_counts(data, false, assoc::LevelOrder::first_seen, check);
            const auto weighted = time_counts(data, true, assoc::LevelOrder::sorted, check);
            if (base == 0) base = sorted.first;
            char levels[16], a[24], b[24], c[24];
            std::snprintf(levels, sizeof levels, "%zux%zu", shape.rows, shape.columns);
            std::snprintf(a, sizeof a, "%.1f (%.1f)", sorted.first, sorted.second);
            std::snprintf(b, sizeof b, "%.1f (%.1f)", first.first, first.second);
            std::snprintf(c, sizeof c, "%.1f (%.1f)", weighted.first, weighted.second);
            std::printf("%-8s %-8s %-22s %-22s %-22s %-12.2f %-12.2f\n", text ? "text" : "number", levels, a, b, c,
                        sorted.first / target_ns, sorted.first / base);
            if (text && shape.rows == 100) {
                const double naive = time_naive(data, check);
                std::printf("\nnaive std::map of copied label pairs (text, 100x50): %.1f ns/record, %.1fx slower\n\n",
                            naive, naive / sorted.first);
            }
        }
    }
    std::printf("\nall timed runs: %.2f s CPU, %.2f s wall (wall/CPU %.2f; above 1 means the machine was busy)\n",
                total_cpu_seconds, total_wall_seconds, total_wall_seconds / total_cpu_seconds);
    std::printf("(check sum %.0f)\n", check);
    return 0;
}
