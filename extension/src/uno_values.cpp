#include "uno_values.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdint>
#include <memory>
#include <rtl/string.hxx>
#include <rtl/ustring.hxx>
#include <unordered_map>
#include <utility>

#include "assoc/count_table.hpp"
#include "assoc/format.hpp"

namespace assoc::calc {

using css::uno::Any;
using css::uno::Sequence;
using css::uno::TypeClass;

Cell to_cell(const Any& value) {
    switch (value.getValueTypeClass()) {
    case TypeClass::TypeClass_VOID: return Cell::blank();
    case TypeClass::TypeClass_STRING: {
        // Read in place (an Any of type string holds exactly an OUString): this runs once per cell
        // of every range, a million times for ASSOC.COUNTS on a million records.
        const OUString& text = *static_cast<const OUString*>(value.getValue());
        return text.isEmpty() ? Cell::blank() : Cell::text(to_utf8(text));
    }
    case TypeClass::TypeClass_BOOLEAN: return Cell::number(value.get<bool>() ? 1.0 : 0.0);
    default: {
        double number = 0.0;
        if (value >>= number) return Cell::number(number);  // double, and the integer types Calc never sends
        throw Error("a value of type " + to_utf8(value.getValueTypeName()) + " cannot be read as a cell");
    }
    }
}

namespace {

double finite(double value) {
    require(std::isfinite(value), "the result is not a finite number for this table");
    return value;
}

}  // namespace

OUString to_ou_string(const std::string& utf8) {
    return OUString(utf8.data(), static_cast<sal_Int32>(utf8.size()), RTL_TEXTENCODING_UTF8);
}

std::string to_utf8(const OUString& text) {
    // Most labels are ASCII: those are copied unit by unit, without the detour through an rtl::OString
    // (an allocation per cell); anything else goes through the office's converter.
    const std::size_t length = static_cast<std::size_t>(text.getLength());
    const sal_Unicode* units = text.getStr();
    std::string ascii(length, '\0');
    std::size_t i = 0;
    for (; i < length && units[i] < 0x80; ++i) ascii[i] = static_cast<char>(units[i]);
    if (i == length) return ascii;
    const rtl::OString bytes = rtl::OUStringToOString(text, RTL_TEXTENCODING_UTF8);
    return std::string(bytes.getStr(), static_cast<std::size_t>(bytes.getLength()));
}

namespace {

// Ranges of records repeat a few labels many times, and Calc hands equal texts over as one shared
// rtl_uString. So each string is converted once and later copies of it are copied as cells: a small
// direct-mapped cache keyed by the string's address (valid while the range, which holds the
// strings, is alive). A miss costs one conversion, as without the cache.
class TextCells {
public:
    const Cell& cell(const OUString& text) {
        Slot& slot = slots_[(reinterpret_cast<std::uintptr_t>(text.pData) >> 4) % slots_.size()];
        if (slot.text != text.pData) {
            slot.cell = text.isEmpty() ? Cell::blank() : Cell::text(to_utf8(text));
            slot.text = text.pData;
        }
        return slot.cell;
    }

private:
    struct Slot {
        const rtl_uString* text = nullptr;
        Cell cell;
    };
    std::array<Slot, 251> slots_;
};

}  // namespace

namespace {

bool is_blank_value(const Any& value) {
    switch (value.getValueTypeClass()) {
    case TypeClass::TypeClass_VOID: return true;
    case TypeClass::TypeClass_STRING: return static_cast<const OUString*>(value.getValue())->isEmpty();
    default: return false;
    }
}

}  // namespace

RangeExtent used_extent(const AnyTable& range) {
    RangeExtent extent;
    const sal_Int32 rows = range.getLength();
    for (sal_Int32 r = rows; r-- > 0;) {
        const Sequence<Any>& row = range[r];
        // Only columns beyond those already known to hold something need a look.
        for (sal_Int32 c = row.getLength(); c-- > static_cast<sal_Int32>(extent.columns);) {
            if (!is_blank_value(row[c])) {
                extent.columns = static_cast<std::size_t>(c) + 1;
                break;
            }
        }
        if (extent.rows == 0 && extent.columns > 0) extent.rows = static_cast<std::size_t>(r) + 1;
    }
    return extent;
}

CellGrid to_cell_grid(const AnyTable& range) {
    const std::size_t columns = range.getLength() == 0 ? 0 : static_cast<std::size_t>(range[0].getLength());
    for (const Sequence<Any>& row : range)
        require(static_cast<std::size_t>(row.getLength()) == columns, "the rows of the range have different lengths");
    // Trailing blank rows and columns are not part of the range: a whole-column reference (A:C) or a
    // range drawn generously below a growing table reads as the table it holds.
    RangeExtent used = used_extent(range);
    // A range of blanks keeps its shape (when it is not huge), so that messages speak of its blanks.
    const std::size_t all_rows = static_cast<std::size_t>(range.getLength());
    if (used.rows == 0 && columns > 0 && all_rows <= ReadOptions{}.max_body_cells / columns) used = {all_rows, columns};
    const std::size_t rows = used.rows;
    // The reader has its own cap on the body; this one keeps a huge range from being copied before
    // that check can run. A header row and column are allowed on top.
    const std::size_t cap = ReadOptions{}.max_body_cells;
    if (used.columns != 0 && rows > (cap + rows + used.columns) / used.columns)
        throw Error("the range holds " + format_count(static_cast<double>(rows) * static_cast<double>(used.columns)) +
                    " cells up to its last value; Assoc reads tables of at most " +
                    format_count(static_cast<double>(cap)) + " counts");
    CellGrid grid(rows, used.columns);
    grid.set_given_shape(all_rows, columns);  // a whole column keeps its height here (see CellGrid)
    // A table of counts holds few texts or none (its labels), and thousands of formulas may each
    // read one: the cache of converted texts is set up only when a text comes.
    std::unique_ptr<TextCells> texts;
    for (std::size_t r = 0; r < rows; ++r) {
        const Any* row = range[static_cast<sal_Int32>(r)].getConstArray();
        for (std::size_t c = 0; c < used.columns; ++c) {
            const Any& value = row[c];
            switch (value.getValueTypeClass()) {
            case TypeClass::TypeClass_DOUBLE: grid.at(r, c) = Cell::number(*static_cast<const double*>(value.getValue())); break;
            case TypeClass::TypeClass_STRING:
                if (!texts) texts = std::make_unique<TextCells>();
                grid.at(r, c) = texts->cell(*static_cast<const OUString*>(value.getValue()));
                break;
            default: grid.at(r, c) = to_cell(value);
            }
        }
    }
    return grid;
}

namespace {

// Gives each distinct label of a range its code. Calc hands equal texts over as one shared
// rtl_uString, so nearly every text is settled by its address: first in a small direct-mapped
// cache, then in a map of addresses (valid while the range, which holds the strings, is alive).
// A second rtl_uString with the same characters only adds a second spelling of the same level,
// which the core merges. Numbers are keyed by value.
class LabelCoder {
public:
    std::uint32_t code(const Any& value) {
        switch (value.getValueTypeClass()) {
        case TypeClass::TypeClass_VOID: return CodedLabels::blank;
        case TypeClass::TypeClass_STRING: return text_code(static_cast<const OUString*>(value.getValue())->pData);
        case TypeClass::TypeClass_BOOLEAN: return number_code(value.get<bool>() ? 1.0 : 0.0);
        default: return number_code(to_cell(value).as_number());  // to_cell refuses anything but numbers
        }
    }
    std::vector<Cell> take_spellings() { return std::move(spellings_); }

private:
    std::uint32_t text_code(rtl_uString* text) {
        if (text->length == 0) return CodedLabels::blank;
        Slot& slot = cache_[(reinterpret_cast<std::uintptr_t>(text) >> 4) % cache_.size()];
        if (slot.text == text) return slot.code;
        const auto [where, added] = by_text_.try_emplace(text, next_code());
        if (added) spellings_.push_back(Cell::text(to_utf8(OUString(text))));
        slot = {text, where->second};
        return where->second;
    }
    std::uint32_t number_code(double number) {
        const auto [where, added] = by_number_.try_emplace(number + 0.0, next_code());  // -0 and 0 alike
        if (added) spellings_.push_back(Cell::number(number + 0.0));
        return where->second;
    }
    std::uint32_t next_code() const {
        require(spellings_.size() < CodedLabels::blank - 1, "the range holds too many different labels");
        return static_cast<std::uint32_t>(spellings_.size());
    }

