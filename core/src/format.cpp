#include "assoc/format.hpp"

#include <cmath>
#include <cstdio>

namespace assoc {

std::string format_count(double value) {
    if (!std::isfinite(value)) return format_number(value);
    if (value != std::floor(value) || std::fabs(value) >= 1e15) return format_number(value, 6);
    char digits[32];
    std::snprintf(digits, sizeof digits, "%.0f", std::fabs(value));
    std::string plain(digits), grouped;
    for (std::size_t i = 0; i < plain.size(); ++i) {
        if (i > 0 && (plain.size() - i) % 3 == 0) grouped += ',';
        grouped += plain[i];
    }
    return (value < 0 ? "-" : "") + grouped;
}

std::string format_number(double value, int digits) {
    if (std::isnan(value)) return "not a number";
    if (std::isinf(value)) return value > 0 ? "infinity" : "minus infinity";
    char buffer[48];
    std::snprintf(buffer, sizeof buffer, "%.*g", digits, value);
    return buffer;
}

std::string format_statistic(double value) {
    if (!std::isfinite(value) || std::fabs(value) >= 1e6) return format_number(value, 3);
    char buffer[32];
    std::snprintf(buffer, sizeof buffer, "%.1f", value);
    return buffer;
}

std::string format_p_value(double p) {
    if (p >= 0.001 || p == 0) return format_number(p, 3);
    char buffer[32];
    std::snprintf(buffer, sizeof buffer, "%.1e", p);
    return buffer;
}

}  // namespace assoc
