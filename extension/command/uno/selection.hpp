#pragma once
// Reads what the user selected in a Calc view: the ranges and their cells, for reading.hpp.
#include <rtl/ustring.hxx>
#include <com/sun/star/frame/XController.hpp>
#include <com/sun/star/uno/Reference.hxx>

#include "reading.hpp"

namespace assoc::command {

using ::rtl::OUString;

// The selection of `controller` (a Calc view): one range, or the parts of a multiple selection.
// Whole columns (or rows) are cut to the sheet's used area. Throws assoc::Error with a message for
// the user when the selection is not cells, is too large, or holds a cell that shows an error.
SelectionContent read_selection_content(const css::uno::Reference<css::frame::XController>& controller);

// Whether the selection of `controller` is something the command can start from: a range of more
// than one cell, or two or more ranges (the toolbar button and menu entry are enabled then).
bool selection_is_usable(const css::uno::Reference<css::frame::XController>& controller);

// Cells read from the selection at most (two columns of a million records fit).
inline constexpr std::size_t max_selection_cells = 2'200'000;

}  // namespace assoc::command
