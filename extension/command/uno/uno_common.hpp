#pragma once
// What the command's UNO files share: the names they use from the UNO runtime and the add-in's
// text conversions, and the command's title (message boxes, the undo step).
#include <com/sun/star/uno/Any.hxx>
#include <com/sun/star/uno/Reference.hxx>
#include <com/sun/star/uno/Sequence.hxx>
#include <rtl/ustring.hxx>
#include <utility>

#include "uno_values.hpp"

namespace assoc::command {

using ::rtl::OUString;
using css::uno::Any;
using css::uno::Reference;
using css::uno::Sequence;
using css::uno::UNO_QUERY;
using css::uno::UNO_QUERY_THROW;
using calc::to_ou_string;
using calc::to_utf8;

// Runs `action` when the scope ends, however it ends. What the action throws is swallowed: a
// clean-up that fails must not replace the failure being reported, nor leave the command.
template <class Action>
class AtExit {
public:
    explicit AtExit(Action action) : action_(std::move(action)) {}
    ~AtExit() {
        try {
            action_();
        } catch (...) {
        }
    }
    AtExit(const AtExit&) = delete;
    AtExit& operator=(const AtExit&) = delete;

private:
    Action action_;
};

// The command's name where the user reads it outside the menu.
constexpr const char* command_title = "Assoc: analyse selection";

}  // namespace assoc::command
