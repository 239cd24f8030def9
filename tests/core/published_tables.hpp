#pragma once
// Published tables that several core tests check against, each with its source once.
// The counts are as printed (or as read in the named reproduction); the expected values the tests
// compare with come from tests/reference/ and name their own tools.
#include "assoc/cell.hpp"
#include "assoc/count_table.hpp"
#include "test_support.hpp"

namespace assoc::test::published {

// Agresti (2007), An Introduction to Categorical Data Analysis, 2nd ed.: gender × party
// identification (table number from memory; counts read in R's ?chisq.test example,
// "From Agresti(2007) p.39"; published_values.md section 3).
inline CountTable party() {
    return table({{"", "Democrat", "Independent", "Republican"},
                  {"Female", 762, 327, 468},
                  {"Male", 484, 239, 477}});
}

// Physicians' Health Study, Agresti (2007) Table 2.3 (from memory; published_values.md section 10):
// rows placebo, aspirin; columns myocardial infarction yes, no.
inline CountTable aspirin() { return table({{189, 10845}, {104, 10933}}); }

// Bickel, Hammel & O'Connell (1975), Science 187:398–403: Berkeley admissions by department
// (counts as in R's UCBAdmissions; published_values.md section 7). Per stratum: men admitted, men
// rejected, women admitted, women rejected.
inline CellGrid admissions() {
    return grid({{"", "men admitted", "men rejected", "women admitted", "women rejected"},
                 {"A", 512, 313, 89, 19},
                 {"B", 353, 207, 17, 8},
                 {"C", 120, 205, 202, 391},
                 {"D", 138, 279, 131, 244},
                 {"E", 53, 138, 94, 299},
                 {"F", 22, 351, 24, 317}});
}

// The same departments as 2×2 tables stacked one below the other.
inline CellGrid admissions_stacked() {
    return grid({{512, 313}, {89, 19}, {353, 207}, {17, 8}, {120, 205}, {202, 391},
                 {138, 279}, {131, 244}, {53, 138}, {94, 299}, {22, 351}, {24, 317}});
}

// Agresti (2007): infant malformation present / absent (rows) by maternal drinks per day
// (columns), scores 0, 0.5, 1.5, 4, 7 (table number and data from memory; published_values.md section 4).
inline CellGrid alcohol() {
    return grid({{"", "0", "<1", "1-2", "3-5", ">=6"},
                 {"present", 48, 38, 5, 1, 1},
                 {"absent", 17066, 14464, 788, 126, 37}});
}
inline CellGrid alcohol_scores() { return grid({{0, 0.5, 1.5, 4.0, 7.0}}); }

// Approval ratings in two surveys a month apart (R's ?mcnemar.test example, citing Agresti
// (1990) p.350; published_values.md section 5).
inline CellGrid approval() {
    return grid({{"", "approve", "disapprove"}, {"approve", 794, 150}, {"disapprove", 86, 570}});
}

}  // namespace assoc::test::published
