#include "total_lines.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <cstring>
#include <iterator>
#include <limits>
#include <optional>
#include <string>
#include <string_view>
#include <unordered_map>
#include <utility>
#include <vector>

#include <boost/container/small_vector.hpp>

#include "ascii_case.hpp"
#include "assoc/cell.hpp"
#include "assoc/error.hpp"
#include "assoc/wording.hpp"

namespace assoc::detail {
namespace {

// Lower case (A–Z), without surrounding spaces or a trailing colon.
std::string folded_total_label(std::string_view label) {
    std::string text = folded_label(label);
    while (!text.empty() && (text.back() == ':' || text.back() == '.')) text.pop_back();
    return std::string(trimmed_label(text));
}

const char* const total_words[] = {
    // English
    "total", "totals", "grand total", "sum", "sum total", "subtotal", "sub-total", "sub total", "all", "overall",
    "total count",
    // German
    "summe", "gesamt", "insgesamt", "gesamtsumme", "zwischensumme", "alle",
    // French
    "totaux", "somme", "ensemble", "sous-total", "total général", "total general",
    // Spanish and Portuguese
    "totales", "suma", "total general", "soma", "total geral", "todos",
    // Italian
    "totale", "totali", "somma", "subtotale", "totale generale",
    // Dutch
    "totaal", "som", "subtotaal", "eindtotaal", "alle",
    // Scandinavian
    "totalt", "summa", "i alt", "samlet",
    // Polish
    "razem", "ogółem", "ogolem", "suma całkowita",
    // The sign of a sum (capital sigma, n-ary summation)
    "Σ", "∑",
};

// "Row total", "Department totals", "Office subtotal": a name followed by the word for a total.
const char* const total_endings[] = {" total", " totals", " subtotal", " sub-total"};

const char* const total_beginnings[] = {"total ",  "grand total", "subtotal ", "gesamt",
                                                          "summe ",  "totale ",     "totaal ",   "totalt ",
                                                          "sub-total "};

// Labels that name everyone ("All staff", "Overall figure", "Whole company"): not totals by the label
// alone (a survey answer may read "All of the time"), but a line so labelled that also holds the sum
// of the others is a total.
const char* const whole_group_beginnings[] = {"all ",     "overall ",     "whole ",       "entire ",
                                              "everyone", "everybody",    "company-wide", "company wide"};

// Labels that say how many people or cases a line holds ("N", "Headcount", "Number of staff",
// "Respondents", "Base"), in the languages of total_words: the column of group sizes that a
// workbook puts beside its counts. Like the names of everyone above, not totals by the label alone.
// The words for a number as such ("N", "Count", "Number of …") name no category either, so a line so
// labelled that does not hold the sum is doubted; the words for people ("Staff", "Respondents") may
// name a group, and are not. Not "No" or "Nr": "No" is an answer.
const char* const count_words[] = {
    // English
    "n", "count", "counts", "headcount", "headcounts", "head count", "number", "numbers", "frequency", "freq",
    "base", "size", "sample size",
    // German, French, Spanish, Portuguese, Italian, Dutch, Scandinavian and Polish
    "anzahl", "fallzahl", "effectif", "effectifs", "nombre", "nb", "número", "numero", "cantidad", "quantidade",
    "conteggio", "aantal", "antal", "antall", "liczba",
    // The people considered for a selection, of whom the selected are a part ("Hired | Applicants")
    "applicants", "applications", "candidates", "bewerber", "bewerbungen", "kandidaten", "candidats",
    "candidatures", "candidatos", "candidaturas", "candidati", "sollicitanten", "kandydaci", "sökande",
    "ansøgere",
};

const char* const people_words[] = {
    "employees", "staff", "people", "persons", "respondents", "responses", "cases", "mitarbeiter", "mitarbeitende",
    "personen", "befragte", "basis", "personnes", "répondants", "repondants", "casos", "personas", "plantilla",
    "pessoas", "organico", "personeel", "osoby",
};

const char* const count_beginnings[] = {"number of ", "count of ",  "no. of ", "# of ",     "anzahl ",
                                        "nombre de ", "número de ", "numero de ", "numero di ", "aantal ",
                                        "antal ",     "liczba "};

// Whether `word` is one of `list`.
template <std::size_t N>
bool listed(std::string_view word, const char* const (&list)[N]) {
    return std::any_of(std::begin(list), std::end(list), [&](const char* w) { return word == w; });
}

bool begins_with(const std::string& text, std::string_view start) {
    return text.size() >= start.size() && text.compare(0, start.size(), start) == 0;
}

bool names_a_count_folded(const std::string& text) {
    return listed(text, count_words) ||
           std::any_of(std::begin(count_beginnings), std::end(count_beginnings),
                       [&](const char* b) { return begins_with(text, b); });
}

}  // namespace

bool names_the_whole_group(std::string_view label) {
    const std::string text = folded_total_label(label);
    if (text == "company" || names_a_count_folded(text)) return true;
    return listed(text, people_words) ||
           std::any_of(std::begin(whole_group_beginnings), std::end(whole_group_beginnings),
                       [&](const char* b) { return begins_with(text, b); });
}

bool names_a_count(std::string_view label) { return names_a_count_folded(folded_total_label(label)); }

namespace {

// A view of the body's rows, or of its columns, as lines of numbers.
struct Lines {
    const Matrix& body;
    bool rows;
    std::size_t count() const { return rows ? body.rows() : body.columns(); }
    std::size_t length() const { return rows ? body.columns() : body.rows(); }
    double at(std::size_t line, std::size_t k) const { return rows ? body(line, k) : body(k, line); }
    bool empty(std::size_t line) const {
        for (std::size_t k = 0; k < length(); ++k)
            if (at(line, k) != 0) return false;
        return true;
    }
};

// Relative only: counts of any size (1e-300 as well as 1e300) are compared to their own digits.

// Whether `line` holds the sum of `others` (leaving out `except`) at every position not excluded
// by `skip`.
template <class Indices>
bool holds_sum(const Lines& lines, std::size_t line, const Indices& others, const std::vector<char>& skip,
               std::size_t except = static_cast<std::size_t>(-1)) {
    for (std::size_t k = 0; k < lines.length(); ++k) {
        if (skip[k]) continue;
        double sum = 0;
        for (std::size_t other : others)
            if (other != except) sum += lines.at(other, k);
        if (!same_amount(lines.at(line, k), sum)) return false;
    }
    return true;
}

std::string line_name(const BodySide& side, std::size_t line) {
    const std::string& label = (*side.labels)[line];
    if (!label.empty()) return "the " + std::string(side.word) + " " + quoted_label(label);
    return std::string(side.word) + " " + std::to_string(side.first_number + line);
}


// Buffers that the searches of both sides reuse: every table read runs them, thousands of times in a
// sheet of small tables, where allocations cost more than the sums (a table of up to 16 lines a side
// needs none).
struct Workspace {
    boost::container::small_vector<std::size_t, 16> lines;
    boost::container::small_vector<double, 16> sums;
};

// Looks for total lines on one side: `total` gets the labelled ones and `skip` holds the labelled
// totals of the other side, whose positions take no part in the sums.
void find_on_side(const Lines& lines, const BodySide& side, std::vector<char>& total, const std::vector<char>& skip,
                  std::vector<std::string>& doubts, Workspace& workspace) {
    auto& data = workspace.lines;
    data.clear();
    for (std::size_t i = 0; i < lines.count(); ++i)
        if (!total[i]) data.push_back(i);

    // Labelled totals: the sum of the other lines, or of the lines since the previous total (a subtotal).
    std::size_t block_start = 0;
    for (std::size_t i = 0; i < lines.count(); ++i) {
        if (!total[i]) continue;
        std::vector<std::size_t> block;
        for (std::size_t j = block_start; j < i; ++j)
            if (!total[j]) block.push_back(j);
        std::vector<std::size_t> after;
        for (std::size_t j = i + 1; j < lines.count() && !total[j]; ++j) after.push_back(j);
        block_start = i + 1;
        if (holds_sum(lines, i, data, skip) || (!block.empty() && holds_sum(lines, i, block, skip)) ||
            (!after.empty() && holds_sum(lines, i, after, skip)))
            continue;
        doubts.push_back(capitalised(line_name(side, i)) + " was set aside as a total, but it does not hold the sum of the "
                         "other " + side.word + "s; check that it is a total and that no " + side.word + " is missing.");
    }

    // A first or last line that holds the sum of the others.
    if (data.size() < 3) return;
    // The other lines are `data` but the candidate, walked in place: this runs for every table read,
    // thousands of times in a sheet of small tables.
    for (std::size_t candidate : {data.back(), data.front()}) {
        // The sum first: it fails at once in almost every table, and the rest needs whole passes.
        if (lines.empty(candidate) || !holds_sum(lines, candidate, data, skip, candidate)) continue;
        std::size_t non_empty = 0;
        for (std::size_t i : data)
            if (i != candidate && !lines.empty(i)) ++non_empty;
        // A sum that holds at a single position (a table of one row or column) is easily a coincidence:
        // there it takes 3 other lines to tell a total.
        std::size_t positions = 0;
        for (std::size_t k = 0; k < lines.length(); ++k) {
            double sum = 0;
            for (std::size_t other : data)
                if (other != candidate) sum += lines.at(other, k);
            if (!skip[k] && sum != 0) ++positions;
        }
        if (non_empty < (positions >= 2 ? 2u : 3u)) continue;
        const std::string& label = (*side.labels)[candidate];
        if (label.empty()) {
            std::vector<std::size_t> numbers;
            for (std::size_t i : data)
                if (i != candidate) numbers.push_back(side.first_number + i);
            throw Error(line_name(side, candidate) + " holds the sum of " + numbered_lines(side.word, numbers) +
                        " in every " + side.other_word + ", so it looks like a total, and a total must not be tested "
                        "as if it held more counts; leave it out of the range, or label it \"Total\" (it is then set "
                        "aside). If it does hold counts, give the " + side.word + "s labels");
        }
        if (names_the_whole_group(label)) {
            total[candidate] = true;  // said with the other totals set aside
            return;
        }
        doubts.push_back(capitalised(line_name(side, candidate)) + " holds the sum of the other " + side.word +
                         "s in every " + side.other_word + ": if it is a total, leave it out of the range or label "
                         "it \"Total\"; it was tested as counts.");
        return;
    }
}

// Subtotals inside the table: a line that holds, in every position, the sum of the lines just above
// it (at least 2 with counts, since the start or the previous total), as a workbook's subtotal under
// each group does. The first and last lines' sums of all the others are found by find_on_side.
// Without a label it is refused; with a label that is not a total word it is doubted. Each line's
// search stops when the running sum passes the line's value, and after 100 lines.
void find_subtotals(const Lines& lines, const BodySide& side, const std::vector<char>& total, const std::vector<char>& skip,
                    std::vector<std::string>& doubts, Workspace& workspace) {
    constexpr std::size_t longest_block = 100;
    std::size_t data_lines = 0;
    for (std::size_t i = 0; i < lines.count(); ++i)
        if (!total[i] && !lines.empty(i)) ++data_lines;
    if (lines.count() < 3) return;
    auto& sum = workspace.sums;
    sum.resize(lines.length());
    auto& block = workspace.lines;
    for (std::size_t i = 2; i < lines.count(); ++i) {
        if (total[i] || lines.empty(i)) continue;
        std::fill(sum.begin(), sum.end(), 0.0);
        block.clear();
        for (std::size_t j = i; j-- > 0 && !total[j] && i - j <= longest_block;) {
            if (lines.empty(j)) continue;
            bool equal = true, within = true;
            for (std::size_t k = 0; k < lines.length(); ++k) {
                if (skip[k]) continue;
                sum[k] += lines.at(j, k);
                equal = equal && same_amount(sum[k], lines.at(i, k));
                within = within && sum[k] <= lines.at(i, k) + 1e-9 * std::max(1.0, lines.at(i, k));
            }
            block.push_back(j);
            if (!within) break;
            if (!equal || block.size() < 2) continue;
            // The sum of every other line is the grand total that find_on_side speaks of.
            if (block.size() + 1 == data_lines) break;
            std::size_t positions = 0;
            for (std::size_t k = 0; k < lines.length(); ++k)
                if (!skip[k] && sum[k] != 0) ++positions;
            const std::string& label = (*side.labels)[i];
            if (positions < (side.labelled ? 2u : 3u)) break;
            std::vector<std::size_t> numbers;
            for (auto it = block.rbegin(); it != block.rend(); ++it) numbers.push_back(side.first_number + *it);
            if (label.empty())
                throw Error(line_name(side, i) + " holds the sum of " + numbered_lines(side.word, numbers) + " above it in "
                            "every " + side.other_word + ", so it looks like a subtotal, and a subtotal must not be "
                            "tested as if it held more counts; label it \"Subtotal\" (it is then set aside) or delete it. "
                            "If it does hold counts, give the " + side.word + "s labels");
            doubts.push_back(capitalised(line_name(side, i)) + " holds the sum of " + numbered_lines(side.word, numbers) +
                             " above it in every " + side.other_word + ": if it is a subtotal, label it \"Subtotal\" (it "
                             "is then set aside); it was tested as counts.");
            break;
        }
    }
}

bool is_word_letter(char c) { return (c >= 'a' && c <= 'z') || static_cast<unsigned char>(c) >= 0x80; }

// The words of a folded label: runs of letters (any byte of a multi-byte character counts as one),
// "%" where it follows no digit ("0–2%" names a band) and "$" on their own.
std::vector<std::string_view> label_words(const std::string& text) {
    std::vector<std::string_view> words;
    for (std::size_t k = 0; k < text.size();) {
        const char c = text[k];
        if (c == '%' || c == '$') {
            std::size_t before = k;
            while (before > 0 && text[before - 1] == ' ') --before;
            if (c == '$' || before == 0 || !(text[before - 1] >= '0' && text[before - 1] <= '9'))
                words.emplace_back(text.data() + k, 1);
            ++k;
            continue;
        }
        if (!is_word_letter(c)) {
            ++k;
            continue;
        }
        std::size_t end = k;
        while (end < text.size() && is_word_letter(text[end])) ++end;
        words.emplace_back(text.data() + k, end - k);
        k = end;
    }
    return words;
}

// Lines that are no counts by their label: a percentage, an average or a rate ("% promoted", "Average",
// "Promotion rate") holding a number that is not whole. Refused: such a line cannot be set aside as a
// total can, since the author may have meant something else by it.
bool names_a_summary(std::string_view label) {
    static const char* const words[] = {"%", "percent", "percentage", "pct", "average", "avg", "mean", "median",
                                        "rate", "ratio", "share", "proportion", "prozent", "anteil", "durchschnitt",
                                        "mittelwert", "pourcentage", "moyenne", "porcentaje", "promedio",
                                        "percentuale", "procent", "gemiddelde"};
    const std::string text = folded_label(label);
    if (text.find('%') != std::string::npos) return true;
    const std::vector<std::string_view> found = label_words(text);
    return std::any_of(found.begin(), found.end(), [&](std::string_view word) { return listed(word, words); });
}

void refuse_summaries(const Lines& lines, const BodySide& side, const std::vector<char>& total) {
    if (!side.labelled) return;
    for (std::size_t i = 0; i < lines.count(); ++i) {
        if (total[i]) continue;
        const std::string& label = (*side.labels)[i];
        // Percentages, whole or not, when every number of the line could be one.
        if (names_percentages(label)) {
            bool within = true, any = false;
            for (std::size_t k = 0; k < lines.length(); ++k) {
                within = within && lines.at(i, k) >= 0 && lines.at(i, k) <= 100;
                any = any || lines.at(i, k) != 0;
            }
            if (within && any)
                throw Error(line_name(side, i) + " is labelled as percentages and holds numbers from 0 to 100, so it "
                            "holds no counts; leave it out of the range, or enter the counts (the tests need the "
                            "number of people or items in each cell)");
        }
        if (!names_a_summary(label)) continue;
        for (std::size_t k = 0; k < lines.length(); ++k) {
            const double value = lines.at(i, k);
            if (value == std::floor(value)) continue;
            throw Error(line_name(side, i) + " holds " + Cell::number(value).describe() + ", not a whole number, under a "
                        "label that names a percentage, an average or a rate, so it holds no counts; leave it out of "
                        "the range (the tests need the number of people or items in each cell)");
        }
    }
}

// A line labelled as a number ("N", "Count", "Number of staff") that is kept as counts: it holds no
// sum of the others (or it would have been set aside as a total), so it is most likely the groups'
// sizes with some people left out of the other lines (those who did not answer), and no group.
void doubt_count_labels(const BodySide& side, const std::vector<char>& total, std::vector<std::string>& doubts) {
    if (!side.labelled) return;
    for (std::size_t i = 0; i < side.labels->size(); ++i) {
        if (total[i] || !names_a_count((*side.labels)[i])) continue;
        doubts.push_back(capitalised(line_name(side, i)) + " is labelled as a number of people or cases, but it does "
                         "not hold the sum of the other " + side.word + "s, so it was tested as a group of its own; if "
                         "it gives the groups' sizes, leave it out of the range.");
    }
}

// Labels that say a line holds something other than counts of people or items, though its numbers
// are whole (a line of numbers that are not whole is refused by refuse_summaries): an average or a
// rate rounded to whole numbers, a target or an expected number beside the observed ones, a
// difference, a running count, or an amount of money or time ("Salary (EUR)", "Hours overtime").
// Each makes the table "Doubtful"; none is set aside, since the author may mean a group by it.
enum class NotCounts { summary, reference, difference, cumulative, amount, measure };

// The words, lower case, as whole words of a label. A summary or a running count may be named
// anywhere in the label ("Promotion rate"); a target only by its first word ("Expected", "Target
// headcount"), since "On target" and "Met target" name outcomes; a difference only by a label made
// of nothing else ("Change", "Net change vs last year"), since "Change management" is a team.
// An average or a median lies within the other lines; see doubt_not_counts.
const char* const middle_words[] = {"average", "avg", "mean", "median", "durchschnitt", "mittelwert", "moyenne",
                                    "promedio", "gemiddelde"};
const char* const summary_words[] = {"rate", "ratio", "share", "proportion", "taux", "tasa"};
const char* const reference_words[] = {
    "target", "targets", "plan", "planned", "expected", "expectation", "forecast", "forecasted", "projected",
    "projection", "quota", "goal", "benchmark", "budget", "budgeted", "soll", "ziel", "erwartet", "prognose",
    "objectif", "prévu", "prevu", "attendu", "prévision", "prevision", "objetivo", "previsto", "esperado",
    "previsión", "doel", "verwacht", "begroting"};
const char* const difference_words[] = {"difference", "change", "variance", "gap", "diff",
                                        "differenz", "abweichung", "veränderung", "écart", "ecart", "variation",
                                        "diferencia", "variación", "variacion", "verschil"};
// Words that may stand beside a difference in its label ("Change vs last year", "Net change").
const char* const difference_fillers[] = {"vs", "versus", "from", "since", "on", "over", "to", "last", "previous",
                                          "prior", "year", "years", "month", "quarter", "week", "yoy", "absolute",
                                          "net", "in", "the", "of", "zu", "gegenüber", "vorjahr", "sur", "par",
                                          "rapport", "an", "sobre", "anterior", "tov"};
const char* const cumulative_words[] = {"cumulative", "cumul", "cumulé", "cumule", "kumuliert",
                                        "kumulativ", "acumulado", "cumulatief"};
// Money and time. A label with a digit names a band ("Under 30 hours", "€20,000–29,999"), and one
// with a word of the second list a category ("Salary band A", "Flexible hours", "Within cost"):
// neither is an amount. Not "pay" or "payment", which name outcomes as often ("Late payment").
const char* const amount_words[] = {"amount", "amounts", "salary", "salaries", "wage", "wages", "earnings",
                                    "revenue", "revenues", "cost", "costs", "spend", "spending", "hours", "hrs",
                                    "eur", "usd", "gbp", "chf", "€", "$", "£", "¥", "betrag",
                                    "gehalt", "lohn", "kosten", "umsatz", "stunden", "montant", "salaire",
                                    "salaires", "heures", "importe", "salario", "horas", "bedrag", "salaris",
                                    "uren"};
// A measure of each group typed beside its counts ("Age", "Score", "Index", "Std dev"), as the whole
// label: with more words it may name a category ("Less than a year", "Retirement age").
const char* const measure_labels[] = {"age", "average age", "index", "score", "rating", "rank", "ranking",
                                      "fte", "odds", "sd", "std", "std dev", "stdev", "standard deviation",
                                      "minimum", "maximum", "year", "tenure", "years of service", "length of service",
                                      "alter", "âge", "edad", "età", "leeftijd"};
const char* const category_words[] = {"band", "bands", "grade", "grades", "range", "group", "level", "scale",
                                      "class", "bracket", "centre", "center", "code", "type", "rise", "raise",
                                      "increase", "cut", "freeze", "review", "category", "tier", "gap", "flexible",
                                      "fixed", "office", "within", "over", "under", "above", "below", "no",
                                      "without", "with", "part", "full"};

struct NotCountsLabel {
    NotCounts kind;
    std::string word;  // the word that says so, for the search of labels that share it
    bool middle = false;  // an average or a median
    bool rate = false;    // a rate, a ratio or a share
};

// What a label says its line holds instead of counts, if anything.
std::optional<NotCountsLabel> names_no_counts(std::string_view label) {
    const std::string text = folded_label(label);
    const std::vector<std::string_view> words = label_words(text);
    if (words.empty()) return std::nullopt;
    if (listed(words.front(), reference_words)) return NotCountsLabel{NotCounts::reference, std::string(words.front())};
    const auto difference = std::find_if(words.begin(), words.end(), [](std::string_view w) { return listed(w, difference_words); });
    if (difference != words.end() && std::all_of(words.begin(), words.end(), [](std::string_view w) {
            return listed(w, difference_words) || listed(w, difference_fillers);
        }))
        return NotCountsLabel{NotCounts::difference, std::string(*difference)};
    for (std::string_view word : words) {
        if (listed(word, middle_words)) return NotCountsLabel{NotCounts::summary, std::string(word), true};
        if (word == "%" || listed(word, summary_words))
            return NotCountsLabel{NotCounts::summary, std::string(word), false, true};
        if (listed(word, cumulative_words)) return NotCountsLabel{NotCounts::cumulative, std::string(word)};
    }
    const bool digit = std::any_of(text.begin(), text.end(), [](char c) { return c >= '0' && c <= '9'; });
    if (digit || std::any_of(words.begin(), words.end(), [](std::string_view w) { return listed(w, category_words); }))
        return std::nullopt;
    for (std::string_view word : words)
        if (listed(word, amount_words)) return NotCountsLabel{NotCounts::amount, std::string(word)};
    std::string joined;
    for (std::string_view word : words) joined += (joined.empty() ? "" : " ") + std::string(word);
    if (listed(joined, measure_labels)) return NotCountsLabel{NotCounts::measure, joined};
    return std::nullopt;
}

// Whether `line` is the first or the last of its side (totals left out) and lies within the others,
// as an average or a median of them does, at every position.
bool lies_within_at_an_end(const Lines& lines, std::size_t line, const std::vector<char>& total) {
    std::size_t first = lines.count(), last = 0;
    for (std::size_t i = 0; i < lines.count(); ++i)
        if (!total[i]) {
            first = std::min(first, i);
            last = i;
        }
    if (line != first && line != last) return false;
    for (std::size_t k = 0; k < lines.length(); ++k) {
        double low = std::numeric_limits<double>::infinity(), high = -low;
        for (std::size_t i = 0; i < lines.count(); ++i) {
            if (i == line || total[i]) continue;
            low = std::min(low, lines.at(i, k));
            high = std::max(high, lines.at(i, k));
        }
        // Rounded to whole numbers, an average may lie half a unit outside.
        if (lines.at(line, k) < low - 0.5 || lines.at(line, k) > high + 0.5) return false;
    }
    return true;
}

// Whether `line` holds, at every position, the percentage that another line makes of all the lines
// (totals and `line` left out), rounded to a whole number: a rate worked out beside its counts.
bool holds_a_percentage_of_another(const Lines& lines, std::size_t line, const std::vector<char>& total) {
    std::vector<double> sums(lines.length(), 0.0);
    for (std::size_t k = 0; k < lines.length(); ++k)
        for (std::size_t i = 0; i < lines.count(); ++i)
            if (i != line && !total[i]) sums[k] += lines.at(i, k);
    for (std::size_t j = 0; j < lines.count(); ++j) {
        if (j == line || total[j]) continue;
        bool all = true, any = false;
        for (std::size_t k = 0; k < lines.length() && all; ++k) {
            if (sums[k] <= 0) continue;
            any = true;
            all = std::abs(lines.at(line, k) - 100 * lines.at(j, k) / sums[k]) <= 0.5 + 1e-9;
        }
        if (all && any) return true;
    }
    return false;
}

// Lines whose label says they hold no counts (names_no_counts), one sentence for each kind. A label
// whose word another label of the same side shares is one of a scale of outcomes ("Below average",
// "Average", "Above average"; "Target met", "Target missed"), and is not doubted; amounts are, even
// when every line names one ("Hours overtime", "Hours normal"). An average or a median is doubted
// only as the first or last line and within the others: "Poor", "Average", "Good" is a scale. A rate
// only when it is the percentage of another line: "Flat rate" may be a kind of pay rise.
void doubt_not_counts(const Lines& values, const BodySide& side, const std::vector<char>& total,
                      std::vector<std::string>& doubts) {
    if (!side.labelled) return;
    const std::vector<std::string>& labels = *side.labels;
    std::vector<std::pair<std::size_t, NotCountsLabel>> named;
    for (std::size_t i = 0; i < labels.size(); ++i)
        if (!total[i] && !labels[i].empty())
            if (auto found = names_no_counts(labels[i]))
                if ((!found->middle || lies_within_at_an_end(values, i, total)) &&
                    (!found->rate || holds_a_percentage_of_another(values, i, total)))
                    named.emplace_back(i, std::move(*found));
    if (named.empty()) return;
    // How many labels hold each of the words found: one pass over the labels.
    std::unordered_map<std::string, std::size_t> holders;
    for (const auto& [line, found] : named)
        if (found.kind != NotCounts::amount) holders.emplace(found.word, 0);
    if (!holders.empty()) {
        for (std::size_t i = 0; i < labels.size(); ++i) {
            if (total[i] || labels[i].empty()) continue;
            const std::string text = folded_label(labels[i]);
            std::vector<std::string_view> words = label_words(text);
            std::sort(words.begin(), words.end());
            words.erase(std::unique(words.begin(), words.end()), words.end());
            for (std::string_view word : words)
                if (auto holder = holders.find(std::string(word)); holder != holders.end()) ++holder->second;
        }
    }
    static const char* const singular[] = {"an average, a rate or a share", "a target, a plan or an expected number",
                                           "a difference or a change", "a running count",
                                           "an amount of money or time",
                                           "a measure of each group (an age, a score, an index, a spread)"};
    static const char* const plural[] = {"averages, rates or shares", "targets, plans or expected numbers",
                                         "differences or changes", "running counts", "amounts of money or time",
                                         "measures of each group (ages, scores, indexes, spreads)"};
    for (NotCounts kind : {NotCounts::summary, NotCounts::reference, NotCounts::difference, NotCounts::cumulative,
                           NotCounts::amount, NotCounts::measure}) {
        std::vector<std::size_t> lines;
        for (const auto& [line, found] : named)
            if (found.kind == kind && (kind == NotCounts::amount || holders[found.word] < 2)) lines.push_back(line);
        if (lines.empty()) continue;
        const auto k = static_cast<std::size_t>(kind);
        const bool one = lines.size() == 1;
        std::vector<std::size_t> numbers;
        for (std::size_t line : lines) numbers.push_back(side.first_number + line);
        const std::string subject = one ? line_name(side, lines.front()) : numbered_lines(side.word, numbers);
        std::string text = capitalised(subject) + (one ? " is labelled as " : " are labelled as ") +
                           (one ? singular[k] : plural[k]) + ", not as a number of people or items, and " +
                           (one ? "was" : "were") + " tested as counts; ";
        if (kind == NotCounts::amount)
            text += "the tests need the number of people or items in each cell, and on amounts their p-value means "
                    "nothing.";
        else if (kind == NotCounts::measure)
            text += std::string("the tests need the number of people or items in each cell; leave ") +
                    (one ? "it" : "them") + " out of the range.";
        else
            text += std::string("if ") + (one ? "it is" : "they are") + " no group of " + (one ? "its" : "their") +
                    " own, leave " + (one ? "it" : "them") + " out of the range.";
        doubts.push_back(std::move(text));
    }
}

// A line that is a part of the line before it ("of which managers" under "Sales", as reports break a
// figure down): its people are counted in both. The phrases, lower case, as the label's beginning
// (after a dash or a bullet), followed by a space, a colon or nothing.
const char* const part_beginnings[] = {"of which", "of whom", "thereof", "whereof", "including", "incl.", "incl",
                                       "davon", "darunter", "hiervon", "dont", "parmi lesquels", "parmi eux",
                                       "de los cuales", "de las cuales", "di cui", "waarvan", "varav", "heraf",
                                       "w tym"};

bool names_a_part(std::string_view label) {
    std::string text = folded_label(label);
    std::size_t start = 0;
    while (start < text.size() && (text[start] == '-' || text[start] == '*' || text[start] == '>' || text[start] == ' '))
        ++start;
    for (const char* bullet : {"–", "—", "•", "·"})
        if (text.compare(start, std::strlen(bullet), bullet) == 0) start += std::strlen(bullet);
    while (start < text.size() && text[start] == ' ') ++start;
    const std::string_view rest(text.data() + start, text.size() - start);
    for (const char* beginning : part_beginnings) {
        const std::string_view phrase(beginning);
        if (rest.size() < phrase.size() || rest.compare(0, phrase.size(), phrase) != 0) continue;
        if (rest.size() == phrase.size() || rest[phrase.size()] == ' ' || rest[phrase.size()] == ':' ||
            phrase.back() == '.')
            return true;
    }
    return false;
}

// Refuses a part line whose every count is no larger than the line it follows (the nearest line
// before it that is neither a total nor a part); doubts one that is larger somewhere or follows none.
void refuse_parts(const Lines& lines, const BodySide& side, const std::vector<char>& total,
                  std::vector<std::string>& doubts) {
    if (!side.labelled) return;
    const std::vector<std::string>& labels = *side.labels;
    std::size_t parent = lines.count();  // none yet
    for (std::size_t i = 0; i < lines.count(); ++i) {
        if (total[i]) continue;
        if (!names_a_part(labels[i])) {
            parent = i;
            continue;
        }
        bool within = parent < lines.count();
        for (std::size_t k = 0; k < lines.length() && within; ++k) within = lines.at(i, k) <= lines.at(parent, k);
        if (within)
            throw Error(line_name(side, i) + " reads as a part of what the " + side.word + "s before it count (its "
                        "label says so, and none of its counts is larger than in " + line_name(side, parent) +
                        "), so its people would be counted twice; leave it out of the range, or subtract it from the " +
                        side.word + " it is a part of to make two groups");
        doubts.push_back(capitalised(line_name(side, i)) + " is labelled as a part of another " + side.word +
                         ", and was tested as a group of its own; if its people are counted in another " + side.word +
                         " too, leave it out of the range.");
    }
}

// Whether a label names the whole group: as a total, a number of people, the people considered or
// everyone of a unit ("Total", "N", "Applicants", "All staff", "Whole company", "Everyone"), which no
// category of people is called. Not the words for people alone ("Staff", "Employees"), which also
// name groups ("Managers | Staff"), nor "All …" followed by other words ("All of the time" answers).
bool names_everyone(std::string_view label) {
    static const char* const units[] = {"company", "firm",    "organisation", "organization", "departments",
                                        "teams",   "groups",  "branches",     "offices",      "sites",
                                        "regions", "units",   "divisions",    "locations",    "stores"};
    if (label.empty()) return false;
    if (is_total_label(label)) return true;
    const std::string text = folded_total_label(label);
    if (text == "company" || text == "everyone" || text == "everybody" || names_a_count_folded(text)) return true;
    for (const char* beginning : {"all ", "overall ", "whole ", "entire "}) {
        if (!begins_with(text, beginning)) continue;
        const std::string rest = text.substr(std::strlen(beginning));
        return listed(rest, people_words) || listed(rest, units) || names_a_count_folded(rest);
    }
    return false;
}

// A side of exactly two lines with counts, one of which names the whole group (names_everyone) and
// holds at least as many as the other at every position (more at one at least): "Promoted | Total"
// or "Hired | Applicants", as a sheet of rates is typed. Each person of the part is in the whole
// too, so the test would compare the part with the whole instead of with the rest: refused.
// Positions of the other side's labelled totals (`skip`) take no part; neither does a pair whose
// lines both name the whole.
void refuse_part_beside_whole(const Lines& lines, const BodySide& side, const std::vector<char>& skip) {
    if (!side.labelled) return;
    std::size_t with_counts[2], found = 0;
    for (std::size_t i = 0; i < lines.count(); ++i) {
        if (lines.empty(i)) continue;
        if (found == 2) return;
        with_counts[found++] = i;
    }
    if (found != 2) return;
    const bool everyone[2] = {names_everyone((*side.labels)[with_counts[0]]),
                              names_everyone((*side.labels)[with_counts[1]])};
    if (everyone[0] == everyone[1]) return;
    const std::size_t whole = with_counts[everyone[0] ? 0 : 1], part = with_counts[everyone[0] ? 1 : 0];
    bool larger = false;
    for (std::size_t k = 0; k < lines.length(); ++k) {
        if (skip[k]) continue;
        if (lines.at(part, k) > lines.at(whole, k)) return;
        larger = larger || lines.at(part, k) < lines.at(whole, k);
    }
    if (!larger) return;
    throw Error(line_name(side, whole) + " names the whole group and holds at least as many as " + line_name(side, part) +
                " in every " + side.other_word + ", so it reads as everyone, of whom " + line_name(side, part) +
                " is a part: its people would be counted twice, and the test would compare a part with the whole "
                "instead of with the rest; replace it with the rest, its counts minus those of " +
                line_name(side, part) + " (a table of counts holds each person once)");
}

// Lines labelled as a missing value ("n/a", "(empty)"): people without an answer, tested as a group.
// An empty line so labelled (a spacer "-") is set aside with the other empty lines.
void doubt_missing_labels(const Lines& lines, const BodySide& side, const std::vector<char>& total,
                          std::vector<std::string>& doubts) {
    if (!side.labelled) return;
    for (std::size_t i = 0; i < side.labels->size(); ++i) {
        if (total[i] || !names_a_missing_value((*side.labels)[i]) || lines.empty(i)) continue;
        doubts.push_back(capitalised(line_name(side, i)) + " is labelled as a missing value and was tested as a group "
                         "of its own; if it holds people or items without an answer, leave it out of the range; if "
                         "it is an answer (\"Not applicable\"), write it in words.");
    }
}

// A line without a label among labelled ones (a row numbering the columns under the header, a note's
// figures): the lines' labels name their groups, so one without is doubted, not taken for a group.
void doubt_unlabelled_lines(const Lines& lines, const BodySide& side, const std::vector<char>& total,
                            std::vector<std::string>& doubts) {
    if (!side.labelled) return;
    std::vector<std::size_t> numbers;
    std::size_t labelled = 0;
    for (std::size_t i = 0; i < lines.count(); ++i) {
        if (total[i] || lines.empty(i)) continue;
        if ((*side.labels)[i].empty())
            numbers.push_back(side.first_number + i);
        else
            ++labelled;
    }
    if (numbers.empty() || labelled < 2) return;
    const bool one = numbers.size() == 1;
    doubts.push_back(capitalised(numbered_lines(side.word, numbers)) + (one ? " has" : " have") + " no label, unlike the "
                     "other " + side.word + "s, and " + (one ? "was" : "were") + " tested as " +
                     (one ? "a group" : "groups") + "; if " + (one ? "it numbers" : "they number") + " the " +
                     side.other_word + "s or " + (one ? "holds" : "hold") + " something other than counts, leave " +
                     (one ? "it" : "them") + " out of the range, and if " + (one ? "it is a group" : "they are groups") +
                     ", label " + (one ? "it" : "them") + ".");
}

// Two lines with the same label: a line copied twice, or one group split in two by mistake.
void doubt_repeated_labels(const BodySide& side, const std::vector<char>& total, std::vector<std::string>& doubts) {
    if (!side.labelled) return;
    const std::vector<std::string>& labels = *side.labels;
    // Each label's lines in one pass (a table may have thousands of lines), said in order of first use.
    std::unordered_map<std::string_view, std::vector<std::size_t>> lines_of;
    std::vector<std::string_view> order;
    for (std::size_t i = 0; i < labels.size(); ++i) {
        if (labels[i].empty() || total[i]) continue;
        std::vector<std::size_t>& lines = lines_of[labels[i]];
        if (lines.empty()) order.push_back(labels[i]);
        lines.push_back(side.first_number + i);
    }
    for (std::string_view label : order) {
        const std::vector<std::size_t>& numbers = lines_of[label];
        if (numbers.size() < 2) continue;
        doubts.push_back(capitalised(numbered_lines(side.word, numbers)) + " have the same label, " +
                         quoted_label(label) + ", and were tested as different " + side.word +
                         "s; if they are one group, add their counts together.");
    }
}

}  // namespace

std::string text_among_counts_reason(const Cell& cell) {
    const std::string_view text = cell.is_text() ? trimmed_label(cell.as_text()) : std::string_view();
    if (text == "-" || text == "–" || text == "—")
        return ", which a report may use for zero; counts must be numbers: leave the cell blank (read as 0) or "
               "enter 0";
    if (is_number_as_text(cell))
        return ", a number stored as text (as imported or pasted data often is); counts must be numbers: enter it "
               "again as a number, or convert those cells to numbers";
    return "; counts must be numbers";
}

bool is_number_as_text(const Cell& cell) {
    const std::string_view text = cell.is_text() ? trimmed_label(cell.as_text()) : std::string_view();
    std::size_t digits = 0, other = 0;
    for (std::size_t k = 0; k < text.size(); ++k) {
        const char c = text[k];
        if (c >= '0' && c <= '9')
            ++digits;
        else if (!(c == ',' || c == '.' || c == '\'' || c == ' ' || (k == 0 && (c == '+' || c == '-')) ||
                   (k + 1 == text.size() && c == '%')))
            ++other;
    }
    return digits > 0 && other == 0;
}

bool names_percentages(std::string_view label) {
    static const char* const words[] = {"%",           "percent",   "percentage", "pct",    "prozent",
                                        "pourcentage", "porcentaje", "percentuale", "procent"};
    const std::string text = folded_label(label);
    const std::vector<std::string_view> found = label_words(text);
    return std::any_of(found.begin(), found.end(), [&](std::string_view word) { return listed(word, words); });
}

bool names_a_missing_value(std::string_view label) {
    static const char* const markers[] = {"n/a", "na", "n.a.", "n.a", "#n/a", "-", "--", "–", "—", "?", "??",
                                          "null", "nil", "nan", "missing", "(missing)", "(empty)", "(blank)",
                                          "empty", "blank", "(leer)", "leer", "(vide)", "vide", "(vacío)",
                                          "(vacio)", "(vuoto)", "(leeg)"};
    const std::string text = folded_label(label);
    return listed(text, markers);
}

bool is_total_label(std::string_view label) {
    const std::string text = folded_total_label(label);
    if (text.empty()) return false;
    for (const char* word : total_words)
        if (text == word) return true;
    for (const char* ending : total_endings) {
        const std::string_view end(ending);
        if (text.size() > end.size() && text.compare(text.size() - end.size(), end.size(), end) == 0) return true;
    }
    for (const char* beginning : total_beginnings) {
        const std::string_view start(beginning);
        if (text.size() > start.size() && text.compare(0, start.size(), start) == 0) return true;
    }
    return false;
}

TotalLines find_total_lines(const Matrix& body, const BodySide& rows, const BodySide& columns, bool distinct_labels,
                            bool counts_only) {
    TotalLines totals;
    totals.rows.assign(body.rows(), 0);
    totals.columns.assign(body.columns(), 0);
    for (std::size_t r = 0; r < body.rows(); ++r) totals.rows[r] = rows.labelled && is_total_label((*rows.labels)[r]);
    for (std::size_t c = 0; c < body.columns(); ++c)
        totals.columns[c] = columns.labelled && is_total_label((*columns.labels)[c]);
    if (counts_only) {
        refuse_summaries(Lines{body, true}, rows, totals.rows);
        refuse_summaries(Lines{body, false}, columns, totals.columns);
        refuse_parts(Lines{body, true}, rows, totals.rows, totals.doubts);
        refuse_parts(Lines{body, false}, columns, totals.columns, totals.doubts);
        refuse_part_beside_whole(Lines{body, true}, rows, totals.columns);
        refuse_part_beside_whole(Lines{body, false}, columns, totals.rows);
    }
    Workspace workspace;
    const std::size_t longest = std::max(body.rows(), body.columns());
    workspace.lines.reserve(longest);
    workspace.sums.reserve(longest);
    find_on_side(Lines{body, true}, rows, totals.rows, totals.columns, totals.doubts, workspace);
    find_on_side(Lines{body, false}, columns, totals.columns, totals.rows, totals.doubts, workspace);
    find_subtotals(Lines{body, true}, rows, totals.rows, totals.columns, totals.doubts, workspace);
    find_subtotals(Lines{body, false}, columns, totals.columns, totals.rows, totals.doubts, workspace);
    doubt_count_labels(rows, totals.rows, totals.doubts);
    doubt_count_labels(columns, totals.columns, totals.doubts);
    doubt_unlabelled_lines(Lines{body, true}, rows, totals.rows, totals.doubts);
    doubt_unlabelled_lines(Lines{body, false}, columns, totals.columns, totals.doubts);
    doubt_missing_labels(Lines{body, true}, rows, totals.rows, totals.doubts);
    doubt_missing_labels(Lines{body, false}, columns, totals.columns, totals.doubts);
    if (counts_only) {
        doubt_not_counts(Lines{body, true}, rows, totals.rows, totals.doubts);
        doubt_not_counts(Lines{body, false}, columns, totals.columns, totals.doubts);
    }
    if (distinct_labels) {
        doubt_repeated_labels(rows, totals.rows, totals.doubts);
        doubt_repeated_labels(columns, totals.columns, totals.doubts);
    }
    return totals;
}

LineSums line_sums(const Matrix& body, const std::vector<char>& total_rows, const std::vector<char>& total_columns) {
    LineSums result;
    result.sums.assign(body.rows() + body.columns(), 0.0);
    double* const row_sums = result.sums.data();
    double* const column_sums = result.sums.data() + body.rows();
    for (std::size_t r = 0; r < body.rows(); ++r)
        for (std::size_t c = 0; c < body.columns(); ++c) {
            if (total_rows[r] || total_columns[c]) continue;
            const double value = body(r, c);
            // Whole: beyond 2^52 every double is; below, the cast is exact (no library call for floor).
            result.all_whole = result.all_whole &&
                               (std::fabs(value) >= 0x1p52 || value == static_cast<double>(static_cast<std::int64_t>(value)));
            row_sums[r] += value;
            column_sums[c] += value;
            result.grand += value;
        }
    return result;
}

std::vector<std::string> refuse_percentages(const Matrix& body, const LineSums& line_totals) {
    const bool all_whole = line_totals.all_whole;
    const double grand = line_totals.grand;
    const double* const row_sums = line_totals.sums.data();
    const double* const column_sums = line_totals.sums.data() + body.rows();

    std::vector<std::string> doubts;
    const auto check_side = [&](const double* sums, std::size_t lines, const char* word) {
        std::size_t with_counts = 0;
        bool hundred = true, one = true, exactly_hundred = true;
        for (std::size_t i = 0; i < lines; ++i) {
            const double sum = sums[i];
            if (sum == 0) continue;
            ++with_counts;
            hundred = hundred && std::fabs(sum - 100) <= 1;
            one = one && std::fabs(sum - 1) <= 0.01;
            exactly_hundred = exactly_hundred && sum == 100;
        }
        if (with_counts < 2) return;
        // The words are put together only when they are said (this runs for every table read).
        const auto every = [&] { return std::string("every ") + word + " adds up to "; };
        const auto instead = [&] {
            return "; the tests need the number of people (or items) in each cell, which a " +
                   std::string(hundred ? "percentage" : "share") + " hides: enter the counts instead";
        };
        if (!all_whole && hundred)
            throw Error(every() + "100 and some entries are not whole numbers, so these look like percentages, not counts" +
                        instead());
        if (!all_whole && one)
            throw Error(every() + "1 and some entries are not whole numbers, so these look like shares (proportions), "
                        "not counts" + instead());
        if (all_whole && exactly_hundred)
            doubts.push_back("Every " + std::string(word) + " adds up to exactly 100: if these are percentages, enter the "
                             "counts instead (the tests need the number of people in each cell); if each " + word +
                             " really counts 100 people, this can be ignored.");
        else if (all_whole && hundred)
            doubts.push_back("Every " + std::string(word) + " adds up to 99, 100 or 101, as percentages rounded to whole "
                             "numbers do: if these are percentages, enter the counts instead (the tests need the number "
                             "of people in each cell); if each " + word + " really counts about 100 people, this can be "
                             "ignored.");
    };
    check_side(row_sums, body.rows(), "row");
    check_side(column_sums, body.columns(), "column");
    if (!all_whole && std::fabs(grand - 100) <= 1)
        throw Error("the entries add up to 100 and some are not whole numbers, so these look like percentages of the "
                    "whole table, not counts; the tests need the number of people (or items) in each cell: enter the "
                    "counts instead");
    if (!all_whole && std::fabs(grand - 1) <= 0.01)
        throw Error("the entries add up to 1 and are not whole numbers, so these look like shares of the whole table, "
                    "not counts; the tests need the number of people (or items) in each cell: enter the counts instead");
    return doubts;
}

}  // namespace assoc::detail
