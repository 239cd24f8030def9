// The Freeman–Halton exact test: the probability, given both margins, of all tables no more
// probable than the observed one.
//
// Under independence with fixed margins a table has probability
//     P = K · ∏ 1/x_ij!,   K = ∏ R_i! ∏ C_j! / n!.
// Tables are built one column at a time (a "network", after Mehta & Patel 1983): after k
// columns, all that matters for the rest is the multiset of row totals still to fill, so partial
// tables meet in shared nodes keyed by those totals, sorted. Each node keeps the distinct "past"
// values (log ∏ 1/x! of the filled columns) that reach it, with their multiplicity (arrivals are
// merged into the values already there through a hash over the values; see NodePasts).
//
// Three devices keep the work small:
// - Bounds. For every node the largest and smallest "future" value over all completions is known
//   (a dynamic programme over the same network). A past whose every completion is no more probable
//   than the observed table adds the total mass of its completions in closed form,
//       Σ over completions of ∏ 1/x! = S! / (∏ r_i! ∏ c_j!)   (remaining totals r, c; S = Σ r),
//   and a past none of whose completions qualify is dropped.
// - Meeting in the last two columns. With two columns left a fill of the first fixes the second,
//   so a node's futures are one short sorted list with prefix sums of their probabilities. The
//   pasts arriving there are never stored one by one: each parent's sorted list of pasts arrives
//   as a whole, shifted by the weight of the column fill, and every past is settled by a binary
//   search over the futures.
// - Symmetry. Rows are the smaller side of the table, so node keys are short (packed into 128
//   bits); a column fill is enumerated once per distinct arrangement over rows with equal
//   remaining totals, weighted by the number of arrangements, since those reach the same node
//   with the same value.
//
// The work cap (ExactLimits) holds throughout: every vector and hash-map node the algorithm keeps
// is counted in bytes before it is allocated, and the clock is read every few thousand steps of
// every loop whose length is not already bounded by the memory counted. And a table that cannot
// finish within the cap is refused as soon as that shows, not when the cap is reached: each stage
// counts its work before doing it, and a forecast of the time still needed (and of the memory
// the last stage's futures will hold) is checked against what is left (see "The forecast" below;
// bench/exact_refusal_validation.cpp measures how early it refuses and that it does not refuse
// tables that would finish).
#include "freeman_halton.hpp"

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdint>
#include <ctime>
#include <functional>
#include <limits>
#include <new>
#include <string>
#include <tuple>
#include <unordered_map>
#include <vector>

#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "exact_limits.hpp"

namespace assoc::detail {
namespace {

constexpr double minus_infinity = -std::numeric_limits<double>::infinity();

// Remaining row totals, largest first, packed `bits` bits each into 128 bits.
struct NodeKey {
    std::uint64_t low = 0, high = 0;
    friend bool operator==(const NodeKey& a, const NodeKey& b) { return a.low == b.low && a.high == b.high; }
};

struct NodeKeyHash {
    std::size_t operator()(const NodeKey& key) const {
        return std::hash<std::uint64_t>{}(key.low ^ (key.high * 0x9E3779B97F4A7C15ull + 0x632BE59BD9B4E019ull));
    }
};

struct Past {
    double log_value;  // log ∏ 1/x! over the filled columns
    double mass;       // number of partial tables with this value (merged values weighted exactly)
};

struct Bounds {
    double largest;   // max over completions of log ∏ 1/x!
    double smallest;  // min over completions
};

// The futures of a node with two columns left: sorted values, and for each position the log of
// the summed probability mass Σ mass·exp(value) of it and all smaller values.
struct FutureList {
    std::vector<double> log_values;
    std::vector<double> masses;
    std::vector<double> log_prefix_mass;
    // The same prefix masses divided by the total, for sums that need no exp per term.
    std::vector<double> prefix_share;
    double log_range() const { return log_prefix_mass.back() - log_prefix_mass.front(); }
};

// Number of values in values[0, end) that are ≤ limit, given that it is at most `end`: a
// galloping search down from `end`, cheap when the answer is close to it.
std::size_t count_up_to(const std::vector<double>& values, std::size_t end, double limit) {
    std::size_t step = 1;
    while (end > 0 && values[end - 1] > limit) {
        const std::size_t low = end > step ? end - step : 0;
        if (values[low] > limit) {
            end = low;
            step *= 2;
        } else {
            return static_cast<std::size_t>(
                std::upper_bound(values.begin() + static_cast<std::ptrdiff_t>(low + 1),
                                 values.begin() + static_cast<std::ptrdiff_t>(end), limit) - values.begin());
        }
    }
    return end;
}

// Sum of exp(terms) without overflow or underflow.
class LogSum {
public:
    void add(double log_term) {
        if (log_term == minus_infinity) return;
        if (log_term <= largest_) {
            sum_ += std::exp(log_term - largest_);
        } else {
            sum_ = sum_ * std::exp(largest_ - log_term) + 1.0;
            largest_ = log_term;
        }
    }
    double value() const { return sum_ == 0 ? 0.0 : std::exp(largest_ + std::log(sum_)); }

private:
    double largest_ = minus_infinity;
    double sum_ = 0.0;
};

class Network {
public:
    Network(const Matrix& counts, const ExactLimits& limits)
        : limits_(limits), start_(Clock::now()), start_cpu_(cpu_now()) {
        const Matrix table = counts.rows() > counts.columns() ? counts.transposed() : counts;
        // The total first: the counts fit in `unsigned` only once it is known to be small.
        double n = 0;
        for (std::size_t r = 0; r < table.rows(); ++r)
            for (std::size_t c = 0; c < table.columns(); ++c) n += table(r, c);
        require(n <= 1e7, "the exact test handles totals up to 10,000,000; this table is larger (use the chi-squared test)");
        std::vector<unsigned> rows(table.rows(), 0), columns(table.columns(), 0);
        for (std::size_t r = 0; r < table.rows(); ++r)
            for (std::size_t c = 0; c < table.columns(); ++c) {
                rows[r] += static_cast<unsigned>(table(r, c));
                columns[c] += static_cast<unsigned>(table(r, c));
            }
        const auto total = static_cast<unsigned>(n);
        take((total + 1) * sizeof(double));
        log_factorial_.resize(total + 1);
        for (unsigned k = 0; k <= total; ++k) {
            log_factorial_[k] = std::lgamma(k + 1.0);
            if (++work_ > next_time_check_) check_time();
        }

        std::sort(rows.begin(), rows.end(), std::greater<unsigned>());
        row_count_ = rows.size();
        bits_ = 1;
        while ((rows.front() >> bits_) != 0) ++bits_;
        if (row_count_ * bits_ > 128) fail_too_large();
        root_ = pack(rows.data());

        // Small columns first: few pasts in the early stages, where every one must be stored.
        columns_ = columns;
        std::sort(columns_.begin(), columns_.end());

        double observed = 0, log_k = -log_factorial_[total];
        for (std::size_t r = 0; r < table.rows(); ++r)
            for (std::size_t c = 0; c < table.columns(); ++c) observed -= log_factorial_[static_cast<unsigned>(table(r, c))];
        for (unsigned r : rows) log_k += log_factorial_[r];
        for (unsigned c : columns) log_k += log_factorial_[c];
        log_k_ = log_k;
        threshold_ = observed + std::log1p(exact_tie_tolerance);

        log_column_factorials_from_.assign(columns_.size() + 1, 0.0);
        for (std::size_t k = columns_.size(); k-- > 0;)
            log_column_factorials_from_[k] = log_column_factorials_from_[k + 1] + log_factorial_[columns_[k]];
        meeting_ = columns_.size() - std::min(backward_columns(), columns_.size() - 1);
        futures_.resize(columns_.size() - meeting_);
        future_sizes_.resize(columns_.size() - meeting_);
        fill_.resize(row_count_);
        capacity_.resize(row_count_ + 1);
        child_.resize(row_count_);
    }

