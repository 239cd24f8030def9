#pragma once
// Labels that name an occasion beside the category ("Yes before", "No before"): the words every label
// of a side shares, at its start or at its end, left out. Paired tables match their columns to their
// rows so, and the validity check points such tables to the paired test.
#include <string>
#include <vector>

namespace assoc::detail {

// The labels folded (folded_label) without the words they all share at their start or end ("Yes
// before", "No before": "yes", "no"); empty when they share none, or when a label would be left
// with nothing.
std::vector<std::string> without_shared_words(const std::vector<std::string>& labels);

// As without_shared_words, but the folded labels themselves when they share no words.
std::vector<std::string> label_keys(const std::vector<std::string>& labels);

}  // namespace assoc::detail
