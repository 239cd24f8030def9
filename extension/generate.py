#!/usr/bin/env python3
"""Writes everything that follows from the function table (extension/functions.py):

  XAssocFunctions.idl   the UNO interface of the add-in
  assoc_functions.hpp   the add-in's UNO methods, the adapter declarations, option-word enums
  assoc_functions.cpp   the UNO method bodies, the wizard texts, the option words, ASSOC.CHECK's trials
                        (every function run on one range, with its defaults or with one of its words)
  functions.md          the function reference

Usage:
  generate.py --out DIR   write all four into DIR (the build runs this)
  generate.py --check     fail if the committed copies idl/XAssocFunctions.idl and docs/functions.md
                          differ from what the table gives (a CTest test runs this)
  generate.py --refresh   rewrite those committed copies
"""

import argparse
import pathlib
import sys

HERE = pathlib.Path(__file__).resolve().parent
SOURCE_ROOT = HERE.parent
sys.path.insert(0, str(HERE))
import functions as spec  # noqa: E402  (the table sits beside this script)

MODULE = ["org", "assocproject", "calc"]
INTERFACE = "XAssocFunctions"
COMMITTED_COPIES = {"XAssocFunctions.idl": SOURCE_ROOT / "idl" / "XAssocFunctions.idl",
                    "functions.md": SOURCE_ROOT / "docs" / "functions.md"}
REFRESH_HINT = ("Refresh them with:  python3 extension/generate.py --refresh   "
                "(or: cmake --build build --target assoc_refresh_copies), then commit them.")

UNO_TABLE = "const css::uno::Sequence<css::uno::Sequence<css::uno::Any>>&"
UNO_ANY = "const css::uno::Any&"
# kind: (IDL type, UNO C++ parameter type). Calc makes only `any` arguments optional.
ARGUMENT_KINDS = {
    "table": ("sequence< sequence< any > >", UNO_TABLE),
    "range": ("sequence< sequence< any > >", UNO_TABLE),
    "labels": ("sequence< sequence< any > >", UNO_TABLE),  # records: read in dictionary form (coded_labels.hpp)
    "optional_range": ("any", UNO_ANY),
    "number": ("any", UNO_ANY),
    "option": ("any", UNO_ANY),
    "word": ("any", UNO_ANY),
    "value": ("any", UNO_ANY),
}
REQUIRED_RANGE_KINDS = ("table", "range", "labels")
RESULT_TYPES = {"number": "double", "row": "std::vector<double>", "array": "assoc::Matrix",
                "text": "std::string", "cells": "assoc::CellGrid"}


# ---------------------------------------------------------------------------------------------
# Checks on the table, so that a mistake there fails the build with a message, not the office.

def option_sets():
    """The distinct Options objects, in order of first use."""
    seen = []
    for function in spec.FUNCTIONS:
        for argument in function.arguments:
            if argument.options is not None and all(argument.options is not o for o in seen):
                seen.append(argument.options)
    return seen


def validate():
    problems = []
    names = set()
    for function in spec.FUNCTIONS:
        if not function.name.startswith("ASSOC."):
            problems.append(f"{function.name}: display names start with ASSOC.")
        if function.method in names or not function.method.isidentifier():
            problems.append(f"{function.name}: method {function.method!r} is not a new identifier")
        names.add(function.method)
        if function.returns not in RESULT_TYPES:
            problems.append(f"{function.name}: unknown result kind {function.returns!r}")
        for argument in function.arguments:
            if argument.kind not in ARGUMENT_KINDS:
                problems.append(f"{function.name}: argument {argument.name}: unknown kind {argument.kind!r}")
            if (argument.kind == "option") != (argument.options is not None):
                problems.append(f"{function.name}: argument {argument.name}: option arguments and only they "
                                "name their Options")
        if tried_by_check(function) and ranges_of(function) and any(
                a.kind == "number" and a.default is None for a in function.arguments):
            problems.append(f"{function.name}: a function that takes a range needs defaults for its numbers, so "
                            "that ASSOC.CHECK can try it on a range")
        if tried_by_check(function) and not ranges_of(function) and any(
                a.kind != "number" for a in function.arguments):
            problems.append(f"{function.name}: a function without a range may take numbers only (ASSOC.CHECK "
                            "reads them from the cells of its range)")
    keys = [o.key for o in option_sets()]
    if len(set(keys)) != len(keys) or not all(k.isidentifier() for k in keys):
        problems.append("the keys of the Options must be distinct identifiers: " + ", ".join(keys))
    display_names = {f.name for f in spec.FUNCTIONS}
    for options in option_sets():
        if any(w.same_as and w.same_as not in display_names for w in options.words):
            problems.append(f"Options {options.key}: same_as names a function that does not exist")
        words = [w.word for w in options.words]
        if len(set(words)) != len(words) or any(w != w.lower() or not w for w in words):
            problems.append(f"Options {options.key}: words must be distinct, non-empty and lower case")
        if any(w in words or w != w.lower() for w in options.refused):
            problems.append(f"Options {options.key}: refused words must be lower case and not among its words")
        if (options.omitted is None) != (not options.omitted_meaning):
            problems.append(f"Options {options.key}: `omitted` and `omitted_meaning` go together")
    if problems:
        sys.exit("extension/functions.py has problems:\n  " + "\n  ".join(problems))


