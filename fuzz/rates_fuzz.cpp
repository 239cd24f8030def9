// Fuzz target: rates of column 1 by row with Wilson intervals (row_rates), and the difference of
// two rates with Newcombe's interval (rate_difference), read from cells at a confidence level from
// the input.
// Input: section 1 is the range; section 2 may give the confidence level.
// Checks: only assoc::Error leaves the core; every rate and limit in [0, 1] and in order; the
// difference and its limits in [−1, 1] and in order, the difference being the two rates' difference;
// counts multiplied by a power of 4 leave the rates as they are.
#include <cmath>

#include "assoc/rates.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

namespace {

void check_rate(const RateInterval& rate, const std::string& what) {
    check_probability(rate.rate, what);
    check_probability(rate.lower, what + ", lower limit");
    check_probability(rate.upper, what + ", upper limit");
    if (rate.lower > rate.rate * (1 + 1e-12) + 1e-15 || rate.upper < rate.rate * (1 - 1e-12) - 1e-15)
        finding("the interval of the " + what + " does not hold it");
}

std::vector<double> check_rates(const CellGrid& range, double confidence) {
    std::vector<double> rates;
    attempt("row_rates", [&] {
        const RowRates result = row_rates(range, confidence);
        for (const RowRate& row : result.rows) {
            check_message(row.name, "row name");
            rates.push_back(row.has_counts ? row.rate.rate : -1);
            if (!row.has_counts) continue;
            check_rate(row.rate, "rate of " + row.name);
            check_nonnegative(row.total, "row total");
        }
        for (const std::string& remark : result.remarks) check_message(remark, "rates remark");
    });
    attempt("rate_difference", [&] {
        const RateDifference result = rate_difference(range, confidence);
        check_between(result.difference, -1, 1, "rate difference");
        check_between(result.lower, -1, 1, "rate difference, lower limit");
        check_between(result.upper, -1, 1, "rate difference, upper limit");
        check_rate(result.first, "first rate");
        check_rate(result.second, "second rate");
        if (!close(result.difference, result.first.rate - result.second.rate, 1e-12))
            finding("the rate difference is not the difference of the rates");
        if (result.lower > result.difference + 1e-12 || result.upper < result.difference - 1e-12)
            finding("the interval of the rate difference does not hold it");
    });
    return rates;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& range = section(sections, 0);
    const double confidence = number_at(section(sections, 1), 0, 0.95);
    const std::vector<double> rates = check_rates(range, confidence);
    const CellGrid bigger = scaled(range, scale_factor(data, size));
    const std::vector<double> scaled_rates = check_rates(bigger, confidence);
    if (rates.size() == scaled_rates.size())
        for (std::size_t i = 0; i < rates.size(); ++i)
            if (!close(rates[i], scaled_rates[i], 1e-12)) finding("a rate of the table times a power of 4 differs");
    return 0;
}
