// Where ASSOC.COUNTS spends its own time, outside Calc: the stages of the add-in's work on
// 1,000,000 records, on ranges built the way Calc hands them over (a Sequence<Sequence<Any>> of
// one row per record, texts as OUStrings shared among equal labels, as Calc's string pool shares
// them). Prints CPU ns per record for each stage, beside a loop that only reads every element (the
// in-process part of the transfer floor). bench/calc/counts_in_calc.py measures the whole call in Calc.
//
// The stages are the real code: to_coded_labels (extension/src/uno_values.cpp), counts_from_records
// (core), to_any of the result; "adapter" mirrors cell_functions::counts and the generated
// AssocFunctions::counts (which cannot be linked here without the whole add-in). For comparison,
// to_cell_grid is what reading the ranges as cells (as every other function does) would cost.
#include <algorithm>
#include <chrono>
#include <cstdint>
#include <cstdio>
#include <ctime>
#include <random>
#include <string>
#include <vector>

#include "assoc/counts_from_records.hpp"
#include "assoc/levels.hpp"
#include "uno_values.hpp"

namespace {

using assoc::calc::AnyTable;
using css::uno::Any;
using css::uno::Sequence;

constexpr std::size_t records = 1'000'000;
constexpr int repetitions = 5;

// Texts as in the Calc bench ("Region 03", "Channel 7"); one OUString per level, shared by its records.
AnyTable make_labels(const char* stem, std::size_t levels, int digits, std::mt19937& generator) {
    std::vector<rtl::OUString> names;
    char buffer[32];
    for (std::size_t i = 0; i < levels; ++i) {
        std::snprintf(buffer, sizeof buffer, "%s %0*zu", stem, digits, i + 1);
        names.push_back(rtl::OUString::createFromAscii(buffer));
    }
    std::uniform_int_distribution<std::size_t> pick(0, levels - 1);
    AnyTable table(static_cast<sal_Int32>(records));
    Sequence<Any>* rows = table.getArray();
    for (std::size_t i = 0; i < records; ++i) {
        rows[i].realloc(1);
        rows[i].getArray()[0] <<= names[pick(generator)];
    }
    return table;
}

template <class Action>
double cpu_ns_per_record(Action action) {
    std::vector<double> ns;
    for (int i = 0; i < repetitions; ++i) {
        const std::clock_t start = std::clock();
        action();
        ns.push_back(static_cast<double>(std::clock() - start) / CLOCKS_PER_SEC * 1e9 / static_cast<double>(records));
    }
    std::sort(ns.begin(), ns.end());
    return ns[ns.size() / 2];
}

volatile double sink = 0;

// What the transfer floor add-in does with each element (bench/calc/floor/floor.cpp).
double read_every_element(const AnyTable& table) {
    std::uint64_t checksum = 0;
    double elements = 0;
    for (const Sequence<Any>& row : table)
        for (const Any& value : row) {
            rtl::OUString text;
            if (value >>= text) checksum += static_cast<std::uint64_t>(text.getLength()) + text[0];
            elements += 1;
        }
    sink = static_cast<double>(checksum);
    return elements;
}


}  // namespace

// The conversion must stay exact: non-ASCII texts, blanks, numbers, booleans, a text met twice.
bool conversion_is_exact() {
    const rtl::OUString zurich("Z\u00FCrich", 7, RTL_TEXTENCODING_UTF8);
    AnyTable table(7);
    const Any values[] = {Any(zurich), Any(rtl::OUString()), Any(3.5), Any(true), Any(zurich),
                          Any(rtl::OUString::createFromAscii("Region 03")), Any(-0.0)};
    for (sal_Int32 i = 0; i < 7; ++i) {
        table.getArray()[i].realloc(1);
        table.getArray()[i].getArray()[0] = values[i];
    }
    const assoc::Cell expected[] = {assoc::Cell::text("Z\xC3\xBCrich"), assoc::Cell::blank(), assoc::Cell::number(3.5),
                                    assoc::Cell::number(1.0), assoc::Cell::text("Z\xC3\xBCrich"),
                                    assoc::Cell::text("Region 03"), assoc::Cell::number(0.0)};
    const assoc::CellGrid grid = assoc::calc::to_cell_grid(table);
    const assoc::CodedLabels coded = assoc::calc::to_coded_labels(table);
    for (std::size_t i = 0; i < 7; ++i) {
        const std::uint32_t code = coded.codes[i];
        const assoc::Cell decoded = code == assoc::CodedLabels::blank ? assoc::Cell::blank() : coded.spellings[code];
        if (grid.at(i, 0) != expected[i] || decoded != expected[i]) {
            std::printf("element %zu was converted wrongly: %s as a cell, %s as a label\n", i + 1,
                        grid.at(i, 0).describe().c_str(), decoded.describe().c_str());
            return false;
        }
    }
    return coded.codes[0] == coded.codes[4];
}

