"""The one table of Assoc's worksheet functions.

Everything about a function that a user or the UNO layer sees comes from here: its name, its
arguments, the Function Wizard texts, the option words, and what it returns. extension/generate.py
turns this table into the UNO interface (IDL), the C++ glue of the add-in (UNO methods, wizard
texts, option-word parsing) and the reference docs/functions.md.

To add a function: add a Function below, then write its adapter (same name as `method`) in
extension/src/cell_functions.cpp. The generator declares the adapter for you, with the C++ types
that the argument and result kinds give:

  argument kind  UNO type                    adapter receives
  table          sequence< sequence< any > >  const assoc::CellGrid&   (blank cells are blank Cells)
  number         any                         double                   (omitted: `default`, or an error)
  option         any                         the C++ type of its Options (omitted: the first word)
  word           any                         const assoc::Cell&       (omitted: a blank Cell)

  result kind    adapter returns             the cell shows
  number         double                      the number
  row            std::vector<double>         one row; a plain entry shows the first (headline) part
  array          assoc::Matrix               an array, e.g. the shape of the table body
  text           std::string                 the text
  cells          assoc::CellGrid             an array of numbers and texts

An assoc::Error thrown by the adapter shows as Err:502; non-finite numbers are turned into errors.
"""

from dataclasses import dataclass, field
from typing import List, Optional

# The wizard category; one of the names Calc honours.
CATEGORY = "Statistical"


@dataclass
class Word:
    word: str     # what the user types, lower case; matched case-insensitively
    meaning: str  # a few words for the wizard and the docs
    cpp: str      # the C++ value the adapter receives


@dataclass
class Options:
    """A set of option words that one or more arguments accept. The first word is the default."""
    name: str              # what the words choose, for messages: "method", "kind"
    cpp_type: str          # the C++ type of the values
    words: List[Word]
    declare: bool = False  # True: the generator declares `enum class cpp_type` with the `cpp` values


@dataclass
class Argument:
    name: str
    kind: str          # table | number | option | word (see the module docstring)
    description: str   # for the wizard; option words are appended automatically
    default: Optional[float] = None  # for number arguments: the value when omitted
    options: Optional[Options] = None  # for option arguments


@dataclass
class Function:
    name: str          # display name, ASSOC.SOMETHING
    method: str        # programmatic name: the UNO method, the adapter, and what .ods files store
    description: str   # one or two sentences for the wizard
    arguments: List[Argument]
    returns: str       # number | row | array | text | cells (see the module docstring)
    result: str        # what the cell shows, for the docs
    notes: List[str] = field(default_factory=list)  # further paragraphs for the docs
    example: str = ""  # a formula for the docs


METHODS = Options("method", "assoc::Method", [
    Word("pearson", "Pearson's X²", "assoc::Method::pearson"),
    Word("g", "the likelihood-ratio statistic G²", "assoc::Method::likelihood_ratio"),
    Word("yates", "Pearson's X² with Yates' continuity correction (2×2 tables only)", "assoc::Method::yates"),
])

RESIDUAL_KINDS = Options("kind", "assoc::ResidualKind", [
    Word("pearson", "(O − E) / √E", "assoc::ResidualKind::pearson"),
    Word("adjusted", "the adjusted (standardized) residual, about standard normal under independence",
         "assoc::ResidualKind::adjusted"),
    Word("raw", "O − E", "assoc::ResidualKind::raw"),
    Word("contribution", "(O − E)² / E, the cell's part of X²", "assoc::ResidualKind::contribution"),
    Word("percent", "the cell's part of X² in percent", "assoc::ResidualKind::percent"),
])

MEASURES = Options("measure", "Measure", [
    Word("cramer", "Cramér's V, from 0 to 1", "cramer"),
    Word("cramer-corrected", "Cramér's V with Bergsma's bias correction", "cramer_corrected"),
    Word("phi", "phi, signed (2×2 tables only)", "phi"),
    Word("contingency", "Pearson's contingency coefficient C", "contingency"),
    Word("w", "Cohen's w, as power calculations use it", "w"),
], declare=True)

TABLE = Argument(
    "table", "table",
    "The range of counts: one row per category of one variable, one column per category of the other. "
    "A first row and a first column of text labels are read as headers. Blank cells count as 0; "
    "rows and columns of zeros are set aside.")