    double p_value() {
        const std::size_t meeting = meeting_;
        using Stage = std::unordered_map<NodeKey, NodePasts, NodeKeyHash>;
        const std::size_t node_bytes = map_node_bytes<Stage>();
        Stage stage;
        take(node_bytes);
        push(stage[root_].pasts, Past{0.0, 1.0});
        for (std::size_t k = 0; k < meeting; ++k) {
            const bool last = k + 1 == meeting;
            // The plan of the stage: every node's pasts merged, those the cheap bounds settle taken
            // out, and the work left counted (pasts × fills of the column), before any of it is done.
            struct Task {
                const NodeKey* node;
                std::vector<Past>* pasts;
                std::size_t first, end;
                double units;
                std::size_t fills_from, fills_to;  // its fills in planned_fills_ (last stage), or none
            };
            std::vector<Task> tasks;
            reserve_for(tasks, stage.size());
            double units = 0, past_bytes = 0;
            for (auto& [node, entry] : stage) {
                std::vector<Past>& pasts = entry.pasts;
                release(entry.slots);
                merge_equal_values(pasts);
                const auto [first, end] = split_by_bounds(pasts, bounds_of(k, node), log_total_future(k, node));
                if (first == end) {
                    release(pasts);
                    continue;
                }
                // Fills past twice what the forecast allows need not be counted: the stage is refused.
                const double enough = 2 * limits_.max_seconds / early_forward_rate / static_cast<double>(end - first) + 1;
                const double fills = count_fills(node, columns_[k], enough);
                // The last stage's fills are enumerated here, once, within a share of the memory,
                // so that the futures they lead to are counted before any is built.
                const std::size_t fills_from = planned_fills_.size();
                std::size_t fills_to = fills_from;
                if (last && (static_cast<double>(fills_from) + fills) * sizeof(Fill) <=
                                static_cast<double>(limits_.max_memory_bytes) / 8) {
                    collect_fills(k, node, planned_fills_);
                    fills_to = planned_fills_.size();
                    for (std::size_t i = fills_from; i < fills_to; ++i) future_size(k + 1, planned_fills_[i].child);
                }
                tasks.push_back(Task{&node, &pasts, first, end, static_cast<double>(end - first) * fills, fills_from,
                                     fills_to});
                past_bytes += static_cast<double>(pasts.capacity() * sizeof(Past));
                units += tasks.back().units;
            }
            begin_stage(k, units, last, past_bytes);
            Stage next;
            double units_before = 0;
            for (const Task& task : tasks) {
                std::vector<Past>& pasts = *task.pasts;
                if (last) {
                    settle_before_meeting(k, *task.node, pasts, task.first, task.end, task.fills_from, task.fills_to);
                } else {
                    const std::size_t first = task.first, end = task.end;
                    for_each_fill(*task.node, columns_[k], [&](const NodeKey& child, double fill_value, double arrangements) {
                        const auto [place, inserted] = next.try_emplace(child);
                        if (inserted) take(node_bytes);
                        NodePasts& target = place->second;
                        reserve_for(target.pasts, target.pasts.size() + (end - first));
                        for (std::size_t i = first; i < end; ++i)
                            target.pasts.push_back(Past{pasts[i].log_value + fill_value, pasts[i].mass * arrangements});
                        // Absorbing keeps the vector's capacity, so the bytes stay counted.
                        if (target.pasts.size() >= target.absorb_at) absorb_arrivals(target);
                        units_done_ += static_cast<double>(end - first);
                        if ((work_ += end - first) > next_time_check_) check_time();
                    });
                }
                release(pasts);
                units_before += task.units;
                units_done_ = units_before;
            }
            end_stage();
            release(tasks);
            release(planned_fills_);
            give_back(stage.size() * node_bytes);
            stage.swap(next);
        }
        return std::min(1.0, result_.value());
    }

private:
    using Clock = std::chrono::steady_clock;

