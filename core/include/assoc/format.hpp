#pragma once
// Numbers written into messages and report sentences.
#include <string>

namespace assoc {

// A count with thousands separators: 1,000,000. Non-whole values keep up to 2 decimals.
std::string format_count(double value);
// A number with `digits` significant digits, without trailing zeros: 0.0512, 3.84.
std::string format_number(double value, int digits = 4);
// A statistic written into a sentence: one decimal while it has at most seven digits (2.9, -5.3,
// 123456.7), three significant digits in scientific notation beyond (-3.49e+07, 1.2e+300), so that a
// huge value never turns into a row of thirty digits.
std::string format_statistic(double value);
// A p-value as people read it: "0.0234", "below 0.0001" would hide the size, so tiny values
// use scientific notation: "3.0e-07".
std::string format_p_value(double p);

}  // namespace assoc
