"""The one table of Assoc's worksheet functions.

Everything about a function that a user or the UNO layer sees comes from here: its name, its
arguments, the Function Wizard texts, the option words, and what it returns. extension/generate.py
turns this table into the UNO interface (IDL), the C++ glue of the add-in (UNO methods, wizard
texts, option-word parsing, the trials of ASSOC.CHECK) and the reference docs/functions.md.

To add a function: add a Function below (and an Options for new option words), then write its
adapter (same name as `method`) in extension/src/cell_functions.cpp. The generator declares the
adapter for you, with the C++ types that the argument and result kinds give:

  argument kind   UNO type                     adapter receives
  table           sequence< sequence< any > >  const assoc::CellGrid&   a table of counts for the tests of
                                                                        independence (ASSOC.CHECK gives its verdict)
  range           sequence< sequence< any > >  const assoc::CellGrid&   any other required range (strata, scores…)
  labels          sequence< sequence< any > >  const assoc::CodedLabels&  a row or column of records' labels, read
                                                                        without a Cell per record (fast on 1M records)
  optional_range  any                          const assoc::CellGrid&   (omitted: an empty grid)
  number          any                          double                   (omitted: `default`, or an error)
  option          any                          the C++ type of its Options (omitted: `omitted`, else the first word)
  word            any                          const assoc::Cell&       (omitted: a blank Cell; a function with a word
                                                                        argument is not tried by ASSOC.CHECK)
  value           any                          const assoc::Cell&       an optional label or number (omitted: a blank
                                                                        Cell, which is what ASSOC.CHECK tries)

  result kind     adapter returns              the cell shows
  number          double                       the number
  row             std::vector<double>          one row; a plain entry shows the first (headline) part
  array           assoc::Matrix                an array, e.g. the shape of the table body
  text            std::string                  the text
  cells           assoc::CellGrid              an array of numbers and texts (a blank Cell shows empty)

An assoc::Error thrown by the adapter shows as Err:502; non-finite numbers are turned into errors.
An adapter that has more to say about its input than its result (a correction it applied, records it
skipped) calls remark(sentence); ASSOC.CHECK shows those sentences when it tries the function.

ASSOC.CHECK tries every function on a range without further code: with the function's name as its
second argument it runs the function with its defaults, with an option word it runs each function
that accepts the word. So a function's arguments other than its ranges need defaults, except for a
function that takes no range at all (ASSOC.CHECK then reads its numbers from the cells of the range).
"""

from dataclasses import dataclass, field
from typing import Dict, List, Optional

# The wizard category of every function (the add-in reports it to Calc); one of the names Calc honours:
# Database, Date&Time, Financial, Information, Logical, Mathematical, Matrix, Statistical, Spreadsheet,
# Text, Add-In.
CATEGORY = "Statistical"


@dataclass
class Word:
    word: str     # what the user types, lower case; matched case-insensitively
    meaning: str  # a few words for the wizard and the docs
    cpp: str      # the C++ value the adapter receives
    # The display name of a function whose run with its defaults gives the same result (ASSOC.PVALUE
    # with "exact" is ASSOC.EXACT), so that ASSOC.CHECK runs a long calculation only once.
    same_as: str = ""


@dataclass
class Options:
    """A set of option words that one or more arguments accept. The first word is the default."""
    key: str               # a C++ identifier, unique among the Options (the generated variable's name)
    name: str              # what the words choose, for messages: "method", "kind"
    cpp_type: str          # the C++ type of the values
    words: List[Word]
    declare: bool = False  # True: the generator declares `enum class cpp_type` with the `cpp` values
    include: str = ""      # the core header that declares cpp_type
    # When omitting the argument means something no single word means (a choice that depends on the
    # table), its C++ value and its meaning for the docs; otherwise omitted means the first word.
    omitted: Optional[str] = None
    omitted_meaning: str = ""
    # Words of other functions that these arguments refuse with a specific message (not just
    # "unknown"), so that a mix-up explains itself.
    refused: Dict[str, str] = field(default_factory=dict)
    # A C++ function that turns a range (an assoc::CellGrid) given instead of a word into cpp_type; ""
    # when the argument takes words only.
    from_range: str = ""


@dataclass
class Argument:
    name: str
    kind: str          # table | range | labels | optional_range | number | option | word | value (module docstring)
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


# ---------------------------------------------------------------------------------------------
# Option words

METHODS = Options("method", "method", "assoc::Method", [
    Word("pearson", "Pearson's X²", "assoc::Method::pearson"),
    Word("g", "the likelihood-ratio statistic G²", "assoc::Method::likelihood_ratio"),
    Word("yates", "Pearson's X² with Yates' continuity correction (2×2 tables only)", "assoc::Method::yates"),
], include="assoc/statistics.hpp", refused={
    "exact": "the exact test has no chi-squared statistic; ASSOC.EXACT (or ASSOC.PVALUE with \"exact\") gives "
             "its p-value",
})

PVALUE_METHODS = Options("pvalue_method", "method", "PValueMethod", [
    Word("pearson", "Pearson's X²", "pearson"),
    Word("g", "the likelihood-ratio statistic G²", "g"),
    Word("yates", "Pearson's X² with Yates' continuity correction (2×2 tables only)", "yates"),
    Word("exact", "the exact test, conditional on the row and column totals (as ASSOC.EXACT; whole counts only)",
         "exact", same_as="ASSOC.EXACT"),
], declare=True)

RESIDUAL_KINDS = Options("residual_kind", "kind", "assoc::ResidualKind", [
    Word("pearson", "(O − E) / √E", "assoc::ResidualKind::pearson"),
    Word("adjusted", "the adjusted (standardized) residual, about standard normal under independence",
         "assoc::ResidualKind::adjusted"),
    Word("raw", "O − E", "assoc::ResidualKind::raw"),
    Word("contribution", "(O − E)² / E, the cell's part of X²", "assoc::ResidualKind::contribution"),
    Word("percent", "the cell's part of X² in percent", "assoc::ResidualKind::percent"),
], include="assoc/residuals.hpp")

MEASURES = Options("measure", "measure", "Measure", [
    Word("cramer", "Cramér's V, from 0 to 1", "cramer"),
    Word("cramer-corrected", "Cramér's V with Bergsma's bias correction", "cramer_corrected"),
    Word("phi", "phi, signed (2×2 tables only)", "phi"),
    Word("contingency", "Pearson's contingency coefficient C", "contingency"),
    Word("w", "Cohen's w, as power calculations use it", "w"),
    # Measures for ordered rows and columns (signed, from −1 to 1).
    Word("gamma", "Goodman and Kruskal's gamma, from −1 to 1, for ordered rows and columns: the excess of pairs "
                  "ranked alike over pairs ranked oppositely, ties left out", "gamma"),
    Word("taub", "Kendall's tau-b, from −1 to 1, for ordered rows and columns: as gamma, with ties counted against "
                 "the association", "tau_b"),
], declare=True)