int main() {
    if (!conversion_is_exact()) return 1;
    std::printf("ASSOC.COUNTS stages outside Calc: %zu records, two 1-column ranges of text labels; "
                "CPU ns per record, median of %d\n\n",
                records, repetitions);
    std::printf("%-8s %12s %14s %10s %10s %10s %14s\n", "levels", "read (floor)", "to_coded_labels", "counts",
                "to_any", "adapter", "(to_cell_grid)");
    const std::pair<std::size_t, std::size_t> shapes[] = {{5, 4}, {10, 10}, {100, 50}};
    std::mt19937 generator(20240601);
    for (const auto& [row_levels, column_levels] : shapes) {
        const AnyTable rows = make_labels("Region", row_levels, row_levels >= 100 ? 3 : 2, generator);
        const AnyTable columns = make_labels("Channel", column_levels, 1 + (column_levels >= 10), generator);
        const double read = cpu_ns_per_record([&] { sink = read_every_element(rows) + read_every_element(columns); });
        const double code = cpu_ns_per_record([&] {
            const assoc::CodedLabels a = assoc::calc::to_coded_labels(rows);
            const assoc::CodedLabels b = assoc::calc::to_coded_labels(columns);
            sink = static_cast<double>(a.codes.size() + b.codes.size());
        });
        const assoc::CodedLabels row_codes = assoc::calc::to_coded_labels(rows);
        const assoc::CodedLabels column_codes = assoc::calc::to_coded_labels(columns);
        const double count = cpu_ns_per_record([&] {
            sink = assoc::counts_from_records(row_codes, column_codes, assoc::CellGrid(), assoc::LevelOrder::sorted).total;
        });
        const assoc::RecordCounts counted = assoc::counts_from_records(row_codes, column_codes);
        const double result = cpu_ns_per_record([&] { sink = assoc::calc::to_any(counted.counts).hasValue(); });
        // The whole of AssocFunctions::counts: conversions, the adapter's work, the result.
        const double adapter = cpu_ns_per_record([&] {
            const assoc::CodedLabels a = assoc::calc::to_coded_labels(rows);
            const assoc::CodedLabels b = assoc::calc::to_coded_labels(columns);
            const assoc::CellGrid weights = assoc::calc::to_optional_cell_grid(Any());
            const assoc::RecordCounts c = assoc::counts_from_records(a, b, weights, assoc::LevelOrder::sorted);
            sink = static_cast<double>(c.feedback().size());
            sink = assoc::calc::to_any(c.counts).hasValue();
        });
        const double as_cells = cpu_ns_per_record([&] {
            const assoc::CellGrid a = assoc::calc::to_cell_grid(rows);
            const assoc::CellGrid b = assoc::calc::to_cell_grid(columns);
            sink = static_cast<double>(a.rows() + b.rows());
        });
        // The table must be the one counted from cells.
        const assoc::RecordCounts from_cells =
            assoc::counts_from_records(assoc::calc::to_cell_grid(rows), assoc::calc::to_cell_grid(columns));
        if (from_cells.counts.values() != counted.counts.values() || from_cells.row_levels != counted.row_levels) {
            std::printf("the table from coded labels differs from the one counted from cells\n");
            return 1;
        }
        char shape[16];
        std::snprintf(shape, sizeof shape, "%zux%zu", row_levels, column_levels);
        std::printf("%-8s %12.1f %15.1f %10.1f %10.3f %10.1f %14.1f\n", shape, read, code, count, result, adapter,
                    as_cells);
    }
    std::printf("\nread (floor): the floor add-in's loop over both ranges; to_coded_labels: both ranges in\n"
                "dictionary form; counts: counts_from_records on them; adapter: all of ASSOC.COUNTS after Calc's\n"
                "hand-over, frees included; (to_cell_grid): reading both ranges as cells instead, for comparison.\n");
    return 0;
}
