#include "uno/options_dialog.hpp"

#include <algorithm>

#include <com/sun/star/awt/DialogProvider2.hpp>
#include <com/sun/star/awt/MessageBoxButtons.hpp>
#include <com/sun/star/awt/MessageBoxType.hpp>
#include <com/sun/star/awt/Toolkit.hpp>
#include <com/sun/star/awt/XCheckBox.hpp>
#include <com/sun/star/awt/XControl.hpp>
#include <com/sun/star/awt/XControlContainer.hpp>
#include <com/sun/star/awt/XDialog.hpp>
#include <com/sun/star/awt/XDialogProvider2.hpp>
#include <com/sun/star/awt/XFixedText.hpp>
#include <com/sun/star/awt/XListBox.hpp>
#include <com/sun/star/awt/XMessageBox.hpp>
#include <com/sun/star/awt/XMessageBoxFactory.hpp>
#include <com/sun/star/awt/XNumericField.hpp>
#include <com/sun/star/awt/XWindow2.hpp>
#include <com/sun/star/awt/XWindowPeer.hpp>
#include <com/sun/star/beans/NamedValue.hpp>
#include <com/sun/star/beans/PropertyAttribute.hpp>
#include <com/sun/star/beans/XPropertyContainer.hpp>
#include <com/sun/star/beans/XPropertySet.hpp>
#include <com/sun/star/beans/XPropertySetInfo.hpp>
#include <com/sun/star/deployment/PackageInformationProvider.hpp>
#include <com/sun/star/document/XDocumentProperties.hpp>
#include <com/sun/star/document/XDocumentPropertiesSupplier.hpp>
#include <com/sun/star/lang/XComponent.hpp>

#include "assoc/error.hpp"
#include "assoc/outcome_column.hpp"
#include "uno/uno_common.hpp"

