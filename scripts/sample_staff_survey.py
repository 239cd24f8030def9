"""The staff-survey sample, samples/staff_survey.fods: ordered answers by tenure band, the same question
within offices, and three survey waves of the same staff, with ASSOC.ORDINAL, ASSOC.STRENGTH ("gamma",
"taub"), ASSOC.WITHIN, ASSOC.REPEATED and ASSOC.SIMULATE with "exact" live in the cells.

Built by scripts/build_samples.py (`--only staff_survey`), with its helpers: the same styles, heat
map, charts, notes and checks as the other samples. Larkspur Components Ltd is a fictional company
and every figure is invented: the tables are typed in below, and the survey waves come from a seeded
generator (WAVE_SEED), so a rebuild gives the same workbook.

tests/calc/samples_test.py (class StaffSurvey) reads it through its named ranges, and
tests/reference/samples_generate.py recomputes its results from its typed cells; the user guide
refers to cells by address: keep those in place, or update them together.
"""

import random

from build_samples import Workbook, expect, fixed, header_row, heading, p_text, percent, store

SATISFACTION = ["Very dissatisfied", "Dissatisfied", "Neutral", "Satisfied", "Very satisfied"]
TENURE_BANDS = ["Under 1 year", "1 to 2 years", "3 to 5 years", "6 to 10 years", "Over 10 years"]
BAND_MIDDLES = [0.5, 1.5, 4, 8, 15]  # years, for the second ordered test
# Answers to "How satisfied are you with your work at Larkspur?" in the 2025 staff survey, by tenure
# band (rows) and answer (columns). Satisfaction falls steadily with tenure, mildly enough that
# Pearson's test, blind to the order, does not find it.
TENURE_COUNTS = [[4, 9, 15, 24, 14],
                 [6, 11, 17, 25, 12],
                 [8, 13, 20, 21, 9],
                 [12, 15, 19, 16, 8],
                 [15, 17, 14, 13, 4]]

# The same question in three answers, by office and three tenure bands. Harbour opened in 2025, so all
# its staff are in their first years: its table has one row and tells nothing about tenure.
OFFICE_BANDS = ["Under 3 years", "3 to 10 years", "Over 10 years"]
OFFICE_ANSWERS = ["Dissatisfied", "Neutral", "Satisfied"]
OFFICE_SURVEY = [("Northgate", [[10, 14, 30], [14, 16, 26], [18, 15, 17]]),
                 ("Riverside", [[6, 9, 20], [9, 11, 17], [12, 10, 11]]),
                 ("Hillcrest", [[5, 8, 15], [7, 9, 12], [10, 8, 7]]),
                 ("Lakeview", [[2, 3, 7], [3, 4, 5], [5, 3, 2]]),
                 ("Harbour", [[3, 4, 9]])]

# "Would you recommend Larkspur as a place to work?" asked of the same 80 staff in three waves; a
# blank where someone did not answer that wave.
WAVE_SEED = 25
WAVE_STAFF = 80
WAVES = ["March 2025", "July 2025", "November 2025"]


def wave_answers(seed=WAVE_SEED, staff=WAVE_STAFF):
    """Yes/No/"" per person and wave: each person's own leaning, yes a little rarer every wave, and about
    one answer in 25 missing. Only Random.random() is used, whose sequence Python keeps across versions."""
    rng = random.Random(seed)
    answers = []
    for _ in range(staff):
        leaning = rng.random()
        row = []
        for wave in range(len(WAVES)):
            if rng.random() < 0.04:
                row.append("")
                continue
            row.append("Yes" if rng.random() < min(0.95, 0.30 + 0.6 * leaning - 0.11 * wave) else "No")
        answers.append(row)
    return answers


WIDTHS = [6.6, 2.6, 2.6, 2.6, 2.6, 2.6, 6.2, 2.6, 0.5, 3.4, 2.2, 2.2]
# Charts of ordered answers: from the heat map's blue (least satisfied) through grey to its orange.
ANSWER_COLOURS = {5: (0x3A6EA5, 0x9DB7D2, 0xD9D9D9, 0xF3C394, 0xE8862A), 3: (0x3A6EA5, 0xD9D9D9, 0xE8862A)}


