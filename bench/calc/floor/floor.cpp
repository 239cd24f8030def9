// The transfer floor: a bench-only Calc add-in (never shipped) whose functions take any[][] ranges
// exactly as ASSOC.COUNTS takes its labels, read every element once and return how many there were.
// Timing them in Calc measures what Calc charges to hand a range to an add-in (building the
// Sequence<Sequence<Any>> from the cells, the call, and freeing it again), which no add-in can avoid.
//
// "Reading" an element is what any add-in must do at the least: check its type and take its value
// (for a text, the OUString; for a number, the double) into a local. A checksum of the values goes
// to a volatile so that the compiler cannot drop the reads.
#include <com/sun/star/lang/Locale.hpp>
#include <com/sun/star/lang/XServiceInfo.hpp>
#include <com/sun/star/lang/XServiceName.hpp>
#include <com/sun/star/sheet/XAddIn.hpp>
#include <com/sun/star/uno/Any.hxx>
#include <com/sun/star/uno/Sequence.hxx>
#include <com/sun/star/uno/XComponentContext.hpp>
#include <cppuhelper/factory.hxx>
#include <cppuhelper/implbase4.hxx>
#include <cppuhelper/implementationentry.hxx>
#include <cppuhelper/supportsservice.hxx>
#include <org/benchonly/transferfloor/XTransferFloor.hpp>
#include <rtl/ustring.hxx>
#include <uno/lbnames.h>

#include <cstdint>