namespace assoc::command {
namespace {

constexpr const char* extension_identifier = "org.assoc-project.calc";
constexpr const char* dialog_file = "/dialogs/AnalyseSelection.xdl";

// The names of the remembered choices among the document's custom properties.
constexpr const char* alpha_property = "Assoc significance level";
constexpr const char* placement_property = "Assoc new sheet";
constexpr const char* outcome_property = "Assoc outcome of interest";
constexpr const char* group_property = "Assoc group compared";

// The placements, in the order of the enum and of the dialog's list. (How to read the selection is
// not remembered: it belongs to one selection, not to the document.)
const char* const placement_words[] = {"after", "end", "before"};

template <class Interface>
Reference<Interface> control(const Reference<css::awt::XControlContainer>& dialog, const char* name) {
    Reference<css::awt::XControl> found = dialog->getControl(OUString::createFromAscii(name));
    if (!found.is()) throw Error(std::string("The dialog file lacks its control ") + name + ".");
    return Reference<Interface>(found, UNO_QUERY_THROW);
}

void fill(const Reference<css::awt::XListBox>& list, const std::vector<std::string>& items, std::size_t selected) {
    list->removeItems(0, list->getItemCount());
    for (std::size_t i = 0; i < items.size(); ++i)
        list->addItem(to_ou_string(items[i]), static_cast<sal_Int16>(i));
    if (!items.empty()) list->selectItemPos(static_cast<sal_Int16>(std::min(selected, items.size() - 1)), true);
}

std::size_t selected(const Reference<css::awt::XListBox>& list) {
    const sal_Int16 position = list->getSelectedItemPos();
    return position < 0 ? 0 : static_cast<std::size_t>(position);
}

Reference<css::beans::XPropertyContainer> custom_properties(const Reference<css::frame::XModel>& model) {
    Reference<css::document::XDocumentPropertiesSupplier> supplier(model, UNO_QUERY);
    if (!supplier.is()) return nullptr;
    return supplier->getDocumentProperties()->getUserDefinedProperties();
}

Any property(const Reference<css::beans::XPropertyContainer>& container, const char* name) {
    Reference<css::beans::XPropertySet> properties(container, UNO_QUERY);
    const OUString key = OUString::createFromAscii(name);
    if (!properties.is() || !properties->getPropertySetInfo()->hasPropertyByName(key)) return Any();
    return properties->getPropertyValue(key);
}

void set_property(const Reference<css::beans::XPropertyContainer>& container, const char* name, const Any& value) {
    Reference<css::beans::XPropertySet> properties(container, UNO_QUERY_THROW);
    const OUString key = OUString::createFromAscii(name);
    if (properties->getPropertySetInfo()->hasPropertyByName(key)) properties->setPropertyValue(key, value);
    else container->addProperty(key, css::beans::PropertyAttribute::REMOVABLE, value);
}

std::string text_property(const Reference<css::beans::XPropertyContainer>& container, const char* name) {
    OUString text;
    property(container, name) >>= text;
    return to_utf8(text);
}

template <std::size_t N>
std::size_t position_of(const char* const (&words)[N], const std::string& word) {
    for (std::size_t i = 0; i < N; ++i)
        if (word == words[i]) return i;
    return 0;
}

std::size_t position_of(const std::vector<std::string>& labels, const std::string& label) {
    for (std::size_t i = 0; i < labels.size(); ++i)
        if (labels[i] == label) return i;
    return 0;
}

// The outcome of interest offered when none is remembered: column 1, unless its label reads as the
// absence of another column's ("No" before "Yes", as a pivot table sorts them); then that column, which
// the dialog shows selected and the sheet names.
std::size_t offered_outcome(const std::vector<std::string>& columns) {
    for (std::size_t k = 1; k < columns.size(); ++k)
        if (assoc::names_the_absence_of(columns[0], columns[k])) return k;
    return 0;
}

}  // namespace

bool has_visible_window(const Reference<css::frame::XFrame>& frame) {
    if (!frame.is()) return false;
    Reference<css::awt::XWindow2> window(frame->getContainerWindow(), UNO_QUERY);
    return window.is() && window->isVisible();
}

void show_message(const Reference<css::uno::XComponentContext>& context, const Reference<css::frame::XFrame>& frame,
                  const std::string& message) {
    Reference<css::awt::XMessageBoxFactory> factory(css::awt::Toolkit::create(context), UNO_QUERY_THROW);
    Reference<css::awt::XWindowPeer> parent(frame->getContainerWindow(), UNO_QUERY_THROW);
    Reference<css::awt::XMessageBox> box =
        factory->createMessageBox(parent, css::awt::MessageBoxType_WARNINGBOX, css::awt::MessageBoxButtons::BUTTONS_OK,
                                  OUString::createFromAscii(command_title), to_ou_string(message));
    box->execute();
    Reference<css::lang::XComponent>(box, UNO_QUERY_THROW)->dispose();
}

std::optional<DialogAnswer> ask_options(const Reference<css::uno::XComponentContext>& context,
                                        const Reference<css::frame::XFrame>& frame, const DialogFacts& facts,
                                        const CommandOptions& initial) {
    const OUString location =
        css::deployment::PackageInformationProvider::get(context)->getPackageLocation(
            OUString::createFromAscii(extension_identifier));
    if (location.isEmpty()) throw Error("The dialog of the command was not found (is the Assoc extension installed?).");
    Sequence<css::beans::NamedValue> arguments(1);
    arguments.getArray()[0] = css::beans::NamedValue("ParentWindow", Any(frame->getContainerWindow()));
    Reference<css::awt::XDialog> dialog = css::awt::DialogProvider2::create(context)->createDialogWithArguments(
        location + OUString::createFromAscii(dialog_file), arguments);
    if (!dialog.is()) throw Error("The dialog of the command could not be opened.");
    const Reference<css::lang::XComponent> component(dialog, UNO_QUERY);
    const AtExit dispose([&] {
        if (component.is()) component->dispose();
    });

    Reference<css::awt::XControlContainer> controls(dialog, UNO_QUERY_THROW);
    control<css::awt::XFixedText>(controls, "SelectionText")->setText(to_ou_string(facts.selection));
    const auto read_as = control<css::awt::XListBox>(controls, "ReadAs");
    read_as->selectItemPos(static_cast<sal_Int16>(initial.read_as), true);
    control<css::awt::XNumericField>(controls, "Alpha")->setValue(initial.alpha);
    const auto outcome = control<css::awt::XListBox>(controls, "Outcome");
    const auto group = control<css::awt::XListBox>(controls, "Group");
    if (!facts.columns.empty()) fill(outcome, facts.columns, initial.outcome_column);
    else
        for (const char* name : {"Outcome", "OutcomeLabel"}) control<css::awt::XWindow>(controls, name)->setEnable(false);
    if (facts.two_by_two) fill(group, facts.rows, initial.group_row);
    else
        for (const char* name : {"Group", "GroupLabel"}) control<css::awt::XWindow>(controls, name)->setEnable(false);
    const auto placement = control<css::awt::XListBox>(controls, "Placement");
    placement->selectItemPos(static_cast<sal_Int16>(initial.placement), true);
    const auto remember = control<css::awt::XCheckBox>(controls, "Remember");
    remember->setState(1);

    if (dialog->execute() != 1) return std::nullopt;

    DialogAnswer answer;
    answer.options.read_as = static_cast<ReadAs>(std::min<std::size_t>(selected(read_as), 2));
    answer.options.alpha = control<css::awt::XNumericField>(controls, "Alpha")->getValue();
    answer.options.placement = static_cast<Placement>(std::min<std::size_t>(selected(placement), 2));
    if (!facts.columns.empty()) answer.options.outcome_column = std::min(selected(outcome), facts.columns.size() - 1);
    if (facts.two_by_two) answer.options.group_row = std::min<std::size_t>(selected(group), 1);
    answer.remember = remember->getState() == 1;
    return answer;
}

CommandOptions remembered_options(const Reference<css::frame::XModel>& model, const DialogFacts& facts) {
    CommandOptions options;
    options.outcome_column = offered_outcome(facts.columns);
    const Reference<css::beans::XPropertyContainer> stored = custom_properties(model);
    if (!stored.is()) return options;
    double alpha = 0;
    if ((property(stored, alpha_property) >>= alpha) && alpha > 0 && alpha < 1) options.alpha = alpha;
    options.placement = static_cast<Placement>(position_of(placement_words, text_property(stored, placement_property)));
    // A remembered outcome that this table has; otherwise the one offered above.
    const auto remembered = std::find(facts.columns.begin(), facts.columns.end(), text_property(stored, outcome_property));
    if (remembered != facts.columns.end())
        options.outcome_column = static_cast<std::size_t>(remembered - facts.columns.begin());
    if (facts.two_by_two) options.group_row = position_of(facts.rows, text_property(stored, group_property));
    return options;
}

void remember_options(const Reference<css::frame::XModel>& model, const CommandOptions& options,
                      const DialogFacts& facts) {
    const Reference<css::beans::XPropertyContainer> stored = custom_properties(model);
    if (!stored.is()) return;
    set_property(stored, alpha_property, Any(options.alpha));
    set_property(stored, placement_property,
                 Any(OUString::createFromAscii(placement_words[static_cast<std::size_t>(options.placement)])));
    if (options.outcome_column < facts.columns.size())
        set_property(stored, outcome_property, Any(to_ou_string(facts.columns[options.outcome_column])));
    if (facts.two_by_two && options.group_row < facts.rows.size())
        set_property(stored, group_property, Any(to_ou_string(facts.rows[options.group_row])));
}

}  // namespace assoc::command