def colour_answers(chart, count):
    """Colours the series of a chart of ordered answers, one series per answer."""
    series = chart.getFirstDiagram().getCoordinateSystems()[0].getChartTypes()[0].getDataSeries()
    for one, colour in zip(series, ANSWER_COLOURS[count]):
        one.Color = colour


def analysis_sheet(book, name, title, note, first_heading, header):
    """A sheet of the workbook: its title and note, and its first section's heading and header row."""
    s = book.sheet(name, WIDTHS)
    s.text("A1", f"Larkspur Components Ltd: {title}", "Assoc title")
    s.text("A2", f"Invented data of a fictional company. {note}", "Assoc note")
    heading(s, "A4", first_heading)
    header_row(s, "A5", header)
    return s


def build_tenure_sheet(book):
    s = analysis_sheet(book, "By tenure", "satisfaction with work by tenure, staff survey 2025",
                       "Both the rows and the columns are ordered. Every result is a live ASSOC.* formula; the grey "
                       "text beside it is the formula.", "1. Answers by tenure band",
                       ["Tenure / Satisfaction", *SATISFACTION, "", "Years (band middle)"])
    s.put("A6", [[band] for band in TENURE_BANDS])
    s.put("B6", TENURE_COUNTS, "Assoc count")
    s.put("H6", [[years] for years in BAND_MIDDLES], "Assoc ratio")
    book.name_range("TenureTable", s, "A5:F10")
    book.name_range("TenureYears", s, "H6:H10")

    heading(s, "A12", "2. Does satisfaction change with tenure?")
    header_row(s, "A13", ["Result", "", "", "", "", "", "Formula"])
    rows = [
        (14, "Ordered test (linear-by-linear): p-value, M², df, r", "B14:E14", "=ASSOC.ORDINAL(A5:F10)"),
        (15, "The same with tenure in years (H6:H10) as row scores", "B15:E15", "=ASSOC.ORDINAL(A5:F10; H6:H10)"),
        (16, "Pearson X², which ignores the order: p-value", "B16", "=ASSOC.PVALUE(A5:F10)"),
        (17, "Goodman–Kruskal gamma", "B17", '=ASSOC.STRENGTH(A5:F10; "gamma")'),
        (18, "Kendall's tau-b", "B18", '=ASSOC.STRENGTH(A5:F10; "taub")'),
        (19, "Cramér's V, which ignores the order", "B19", "=ASSOC.STRENGTH(A5:F10)"),
    ]
    for row, label, cells, text in rows:
        s.text(f"A{row}", label, "Assoc label")
        if ":" in cells:
            s.array(cells, text, "Assoc ratio", show=f"G{row}")
            s.cells(f"B{row}").CellStyle = "Assoc p-value"
            s.cells(f"D{row}").CellStyle = "Assoc whole"
            s.cells(f"E{row}").CellStyle = "Assoc strength"
        else:
            s.formula(cells, text, "Assoc p-value" if row == 16 else "Assoc strength", show=f"G{row}")
    s.text("A20", "Can the chi-squared test be trusted here?", "Assoc label")
    s.formula("B20", "=ASSOC.CHECK(A5:F10)", "Assoc text")
    s.cells("B20:F20").merge(True)
    s.show_formula("G20", "B20")
    for name, cells in (("TenureOrdinal", "B14:E14"), ("TenureOrdinalYears", "B15:E15"), ("TenurePearson", "B16"),
                        ("TenureGamma", "B17"), ("TenureTauB", "B18")):
        book.name_range(name, s, cells)

    heading(s, "A22", "3. Where the answers depart from independence (adjusted residuals, heat map)")
    header_row(s, "A23", ["Tenure band", *SATISFACTION, "Formula"])
    for i in range(5):
        s.formula(f"A{24 + i}", f"=A{6 + i}")
    s.array("B24:F28", '=ASSOC.RESIDUALS(A5:F10; "adjusted")', "Assoc residual", show="G24")
    s.heat_map("B24:F28")
    s.heat_map_key("A30")
    colour_answers(s.chart("TenureAnswers", "J4", (13.5, 8.5), ["A5:F10"], "Answers by tenure band", "Share of staff",
                           stacked_shares=True), 5)
    return s