    // How many of the last columns keep complete future lists. The forward pass grows with the
    // columns before the meeting stage, the lists with the columns after it; with few rows the
    // lists stay short enough to take more columns. The rule was tuned on the bench suite.
    std::size_t backward_columns() const {
        if (row_count_ == 2) return std::clamp<std::size_t>((columns_.size() + 1) / 3, 2, 5);
        if (row_count_ <= 4 && columns_.size() >= 8) return 3;
        return 2;
    }

    // Pasts are sorted: a prefix of [from, to) qualifies with every completion (its total mass is
    // added here), a suffix with none; returns the range [first, end) in between, which needs a
    // closer look.
    std::pair<std::size_t, std::size_t> split_by_bounds(const std::vector<Past>& pasts, const Bounds& bounds,
                                                        double log_total) {
        return split_by_bounds(pasts, 0, pasts.size(), bounds, log_total);
    }

    std::pair<std::size_t, std::size_t> split_by_bounds(const std::vector<Past>& pasts, std::size_t from,
                                                        std::size_t to, const Bounds& bounds, double log_total) {
        std::size_t first = from, end = to;
        while (first < end && pasts[first].log_value + bounds.largest <= threshold_) {
            result_.add(log_k_ + pasts[first].log_value + std::log(pasts[first].mass) + log_total);
            ++first;
        }
        while (end > first && pasts[end - 1].log_value + bounds.smallest > threshold_) --end;
        return {first, end};
    }

    // A node three columns from the end: each fill of its column leads to a node whose futures
    // are a sorted list, so every past is settled there by binary search, without storing it again.
    // The pasts in [cheap_first, cheap_end) are those the cheap bounds did not settle; the node's
    // fills are planned_fills_[fills_from, fills_to) when the plan kept them, else enumerated here.
    void settle_before_meeting(std::size_t k, const NodeKey& node, const std::vector<Past>& pasts,
                               std::size_t cheap_first, std::size_t cheap_end, std::size_t fills_from,
                               std::size_t fills_to) {
        const double log_total = log_total_future(k, node);
        const bool planned = fills_from < fills_to;
        if (!planned) {
            scratch_fills_.clear();  // it keeps its capacity, which stays counted
            collect_fills(k, node, scratch_fills_);
            fills_from = 0;
            fills_to = scratch_fills_.size();
        }
        const std::vector<Fill>& fills = planned ? planned_fills_ : scratch_fills_;
        struct Child {
            const FutureList* futures;
            double fill_value;
            double log_arrangements;
        };
        std::vector<Child> children;
        reserve_for(children, fills_to - fills_from);
        Bounds bounds{minus_infinity, std::numeric_limits<double>::infinity()};
        for (std::size_t i = fills_from; i < fills_to; ++i) {
            const Fill& fill = fills[i];
            children.push_back(Child{&futures_of(k + 1, fill.child), fill.value, fill.log_arrangements});
            bounds.largest = std::max(bounds.largest, fill.value + children.back().futures->log_values.back());
            bounds.smallest = std::min(bounds.smallest, fill.value + children.back().futures->log_values.front());
        }
        const auto [first, end] = split_by_bounds(pasts, cheap_first, cheap_end, bounds, log_total);
        if (first == end) {
            release(children);
            return;
        }
        // Each past's weight mass·exp(value), relative to the largest, so that a child's sum needs
        // products only; when the weights or the futures span too wide a range for that, the sum
        // falls back to logarithms term by term.
        const std::size_t weight_bytes = 2 * (end - first) * sizeof(double);
        take(weight_bytes);
        std::vector<double> log_weighted(end - first), share(end - first);
        for (std::size_t i = first; i < end; ++i) log_weighted[i - first] = pasts[i].log_value + std::log(pasts[i].mass);
        const double log_weighted_max = *std::max_element(log_weighted.begin(), log_weighted.end());
        const double log_weighted_min = *std::min_element(log_weighted.begin(), log_weighted.end());
        for (std::size_t i = 0; i < share.size(); ++i) share[i] = std::exp(log_weighted[i] - log_weighted_max);
        for (const Child& child : children) {
            const FutureList& futures = *child.futures;
            const double log_limit = threshold_ - child.fill_value;
            const bool linear = (log_weighted_max - log_weighted_min) + futures.log_range() < 600;
            std::size_t cut = futures.log_values.size();
            double sum = 0;
            for (std::size_t i = first; i < end; ++i) {
                // Pasts rise, so the qualifying futures shrink: search only below the last cut.
                cut = count_up_to(futures.log_values, cut, log_limit - pasts[i].log_value);
                if (cut == 0) break;
                if (linear)
                    sum += share[i - first] * futures.prefix_share[cut - 1];
                else
                    result_.add(log_k_ + child.fill_value + child.log_arrangements + log_weighted[i - first] +
                                futures.log_prefix_mass[cut - 1]);
            }
            if (linear && sum > 0)
                result_.add(log_k_ + child.fill_value + child.log_arrangements + log_weighted_max +
                            futures.log_prefix_mass.back() + std::log(sum));
            units_done_ += static_cast<double>(cheap_end - cheap_first);
            if ((work_ += end - first) > next_time_check_) check_time();
        }
        give_back(weight_bytes);
        release(children);
    }

    NodeKey pack(const unsigned* values) const {
        NodeKey key;
        for (std::size_t i = 0; i < row_count_; ++i) {
            const std::size_t shift = i * bits_;
            const auto v = static_cast<std::uint64_t>(values[i]);
            if (shift < 64) {
                key.low |= v << shift;
                if (shift + bits_ > 64) key.high |= v >> (64 - shift);
            } else {
                key.high |= v << (shift - 64);
            }
        }
        return key;
    }