SIDES = Options("side", "side", "assoc::Side", [
    Word("two-sided", "every table with the same totals that is no more probable than this one",
         "assoc::Side::two_sided"),
    Word("lower", "2×2 only: a top-left count this small or smaller (evidence of an odds ratio below 1)",
         "assoc::Side::lower"),
    Word("upper", "2×2 only: a top-left count this large or larger (evidence of an odds ratio above 1)",
         "assoc::Side::upper"),
], include="assoc/exact_test.hpp")

SIMULATION_METHODS = Options("simulation_method", "method", "SimulationMethod", [
    Word("pearson", "Pearson's X²", "pearson"),
    Word("g", "the likelihood-ratio statistic G²", "g"),
    Word("exact", "the tables' probability: random tables no more probable than this one count, as the exact test "
                  "orders them, so the p-value estimates ASSOC.EXACT's (with the same margin for ties)", "exact"),
], declare=True, refused={
    "yates": "Yates' correction adjusts the chi-squared approximation, and a simulated p-value needs no "
             "approximation; use \"pearson\" or \"g\"",
})

ADJUSTMENTS = Options("adjustment", "adjustment", "assoc::PAdjustment", [
    Word("holm", "Holm's step-down adjustment: the chance of any false finding among the cells stays at the "
                 "level, with more power than Bonferroni", "assoc::PAdjustment::holm"),
    Word("bonferroni", "each p-value times the number of cells tested, at most 1", "assoc::PAdjustment::bonferroni"),
    Word("none", "no adjustment: each cell on its own", "assoc::PAdjustment::none"),
], include="assoc/p_value_adjustment.hpp")

LEVEL_ORDERS = Options("level_order", "order", "assoc::LevelOrdering", [
    Word("sorted", "numbers ascending, then texts in alphabetical order as the office's language reads it "
                   "(case and accents only break ties)", "assoc::LevelOrdering(assoc::LevelOrder::sorted)"),
    Word("first", "in the order in which the labels first appear",
         "assoc::LevelOrdering(assoc::LevelOrder::first_seen)"),
], include="assoc/levels.hpp", from_range="assoc::LevelOrdering::from_range")

CONTINUITY = Options("continuity", "correction", "assoc::Continuity", [
    Word("corrected", "with the continuity correction of ½", "assoc::Continuity::corrected"),
    Word("uncorrected", "without it", "assoc::Continuity::uncorrected"),
], include="assoc/mantel_haenszel.hpp")

PAIRED_METHODS = Options("paired_method", "method", "std::optional<assoc::PairedMethod>", [
    Word("corrected", "McNemar's test with the continuity correction, max(0, |b − c| − 1)² / (b + c) "
                      "(2×2 tables; the correction never exceeds the difference)",
         "assoc::PairedMethod::corrected"),
    Word("uncorrected", "McNemar's test without the correction, (b − c)² / (b + c); for a larger square table "
                        "Bowker's test of symmetry", "assoc::PairedMethod::uncorrected"),
    Word("exact", "the exact binomial test of the changes b against c (2×2 tables, whole counts)",
         "assoc::PairedMethod::exact"),
], include="assoc/paired_tests.hpp", omitted="std::nullopt",
    omitted_meaning="\"corrected\" for a 2×2 table, Bowker's test of symmetry for a larger one")


# ---------------------------------------------------------------------------------------------
# Arguments that several functions share

TABLE = Argument(
    "table", "table",
    "The range of counts: one row per category of one variable, one column per category of the other. "
    "A first row and a first column of text labels are read as headers. Blank cells count as 0; "
    "rows and columns of zeros, and rows and columns labelled as totals, are set aside.")

# The measures of column 1 refuse a first column that reads as the absence of another (outcome_column.hpp).
OUTCOME_FIRST = ("A first column of counts whose label reads as the absence of another's (\"No\" before \"Yes\", "
                 "\"Not promoted\" before \"Promoted\", as a pivot table sorts them) is an error that says so, since "
                 "the result would measure not having the outcome: put the outcome of interest first, or, to measure "
                 "\"No\" on purpose, leave the header row out of the range.")
TWO_BY_TWO = Argument(
    "table", "table",
    "A 2×2 range of counts, headers allowed: rows are the two groups, column 1 the outcome of interest "
    "(for example promoted), column 2 the other outcome.")

CONFIDENCE = Argument("confidence", "number",
                      "Optional. The confidence level of the interval, between 0 and 1; 0.95 when omitted.",
                      default=0.95)

ALPHA = Argument("alpha", "number", "Optional. The significance level, between 0 and 1; 0.05 when omitted.",
                 default=0.05)