def ranges_of(function):
    """The required range arguments (kinds table and range), in order."""
    return [a for a in function.arguments if a.kind in REQUIRED_RANGE_KINDS]


def tried_by_check(function):
    """ASSOC.CHECK tries every function except those with a free word argument (ASSOC.CHECK itself)."""
    return not any(a.kind == "word" for a in function.arguments)


def tests_independence(function):
    """Whether the function's first argument is a table of counts for the tests of independence."""
    return bool(function.arguments) and function.arguments[0].kind == "table"


# ---------------------------------------------------------------------------------------------
# Texts shared by the wizard and the docs.

def all_words():
    words = []
    for options in option_sets():
        for word in options.words:
            if word.word not in words:
                words.append(word.word)
    return words


def quoted_list(words, last="or"):
    quoted = [f'"{w}"' for w in words]
    return quoted[0] if len(quoted) == 1 else ", ".join(quoted[:-1]) + f" {last} " + quoted[-1]


def argument_description(argument):
    text = argument.description.replace("{all_words}", quoted_list(all_words()))
    options = argument.options
    if options is not None:
        marked_default = options.omitted is None
        choices = "; ".join(f'"{w.word}"{" (default)" if i == 0 and marked_default else ""}: {w.meaning}'
                            for i, w in enumerate(options.words))
        text += f" {choices}."
        if not marked_default:
            text += f" Omitted: {options.omitted_meaning}."
        text += " Upper or lower case."
    return text


def syntax(function):
    required = [a.kind in REQUIRED_RANGE_KINDS or (a.kind == "number" and a.default is None)
                for a in function.arguments]
    parts = [a.name if needed else f"[{a.name}]" for a, needed in zip(function.arguments, required)]
    return f"{function.name}({'; '.join(parts)})"


# ---------------------------------------------------------------------------------------------
# Writers.

GENERATED = "Generated by extension/generate.py from extension/functions.py: do not edit."


def cpp_string(text):
    escaped = text.replace("\\", "\\\\").replace('"', '\\"')
    return f'"{escaped}"'


def idl_identifier(name):
    """unoidl-write refuses underscores in identifiers: row_labels becomes rowLabels (the wizard keeps row_labels)."""
    head, *rest = name.split("_")
    return head + "".join(part[:1].upper() + part[1:] for part in rest)


def idl():
    lines = [f"// {GENERATED}",
             "#include <com/sun/star/uno/XInterface.idl>",
             "#include <com/sun/star/lang/IllegalArgumentException.idl>",
             "",
             " ".join(f"module {m} {{" for m in MODULE),
             "",
             "/** The ASSOC.* worksheet functions of the Assoc add-in for LibreOffice Calc.",
             "    Input problems raise IllegalArgumentException (the cell shows Err:502). */",
             f"interface {INTERFACE} : com::sun::star::uno::XInterface",
             "{"]
    for function in spec.FUNCTIONS:
        parameters = ", ".join(f"[in] {ARGUMENT_KINDS[a.kind][0]} {idl_identifier(a.name)}" for a in function.arguments)
        lines += [f"    /** {function.name}: {function.description} */",
                  f"    any {function.method}({parameters})",
                  "        raises(com::sun::star::lang::IllegalArgumentException);",
                  ""]
    lines[-1] = "};"
    lines += ["", " ".join("};" for _ in MODULE), ""]
    return "\n".join(lines)