def tenure_notes(s):
    value = lambda cell: s.cells(cell).getValue()  # noqa: E731
    p_ordinal, m2, r = value("B14"), value("C14"), value("E14")
    p_pearson, gamma, tau = value("B16"), value("B17"), value("B18")
    expect(p_ordinal < 0.001 and p_pearson > 0.05 and r < 0 and gamma < tau < 0 and value("B15") < 0.001,
           "the ordered test finds a falling trend that Pearson's test misses, gamma beyond tau-b")
    residuals = [[value(f"{c}{r}") for c in "BCDEF"] for r in range(24, 29)]
    strongest = max((x for row in residuals for x in row), key=abs)
    beyond = sum(1 for row in residuals for x in row if abs(x) > 2)
    expect(beyond == 1 and residuals[-1][0] > 2 and residuals[0][-1] > 0 and residuals[0][0] < 0,
           "one cell passes ±2, and the residuals drift from new staff's satisfied to long-serving staff's "
           "dissatisfied answers")
    s.text("A33", "Reading the results", "Assoc section")
    s.notes("A34", [
        f"Pearson's test finds no association ({p_text(p_pearson)}): it treats the bands and the answers as "
        f"unordered labels. The ordered test finds a clear one (M² = {fixed(m2, 2)}, {p_text(p_ordinal)}): the "
        f"longer staff have served, the less satisfied they are (r = {fixed(r, 3)}; negative because later rows go "
        f"with earlier columns). Gamma ({fixed(gamma, 3)}) and tau-b ({fixed(tau, 3)}) say the same; gamma leaves "
        "out the many pairs of staff in the same band or giving the same answer, so it lies further from 0.",
        "The heat map shows a drift across the whole table rather than a few cells: orange (more answers than "
        "independence predicts) runs from the satisfied answers of new staff to the dissatisfied answers of "
        f"long-serving staff. Only one cell passes ±2 ({fixed(strongest, 2)}), and among 25 cells one can "
        "by chance. Such a drift is what the ordered test is built to find; the chi-squared test spreads it over 16 "
        "degrees of freedom and misses it.",
        "Cautions: an association is not proof of cause. Longer-serving staff differ in roles, grades and age, and "
        "a survey reaches those who answer. Small samples and many tests mislead. For decisions about people, "
        "follow applicable law and policy, and seek qualified advice.",
    ], width=165)


