// Where ASSOC.COUNTS spends its own time, outside Calc: the stages of the add-in's work on
// 1,000,000 records, on ranges built the way Calc hands them over (a Sequence<Sequence<Any>> of
// one row per record, texts as OUStrings shared among equal labels, as Calc's string pool shares
// them). Prints CPU ns per record for each stage, beside a loop that only reads every element (the
// in-process part of the transfer floor). bench/calc/counts_in_calc.py measures the whole call in Calc.
//
// The stages are the real code: to_cell_grid (extension/src/uno_values.cpp), counts_from_records
// and distinct_levels (core), to_any of the result; "adapter" mirrors cell_functions::counts and the
// generated AssocFunctions::counts (which cannot be linked here without the whole add-in).
#include <algorithm>
#include <chrono>
#include <cstdint>
#include <cstdio>
#include <ctime>
#include <random>
#include <string>
#include <unordered_map>
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


// ---------------------------------------------------------------------------------------------
// PROTOTYPE (bench only, not in the add-in): ASSOC.COUNTS straight from the Any values, with no
// CellGrid of a million cells. It needs the generated glue to hand the adapter the raw ranges
// (extension/generate.py converts every range with to_cell_grid first), so it is measured here.
//
// Each range is dictionary-encoded: one "spelling" per distinct rtl_uString (Calc's string pool
// gives equal texts one rtl_uString, so a pointer lookup settles nearly every element; a second
// rtl_uString with the same text is only a second spelling of the same level, which the core merges)
// or per distinct number. The pairs of spellings are counted, and the core counts the distinct pairs
// weighted by how often each occurs: the same levels, order, remarks and caps as counting records.
// (Not handled here, as the real thing would: given weights, the exact messages about a bad label's
// position, and ranges laid out along a row.)
class Spellings {
public:
    static constexpr std::uint32_t blank = 0xffffffffu;

    std::uint32_t code(const Any& value) {
        switch (value.getValueTypeClass()) {
        case css::uno::TypeClass_VOID: return blank;
        case css::uno::TypeClass_STRING: {
            rtl_uString* text = static_cast<const rtl::OUString*>(value.getValue())->pData;
            if (text->length == 0) return blank;
            Slot& slot = cache_[(reinterpret_cast<std::uintptr_t>(text) >> 4) % cache_size];
            if (slot.text == text) return slot.code;
            const auto [where, added] = by_text_.try_emplace(text, static_cast<std::uint32_t>(cells_.size()));
            if (added) {
                rtl_uString_acquire(text);  // keeps the pointer valid as a key while we count
                cells_.push_back(assoc::Cell::text(assoc::calc::to_utf8(rtl::OUString(text))));
            }
            slot = {text, where->second};
            return where->second;
        }
        case css::uno::TypeClass_BOOLEAN: return number_code(value.get<bool>() ? 1.0 : 0.0);
        default: {
            double number = 0.0;
            value >>= number;
            return number_code(number);
        }
        }
    }
    ~Spellings() {
        for (const auto& entry : by_text_) rtl_uString_release(const_cast<rtl_uString*>(entry.first));
    }
    std::size_t size() const { return cells_.size(); }
    const assoc::Cell& operator[](std::size_t i) const { return cells_[i]; }

private:
    std::uint32_t number_code(double number) {
        const auto [where, added] = by_number_.try_emplace(number + 0.0, static_cast<std::uint32_t>(cells_.size()));
        if (added) cells_.push_back(assoc::Cell::number(number));
        return where->second;
    }
    static constexpr std::size_t cache_size = 1021;
    struct Slot {
        const rtl_uString* text = nullptr;
        std::uint32_t code = 0;
    };
    std::vector<Slot> cache_ = std::vector<Slot>(cache_size);
    std::unordered_map<const rtl_uString*, std::uint32_t> by_text_;
    std::unordered_map<double, std::uint32_t> by_number_;
    std::vector<assoc::Cell> cells_;
};

