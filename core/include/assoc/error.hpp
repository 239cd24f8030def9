#pragma once
// The one error type that leaves the core. Its message is written for the person
// at the spreadsheet, not for a programmer: it says what is wrong and where.
#include <stdexcept>
#include <string>

namespace assoc {

class Error : public std::runtime_error {
public:
    explicit Error(const std::string& message) : std::runtime_error(message) {}
};

// Throws Error(message) unless condition holds; keeps precondition checks one line each.
inline void require(bool condition, const std::string& message) {
    if (!condition) throw Error(message);
}

}  // namespace assoc