    void unpack(const NodeKey& key, unsigned* values) const {
        const std::uint64_t mask = (std::uint64_t{1} << bits_) - 1;
        for (std::size_t i = 0; i < row_count_; ++i) {
            const std::size_t shift = i * bits_;
            std::uint64_t v;
            if (shift < 64) {
                v = key.low >> shift;
                if (shift + bits_ > 64) v |= key.high << (64 - shift);
            } else {
                v = key.high >> (shift - 64);
            }
            values[i] = static_cast<unsigned>(v & mask);
        }
    }

    // Calls visit(child, log ∏ 1/x_i!, arrangements) for each way to put `total` into the rows
    // of `node` (x_i ≤ r_i), once per arrangement class over rows with equal totals. The callback
    // must not enumerate fills itself (the buffers are shared).
    template <class Visit>
    void for_each_fill(const NodeKey& node, unsigned total, Visit&& visit) {
        std::vector<unsigned> rows(row_count_);
        unpack(node, rows.data());
        std::size_t length = row_count_;
        while (length > 0 && rows[length - 1] == 0) --length;
        rows_ = rows;
        length_ = length;
        capacity_[length] = 0;
        for (std::size_t i = length; i-- > 0;) capacity_[i] = capacity_[i + 1] + rows[i];
        fill_rows(0, total, 0.0, 1.0, 0, 0, visit);
    }

    template <class Visit>
    void fill_rows(std::size_t i, unsigned remaining, double fill_value, double arrangements, unsigned group_position,
                   unsigned run, Visit& visit) {
        if (i == length_) {
            for (std::size_t k = 0; k < row_count_; ++k) child_[k] = k < length_ ? rows_[k] - fill_[k] : 0;
            // Insertion sort, largest first: the rows are few and nearly in order already.
            for (std::size_t a = 1; a < length_; ++a)
                for (std::size_t b = a; b > 0 && child_[b - 1] < child_[b]; --b) std::swap(child_[b - 1], child_[b]);
            visit(pack(child_.data()), fill_value, arrangements);
            return;
        }
        const bool same_group = i > 0 && rows_[i] == rows_[i - 1];
        unsigned highest = std::min(rows_[i], remaining);
        if (same_group) highest = std::min(highest, fill_[i - 1]);
        const unsigned after = capacity_[i + 1];
        const unsigned lowest = remaining > after ? remaining - after : 0;
        for (unsigned v = lowest; v <= highest; ++v) {
            if (++work_ > next_time_check_) check_time();
            fill_[i] = v;
            const unsigned position = same_group ? group_position + 1 : 0;
            const unsigned new_run = same_group && v == fill_[i - 1] ? run + 1 : 1;
            fill_rows(i + 1, remaining - v, fill_value - log_factorial_[v], arrangements * (position + 1) / new_run,
                      position, new_run, visit);
        }
    }

    // log of Σ over completions of ∏ 1/x! from stage k: S!/(∏ r_i! ∏_{j≥k} c_j!).
    double log_total_future(std::size_t k, const NodeKey& node) const {
        std::vector<unsigned> rows(row_count_);
        unpack(node, rows.data());
        unsigned s = 0;
        double log_rows = 0;
        for (unsigned r : rows) {
            s += r;
            log_rows += log_factorial_[r];
        }
        return log_factorial_[s] - log_rows - log_column_factorials_from_[k];
    }

    // Bounds on the future values of a node from stage k on. Exact (from the futures) two columns
    // before the end; before that, from relaxations that drop one set of margins, which are cheap
    // and still valid: the most probable completion is no more probable than the best way to
    // spread each row (or each column) evenly, and no less probable than the least probable
    // way, putting each row (or each column) into a single cell.
    Bounds bounds_of(std::size_t k, const NodeKey& node) {
        if (k >= meeting_) {
            const FutureList& futures = futures_of(k, node);
            return {futures.log_values.back(), futures.log_values.front()};
        }
        std::vector<unsigned> rows(row_count_);
        unpack(node, rows.data());
        const std::size_t columns_left = columns_.size() - k;
        double spread_rows = 0, spread_columns = 0, single_rows = 0, single_columns = 0;
        for (unsigned r : rows) {
            spread_rows -= evenly_spread(r, columns_left);
            single_rows -= log_factorial_[r];
        }
        for (std::size_t j = k; j < columns_.size(); ++j) {
            spread_columns -= evenly_spread(columns_[j], length_of(rows));
            single_columns -= log_factorial_[columns_[j]];
        }
        return {std::min(spread_rows, spread_columns), std::max(single_rows, single_columns)};
    }

    static std::size_t length_of(const std::vector<unsigned>& rows) {
        std::size_t length = rows.size();
        while (length > 0 && rows[length - 1] == 0) --length;
        return length;
    }

    // Σ log x_j! when `total` is spread as evenly as whole numbers allow over `parts` cells.
    double evenly_spread(unsigned total, std::size_t parts) const {
        const auto base = static_cast<unsigned>(total / parts);
        const auto extra = static_cast<unsigned>(total % parts);
        return static_cast<double>(parts - extra) * log_factorial_[base] + extra * log_factorial_[base + 1];
    }