STRATA_RANGE = Argument(
    "strata", "range",
    "The 2×2 tables of the strata (for example one per department): either one row per stratum with its "
    "four counts a, b, c, d (row 1: a, b; row 2: c, d), or the 2×2 tables stacked in two columns. A first "
    "row and a first column of text labels are read as headers; stacked tables may name their strata in a "
    "label column before the group labels.")


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
        ["Yates' correction is never applied unless asked for, and only to 2×2 tables. The exact test has no "
         "statistic: use ASSOC.EXACT for it.",
         "A statistic above 1.8e308, the largest spreadsheet number (possible only when the counts add up to "
         "nearly that much), is an error that ASSOC.CHECK explains; its p-value, from ASSOC.PVALUE, is 0."],
        '=ASSOC.STATISTIC(A1:D3; "g")'),
    Function(
        "ASSOC.PVALUE", "pvalue",
        "The p-value of the test of independence: the chance of a result at least this far from "
        "independence if rows and columns were independent.",
        [TABLE, Argument("method", "option", "Optional. The test the p-value belongs to.", options=PVALUE_METHODS)],
        "number", "the p-value, between 0 and 1",
        ["Chi-squared p-values are computed from the upper tail directly, so very small p-values keep their "
         "digits. \"exact\" gives the same value as ASSOC.EXACT with its default side."],
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
        [Argument("df", "number", "The degrees of freedom, a number above 0 (see ASSOC.DF)."), ALPHA],
        "number", "the value c with P(X² ≥ c) = alpha",
        [], "=ASSOC.CRITICAL(2; 0.01)"),
    Function(
        "ASSOC.RESIDUALS", "residuals",
        "Cell residuals that show which cells drive an association, and in which direction.",
        [TABLE, Argument("kind", "option", "Optional. Which residual to compute.", options=RESIDUAL_KINDS)],
        "array", "an array of the shape of the table body; set-aside rows and columns show 0",
        ["Adjusted residuals beyond about ±2 mark cells that differ from independence at about the 5% level "
         "each (common practice); with many cells some will by chance. ASSOC.CELLTEST turns them into "
         "p-values adjusted for the number of cells."],
        '=ASSOC.RESIDUALS(A1:D3; "adjusted")'),
    Function(
        "ASSOC.STRENGTH", "strength",
        "The strength of association on a scale that does not grow with the sample size.",
        [TABLE, Argument("measure", "option", "Optional. The measure of strength.", options=MEASURES)],
        "number", "the measure; \"cramer\" to \"w\" are computed from the uncorrected Pearson X², \"gamma\" and "
                  "\"taub\" from the pairs of counts that the order of the rows and the columns ranks alike or "
                  "oppositely",
        ["Cramér's V (corrected or not), phi, C and w ignore any order of the categories. For ordered rows and columns "
         "(tenure bands by a satisfaction scale), \"gamma\" and \"taub\" say in which direction and how strongly the "
         "order of the rows goes with that of the columns: positive when later rows go with later columns. Gamma "
         "leaves out pairs tied on either variable, so it reaches ±1 as soon as one kind of pair is missing and lies "
         "further from 0 than tau-b; tau-b counts the ties against the association and reaches ±1 only for a square table "
         "with every count on a diagonal. ASSOC.ORDINAL tests such an association."],
        '=ASSOC.STRENGTH(A1:D3; "cramer-corrected")'),
    Function(
        "ASSOC.VINTERVAL", "vinterval",
        "Cramér's V with a confidence interval for the V of the population the table was drawn from.",
        [TABLE, CONFIDENCE],
        "row", "one row: Cramér's V, the lower and the upper end of its interval; a plain entry shows V (the same "
               "number as ASSOC.STRENGTH)",
        ["The interval inverts the noncentral chi-squared distribution of X², as ASSOC.REPORT's interval does (the "
         "same numbers at 0.95; see ASSOC.REPORT and the guide's \"The interval of Cramér's V\"). A limit is 0 when "
         "even a population without association makes the observed X² likely enough, so a table whose test is not "
         "significant at 1 − confidence has the lower end 0, and a table closer to independence than chance "
         "usually gives has the interval 0 to 0 (ASSOC.CHECK with \"vinterval\" says so). The interval is rough for "
         "small or sparse tables, and it can lie below the sample's V, which overstates the population's V on "
         "average.",
         "It takes about a millisecond at most, whatever the counts, and never runs the exact test (ASSOC.REPORT "
         "does), so it suits sheets that recalculate often."],
        "=ASSOC.VINTERVAL(A1:D3)"),
    Function(
        "ASSOC.EXACT", "exact",
        "The exact p-value of the test of independence, conditional on the row and column totals (Fisher's "
        "test for 2×2 tables, its Freeman–Halton extension for larger ones). Needs whole counts.",
        [TABLE, Argument("side", "option", "Optional. Which tables count as at least as extreme as this one.",
                         options=SIDES)],
        "number", "the p-value, between 0 and 1",
        ["Two-sided, the p-value adds up the probabilities of all tables with the same totals that are no more "
         "probable than the observed one. A table up to 1e-7 (relative) more probable than the observed one "
         "counts as no more probable: tables that are equally probable in exact arithmetic come out a few units "
         "of the 16th digit apart in floating point, and without a margin they would be counted or left out by "
         "rounding. Tools differ here: some use the same relative margin, some a far smaller one (1e-14), and "
         "some an absolute margin, which treats every table as tied once probabilities are tiny; "
         "p-values then differ by the probability of the near-ties.",
         "Trustworthy where the chi-squared approximation is doubtful (small expected counts). For a 2×2 table "
         "the calculation takes well under a millisecond however large the counts, up to a total of "
         "9,007,199,254,740,991 (2^53 − 1, the largest whole number a spreadsheet holds exactly), and keeps "
         "about 13 significant digits even far in the tail. For larger tables with many counts the number of "
         "possible tables grows quickly: the calculation stops with an error after 5 seconds, or when it "
         "would need more than 400 MB of memory; ASSOC.SIMULATE(range; ; ; \"exact\") then estimates the same "
         "p-value by simulation. ASSOC.CHECK with \"exact\" says why it fails.",
         "The calculation counts its work before doing it and watches its pace, so a table it cannot finish "
         "within those limits is usually refused at once rather than after 5 seconds. While LibreOffice runs, "
         "the answer (or the refusal) for a table is remembered: recalculating or reopening a sheet does not "
         "compute an unchanged table again, and any change to its counts is computed afresh."],
        "=ASSOC.EXACT(A1:C3)"),
    Function(
        "ASSOC.SIMULATE", "simulate",
        "A simulated (Monte Carlo) p-value of the test of independence: the share of random tables with the "
        "same row and column totals whose statistic is at least this table's. Needs whole counts.",
        [TABLE,
         Argument("trials", "number", "Optional. The number of random tables, a whole number from 100 to "
                                      "10,000,000; 100,000 when omitted.", default=100000),
         Argument("seed", "number", "Optional. The start of the random sequence, a whole number from 0 to "
                                    "4,294,967,295; 1 when omitted. The same seed gives the same p-value.",
                  default=1),
         Argument("method", "option", "Optional. The statistic compared.", options=SIMULATION_METHODS)],
        "row", "one row: the p-value, its standard error (the Monte Carlo error), the number of trials; a plain "
               "entry shows the p-value",
        ["The p-value is (1 + k) / (trials + 1), k the number of random tables at least as extreme, so it is "
         "never 0. The standard error √(p (1 − p) / trials) shrinks with more trials. Tables too large to "
         "simulate within a few seconds are refused with an error that says how many trials would fit, and a "
         "simulation still running after 5 seconds stops with an error that says how far it got.",
         "With \"pearson\" or \"g\" it estimates the exact p-value of that statistic, which can differ from "
         "ASSOC.EXACT's: the exact test orders tables by their probability. With \"exact\" it orders them the same "
         "way, so it estimates ASSOC.EXACT's p-value where the exact test is out of reach.",
         "Since the same counts, trials, seed and method always give the same result, it is remembered while "
         "LibreOffice runs: recalculating or reopening a sheet does not simulate an unchanged table again."],
        "=ASSOC.SIMULATE(A1:D4; 100000; 7)"),
    Function(
        "ASSOC.ODDSRATIO", "oddsratio",
        "The odds ratio of a 2×2 table: the odds of column 1 in row 1 over the odds of column 1 in row 2, "
        "with a confidence interval (Woolf's method).",
        [TWO_BY_TWO, CONFIDENCE],
        "row", "one row: the odds ratio, the lower and the upper end of the interval; a plain entry shows the "
               "odds ratio",
        ["When a cell is 0, 0.5 is added to every cell first (the Haldane–Anscombe correction); ASSOC.CHECK "
         "says so. This is the sample (cross-product) odds ratio, not the conditional estimate some exact "
         "tests report.", OUTCOME_FIRST],
        "=ASSOC.ODDSRATIO(A1:C3; 0.95)"),
    Function(
        "ASSOC.RISKRATIO", "riskratio",
        "The risk ratio (relative risk) of a 2×2 table: the share of column 1 in row 1 over the share of "
        "column 1 in row 2, with a confidence interval (log method).",
        [TWO_BY_TWO, CONFIDENCE],
        "row", "one row: the risk ratio, the lower and the upper end of the interval; a plain entry shows the "
               "risk ratio",
        ["When a cell is 0, 0.5 is added to every cell first, as for the odds ratio.", OUTCOME_FIRST],
        "=ASSOC.RISKRATIO(A1:C3)"),
    Function(
        "ASSOC.CELLTEST", "celltest",
        "Which cells depart from independence: for each cell, the two-sided p-value of its adjusted "
        "residual, adjusted for the number of cells tested.",
        [TABLE, Argument("adjust", "option", "Optional. How the p-values allow for testing many cells.",
                         options=ADJUSTMENTS)],
        "cells", "an array of the shape of the table body; cells of set-aside rows and columns are not tested and "
                 "stay empty",
        ["A small p-value marks a cell with more or fewer counts than independence explains; the sign of "
         "ASSOC.RESIDUALS(…; \"adjusted\") says which."],
        '=ASSOC.CELLTEST(A1:D4; "holm")'),
    Function(
        "ASSOC.FIT", "fit",
        "Pearson's goodness-of-fit test: do the counts of one variable follow the expected shares?",
        [Argument("observed", "range", "One row or one column of counts, one per category; a text label at "
                                       "its start, or a row or column of labels beside it, is allowed."),
         Argument("expected", "optional_range",
                  "Optional. The expected counts or shares, one per category, in any unit (9, 3, 3, 1 or "
                  "percentages); they are rescaled to the observed total. Equal shares when omitted."),
         Argument("estimated", "number", "Optional. The number of parameters estimated from the same data, "
                                         "which lowers the degrees of freedom; 0 when omitted.", default=0)],
        "row", "one row: the p-value, the statistic X², the degrees of freedom; a plain entry shows the p-value",
        ["The degrees of freedom are the categories − 1 − estimated. A category expected to have no counts "
         "must have none, and is then left out. Expected values under a label that speaks of percentages "
         "(\"Plan %\") must add up to 100 (within 1, for rounding), or to 1 when the cells are formatted as "
         "percentages (30% holds 0.3): otherwise a category is missing or a value mistyped, and they are an error "
         "rather than rescaled. So are expected values that are all shares (from 0 to below 1) and do not add up to "
         "1 even allowing for their rounding (half a unit of their last decimal each: 0.3, 0.3, 0.3 for thirds is "
         "taken, 0.25, 0.35, 0.3 is not). Total rows in either range are set aside, and ASSOC.CHECK with "
         "\"ASSOC.FIT\" says so.",
         "When both ranges name their categories (a column of labels beside each, every label different), the "
         "expected values are matched to the observed categories by label, whatever their order (spaces at the "
         "ends and capitals aside); labels that differ are an error that names them. Otherwise the values are "
         "taken in order."],
        "=ASSOC.FIT(B2:B5; C2:C5)"),
    Function(
        "ASSOC.POWER", "power",
        "The power of the chi-squared test: the chance that it finds an effect of size w with n counts in all.",
        [Argument("w", "number", "The effect size w, 0 or more and below 5 (Cohen: 0.1 small, 0.3 medium, 0.5 large); "
                                       "5 or more is an error, most often a percentage typed as a number (30 for 0.3)."),
         Argument("n", "number", "The total count, above 0."),
         Argument("df", "number", "The degrees of freedom of the test, a whole number of 1 or more."),
         ALPHA],
        "number", "the power, between alpha and 1",
        ["Model: X² follows the noncentral chi-squared distribution with noncentrality n·w²."],
        "=ASSOC.POWER(0.3; 88; 1)"),
    Function(
        "ASSOC.SAMPLESIZE", "samplesize",
        "The smallest total count with which the chi-squared test reaches the given power for an effect of "
        "size w.",
        [Argument("w", "number", "The effect size w, above 0 and below 5 (Cohen: 0.1 small, 0.3 medium, 0.5 large); "
                                       "5 or more is an error, most often a percentage typed as a number (30 for 0.3)."),
         Argument("power", "number", "The power wanted, between alpha and 1, for example 0.8."),
         Argument("df", "number", "The degrees of freedom of the test, a whole number of 1 or more."),
         ALPHA],
        "number", "a whole number of counts",
        ["The same model as ASSOC.POWER; the answer is the smallest whole n whose power reaches the target."],
        "=ASSOC.SAMPLESIZE(0.3; 0.8; 1)"),
    Function(
        "ASSOC.COUNTS", "counts",
        "Counts records into a table: one record per position of the two label ranges (for example each "
        "employee's department and outcome), optionally weighted.",
        [Argument("row_labels", "labels", "One row or column of labels, one per record: the rows of the table."),
         Argument("column_labels", "labels",
                  "One row or column of labels, as long as row_labels: the columns of the table."),
         Argument("weights", "optional_range",
                  "Optional. One number of 0 or more per record, as long as the labels: how many people or items "
                  "the record stands for (a frequency weight, never an amount such as pay); a record with a blank "
                  "weight is skipped. Each record counts once when omitted."),
         Argument("order", "option", "Optional. The order of the rows and columns: a range that lists the labels "
                                     "in the wanted order (an answer scale: Poor, Fair, Good, Excellent), or a word.",
                  options=LEVEL_ORDERS)],
        "array", "the counts only, one row per label of ASSOC.LEVELS(row_labels) and one column per label of "
                 "ASSOC.LEVELS(column_labels), in the same order",
        ["The result holds no labels, so it can go straight into the other ASSOC functions. For a table with "
         "headers, put ASSOC.LEVELS(row_labels) in the column to its left and "
         "TRANSPOSE(ASSOC.LEVELS(column_labels)) in the row above it (both with the same order), and give the "
         "whole block to ASSOC.REPORT.",
         "A record with a blank label (or a blank weight) is skipped. Labels that differ only by spaces at "
         "their start or end are one label (\"No\" and \"No \"); otherwise labels are compared exactly: "
         "\"Sales\" and \"sales\" are two labels, and the number 5 and the text \"5\" are two (ASSOC.CHECK "
         "with \"counts\" points out both). A label whose records are all skipped gets a row (or column) of "
         "zeros, which the other functions set aside.",
         "Whole columns (B:B) may be given: the blank cells below the last record are no records, and a first "
         "cell that holds a text found nowhere else in the column is its header and is left out (ASSOC.CHECK "
         "says so). A weight that is negative, or text, is an error that names its row. A header repeated "
         "among the records (the first row again lower down, its texts found nowhere else, as in a report "
         "pasted page by page) is an error that names its rows; such a line lower down only is counted, and "
         "ASSOC.CHECK with \"counts\" points it out.",
         "The order of the rows and columns is that of ASSOC.LEVELS (see there for how texts are sorted)."],
        "=ASSOC.COUNTS(B2:B200; C2:C200)"),
    Function(
        "ASSOC.LEVELS", "levels",
        "The distinct labels of a row or column of records, blanks left out: the row or column headers of "
        "ASSOC.COUNTS.",
        [Argument("labels", "labels", "One row or column of labels, one per record."),
         Argument("order", "option", "Optional. The order of the labels: a range that lists them in the wanted "
                                     "order (an answer scale: Poor, Fair, Good, Excellent), or a word.",
                  options=LEVEL_ORDERS)],
        "cells", "a column of labels (numbers stay numbers); labels that are all texts compare equal to typed "
                 "text in `=`, MATCH, VLOOKUP, COUNTIF and EXACT",
        ["Use TRANSPOSE(ASSOC.LEVELS(…)) for a row, and ROWS(ASSOC.LEVELS(…)) for the number of labels (the "
         "size of the range to select for the array). With an order range, every label it lists is a level, "
         "also one that no record holds, and a label it lacks is an error that names it. Labels are read as "
         "ASSOC.COUNTS reads them (spaces at the ends left out, a whole column's header left out).",
         "Sorted texts follow the Unicode Collation Algorithm through LibreOffice's own collator for the locale "
         "setting (Tools ▸ Options ▸ Language Settings ▸ Languages): letters first, without regard to case or "
         "accents, so \"Éclair\" comes between \"apple\" and \"zeta\"; then accents (\"resume\" before "
         "\"résumé\"), then case (lower case first), and texts still equal by their Unicode code points, so "
         "the order never depends on the order of the records. Latin letters come before Greek, Cyrillic and "
         "other scripts, and a language's own rules apply where it has them (in Swedish, Ä after Z). Many "
         "programs instead sort texts by their character codes, which puts lower case after all capitals and "
         "accented letters after Z; the office's own sort can also differ slightly, since by default it treats "
         "texts that differ only in case as equal. The order changes only how rows and columns are listed, "
         "never a count or a test."],
        "=ASSOC.LEVELS(B2:B200)"),
    Function(
        "ASSOC.STRATA", "strata",
        "The Mantel–Haenszel test of association across strata (for example promotion by sex within each "
        "department), with the common odds ratio and its 95% confidence interval.",
        [STRATA_RANGE,
         Argument("correction", "option", "Optional. The continuity correction of the statistic.",
                  options=CONTINUITY)],
        "row", "one row: the p-value, the statistic (chi-squared, 1 degree of freedom), the common odds ratio, "
               "the lower and the upper end of its interval; a plain entry shows the p-value",
        ["The common odds ratio compares the odds of column 1 in row 1 with those in row 2, the same in every "
         "stratum. Strata without counts in both rows and both columns add nothing and are left out "
         "(ASSOC.CHECK with \"strata\" names them). ASSOC.HOMOGENEITY tests whether one common odds ratio fits "
         "all strata.",
         "In stacked tables the labels tell which rows form a stratum: a first label column that names the "
         "strata (its name on the stratum's first row, the rows below blank or repeating the name), a stratum's "
         "name on its first row, its name on each of its rows, or group labels that repeat (Women, Men, Women, "
         "Men). A stratum name that comes back after another stratum is an error. A stratum that does not have exactly 2 rows is "
         "an error that names it and its rows; a stratum whose groups come in the other order is matched by "
         "their labels. Without labels (or with labels that are all different) the rows are taken two by two, "
         "and ASSOC.CHECK says so when there are labels. Rows labelled as totals are left out.",
         "The continuity correction never exceeds the difference it corrects: the statistic is "
         "(|D| − min(½, |D|))² / V, with D the sum over strata of observed minus expected top-left counts and V "
         "its variance, so when |D| is below ½ the statistic is 0 and the p-value 1. The correction allows for "
         "counts being whole; a correction larger than the difference would turn a difference smaller than "
         "half a count into evidence. Yates' and McNemar's corrections in Assoc follow the same rule. Other "
         "tools differ only when |D| < ½: some then drop the correction (statistic D² / V), some subtract ½ "
         "regardless ((½ − |D|)² / V).",
         "Column 1 is the outcome of the common odds ratio: a first column of counts (or, with one row per stratum, "
         "a third) whose label reads as the absence of the next one's (\"No\" before \"Yes\") is an error that "
         "says so, for the p-value too; put the outcome of interest first, or leave the header row out of the "
         "range."],
        "=ASSOC.STRATA(A1:E7)"),
    Function(
        "ASSOC.HOMOGENEITY", "homogeneity",
        "The Breslow–Day test, with Tarone's correction, that the odds ratio is the same in every stratum.",
        [STRATA_RANGE],
        "row", "one row: the p-value, the statistic, the degrees of freedom (strata used − 1); a plain entry "
               "shows the p-value",
        ["A small p-value says the strata differ, so the common odds ratio of ASSOC.STRATA hides real "
         "differences between them."],
        "=ASSOC.HOMOGENEITY(A1:E7)"),
    Function(
        "ASSOC.PAIRED", "paired",
        "A test for paired answers (the same people classified twice, before and after): do changes in one "
        "direction outnumber changes in the other? McNemar's test for 2×2 tables, Bowker's for larger ones.",
        [Argument("table", "range", "A square range of counts, headers allowed: rows are the first "
                                    "classification, columns the second, in the same order of categories."),
         Argument("method", "option", "Optional. The test to apply.", options=PAIRED_METHODS)],
        "row", "one row: the p-value, the statistic, the degrees of freedom; a plain entry shows the p-value",
        ["With \"exact\" the statistic is the smaller of the two counts of changes and the degrees of freedom "
         "are 0 (a binomial test has none); it takes up to 9,007,199,254,740,991 changes (2^53 − 1) and "
         "well under a millisecond at any size. Rows and columns of zeros are kept, since row i and column i "
         "must stay the same category; rows and columns labelled as totals are left out.",
         "When both the rows and the columns carry labels, the columns are matched to the rows by their labels "
         "(spaces at the ends and capitals aside), whatever their order, and also once the words that every row "
         "label shares and those that every column label shares are left out (\"Yes before\" with \"Yes after\", "
         "\"Fail (first)\" with \"Fail (retest)\"; ASSOC.CHECK with \"paired\" lists the pairs); labels that do "
         "not match are an error that names them. With labels on one side only, the columns must come in the rows' "
         "order.",
         "Bowker's test adds (n_ij − n_ji)² / (n_ij + n_ji) over the pairs of categories, and a pair in which "
         "nobody changed either way (n_ij = n_ji = 0) is left out with its degree of freedom: it says nothing "
         "about symmetry, and its term would be 0 / 0. The degrees of freedom are the number of pairs with "
         "changes, at most k(k − 1)/2. Other tools give no result for such a table, or keep k(k − 1)/2 degrees "
         "of freedom, which makes the p-value larger (the test more cautious) than the changes justify."],
        "=ASSOC.PAIRED(A1:C3)"),
    Function(
        "ASSOC.TREND", "trend",
        "The Cochran–Armitage test for a trend in a share across ordered categories (for example the share "
        "promoted by number of training courses taken).",
        [Argument("table", "range", "A range of counts with two outcomes and the ordered categories: 2 rows "
                                    "(outcomes) × k columns (categories), or k rows × 2 columns; headers allowed."),
         Argument("scores", "optional_range",
                  "Optional. One score per category, in the order of the table, for example the number of "
                  "courses; 1, 2, 3, … when omitted.")],
        "row", "one row: the two-sided p-value and z; a plain entry shows the p-value",
        ["z is positive when the share of the first outcome (row 1 of a 2×k table, column 1 of a k×2 table) "
         "rises with the score. z² is the statistic with the variance based on n; Mantel's version with n − 1 "
         "is smaller by the factor (n − 1)/n.",
         "Without scores, categories whose labels name an order of their own, by their numbers (\"0-2 years\", "
         "\"2-5 years\", \"10+ years\"; years before quarters) or as the steps of a common answer scale (\"Poor\", "
         "\"Fair\", \"Good\"), must come in that order or its reverse: otherwise the table is an error that "
         "names both orders."],
        "=ASSOC.TREND(A1:F3; A5:E5)"),
    Function(
        "ASSOC.IMPACT", "impact",
        "Selection rates by group and their ratio to the highest group's rate, flagging groups below a "
        "threshold (four-fifths by default).",
        [Argument("selected", "range", "One row or column: the number selected in each group; a text header "
                                       "at its start is allowed."),
         Argument("considered", "range", "One row or column as long as selected: the number considered "
                                         "(applicants, candidates) in each group; a text header at its start is "
                                         "allowed."),
         Argument("threshold", "number", "Optional. The ratio below which a group is flagged, above 0 and at "
                                         "most 1; 0.8 (four-fifths) when omitted.", default=0.8)],
        "cells", "one row per group: the selection rate, the ratio to the highest rate, and a flag text when the "
                 "ratio is below the threshold (empty otherwise); a group with no one considered has an empty rate "
                 "and ratio and its reason as the text; enter it over 3 columns and one row per group",
        ["A header in the first cells is left out, and so are the blank cells after the last group (whole columns "
         "such as B:B may be given); the result has one row per group below the header. A group whose two cells "
         "are blank, or with 0 considered, has no selection rate: its row is left empty with its reason, and the "
         "other groups are compared. A first or last group that holds the sums of at least 2 other groups in both "
         "ranges is a total, and an error: leave the total row out of the ranges. Counts are numbers of people: a "
         "selection rate (0.15) typed instead of the number selected is an error, and so is a header over the "
         "considered counts that names those not selected (\"Not selected\", \"Rejected\", \"Others\"): "
         "considered means everyone in the group.",
         "The four-fifths rule of thumb comes from the US Uniform Guidelines on Employee Selection Procedures, "
         "29 CFR 1607.4(D). It is a screening rule, not a test: with few people a large difference can be "
         "chance, and with many a small one can matter. Follow applicable law and policy and seek qualified "
         "advice."],
        "=ASSOC.IMPACT(B2:B4; C2:C4)"),
    Function(
        "ASSOC.CHECK", "check",
        "Says in words whether the chi-squared test can be trusted for this table, or why the table "
        "cannot be used. With the name or an option word of another ASSOC function it also tries that "
        "function on the range and says why it fails.",
        [TABLE, Argument("function_or_word", "word",
                         "Optional. The name of another ASSOC function (\"exact\" or \"ASSOC.EXACT\"), or one of "
                         "its option words; ASSOC.CHECK then tries it on the range and says whether it works, "
                         "and why not. Accepted words: {all_words}.")],
        "text", 'a verdict that starts with "Sound:" or "Doubtful:", or starts with "Cannot use this table:" '
                "and gives the reason; then what the function or word tried does on the range",
        ["Where another ASSOC function shows an error (Err:502) for a range or an option word, ASSOC.CHECK "
         "with the same range and the function's name or word explains it. A name runs the function with its "
         "defaults; a word runs every function that accepts it (a function that cannot use the range even "
         "with its defaults is left out when another one can). The verdict on the chi-squared test is given "
         "for functions that take a table of counts for the test of independence. Everything ASSOC.CHECK "
         "tries in one cell shares a cap of 10 seconds (it may run two exact or simulated tests, each with "
         "its own cap, within it).",
         "For a function that takes two ranges (ASSOC.COUNTS, ASSOC.IMPACT), give ASSOC.CHECK one range with "
         "the two side by side as columns, in the order of the arguments (for ASSOC.COUNTS a third column of "
         "weights may follow); for one that takes only numbers (ASSOC.POWER), give its numbers in one row or "
         "column. An order given as a range (ASSOC.LEVELS, ASSOC.COUNTS) goes in one more column after them "
         "(for ASSOC.COUNTS after the weights' column, blank when there are no weights).",
         "The verdict is \"Doubtful\" whenever the table itself is ambiguous, whatever its expected counts: "
         "counts that are not whole numbers (weighted data), a line labelled as data that holds the sum of the "
         "others, rows that each add up to exactly 100. It names the rows and columns set aside (empty ones and "
         "totals) in a short summary, and points to ASSOC.PAIRED when the rows and the columns carry the same "
         "labels. An unknown word gets the nearest words Assoc knows."],
        '=ASSOC.CHECK(A1:D3; "exact")'),
    Function(
        "ASSOC.REPORT", "report",
        "A full account of the test of independence as a two-column block of labels and values: sizes, "
        "statistics and p-values (the exact one too), decision, strength with its interval, validity, the "
        "cells that stand out, a conclusion in words and a caution.",
        [TABLE, ALPHA],
        "cells", "a two-column array of labels and values, one row per line of the report (22 lines); enter it "
                 "as an array formula over 2 columns and 22 rows",
        ["When the corner cell of a table with both headers names the variables as \"rows / columns\" "
         "(for example \"Department / Outcome\"), the conclusion uses those names; a corner without \"/\" is "
         "a title and is not used.",
         "When independence is rejected, the conclusion says how strong the association is, in words, from "
         "Cramér's V turned into Cohen's w = V·√(min(rows, columns) − 1): below 0.1 very weak, from 0.1 weak, "
         "from 0.3 moderate, from 0.5 strong (Cohen's conventions for w, 1988; \"very weak\" for less than "
         "small is common practice). So a tiny p-value from a very large table can read \"very weak\". When "
         "the interval of V is 0 to 0 (X² below the 2.5% point of its distribution under independence), the "
         "conclusion explains it.",
         "The exact p-value is computed when the counts are whole and the test finishes within 2 seconds and "
         "100 MB of memory; otherwise its line says why not (ASSOC.EXACT allows 5 seconds and 400 MB, "
         "ASSOC.SIMULATE estimates the p-value). Like ASSOC.EXACT's, the exact line is remembered for an "
         "unchanged table while LibreOffice runs. A statistic above 1.8e308, the largest spreadsheet number, "
         "is written in words on its line. The cells "
         "that stand out are the (at most 3) cells with the largest adjusted residuals beyond ±2, named by "
         "their labels (or by their row and column in the range); in a table of two columns (rows) only the "
         "first column's (row's) cells are named, since the other's only repeat them with the sign turned.",
         "In LibreOffice 7.4 the texts of the report compare unequal to typed text (it also holds numbers; see "
         "the guide's workbook habits): use G5&\"\" to compare a line's label or text.",
         "The 95% interval of Cramér's V inverts the noncentral chi-squared distribution of X²: the limits "
         "λ_L and λ_U of its noncentrality are those with P(X² ≥ observed | λ) = 2.5% and 97.5%, and each "
         "becomes V = √(λ / (n (min(r, c) − 1))), at most 1; a limit is 0 when even λ = 0 makes the observed "
         "X² likely enough. λ = n·w² is the same model as ASSOC.POWER's, so the interval is one for the "
         "population V. Published methods differ: some use √((λ + df) / (n (min(r, c) − 1))), which describes "
         "the expected sample V instead and gives higher limits. The interval is rough for small or sparse "
         "tables, and it can lie below the sample V, which overstates the population V on average."],
        "=ASSOC.REPORT(A1:D3; 0.05)"),
]


