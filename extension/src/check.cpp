#include "check.hpp"

#include <algorithm>

#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/validity.hpp"
#include "assoc/wording.hpp"
#include "function_catalog.hpp"
#include "option_words.hpp"
#include "worksheet_limits.hpp"

namespace assoc::calc {
namespace {

// Calls arrive on varying threads but never at the same time; each trial runs on the caller's thread.
thread_local std::vector<std::string>* collecting = nullptr;

std::string as_sentence(const std::string& text) {
    return !text.empty() && text.back() == '.' ? text : text + ".";
}

bool contains(const std::string& text, const std::string& part) { return text.find(part) != std::string::npos; }

// "ASSOC.EXACT" → "exact": how a name is compared with what the user typed.
std::string short_name(const std::string& display_name) {
    return normalized_word(display_name.substr(display_name.find('.') + 1));
}

std::string joined(const std::vector<std::string>& items) {
    std::string text;
    for (std::size_t i = 0; i < items.size(); ++i)
        text += (i == 0 ? "" : i + 1 == items.size() ? " and " : ", ") + items[i];
    return text;
}

std::string verdict(const CellGrid& range) {
    try {
        return check_validity(read_count_table(range)).summary();
    } catch (const Error& error) {
        return "Cannot use this table: " + as_sentence(error.what());
    }
}

struct Outcome {
    bool ok = true;
    std::string reason;                // the error's message when not ok
    std::vector<std::string> remarks;  // what the function remarked while it ran
};

Outcome run(const FunctionTrial& trial, const CellGrid& range) {
    Outcome outcome;
    RemarkCollector collector;
    try {
        trial.run(range);
    } catch (const Error& error) {
        outcome.ok = false;
        outcome.reason = error.what();
    }
    outcome.remarks = collector.remarks();
    return outcome;
}

// An unknown word: the nearest words and function names (a few), not the whole list.
std::string unknown_word(const std::string& typed) {
    std::vector<std::string> candidates;
    for (const FunctionTrial& trial : function_trials()) {
        const std::string candidate = trial.word == nullptr ? short_name(trial.function) : std::string(trial.word);
        if ((trial.word == nullptr || trial.refusal == nullptr) &&
            std::find(candidates.begin(), candidates.end(), candidate) == candidates.end())
            candidates.push_back(candidate);
    }
    std::string text = quoted_label(typed) + " is not an option word or the name of an ASSOC function";
    const std::vector<std::string> nearest = nearest_words(typed, candidates);
    if (nearest.empty()) return text + "; the words and names are listed in the Function Wizard and in functions.md.";
    return text + "; did you mean " + quoted_list(nearest, "or") + "?";
}

// One function tried on the range: named by the user (run with its defaults) or accepting the word.
struct Candidate {
    const FunctionTrial* trial;
    bool named;
    Outcome outcome;
    bool fits = false;  // the function runs on the range with all its defaults
};

}  // namespace

void remark(const std::string& sentence) {
    if (collecting != nullptr && !sentence.empty()) collecting->push_back(sentence);
}

RemarkCollector::RemarkCollector() : outer_(collecting) { collecting = &remarks_; }

RemarkCollector::~RemarkCollector() { collecting = outer_; }

std::vector<CellGrid> split_columns(const CellGrid& range, std::size_t count, std::size_t optional, const char* function) {
    // A single range given as one row (the labels of ASSOC.LEVELS along a row) is that range, whole.
    if (count == 1 && range.rows() == 1 && range.columns() > 1) {
        std::vector<CellGrid> parts{range};
        parts.resize(1 + optional);
        return parts;
    }
    // Fewer columns are blank ones: the range lost its trailing blank columns when it was read.
    const std::size_t given = std::max(range.columns(), std::min(range.given_columns(), count + optional));
    // A range given with too few columns (a single column for two ranges) is no such blank: it is said.
    require(range.columns() <= count + optional && range.given_columns() >= count,
            std::string("to try ") + function + ", give ASSOC.CHECK its " + std::to_string(count) +
                " ranges side by side as the columns of one range" +
                (optional > 0 ? " (and " + std::string(optional == 1 ? "the optional one" : "the optional ones") +
                                    " after them)"
                              : std::string()) +
                "; this range has " + std::to_string(range.columns()) + (range.columns() == 1 ? " column" : " columns"));
    std::vector<CellGrid> columns(count, CellGrid(range.rows(), 1));
    for (std::size_t c = count; c < count + optional; ++c)
        columns.push_back(c < given ? CellGrid(range.rows(), 1) : CellGrid());
    for (std::size_t c = 0; c < range.columns(); ++c)
        for (std::size_t r = 0; r < range.rows(); ++r) columns[c].at(r, 0) = range.at(r, c);
    // Each column keeps the range's given height, so that a whole column is read as one; an optional
    // column left blank is not given (the order after a blank column of weights).
    for (std::size_t c = 0; c < columns.size(); ++c) {
        CellGrid& column = columns[c];
        if (column.empty()) continue;
        if (c >= count && std::all_of(column.begin(), column.end(), [](const Cell& cell) { return cell.is_blank(); })) {
            column = CellGrid();
            continue;
        }
        column.set_given_shape(range.given_rows(), 1);
    }
    return columns;
}

std::vector<double> numbers_in_range(const CellGrid& range, std::size_t required, std::initializer_list<const char*> names,
                                     const char* function) {
    std::vector<std::string> listed(names.begin(), names.end());
    const std::string how = std::string("to try ") + function + ", give ASSOC.CHECK its numbers (" + joined(listed) +
                            ") in one row or column";
    require(range.rows() == 1 || range.columns() == 1, how + "; this range has " + std::to_string(range.rows()) + " rows and " +
                                                           std::to_string(range.columns()) + " columns");
    std::vector<Cell> cells;
    for (std::size_t r = 0; r < range.rows(); ++r)
        for (std::size_t c = 0; c < range.columns(); ++c) cells.push_back(range.at(r, c));
    while (!cells.empty() && cells.back().is_blank()) cells.pop_back();
    require(cells.size() >= required && cells.size() <= listed.size(),
            how + " (" + std::to_string(required) + (required == listed.size() ? "" : " to " + std::to_string(listed.size())) +
                " numbers); this range has " + std::to_string(cells.size()));
    std::vector<double> numbers;
    for (std::size_t i = 0; i < cells.size(); ++i) {
        require(cells[i].is_number(), how + "; " + listed[i] + " holds " + cells[i].describe());
        numbers.push_back(cells[i].as_number());
    }
    return numbers;
}

std::string check_range(const CellGrid& range, const Cell& function_or_word) {
    // Everything CHECK tries shares its one cap (worksheet_limits.hpp).
    const CellBudget budget(worksheet_check_seconds);
    const ReturnFreedMemory after;
    if (function_or_word.is_blank()) return verdict(range);
    if (!function_or_word.is_text())
        return "The second argument must be an option word or the name of an ASSOC function (for example \"exact\"), not " +
               function_or_word.describe() + ".";
    const std::string word = normalized_word(function_or_word.as_text());
    // Only spaces: blank, as every function reads such an option word (its default).
    if (word.empty()) return verdict(range);
    const std::string name = word.rfind("assoc.", 0) == 0 ? word.substr(6) : word;

    std::vector<Candidate> candidates;
    std::vector<const FunctionTrial*> refusals;
    for (const FunctionTrial& trial : function_trials()) {
        if (trial.word == nullptr) {
            if (short_name(trial.function) == name) candidates.push_back({&trial, true, {}});
        } else if (word == trial.word) {
            if (trial.refusal != nullptr) refusals.push_back(&trial);
            else candidates.push_back({&trial, false, {}});
        }
    }
    if (candidates.empty() && refusals.empty()) return unknown_word(function_or_word.as_text());
    // A function's name ("exact" for ASSOC.EXACT) says what the user means: the option words that
    // other functions spell the same way are then beside the point (refusals still say why a
    // function does not take the word).
    if (std::any_of(candidates.begin(), candidates.end(), [](const Candidate& c) { return c.named; }))
        candidates.erase(std::remove_if(candidates.begin(), candidates.end(), [](const Candidate& c) { return !c.named; }),
                         candidates.end());

    // Each function's run with its defaults, done at most once: it tells whether the range suits it.
    std::vector<std::pair<std::string, Outcome>> defaults;
    const auto with_defaults = [&](const char* function) -> const Outcome& {
        for (const auto& [known, outcome] : defaults)
            if (known == function) return outcome;
        for (const FunctionTrial& trial : function_trials())
            if (trial.word == nullptr && std::string(trial.function) == function) {
                defaults.emplace_back(function, run(trial, range));
                return defaults.back().second;
            }
        throw Error(std::string("no trial of ") + function);  // the generator writes one for every function
    };
    for (Candidate& candidate : candidates) {
        const FunctionTrial& trial = *candidate.trial;
        candidate.fits = with_defaults(trial.function).ok;
        candidate.outcome = trial.same_run_as != nullptr ? with_defaults(trial.same_run_as) : run(trial, range);
    }

    // A failure is worth telling when the user named the function, or when the function can use the
    // range with its defaults (so the word is what fails), or when no function can use the range at all.
    // Otherwise the range is evidently meant for another function that takes the same word.
    const bool any_fits = std::any_of(candidates.begin(), candidates.end(), [](const Candidate& c) { return c.fits; });
    std::vector<const Candidate*> considered;
    for (const Candidate& candidate : candidates)
        if (candidate.named || candidate.fits || !any_fits) considered.push_back(&candidate);

    std::string text;
    const bool independence = std::any_of(considered.begin(), considered.end(),
                                          [](const Candidate* c) { return c->trial->tests_independence; });
    if (independence) text = verdict(range);
    const auto add = [&](const std::string& sentence) { text += (text.empty() ? "" : " ") + sentence; };

    // Failures, one sentence per reason; a reason the verdict already gives is not repeated.
    std::vector<std::pair<std::string, std::vector<const Candidate*>>> failures;
    for (const Candidate* candidate : considered) {
        if (candidate->outcome.ok || contains(text, candidate->outcome.reason)) continue;
        auto same = std::find_if(failures.begin(), failures.end(),
                                 [&](const auto& f) { return f.first == candidate->outcome.reason; });
        if (same == failures.end()) failures.push_back({candidate->outcome.reason, {candidate}});
        else same->second.push_back(candidate);
    }
    for (const auto& [reason, failing] : failures) {
        std::vector<std::string> named, worded;
        for (const Candidate* candidate : failing)
            (candidate->named ? named : worded).push_back(candidate->trial->function);
        std::string who = joined(named);
        if (!worded.empty()) who += (named.empty() ? "" : " and ") + joined(worded) + " with \"" + word + "\"";
        add(who + " cannot be used here: " + as_sentence(reason));
    }
    const bool any_ok = std::any_of(considered.begin(), considered.end(), [](const Candidate* c) { return c->outcome.ok; });
    if (failures.empty() && any_ok) {
        const bool only_named = std::all_of(considered.begin(), considered.end(), [](const Candidate* c) { return c->named; });
        add((only_named ? std::string(considered.front()->trial->function) : "\"" + word + "\"") + " can be used on this " +
            (independence ? "table." : "range."));
    }
    for (const Candidate* candidate : considered)
        for (const std::string& sentence : candidate->outcome.remarks)
            if (!contains(text, sentence)) add(sentence);
    for (const FunctionTrial* refusing : refusals)
        if (candidates.empty() || with_defaults(refusing->function).ok)
            add(std::string(refusing->function) + " does not take \"" + word + "\": " + as_sentence(refusing->refusal));
    return text;
}

}  // namespace assoc::calc