def adapter_parameter(argument):
    if argument.kind == "labels":
        return f"const assoc::CodedLabels& {argument.name}"
    if argument.kind in ("table", "range", "optional_range"):
        return f"const assoc::CellGrid& {argument.name}"
    if argument.kind == "number":
        return f"double {argument.name}"
    if argument.kind == "option":
        return f"{argument.options.cpp_type} {argument.name}"
    return f"const assoc::Cell& {argument.name}"


def uno_signature(function, qualified):
    parameters = ", ".join(f"{ARGUMENT_KINDS[a.kind][1]} {a.name}" for a in function.arguments)
    name = f"AssocFunctions::{function.method}" if qualified else function.method
    return f"css::uno::Any SAL_CALL {name}({parameters})"


def header():
    uno_interface = "::".join(MODULE) + "::" + INTERFACE
    lines = [f"// {GENERATED}",
             "#pragma once",
             "#include <optional>",
             "#include <string>",
             "#include <vector>",
             "",
             "#include <com/sun/star/lang/XServiceInfo.hpp>",
             "#include <com/sun/star/lang/XServiceName.hpp>",
             "#include <com/sun/star/sheet/XAddIn.hpp>",
             "#include <cppuhelper/implbase4.hxx>",
             f"#include <{'/'.join(MODULE)}/{INTERFACE}.hpp>",
             "",
             *[f'#include "{header}"' for header in core_headers()],
             '#include "function_catalog.hpp"',
             "",
             "namespace assoc::calc {",
             ""]
    for options in option_sets():
        if options.declare:
            lines.append(f"// The {options.name} words, as ASSOC functions receive them.")
            lines.append(f"enum class {options.cpp_type} {{ {', '.join(w.cpp for w in options.words)} }};")
            lines.append("")
    lines += ["// One adapter per worksheet function (written in cell_functions.cpp): converted arguments",
              "// in, a core call, a result out. Throw assoc::Error for anything the user must fix.",
              "namespace cell_functions {"]
    for function in spec.FUNCTIONS:
        parameters = ", ".join(adapter_parameter(a) for a in function.arguments)
        lines.append(f"{RESULT_TYPES[function.returns]} {function.method}({parameters});")
    lines += ["}  // namespace cell_functions",
              "",
              "// The UNO side of the worksheet functions: each method converts its arguments, calls its",
              "// adapter and converts the result, with every exception mapped to a UNO one.",
              "// The add-in class (addin.cpp) adds XAddIn, XServiceName and XServiceInfo.",
              f"class AssocFunctions : public cppu::WeakImplHelper4<{uno_interface}, css::sheet::XAddIn,",
              "                                                    css::lang::XServiceName, css::lang::XServiceInfo> {",
              "public:"]
    for function in spec.FUNCTIONS:
        lines.append(f"    {uno_signature(function, qualified=False)} override;")
    lines += ["};", "", "}  // namespace assoc::calc", ""]
    return "\n".join(lines)


def core_headers():
    """The core headers the generated header needs: cells and matrices, and the option types."""
    headers = {"assoc/cell.hpp", "assoc/coded_labels.hpp", "assoc/matrix.hpp"}
    headers.update(o.include for o in option_sets() if o.include)
    return sorted(headers)


def words_variable(options):
    return f"{options.key}_words"


def word_value(options, word):
    return word.cpp if not options.declare else f"{options.cpp_type}::{word.cpp}"


def omitted_value(options):
    return options.omitted if options.omitted is not None else word_value(options, options.words[0])


def read_argument(argument):
    if argument.kind == "labels":
        return f"to_coded_labels({argument.name})"
    if argument.kind in REQUIRED_RANGE_KINDS:
        return f"to_cell_grid({argument.name})"
    if argument.kind == "optional_range":
        return f"to_optional_cell_grid({argument.name})"
    if argument.kind == "number":
        fallback = "std::nullopt" if argument.default is None else repr(float(argument.default))
        return f'read_number({argument.name}, "{argument.name}", {fallback})'
    if argument.kind == "option" and argument.options.from_range:
        return f"{words_variable(argument.options)}.read({argument.name}, {argument.options.from_range})"
    if argument.kind == "option":
        return f"{words_variable(argument.options)}.read({argument.name})"
    return f"to_cell({argument.name})"


