#include <cmath>

#include "assoc/chi_squared_distribution.hpp"
#include "assoc/error.hpp"
#include "assoc/statistics.hpp"

namespace assoc {

TestResult independence_test(const CountTable& table, Method method) {
    TestResult result;
    switch (method) {
    case Method::pearson: result.statistic = pearson_statistic(table); break;
    case Method::likelihood_ratio: result.statistic = likelihood_ratio_statistic(table); break;
    case Method::yates: result.statistic = yates_statistic(table); break;
    }
    result.df = degrees_of_freedom(table);
    result.p_value = chi_squared_p_value(result.statistic, result.df);
    return result;
}

double representable_statistic(const TestResult& result, Method method) {
    require(std::isfinite(result.statistic),
            method_name(method) + " is larger than a spreadsheet number can hold (above 1.8e308) for this table, so "
            "its p-value is 0; divide every count by the same factor to see its size (it shrinks by that factor)");
    return result.statistic;
}

std::string method_name(Method method) {
    switch (method) {
    case Method::pearson: return "Pearson X²";
    case Method::likelihood_ratio: return "likelihood-ratio G²";
    case Method::yates: return "Yates-corrected X²";
    }
    return "";
}

}  // namespace assoc
