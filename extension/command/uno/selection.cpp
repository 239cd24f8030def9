#include "uno/selection.hpp"

#include <com/sun/star/container/XIndexAccess.hpp>
#include <com/sun/star/container/XNamed.hpp>
#include <com/sun/star/sheet/FormulaResult.hpp>
#include <com/sun/star/sheet/XCellRangeAddressable.hpp>
#include <com/sun/star/sheet/XCellRangesQuery.hpp>
#include <com/sun/star/sheet/XSheetCellRanges.hpp>
#include <com/sun/star/sheet/XSheetCellCursor.hpp>
#include <com/sun/star/sheet/XSpreadsheet.hpp>
#include <com/sun/star/sheet/XSpreadsheetDocument.hpp>
#include <com/sun/star/sheet/XUsedAreaCursor.hpp>
#include <com/sun/star/sheet/XCellRangeData.hpp>
#include <com/sun/star/table/CellRangeAddress.hpp>
#include <com/sun/star/table/XCellRange.hpp>
#include <com/sun/star/view/XSelectionSupplier.hpp>

#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "uno/uno_common.hpp"

namespace assoc::command {
namespace {

using css::table::CellRangeAddress;
namespace sheet = css::sheet;

std::vector<CellRangeAddress> selected_ranges(const Reference<css::frame::XController>& controller) {
    Reference<css::view::XSelectionSupplier> supplier(controller, UNO_QUERY);
    if (!supplier.is()) return {};
    const css::uno::Any selection = supplier->getSelection();
    Reference<sheet::XSheetCellRanges> parts(selection, UNO_QUERY);
    if (parts.is()) {
        const css::uno::Sequence<CellRangeAddress> addresses = parts->getRangeAddresses();
        return std::vector<CellRangeAddress>(addresses.begin(), addresses.end());
    }
    Reference<sheet::XCellRangeAddressable> range(selection, UNO_QUERY);
    if (range.is()) return {range->getRangeAddress()};
    return {};
}

std::size_t cells_of(const CellRangeAddress& a) {
    return static_cast<std::size_t>(a.EndRow - a.StartRow + 1) * static_cast<std::size_t>(a.EndColumn - a.StartColumn + 1);
}

}  // namespace

bool selection_is_usable(const Reference<css::frame::XController>& controller) {
    const std::vector<CellRangeAddress> ranges = selected_ranges(controller);
    return ranges.size() >= 2 || (ranges.size() == 1 && cells_of(ranges[0]) > 1);
}

SelectionContent read_selection_content(const Reference<css::frame::XController>& controller) {
    std::vector<CellRangeAddress> ranges = selected_ranges(controller);
    if (ranges.empty())
        throw Error("The selection is not a range of cells. Select a table of counts (its labels may be included), "
                    "or two columns of records, and run the command again.");
    Reference<sheet::XSpreadsheetDocument> document(controller->getModel(), UNO_QUERY_THROW);
    Reference<css::container::XIndexAccess> sheets(document->getSheets(), UNO_QUERY_THROW);
    Reference<sheet::XSpreadsheet> sheet(sheets->getByIndex(ranges[0].Sheet), UNO_QUERY_THROW);
    const std::string sheet_name = calc::to_utf8(Reference<css::container::XNamed>(sheet, UNO_QUERY_THROW)->getName());

    // The last used row and column of the sheet, to cut whole columns and rows.
    Reference<sheet::XSheetCellCursor> cursor = sheet->createCursor();
    Reference<sheet::XUsedAreaCursor>(cursor, UNO_QUERY_THROW)->gotoEndOfUsedArea(false);
    const CellRangeAddress used = Reference<sheet::XCellRangeAddressable>(cursor, UNO_QUERY_THROW)->getRangeAddress();

    SelectionContent content;
    std::size_t total = 0;
    for (CellRangeAddress& address : ranges) {
        if (address.Sheet != ranges[0].Sheet)
            throw Error("The selection spans several sheets. Select cells on one sheet and run the command again.");
        // A whole column (1,048,576 rows) or row: only the part in use counts.
        if (address.EndRow - address.StartRow + 1 >= 65536 && address.EndRow > used.EndRow) {
            address.EndRow = std::max(address.StartRow, used.EndRow);
            content.whole_columns = true;
        }
        if (address.EndColumn - address.StartColumn + 1 >= 1024 && address.EndColumn > used.EndColumn)
            address.EndColumn = std::max(address.StartColumn, used.EndColumn);
        total += cells_of(address);
    }
    if (total > max_selection_cells)
        throw Error("The selection has " + format_count(static_cast<double>(total)) + " cells; the command reads at most " +
                    format_count(static_cast<double>(max_selection_cells)) +
                    ". Select the table, or the two columns of records, alone.");

    for (const CellRangeAddress& address : ranges) {
        Reference<css::table::XCellRange> cells =
            sheet->getCellRangeByPosition(address.StartColumn, address.StartRow, address.EndColumn, address.EndRow);
        // A cell that shows an error would make every function show one too (Err:504).
        Reference<sheet::XSheetCellRanges> errors =
            Reference<sheet::XCellRangesQuery>(cells, UNO_QUERY_THROW)->queryFormulaCells(sheet::FormulaResult::ERROR);
        if (errors.is() && errors->getCount() > 0) {
            const CellRangeAddress first = errors->getRangeAddresses()[0];
            throw Error("Cell " + cell_address(static_cast<std::size_t>(first.StartRow),
                                               static_cast<std::size_t>(first.StartColumn)) +
                        " of the selection shows an error. Correct it (or leave it out of the selection) and run the "
                        "command again.");
        }
        content.ranges.push_back(RangeRef{sheet_name, static_cast<std::size_t>(address.StartRow),
                                          static_cast<std::size_t>(address.StartColumn),
                                          static_cast<std::size_t>(address.EndRow - address.StartRow + 1),
                                          static_cast<std::size_t>(address.EndColumn - address.StartColumn + 1)});
        content.values.push_back(
            calc::to_cell_grid(Reference<sheet::XCellRangeData>(cells, UNO_QUERY_THROW)->getDataArray()));
    }
    return content;
}

}  // namespace assoc::command
