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
// The same for a fixed message, which then costs nothing when the condition holds (checks on the
// path of every cell formula run thousands of times per recalculation). A message composed with
// numbers is better built only on failure: `if (!condition) throw Error(...)`.
inline void require(bool condition, const char* message) {
    if (!condition) throw Error(message);
}

}  // namespace assoc