def trial_body(function, option_argument=None, word=None):
    """C++ statements that run the adapter on ASSOC.CHECK's one range: a function with one range gets the
    whole range, one with several gets a column each, one without ranges reads its numbers from the
    cells; everything else takes its default (or `word` for `option_argument`)."""
    ranges = ranges_of(function)
    optional = [a for a in function.arguments if a.kind == "optional_range"]
    numbers = [a for a in function.arguments if a.kind == "number"]
    # An option that also takes a range (the order of ASSOC.LEVELS): its list may come as the last column.
    listed = next((a for a in function.arguments if a.kind == "option" and a.options.from_range), None)
    name = cpp_string(function.name)
    statements = []
    split = len(ranges) > 1 or (ranges and listed is not None)
    if split:
        # Side by side: one column per range, then (when given) one per optional range (COUNTS' weights),
        # then the list of an option that takes one.
        extra = len(optional) + (1 if listed is not None else 0)
        statements.append(f"const auto parts = split_columns(range, {len(ranges)}, {extra}, {name});")
    if not ranges:
        required = sum(1 for a in numbers if a.default is None)
        names = ", ".join(cpp_string(a.name) for a in numbers)
        statements.append(f"const auto numbers = numbers_in_range(range, {required}, {{{names}}}, {name});")
    values = []
    for argument in function.arguments:
        if argument.kind in REQUIRED_RANGE_KINDS:
            part = f"parts[{ranges.index(argument)}]" if split else "range"
            values.append(f"assoc::code_labels({part})" if argument.kind == "labels" else part)
        elif argument.kind == "optional_range" and split:
            values.append(f"parts[{len(ranges) + optional.index(argument)}]")
        elif argument.kind == "optional_range":
            values.append("assoc::CellGrid()")
        elif argument.kind == "number" and ranges:
            values.append(repr(float(argument.default)))
        elif argument.kind == "number":
            i = numbers.index(argument)
            values.append(f"numbers[{i}]" if argument.default is None
                          else f"(numbers.size() > {i} ? numbers[{i}] : {float(argument.default)!r})")
        elif argument.kind == "option" and argument is option_argument:
            values.append(word_value(argument.options, word))
        elif argument.kind == "option" and argument is listed and split:
            order = f"parts[{len(ranges) + len(optional)}]"
            values.append(f"({order}.empty() ? {omitted_value(argument.options)} : "
                          f"{argument.options.from_range}({order}))")
        elif argument.kind == "option":
            values.append(omitted_value(argument.options))
        else:
            values.append("assoc::Cell::blank()")
    # Through to_any, as the UNO method does, so that a result that is not a finite number fails here too.
    statements.append(f"(void)to_any(cell_functions::{function.method}({', '.join(values)}));")
    return " ".join(statements)


def trials():
    """One entry per function with its defaults, one per option word it accepts, one per word it refuses."""
    entries = []
    for function in spec.FUNCTIONS:
        if not tried_by_check(function):
            continue
        independence = "true" if tests_independence(function) else "false"
        name = cpp_string(function.name)
        lambda_of = lambda body: f"[](const assoc::CellGrid& range) {{ {body} }}"  # noqa: E731
        entries.append(f"{{{name}, nullptr, {independence}, {name}, nullptr,\n"
                       f"         {lambda_of(trial_body(function))}}}")
        for argument in function.arguments:
            if argument.kind != "option":
                continue
            options = argument.options
            for i, word in enumerate(options.words):
                same = (name if i == 0 and options.omitted is None
                        else cpp_string(word.same_as) if word.same_as else "nullptr")
                entries.append(f"{{{name}, {cpp_string(word.word)}, {independence}, {same}, nullptr,\n"
                               f"         {lambda_of(trial_body(function, argument, word))}}}")
            for word, reason in options.refused.items():
                entries.append(f"{{{name}, {cpp_string(word)}, {independence}, nullptr, {cpp_string(reason)}, nullptr}}")
    return entries


