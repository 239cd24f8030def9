#pragma once
// The order of texts: how the "sorted" labels of ASSOC.LEVELS and ASSOC.COUNTS are listed.
//
// Texts are put in the order a reader of the language expects, by the multi-level comparison of the
// Unicode Collation Algorithm (Unicode Technical Standard #10): the letters decide first, read
// without regard to case or accents ("apple" < "Éclair" < "zeta" < "Ω" < "Яблоко"); where the
// letters are the same, accents decide ("resume" < "résumé"), then case, lower case first
// ("résumé" < "Résumé"). Texts that the collation still finds equal — the same words written with
// different but equivalent Unicode characters, such as "é" as one character or as "e" and a
// combining accent — are ordered by their Unicode code points, so that the order is total and never
// depends on the order of the records.
//
// Which collation? The core's own (`unicode_collation()`) is the algorithm's default order, the root
// collation of the Unicode Common Locale Data Repository, through ICU. A host can bring another:
// the Calc add-in uses the office's own collator for the office's locale setting, which is the same
// default order tailored to a language where the language asks for it (in Swedish, "Ä" comes after
// "Z"). The add-in does not use ICU itself: LibreOffice builds other than Debian's carry their own
// ICU under other library names, so a link to one ICU would break the package there, while the
// office's collator is reachable in every build (see DEVELOPERS.md, "The order of texts").
#include <cstddef>
#include <functional>
#include <string>
#include <string_view>
#include <vector>

namespace assoc {

// A way of putting texts in order, for a whole list at once (so that an implementation can prepare
// each text once: a sort key, or a conversion to its own string type).
class TextCollation {
public:
    virtual ~TextCollation() = default;
    // For each text (UTF-8), its rank in this collation's order: 0 for the first; texts the
    // collation finds equal share a rank.
    virtual std::vector<std::size_t> ranks(const std::vector<std::string_view>& texts) const = 0;
};

// The Unicode Collation Algorithm through ICU, at tertiary strength (letters, then accents, then
// case). `locale` is a BCP 47 tag ("sv", "de-DE"); the empty text gives the default (root) order.
// Bytes that are not UTF-8 read as U+FFFD.
class UnicodeCollation final : public TextCollation {
public:
    explicit UnicodeCollation(std::string locale = "");
    std::vector<std::size_t> ranks(const std::vector<std::string_view>& texts) const override;

private:
    std::string locale_;
};

// The core's collation: the default (root) order of the Unicode Collation Algorithm.
// Defined in the library assoc::core; a host that brings its own collation links assoc::core_hosted,
// which leaves this out, and with it ICU.
const TextCollation& unicode_collation();

// For implementations: ranks from a three-way comparison of positions in the list
// (negative, zero or positive as text i comes before, ties with or comes after text j).
std::vector<std::size_t> ranks_by_comparison(std::size_t count,
                                             const std::function<int(std::size_t, std::size_t)>& compare);

// The positions of `texts` in collated order: by the collation's rank, texts of equal rank by
// their code points (UTF-8 bytes compare in code-point order).
std::vector<std::size_t> collated_order(const std::vector<std::string_view>& texts, const TextCollation& collation);

}  // namespace assoc