# ---------------------------------------------------------------------------------------------
# The figures a memo needs: rates with intervals, a difference of rates, which groups differ from
# which, and one risk ratio across strata. Placed before ASSOC.CHECK in the wizard and the docs.

PAIR_ADJUSTMENTS = Options("pair_adjustment", "adjustment", "assoc::PAdjustment", [
    Word("holm", "Holm's step-down adjustment: the chance of any false finding among the pairs stays at the "
                 "level, with more power than Bonferroni", "assoc::PAdjustment::holm"),
    Word("bonferroni", "each p-value times the number of pairs, at most 1", "assoc::PAdjustment::bonferroni"),
    Word("none", "no adjustment: each pair on its own, so with many pairs some look significant by chance",
         "assoc::PAdjustment::none"),
], include="assoc/p_value_adjustment.hpp")

PAIRWISE_METHODS = Options("pairwise_method", "method", "assoc::PairwiseMethod", [
    Word("pearson", "Pearson's X² without correction on each pair's table", "assoc::PairwiseMethod::pearson"),
    Word("exact", "the exact test on each pair's table (whole counts only; all pairs together get about 5 seconds "
                  "and 400 MB of working memory)", "assoc::PairwiseMethod::exact"),
], include="assoc/pairwise_comparisons.hpp")

