#!/usr/bin/env python3
"""Writes everything that follows from the function table (extension/functions.py):

  XAssocFunctions.idl   the UNO interface of the add-in
  assoc_functions.hpp   the add-in's UNO methods, the adapter declarations, option-word enums
  assoc_functions.cpp   the UNO method bodies, the wizard texts, the option words, ASSOC.CHECK's trials
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
# kind: (IDL type, UNO C++ parameter type)
ARGUMENT_KINDS = {
    "table": ("sequence< sequence< any > >", UNO_TABLE),
    "number": ("any", UNO_ANY),
    "option": ("any", UNO_ANY),
    "word": ("any", UNO_ANY),
}
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
        if any(a.kind == "option" for a in function.arguments) and not trial_ready(function):
            problems.append(f"{function.name}: a function with option words needs a table argument and "
                            "defaults for its other arguments, so that ASSOC.CHECK can try its words")
    option_names = [o.name for o in option_sets()]
    if len(set(option_names)) != len(option_names):
        problems.append("two different Options share a name: " + ", ".join(option_names))
    for options in option_sets():
        words = [w.word for w in options.words]
        if len(set(words)) != len(words) or any(w != w.lower() or not w for w in words):
            problems.append(f"Options {options.name}: words must be distinct, non-empty and lower case")
    if problems:
        sys.exit("extension/functions.py has problems:\n  " + "\n  ".join(problems))


def trial_ready(function):
    return (any(a.kind == "table" for a in function.arguments) and
            all(a.kind in ("table", "option", "word") or a.default is not None for a in function.arguments))


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
    if argument.options is not None:
        choices = "; ".join(f'"{w.word}"{" (default)" if i == 0 else ""}: {w.meaning}'
                            for i, w in enumerate(argument.options.words))
        text += f" {choices}. Upper or lower case."
    return text


def syntax(function):
    required = [a.kind == "table" or (a.kind == "number" and a.default is None) for a in function.arguments]
    parts = [a.name if needed else f"[{a.name}]" for a, needed in zip(function.arguments, required)]
    return f"{function.name}({'; '.join(parts)})"


# ---------------------------------------------------------------------------------------------
# Writers.

GENERATED = "Generated by extension/generate.py from extension/functions.py: do not edit."


def cpp_string(text):
    escaped = text.replace("\\", "\\\\").replace('"', '\\"')
    return f'"{escaped}"'


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
        parameters = ", ".join(f"[in] {ARGUMENT_KINDS[a.kind][0]} {a.name}" for a in function.arguments)
        lines += [f"    /** {function.name}: {function.description} */",
                  f"    any {function.method}({parameters})",
                  "        raises(com::sun::star::lang::IllegalArgumentException);",
                  ""]
    lines[-1] = "};"
    lines += ["", " ".join("};" for _ in MODULE), ""]
    return "\n".join(lines)


def adapter_parameter(argument):
    if argument.kind == "table":
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
             "#include <string>",
             "#include <vector>",
             "",
             "#include <com/sun/star/lang/XServiceInfo.hpp>",
             "#include <com/sun/star/lang/XServiceName.hpp>",
             "#include <com/sun/star/sheet/XAddIn.hpp>",
             "#include <cppuhelper/implbase4.hxx>",
             f"#include <{'/'.join(MODULE)}/{INTERFACE}.hpp>",
             "",
             '#include "assoc/cell.hpp"',
             '#include "assoc/matrix.hpp"',
             '#include "assoc/residuals.hpp"',
             '#include "assoc/statistics.hpp"',
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


def words_variable(options):
    return f"{options.name}_words"


def read_argument(argument):
    if argument.kind == "table":
        return f"to_cell_grid({argument.name})"
    if argument.kind == "number":
        fallback = "std::nullopt" if argument.default is None else repr(float(argument.default))
        return f'read_number({argument.name}, "{argument.name}", {fallback})'
    if argument.kind == "option":
        return f"{words_variable(argument.options)}.read({argument.name})"
    return f"to_cell({argument.name})"


def trial_arguments(function, option_argument, word):
    values = []
    for argument in function.arguments:
        if argument is option_argument:
            values.append(word.cpp if not option_argument.options.declare
                          else f"{option_argument.options.cpp_type}::{word.cpp}")
        elif argument.kind == "table":
            values.append("table")
        elif argument.kind == "option":
            first = argument.options.words[0]
            values.append(first.cpp if not argument.options.declare else f"{argument.options.cpp_type}::{first.cpp}")
        elif argument.kind == "word":
            values.append("assoc::Cell::blank()")
        else:
            values.append(repr(float(argument.default)))
    return ", ".join(values)


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
        prefix = f"{options.cpp_type}::" if options.declare else ""
        entries = ", ".join(f"{{{cpp_string(w.word)}, {prefix}{w.cpp}}}" for w in options.words)
        lines.append(f"const OptionWords<{options.cpp_type}> {words_variable(options)}({cpp_string(options.name)}, "
                     f"{{{entries}}});")
    lines += ["", "}  // namespace", "",
              "const std::vector<FunctionInfo>& function_catalog() {",
              "    static const std::vector<FunctionInfo> catalog = {"]
    for function in spec.FUNCTIONS:
        arguments = ", ".join(f"{{{cpp_string(a.name)}, {cpp_string(argument_description(a))}}}"
                              for a in function.arguments)
        lines.append(f"        {{{cpp_string(function.method)}, {cpp_string(function.name)},")
        lines.append(f"         {cpp_string(function.description)},")
        lines.append(f"         {{{arguments}}}}},")
    lines += ["    };", "    return catalog;", "}", "",
              "const std::vector<OptionTrial>& option_trials() {",
              "    static const std::vector<OptionTrial> trials = {"]
    for function in spec.FUNCTIONS:
        for argument in function.arguments:
            if argument.kind != "option":
                continue
            for word in argument.options.words:
                call = f"cell_functions::{function.method}({trial_arguments(function, argument, word)})"
                lines.append(f"        {{{cpp_string(word.word)}, {cpp_string(function.name)},")
                lines.append(f"         [](const assoc::CellGrid& table) {{ (void){call}; }}}},")
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
independence and its family. The sample workbook `samples/promotions.fods` (invented data of a
fictional company) uses each of them; `scripts/demo.sh` recalculates it and prints the results.

## Tables

The `table` argument is a range of counts, one row per category of one variable and one column per
category of the other.

- A first row whose cells are all text (or blank) is a header row; a first column of text below it is
  a header column. Labels are used in messages and in the conclusion of `ASSOC.REPORT`.
- Blank cells count as 0. A row or column of zeros is set aside: it takes no part in the test and is
  mentioned by `ASSOC.CHECK`. Array results keep the shape of the body and show 0 there.
- Text among the counts, negative counts, and a table with fewer than 2 rows or 2 columns holding
  counts are errors.

## Option words and errors

Option words may be written in upper or lower case; an omitted option takes the first word listed.
When a function cannot compute a result for its input it shows **Err:502**. `ASSOC.CHECK` with the
same table (and the same option word) explains why in plain words. An unknown option word is such an
error; its message lists the accepted words.

Functions that return several values (arrays, or one row of parts with the headline value first) are
entered as array formulas (Ctrl+Shift+Enter) over a range of the right size; entered in a single
cell they show their first value.

## Caution

A significant association is not proof of cause, nor of discrimination. Small samples can mislead in
either direction. For decisions about people, follow applicable law and policy and seek qualified
advice.

## Functions

| function | result |
|---|---|
"""


def docs():
    text = DOCS_INTRO.format(generated=GENERATED, count=len(spec.FUNCTIONS), category=spec.CATEGORY)
    for function in spec.FUNCTIONS:
        text += f"| [`{syntax(function)}`](#{function.name.lower().replace('.', '')}) | {function.result} |\n"
    for function in spec.FUNCTIONS:
        text += f"\n### {function.name}\n\n`{syntax(function)}`\n\n{function.description}\n\n"
        text += "| argument | what it expects |\n|---|---|\n"
        for argument in function.arguments:
            text += f"| `{argument.name}` | {argument_description(argument)} |\n"
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