def build_offices_sheet(book):
    s = analysis_sheet(book, "Within offices", "satisfaction by tenure, office by office, staff survey 2025",
                       "The strata in the long layout: office, tenure band, one column of counts per answer.",
                       "1. Answers by office and tenure band", ["Office", "Tenure band", *OFFICE_ANSWERS])
    rows = []
    for office, table in OFFICE_SURVEY:
        for band, counts in zip(OFFICE_BANDS, table):
            rows.append([office, band, *counts])
    last = 5 + len(rows)
    s.put("A6", [row[:2] for row in rows])
    s.put("C6", [row[2:] for row in rows], "Assoc count")
    book.name_range("OfficeSurvey", s, f"A5:E{last}")

    r = last + 2
    heading(s, f"A{r}", "2. Is satisfaction related to tenure within the offices?")
    header_row(s, f"A{r + 1}", ["Result", "", "", "", "", "", "Formula"])
    s.text(f"A{r + 2}", "Within offices (generalized Cochran–Mantel–Haenszel): p-value, statistic, df", "Assoc label")
    s.array(f"B{r + 2}:D{r + 2}", f"=ASSOC.WITHIN(A5:E{last})", "Assoc ratio", show=f"G{r + 2}")
    s.cells(f"B{r + 2}").CellStyle = "Assoc p-value"
    s.cells(f"D{r + 2}").CellStyle = "Assoc whole"
    book.name_range("WithinResult", s, f"B{r + 2}:D{r + 2}")
    s.text(f"A{r + 3}", "What ASSOC.CHECK says about the strata", "Assoc label")
    s.formula(f"B{r + 3}", f'=ASSOC.CHECK(A5:E{last}; "within")', "Assoc text")
    s.cells(f"B{r + 3}:F{r + 3}").merge(True)
    s.show_formula(f"G{r + 3}", f"B{r + 3}")

    # All offices together, summed from the strata, with its residual heat map.
    p = r + 5
    heading(s, f"A{p}", "3. All offices together (adjusted residuals with the heat map beside the counts)")
    header_row(s, f"A{p + 1}", ["Tenure band / Answer", *OFFICE_ANSWERS, "", "", "Formula"])
    for i, band in enumerate(OFFICE_BANDS):
        s.text(f"A{p + 2 + i}", band)
        for j, column in enumerate("BCD"):
            source = "CDE"[j]
            s.formula(f"{column}{p + 2 + i}", f"=SUMIFS({source}$6:{source}${last}; $B$6:$B${last}; $A{p + 2 + i})",
                      "Assoc count", show=f"G{p + 2}" if (i, j) == (0, 0) else None)
    pooled = f"A{p + 1}:D{p + 4}"
    book.name_range("PooledSurvey", s, pooled)
    header_row(s, f"A{p + 6}", ["Adjusted residuals", *OFFICE_ANSWERS, "", "", "Formula"])
    for i in range(3):
        s.formula(f"A{p + 7 + i}", f"=A{p + 2 + i}")
    s.array(f"B{p + 7}:D{p + 9}", f'=ASSOC.RESIDUALS({pooled}; "adjusted")', "Assoc residual", show=f"G{p + 7}")
    s.heat_map(f"B{p + 7}:D{p + 9}")
    s.text(f"A{p + 10}", "Ordered test of all offices together: p-value, M², df, r", "Assoc label")
    s.array(f"B{p + 10}:E{p + 10}", f"=ASSOC.ORDINAL({pooled})", "Assoc ratio", show=f"G{p + 10}")
    s.cells(f"B{p + 10}").CellStyle = "Assoc p-value"
    s.cells(f"D{p + 10}").CellStyle = "Assoc whole"
    s.heat_map_key(f"A{p + 12}")

    # The smallest office: the exact test, and its simulated estimate.
    q = p + 15
    heading(s, f"A{q}", "4. The smallest office alone: the exact test and its simulated estimate")
    header_row(s, f"A{q + 1}", ["Lakeview: tenure / answer", *OFFICE_ANSWERS, "", "", "Formula"])
    lakeview = 6 + 3 * 3  # the first Lakeview row of the strata
    for i in range(3):
        s.formula(f"A{q + 2 + i}", f"=B{lakeview + i}")
        for j, column in enumerate("BCD"):
            s.formula(f"{column}{q + 2 + i}", f"={'CDE'[j]}{lakeview + i}", "Assoc count")
    small = f"A{q + 1}:D{q + 4}"
    book.name_range("LakeviewTable", s, small)
    lines = [(q + 5, "Exact p-value (ASSOC.EXACT)", f"B{q + 5}", f"=ASSOC.EXACT({small})"),
             (q + 6, "Simulated, ordered as the exact test: p-value, standard error, trials", f"B{q + 6}:D{q + 6}",
              f'=ASSOC.SIMULATE({small}; 100000; 7; "exact")'),
             (q + 7, "Simulated, ordered by Pearson X²: p-value, standard error, trials", f"B{q + 7}:D{q + 7}",
              f"=ASSOC.SIMULATE({small}; 100000; 7)")]
    for row, label, cells, text in lines:
        s.text(f"A{row}", label, "Assoc label")
        if ":" in cells:
            s.array(cells, text, "Assoc p-value", show=f"G{row}")
            s.cells(f"D{row}").CellStyle = "Assoc count"
        else:
            s.formula(cells, text, "Assoc p-value", show=f"G{row}")
    book.name_range("LakeviewExact", s, f"B{q + 5}")
    book.name_range("LakeviewSimulatedExact", s, f"B{q + 6}:D{q + 6}")
    colour_answers(s.chart("PooledAnswers", "J4", (13.5, 8.5), [pooled], "Answers by tenure band, all offices",
                           "Share of staff", stacked_shares=True), 3)
    return s, {"within": r + 2, "check": r + 3, "pooled": p + 1, "ordinal": p + 10, "lakeview": q + 5,
               "notes": q + 10}