def source():
    lines = [f"// {GENERATED}",
             '#include "assoc_functions.hpp"',
             "",
             "#include <optional>",
             "",
             '#include "option_words.hpp"',
             '#include "uno_values.hpp"',
             "",
             "namespace assoc::calc {",
             "namespace {",
             ""]
    for options in option_sets():
        entries = ", ".join(f"{{{cpp_string(w.word)}, {word_value(options, w)}}}" for w in options.words)
        refused = ", ".join(f"{{{cpp_string(w)}, {cpp_string(r)}}}" for w, r in options.refused.items())
        lines.append(f"const OptionWords<{options.cpp_type}> {words_variable(options)}(")
        lines.append(f"    {cpp_string(options.name)}, {{{entries}}},")
        lines.append(f"    {omitted_value(options)}, {{{refused}}});")
    lines += ["", "}  // namespace", "",
              f"const char* const function_category = {cpp_string(spec.CATEGORY)};",
              "",
              "const std::vector<FunctionInfo>& function_catalog() {",
              "    static const std::vector<FunctionInfo> catalog = {"]
    for function in spec.FUNCTIONS:
        arguments = ", ".join(f"{{{cpp_string(a.name)}, {cpp_string(argument_description(a))}}}"
                              for a in function.arguments)
        lines.append(f"        {{{cpp_string(function.method)}, {cpp_string(function.name)},")
        lines.append(f"         {cpp_string(function.description)},")
        lines.append(f"         {{{arguments}}}}},")
    lines += ["    };", "    return catalog;", "}", "",
              "const std::vector<FunctionTrial>& function_trials() {",
              "    static const std::vector<FunctionTrial> trials = {"]
    for entry in trials():
        lines.append(f"        {entry},")
    lines += ["    };", "    return trials;", "}", ""]
    for function in spec.FUNCTIONS:
        lines.append(uno_signature(function, qualified=True) + " {")
        lines.append(f"    return guarded({cpp_string(function.name)}, [&] {{")
        for argument in function.arguments:
            lines.append(f"        const auto {argument.name}_value = {read_argument(argument)};")
        call_arguments = ", ".join(f"{a.name}_value" for a in function.arguments)
        lines.append(f"        return to_any(cell_functions::{function.method}({call_arguments}));")
        lines += ["    });", "}", ""]
    lines += ["}  // namespace assoc::calc", ""]
    return "\n".join(lines)


DOCS_INTRO = """\
# Assoc worksheet functions

<!-- {generated} Refresh with: python3 extension/generate.py --refresh -->

Assoc adds {count} worksheet functions to LibreOffice Calc, all in the Function Wizard's
**{category}** category. They test whether two classifications of the same people or items (for
example department and promotion outcome) are associated, with Pearson's chi-squared test of
independence and its family. The workbooks in `samples/` (invented data of a fictional company)
show them at work; `scripts/demo.sh` recalculates `samples/promotions.fods` and prints the results.
The [user guide](guide.md) has a worked example of each.

## Tables

The `table` argument is a range of counts, one row per category of one variable and one column per
category of the other.

- A first row whose cells are all text (or blank) is a header row; a first column of text below it is
  a header column. Labels are used in messages and in the conclusion of `ASSOC.REPORT`.
- Blank cells count as 0. A row or column of zeros is set aside: it takes no part in the test and is
  mentioned by `ASSOC.CHECK`. Array results keep the shape of the body and show 0 there.
- Totals are never tested as counts. A row or column labelled as a total ("Total", "Grand total",
  "Subtotal", "Sum", "All", "Summe", "Gesamt", "Somme", "Totale", "Totaal", "Totalt", … in any case) is
  set aside like an empty one. A first or last row or column without a label that holds the sum of the
  others is refused (label it "Total", or leave it out); one labelled as data is kept and makes the
  verdict of `ASSOC.CHECK` "Doubtful".
- Percentages and shares are not counts: rows (or columns) that each add up to 100 or to 1, or a table
  that adds up to 100 or 1, with entries that are not whole numbers, are refused. Counts that are not
  whole numbers (weighted data) are never called "Sound".
- Labels are read without the spaces at their start and end. Messages count rows and columns of the
  range as selected, a header row or column being number 1, and name them by their labels where the
  range has labels.
- Text among the counts, negative counts, and a table with fewer than 2 rows or 2 columns holding
  counts are errors.
- Trailing blank rows and columns are not part of a range: a whole-column reference (`A:E`), a
  whole-row one (`1:6`) or a range drawn below a growing table reads as the table it holds, and
  array results have the shape of that table.

Functions that take other ranges (records for `ASSOC.COUNTS` and `ASSOC.LEVELS`, strata, paired or
ordered tables, a row of counts) say below what they expect; where they read counts, headers and
blanks follow the same rules.

## Option words and errors

Option words may be written in upper or lower case; an omitted option takes the first word listed
(where the choice depends on the table, the function says so).
When a function cannot compute a result for its input it shows **Err:502**. `ASSOC.CHECK` with the
same table (and the same option word) explains why in plain words. An unknown option word is such an
error; its message names the nearest accepted words.

Functions that return several values (arrays, or one row of parts with the headline value first) are
entered as array formulas (Ctrl+Shift+Enter) over a range of the right size; entered in a single
cell they show their first value.

Over a range larger than the result, Calc fills the extra cells with #N/A, except in one case: it
repeats a result of one row down every row of the range, a result of one column across every column,
and a single value in every cell. So `ASSOC.STATISTIC` entered down three cells of a column shows the
statistic three times, not its three parts: enter it across a row, or wrap it in `TRANSPOSE`. This is
how Calc spreads every array result; an add-in cannot change it.

The conventions that decide results where methods differ between tools (the tie margin of the exact
test, the continuity corrections, Bowker's test with empty pairs, the order of texts, the interval of
Cramér's V) are stated under each function below and gathered, with their reasons, in the
[user guide](guide.md#conventions-what-exactly-is-computed).

## Caution

A significant association is not proof of cause, nor of discrimination. Small samples can mislead in
either direction. For decisions about people, follow applicable law and policy and seek qualified
advice.

## Functions

| function | result |
|---|---|
"""


