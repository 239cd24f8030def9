#include "uno/sheet_writer.hpp"

#include <com/sun/star/awt/FontSlant.hpp>
#include <com/sun/star/awt/FontWeight.hpp>
#include <com/sun/star/awt/Point.hpp>
#include <com/sun/star/awt/Rectangle.hpp>
#include <com/sun/star/awt/Size.hpp>
#include <com/sun/star/beans/PropertyValue.hpp>
#include <com/sun/star/beans/XMultiPropertySet.hpp>
#include <com/sun/star/beans/XPropertySet.hpp>
#include <com/sun/star/chart/XAxisYSupplier.hpp>
#include <com/sun/star/chart/XChartDocument.hpp>
#include <com/sun/star/chart/XDiagram.hpp>
#include <com/sun/star/container/XIndexAccess.hpp>
#include <com/sun/star/beans/NamedValue.hpp>
#include <com/sun/star/configuration/theDefaultProvider.hpp>
#include <com/sun/star/container/XNameAccess.hpp>
#include <com/sun/star/container/XNameReplace.hpp>
#include <com/sun/star/util/XChangesBatch.hpp>
#include <com/sun/star/datatransfer/XTransferableSupplier.hpp>
#include <com/sun/star/document/XEmbeddedObjectSupplier.hpp>
#include <com/sun/star/document/XUndoManager.hpp>
#include <com/sun/star/document/XUndoManagerSupplier.hpp>
#include <com/sun/star/frame/Desktop.hpp>
#include <com/sun/star/frame/XComponentLoader.hpp>
#include <com/sun/star/frame/XModel.hpp>
#include <com/sun/star/io/SequenceInputStream.hpp>
#include <com/sun/star/lang/Locale.hpp>
#include <com/sun/star/lang/XMultiServiceFactory.hpp>
#include <com/sun/star/document/XActionLockable.hpp>
#include <com/sun/star/sheet/XArrayFormulaRange.hpp>
#include <com/sun/star/sheet/XCellRangeFormula.hpp>
#include <com/sun/star/sheet/XSheetCellRangeContainer.hpp>
#include <com/sun/star/sheet/XSheetOutline.hpp>
#include <com/sun/star/sheet/XSpreadsheet.hpp>
#include <com/sun/star/table/TableOrientation.hpp>
#include <com/sun/star/sheet/XSpreadsheetDocument.hpp>
#include <com/sun/star/sheet/XSpreadsheetView.hpp>
#include <com/sun/star/sheet/XSpreadsheets.hpp>
#include <com/sun/star/container/XNameContainer.hpp>
#include <com/sun/star/style/XStyleFamiliesSupplier.hpp>
#include <com/sun/star/table/BorderLine2.hpp>
#include <com/sun/star/table/CellHoriJustify.hpp>
#include <com/sun/star/table/CellRangeAddress.hpp>
#include <com/sun/star/table/CellVertJustify2.hpp>
#include <com/sun/star/table/XCell.hpp>
#include <com/sun/star/table/XCellRange.hpp>
#include <com/sun/star/table/XColumnRowRange.hpp>
#include <com/sun/star/table/XTableCharts.hpp>
#include <com/sun/star/table/XTableChartsSupplier.hpp>
#include <com/sun/star/text/XText.hpp>
#include <com/sun/star/util/XCloseable.hpp>
#include <com/sun/star/util/XMergeable.hpp>
#include <com/sun/star/util/XNumberFormats.hpp>
#include <com/sun/star/util/XNumberFormatsSupplier.hpp>
#include <com/sun/star/view/XSelectionSupplier.hpp>
#include <atomic>
#include <cstdio>
#include <map>
#include <optional>

#include "palette.hpp"
#include "uno/uno_common.hpp"

