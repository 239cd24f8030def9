#pragma once
// The border between UNO and the core: Calc's values in, core types out, and back; and the one
// place where exceptions are mapped, so that only UNO exceptions leave the add-in.
#include <com/sun/star/lang/IllegalArgumentException.hpp>
#include <com/sun/star/uno/Any.hxx>
#include <com/sun/star/uno/RuntimeException.hpp>
#include <com/sun/star/uno/Sequence.hxx>
#include <exception>
#include <rtl/ustring.hxx>
#include <optional>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/coded_labels.hpp"
#include "assoc/error.hpp"
#include "assoc/matrix.hpp"

namespace assoc::calc {

using ::rtl::OUString;
using AnyTable = css::uno::Sequence<css::uno::Sequence<css::uno::Any>>;

OUString to_ou_string(const std::string& utf8);
std::string to_utf8(const OUString& text);

// The part of a range up to its last row and last column that hold a value (not blank, not an empty
// text); {0, 0} for a range of blanks.
struct RangeExtent {
    std::size_t rows = 0;
    std::size_t columns = 0;
};
RangeExtent used_extent(const AnyTable& range);

// A range as Calc passes it to an any[][] argument (numbers, texts, and blanks as empty texts),
// without its trailing blank rows and columns (see used_extent): whole-column and whole-row
// references read as the table they hold, and the size cap applies to what is left. A range of
// blanks keeps its shape unless it is larger than the cap (then it reads as empty).
CellGrid to_cell_grid(const AnyTable& range);
// A range of labels (raw records: one label per record) in dictionary form, read without a Cell per
// record: each distinct text is converted once, so a million records cost little more than Calc's
// hand-over. Blanks and empty texts get CodedLabels::blank; booleans are 1 or 0.
CodedLabels to_coded_labels(const AnyTable& range);
// An optional range (an `any` argument): omitted gives an empty grid, a range arrives as an
// any[][] array, and a single cell or value as itself (a 1×1 grid).
CellGrid to_optional_cell_grid(const css::uno::Any& argument);
// One value from Calc (a scalar argument or a cell of a range): omitted (void) and empty text
// are blank, booleans are 1 or 0.
Cell to_cell(const css::uno::Any& value);
// A number argument; omitted takes `fallback`, or is an error when there is none.
double read_number(const css::uno::Any& argument, const char* name, std::optional<double> fallback);

// Results. Each refuses a non-finite number with an assoc::Error rather than pass it on silently.
css::uno::Any to_any(double value);
css::uno::Any to_any(const std::vector<double>& row);
css::uno::Any to_any(const Matrix& values);
css::uno::Any to_any(const std::string& text);
css::uno::Any to_any(const CellGrid& cells);

// Runs one worksheet function. assoc::Error (a problem with the input) becomes
// IllegalArgumentException, shown as Err:502; anything else becomes RuntimeException.
template <class Compute>
css::uno::Any guarded(const char* function, Compute compute) {
    try {
        return compute();
    } catch (const Error& error) {
        throw css::lang::IllegalArgumentException(to_ou_string(std::string(function) + ": " + error.what()),
                                                  css::uno::Reference<css::uno::XInterface>(), 0);
    } catch (const std::exception& error) {
        throw css::uno::RuntimeException(
            to_ou_string(std::string(function) + ": unexpected failure: " + error.what()));
    } catch (...) {
        throw css::uno::RuntimeException(to_ou_string(std::string(function) + ": unexpected failure"));
    }
}

}  // namespace assoc::calc