FUNCTIONS = [
    Function(
        "ASSOC.EXPECTED", "expected",
        "Expected counts if rows and columns were independent: row total × column total / grand total.",
        [TABLE],
        "array", "an array of the shape of the table body (without headers); set-aside rows and columns show 0",
        ["Enter it as an array formula over a range the size of the body."],
        "=ASSOC.EXPECTED(A1:D3)"),
    Function(
        "ASSOC.STATISTIC", "statistic",
        "The chi-squared test statistic of independence for a table of counts. Entered as an array over "
        "three cells in a row it also gives the degrees of freedom and the p-value.",
        [TABLE, Argument("method", "option", "Optional. The test statistic to compute.", options=METHODS)],
        "row", "one row: the statistic, the degrees of freedom, the p-value; a plain entry shows the statistic",
        ["Yates' correction is never applied unless asked for, and only to 2×2 tables."],
        '=ASSOC.STATISTIC(A1:D3; "g")'),
    Function(
        "ASSOC.PVALUE", "pvalue",
        "The p-value of the chi-squared test of independence: the chance of a statistic at least this "
        "large if rows and columns were independent.",
        [TABLE, Argument("method", "option", "Optional. The test statistic the p-value belongs to.",
                         options=METHODS)],
        "number", "the upper-tail p-value, between 0 and 1",
        ["Computed from the upper tail directly, so very small p-values keep their digits."],
        "=ASSOC.PVALUE(A1:D3)"),
    Function(
        "ASSOC.DF", "df",
        "Degrees of freedom of the test: (rows − 1) × (columns − 1), counting rows and columns that hold counts.",
        [TABLE],
        "number", "a whole number",
        [], "=ASSOC.DF(A1:D3)"),
    Function(
        "ASSOC.CRITICAL", "critical",
        "The critical value of the chi-squared distribution: the statistic above which independence is "
        "rejected at significance level alpha.",
        [Argument("df", "number", "The degrees of freedom, a number above 0 (see ASSOC.DF)."),
         Argument("alpha", "number", "Optional. The significance level, between 0 and 1; 0.05 when omitted.",
                  default=0.05)],
        "number", "the value c with P(X² ≥ c) = alpha",
        [], "=ASSOC.CRITICAL(2; 0.01)"),
    Function(
        "ASSOC.RESIDUALS", "residuals",
        "Cell residuals that show which cells drive an association, and in which direction.",
        [TABLE, Argument("kind", "option", "Optional. Which residual to compute.", options=RESIDUAL_KINDS)],
        "array", "an array of the shape of the table body; set-aside rows and columns show 0",
        ["Adjusted residuals beyond about ±2 mark cells that differ from independence at about the 5% level "
         "each (common practice); with many cells some will by chance."],
        '=ASSOC.RESIDUALS(A1:D3; "adjusted")'),
    Function(
        "ASSOC.STRENGTH", "strength",
        "The strength of association on a scale that does not grow with the sample size.",
        [TABLE, Argument("measure", "option", "Optional. The measure of strength.", options=MEASURES)],
        "number", "the measure; all are computed from the uncorrected Pearson X²",
        [], '=ASSOC.STRENGTH(A1:D3; "cramer-corrected")'),
    Function(
        "ASSOC.CHECK", "check",
        "Says in words whether the chi-squared test can be trusted for this table, or why the table "
        "cannot be used. With an option word of another ASSOC function it also tries that choice.",
        [TABLE, Argument("method", "word",
                         "Optional. An option word of another ASSOC function; ASSOC.CHECK then also says "
                         "whether that choice works on this table, and why not. Accepted words: {all_words}.")],
        "text", 'a verdict that starts with "Sound:" or "Doubtful:", or starts with "Cannot use this table:" '
                "and gives the reason",
        ["Where another ASSOC function shows an error (Err:502) for a table or an option word, ASSOC.CHECK "
         "with the same table and word explains it."],
        '=ASSOC.CHECK(A1:D3; "yates")'),
    Function(
        "ASSOC.REPORT", "report",
        "A full account of the test of independence as a two-column block of labels and values: sizes, "
        "statistics and p-values, decision, strength, validity, a conclusion in words and a caution.",
        [TABLE, Argument("alpha", "number", "Optional. The significance level, between 0 and 1; 0.05 when omitted.",
                         default=0.05)],
        "cells", "a two-column array of labels and values, one row per line of the report (18 lines); enter it "
                 "as an array formula over 2 columns and 18 rows",
        ["When the corner cell of a table with both headers names the variables as \"rows / columns\" "
         "(for example \"Department / Outcome\"), the conclusion uses those names."],
        "=ASSOC.REPORT(A1:D3; 0.05)"),
]