def cell(text):
    """Text inside a Markdown table cell: a | would end the cell."""
    return text.replace("|", "\\|")


def docs():
    text = DOCS_INTRO.format(generated=GENERATED, count=len(spec.FUNCTIONS), category=spec.CATEGORY)
    for function in spec.FUNCTIONS:
        text += f"| [`{syntax(function)}`](#{function.name.lower().replace('.', '')}) | {cell(function.result)} |\n"
    for function in spec.FUNCTIONS:
        text += f"\n### {function.name}\n\n`{syntax(function)}`\n\n{function.description}\n\n"
        text += "| argument | what it expects |\n|---|---|\n"
        for argument in function.arguments:
            text += f"| `{argument.name}` | {cell(argument_description(argument))} |\n"
        text += f"\n**Result:** {function.result}.\n"
        for note in function.notes:
            text += f"\n{note}\n"
        if function.example:
            text += f"\nExample: `{function.example}`\n"
    return text


def outputs():
    return {"XAssocFunctions.idl": idl(), "assoc_functions.hpp": header(),
            "assoc_functions.cpp": source(), "functions.md": docs()}


def write_if_changed(path, text):
    path.parent.mkdir(parents=True, exist_ok=True)
    if not path.exists() or path.read_text(encoding="utf-8") != text:
        path.write_text(text, encoding="utf-8")


def main():
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    mode = parser.add_mutually_exclusive_group(required=True)
    mode.add_argument("--out", type=pathlib.Path, help="write the generated files into this folder")
    mode.add_argument("--check", action="store_true", help="check the committed copies")
    mode.add_argument("--refresh", action="store_true", help="rewrite the committed copies")
    options = parser.parse_args()
    validate()
    generated = outputs()
    if options.out:
        options.out.mkdir(parents=True, exist_ok=True)
        for name, text in generated.items():
            (options.out / name).write_text(text, encoding="utf-8")
    elif options.refresh:
        for name, path in COMMITTED_COPIES.items():
            write_if_changed(path, generated[name])
            print(f"wrote {path.relative_to(SOURCE_ROOT)}")
    else:
        stale = [str(path.relative_to(SOURCE_ROOT)) for name, path in COMMITTED_COPIES.items()
                 if not path.exists() or path.read_text(encoding="utf-8") != generated[name]]
        if stale:
            sys.exit("Out of date with extension/functions.py: " + ", ".join(stale) + ".\n" + REFRESH_HINT)
        print("idl/XAssocFunctions.idl and docs/functions.md match extension/functions.py.")


if __name__ == "__main__":
    main()
