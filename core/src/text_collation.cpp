#include "assoc/text_collation.hpp"

#include <algorithm>
#include <numeric>

#include "assoc/error.hpp"

namespace assoc {

std::vector<std::size_t> ranks_by_comparison(std::size_t count,
                                             const std::function<int(std::size_t, std::size_t)>& compare) {
    std::vector<std::size_t> by_rank(count);
    std::iota(by_rank.begin(), by_rank.end(), std::size_t{0});
    std::sort(by_rank.begin(), by_rank.end(), [&](std::size_t i, std::size_t j) { return compare(i, j) < 0; });
    std::vector<std::size_t> rank(count);
    std::size_t current = 0;
    for (std::size_t p = 0; p < count; ++p) {
        if (p > 0 && compare(by_rank[p - 1], by_rank[p]) != 0) ++current;
        rank[by_rank[p]] = current;
    }
    return rank;
}

std::vector<std::size_t> collated_order(const std::vector<std::string_view>& texts, const TextCollation& collation) {
    const std::vector<std::size_t> rank = collation.ranks(texts);
    require(rank.size() == texts.size(), "the collation of texts gave a rank to a different number of texts");
    std::vector<std::size_t> order(texts.size());
    std::iota(order.begin(), order.end(), std::size_t{0});
    // std::string_view compares through char_traits<char>, which orders bytes as unsigned: for
    // UTF-8 that is code-point order.
    std::sort(order.begin(), order.end(), [&](std::size_t i, std::size_t j) {
        if (rank[i] != rank[j]) return rank[i] < rank[j];
        return texts[i] < texts[j];
    });
    return order;
}

}  // namespace assoc
