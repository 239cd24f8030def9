// The protocol handler: the framework creates one per frame (initialize gets the frame), asks it
// for a dispatch of org.assocproject.calc:AnalyseSelection, keeps the toolbar button and menu
// entry enabled while a range is selected (status listeners, told on every selection change),
// and dispatches. Nothing but a DispatchResultEvent leaves dispatchWithNotification: every
// failure becomes State FAILURE with the message in Result (and a message box in the GUI).
#include "uno/analyse_command.hpp"

#include <com/sun/star/beans/PropertyValue.hpp>
#include <com/sun/star/frame/DispatchResultEvent.hpp>
#include <com/sun/star/frame/DispatchResultState.hpp>
#include <com/sun/star/frame/FeatureStateEvent.hpp>
#include <com/sun/star/frame/XController.hpp>
#include <com/sun/star/frame/XDispatchProvider.hpp>
#include <com/sun/star/frame/XDispatchResultListener.hpp>
#include <com/sun/star/frame/XFrame.hpp>
#include <com/sun/star/frame/XModel.hpp>
#include <com/sun/star/frame/XNotifyingDispatch.hpp>
#include <com/sun/star/frame/XStatusListener.hpp>
#include <com/sun/star/lang/XInitialization.hpp>
#include <com/sun/star/lang/XServiceInfo.hpp>
#include <com/sun/star/view/XSelectionChangeListener.hpp>
#include <com/sun/star/view/XSelectionSupplier.hpp>
#include <cppuhelper/implbase5.hxx>
#include <cppuhelper/supportsservice.hxx>
#include <cppuhelper/weakref.hxx>
#include <cmath>
#include <mutex>
#include <optional>
#include <vector>

#include "analysis_sheet.hpp"
#include "assoc/error.hpp"
#include "uno/options_dialog.hpp"
#include "uno/selection.hpp"
#include "uno/sheet_writer.hpp"
#include "office_collation.hpp"
#include "uno/uno_common.hpp"

