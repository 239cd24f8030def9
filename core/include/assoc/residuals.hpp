#pragma once
// Cell residuals: which cells drive the association, and in which direction.
#include "assoc/count_table.hpp"
#include "assoc/matrix.hpp"

namespace assoc {

enum class ResidualKind {
    pearson,       // (O − E) / √E
    adjusted,      // (O − E) / √(E (1 − R/n)(1 − C/n)), standard normal under independence (Haberman 1973)
    raw,           // O − E
    contribution,  // (O − E)² / E, the cell's share of X²
    percent,       // 100 · contribution / X²
};

// Residuals of the kept cells (the shape of table.counts()).
Matrix residuals(const CountTable& table, ResidualKind kind);

}  // namespace assoc