RATE_TABLE = Argument(
    "table", "range",
    "A range of counts, headers allowed: one row per group, column 1 the outcome of interest (for example "
    "promoted), the other columns the rest. Blank cells count as 0.")

MEMO_FUNCTIONS = [
    Function(
        "ASSOC.RATES", "rates",
        "The rate of the outcome in each row of a table (column 1 over the row total), with its Wilson score "
        "confidence interval.",
        [RATE_TABLE, CONFIDENCE],
        "cells", "one row per row of the table body: the row total n, the rate, the lower and the upper end of its "
                 "interval; a row of zeros stays empty; enter it over 4 columns and one row per group",
        ["The Wilson interval suits small groups and rates near 0 or 1 and always lies between 0 and 1: a rate of 0 "
         "has the lower end 0, a rate of 1 the upper end 1, and no correction is needed. A table of one row is "
         "allowed. ASSOC.CHECK with \"rates\" names the rows that have no counts.",
         "Intervals that overlap do not show that two groups do not differ: ASSOC.RATEDIFF and ASSOC.PAIRWISE "
         "compare groups.", OUTCOME_FIRST],
        "=ASSOC.RATES(A1:C6)"),
    Function(
        "ASSOC.RATEDIFF", "ratediff",
        "The difference between the rates of the two rows of a 2×2 table (row 1 minus row 2, column 1 the "
        "outcome), with Newcombe's hybrid score confidence interval.",
        [Argument("table", "range", "A 2×2 range of counts, headers allowed: rows are the two groups, column 1 the "
                                    "outcome of interest (for example promoted), column 2 the rest."),
         CONFIDENCE],
        "row", "one row: the difference, the lower and the upper end of its interval, as shares (0.109 is 10.9 "
               "percentage points); a plain entry shows the difference",
        ["Newcombe's method (1998, method 10) combines the Wilson intervals of the two rates; it stays between −1 "
         "and 1 and needs no correction when a rate is 0 or 1. A column of zeros is allowed (both rates 0, or "
         "both 1); a row of zeros is not, since that group has no rate.", OUTCOME_FIRST],
        "=ASSOC.RATEDIFF(A1:C3)"),
    Function(
        "ASSOC.PAIRWISE", "pairwise",
        "Which groups differ from which: every pair of rows of a table tested on its columns, with the p-values "
        "adjusted for the number of pairs.",
        [TABLE,
         Argument("adjust", "option", "Optional. How the p-values allow for testing many pairs.",
                  options=PAIR_ADJUSTMENTS),
         Argument("method", "option", "Optional. The test of each pair.", options=PAIRWISE_METHODS)],
        "cells", "one row per pair of rows with counts, in the order (1,2), (1,3), …, (2,3), …: the first row's "
                 "label, the second row's label, the p-value of the pair and the adjusted p-value; enter it over 4 "
                 "columns and r(r − 1)/2 rows for r groups (10 rows for 5 groups)",
        ["Read the adjusted p-value: with many pairs some unadjusted p-values are small by chance alone. A "
         "significant difference between two groups is not proof of discrimination, nor of what causes it.",
         "Each pair is tested on its own table of 2 rows (columns empty in both rows left out); a pair whose counts "
         "all fall in one column gets p = 1. Rows without a label are named \"row k\"; rows of zeros take no part. "
         "At most 100 rows. ASSOC.CHECK with \"pairwise\" names pairs whose chi-squared p-value is doubtful. "
         "With \"exact\" all the pairs together have the exact test's cap: 5 seconds and 400 MB.",
         "Entered in a single cell it shows the first row's label, as an array's top-left value. The smallest "
         "adjusted p-value: `=MIN(INDEX(ASSOC.PAIRWISE(A1:C6);0;4))`."],
        "=ASSOC.PAIRWISE(A1:C6)"),
    Function(
        "ASSOC.STRATARISK", "stratarisk",
        "The Mantel–Haenszel common risk ratio across strata (for example Design's promotion rate over "
        "Assembly's, office by office), with the Greenland–Robins confidence interval.",
        [STRATA_RANGE, CONFIDENCE],
        "row", "one row: the common risk ratio, the lower and the upper end of its interval; a plain entry shows "
               "the ratio",
        ["In each stratum row 1 is the group whose rate is on top, column 1 the outcome. A stratum with an empty "
         "row, or with nobody in column 1, adds nothing and is left out (ASSOC.CHECK with \"stratarisk\" names "
         "it); a zero cell elsewhere needs no correction. For one stratum without a zero cell the ratio and its "
         "interval are those of ASSOC.RISKRATIO.",
         "Beside ASSOC.IMPACT: a ratio below 0.8 (or above 1.25, which puts row 2's group below four-fifths of row "
         "1's) is the four-fifths screen applied within strata. It is a screen, not a test; follow applicable law "
         "and policy and seek qualified advice.",
         "A first column of counts (or, with one row per stratum, a third) whose label reads as the absence of the "
         "next one's (\"No\" before \"Yes\") is an error that says so; put the outcome of interest first, or "
         "leave the header row out of the range."],
        "=ASSOC.STRATARISK(A1:E5)"),
]