    // All futures of a node at stage k ≥ meeting_: sorted, equal values merged, with prefix sums.
    const FutureList& futures_of(std::size_t k, const NodeKey& node) {
        auto& memo = futures_[k - meeting_];
        if (auto found = memo.find(node); found != memo.end()) return found->second;
        const bool outermost = futures_depth_++ == 0;
        const double started = outermost ? cpu_seconds() : 0.0;
        // The values arrive with their bytes counted; they are given back once the list is built.
        std::vector<Past> values = k + 2 == columns_.size() ? last_two_columns(node) : combined_futures(k, node);
        built_future_values_ += static_cast<double>(values.size());
        merge_equal_values(values);
        const std::size_t list_bytes = future_node_bytes() + 4 * values.size() * sizeof(double);
        take(list_bytes);
        future_bytes_ += static_cast<double>(list_bytes);
        FutureList list;
        list.log_values.reserve(values.size());
        list.masses.reserve(values.size());
        list.log_prefix_mass.reserve(values.size());
        list.prefix_share.reserve(values.size());
        const double largest = values.back().log_value;
        double running = 0;  // Σ mass·exp(value − largest): every term is at most its mass, so no overflow
        for (const Past& v : values) {
            if (++work_ > next_time_check_) check_time();
            running += v.mass * std::exp(v.log_value - largest);
            list.log_values.push_back(v.log_value);
            list.masses.push_back(v.mass);
            list.log_prefix_mass.push_back(largest + std::log(running));
        }
        for (double log_mass : list.log_prefix_mass) list.prefix_share.push_back(std::exp(log_mass - list.log_prefix_mass.back()));
        release(values);
        if (--futures_depth_ == 0 && outermost) futures_seconds_ += cpu_seconds() - started;
        return memo.emplace(node, std::move(list)).first->second;
    }

    // Futures with more than two columns left: each fill of column k followed by every future of
    // the node it leads to.
    std::vector<Past> combined_futures(std::size_t k, const NodeKey& node) {
        std::vector<std::pair<NodeKey, Past>> children;
        for_each_fill(node, columns_[k], [&](const NodeKey& child, double fill_value, double arrangements) {
            push(children, {child, Past{fill_value, arrangements}});
        });
        std::vector<Past> values;  // counted here, given back by futures_of
        for (const auto& [child, fill] : children) {
            const FutureList& below = futures_of(k + 1, child);
            reserve_for(values, values.size() + below.log_values.size());
            for (std::size_t j = 0; j < below.log_values.size(); ++j)
                values.push_back(Past{fill.log_value + below.log_values[j], fill.mass * below.masses[j]});
            if ((work_ += below.log_values.size()) > next_time_check_) check_time();
        }
        release(children);
        return values;
    }

    // The futures of a node with two columns left: each fill x of the first column leaves r − x
    // for the last, so a future's value is −Σ log x_i! + log (r_i − x_i)!.
    std::vector<Past> last_two_columns(const NodeKey& node) {
        std::vector<unsigned> rows(row_count_);
        unpack(node, rows.data());
        const std::size_t length = length_of(rows);
        std::vector<unsigned> capacity(length + 1, 0), fill(length, 0);
        for (std::size_t i = length; i-- > 0;) capacity[i] = capacity[i + 1] + rows[i];
        std::vector<Past> values;  // counted here, given back by futures_of
        // The same walk as fill_rows, kept separate because it needs no child keys.
        auto walk = [&](auto& self, std::size_t i, unsigned remaining, double value, double arrangements,
                        unsigned group_position, unsigned run) -> void {
            if (i == length) {
                push(values, Past{value, arrangements});
                return;
            }
            const bool same_group = i > 0 && rows[i] == rows[i - 1];
            unsigned highest = std::min(rows[i], remaining);
            if (same_group) highest = std::min(highest, fill[i - 1]);
            const unsigned lowest = remaining > capacity[i + 1] ? remaining - capacity[i + 1] : 0;
            for (unsigned v = lowest; v <= highest; ++v) {
                if (++work_ > next_time_check_) check_time();
                fill[i] = v;
                const unsigned position = same_group ? group_position + 1 : 0;
                const unsigned new_run = same_group && v == fill[i - 1] ? run + 1 : 1;
                self(self, i + 1, remaining - v, value - log_factorial_[v] - log_factorial_[rows[i] - v],
                     arrangements * (position + 1) / new_run, position, new_run);
            }
        };
        walk(walk, 0, columns_[columns_.size() - 2], 0.0, 1.0, 0, 0);
        return values;
    }

    // Working memory, counted in bytes before it is allocated, so that the cap stops the test
    // before the memory is taken. A vector is counted by its capacity, not its size; a hash-map
    // node by its size with the allocator's and the bucket table's share. On the bench tables the
    // peak resident memory grew by 0.83 to 1.09 times the count.
    void take(std::size_t bytes) {
        memory_ += bytes;
        if (memory_ > limits_.max_memory_bytes) fail("memory");
    }

    void give_back(std::size_t bytes) { memory_ -= bytes; }

    // Sorts pasts by value and merges those whose values agree to within rounding, keeping the
    // mass exact (the merged mass is expressed relative to the kept value). The sort reads no
    // clock: the vector is within the memory cap, which bounds the sort too (about 2 s for 17
    // million values, a 270 MB vector).
    void merge_equal_values(std::vector<Past>& pasts) {
        std::sort(pasts.begin(), pasts.end(), [](const Past& a, const Past& b) { return a.log_value < b.log_value; });
        std::size_t kept = 0;
        for (std::size_t i = 0; i < pasts.size(); ++i) {
            if (kept > 0 && pasts[i].log_value - pasts[kept - 1].log_value <= merge_tolerance) {
                merge_into(pasts[kept - 1], pasts[i].log_value, pasts[i].mass);
            } else {
                pasts[kept++] = pasts[i];
            }
            if (++work_ > next_time_check_) check_time();
        }
        pasts.resize(kept);  // the capacity stays, and stays counted
    }

    // Values closer than this are one value (they differ by rounding: sums of the same log
    // factorials in another order).
    static constexpr double merge_tolerance = 1e-9;

    // Adds a past of value `value` and mass `mass` to `kept`, whose value is within the tolerance:
    // mass·e^(value − kept), with e^d taken as 1 + d (|d| ≤ 1e-9, so d²/2 is below the rounding).
    static void merge_into(Past& kept, double value, double mass) {
        kept.mass += mass * (1 + (value - kept.log_value));
    }

