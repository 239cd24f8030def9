// The core's collation of texts: the Unicode Collation Algorithm through ICU (see text_collation.hpp).
// This file is the only one of the core that uses ICU; it is left out of assoc::core_hosted.
#include <unicode/ucol.h>
#include <unicode/uloc.h>
#include <unicode/ustring.h>

#include <cstring>
#include <memory>
#include <string>

#include "assoc/error.hpp"
#include "assoc/text_collation.hpp"

namespace assoc {
namespace {

struct CloseCollator {
    void operator()(UCollator* collator) const { ucol_close(collator); }
};
using Collator = std::unique_ptr<UCollator, CloseCollator>;

[[noreturn]] void fail(const char* what, UErrorCode status) {
    throw Error(std::string("texts cannot be put in order: ") + what + " (ICU: " + u_errorName(status) + ")");
}

// A collator of its own for each list: ICU shares the collation data between collators, so opening
// one costs little, and nothing is shared between threads.
Collator open_collator(const std::string& locale) {
    UErrorCode status = U_ZERO_ERROR;
    char id[ULOC_FULLNAME_CAPACITY] = "";
    if (!locale.empty()) {
        int32_t parsed = 0;
        uloc_forLanguageTag(locale.c_str(), id, sizeof id, &parsed, &status);
        if (U_FAILURE(status) || parsed != static_cast<int32_t>(locale.size()))
            throw Error("texts cannot be put in order: \"" + locale + "\" is not a language tag such as \"sv\" or \"de-DE\"");
    }
    Collator collator(ucol_open(id, &status));
    if (U_FAILURE(status)) fail("the Unicode collation data is missing", status);
    // Tertiary strength: letters, then accents, then case. Normalisation on, so that texts written
    // with equivalent characters in any order compare as the algorithm says (its first step).
    ucol_setStrength(collator.get(), UCOL_TERTIARY);
    ucol_setAttribute(collator.get(), UCOL_NORMALIZATION_MODE, UCOL_ON, &status);
    if (U_FAILURE(status)) fail("the collator refused normalisation", status);
    return collator;
}

std::u16string to_utf16(std::string_view text) {
    // A UTF-16 text never has more units than its UTF-8 bytes (an invalid byte becomes one U+FFFD).
    std::u16string units(text.size(), u'\0');
    int32_t length = 0;
    UErrorCode status = U_ZERO_ERROR;
    u_strFromUTF8WithSub(reinterpret_cast<UChar*>(units.data()), static_cast<int32_t>(units.size()), &length,
                         text.data(), static_cast<int32_t>(text.size()), 0xFFFD, nullptr, &status);
    if (U_FAILURE(status)) fail("a text could not be read as UTF-8", status);
    units.resize(static_cast<std::size_t>(length));
    return units;
}

// The sort key of a text: comparing keys byte by byte is comparing the texts.
std::string sort_key(const UCollator* collator, std::string_view text) {
    const std::u16string units = to_utf16(text);
    const auto* source = reinterpret_cast<const UChar*>(units.data());
    const auto length = static_cast<int32_t>(units.size());
    std::string key(2 * units.size() + 16, '\0');
    int32_t needed = ucol_getSortKey(collator, source, length, reinterpret_cast<uint8_t*>(key.data()),
                                     static_cast<int32_t>(key.size()));
    if (needed > static_cast<int32_t>(key.size())) {
        key.resize(static_cast<std::size_t>(needed));
        needed = ucol_getSortKey(collator, source, length, reinterpret_cast<uint8_t*>(key.data()), needed);
    }
    require(needed > 0, "texts cannot be put in order: the collator gave no sort key");
    key.resize(static_cast<std::size_t>(needed));
    return key;
}

}  // namespace

UnicodeCollation::UnicodeCollation(std::string locale) : locale_(std::move(locale)) {
    open_collator(locale_);  // a bad locale fails here, not at first use
}

std::vector<std::size_t> UnicodeCollation::ranks(const std::vector<std::string_view>& texts) const {
    const Collator collator = open_collator(locale_);
    std::vector<std::string> keys;
    keys.reserve(texts.size());
    for (std::string_view text : texts) keys.push_back(sort_key(collator.get(), text));
    return ranks_by_comparison(keys.size(), [&](std::size_t i, std::size_t j) { return keys[i].compare(keys[j]); });
}

const TextCollation& unicode_collation() {
    static const UnicodeCollation root;
    return root;
}

}  // namespace assoc