namespace assoc::command {
namespace {

// The page style of the sheets the command makes: as wide as one page, as many pages long as needed.
constexpr const char* page_style = "Assoc analysis";
// Height of a line of 10 pt text, in 1/100 mm.
constexpr sal_Int32 line_height = 452;

Reference<css::sheet::XSpreadsheets> sheets_of(const Reference<css::frame::XController>& controller) {
    return Reference<css::sheet::XSpreadsheetDocument>(controller->getModel(), UNO_QUERY_THROW)->getSheets();
}

Reference<css::table::XCellRange> cells(const Reference<css::sheet::XSpreadsheet>& sheet, const Area& area) {
    return sheet->getCellRangeByPosition(static_cast<sal_Int32>(area.column), static_cast<sal_Int32>(area.row),
                                         static_cast<sal_Int32>(area.last_column()), static_cast<sal_Int32>(area.last_row()));
}

css::table::CellRangeAddress address_of(const Area& area, sal_Int16 sheet_index) {
    css::table::CellRangeAddress address;
    address.Sheet = sheet_index;
    address.StartColumn = static_cast<sal_Int32>(area.column);
    address.StartRow = static_cast<sal_Int32>(area.row);
    address.EndColumn = static_cast<sal_Int32>(area.last_column());
    address.EndRow = static_cast<sal_Int32>(area.last_row());
    return address;
}

std::string hex_colour(std::uint32_t colour) {
    char text[8];
    std::snprintf(text, sizeof text, "#%06x", static_cast<unsigned>(colour));
    return text;
}

// The number format keys of the document, added once each.
class NumberFormats {
public:
    explicit NumberFormats(const Reference<css::frame::XModel>& model)
        : formats_(Reference<css::util::XNumberFormatsSupplier>(model, UNO_QUERY_THROW)->getNumberFormats()) {}
    sal_Int32 key(const char* code) {
        const auto found = keys_.find(code);
        if (found != keys_.end()) return found->second;
        const css::lang::Locale english("en", "US", "");
        sal_Int32 key = formats_->queryKey(OUString::createFromAscii(code), english, false);
        if (key == -1) key = formats_->addNew(OUString::createFromAscii(code), english);
        keys_[code] = key;
        return key;
    }

private:
    Reference<css::util::XNumberFormats> formats_;
    std::map<std::string, sal_Int32> keys_;
};

void set(const Reference<css::beans::XPropertySet>& properties, const char* name, const Any& value) {
    properties->setPropertyValue(OUString::createFromAscii(name), value);
}

// The cell properties of a look, set in one call (one pass over the cells' row heights).
void apply_look(const Reference<css::beans::XPropertySet>& target, Look look, NumberFormats& formats) {
    std::vector<OUString> names;
    std::vector<Any> values;
    auto set_ = [&](const char* name, const Any& value) {
        names.push_back(OUString::createFromAscii(name));
        values.push_back(value);
    };
    const float bold = css::awt::FontWeight::BOLD;
    auto wrap = [&] { set_("IsTextWrapped", Any(true)); };
    auto number = [&](const char* code) {
        set_("NumberFormat", Any(formats.key(code)));
        set_("HoriJustify", Any(css::table::CellHoriJustify_RIGHT));
    };
    switch (look) {
    case Look::title:
        set_("CharHeight", Any(14.0f));
        set_("CharWeight", Any(bold));
        break;
    case Look::note:
        set_("CharColor", Any(static_cast<sal_Int32>(palette::note_text)));
        set_("CharPosture", Any(css::awt::FontSlant_ITALIC));
        wrap();
        break;
    case Look::section:
        set_("CharHeight", Any(11.0f));
        set_("CharWeight", Any(bold));
        break;
    case Look::header: {
        css::table::BorderLine2 rule;
        rule.Color = static_cast<sal_Int32>(palette::heading_rule);
        rule.OuterLineWidth = 18;
        rule.LineWidth = 18;
        set_("CharWeight", Any(bold));
        set_("BottomBorder", Any(rule));
        set_("HoriJustify", Any(css::table::CellHoriJustify_CENTER));
        wrap();
        break;
    }
    case Look::label: break;
    case Look::text:
        set_("HoriJustify", Any(css::table::CellHoriJustify_LEFT));
        wrap();
        break;
    case Look::caution:
        set_("CharColor", Any(static_cast<sal_Int32>(palette::caution_text)));
        set_("HoriJustify", Any(css::table::CellHoriJustify_LEFT));
        wrap();
        break;
    case Look::input:
        set_("CellBackColor", Any(static_cast<sal_Int32>(palette::input_fill)));
        set_("CharWeight", Any(bold));
        number("0.0##");
        break;
    case Look::count: number("General"); break;
    case Look::decimal: number("0.00"); break;
    case Look::strength: number("0.000"); break;
    case Look::p_value: number("[<0.0001]0.0E+00;0.0000"); break;
    case Look::residual: number("+0.00;-0.00;0.00"); break;
    case Look::percent: number("0.0%"); break;
    case Look::whole: number("0"); break;
    case Look::key_low:
    case Look::key_middle:
    case Look::key_high: {
        const std::size_t point = look == Look::key_low ? 0 : look == Look::key_middle ? 1 : 2;
        set_("CellBackColor", Any(static_cast<sal_Int32>(palette::heat_map[point].colour)));
        set_("HoriJustify", Any(css::table::CellHoriJustify_CENTER));
        break;
    }
    }
    if (names.empty()) return;
    Reference<css::beans::XMultiPropertySet>(target, UNO_QUERY_THROW)
        ->setPropertyValues(Sequence<OUString>(names.data(), static_cast<sal_Int32>(names.size())),
                            Sequence<Any>(values.data(), static_cast<sal_Int32>(values.size())));
}

// A colour scale cannot be made through the API of LibreOffice 7.4 (its entries cannot be set),
// but one pasted from another document works: load a small flat ODS document that holds the scale
// over a block of the area's size, copy the block, paste it at the area's corner.
void paste_colour_scale(const Reference<css::uno::XComponentContext>& context,
                        const Reference<css::frame::XController>& controller,
                        const Reference<css::sheet::XSpreadsheet>& sheet, const Area& area) {
    std::string entries;
    for (const palette::ScalePoint& point : palette::heat_map)
        entries += "<calcext:color-scale-entry calcext:value=\"" + std::to_string(point.value) +
                   "\" calcext:type=\"number\" calcext:color=\"" + hex_colour(point.colour) + "\"/>";
    const std::string end = cell_address(area.rows - 1, area.columns - 1);
    const std::string xml =
        "<?xml version=\"1.0\" encoding=\"UTF-8\"?>"
        "<office:document xmlns:office=\"urn:oasis:names:tc:opendocument:xmlns:office:1.0\" "
        "xmlns:table=\"urn:oasis:names:tc:opendocument:xmlns:table:1.0\" "
        "xmlns:calcext=\"urn:org:documentfoundation:names:experimental:calc:xmlns:calcext:1.0\" office:version=\"1.3\" "
        "office:mimetype=\"application/vnd.oasis.opendocument.spreadsheet\"><office:body><office:spreadsheet>"
        "<table:table table:name=\"S\"><table:table-row table:number-rows-repeated=\"" +
        std::to_string(area.rows) + "\"><table:table-cell table:number-columns-repeated=\"" +
        std::to_string(area.columns) +
        "\"/></table:table-row><calcext:conditional-formats><calcext:conditional-format "
        "calcext:target-range-address=\"S.A1:S." + end + "\"><calcext:color-scale>" + entries +
        "</calcext:color-scale></calcext:conditional-format></calcext:conditional-formats></table:table>"
        "</office:spreadsheet></office:body></office:document>";
    Sequence<sal_Int8> bytes(static_cast<sal_Int32>(xml.size()));
    std::copy(xml.begin(), xml.end(), bytes.getArray());

    Sequence<css::beans::PropertyValue> arguments(3);
    arguments.getArray()[0].Name = "InputStream";
    arguments.getArray()[0].Value <<= css::io::SequenceInputStream::createStreamFromSequence(context, bytes);
    arguments.getArray()[1].Name = "FilterName";
    arguments.getArray()[1].Value <<= OUString("OpenDocument Spreadsheet Flat XML");
    arguments.getArray()[2].Name = "Hidden";
    arguments.getArray()[2].Value <<= true;
    Reference<css::frame::XComponentLoader> loader(css::frame::Desktop::create(context), UNO_QUERY_THROW);
    Reference<css::lang::XComponent> scratch =
        loader->loadComponentFromURL("private:stream", "_blank", 0, arguments);
    Reference<css::util::XCloseable> closer(scratch, UNO_QUERY);
    try {
        Reference<css::frame::XModel> model(scratch, UNO_QUERY_THROW);
        Reference<css::frame::XController> scratch_view = model->getCurrentController();
        Reference<css::sheet::XSpreadsheetDocument> document(model, UNO_QUERY_THROW);
        Reference<css::sheet::XSpreadsheet> source(
            Reference<css::container::XIndexAccess>(document->getSheets(), UNO_QUERY_THROW)->getByIndex(0),
            UNO_QUERY_THROW);
        Reference<css::view::XSelectionSupplier>(scratch_view, UNO_QUERY_THROW)
            ->select(Any(cells(source, Area{0, 0, area.rows, area.columns})));
        const Reference<css::datatransfer::XTransferable> block =
            Reference<css::datatransfer::XTransferableSupplier>(scratch_view, UNO_QUERY_THROW)->getTransferable();
        Reference<css::view::XSelectionSupplier>(controller, UNO_QUERY_THROW)
            ->select(Any(cells(sheet, Area{area.row, area.column})));
        Reference<css::datatransfer::XTransferableSupplier>(controller, UNO_QUERY_THROW)->insertTransferable(block);
    } catch (...) {
        if (closer.is()) closer->close(true);
        throw;
    }
    if (closer.is()) closer->close(true);
}

// A chart name not used in the document, nor earlier in this session: Calc keeps a listener per
// chart name after a sheet with a chart is removed (by Undo, the rollback, or the user), and
// a new chart of the same name then crashed the office (7.4.7, ScChartListener::StartListeningTo).
std::string unique_chart_name(const Reference<css::sheet::XSpreadsheets>& sheets) {
    static std::atomic<int> last{0};
    Reference<css::container::XIndexAccess> all(sheets, UNO_QUERY_THROW);
    for (int n = ++last;; n = ++last) {
        const OUString name = to_ou_string("Assoc chart " + std::to_string(n));
        bool used = false;
        for (sal_Int32 i = 0; i < all->getCount() && !used; ++i) {
            Reference<css::table::XTableChartsSupplier> charts(all->getByIndex(i), UNO_QUERY);
            used = charts.is() && charts->getCharts()->hasByName(name);
        }
        if (!used) return calc::to_utf8(name);
    }
}

void add_chart(const Reference<css::sheet::XSpreadsheets>& sheets, const Reference<css::sheet::XSpreadsheet>& sheet,
               const ChartPlan& plan, sal_Int16 sheet_index) {
    Reference<css::beans::XPropertySet> anchor(cells(sheet, plan.anchor), UNO_QUERY_THROW);
    css::awt::Point position;
    css::awt::Size size;
    anchor->getPropertyValue("Position") >>= position;
    anchor->getPropertyValue("Size") >>= size;
    Sequence<css::table::CellRangeAddress> ranges(1);
    ranges.getArray()[0] = address_of(plan.data, sheet_index);

    const OUString name = to_ou_string(unique_chart_name(sheets));
    Reference<css::table::XTableCharts> charts =
        Reference<css::table::XTableChartsSupplier>(sheet, UNO_QUERY_THROW)->getCharts();
    charts->addNewByName(name, css::awt::Rectangle(position.X, position.Y, size.Width, size.Height), ranges, true, true);
    Reference<css::chart::XChartDocument> chart(
        Reference<css::document::XEmbeddedObjectSupplier>(charts->getByName(name), UNO_QUERY_THROW)->getEmbeddedObject(),
        UNO_QUERY_THROW);
    Reference<css::chart::XDiagram> diagram(
        Reference<css::lang::XMultiServiceFactory>(chart, UNO_QUERY_THROW)->createInstance("com.sun.star.chart.BarDiagram"),
        UNO_QUERY_THROW);
    chart->setDiagram(diagram);
    Reference<css::beans::XPropertySet> look(diagram, UNO_QUERY_THROW);
    set(look, "Vertical", Any(true));  // bars across, one per row of the table
    set(look, "Stacked", Any(true));   // each row's shares side by side, adding up to 100%
    set(Reference<css::beans::XPropertySet>(chart, UNO_QUERY_THROW), "HasMainTitle", Any(true));
    set(Reference<css::beans::XPropertySet>(chart, UNO_QUERY_THROW), "HasLegend", Any(true));
    set(Reference<css::beans::XPropertySet>(chart->getTitle(), UNO_QUERY_THROW), "String", Any(to_ou_string(plan.title)));
    Reference<css::chart::XAxisYSupplier> axes(diagram, UNO_QUERY);
    if (axes.is()) {
        Reference<css::beans::XPropertySet> axis = axes->getYAxis();
        set(axis, "Min", Any(0.0));
        set(axis, "Max", Any(1.0));
    }
    for (std::size_t series = 0; series + 1 < plan.data.columns; ++series)
        set(diagram->getDataRowProperties(static_cast<sal_Int32>(series)), "Color",
            Any(static_cast<sal_Int32>(palette::chart_series[series % palette::chart_series.size()])));
}

void use_page_style(const Reference<css::frame::XModel>& model, const Reference<css::sheet::XSpreadsheet>& sheet) {
    Reference<css::container::XNameContainer> styles(
        Reference<css::style::XStyleFamiliesSupplier>(model, UNO_QUERY_THROW)->getStyleFamilies()->getByName("PageStyles"),
        UNO_QUERY_THROW);
    const OUString name = OUString::createFromAscii(page_style);
    if (!styles->hasByName(name)) {
        Reference<css::beans::XPropertySet> style(
            Reference<css::lang::XMultiServiceFactory>(model, UNO_QUERY_THROW)->createInstance("com.sun.star.style.PageStyle"),
            UNO_QUERY_THROW);
        styles->insertByName(name, Any(style));
        set(style, "ScaleToPagesX", Any(static_cast<sal_Int16>(1)));
        set(style, "ScaleToPagesY", Any(static_cast<sal_Int16>(0)));
    }
    set(Reference<css::beans::XPropertySet>(sheet, UNO_QUERY_THROW), "PageStyle", Any(name));
}

void write_plan(const Reference<css::uno::XComponentContext>& context, const Reference<css::frame::XController>& controller,
                const Reference<css::sheet::XSpreadsheets>& sheets, const Reference<css::sheet::XSpreadsheet>& sheet,
                sal_Int16 sheet_index, const SheetPlan& plan, Stopwatch& stopwatch, const std::string& fail_after) {
    // Phases as the stopwatch names them; the tests make one fail to see the sheet removed again.
    auto phase = [&](const char* name) {
        stopwatch.lap(name);
        if (fail_after == name)
            throw css::uno::RuntimeException(to_ou_string(std::string("a failure on purpose after ") + name));
    };
    for (const Area& area : plan.colour_scales()) paste_colour_scale(context, controller, sheet, area);
    phase("colour_scale");

    Reference<css::table::XColumnRowRange> lines(sheet, UNO_QUERY_THROW);
    // Column widths, one call for each run of neighbouring columns of one width.
    const auto& widths = plan.column_widths();
    for (auto run = widths.begin(); run != widths.end();) {
        auto end = std::next(run);
        while (end != widths.end() && end->first == std::prev(end)->first + 1 && end->second == run->second) ++end;
        const Area columns{0, run->first, 1, std::prev(end)->first - run->first + 1};
        set(Reference<css::beans::XPropertySet>(
                Reference<css::table::XColumnRowRange>(cells(sheet, columns), UNO_QUERY_THROW)->getColumns(),
                UNO_QUERY_THROW),
            "Width", Any(static_cast<sal_Int32>(run->second * 100)));
        run = end;
    }

    for (const Entry& entry : plan.entries()) {
        const Reference<css::table::XCellRange> range = cells(sheet, entry.area);
        switch (entry.kind) {
        case Entry::Kind::text:
            Reference<css::text::XText>(range->getCellByPosition(0, 0), UNO_QUERY_THROW)
                ->setString(to_ou_string(entry.content));
            break;
        case Entry::Kind::number: range->getCellByPosition(0, 0)->setValue(entry.number); break;
        case Entry::Kind::formula: range->getCellByPosition(0, 0)->setFormula(to_ou_string(entry.content)); break;
        case Entry::Kind::array_formula:
            Reference<css::sheet::XArrayFormulaRange>(range, UNO_QUERY_THROW)->setArrayFormula(to_ou_string(entry.content));
            break;
        case Entry::Kind::formula_block: {
            Sequence<Sequence<OUString>> rows(static_cast<sal_Int32>(entry.area.rows));
            for (std::size_t r = 0; r < entry.area.rows; ++r) {
                Sequence<OUString> row(static_cast<sal_Int32>(entry.area.columns));
                for (std::size_t c = 0; c < entry.area.columns; ++c)
                    row.getArray()[c] = to_ou_string(entry.block[r * entry.area.columns + c]);
                rows.getArray()[r] = row;
            }
            Reference<css::sheet::XCellRangeFormula>(range, UNO_QUERY_THROW)->setFormulaArray(rows);
            break;
        }
        }
    }

    phase("cells");
    // Every cell aligned at the top, for rows that a wrapped text makes taller.
    set(Reference<css::beans::XPropertySet>(cells(sheet, Area{0, 0, plan.rows_used(), plan.columns_used()}), UNO_QUERY_THROW),
        "VertJustify", Any(css::table::CellVertJustify2::TOP));
    // Each look once, over all its cells (a call per property and cell block would cost far more).
    NumberFormats formats(controller->getModel());
    std::map<Look, std::vector<css::table::CellRangeAddress>> by_look;
    for (const auto& [area, look] : plan.looks()) by_look[look].push_back(address_of(area, sheet_index));
    Reference<css::lang::XMultiServiceFactory> factory(controller->getModel(), UNO_QUERY_THROW);
    for (const auto& [look, addresses] : by_look) {
        Reference<css::sheet::XSheetCellRangeContainer> group(
            factory->createInstance("com.sun.star.sheet.SheetCellRanges"), UNO_QUERY_THROW);
        group->addRangeAddresses(Sequence<css::table::CellRangeAddress>(addresses.data(),
                                                                        static_cast<sal_Int32>(addresses.size())),
                                 false);
        apply_look(Reference<css::beans::XPropertySet>(group, UNO_QUERY_THROW), look, formats);
    }

    phase("looks");
    Reference<css::container::XIndexAccess> rows(lines->getRows(), UNO_QUERY_THROW);
    for (const auto& [area, line_count] : plan.merges()) {
        Reference<css::util::XMergeable>(cells(sheet, area), UNO_QUERY_THROW)->merge(true);
        if (line_count > 1) {
            Reference<css::beans::XPropertySet> row(rows->getByIndex(static_cast<sal_Int32>(area.row)), UNO_QUERY_THROW);
            set(row, "Height", Any(static_cast<sal_Int32>(line_count) * line_height + 100));
        }
    }

    for (const Area& rows : plan.collapsed_rows()) {
        const css::table::CellRangeAddress address = address_of(rows, sheet_index);
        Reference<css::sheet::XSheetOutline> outline(sheet, UNO_QUERY_THROW);
        outline->group(address, css::table::TableOrientation_ROWS);
        outline->hideDetail(address);
    }
    phase("merges");
    if (plan.chart()) add_chart(sheets, sheet, *plan.chart(), sheet_index);
    phase("chart");
    use_page_style(controller->getModel(), sheet);
}

// Calc keeps at most "Undo steps" actions (Tools ▸ Options ▸ LibreOffice ▸ Advanced ▸ Expert
// Configuration: org.openoffice.Office.Common/Undo/Steps, 100 by default), and in LibreOffice 7.4
// that limit also cuts the actions inside one undo context, oldest first: measured in a visible
// window, Undo of a sheet built with more recorded actions than that left the sheet and its first
// rows behind (and with 1,000 steps removed it whole). So while the sheet is written, the limit is
// raised to cover its actions, and set back afterwards (the document's undo list follows the
// setting at once; the setting is the user's and ends as it was).
class UndoRoom {
public:
    UndoRoom(const Reference<css::uno::XComponentContext>& context, sal_Int32 actions) {
        try {
            Sequence<Any> arguments(1);
            arguments.getArray()[0] <<= css::beans::NamedValue("nodepath", Any(OUString("/org.openoffice.Office.Common/Undo")));
            Reference<css::lang::XMultiServiceFactory> provider =
                css::configuration::theDefaultProvider::get(context);
            access_.set(provider->createInstanceWithArguments("com.sun.star.configuration.ConfigurationUpdateAccess",
                                                              arguments),
                        UNO_QUERY_THROW);
            access_->getByName("Steps") >>= previous_;
            if (previous_ >= actions) return;
            change(actions);
            raised_ = true;
        } catch (const css::uno::Exception&) {
            // Without the setting the sheet is still made; Undo may then leave part of it behind.
        }
    }
    ~UndoRoom() {
        try {
            if (raised_) change(previous_);
        } catch (...) {
        }
    }
    UndoRoom(const UndoRoom&) = delete;
    UndoRoom& operator=(const UndoRoom&) = delete;

private:
    void change(sal_Int32 steps) {
        Reference<css::container::XNameReplace>(access_, UNO_QUERY_THROW)->replaceByName("Steps", Any(steps));
        Reference<css::util::XChangesBatch>(access_, UNO_QUERY_THROW)->commitChanges();
    }

