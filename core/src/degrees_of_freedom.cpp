#include "assoc/error.hpp"
#include "assoc/statistics.hpp"

namespace assoc {

double degrees_of_freedom(const CountTable& table) {
    // A table read with require_two_by_two off may keep fewer than 2 rows or columns: never let
    // rows() − 1 wrap around below zero.
    require(table.rows() >= 1 && table.columns() >= 1, "the table holds no counts");
    return static_cast<double>(table.rows() - 1) * static_cast<double>(table.columns() - 1);
}

}  // namespace assoc
