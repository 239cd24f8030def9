#include "office_collation.hpp"

#include <com/sun/star/beans/PropertyValue.hpp>
#include <com/sun/star/container/XNameAccess.hpp>
#include <com/sun/star/i18n/XCollator.hpp>
#include <com/sun/star/lang/Locale.hpp>
#include <com/sun/star/lang/XMultiServiceFactory.hpp>
#include <com/sun/star/uno/Exception.hpp>
#include <com/sun/star/uno/Sequence.hxx>
#include <osl/process.h>
#include <rtl/ustring.hxx>

#include <mutex>
#include <string>
#include <vector>

#include "assoc/error.hpp"
#include "uno_values.hpp"

namespace assoc::calc {
namespace {

using css::uno::Reference;
using css::uno::UNO_QUERY;
using css::uno::UNO_QUERY_THROW;

// A language tag ("de-DE", "sv", "ca-ES-valencia") as the office's Locale struct: language and
// country where the tag is that simple, otherwise the office's convention for full tags
// (language "qlt", the tag in the variant).
css::lang::Locale locale_from_tag(const OUString& tag) {
    const sal_Int32 dash = tag.indexOf('-');
    if (dash < 0) return css::lang::Locale(tag, OUString(), OUString());
    const OUString country = tag.copy(dash + 1);
    if (country.indexOf('-') < 0 && (country.getLength() == 2 || country.getLength() == 3))
        return css::lang::Locale(tag.copy(0, dash), country, OUString());
    return css::lang::Locale("qlt", OUString(), tag);
}

// The office's locale setting (Tools ▸ Options ▸ Language Settings ▸ Languages ▸ Locale setting);
// when that is "Default", the locale of the office's process (the system's), as the office itself
// resolves it.
css::lang::Locale office_locale(const Reference<css::uno::XComponentContext>& context) {
    try {
        const Reference<css::lang::XMultiServiceFactory> provider(
            context->getServiceManager()->createInstanceWithContext("com.sun.star.configuration.ConfigurationProvider",
                                                                    context),
            UNO_QUERY_THROW);
        css::beans::PropertyValue path;
        path.Name = "nodepath";
        path.Value <<= OUString("/org.openoffice.Setup/L10N");
        css::uno::Sequence<css::uno::Any> arguments(1);
        arguments.getArray()[0] <<= path;
        const Reference<css::container::XNameAccess> settings(
            provider->createInstanceWithArguments("com.sun.star.configuration.ConfigurationAccess", arguments),
            UNO_QUERY_THROW);
        OUString tag;
        if ((settings->getByName("ooSetupSystemLocale") >>= tag) && !tag.isEmpty()) return locale_from_tag(tag);
    } catch (const css::uno::Exception&) {
        // No readable setting: the process's locale, as for "Default".
    }
    rtl_Locale* process = nullptr;
    if (osl_getProcessLocale(&process) == osl_Process_E_None && process != nullptr)
        return css::lang::Locale(OUString(process->Language), OUString(process->Country), OUString(process->Variant));
    return css::lang::Locale();
}

bool same_locale(const css::lang::Locale& a, const css::lang::Locale& b) {
    return a.Language == b.Language && a.Country == b.Country && a.Variant == b.Variant;
}

class OfficeCollation final : public TextCollation {
public:
    void set_context(const Reference<css::uno::XComponentContext>& context) {
        const std::lock_guard<std::mutex> lock(mutex_);
        if (!context_.is()) context_ = context;
    }

    std::vector<std::size_t> ranks(const std::vector<std::string_view>& texts) const override {
        // Calls arrive on varying threads; the collator is not known to be safe for concurrent use.
        const std::lock_guard<std::mutex> lock(mutex_);
        try {
            const Reference<css::i18n::XCollator> collator = current_collator();
            std::vector<OUString> converted;
            converted.reserve(texts.size());
            for (std::string_view text : texts)
                converted.emplace_back(text.data(), static_cast<sal_Int32>(text.size()), RTL_TEXTENCODING_UTF8);
            return ranks_by_comparison(converted.size(), [&](std::size_t i, std::size_t j) {
                return static_cast<int>(collator->compareString(converted[i], converted[j]));
            });
        } catch (const css::uno::Exception& failure) {
            throw Error("texts cannot be put in order: the office's collator failed (" + to_utf8(failure.Message) +
                        "); use the order \"first\"");
        }
    }

private:
    // The collator for the locale setting as it is now (it may change while the office runs).
    Reference<css::i18n::XCollator> current_collator() const {
        require(context_.is(), "texts cannot be put in order: the office has not started the add-in properly; "
                               "use the order \"first\"");
        const css::lang::Locale locale = office_locale(context_);
        if (collator_.is() && same_locale(locale, locale_)) return collator_;
        const Reference<css::i18n::XCollator> collator(
            context_->getServiceManager()->createInstanceWithContext("com.sun.star.i18n.Collator", context_),
            UNO_QUERY);
        require(collator.is(), "texts cannot be put in order: the office offers no collator; use the order \"first\"");
        // Options 0: the collator's full comparison (letters, then accents, then case).
        collator->loadDefaultCollator(locale, 0);
        collator_ = collator;
        locale_ = locale;
        return collator_;
    }

    mutable std::mutex mutex_;
    Reference<css::uno::XComponentContext> context_;
    mutable Reference<css::i18n::XCollator> collator_;
    mutable css::lang::Locale locale_;
};

OfficeCollation& the_office_collation() {
    static OfficeCollation collation;
    return collation;
}

}  // namespace

void set_office_context(const Reference<css::uno::XComponentContext>& context) {
    the_office_collation().set_context(context);
}

const TextCollation& office_collation() { return the_office_collation(); }

}  // namespace assoc::calc