assoc::Matrix counts_from_anys(const AnyTable& row_labels, const AnyTable& column_labels, assoc::LevelOrder order) {
    const std::size_t n = static_cast<std::size_t>(row_labels.getLength());
    Spellings rows, columns;
    std::vector<std::uint32_t> row_codes(n), column_codes(n);
    std::size_t skipped = 0;
    for (std::size_t i = 0; i < n; ++i) {
        row_codes[i] = rows.code(row_labels[static_cast<sal_Int32>(i)][0]);
        column_codes[i] = columns.code(column_labels[static_cast<sal_Int32>(i)][0]);
        if (row_codes[i] == Spellings::blank || column_codes[i] == Spellings::blank) ++skipped;
    }
    // Pairs of spellings, counted densely (the real thing would switch to a hash map for many spellings),
    // listed in order of first appearance so that "first" order comes out as from the records.
    const std::size_t width = columns.size();
    std::vector<double> pair_counts(rows.size() * width, 0.0);
    std::vector<std::uint32_t> pairs_in_order;
    for (std::size_t i = 0; i < n; ++i) {
        if (row_codes[i] == Spellings::blank || column_codes[i] == Spellings::blank) continue;
        const std::size_t pair = row_codes[i] * width + column_codes[i];
        if (pair_counts[pair]++ == 0) pairs_in_order.push_back(static_cast<std::uint32_t>(pair));
    }
    assoc::CellGrid pair_rows(pairs_in_order.size(), 1), pair_columns(pairs_in_order.size(), 1),
        pair_weights(pairs_in_order.size(), 1);
    for (std::size_t p = 0; p < pairs_in_order.size(); ++p) {
        pair_rows.at(p, 0) = rows[pairs_in_order[p] / width];
        pair_columns.at(p, 0) = columns[pairs_in_order[p] % width];
        pair_weights.at(p, 0) = assoc::Cell::number(pair_counts[pairs_in_order[p]]);
    }
    assoc::RecordCounts counted = assoc::counts_from_records(pair_rows, pair_columns, pair_weights, order);
    counted.records = n;  // the feedback speaks of records, not of pairs
    counted.weighted = false;
    counted.skipped_blank = skipped;
    sink = static_cast<double>(counted.feedback().size());
    // (With skipped records the adapter would add the levels of the spellings, as it does now.)
    return counted.counts;
}
}  // namespace

// The conversion must stay exact: non-ASCII texts, blanks, numbers, booleans, a text met twice.
bool conversion_is_exact() {
    const rtl::OUString zurich("Z\u00FCrich", 7, RTL_TEXTENCODING_UTF8);
    AnyTable table(6);
    const Any values[] = {Any(zurich), Any(rtl::OUString()), Any(3.5), Any(true), Any(zurich),
                          Any(rtl::OUString::createFromAscii("Region 03"))};
    for (sal_Int32 i = 0; i < 6; ++i) {
        table.getArray()[i].realloc(1);
        table.getArray()[i].getArray()[0] = values[i];
    }
    const assoc::CellGrid grid = assoc::calc::to_cell_grid(table);
    const assoc::Cell expected[] = {assoc::Cell::text("Z\xC3\xBCrich"), assoc::Cell::blank(), assoc::Cell::number(3.5),
                                    assoc::Cell::number(1.0), assoc::Cell::text("Z\xC3\xBCrich"),
                                    assoc::Cell::text("Region 03")};
    for (std::size_t i = 0; i < 6; ++i)
        if (grid.at(i, 0) != expected[i]) {
            std::printf("to_cell_grid converted element %zu wrongly: %s\n", i + 1, grid.at(i, 0).describe().c_str());
            return false;
        }
    return true;
}

