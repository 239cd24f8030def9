#pragma once
// What the generated part of the add-in (assoc_functions.cpp, from extension/functions.py) tells the
// hand-written part: the names and wizard texts of every function, and the trials with which
// ASSOC.CHECK runs any function on a range; and what the trials need from the hand-written part.
#include <cstddef>
#include <initializer_list>
#include <string>
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

// One way to run one function on ASSOC.CHECK's range: with all its defaults (word is nullptr), or
// with one of its option words (its other arguments at their defaults). ASSOC.CHECK uses them to
// say why a function or a choice fails on a range.
struct FunctionTrial {
    const char* function;     // display name
    const char* word;         // the option word tried; nullptr: the function with its defaults
    bool tests_independence;  // its first argument is a table of counts for the tests of independence
    // The display name of the function whose run with all its defaults this run is (the function
    // itself for no word or the word that omitting gives; ASSOC.EXACT for ASSOC.PVALUE with "exact"),
    // so that ASSOC.CHECK runs it once; nullptr: a run of its own.
    const char* same_run_as;
    const char* refusal;      // a word the function refuses on purpose: why (and run is nullptr)
    void (*run)(const CellGrid& range);
};

// The Function Wizard category of every function (CATEGORY in functions.py).
extern const char* const function_category;
const std::vector<FunctionInfo>& function_catalog();
const std::vector<FunctionTrial>& function_trials();

// For the trials of functions that take several ranges (or a range and an order given as a range):
// the range's columns, one per range argument, then `optional` more when the range has more columns
// (empty grids for those not given: optional ranges, then the list of an option that takes one); an
// error when it has more columns than that. A single range given as one row is taken whole.
std::vector<CellGrid> split_columns(const CellGrid& range, std::size_t count, std::size_t optional, const char* function);
// For the trials of functions that take only numbers: the numbers of a single row or column,
// at least `required` of them and at most one per name.
std::vector<double> numbers_in_range(const CellGrid& range, std::size_t required,
                                     std::initializer_list<const char*> names, const char* function);

// Sentences an adapter has to say about its input besides its result (a correction it applied,
// records it skipped). While a RemarkCollector exists on the thread (ASSOC.CHECK trying a
// function), remark() keeps them; otherwise they are dropped.
void remark(const std::string& sentence);

class RemarkCollector {
public:
    RemarkCollector();
    ~RemarkCollector();
    RemarkCollector(const RemarkCollector&) = delete;
    RemarkCollector& operator=(const RemarkCollector&) = delete;
    const std::vector<std::string>& remarks() const { return remarks_; }

private:
    std::vector<std::string> remarks_;
    std::vector<std::string>* outer_;
};

}  // namespace assoc::calc