    struct Slot {
        const rtl_uString* text = nullptr;
        std::uint32_t code = 0;
    };
    std::array<Slot, 1021> cache_{};
    std::unordered_map<const rtl_uString*, std::uint32_t> by_text_;
    std::unordered_map<double, std::uint32_t> by_number_;
    std::vector<Cell> spellings_;
};

}  // namespace

CodedLabels to_coded_labels(const AnyTable& range) {
    CodedLabels coded;
    coded.rows = static_cast<std::size_t>(range.getLength());
    coded.columns = coded.rows == 0 ? 0 : static_cast<std::size_t>(range[0].getLength());
    coded.codes.reserve(coded.rows * coded.columns);
    LabelCoder coder;
    for (const Sequence<Any>& row : range) {
        require(static_cast<std::size_t>(row.getLength()) == coded.columns, "the rows of the range have different lengths");
        for (const Any& value : row) coded.codes.push_back(coder.code(value));
    }
    coded.spellings = coder.take_spellings();
    coded.whole_line = is_whole_line(coded.rows, coded.columns);
    return coded;
}

CellGrid to_optional_cell_grid(const Any& argument) {
    if (!argument.hasValue()) return CellGrid();
    AnyTable range;
    if (argument >>= range) return to_cell_grid(range);
    CellGrid single(1, 1);
    single.at(0, 0) = to_cell(argument);
    return single;
}

double read_number(const Any& argument, const char* name, std::optional<double> fallback) {
    const Cell cell = to_cell(argument);
    if (cell.is_blank() && fallback) return *fallback;
    require(!cell.is_blank(), std::string("the argument ") + name + " is missing");
    require(cell.is_number(), std::string("the argument ") + name + " must be a number, not " + cell.describe());
    return cell.as_number();
}

Any to_any(double value) { return Any(finite(value)); }

Any to_any(const std::vector<double>& row) {
    Sequence<Sequence<Any>> result(1);
    result.getArray()[0].realloc(static_cast<sal_Int32>(row.size()));
    Any* cells = result.getArray()[0].getArray();
    for (std::size_t c = 0; c < row.size(); ++c) cells[c] <<= finite(row[c]);
    return Any(result);
}

Any to_any(const Matrix& values) {
    Sequence<Sequence<double>> result(static_cast<sal_Int32>(values.rows()));
    Sequence<double>* rows = result.getArray();
    for (std::size_t r = 0; r < values.rows(); ++r) {
        rows[r].realloc(static_cast<sal_Int32>(values.columns()));
        double* cells = rows[r].getArray();
        for (std::size_t c = 0; c < values.columns(); ++c) cells[c] = finite(values(r, c));
    }
    return Any(result);
}

Any to_any(const std::string& text) { return Any(to_ou_string(text)); }

Any to_any(const CellGrid& cells) {
    // Calc 7.4 turns the texts of a string[][] result into texts of its shared string pool, as typed
    // texts are, so `=`, EXACT, MATCH, VLOOKUP and COUNTIF find them. An any[][] result goes through
    // ScSequenceToMatrix::CreateMixedMatrix, which wraps each text without the pool: it shows right
    // but compares unequal to the same typed text (those comparisons match the pool's pointers). So a
    // result of texts only (ASSOC.LEVELS of text labels) goes as string[][]; one that mixes numbers
    // and texts has no such route (see the guide's workbook habits).
    const bool all_text = std::none_of(cells.begin(), cells.end(), [](const Cell& cell) { return cell.is_number(); });
    if (all_text) {
        Sequence<Sequence<OUString>> texts(static_cast<sal_Int32>(cells.rows()));
        Sequence<OUString>* rows = texts.getArray();
        for (std::size_t r = 0; r < cells.rows(); ++r) {
            rows[r].realloc(static_cast<sal_Int32>(cells.columns()));
            OUString* out = rows[r].getArray();
            for (std::size_t c = 0; c < cells.columns(); ++c) out[c] = to_ou_string(cells.at(r, c).as_text());
        }
        return Any(texts);
    }
    Sequence<Sequence<Any>> result(static_cast<sal_Int32>(cells.rows()));
    Sequence<Any>* rows = result.getArray();
    for (std::size_t r = 0; r < cells.rows(); ++r) {
        rows[r].realloc(static_cast<sal_Int32>(cells.columns()));
        Any* out = rows[r].getArray();
        for (std::size_t c = 0; c < cells.columns(); ++c) {
            const Cell& cell = cells.at(r, c);
            if (cell.is_number()) out[c] <<= finite(cell.as_number());
            // A blank stays void, an empty element of the array: `=X1=""` is then true, as for an empty
            // cell (an empty text outside the pool would compare unequal to "").
            else if (!cell.is_blank()) out[c] <<= to_ou_string(cell.as_text());
        }
    }
    return Any(result);
}

}  // namespace assoc::calc
