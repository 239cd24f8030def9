#pragma once
// Strength of association for tables whose rows and columns are both ordered, from the pairs of
// people (counts) that the two orders rank alike or oppositely. Both are signed: positive when
// higher rows go with higher columns (in the order of the table), negative when with lower ones.
//
// A pair of people in different rows and different columns is concordant when the one in the
// later row is also in the later column, discordant when in the earlier column:
//     C = Σ n_ij Σ_{k>i, l>j} n_kl,   D = Σ n_ij Σ_{k>i, l<j} n_kl.
// Pairs in the same row or the same column (ties) are neither.
#include "assoc/count_table.hpp"

namespace assoc {

// Goodman and Kruskal's γ = (C − D) / (C + D), from −1 to 1: the excess of concordant over
// discordant pairs among the untied ones. It ignores ties, so it reaches ±1 whenever one kind of
// pair is missing, and it is larger than τ-b for tables with few categories.
double goodman_kruskal_gamma(const CountTable& table);

// Kendall's τ-b = (C − D) / √((P − T_rows)(P − T_columns)), from −1 to 1, with P = n(n − 1)/2 all
// pairs and T the pairs tied on the rows (on the columns); for a table that is
// 2 (C − D) / √((n² − Σ n_i+²)(n² − Σ n_+j²)). It counts ties against the association, reaches
// ±1 only for a square table with all counts on one diagonal, and equals Kendall's τ-b of the
// people's two ranks (scipy's kendalltau on the expanded data).
double kendall_tau_b(const CountTable& table);

}  // namespace assoc
