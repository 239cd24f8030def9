// The UNO component: the generated worksheet functions plus what Calc asks an add-in about them
// (XAddIn: names, descriptions, category) and the service facts; and the factory entry point
// for passive registration (assoc.components), which also registers the menu command's protocol
// handler (extension/command).
#include <com/sun/star/lang/Locale.hpp>
#include <com/sun/star/uno/XComponentContext.hpp>
#include <cppuhelper/factory.hxx>
#include <cppuhelper/implementationentry.hxx>
#include <cppuhelper/supportsservice.hxx>
#include <uno/lbnames.h>

#include "assoc_functions.hpp"
#include "office_collation.hpp"
#include "uno/analyse_command.hpp"
#include "uno_values.hpp"

namespace assoc::calc {
namespace {

using css::uno::Sequence;

constexpr const char* implementation_name = "org.assocproject.calc.Functions";

Sequence<OUString> service_names() {
    Sequence<OUString> names(2);
    names.getArray()[0] = "com.sun.star.sheet.AddIn";
    names.getArray()[1] = OUString::createFromAscii(implementation_name);
    return names;
}

const FunctionInfo* by_method(const OUString& method) {
    const std::string name = to_utf8(method);
    for (const FunctionInfo& info : function_catalog())
        if (name == info.method) return &info;
    return nullptr;
}

const ArgumentInfo* argument_of(const OUString& method, sal_Int32 index) {
    const FunctionInfo* info = by_method(method);
    if (info == nullptr || index < 0 || static_cast<std::size_t>(index) >= info->arguments.size()) return nullptr;
    return &info->arguments[static_cast<std::size_t>(index)];
}

OUString text(const char* utf8) { return utf8 == nullptr ? OUString() : to_ou_string(utf8); }

// Calc asks these with names it got from us; an unknown name gets an empty answer, never an exception.
class AssocAddIn final : public AssocFunctions {
public:
    // XAddIn
    OUString SAL_CALL getProgrammaticFuntionName(const OUString& display_name) override {
        const std::string name = to_utf8(display_name);
        for (const FunctionInfo& info : function_catalog())
            if (name == info.display_name) return text(info.method);
        return OUString();
    }
    OUString SAL_CALL getDisplayFunctionName(const OUString& method) override {
        const FunctionInfo* info = by_method(method);
        return info ? text(info->display_name) : OUString();
    }
    OUString SAL_CALL getFunctionDescription(const OUString& method) override {
        const FunctionInfo* info = by_method(method);
        return info ? text(info->description) : OUString();
    }
    OUString SAL_CALL getDisplayArgumentName(const OUString& method, sal_Int32 index) override {
        const ArgumentInfo* argument = argument_of(method, index);
        return argument ? text(argument->name) : OUString();
    }
    OUString SAL_CALL getArgumentDescription(const OUString& method, sal_Int32 index) override {
        const ArgumentInfo* argument = argument_of(method, index);
        return argument ? text(argument->description) : OUString();
    }
    OUString SAL_CALL getProgrammaticCategoryName(const OUString&) override { return text(function_category); }
    OUString SAL_CALL getDisplayCategoryName(const OUString&) override { return text(function_category); }

    // XLocalizable: the texts are English only; the locale is kept because Calc sets it.
    void SAL_CALL setLocale(const css::lang::Locale& locale) override { locale_ = locale; }
    css::lang::Locale SAL_CALL getLocale() override { return locale_; }

    // XServiceName: the prefix of the programmatic names that documents store.
    OUString SAL_CALL getServiceName() override { return OUString::createFromAscii(implementation_name); }

    // XServiceInfo
    OUString SAL_CALL getImplementationName() override { return OUString::createFromAscii(implementation_name); }
    sal_Bool SAL_CALL supportsService(const OUString& name) override { return cppu::supportsService(this, name); }
    Sequence<OUString> SAL_CALL getSupportedServiceNames() override { return service_names(); }

private:
    css::lang::Locale locale_;
};

css::uno::Reference<css::uno::XInterface> SAL_CALL create(const css::uno::Reference<css::uno::XComponentContext>& context) {
    set_office_context(context);  // the collator that puts labels in order comes from the office
    return static_cast<cppu::OWeakObject*>(new AssocAddIn);
}

OUString SAL_CALL get_implementation_name() { return OUString::createFromAscii(implementation_name); }

const cppu::ImplementationEntry entries[] = {
    {create, get_implementation_name, service_names, cppu::createSingleComponentFactory, nullptr, 0},
    {assoc::command::create_analyse_command, assoc::command::analyse_command_implementation_name,
     assoc::command::analyse_command_service_names, cppu::createSingleComponentFactory, nullptr, 0},
    {nullptr, nullptr, nullptr, nullptr, nullptr, 0},
};

}  // namespace
}  // namespace assoc::calc

extern "C" SAL_DLLPUBLIC_EXPORT void* SAL_CALL component_getFactory(const char* implementation, void* service_manager,
                                                                    void* registry_key) {
    return cppu::component_getFactoryHelper(implementation, service_manager, registry_key, assoc::calc::entries);
}

extern "C" SAL_DLLPUBLIC_EXPORT void SAL_CALL component_getImplementationEnvironment(const char** environment,
                                                                                    uno_Environment**) {
    *environment = CPPU_CURRENT_LANGUAGE_BINDING_NAME;
}
