#pragma once
// The command's dialog (package/dialogs/AnalyseSelection.xdl) and the choices it remembers in the
// document (as custom document properties, File ▸ Properties ▸ Custom Properties).
#include <rtl/ustring.hxx>
#include <com/sun/star/frame/XFrame.hpp>
#include <com/sun/star/frame/XModel.hpp>
#include <com/sun/star/uno/Reference.hxx>
#include <com/sun/star/uno/XComponentContext.hpp>
#include <optional>
#include <string>
#include <vector>

#include "analysis_sheet.hpp"

namespace assoc::command {

using ::rtl::OUString;

// What the dialog shows besides the choices.
struct DialogFacts {
    std::string selection;  // what the selection was read as, or why it could not be read
    bool two_by_two = false;
    std::vector<std::string> rows;     // the two rows with counts (2×2 tables only)
    std::vector<std::string> columns;  // the columns with counts: the choices of the outcome of interest
};

struct DialogAnswer {
    CommandOptions options;
    bool remember = true;
};

// Shows the dialog over `frame`'s window; nothing when the user cancels. Throws on failure (a
// missing dialog file).
std::optional<DialogAnswer> ask_options(const css::uno::Reference<css::uno::XComponentContext>& context,
                                        const css::uno::Reference<css::frame::XFrame>& frame, const DialogFacts& facts,
                                        const CommandOptions& initial);

// The choices remembered in the document (defaults where none are). The outcome of interest and the
// group compared are kept by their labels and given back as positions only when `facts` has those
// labels (the group for 2×2 tables only).
CommandOptions remembered_options(const css::uno::Reference<css::frame::XModel>& model, const DialogFacts& facts);
void remember_options(const css::uno::Reference<css::frame::XModel>& model, const CommandOptions& options,
                      const DialogFacts& facts);

// Shows a message box over `frame`'s window (an error, or a warning).
void show_message(const css::uno::Reference<css::uno::XComponentContext>& context,
                  const css::uno::Reference<css::frame::XFrame>& frame, const std::string& message);

// Whether the frame has a window the user sees (hidden documents get no dialogs).
bool has_visible_window(const css::uno::Reference<css::frame::XFrame>& frame);

}  // namespace assoc::command