namespace assoc::command {
namespace {

constexpr const char* implementation_name = "org.assocproject.calc.AnalyseCommand";
constexpr const char* protocol = "org.assocproject.calc:";
constexpr const char* command_path = "AnalyseSelection";

// The dispatch arguments (all optional). NoDialog and Alpha are the documented ones; the others
// answer the dialog's other questions, so that scripts and tests can ask for everything.
struct Arguments {
    bool no_dialog = false;
    std::optional<double> alpha;
    std::optional<ReadAs> read_as;
    std::optional<Placement> placement;
    std::optional<std::size_t> outcome_column;  // from 1 in the argument (plan_analysis_sheet checks the end)
    std::optional<std::size_t> group_row;       // 1 or 2 in the argument
    std::string fail_after;  // FailAfter: for the tests of the rollback only (see SheetPlacement)
};

std::string text_argument(const css::beans::PropertyValue& argument) {
    OUString text;
    if (!(argument.Value >>= text))
        throw Error("The dispatch argument " + to_utf8(argument.Name) + " must be a text.");
    return to_utf8(text);
}

double number_argument(const css::beans::PropertyValue& argument) {
    double value = 0;
    if (!(argument.Value >>= value))
        throw Error("The dispatch argument " + to_utf8(argument.Name) + " must be a number.");
    return value;
}

std::size_t column_number(const css::beans::PropertyValue& argument) {
    const double value = number_argument(argument);
    if (!(value >= 1 && value <= 1e6 && value == std::floor(value)))
        throw Error("The dispatch argument " + to_utf8(argument.Name) + " must be a whole number from 1.");
    return static_cast<std::size_t>(value) - 1;
}

std::size_t first_or_second(const css::beans::PropertyValue& argument) {
    const double value = number_argument(argument);
    if (value != 1 && value != 2)
        throw Error("The dispatch argument " + to_utf8(argument.Name) + " must be 1 or 2.");
    return static_cast<std::size_t>(value) - 1;
}

Arguments read_arguments(const Sequence<css::beans::PropertyValue>& arguments) {
    Arguments out;
    for (const css::beans::PropertyValue& argument : arguments) {
        const std::string name = to_utf8(argument.Name);
        if (name == "NoDialog") {
            bool value = false;
            if (!(argument.Value >>= value)) throw Error("The dispatch argument NoDialog must be true or false.");
            out.no_dialog = value;
        } else if (name == "Alpha") {
            out.alpha = number_argument(argument);
        } else if (name == "ReadAs") {
            out.read_as = parse_read_as(text_argument(argument));
        } else if (name == "Placement") {
            const std::string word = text_argument(argument);
            if (word == "after") out.placement = Placement::after_source;
            else if (word == "end") out.placement = Placement::end;
            else if (word == "before") out.placement = Placement::before_source;
            else throw Error("The dispatch argument Placement must be \"after\", \"end\" or \"before\", not \"" + word + "\".");
        } else if (name == "OutcomeColumn") {
            out.outcome_column = column_number(argument);
        } else if (name == "GroupRow") {
            out.group_row = first_or_second(argument);
        } else if (name == "FailAfter") {
            out.fail_after = text_argument(argument);
        }
        // Other arguments (the framework adds some, such as Referer) are not ours.
    }
    return out;
}

void apply(const Arguments& arguments, CommandOptions& options) {
    if (arguments.alpha) options.alpha = *arguments.alpha;
    if (arguments.read_as) options.read_as = *arguments.read_as;
    if (arguments.placement) options.placement = *arguments.placement;
    if (arguments.outcome_column) options.outcome_column = *arguments.outcome_column;
    if (arguments.group_row) options.group_row = *arguments.group_row;
}

DialogFacts facts_of(const std::optional<Reading>& reading, const std::string& problem) {
    DialogFacts facts;
    if (!reading) {
        facts.selection = problem;
        return facts;
    }
    std::string description = reading->description;
    if (!description.empty()) description.front() = static_cast<char>(std::toupper(description.front()));
    facts.selection = description + ".";
    const CountTable& table = reading->table;
    facts.two_by_two = table.is_two_by_two();
    for (std::size_t c : table.kept_columns()) facts.columns.push_back(reading->column_names[c]);
    if (facts.two_by_two)
        for (std::size_t r : table.kept_rows()) facts.rows.push_back(reading->row_names[r]);
    return facts;
}

// Whether the dialog's "Read the selection as" could cure a selection that was not read: two
// columns, side by side or apart.
bool two_columns(const SelectionContent& content) {
    std::size_t columns = 0;
    for (const RangeRef& range : content.ranges) columns += range.columns;
    return columns == 2;
}

class Cancelled {};

class AnalyseCommand final
    : public cppu::WeakImplHelper5<css::frame::XDispatchProvider, css::frame::XNotifyingDispatch,
                                   css::lang::XInitialization, css::lang::XServiceInfo,
                                   css::view::XSelectionChangeListener> {
public:
    explicit AnalyseCommand(const Reference<css::uno::XComponentContext>& context) : context_(context) {}

    // XInitialization: the framework passes the frame first.
    void SAL_CALL initialize(const Sequence<Any>& arguments) override {
        for (const Any& argument : arguments) {
            Reference<css::frame::XFrame> frame(argument, UNO_QUERY);
            if (frame.is()) {
                frame_ = frame;
                return;
            }
        }
    }

    // XDispatchProvider
    Reference<css::frame::XDispatch> SAL_CALL queryDispatch(const css::util::URL& url, const OUString&,
                                                            sal_Int32) override {
        try {
            if (url.Protocol != OUString::createFromAscii(protocol) || url.Path != OUString::createFromAscii(command_path))
                return nullptr;
            // Calc documents only.
            Reference<css::frame::XFrame> frame(frame_);
            if (!frame.is() || !frame->getController().is()) return nullptr;
            Reference<css::lang::XServiceInfo> model(frame->getController()->getModel(), UNO_QUERY);
            if (!model.is() || !model->supportsService("com.sun.star.sheet.SpreadsheetDocument")) return nullptr;
            return this;
        } catch (...) {
            return nullptr;
        }
    }
    Sequence<Reference<css::frame::XDispatch>> SAL_CALL
    queryDispatches(const Sequence<css::frame::DispatchDescriptor>& requests) override {
        Sequence<Reference<css::frame::XDispatch>> dispatches(requests.getLength());
        for (sal_Int32 i = 0; i < requests.getLength(); ++i)
            dispatches.getArray()[i] =
                queryDispatch(requests[i].FeatureURL, requests[i].FrameName, requests[i].SearchFlags);
        return dispatches;
    }

    // XDispatch, XNotifyingDispatch
    void SAL_CALL dispatch(const css::util::URL& url, const Sequence<css::beans::PropertyValue>& arguments) override {
        dispatchWithNotification(url, arguments, nullptr);
    }
    void SAL_CALL dispatchWithNotification(const css::util::URL&, const Sequence<css::beans::PropertyValue>& arguments,
                                           const Reference<css::frame::XDispatchResultListener>& listener) override {
        sal_Int16 state = css::frame::DispatchResultState::FAILURE;
        std::string result;
        bool gui = false;
        try {
            result = run(arguments, gui);
            state = css::frame::DispatchResultState::SUCCESS;
        } catch (const Cancelled&) {
            result = "Cancelled: no sheet was made.";
            gui = false;
        } catch (const Error& error) {
            result = error.what();
        } catch (const css::uno::Exception& error) {
            result = "The sheet could not be made: " + to_utf8(error.Message);
        } catch (const std::exception& error) {
            result = std::string("The sheet could not be made: ") + error.what();
        } catch (...) {
            result = "The sheet could not be made (an unexpected failure).";
        }
        if (state != css::frame::DispatchResultState::SUCCESS && gui) {
            try {
                show_message(context_, Reference<css::frame::XFrame>(frame_), result);
            } catch (...) {
            }
        }
        if (listener.is()) {
            try {
                listener->dispatchFinished(css::frame::DispatchResultEvent(
                    static_cast<cppu::OWeakObject*>(this), state, Any(to_ou_string(result))));
            } catch (...) {
            }
        }
    }

    void SAL_CALL addStatusListener(const Reference<css::frame::XStatusListener>& listener,
                                    const css::util::URL& url) override {
        if (!listener.is()) return;
        bool first = false;
        {
            std::lock_guard<std::mutex> lock(mutex_);
            first = listeners_.empty();
            listeners_.push_back({listener, url});
        }
        try {
            if (first) watch_selection(true);
            tell(listener, url, usable());
        } catch (...) {
        }
    }
    void SAL_CALL removeStatusListener(const Reference<css::frame::XStatusListener>& listener,
                                       const css::util::URL&) override {
        bool last = false;
        {
            std::lock_guard<std::mutex> lock(mutex_);
            for (auto it = listeners_.begin(); it != listeners_.end();)
                it = it->listener == listener ? listeners_.erase(it) : it + 1;
            last = listeners_.empty();
        }
        if (last) {
            try {
                watch_selection(false);
            } catch (...) {
            }
        }
    }

    // XSelectionChangeListener
    void SAL_CALL selectionChanged(const css::lang::EventObject&) override {
        try {
            const bool enabled = usable();
            for (const Listener& entry : listeners()) tell(entry.listener, entry.url, enabled);
        } catch (...) {
        }
    }
    void SAL_CALL disposing(const css::lang::EventObject&) override {
        std::lock_guard<std::mutex> lock(mutex_);
        watched_.clear();
        listeners_.clear();
    }

    // XServiceInfo
    OUString SAL_CALL getImplementationName() override { return analyse_command_implementation_name(); }
    sal_Bool SAL_CALL supportsService(const OUString& name) override { return cppu::supportsService(this, name); }
    Sequence<OUString> SAL_CALL getSupportedServiceNames() override { return analyse_command_service_names(); }

private:
    struct Listener {
        Reference<css::frame::XStatusListener> listener;
        css::util::URL url;
    };

    std::vector<Listener> listeners() {
        std::lock_guard<std::mutex> lock(mutex_);
        return listeners_;
    }

    Reference<css::frame::XController> controller() const {
        Reference<css::frame::XFrame> frame(frame_);
        return frame.is() ? frame->getController() : nullptr;
    }

    bool usable() const {
        const Reference<css::frame::XController> view = controller();
        return view.is() && selection_is_usable(view);
    }

    void tell(const Reference<css::frame::XStatusListener>& listener, const css::util::URL& url, bool enabled) {
        listener->statusChanged(
            css::frame::FeatureStateEvent(static_cast<cppu::OWeakObject*>(this), url, OUString(), enabled, false, Any()));
    }

    void watch_selection(bool on) {
        if (on) {
            Reference<css::view::XSelectionSupplier> supplier(controller(), UNO_QUERY);
            if (!supplier.is()) return;
            supplier->addSelectionChangeListener(this);
            std::lock_guard<std::mutex> lock(mutex_);
            watched_ = supplier;
        } else {
            Reference<css::view::XSelectionSupplier> supplier;
            {
                std::lock_guard<std::mutex> lock(mutex_);
                supplier = watched_;
                watched_.clear();
            }
            if (supplier.is()) supplier->removeSelectionChangeListener(this);
        }
    }

    // Makes the sheet and returns its name; throws Error (or a UNO exception) on failure, and
    // Cancelled when the user cancels the dialog. `gui` tells the caller whether to show failures.
    std::string run(const Sequence<css::beans::PropertyValue>& dispatch_arguments, bool& gui) {
        const Reference<css::frame::XFrame> frame(frame_);
        if (!frame.is()) throw Error("The command has no window to work in.");
        const Reference<css::frame::XController> view = frame->getController();
        const Reference<css::frame::XModel> model = view.is() ? view->getModel() : nullptr;
        if (!model.is()) throw Error("The command has no document to work in.");
        const Arguments arguments = read_arguments(dispatch_arguments);
        gui = !arguments.no_dialog && has_visible_window(frame);

        Stopwatch stopwatch;
        const SelectionContent content = read_selection_content(view);
        stopwatch.lap("read");
        CommandOptions options = remembered_options(model, DialogFacts{});
        apply(arguments, options);
        std::optional<Reading> reading;
        std::string problem;
        try {
            reading = read_selection(content, calc::office_collation(), options.read_as);
        } catch (const Error& error) {
            problem = error.what();
        }
        DialogFacts facts = facts_of(reading, problem);
        {
            const CommandOptions remembered = remembered_options(model, facts);
            options.outcome_column = remembered.outcome_column;
            options.group_row = remembered.group_row;
            apply(arguments, options);
        }

        if (gui) {
            if (!reading && !two_columns(content)) throw Error(problem);
            const std::optional<DialogAnswer> answer = ask_options(context_, frame, facts, options);
            if (!answer) throw Cancelled();
            const ReadAs read_before = options.read_as;
            options = answer->options;
            if (!reading || options.read_as != read_before) {
                reading = read_selection(content, calc::office_collation(), options.read_as);
                facts = facts_of(reading, "");
                // The dialog offered the columns and rows of the other reading.
                options.outcome_column = options.group_row = 0;
            }
            if (answer->remember) remember_options(model, options, facts);
        } else if (!reading) {
            throw Error(problem);
        }
        check_options(options);
        if (!reading->table.is_two_by_two()) options.group_row = 0;

        stopwatch.lap("dialog");
        const bool exact_live = exact_test_is_quick(reading->table);
        stopwatch.lap("exact_probe");
        const SheetPlan plan = plan_analysis_sheet(*reading, options, exact_live);
        stopwatch.lap("plan");
        const std::string source_sheet =
            reading->table_source ? reading->table_source->range.sheet : reading->record_source->row_labels.sheet;
        const std::string name =
            write_sheet(context_, view, plan, SheetPlacement{sheet_base_name(*reading), options.placement, source_sheet, arguments.fail_after},
                        stopwatch);
        stopwatch.print();
        return name;
    }

    Reference<css::uno::XComponentContext> context_;
    css::uno::WeakReference<css::frame::XFrame> frame_;
    std::mutex mutex_;
    std::vector<Listener> listeners_;
    Reference<css::view::XSelectionSupplier> watched_;
};

}  // namespace

Reference<css::uno::XInterface> SAL_CALL create_analyse_command(const Reference<css::uno::XComponentContext>& context) {
    calc::set_office_context(context);  // records' labels are put in order by the office's collator
    return static_cast<cppu::OWeakObject*>(new AnalyseCommand(context));
}

OUString SAL_CALL analyse_command_implementation_name() { return OUString::createFromAscii(implementation_name); }

Sequence<OUString> SAL_CALL analyse_command_service_names() {
    Sequence<OUString> names(1);
    names.getArray()[0] = "com.sun.star.frame.ProtocolHandler";
    return names;
}

}  // namespace assoc::command