def offices_notes(s, places):
    value = lambda cell: s.cells(cell).getValue()  # noqa: E731
    w = places["within"]
    p_within, statistic, df = value(f"B{w}"), value(f"C{w}"), value(f"D{w}")
    check = s.cells(f"B{places['check']}").getString()
    exact = value(f"B{places['lakeview']}")
    simulated, standard_error = value(f"B{places['lakeview'] + 1}"), value(f"C{places['lakeview'] + 1}")
    by_pearson = value(f"B{places['lakeview'] + 2}")
    staff = sum(value(f"{c}{r}") for c in "BCD" for r in range(places["lakeview"] - 3, places["lakeview"]))
    expect(p_within < 0.01 and df == 4 and '"Harbour"' in check and abs(simulated - exact) < 4 * standard_error,
           "the association holds within offices, Harbour is set aside, and the simulation agrees with the exact "
           "test")
    s.text(f"A{places['notes']}", "Reading the results", "Assoc section")
    s.notes(f"A{places['notes'] + 1}", [
        f"Within the offices, satisfaction still goes with tenure (statistic {fixed(statistic, 2)}, {fixed(df, 0)} "
        f"degrees of freedom, {p_text(p_within)}): the pattern is not only a mix of offices with different staff. "
        "ASSOC.WITHIN compares each office with itself and adds up the evidence; it asks about association of any "
        "kind, without using the order.",
        "Harbour opened in 2025, so all its staff are in their first years: its table has a single row and tells "
        "nothing about tenure. ASSOC.CHECK names it as set aside.",
        f"Lakeview alone is small ({fixed(staff, 0)} staff): the exact p-value is {fixed(exact, 3)}. Simulating tables ordered "
        f"as the exact test orders them gives {fixed(simulated, 3)} (standard error {fixed(standard_error, 4)}), "
        f"the same p-value within the Monte Carlo error; ordered by Pearson X² the simulation estimates another "
        f"test's p-value ({fixed(by_pearson, 3)}). Use ASSOC.SIMULATE(range; ; ; \"exact\") when ASSOC.EXACT stops "
        "at its limits.",
        "Cautions: an association is not proof of cause, and small offices mislead easily. For decisions about "
        "people, follow applicable law and policy, and seek qualified advice.",
    ], width=165)


def build_answers_sheet(book):
    """The survey waves' answers, one row per person (a records sheet: no analysis of its own)."""
    s = book.sheet("Wave answers", [2.6, 3.2, 3.2, 3.2, 0.6, 12], records=True)
    header_row(s, "A1", ["Employee", *WAVES])
    answers = wave_answers()
    s.put("A2", [[f"E-{101 + i:03d}", *row] for i, row in enumerate(answers)])
    last = 1 + len(answers)
    book.name_range("WaveAnswers", s, f"B1:D{last}")
    book.name_range("MarchJulyAnswers", s, f"B1:C{last}")
    for name, column in (("WaveMarch", "B"), ("WaveJuly", "C"), ("WaveNovember", "D")):
        book.name_range(name, s, f"{column}2:{column}{last}")
    s.notes("F1", [
        f"{WAVE_STAFF} invented staff of Larkspur Components Ltd (a fictional company), asked in three survey waves "
        "of 2025: \"Would you recommend Larkspur as a place to work?\" A blank where someone did not answer that wave.",
        "The sheet Waves tests the answers through the named ranges WaveAnswers (the three waves, with their header "
        "row), MarchJulyAnswers, WaveMarch, WaveJuly and WaveNovember.",
    ], width=70)
    s.raw.setPrintAreas((s.cells(f"A1:D{last}").RangeAddress,))
    s.raw.setTitleRows(s.cells("A1:D1").RangeAddress)
    return s


