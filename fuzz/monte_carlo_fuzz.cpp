// Fuzz target: the simulated (Monte Carlo) p-value, with its options read as a worksheet gives
// them, under a small work cap.
// Input: section 1 is the range; section 2 may give the trials, the seed and the statistic word.
// Checks: only assoc::Error leaves the core; the p-value in [1/(trials + 1), 1]; the standard error
// ≥ 0; the count of simulated tables at most the trials; the same seed gives the same answer; the
// cap holds.
#include <cmath>

#include "assoc/count_table.hpp"
#include "assoc/monte_carlo.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& range = section(sections, 0);
    const CellGrid& arguments = section(sections, 1);
    SimulationOptions options;
    const std::string word = word_at(arguments, 2);
    if (!attempt("simulation_options", [&] {
            options = simulation_options(number_at(arguments, 0, 200), number_at(arguments, 1, 1),
                                         word.empty() ? std::nullopt : std::optional<std::string>(word));
        }))
        return 0;
    options.limits.max_work = 2e6;   // a five-hundredth of the core's default
    options.limits.max_seconds = 1;  // within the 2 s of CPU time allowed below
    CountTable table;
    if (!attempt("read_count_table", [&] { table = read_count_table(range); })) return 0;
    SimulationResult first;
    const bool answered = attempt("monte_carlo_test", [&] {
        first = monte_carlo_test(table, options);
        const double trials = static_cast<double>(first.trials);
        check_between(first.p_value, 1 / (trials + 1), 1, "simulated p-value");
        check_nonnegative(first.standard_error, "standard error");
        check_nonnegative(first.statistic, "observed statistic");
        if (first.trials != options.trials || first.at_least_as_large > first.trials)
            finding("the simulation counted more tables than it drew");
    }, 2.0);
    if (answered && options.trials <= 2000)
        attempt("monte_carlo_test (again)", [&] {
            if (monte_carlo_test(table, options).at_least_as_large != first.at_least_as_large)
                finding("the same seed gave a different answer");
        });
    return 0;
}