    // The pasts arriving at a node of the next stage. They are stored as they arrive (one after the
    // other in memory, which keeps the stage's pushes cheap) and, once the node holds 4096 pasts or
    // twice its distinct ones, the new arrivals are absorbed into the distinct values before them:
    // a hash table over the values, cut into intervals of the tolerance, finds a value already there
    // and adds the arrival's mass to it. So memory follows the number of distinct values, not the
    // number of paths, and no sort is needed until the next stage (sorting every few thousand
    // arrivals had cost more than half of a forward stage). Values that straddle the border of two
    // intervals stay apart here and are merged when the next stage sorts the node's pasts.
    struct NodePasts {
        std::vector<Past> pasts;  // [0, distinct): absorbed, distinct; then arrivals
        std::size_t distinct = 0;
        std::size_t absorb_at = 4096;
        // 1 + the position of a distinct past, or 0 for an empty slot; a power of two long, at most
        // half full.
        std::vector<std::uint32_t> slots;
    };

    static std::int64_t interval_of(double value) {
        // |value| ≤ ln(10^7!) ≈ 1.5e8, so value/tolerance fits in 64 bits. Rounded down by hand:
        // std::floor is a library call on the baseline x86-64 instruction set.
        const double scaled = value * (1 / merge_tolerance);
        const auto truncated = static_cast<std::int64_t>(scaled);
        return static_cast<double>(truncated) > scaled ? truncated - 1 : truncated;
    }

    static std::size_t slot_of(std::int64_t interval, std::size_t mask) {
        return static_cast<std::size_t>((static_cast<std::uint64_t>(interval) * 0x9E3779B97F4A7C15ull) >> 32) & mask;
    }

    void absorb_arrivals(NodePasts& node) {
        std::vector<Past>& pasts = node.pasts;
        for (std::size_t i = node.distinct; i < pasts.size(); ++i) {
            if (2 * (node.distinct + 1) > node.slots.size()) grow_slots(node);
            const std::int64_t interval = interval_of(pasts[i].log_value);
            const std::size_t mask = node.slots.size() - 1;
            for (std::size_t s = slot_of(interval, mask);; s = (s + 1) & mask) {
                std::uint32_t& slot = node.slots[s];
                if (slot == 0) {
                    pasts[node.distinct++] = pasts[i];
                    slot = static_cast<std::uint32_t>(node.distinct);
                    break;
                }
                Past& kept = pasts[slot - 1];
                if (interval_of(kept.log_value) == interval) {
                    merge_into(kept, pasts[i].log_value, pasts[i].mass);
                    break;
                }
            }
            if (++work_ > next_time_check_) check_time();
        }
        pasts.resize(node.distinct);  // the capacity stays, and stays counted
        node.absorb_at = std::max<std::size_t>(4096, 2 * node.distinct);
    }

    void grow_slots(NodePasts& node) {
        const std::size_t size = std::max<std::size_t>(64, 2 * node.slots.size());
        if (node.distinct >= std::numeric_limits<std::uint32_t>::max() / 2) fail("memory");
        release(node.slots);
        take(size * sizeof(std::uint32_t));
        node.slots.assign(size, 0);
        const std::size_t mask = size - 1;
        for (std::size_t i = 0; i < node.distinct; ++i) {
            std::size_t s = slot_of(interval_of(node.pasts[i].log_value), mask);
            while (node.slots[s] != 0) s = (s + 1) & mask;
            node.slots[s] = static_cast<std::uint32_t>(i + 1);
            if (++work_ > next_time_check_) check_time();
        }
    }

    // Room for `needed` elements, at least doubling, so that pushes stay amortised. The new
    // buffer's pages are touched only as elements arrive, so while the elements move, the old
    // buffer and the copied part of the new one together take about the new capacity.
    template <class T>
    void reserve_for(std::vector<T>& values, std::size_t needed) {
        if (needed <= values.capacity()) return;
        const std::size_t capacity = std::max(needed, 2 * values.capacity());
        take((capacity - values.capacity()) * sizeof(T));
        values.reserve(capacity);
    }

    template <class T>
    void push(std::vector<T>& values, const T& value) {
        reserve_for(values, values.size() + 1);
        values.push_back(value);
    }

    template <class T>
    void release(std::vector<T>& values) {
        give_back(values.capacity() * sizeof(T));
        std::vector<T>().swap(values);
    }

    // A node of a hash map: the key and value, the link, the cached hash, the allocator's header
    // and a bucket pointer.
    template <class Map>
    static constexpr std::size_t map_node_bytes() {
        return sizeof(typename Map::value_type) + 4 * sizeof(void*);
    }

    // A node of the futures' memo, with the headers of its four vectors.
    static constexpr std::size_t future_node_bytes() {
        return map_node_bytes<std::unordered_map<NodeKey, FutureList, NodeKeyHash>>() + 4 * 2 * sizeof(void*);
    }

    double elapsed() const { return std::chrono::duration<double>(Clock::now() - start_).count(); }
    // Processor seconds of this thread (POSIX); where that clock is missing, of the process.
    static double cpu_now() {
#if defined(CLOCK_THREAD_CPUTIME_ID)
        timespec now{};
        clock_gettime(CLOCK_THREAD_CPUTIME_ID, &now);
        return static_cast<double>(now.tv_sec) + static_cast<double>(now.tv_nsec) * 1e-9;
#else
        return static_cast<double>(std::clock()) / CLOCKS_PER_SEC;
#endif
    }
    // Processor seconds spent on the test so far.
    double cpu_seconds() const { return cpu_now() - start_cpu_; }