    Reference<css::container::XNameAccess> access_;
    sal_Int32 previous_ = 0;
    bool raised_ = false;
};

// About how many actions Calc records while the plan is written, with room to spare.
sal_Int32 recorded_actions(const SheetPlan& plan) {
    return static_cast<sal_Int32>(plan.entries().size() + 18 + 2 * plan.merges().size() + plan.column_widths().size() +
                                  2 * plan.collapsed_rows().size() + 20);
}

sal_Int16 index_of(const Reference<css::sheet::XSpreadsheets>& sheets, const OUString& name) {
    const Sequence<OUString> names = sheets->getElementNames();
    for (sal_Int32 i = 0; i < names.getLength(); ++i)
        if (names[i] == name) return static_cast<sal_Int16>(i);
    return static_cast<sal_Int16>(names.getLength());
}

}  // namespace

std::string unique_sheet_name(const Reference<css::frame::XController>& controller, const std::string& base) {
    const Reference<css::sheet::XSpreadsheets> sheets = sheets_of(controller);
    std::string name = base;
    for (int n = 2; sheets->hasByName(to_ou_string(name)); ++n) name = base + " (" + std::to_string(n) + ")";
    return name;
}

std::string write_sheet(const Reference<css::uno::XComponentContext>& context,
                        const Reference<css::frame::XController>& controller, const SheetPlan& plan,
                        const SheetPlacement& placement, Stopwatch& stopwatch) {
    const Reference<css::sheet::XSpreadsheets> sheets = sheets_of(controller);
    const std::string name = unique_sheet_name(controller, placement.base_name);
    const OUString sheet_name = to_ou_string(name);
    const sal_Int16 source = index_of(sheets, to_ou_string(placement.source_sheet));
    const sal_Int16 count = static_cast<sal_Int16>(sheets->getElementNames().getLength());
    const sal_Int16 position = placement.where == Placement::end             ? count
                               : placement.where == Placement::before_source ? source
                                                                             : static_cast<sal_Int16>(source + 1);

    Reference<css::document::XUndoManager> undo;
    Reference<css::document::XUndoManagerSupplier> undo_supplier(controller->getModel(), UNO_QUERY);
    if (undo_supplier.is()) undo = undo_supplier->getUndoManager();
    std::optional<UndoRoom> room;
    if (undo.is()) {
        room.emplace(context, recorded_actions(plan));
        undo->enterUndoContext(to_ou_string(command_title));
    }
    // While the sheet is written, the document neither repaints nor adjusts row heights cell by cell.
    const Reference<css::document::XActionLockable> lock(controller->getModel(), UNO_QUERY);
    if (lock.is()) lock->addActionLock();
    const AtExit unlock([&] {
        if (lock.is()) lock->removeActionLock();
    });
    bool inserted = false;
    try {
        sheets->insertNewByName(sheet_name, std::min(position, count));
        inserted = true;
        Reference<css::sheet::XSpreadsheet> sheet(sheets->getByName(sheet_name), UNO_QUERY_THROW);
        stopwatch.lap("insert");
        write_plan(context, controller, sheets, sheet, index_of(sheets, sheet_name), plan, stopwatch,
                   placement.fail_after);
        Reference<css::sheet::XSpreadsheetView>(controller, UNO_QUERY_THROW)->setActiveSheet(sheet);
        Reference<css::view::XSelectionSupplier>(controller, UNO_QUERY_THROW)->select(Any(cells(sheet, Area{0, 0})));
    } catch (...) {
        if (inserted) {
            try {
                if (sheets->hasByName(sheet_name)) sheets->removeByName(sheet_name);
            } catch (...) {
            }
        }
        if (undo.is()) {
            try {
                undo->leaveUndoContext();
            } catch (...) {
            }
        }
        throw;
    }
    if (undo.is()) undo->leaveUndoContext();
    stopwatch.lap("finish");
    return name;
}

}  // namespace assoc::command
