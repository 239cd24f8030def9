#pragma once
// What the generated part of the add-in (assoc_functions.cpp, from extension/functions.py) tells the
// hand-written part: the names and wizard texts of every function, and the option words that
// ASSOC.CHECK can try on a table.
#include <vector>

#include "assoc/cell.hpp"

namespace assoc::calc {

struct ArgumentInfo {
    const char* name;
    const char* description;
};

struct FunctionInfo {
    const char* method;        // programmatic name (the UNO method)
    const char* display_name;  // ASSOC.SOMETHING
    const char* description;
    std::vector<ArgumentInfo> arguments;
};

// One option word of one function, with a way to run that function on a table with that word
// (its other arguments at their defaults). ASSOC.CHECK uses it to say why a choice fails.
struct OptionTrial {
    const char* word;
    const char* function;  // display name
    void (*run)(const CellGrid& table);
};

const std::vector<FunctionInfo>& function_catalog();
const std::vector<OptionTrial>& option_trials();

}  // namespace assoc::calc
