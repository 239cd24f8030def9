#pragma once
// Carries out a SheetPlan on a new sheet of a Calc document, as one undo step; on any failure the
// half-built sheet is removed again and the exception passes on.
#include <rtl/ustring.hxx>
#include <com/sun/star/frame/XController.hpp>
#include <com/sun/star/uno/Reference.hxx>
#include <com/sun/star/uno/XComponentContext.hpp>
#include <string>

#include "analysis_sheet.hpp"
#include "sheet_plan.hpp"
#include "uno/stopwatch.hpp"

namespace assoc::command {

using ::rtl::OUString;

struct SheetPlacement {
    std::string base_name;     // made unique: "Name", "Name (2)", …
    Placement where = Placement::after_source;
    std::string source_sheet;  // the sheet of the data
    // For the tests of the rollback: fail on purpose after this phase of the writing ("" never).
    std::string fail_after;
};

// Inserts the sheet, writes the plan, shows the sheet in the view; returns the sheet's name.
std::string write_sheet(const css::uno::Reference<css::uno::XComponentContext>& context,
                        const css::uno::Reference<css::frame::XController>& controller, const SheetPlan& plan,
                        const SheetPlacement& placement, Stopwatch& stopwatch);

// A name not yet used by a sheet of the document: base, "base (2)", "base (3)", …
std::string unique_sheet_name(const css::uno::Reference<css::frame::XController>& controller, const std::string& base);

}  // namespace assoc::command
