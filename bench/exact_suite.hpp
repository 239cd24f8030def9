#pragma once
// Reads bench/exact_suite.txt (one table per line: name, rows, columns, counts row by row; lines
// starting with # are comments), for the bench programs of the exact test.
#include <cstddef>
#include <fstream>
#include <sstream>
#include <string>
#include <vector>

#include "assoc/matrix.hpp"

namespace assoc::bench {

struct SuiteTable {
    std::string name;
    Matrix counts;
};

inline std::vector<SuiteTable> read_suite(const char* path) {
    std::ifstream in(path);
    std::vector<SuiteTable> suite;
    std::string line;
    while (std::getline(in, line)) {
        if (line.empty() || line[0] == '#') continue;
        std::istringstream fields(line);
        SuiteTable t;
        std::size_t rows = 0, columns = 0;
        fields >> t.name >> rows >> columns;
        t.counts = Matrix(rows, columns);
        for (std::size_t r = 0; r < rows; ++r)
            for (std::size_t c = 0; c < columns; ++c) fields >> t.counts(r, c);
        suite.push_back(t);
    }
    return suite;
}

}  // namespace assoc::bench