int main() {
    if (!conversion_is_exact()) return 1;
    std::printf("ASSOC.COUNTS stages outside Calc: %zu records, two 1-column ranges of text labels; "
                "CPU ns per record, median of %d\n\n",
                records, repetitions);
    std::printf("%-8s %10s %12s %10s %10s %10s %12s %12s\n", "levels", "read (floor)", "to_cell_grid", "counts",
                "levels", "to_any", "adapter", "prototype");
    const std::pair<std::size_t, std::size_t> shapes[] = {{5, 4}, {10, 10}, {100, 50}};
    std::mt19937 generator(20240601);
    for (const auto& [row_levels, column_levels] : shapes) {
        const AnyTable rows = make_labels("Region", row_levels, row_levels >= 100 ? 3 : 2, generator);
        const AnyTable columns = make_labels("Channel", column_levels, 1 + (column_levels >= 10), generator);
        const double read = cpu_ns_per_record([&] { sink = read_every_element(rows) + read_every_element(columns); });
        const double convert = cpu_ns_per_record([&] {
            const assoc::CellGrid a = assoc::calc::to_cell_grid(rows);
            const assoc::CellGrid b = assoc::calc::to_cell_grid(columns);
            sink = static_cast<double>(a.rows() + b.rows());
        });
        const assoc::CellGrid row_grid = assoc::calc::to_cell_grid(rows);
        const assoc::CellGrid column_grid = assoc::calc::to_cell_grid(columns);
        const double count = cpu_ns_per_record([&] {
            sink = assoc::counts_from_records(row_grid, column_grid, assoc::CellGrid(), assoc::LevelOrder::sorted).total;
        });
        const double distinct = cpu_ns_per_record([&] {
            sink = static_cast<double>(assoc::distinct_levels(row_grid).size() + assoc::distinct_levels(column_grid).size());
        });
        const assoc::RecordCounts counted = assoc::counts_from_records(row_grid, column_grid);
        const double result = cpu_ns_per_record([&] { sink = assoc::calc::to_any(counted.counts).hasValue(); });
        // The whole of AssocFunctions::counts: conversions, the adapter's work, the result.
        const double adapter = cpu_ns_per_record([&] {
            const assoc::CellGrid a = assoc::calc::to_cell_grid(rows);
            const assoc::CellGrid b = assoc::calc::to_cell_grid(columns);
            const assoc::CellGrid weights = assoc::calc::to_optional_cell_grid(Any());
            const assoc::RecordCounts c = assoc::counts_from_records(a, b, weights, assoc::LevelOrder::sorted);
            sink = static_cast<double>(c.feedback().size());
            if (c.skipped_blank > 0)  // as cell_functions::counts
                sink = static_cast<double>(assoc::distinct_levels(a).size() + assoc::distinct_levels(b).size());
            sink = assoc::calc::to_any(c.counts).hasValue();
        });
        // The prototype, checked against the real path.
        const double proposed = cpu_ns_per_record([&] {
            sink = counts_from_anys(rows, columns, assoc::LevelOrder::sorted).values().size();
        });
        if (counts_from_anys(rows, columns, assoc::LevelOrder::sorted).values() != counted.counts.values()) {
            std::printf("the prototype's table differs from counts_from_records'\n");
            return 1;
        }
        char shape[16];
        std::snprintf(shape, sizeof shape, "%zux%zu", row_levels, column_levels);
        std::printf("%-8s %12.1f %12.1f %10.1f %10.1f %10.3f %12.1f %12.1f\n", shape, read, convert, count, distinct,
                    result, adapter, proposed);
    }
    std::printf("\nread (floor): the floor add-in's loop over both ranges; to_cell_grid: both ranges to CellGrid;\n"
                "counts: counts_from_records; levels: distinct_levels of both grids (the adapter needs them only\n"
                "when records were skipped); adapter: all of ASSOC.COUNTS after Calc's hand-over, frees included;\n"
                "prototype: counting straight from the Any values (see counts_from_anys), same table.\n");
    return 0;
}
