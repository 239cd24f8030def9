#pragma once
// Times the phases of one run of the command. With the environment variable ASSOC_COMMAND_TIMES
// set (in the office's environment), the command prints them to standard error, one line per
// run: how bench/calc/command_bench.py splits the time of building a sheet.
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <string>
#include <utility>
#include <vector>

namespace assoc::command {

class Stopwatch {
public:
    void lap(const char* phase) {
        const auto now = std::chrono::steady_clock::now();
        laps_.emplace_back(phase, std::chrono::duration<double>(now - last_).count());
        last_ = now;
    }
    void print() const {
        if (std::getenv("ASSOC_COMMAND_TIMES") == nullptr) return;
        std::string line = "assoc-command-times";
        double total = 0;
        for (const auto& [phase, seconds] : laps_) {
            line += " " + phase + "=" + std::to_string(seconds);
            total += seconds;
        }
        std::fprintf(stderr, "%s total=%f\n", line.c_str(), total);
        std::fflush(stderr);
    }

private:
    std::chrono::steady_clock::time_point last_ = std::chrono::steady_clock::now();
    std::vector<std::pair<std::string, double>> laps_;
};

}  // namespace assoc::command