_BEFORE_CHECK = next(i for i, f in enumerate(FUNCTIONS) if f.name == "ASSOC.CHECK")
FUNCTIONS[_BEFORE_CHECK:_BEFORE_CHECK] = MEMO_FUNCTIONS


# ---------------------------------------------------------------------------------------------
# Ordered tables, association within r×c strata, repeated yes/no answers (issue 13). Placed before
# ASSOC.CHECK, after the memo figures.

ORDERED_FUNCTIONS = [
    Function(
        "ASSOC.ORDINAL", "ordinal",
        "The linear-by-linear association test for a table whose rows and columns are both ordered (tenure band "
        "by satisfaction): does a later row go with a later column? Far more powerful than the chi-squared test "
        "when the association follows the order.",
        [TABLE,
         Argument("row_scores", "optional_range",
                  "Optional. One number per row of the table (rows of zeros included), rising or falling with the "
                  "order of the rows, for example each tenure band's middle in years; 1, 2, 3, … when omitted."),
         Argument("column_scores", "optional_range",
                  "Optional. One number per column, rising or falling with the order of the columns; 1, 2, 3, … "
                  "when omitted.")],
        "row", "one row: the two-sided p-value, the statistic M² = (n − 1) r², the degrees of freedom (1) and the "
               "correlation r of the row and column scores; a plain entry shows the p-value",
        ["r is positive when later rows go with later columns, negative when with earlier ones. The scores set "
         "the spacing of the categories (equal steps by default); M² does not change when all scores of a side are "
         "shifted or stretched, only when their spacing changes. Scores that are not numbers, a score too few or "
         "too many, and scores that do not rise (or fall) steadily are errors.",
         "For a table of 2 rows, M² = (n − 1)/n × z² of ASSOC.TREND with the same column scores (ASSOC.TREND's "
         "variance uses n, Mantel's M² uses n − 1), and r has the sign opposite to z's when the row scores rise.",
         "ASSOC.STRENGTH with \"gamma\" or \"taub\" gives the strength of such an association.",
         "Rows or columns whose labels name an order of their own, by their numbers (\"Under 30\", \"30-39\", "
         "\"40+\") or as the steps of a common answer scale (\"Never\" … \"Always\"), must come in that order or "
         "its reverse: otherwise the table is an error that names both orders."],
        "=ASSOC.ORDINAL(A1:F6)"),
    Function(
        "ASSOC.WITHIN", "within",
        "The generalized Cochran–Mantel–Haenszel test: are rows and columns associated once the strata (offices, "
        "channels) are held apart? For tables of any size; for 2×2 strata ASSOC.STRATA also gives the common "
        "odds ratio.",
        [Argument("strata", "range",
                  "The strata in the long layout: one row per stratum and row category, with the stratum's label in "
                  "column 1, the row's label in column 2 and one column of counts per column category after them; a "
                  "header row naming the categories is optional. A blank stratum label below a stratum's first row "
                  "means the label above (a stratum named once, or merged cells). A stratum's rows must be together; "
                  "the strata may come in any order.")],
        "row", "one row: the p-value, the statistic (chi-squared), the degrees of freedom (rows − 1) × (columns − 1); "
               "a plain entry shows the p-value",
        ["It tests general association: any pattern in any stratum, with no order of the categories assumed. A "
         "stratum may leave out a row label (its counts are then 0). Strata with fewer than 2 rows or 2 columns "
         "holding counts add nothing and are set aside, and so are rows and columns that hold counts only in such "
         "strata; ASSOC.CHECK with \"within\" names them. With 2 rows and 2 columns in every stratum the statistic "
         "is that of ASSOC.STRATA with \"uncorrected\". Rows whose row or stratum label names a total (\"Total\", "
         "\"All\") and count columns headed as totals are set aside, and ASSOC.CHECK says so: a total is not more "
         "people."],
        "=ASSOC.WITHIN(A1:F10)"),
    Function(
        "ASSOC.REPEATED", "repeated",
        "Cochran's Q test for the same people answering yes or no on several occasions (survey waves): does the "
        "share of yes change from one occasion to another? For 2 occasions it is McNemar's test without the "
        "continuity correction.",
        [Argument("answers", "range",
                  "One row per person and one column per occasion, each answer 1 (yes) or 0 (no), or one of two "
                  "text labels; a header row naming the occasions is optional, and so is a first column of the "
                  "people's numbers or names (a different entry on every row). A row with a blank answer is set "
                  "aside."),
         Argument("yes", "value",
                  "Optional. The text label that counts as yes, in any case (for example \"Agree\"); when omitted, "
                  "\"yes\" if it is one of the two labels, otherwise the first label in the range. Q is the same "
                  "either way.")],
        "row", "one row: the p-value, Q, the degrees of freedom (occasions − 1); a plain entry shows the p-value",
        ["People who answered the same on every occasion add nothing to Q. ASSOC.CHECK with \"repeated\" says which "
         "label was counted as yes and how many people were set aside for a blank answer. Labels are compared "
         "exactly: \"Yes\" and \"yes\" are two labels, and a third label is an error."],
        '=ASSOC.REPEATED(B2:D120; "Yes")'),
]

_BEFORE_CHECK = next(i for i, f in enumerate(FUNCTIONS) if f.name == "ASSOC.CHECK")
FUNCTIONS[_BEFORE_CHECK:_BEFORE_CHECK] = ORDERED_FUNCTIONS
