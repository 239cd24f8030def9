#pragma once
// The order of texts inside the office: Calc's own collator (com.sun.star.i18n.Collator) for the
// office's locale setting, so that ASSOC.LEVELS and ASSOC.COUNTS list labels as a reader of that
// language expects, and as the office's own sorting does. The add-in passes this to the core
// instead of the core's ICU collation (see assoc/text_collation.hpp and DEVELOPERS.md for why).
#include <com/sun/star/uno/Reference.hxx>
#include <com/sun/star/uno/XComponentContext.hpp>

#include "assoc/text_collation.hpp"

namespace assoc::calc {

// Called when the office creates the add-in: the context the collator and the settings come from.
void set_office_context(const css::uno::Reference<css::uno::XComponentContext>& context);

// The office's collation. Its ranks() throws assoc::Error when the office offers no collator.
const TextCollation& office_collation();

}  // namespace assoc::calc
