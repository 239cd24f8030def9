#pragma once
// The protocol handler of the command "Analyse selection" (org.assocproject.calc:AnalyseSelection),
// registered beside the worksheet functions in the extension's library (src/addin.cpp).
#include <com/sun/star/uno/Reference.hxx>
#include <com/sun/star/uno/Sequence.hxx>
#include <com/sun/star/uno/XComponentContext.hpp>
#include <com/sun/star/uno/XInterface.hpp>
#include <rtl/ustring.hxx>

namespace assoc::command {

using ::rtl::OUString;

css::uno::Reference<css::uno::XInterface> SAL_CALL
create_analyse_command(const css::uno::Reference<css::uno::XComponentContext>& context);
OUString SAL_CALL analyse_command_implementation_name();
css::uno::Sequence<OUString> SAL_CALL analyse_command_service_names();

}  // namespace assoc::command