namespace transfer_floor {
namespace {

using css::uno::Any;
using css::uno::Sequence;
using ::rtl::OUString;
using AnyTable = Sequence<Sequence<Any>>;

constexpr const char* implementation_name = "org.benchonly.transferfloor.Functions";
constexpr const char* category = "Add-In";

volatile std::uint64_t checksum_sink = 0;

struct Tally {
    double elements = 0;
    std::uint64_t checksum = 0;
};

// Reads one element the way an add-in that uses it must: its type, then its value.
void read_element(const Any& value, Tally& tally) {
    switch (value.getValueTypeClass()) {
    case css::uno::TypeClass_STRING: {
        OUString text;
        value >>= text;
        tally.checksum += static_cast<std::uint64_t>(text.getLength()) + (text.isEmpty() ? 0u : text[0]);
        break;
    }
    case css::uno::TypeClass_BOOLEAN: tally.checksum += value.get<bool>() ? 1u : 0u; break;
    default: {
        double number = 0.0;
        value >>= number;
        tally.checksum += static_cast<std::uint64_t>(number);
        break;
    }
    }
    tally.elements += 1;
}

void read_range(const AnyTable& range, Tally& tally) {
    for (const Sequence<Any>& row : range)
        for (const Any& value : row) read_element(value, tally);
}

double finish(const Tally& tally) {
    checksum_sink = tally.checksum;
    return tally.elements;
}

struct Function {
    const char* method;
    const char* display_name;
    const char* description;
    const char* arguments[2];
};

const Function functions[] = {
    {"readtwo", "TRANSFERFLOOR.READTWO", "Bench only: reads every element of two ranges, returns their number",
     {"first", "second"}},
    {"readone", "TRANSFERFLOOR.READONE", "Bench only: reads every element of one range, returns their number",
     {"range", nullptr}},
    {"readtable", "TRANSFERFLOOR.READTABLE",
     "Bench only: reads every element of one range and its optional second argument, returns their number",
     {"range", "option"}},
};

const Function* by_method(const OUString& method) {
    for (const Function& function : functions)
        if (method.equalsAscii(function.method)) return &function;
    return nullptr;
}

OUString ascii(const char* text) { return text == nullptr ? OUString() : OUString::createFromAscii(text); }

Sequence<OUString> service_names() {
    Sequence<OUString> names(2);
    names.getArray()[0] = "com.sun.star.sheet.AddIn";
    names.getArray()[1] = OUString::createFromAscii(implementation_name);
    return names;
}

class TransferFloor final
    : public cppu::WeakImplHelper4<org::benchonly::transferfloor::XTransferFloor, css::sheet::XAddIn,
                                   css::lang::XServiceName, css::lang::XServiceInfo> {
public:
    // XTransferFloor
    double SAL_CALL readtwo(const AnyTable& first, const AnyTable& second) override {
        Tally tally;
        read_range(first, tally);
        read_range(second, tally);
        return finish(tally);
    }
    double SAL_CALL readone(const AnyTable& range) override {
        Tally tally;
        read_range(range, tally);
        return finish(tally);
    }
    Any SAL_CALL readtable(const AnyTable& range, const Any& option) override {
        Tally tally;
        read_range(range, tally);
        read_element(option, tally);
        tally.elements -= 1;  // the option is read, not counted
        return Any(finish(tally));
    }

    // XAddIn
    OUString SAL_CALL getProgrammaticFuntionName(const OUString& display_name) override {
        for (const Function& function : functions)
            if (display_name.equalsAscii(function.display_name)) return ascii(function.method);
        return OUString();
    }
    OUString SAL_CALL getDisplayFunctionName(const OUString& method) override {
        const Function* function = by_method(method);
        return function ? ascii(function->display_name) : OUString();
    }
    OUString SAL_CALL getFunctionDescription(const OUString& method) override {
        const Function* function = by_method(method);
        return function ? ascii(function->description) : OUString();
    }
    OUString SAL_CALL getDisplayArgumentName(const OUString& method, sal_Int32 index) override {
        const Function* function = by_method(method);
        return function && index >= 0 && index < 2 ? ascii(function->arguments[index]) : OUString();
    }
    OUString SAL_CALL getArgumentDescription(const OUString& method, sal_Int32 index) override {
        return getDisplayArgumentName(method, index);
    }
    OUString SAL_CALL getProgrammaticCategoryName(const OUString&) override { return ascii(category); }
    OUString SAL_CALL getDisplayCategoryName(const OUString&) override { return ascii(category); }

    // XLocalizable
    void SAL_CALL setLocale(const css::lang::Locale& locale) override { locale_ = locale; }
    css::lang::Locale SAL_CALL getLocale() override { return locale_; }

    // XServiceName: the prefix of the programmatic names.
    OUString SAL_CALL getServiceName() override { return ascii(implementation_name); }

    // XServiceInfo
    OUString SAL_CALL getImplementationName() override { return ascii(implementation_name); }
    sal_Bool SAL_CALL supportsService(const OUString& name) override { return cppu::supportsService(this, name); }
    Sequence<OUString> SAL_CALL getSupportedServiceNames() override { return service_names(); }

private:
    css::lang::Locale locale_;
};

css::uno::Reference<css::uno::XInterface> SAL_CALL create(const css::uno::Reference<css::uno::XComponentContext>&) {
    return static_cast<cppu::OWeakObject*>(new TransferFloor);
}

OUString SAL_CALL get_implementation_name() { return ascii(implementation_name); }

const cppu::ImplementationEntry entries[] = {
    {create, get_implementation_name, service_names, cppu::createSingleComponentFactory, nullptr, 0},
    {nullptr, nullptr, nullptr, nullptr, nullptr, 0},
};

}  // namespace
}  // namespace transfer_floor

extern "C" SAL_DLLPUBLIC_EXPORT void* SAL_CALL component_getFactory(const char* implementation, void* service_manager,
                                                                    void* registry_key) {
    return cppu::component_getFactoryHelper(implementation, service_manager, registry_key, transfer_floor::entries);
}

extern "C" SAL_DLLPUBLIC_EXPORT void SAL_CALL component_getImplementationEnvironment(const char** environment,
                                                                                    uno_Environment**) {
    *environment = CPPU_CURRENT_LANGUAGE_BINDING_NAME;
}
