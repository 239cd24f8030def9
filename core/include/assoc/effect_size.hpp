#pragma once
#include <string>
// Strength of association, on scales that do not grow with the sample size.
// All use the uncorrected Pearson X²: a continuity correction is for the test, not the size.
#include "assoc/count_table.hpp"

namespace assoc {

// Cramér's V = √(X² / (n (min(r, c) − 1))), between 0 and 1.
double cramers_v(const CountTable& table);

// Bergsma's (2013) bias-corrected V: φ̃² = max(0, X²/n − (r−1)(c−1)/(n−1)),
// r̃ = r − (r−1)²/(n−1), c̃ = c − (c−1)²/(n−1), Ṽ = √(φ̃² / min(r̃ − 1, c̃ − 1)).
// Never above V; 0 when the table shows less association than chance would.
double cramers_v_corrected(const CountTable& table);

// Signed phi for a 2×2 table, (ad − bc) / √(r1 r2 c1 c2): positive when the
// diagonal cells are larger than independence would give.
double phi_coefficient(const CountTable& table);

// Pearson's contingency coefficient C = √(X² / (X² + n)).
double contingency_coefficient(const CountTable& table);

// Cohen's w = √(X² / n), the effect size that power calculations use.
double cohens_w(const CountTable& table);

// The strength of an association in words for a memo, from Cramér's V turned into Cohen's w =
// V·√(min(r, c) − 1) (the same as √(X²/n)): below 0.1 "very weak", from 0.1 "weak", from 0.3
// "moderate", from 0.5 "strong". The bands are Cohen's (1988, ch. 7) conventions for w: 0.1 small,
// 0.3 medium, 0.5 large (from memory); "very weak" for less than small is common practice.
std::string strength_in_words(double cramers_v, const CountTable& table);
// Those bands in a few words, to go with strength_in_words.
std::string strength_bands();

}  // namespace assoc
