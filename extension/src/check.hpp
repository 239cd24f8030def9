#pragma once
// ASSOC.CHECK: the verdict on the chi-squared test for a table, and what another ASSOC function, or
// an option word, does on a range: it runs the generated trials (function_catalog.hpp) and says in
// words which fail and why. A new function or word takes part without code here.
#include <string>

#include "assoc/cell.hpp"

namespace assoc::calc {

// `function_or_word` is blank, a function's name ("exact", "ASSOC.EXACT", any case) or an option word.
std::string check_range(const CellGrid& range, const Cell& function_or_word);

}  // namespace assoc::calc