    // The number of fills for_each_fill(node, total) visits (one per arrangement class), counted
    // without building them: the last two rows are counted in closed form. Stops counting once the
    // count reaches `enough`.
    double count_fills(const NodeKey& node, unsigned total, double enough) {
        std::vector<unsigned> rows(row_count_);
        unpack(node, rows.data());
        const std::size_t length = length_of(rows);
        if (length == 0) return total == 0 ? 1 : 0;
        std::vector<unsigned> capacity(length + 1, 0);
        for (std::size_t i = length; i-- > 0;) capacity[i] = capacity[i + 1] + rows[i];
        double count = 0;
        auto walk = [&](auto& self, std::size_t i, unsigned remaining, unsigned previous) -> void {
            const bool same_group = i > 0 && rows[i] == rows[i - 1];
            unsigned highest = std::min(rows[i], remaining);
            if (same_group) highest = std::min(highest, previous);
            unsigned lowest = remaining > capacity[i + 1] ? remaining - capacity[i + 1] : 0;
            if (i + 1 == length) {
                if (lowest <= highest) count += 1;
                return;
            }
            if (i + 2 == length) {
                // The last row takes what is left, which the lowest value already keeps within its
                // total; within a group it must not exceed this row's value.
                if (rows[i + 1] == rows[i]) lowest = std::max(lowest, (remaining + 1) / 2);
                if (lowest <= highest) count += highest - lowest + 1;
                return;
            }
            for (unsigned v = lowest; v <= highest && count < enough; ++v) {
                if (++work_ > next_time_check_) check_time();
                self(self, i + 1, remaining - v, v);
            }
        };
        walk(walk, 0, total, 0);
        return count;
    }

    // A fill of a column: the node it leads to, log ∏ 1/x_i!, and the log of its arrangements.
    struct Fill {
        NodeKey child;
        double value;
        double log_arrangements;
    };

    // Appends the fills of stage k's column at `node` to `fills`.
    void collect_fills(std::size_t k, const NodeKey& node, std::vector<Fill>& fills) {
        for_each_fill(node, columns_[k], [&](const NodeKey& child, double value, double arrangements) {
            push(fills, Fill{child, value, std::log(arrangements)});
        });
    }

    // A lower bound on the values futures_of(k, node) builds (the measure of its work), counted
    // without building them (memoised): a list over the last two columns builds one value per fill
    // of its column; a combined list at least one per fill (each list it is made of holds a value
    // or more; how many survive the merging of equal values is not known in advance).
    double future_size(std::size_t k, const NodeKey& node) {
        auto& memo = future_sizes_[k - meeting_];
        if (auto found = memo.find(node); found != memo.end()) return found->second;
        double size = 0;
        if (k + 2 == columns_.size()) {
            size = count_fills(node, columns_[k], std::numeric_limits<double>::infinity());
        } else {
            std::vector<NodeKey> children;
            for_each_fill(node, columns_[k], [&](const NodeKey& child, double, double) { push(children, child); });
            for (const NodeKey& child : children) future_size(k + 1, child);
            size = static_cast<double>(children.size());
            release(children);
        }
        take(map_node_bytes<std::unordered_map<NodeKey, double, NodeKeyHash>>());
        memo.emplace(node, size);
        planned_future_values_ += size;
        return size;
    }

    // ---- The forecast (ExactLimits::forecast): refusing at once what cannot finish in time ----
    //
    // Every stage is planned before it runs (p_value): its work is counted in units, one per past
    // and fill of the column (a push of a forward stage, a search of the last stage), and the
    // futures the last stage needs are counted in values. The forecast adds up what is left:
    // - the current stage's units left, at its own pace so far: measured in processor time over
    //   the last doubling of its progress once 2% of it is done (a forward stage's pace only slows
    //   as its lists grow, so the rest takes at least that long). The last stage's pace quickens
    //   instead (its first searches meet futures lists not yet in the cache; on the bench tables it
    //   was 1.5 to 2.5 times its average over the first 2%), so there it is measured from 10% on,
    //   and the faster of the pace over the whole stage and that over the last doubling is taken.
    //   Before that, at the pace of the last forward stage but no slower than 15 ns a unit (small
    //   stages cost more per unit than large ones, up to 16 times on the bench tables), or 1 ns a
    //   unit for the last stage;
    // - for a forward stage of 100,000 units or more, as many more stages of the same cost as
    //   forward stages remain (on the bench suite and random tables of its sizes each took 1.2 to
    //   40 times as long as the one before);
    // - the futures left to build, at their pace so far (20 ns a value before it is known);
    // and refuses, with the limit's own message, as soon as that cannot fit in the time left. The
    // processor time is turned into time on the clock by the share of it the test has had so far
    // (at least a quarter).
    // The memory of the last stage is foreseen too (check_future_memory): the futures it builds
    // stay until its end, beside everything but its pasts.
    // Each part is a lower estimate, so that a table that would finish is not refused; a table
    // whose cost only shows late (many stages that grow slowly) is still refused at the limit.
    void begin_stage(std::size_t k, double units, bool last, double past_bytes) {
        stage_ = k;
        last_stage_ = last;
        stage_units_ = units;
        units_done_ = 0;
        stage_started_ = cpu_seconds();
        stage_futures_seconds_ = futures_seconds_;
        kept_bytes_ = static_cast<double>(memory_) - past_bytes;
        stage_future_bytes_ = future_bytes_;
        stage_future_values_ = built_future_values_;
        window_units_ = window_seconds_ = mark_units_ = mark_seconds_ = 0;
        check_forecast();
    }

    void end_stage() {
        const double seconds = stage_seconds();
        if (!last_stage_ && seconds >= 0.005 && stage_units_ > 0) forward_rate_ = seconds / stage_units_;
    }

    // Processor seconds of the current stage's own work (the futures it built taken out).
    double stage_seconds() const {
        return cpu_seconds() - stage_started_ - (futures_seconds_ - stage_futures_seconds_);
    }

