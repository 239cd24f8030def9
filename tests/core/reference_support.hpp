#pragma once
// Glue between the generated reference values (tests/reference/core_reference_values.hpp)
// and GoogleTest: building the table, naming parameterised tests, printing a parameter.
#include <gtest/gtest.h>

#include <ostream>
#include <string>

#include "assoc/count_table.hpp"
#include "core_reference_values.hpp"
#include "test_support.hpp"

namespace assoc::reference {

// Prints a reference table by name in test output (instead of its bytes).
inline void PrintTo(const ReferenceTable& table, std::ostream* out) { *out << table.name; }

}  // namespace assoc::reference

namespace assoc::test {

inline CountTable table_of(const reference::ReferenceTable& reference) {
    return counts_table(reference.rows, reference.columns, reference.counts);
}

inline std::string reference_table_name(const ::testing::TestParamInfo<reference::ReferenceTable>& info) {
    return info.param.name;
}

}  // namespace assoc::test
