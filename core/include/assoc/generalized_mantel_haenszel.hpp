#pragma once
// The generalized Cochran–Mantel–Haenszel test of general association across strata: are the
// rows and columns of r×c tables associated once the strata (offices, channels) are held apart?
// For 2×2 strata it is the Mantel–Haenszel test of mantel_haenszel.hpp without the continuity
// correction.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/long_strata.hpp"
#include "assoc/work_limits.hpp"

namespace assoc {

struct GeneralAssociationResult {
    double p_value = 1.0;
    double statistic = 0.0;  // chi-squared with df degrees of freedom under no association in any stratum
    double df = 0.0;         // (rows − 1)(columns − 1), over the rows and columns with counts in the strata used
    std::size_t strata_used = 0;
    std::size_t rows = 0, columns = 0;  // rows and columns with counts in the strata used
    // Sentences about what was set aside: strata with fewer than 2 rows or 2 columns with counts, rows
    // and columns without counts in the strata used, blank rows of the range.
    std::vector<std::string> remarks;
};

// GeneralAssociationLimits (the size of the matrix to invert and the work of the sums) are with the
// core's other caps in work_limits.hpp.

// Landis, Heyman & Koch (1978): with the first (r − 1)(c − 1) cells of each stratum h as vectors,
//     Q = (Σ_h (n_h − m_h))ᵀ (Σ_h V_h)⁻¹ (Σ_h (n_h − m_h)),
// m_h = E(n_h) = R_i C_j / N_h, and V_h = N_h² / (N_h − 1) · (diag(p) − p pᵀ) ⊗ (diag(q) − q qᵀ)
// with p = R / N_h and q = C / N_h over those rows and columns: chi-squared with
// (r − 1)(c − 1) degrees of freedom (R 4.2.2's mantelhaen.test for r×c×K arrays).
// Strata with fewer than 2 rows or 2 columns with counts (or a total of 1 or less) add nothing:
// they are set aside and named in `remarks`; so are rows and columns that hold counts only in
// such strata. Errors: no informative stratum; fewer than 2 rows or 2 columns left; strata that
// together cannot compare every row with every column (the summed variance is singular); the limits.
GeneralAssociationResult general_association_test(const LongStrata& strata, const GeneralAssociationLimits& limits = {});
GeneralAssociationResult general_association_test(const CellGrid& range, const GeneralAssociationLimits& limits = {});

}  // namespace assoc
