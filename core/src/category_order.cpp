#include "category_order.hpp"

#include <algorithm>
#include <cstddef>
#include <cstdlib>
#include <iterator>
#include <string_view>

#include "assoc/wording.hpp"

namespace assoc::detail {
namespace {

bool is_digit(char c) { return c >= '0' && c <= '9'; }
bool is_letter(char c) { return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z'); }

// The numbers a label orders by, years first ("Q4 2023" before "Q1 2024"), then the others in the
// order they are written ("0-2 years" is 0, 2; "Under 30" is 30). A number glued to a letter after
// it or before it ("A1", "Q4", "3rd") is a code, not a quantity, except a year ("FY2024").
// Empty when the label has no such number.
std::vector<double> order_key(const std::string& label) {
    std::vector<double> years, others;
    for (std::size_t i = 0; i < label.size();) {
        if (!is_digit(label[i])) {
            ++i;
            continue;
        }
        const std::size_t start = i;
        while (i < label.size() && is_digit(label[i])) ++i;
        const std::size_t whole_digits = i - start;
        // A decimal or grouped part, with either separator ("2.5", "10,000": order is kept either way).
        if (i + 1 < label.size() && (label[i] == '.' || label[i] == ',') && is_digit(label[i + 1])) {
            ++i;
            while (i < label.size() && is_digit(label[i])) ++i;
        }
        std::string number(label, start, i - start);
        std::replace(number.begin(), number.end(), ',', '.');
        const double value = std::strtod(number.c_str(), nullptr);
        const bool glued = (start > 0 && is_letter(label[start - 1])) || (i < label.size() && is_letter(label[i]));
        if (whole_digits == 4 && i - start == 4 && value >= 1900 && value <= 2100)
            years.push_back(value);
        else if (!glued)
            others.push_back(value);
    }
    years.insert(years.end(), others.begin(), others.end());
    return years;
}

// Common answer scales, each in its order (folded: lower case, single spaces).
const std::vector<std::vector<std::string_view>>& scales() {
    static const std::vector<std::vector<std::string_view>> lists = {
        {"strongly disagree", "disagree", "somewhat disagree", "neutral", "neither agree nor disagree",
         "somewhat agree", "agree", "strongly agree"},
        {"very dissatisfied", "dissatisfied", "somewhat dissatisfied", "neutral", "somewhat satisfied", "satisfied",
         "very satisfied"},
        {"very poor", "poor", "fair", "average", "good", "very good", "excellent"},
        {"never", "rarely", "seldom", "sometimes", "often", "usually", "always"},
        {"very low", "low", "medium", "moderate", "high", "very high"},
        {"very unlikely", "unlikely", "neutral", "likely", "very likely"},
        {"very bad", "bad", "neutral", "good", "very good"},
        {"does not meet expectations", "partially meets expectations", "meets expectations", "exceeds expectations",
         "far exceeds expectations"},
        {"below expectations", "meets expectations", "above expectations"},
        {"junior", "intermediate", "senior"},
        {"small", "medium", "large"},
    };
    return lists;
}

// Each label's place on one common scale, or empty when no one scale holds them all.
std::vector<double> scale_places(const std::vector<std::string>& labels) {
    std::vector<std::string> folded;
    for (const std::string& label : labels) folded.push_back(folded_label(label));
    for (const std::vector<std::string_view>& scale : scales()) {
        std::vector<double> places;
        for (const std::string& label : folded) {
            const auto at = std::find(scale.begin(), scale.end(), std::string_view(label));
            if (at == scale.end()) break;
            places.push_back(static_cast<double>(at - scale.begin()));
        }
        if (places.size() == labels.size()) return places;
    }
    return {};
}

template <typename Key>
bool in_order(const std::vector<Key>& keys) {
    bool rising = true, falling = true;
    for (std::size_t i = 1; i < keys.size(); ++i) {
        rising = rising && !(keys[i] < keys[i - 1]);
        falling = falling && !(keys[i - 1] < keys[i]);
    }
    return rising || falling;
}

}  // namespace

std::optional<std::string> categories_out_of_order(const std::vector<std::string>& labels, const char* side,
                                                   const char* scores) {
    if (labels.size() < 3) return std::nullopt;  // two categories are in one order or its reverse
    std::vector<std::vector<double>> keys;
    for (const std::string& label : labels) {
        if (label.empty()) return std::nullopt;
        keys.push_back(order_key(label));
        if (keys.back().empty()) break;
    }
    std::vector<std::size_t> order(labels.size());
    for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
    if (keys.size() == labels.size() && !keys.back().empty()) {
        if (in_order(keys)) return std::nullopt;
        std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) { return keys[a] < keys[b]; });
    } else {
        const std::vector<double> places = scale_places(labels);
        if (places.empty() || in_order(places)) return std::nullopt;
        std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) { return places[a] < places[b]; });
    }
    std::vector<std::string> given, named;
    for (std::size_t i = 0; i < labels.size(); ++i) {
        given.push_back(quoted_label(labels[i]));
        named.push_back(quoted_label(labels[order[i]]));
    }
    const std::string sides = std::string(side) + "s";
    const std::string start = "the " + sides + "' labels name an order (" + name_list(named, 8) +
                              ") but the table has them in another (" + name_list(given, 8) + "), and ";
    if (scores == nullptr)
        return start + "the test follows the table's order, so it would follow an order nobody meant; put the " + sides +
               " in the order of their labels";
    return start + "without " + scores + " the " + sides + " are scored 1, 2, 3, … in the table's order, so the test "
           "would follow an order nobody meant; put the " + sides + " in the order of their labels, or give " + scores +
           " (one per " + side + ", in the table's order)";
}

}  // namespace assoc::detail
