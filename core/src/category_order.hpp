#pragma once
// Whether the labels of ordered categories name an order other than the one the table gives them
// ("5-10 years, 0-2 years, 2-5 years, 10+ years"; "Poor, Good, Fair, Excellent"). The trend and
// linear-by-linear tests score categories 1, 2, 3, … in the table's order when no scores are given,
// so such a table would be tested along an order nobody meant.
#include <optional>
#include <string>
#include <vector>

namespace assoc::detail {

// The refusal's text when `labels` (one per category, in the table's order; "" where none) all
// name an order, by their numbers or as the steps of a common answer scale, and the table's order
// is neither that order nor its reverse; nullopt otherwise. `side` is "row" or "column", and
// `scores` the argument that would give scores in any order ("scores"), or nullptr where scores
// must follow the table's order too (the linear-by-linear test).
std::optional<std::string> categories_out_of_order(const std::vector<std::string>& labels, const char* side,
                                                   const char* scores);

}  // namespace assoc::detail