    void check_forecast() {
        if (!limits_.forecast) return;
        const double wall = elapsed(), cpu = cpu_seconds(), in_stage = stage_seconds();
        // The pace over the last doubling of the stage's progress.
        // The window runs from the last doubling but one, so that it always spans the last doubling.
        if (units_done_ >= 2 * mark_units_) {
            window_units_ = mark_units_;
            window_seconds_ = mark_seconds_;
            mark_units_ = units_done_;
            mark_seconds_ = in_stage;
        }
        double rate = last_stage_ ? settle_rate : std::min(forward_rate_, early_forward_rate);
        if (units_done_ >= (last_stage_ ? 0.1 : 0.02) * stage_units_ && in_stage >= 0.01) {
            rate = in_stage / units_done_;
            const double window = units_done_ - window_units_;
            if (window >= 0.01 * stage_units_ && in_stage - window_seconds_ >= 0.005) {
                const double recent = (in_stage - window_seconds_) / window;
                rate = last_stage_ ? std::min(rate, recent) : std::max(rate, recent);
            }
        }
        double seconds_left = std::max(0.0, stage_units_ - units_done_) * rate;
        if (!last_stage_ && stage_units_ >= 1e5 && stage_ + 2 < meeting_)
            seconds_left += static_cast<double>(meeting_ - 2 - stage_) * stage_units_ * rate;
        const double futures_left = std::max(0.0, planned_future_values_ - built_future_values_);
        const double future_rate =
            built_future_values_ >= 1e5 ? futures_seconds_ / built_future_values_ : default_future_rate;
        seconds_left += futures_left * future_rate;
        // The share is taken as at least a quarter: a test starved of the processor for a moment
        // (a busy machine) would otherwise see every remaining step magnified many times.
        const double slowdown = cpu >= 0.05 ? std::clamp(wall / cpu, 1.0, max_slowdown) : 1.0;
        if (wall + seconds_left * slowdown > limits_.max_seconds) fail("time");
        if (last_stage_) check_future_memory();
    }

    // The last stage keeps every futures list it builds until it ends, while its pasts are given
    // back task by task; so at its end it holds at least what it held at its start less its pasts
    // (kept_bytes_), and all the lists. The lists still to build hold at least the values the plan
    // counted for them (planned_future_values_, before equal values merge), in bytes at half the
    // pace of the lists built so far in the stage: equal values merge unevenly from list to list
    // (on the bench tables a list took 6 to 27 bytes per counted value), and the half leaves room
    // for that. Measured once the stage has built 100,000 values and 2% of its plan.
    void check_future_memory() {
        const double built = built_future_values_ - stage_future_values_;
        const double left = planned_future_values_ - built_future_values_;
        if (left <= 0 || built < std::max(1e5, 0.02 * (planned_future_values_ - stage_future_values_))) return;
        const double bytes = future_bytes_ - stage_future_bytes_;
        const double bytes_per_value = 0.5 * bytes / built;
        if (kept_bytes_ + bytes + left * bytes_per_value > static_cast<double>(limits_.max_memory_bytes)) fail("memory");
    }
    static constexpr double early_forward_rate = 15e-9, settle_rate = 1e-9, default_future_rate = 20e-9;
    static constexpr double max_slowdown = 4;

    void check_time() {
        next_time_check_ = work_ + (1u << 12);  // the clock is cheap; check often so limits hold closely
        const double seconds = std::chrono::duration<double>(Clock::now() - start_).count();
        if (seconds > limits_.max_seconds) fail("time");
        check_forecast();
    }

    [[noreturn]] void fail(const char* resource) const { throw exact_limit_error(limits_, resource); }

    [[noreturn]] void fail_too_large() const {
        throw Error(std::string("the exact test cannot enumerate a table with this many rows and columns and such "
                                "totals; ") + simulate_instead);
    }

    ExactLimits limits_;
    Clock::time_point start_;
    double start_cpu_;
    std::vector<double> log_factorial_;
    std::vector<unsigned> columns_;
    std::vector<double> log_column_factorials_from_;
    std::size_t row_count_ = 0, bits_ = 1, length_ = 0;
    NodeKey root_;
    double log_k_ = 0, threshold_ = 0;
    std::size_t meeting_ = 0;  // the first stage whose nodes keep all their futures
    std::vector<std::unordered_map<NodeKey, FutureList, NodeKeyHash>> futures_;
    std::vector<std::unordered_map<NodeKey, double, NodeKeyHash>> future_sizes_;
    std::vector<unsigned> rows_, capacity_, fill_, child_;
    std::vector<Fill> planned_fills_, scratch_fills_;
    std::size_t memory_ = 0;  // bytes of working memory held, as counted by take and give_back
    unsigned long long work_ = 0, next_time_check_ = 1u << 12;
    LogSum result_;
    // Progress of the current stage, for the forecast.
    double units_done_ = 0, stage_units_ = 0;
    std::size_t futures_depth_ = 0;
    double futures_seconds_ = 0;
    // Bytes of the futures lists built, and for the last stage's memory forecast, what it started from.
    double future_bytes_ = 0, kept_bytes_ = 0, stage_future_bytes_ = 0, stage_future_values_ = 0;
    double stage_started_ = 0, stage_futures_seconds_ = 0;
    double forward_rate_ = early_forward_rate;
    double planned_future_values_ = 0, built_future_values_ = 0;
    std::size_t stage_ = 0;
    bool last_stage_ = false;
    double window_units_ = 0, window_seconds_ = 0, mark_units_ = 0, mark_seconds_ = 0;
};

}  // namespace

double freeman_halton_p_value(const Matrix& counts, const ExactLimits& limits) {
    try {
        Network network(counts, limits);
        return network.p_value();
    } catch (const std::bad_alloc&) {
        // The memory cap counts what the test holds, but the machine may have less free; the
        // network is gone by now, so its memory is back for the message.
        throw exact_limit_error(limits, "memory");
    }
}

}  // namespace assoc::detail