def build_waves_sheet(book):
    s = analysis_sheet(book, "Waves", "\"Would you recommend Larkspur as a place to work?\", three survey waves "
                       "of the same staff", f"The answers of {WAVE_STAFF} staff are on the sheet Wave answers, one row "
                       "per person. Every result is a live ASSOC.* formula; the grey text beside it is the formula.",
                       "1. Did the share of yes change between the waves?", ["Result", "", "", "", "", "", "Formula"])
    s.text("A6", "Cochran's Q over the three waves: p-value, Q, df", "Assoc label")
    s.array("B6:D6", '=ASSOC.REPEATED(WaveAnswers; "Yes")', "Assoc ratio", show="G6")
    s.text("A7", "What ASSOC.CHECK says about the answers", "Assoc label")
    s.formula("B7", '=ASSOC.CHECK(WaveAnswers; "repeated")', "Assoc text")
    s.cells("B7:F7").merge(True)
    s.show_formula("G7", "B7")
    book.name_range("WaveRepeated", s, "B6:D6")

    heading(s, "A9", "2. Share answering yes in each wave, of those who answered")
    header_row(s, "A10", ["Wave", "Yes", "Answered", "Share yes", "", "", "Formula"])
    for i, (wave, name) in enumerate(zip(WAVES, ("WaveMarch", "WaveJuly", "WaveNovember"))):
        row = 11 + i
        s.text(f"A{row}", wave)
        s.formula(f"B{row}", f'=COUNTIF({name}; "Yes")', "Assoc count", show=f"G{row}" if i == 0 else None)
        s.formula(f"C{row}", f"=COUNTA({name})", "Assoc count")
        s.formula(f"D{row}", f"=B{row}/C{row}", "Assoc rate")

    heading(s, "A15", "3. Two waves only: Cochran's Q is McNemar's test without the correction")
    header_row(s, "A16", ["March / July", "Yes", "No", "", "", "", "Formula"])
    for i, first in enumerate(("Yes", "No")):
        row = 17 + i
        s.text(f"A{row}", first)
        for column, second in zip("BC", ("Yes", "No")):
            s.formula(f"{column}{row}", f'=COUNTIFS(WaveMarch; "{first}"; WaveJuly; "{second}")', "Assoc count",
                      show=f"G{row}" if (i, column) == (0, "B") else None)
    s.text("A19", "Cochran's Q, March and July only: p-value, Q, df", "Assoc label")
    s.array("B19:D19", '=ASSOC.REPEATED(MarchJulyAnswers; "Yes")', "Assoc ratio", show="G19")
    s.text("A20", "McNemar's test without the correction on the 2×2 table: p-value, statistic, df", "Assoc label")
    s.array("B20:D20", '=ASSOC.PAIRED(A16:C18; "uncorrected")', "Assoc ratio", show="G20")
    for row in (6, 19, 20):
        s.cells(f"B{row}").CellStyle = "Assoc p-value"
        s.cells(f"D{row}").CellStyle = "Assoc whole"
    book.name_range("TwoWaveRepeated", s, "B19:D19")
    book.name_range("TwoWavePaired", s, "B20:D20")
    s.chart("WaveShares", "J4", (12, 7.5), ["A10:A13", "D10:D13"], "Share recommending Larkspur, by wave",
                    "Share answering yes", percent=True, legend=False)
    return s


def waves_notes(s):
    value = lambda cell: s.cells(cell).getValue()  # noqa: E731
    p, q = value("B6"), value("C6")
    shares = [value(f"D{r}") for r in (11, 12, 13)]
    check = s.cells("B7").getString()
    expect(p < 0.05 and shares[0] > shares[1] > shares[2] and "set aside" in check and
           abs(value("C19") - value("C20")) < 1e-9 and value("B19") > 0.05,
           "the share of yes falls significantly over the waves, some staff are set aside, and two waves alone "
           "show no significant change")
    s.text("A23", "Reading the results", "Assoc section")
    s.notes("A24", [
        f"The share recommending Larkspur fell from {percent(shares[0], 0)} in March to {percent(shares[1], 0)} in "
        f"July and {percent(shares[2], 0)} in November, of those who answered. Cochran's Q (Q = {fixed(q, 2)}, "
        f"{p_text(p)}) compares the waves within each person, so each person's own leaning cancels out; staff who "
        "gave the same answer every time add nothing.",
        "Staff who missed a wave are set aside, since Q needs every answer of a person; ASSOC.CHECK says how many and "
        "which rows. Between March and July alone the change is not significant. For two waves Q equals McNemar's "
        "statistic without the continuity correction (ASSOC.PAIRED with \"uncorrected\" on the 2×2 table).",
        "Cautions: the waves differ in more than time (news, reorganisations, who answered). Many tests mislead. For "
        "decisions about people, follow applicable law and policy, and seek qualified advice.",
    ], width=165)


def build(office, out):
    book = Workbook(office, "Larkspur Components Ltd: staff survey 2025 (invented)")
    tenure = build_tenure_sheet(book)
    offices, places = build_offices_sheet(book)
    build_answers_sheet(book)
    waves = build_waves_sheet(book)
    book.doc.Sheets.moveByName("Wave answers", book.doc.Sheets.Count)

    def tidy():
        tenure.fit_text_height("B20", 62)
        offices.fit_text_height(f"B{places['check']}", 62)
        waves.fit_text_height("B7", 62)
    store(office, book, out / "staff_survey.fods",
          [lambda: tenure_notes(tenure), lambda: offices_notes(offices, places), lambda: waves_notes(waves), tidy])
