#!/usr/bin/python3
"""Builds the sample workbooks samples/quick_start.fods (the user guide's first example),
samples/promotions.fods (the workbook scripts/demo.sh recalculates and prints), samples/hr_review.fods
and samples/invoice_exceptions.fods through the UNO API, in a throwaway headless office with the built
extension installed.

    /usr/bin/python3 scripts/build_samples.py --oxt build/extension/assoc.oxt [--out samples]
        [--only quick_start promotions hr_review invoice_exceptions]

scripts/demo.py reads the promotions sheet through its named ranges CountTable (A4:C9) and
AssocReport (F5:G26), and the guide and its screenshots (scripts/render_samples.py) refer to cells
of the samples by address: keep those in place, or update them together. Optimal row heights depend
on the fonts: build with the Liberation fonts installed (Debian: fonts-liberation2).

Larkspur Components Ltd is a fictional company and every figure is invented: the HR tables are
typed in below, and the invoice records come from a seeded generator (INVOICE_SEED), so a rebuild
gives the same workbooks. Each analysis sheet gets live ASSOC.* formulas (array formulas where the
result is an array) with their formula text beside them, a heat map of adjusted residuals with its
key (except the Re-audit sheet, whose paired answers ask about the changes, not independence), a
chart, and notes on reading the results, with the cautions. The numbers the notes quote are rounded
as the cells display them (fixed() and percent()).

The heat map is a three-colour scale of our own (HEAT_MAP below). The office's API cannot yet fill
in the points of a colour scale (setting them crashes LibreOffice 7.4), so the builder writes the
scales into the stored flat XML, loads the file again, checks every scale arrived and no cell shows
an error, and stores it once more so that the committed file is the office's own rendering of it.
"""

import argparse
import decimal
import math
import pathlib
import random
import re
import sys
import textwrap

HERE = pathlib.Path(__file__).resolve().parent
sys.path.insert(0, str(HERE))
from assoc_office import ThrowawayOffice, file_url, properties  # noqa: E402

FLAT_ODS = "OpenDocument Spreadsheet Flat XML"

# ---------------------------------------------------------------------------------------------
# Colours. The heat map of adjusted residuals: purple where a cell has fewer counts than
# independence predicts, near-white where it has as many, orange where it has more; the ends are
# reached at -3 and +3 and values beyond take the end colour. The three colours are ColorBrewer's
# colour-blind-safe diverging scheme "PuOr" with 3 classes (Cynthia Brewer, colorbrewer2.org;
# Harrower & Brewer 2003, The Cartographic Journal 40(1), 27-37): the same palette, used the same
# way, as the sheets of the menu command (extension/command/palette.hpp; tests/calc/command_test.py
# checks that the two agree).
HEAT_MAP = ((-3, 0x998EC3, "−3 or less: fewer than expected"),
            (0, 0xF7F7F7, "0: as expected"),
            (3, 0xF1A340, "+3 or more: more than expected"))
CHART_FIRST = 0x3A6EA5    # the first series of a chart (our own blue)
CHART_SECOND = 0xE8862A   # the second series (our own orange)
CHART_LINE = 0x7A2E2E     # a reference line (the four-fifths line)
HEADING_RULE = 0x333333
NOTE_GREY = 0x555555
FORMULA_GREY = 0x6B6B6B

# ---------------------------------------------------------------------------------------------
# Invented data

# Promotion decisions in 2025 by office: Design promoted, Design not promoted, Assembly promoted,
# Assembly not promoted. Chosen so that pooled over the offices Design looks favoured while within
# every office but one Assembly's rate is a little higher (Simpson's paradox): Design staff work
# mostly in Northgate, where promotion rates are high for everyone.
OFFICES = [("Northgate", 41, 56, 10, 11),
           ("Riverside", 23, 61, 12, 25),
           ("Hillcrest", 7, 31, 13, 70),
           ("Lakeview", 2, 25, 11, 93)]

# Candidates for the 2025 team-leader programme by age band: selected, considered.
AGE_BANDS = [("Under 30", 19, 64),
             ("30 to 39", 27, 88),
             ("40 to 49", 15, 57),
             ("50 and over", 6, 31)]

# The target mix of approval channels in the finance policy (invented), in percent.
PLANNED_CHANNEL_SHARES = {"Automatic match": 65, "Manager approval": 28, "Manual override": 7}

INVOICE_COUNT = 600
INVOICE_SEED = 19
REGIONS = (("North", 0.28, 1.0), ("Midlands", 0.25, 1.0), ("South", 0.27, 2.2), ("Coastal", 0.20, 0.9))
SIZE_BANDS = ((1000, "Band 1: under 1,000"), (5000, "Band 2: 1,000 to 4,999"),
              (20000, "Band 3: 5,000 to 19,999"), (math.inf, "Band 4: 20,000 and over"))


def size_band(amount):
    return next(name for limit, name in SIZE_BANDS if amount < limit)


def invoice_records(seed=INVOICE_SEED, count=INVOICE_COUNT):
    """(id, region, channel, amount, exception, re-audit) per invoice. Exceptions are more likely
    in the South, through manual overrides and for larger invoices; every fifth invoice is
    re-audited (the others have a blank re-audit). Only Random.random() is used, whose sequence
    Python keeps the same across versions."""
    rng = random.Random(seed)

    def pick(weights):
        u, total = rng.random() * sum(weights.values()), 0.0
        for item, weight in weights.items():
            total += weight
            if u < total:
                return item
        return item

    records = []
    for i in range(count):
        region = pick({name: share for name, share, _ in REGIONS})
        region_factor = {name: factor for name, _, factor in REGIONS}[region]
        normal = math.sqrt(-2 * math.log(1 - rng.random())) * math.cos(2 * math.pi * rng.random())
        amount = max(35.0, round(math.exp(math.log(2600) + 1.25 * normal), 2))
        if amount >= 5000:
            channel = pick({"Automatic match": 0.35, "Manager approval": 0.55, "Manual override": 0.10})
        else:
            channel = pick({"Automatic match": 0.62, "Manager approval": 0.28, "Manual override": 0.10})
        base = {"Automatic match": 0.04, "Manager approval": 0.09, "Manual override": 0.26}[channel]
        size_factor = {1: 0.8, 2: 1.0, 3: 1.3, 4: 1.7}[int(size_band(amount)[5])]
        exception = "Yes" if rng.random() < min(0.9, base * region_factor * size_factor) else "No"
        reaudit = ""
        if i % 5 == 2:
            kept = 0.9 if exception == "Yes" else 0.92
            reaudit = exception if rng.random() < kept else ("No" if exception == "Yes" else "Yes")
        records.append((f"INV-25-{i + 1:04d}", region, channel, amount, exception, reaudit))
    return records


# ---------------------------------------------------------------------------------------------
# Writing cells

def column_name(index):
    name = ""
    index += 1
    while index:
        index, rest = divmod(index - 1, 26)
        name = chr(ord("A") + rest) + name
    return name


def split_address(cell):
    match = re.fullmatch(r"([A-Z]+)(\d+)", cell)
    column = 0
    for letter in match.group(1):
        column = column * 26 + ord(letter) - ord("A") + 1
    return column - 1, int(match.group(2)) - 1


class Workbook:
    """A new spreadsheet document with our styles, and helpers that write to it."""

    def __init__(self, office, title):
        self.office = office
        self.doc = office.new_spreadsheet()
        self.doc.DocumentProperties.Title = title
        self.doc.DocumentProperties.Author = "Assoc samples (scripts/build_samples.py)"
        self.formats = {}
        self._make_styles()
        self.heat_maps = []  # (sheet name, range) for the colour scales written into the XML

    # -- styles ------------------------------------------------------------------------------
    def number_format(self, code):
        from com.sun.star.lang import Locale
        if code not in self.formats:
            locale = Locale("en", "US", "")
            key = self.doc.NumberFormats.queryKey(code, locale, False)
            self.formats[code] = key if key != -1 else self.doc.NumberFormats.addNew(code, locale)
        return self.formats[code]

    def _make_styles(self):
        import uno
        from com.sun.star.table import BorderLine2
        bold, italic = 150.0, uno.Enum("com.sun.star.awt.FontSlant", "ITALIC")
        left = uno.Enum("com.sun.star.table.CellHoriJustify", "LEFT")
        rule = BorderLine2()
        rule.Color, rule.OuterLineWidth, rule.LineWidth = HEADING_RULE, 18, 18
        styles = self.doc.StyleFamilies.getByName("CellStyles")
        default = styles.getByName("Default")
        default.CharFontName, default.CharHeight = "Liberation Sans", 10.0
        default.VertJustify = 1  # top
        definitions = {
            "Assoc title": dict(CharHeight=14.0, CharWeight=bold),
            "Assoc note": dict(CharPosture=italic, CharColor=NOTE_GREY),
            "Assoc section": dict(CharWeight=bold, CharHeight=11.0),
            "Assoc header": dict(CharWeight=bold, IsTextWrapped=True, BottomBorder=rule),
            "Assoc label": dict(IsTextWrapped=True),
            "Assoc flag": dict(IsTextWrapped=False, HoriJustify=left, CharColor=CHART_LINE),
            "Assoc text": dict(IsTextWrapped=True, HoriJustify=left),
            "Assoc formula": dict(CharColor=FORMULA_GREY, CharFontName="Liberation Mono", CharHeight=8.5),
            "Assoc count": dict(NumberFormat=self.number_format("#,##0")),
            "Assoc amount": dict(NumberFormat=self.number_format("#,##0.00")),
            "Assoc p-value": dict(NumberFormat=self.number_format("[<0.0001]0.0E+00;0.0000")),
            "Assoc ratio": dict(NumberFormat=self.number_format("0.00")),
            "Assoc strength": dict(NumberFormat=self.number_format("0.000")),
            "Assoc residual": dict(NumberFormat=self.number_format("0.00")),
            "Assoc rate": dict(NumberFormat=self.number_format("0.0%")),
            "Assoc whole": dict(NumberFormat=self.number_format("0")),
        }
        for name, values in definitions.items():
            style = self.doc.createInstance("com.sun.star.style.CellStyle")
            styles.insertByName(name, style)
            style.ParentStyle = "Default"
            for key, value in values.items():
                style.setPropertyValue(key, value)
        for low, colour, _ in HEAT_MAP:
            style = self.doc.createInstance("com.sun.star.style.CellStyle")
            name = f"Assoc heat {low:+d}".replace("+0", "0")
            styles.insertByName(name, style)
            style.ParentStyle = "Default"
            style.CellBackColor = colour
            style.CharColor = 0x000000  # the PuOr colours are light enough for black text
            style.HoriJustify = uno.Enum("com.sun.star.table.CellHoriJustify", "CENTER")

        pages = self.doc.StyleFamilies.getByName("PageStyles")
        for name, landscape, one_page in (("Assoc sheet", True, True), ("Assoc records", False, False)):
            page = self.doc.createInstance("com.sun.star.style.PageStyle")
            pages.insertByName(name, page)
            page.IsLandscape = landscape
            page.Width, page.Height = (29700, 21000) if landscape else (21000, 29700)
            page.TopMargin = page.BottomMargin = 1200
            page.LeftMargin = page.RightMargin = 1300
            page.HeaderIsOn = False
            page.FooterIsOn = True
            if one_page:
                page.ScaleToPagesX, page.ScaleToPagesY = 1, 1
            else:
                page.ScaleToPagesX, page.ScaleToPagesY = 1, 0
            footer = page.RightPageFooterContent
            footer.CenterText.setString("Assoc sample: invented data of a fictional company. An association is "
                                        "not proof of cause or of discrimination.")
            footer.RightText.setString("")
            footer.LeftText.setString("")
            page.RightPageFooterContent = footer

    # -- sheets ------------------------------------------------------------------------------
    def sheet(self, name, widths_cm, records=False):
        sheets = self.doc.Sheets
        if sheets.Count == 1 and sheets.getByIndex(0).Name == "Sheet1" and not getattr(self, "_named_first", False):
            sheets.getByIndex(0).Name = name
            self._named_first = True
        else:
            sheets.insertNewByName(name, sheets.Count)
        sheet = Sheet(self, sheets.getByName(name))
        sheet.raw.PageStyle = "Assoc records" if records else "Assoc sheet"
        for index, width in enumerate(widths_cm):
            sheet.raw.Columns.getByIndex(index).Width = int(width * 1000)
        return sheet

    def name_range(self, name, sheet, cells):
        from com.sun.star.table import CellAddress
        first, _, last = cells.partition(":")
        reference = f"${quoted(sheet.name)}.{absolute(first)}" + (f":{absolute(last)}" if last else "")
        self.doc.NamedRanges.addNewByName(name, reference, CellAddress(0, 0, 0), 0)


def quoted(sheet_name):
    """A sheet name as references write it: in single quotes when it holds more than letters and digits."""
    return sheet_name if re.fullmatch(r"\w+", sheet_name) else "'" + sheet_name.replace("'", "''") + "'"


def absolute(cell):
    column, row = split_address(cell)
    return f"${column_name(column)}${row + 1}"


class Sheet:
    def __init__(self, book, raw):
        self.book, self.raw, self.name = book, raw, raw.Name

    def cells(self, address):
        return self.raw.getCellRangeByName(address)

    def put(self, cell, rows, style=None):
        """Writes a block of constants (None: blank) with its top-left corner at `cell`."""
        column, row = split_address(cell)
        width = max(len(r) for r in rows)
        data = tuple(tuple("" if v is None else (float(v) if isinstance(v, (int, float)) else v)
                           for v in list(r) + [None] * (width - len(r))) for r in rows)
        block = self.raw.getCellRangeByPosition(column, row, column + width - 1, row + len(rows) - 1)
        block.setDataArray(data)
        if style:
            block.CellStyle = style
        return block

    def text(self, cell, value, style=None, across=None):
        target = self.cells(cell)
        target.setString(value)
        if style:
            target.CellStyle = style
        if across:
            self.cells(f"{cell}:{across}").merge(True)
        return target

    def formula(self, cell, text, style=None, show=None):
        """A formula in one cell; `show` names a cell that displays the formula's text."""
        target = self.cells(cell)
        target.setFormula(text)
        if style:
            target.CellStyle = style
        if show:
            self.show_formula(show, cell)
        return target

    def array(self, cells, text, style=None, show=None):
        block = self.cells(cells)
        block.setArrayFormula(text)
        if style:
            block.CellStyle = style
        if show:
            self.show_formula(show, cells.split(":")[0])
        return block

    def show_formula(self, cell, of):
        # The formula text, live: FORMULA() shows it as the user would type it (array braces included).
        target = self.cells(cell)
        target.setFormula(f"=FORMULA({of})")
        target.CellStyle = "Assoc formula"

    def heat_map(self, cells):
        self.book.heat_maps.append((self.name, cells))

    def heat_map_key(self, cell):
        """A row of three cells in the heat map's colours, with what they mean."""
        column, row = split_address(cell)
        self.text(cell, "Heat map (adjusted residuals):", "Assoc label")
        for offset, (low, _, meaning) in enumerate(HEAT_MAP):
            target = self.raw.getCellByPosition(column + 1 + offset, row)
            target.setString(meaning.split(":")[0])
            target.CellStyle = f"Assoc heat {low:+d}".replace("+0", "0")
        meanings = "; ".join(meaning for _, _, meaning in HEAT_MAP)
        self.text(f"{column_name(column + 1)}{row + 2}", f"{meanings}. Beyond about ±2 stands out.", "Assoc note")

    def notes(self, cell, paragraphs, width=150):
        """Notes as lines of plain text that run over the empty cells to their right."""
        column, row = split_address(cell)
        for paragraph in paragraphs:
            for line in textwrap.wrap(paragraph, width, subsequent_indent="  ") or [""]:
                self.raw.getCellByPosition(column, row).setString(line)
                row += 1
        return row

    def height(self, row, lines):
        self.raw.Rows.getByIndex(row - 1).Height = int(440 * lines + 60)

    def fit_text_height(self, cell, width_chars, label_chars=34):
        """Sets the height of a row with a wrapped merged cell (whose height Calc does not fit) to show
        its recalculated text and the label in column A."""
        def lines(text, width):
            return sum(max(1, math.ceil(len(part) / width)) for part in text.split("\n"))
        row = split_address(cell)[1] + 1
        self.height(row, max(lines(self.cells(cell).getString(), width_chars),
                             lines(self.cells(f"A{row}").getString(), label_chars)))

    def chart(self, name, anchor, size_cm, ranges, title, y_title, percent=False, line_series=None,
              legend=True, stacked_shares=False):
        """Columns (one series per column of the ranges), optionally with one series drawn as a line
        (`line_series`), or columns stacked to 100% (`stacked_shares`)."""
        from com.sun.star.awt import Rectangle
        position = self.cells(anchor).Position
        addresses = tuple(self.cells(r).RangeAddress for r in ranges)
        self.raw.Charts.addNewByName(name, Rectangle(position.X, position.Y, int(size_cm[0] * 1000),
                                                     int(size_cm[1] * 1000)), addresses, True, True)
        chart = self.raw.Charts.getByName(name).getEmbeddedObject()
        chart.HasMainTitle = True
        chart.Title.String = title
        chart.Title.CharHeight = 11.0
        chart.HasLegend = legend
        if legend:
            chart.Legend.Alignment = uno_enum("com.sun.star.chart.ChartLegendPosition", "BOTTOM")
        diagram = chart.Diagram
        diagram.Wall.FillColor = 0xFFFFFF
        diagram.XAxis.TextBreak = True  # long category names wrap instead of turning
        diagram.XAxis.TextRotation = 0
        diagram.HasYAxisTitle = True
        diagram.YAxisTitle.String = y_title
        diagram.YAxis.AutoMin = False
        diagram.YAxis.Min = 0.0
        if stacked_shares:
            diagram.Stacked = True
            diagram.Percent = True
        if percent:
            diagram.YAxis.LinkNumberFormatToSource = False
            diagram.YAxis.NumberFormat = self.book.number_format("0%")
        coordinates = chart.getFirstDiagram().getCoordinateSystems()[0]
        bars = coordinates.getChartTypes()[0]
        series = list(bars.getDataSeries())
        for one, colour in zip(series, (CHART_FIRST, CHART_SECOND, CHART_LINE)):
            one.Color = colour
        if line_series is not None:
            line = self.book.office.service("com.sun.star.chart2.LineChartType")
            coordinates.addChartType(line)
            moved = series[line_series]
            bars.removeDataSeries(moved)
            line.addDataSeries(moved)
            moved.Color = CHART_LINE
            moved.LineWidth = 50
        return chart


def heading(sheet, cell, text, across=None):
    sheet.text(cell, text, "Assoc section", across)


def header_row(sheet, cell, labels):
    sheet.put(cell, [labels], "Assoc header")


# ---------------------------------------------------------------------------------------------
# The HR workbook

def build_offices_sheet(book):
    s = book.sheet("Offices", [6.6, 2.6, 2.6, 2.6, 2.6, 2.6, 5.8, 0.5, 3.4, 2.2, 2.2])
    s.text("A1", "Larkspur Components Ltd: promotions in 2025 by department, office by office", "Assoc title")
    s.text("A2", "Invented data of a fictional company. Every result is a live ASSOC.* formula; the grey text "
                 "beside it is the formula.", "Assoc note")

    heading(s, "A4", "1. Promotion decisions in each office (the strata)")
    header_row(s, "A5", ["Office", "Design: promoted", "Design: not promoted", "Assembly: promoted",
                         "Assembly: not promoted"])
    s.put("A6", [[name] for name, *_ in OFFICES])
    s.put("B6", [counts for _, *counts in OFFICES], "Assoc count")
    book.name_range("OfficeStrata", s, "A5:E9")

    heading(s, "A11", "2. All offices pooled")
    header_row(s, "A12", ["Department / Promotion outcome", "Promoted", "Not promoted", "Promotion rate"])
    s.put("A13", [["Design"], ["Assembly"]])
    for row, (promoted, not_promoted) in ((13, ("B", "C")), (14, ("D", "E"))):
        s.formula(f"B{row}", f"=SUM({promoted}6:{promoted}9)", "Assoc count")
        s.formula(f"C{row}", f"=SUM({not_promoted}6:{not_promoted}9)", "Assoc count")
        s.formula(f"D{row}", f"=B{row}/(B{row}+C{row})", "Assoc rate")
    book.name_range("PooledTable", s, "A12:C14")

    heading(s, "A16", "3. Pooled against within offices")
    header_row(s, "A17", ["Result", "", "", "", "", "", "Formula"])
    s.text("A18", "Pooled: p-value of Pearson X²", "Assoc label")
    s.formula("B18", "=ASSOC.PVALUE(A12:C14)", "Assoc p-value", show="G18")
    s.text("A19", "Pooled: odds ratio of promotion, Design against Assembly, and its 95% limits", "Assoc label")
    s.array("B19:D19", "=ASSOC.ODDSRATIO(A12:C14)", "Assoc ratio", show="G19")
    s.text("A20", "Pooled: risk ratio (Design's promotion rate over Assembly's) and its 95% limits", "Assoc label")
    s.array("B20:D20", "=ASSOC.RISKRATIO(A12:C14)", "Assoc ratio", show="G20")
    s.text("A21", "Within offices (Mantel–Haenszel): p-value, X² (1 df), common odds ratio, its 95% limits",
           "Assoc label")
    s.array("B21:F21", "=ASSOC.STRATA(A5:E9)", "Assoc ratio", show="G21")
    s.cells("B21").CellStyle = "Assoc p-value"
    s.text("A22", "Does one odds ratio fit every office? (Breslow–Day) p-value, statistic, df", "Assoc label")
    s.array("B22:D22", "=ASSOC.HOMOGENEITY(A5:E9)", "Assoc ratio", show="G22")
    s.cells("B22").CellStyle = "Assoc p-value"
    s.cells("D22").CellStyle = "Assoc whole"
    s.text("A23", "What ASSOC.CHECK says about the strata", "Assoc label")
    s.formula("B23", '=ASSOC.CHECK(A5:E9; "strata")', "Assoc text")
    s.cells("B23:F23").merge(True)
    s.show_formula("G23", "B23")
    book.name_range("PooledPValue", s, "B18")
    book.name_range("PooledOddsRatio", s, "B19:D19")
    book.name_range("PooledRiskRatio", s, "B20:D20")
    book.name_range("StrataResult", s, "B21:F21")
    book.name_range("HomogeneityResult", s, "B22:D22")

    heading(s, "A25", "4. Why: where each department works (counts, and adjusted residuals with the heat map)")
    header_row(s, "A26", ["Office / Department", "Design", "Assembly", "", "Design", "Assembly", "Formula"])
    for i, r in enumerate(range(27, 31)):
        s.formula(f"A{r}", f"=A{6 + i}")
        s.formula(f"B{r}", f"=B{6 + i}+C{6 + i}", "Assoc count")
        s.formula(f"C{r}", f"=D{6 + i}+E{6 + i}", "Assoc count")
    s.array("E27:F30", '=ASSOC.RESIDUALS(A26:C30; "adjusted")', "Assoc residual", show="G27")
    s.heat_map("E27:F30")
    s.text("A31", "p-value: do the offices differ in their mix of departments?", "Assoc label")
    s.formula("B31", "=ASSOC.PVALUE(A26:C30)", "Assoc p-value", show="G31")

    heading(s, "A33", "5. Why: promotion by office, both departments together")
    header_row(s, "A34", ["Office / Promotion outcome", "Promoted", "Not promoted", "", "Promoted",
                          "Not promoted", "Formula"])
    for i, r in enumerate(range(35, 39)):
        s.formula(f"A{r}", f"=A{6 + i}")
        s.formula(f"B{r}", f"=B{6 + i}+D{6 + i}", "Assoc count")
        s.formula(f"C{r}", f"=C{6 + i}+E{6 + i}", "Assoc count")
    s.array("E35:F38", '=ASSOC.RESIDUALS(A34:C38; "adjusted")', "Assoc residual", show="G35")
    s.heat_map("E35:F38")
    s.text("A39", "p-value: do the offices differ in promotion rate?", "Assoc label")
    s.formula("B39", "=ASSOC.PVALUE(A34:C38)", "Assoc p-value", show="G39")
    s.heat_map_key("A41")

    # Rates for the chart, to the right.
    heading(s, "I4", "Promotion rate by office")
    header_row(s, "I5", ["Office", "Design", "Assembly"])
    for i, r in enumerate(range(6, 10)):
        s.formula(f"I{r}", f"=A{r}")
        s.formula(f"J{r}", f"=B{r}/(B{r}+C{r})", "Assoc rate")
        s.formula(f"K{r}", f"=D{r}/(D{r}+E{r})", "Assoc rate")
    s.text("I10", "All offices")
    s.formula("J10", "=D13", "Assoc rate")
    s.formula("K10", "=D14", "Assoc rate")
    s.chart("OfficeRates", "I12", (12.5, 8.5), ["I5:K10"], "Promotion rate by office and department",
            "Share promoted", percent=True)
    return s


def offices_notes(s):
    value = lambda cell: s.cells(cell).getValue()  # noqa: E731
    design, assembly = value("D13"), value("D14")
    expect(value("B18") < 0.05 and value("B19") > 1, "pooled, Design is significantly favoured")
    expect(value("B21") > 0.05 and value("D21") < 1, "within offices the odds ratio is below 1, not significant")
    expect(value("B22") > 0.05, "one odds ratio fits every office")
    expect(value("E27") > 2 and value("E35") > 2, "Design staff and promotions both concentrate in Northgate")
    s.text("A45", "Reading the results", "Assoc section")
    s.notes("A46", [
        "Pooled over the four offices, Design staff were promoted more often than Assembly staff "
        f"({percent(design, 1)} against {percent(assembly, 1)}; odds ratio {fixed(value('B19'), 2)}, "
        f"{p_text(value('B18'))}). Office by office the difference vanishes and even turns slightly the other way: "
        f"the Mantel–Haenszel common odds ratio is {fixed(value('D21'), 2)} (95% limits {fixed(value('E21'), 2)} to "
        f"{fixed(value('F21'), 2)}, {p_text(value('B21'))}), and one common odds ratio fits every office "
        f"(Breslow–Day {p_text(value('B22'))}).",
        "Why: Design staff work mostly in Northgate, where promotion rates are high for everyone (sections 4 and 5: "
        "orange cells have more people than independence predicts, purple cells fewer). Pooling mixes the office "
        "effect into the comparison of departments. This reversal is known as Simpson's paradox.",
        "Which comparison answers your question is a judgement: comparing within offices removes the office "
        "effect, but other differences that the table does not record may remain.",
        "Cautions: an association is not proof of cause. Small samples and many tests mislead: at the 5% level "
        "about one test in twenty is 'significant' by chance alone. For decisions about people a significant "
        "result is not proof of discrimination, and a non-significant one is not proof of fairness. Follow "
        "applicable law and policy, and seek qualified advice.",
    ], width=165)


def build_selection_sheet(book):
    s = book.sheet("Selection", [6.6, 2.6, 2.6, 2.6, 2.6, 2.6, 5.8, 0.5, 3.4, 2.2, 2.2])
    s.text("A1", "Larkspur Components Ltd: selection for the 2025 team-leader programme by age band",
           "Assoc title")
    s.text("A2", "Invented data of a fictional company. Every result is a live ASSOC.* formula; the grey text "
                 "beside it is the formula.", "Assoc note")

    heading(s, "A4", "1. Candidates considered and selected")
    header_row(s, "A5", ["Age band / Decision", "Selected", "Not selected", "Considered"])
    s.put("A6", [[band] for band, _, _ in AGE_BANDS])
    s.put("B6", [[selected] for _, selected, _ in AGE_BANDS], "Assoc count")
    s.put("D6", [[considered] for _, _, considered in AGE_BANDS], "Assoc count")
    for r in range(6, 10):
        s.formula(f"C{r}", f"=D{r}-B{r}", "Assoc count")
    book.name_range("SelectionTable", s, "A5:C9")

    heading(s, "A11", "2. Selection rates and the four-fifths screen")
    header_row(s, "A12", ["Age band", "Selection rate", "Ratio to the highest rate", "Flag", "", "",
                          "Formula"])
    for i, r in enumerate(range(13, 17)):
        s.formula(f"A{r}", f"=A{6 + i}")
    s.array("B13:D16", "=ASSOC.IMPACT(B6:B9; D6:D9)", "Assoc ratio", show="G13")
    s.cells("B13:B16").CellStyle = "Assoc rate"
    s.cells("D13:D16").CellStyle = "Assoc flag"
    book.name_range("ImpactResult", s, "B13:D16")
    heading(s, "I4", "Rates for the chart")
    header_row(s, "I5", ["Age band", "Selection rate", "Four-fifths line"])
    for i, r in enumerate(range(6, 10)):
        s.formula(f"I{r}", f"=A{r + 7}")
        s.formula(f"J{r}", f"=B{r + 7}", "Assoc rate")
        s.formula(f"K{r}", "=0.8*MAX($B$13:$B$16)", "Assoc rate")

    heading(s, "A18", "3. Tests on the same table")
    header_row(s, "A19", ["Result", "", "", "", "", "", "Formula"])
    rows = [
        ("p-value of Pearson X²", "B20", "=ASSOC.PVALUE(A5:C9)", "Assoc p-value"),
        ("p-value, exact test", "B21", "=ASSOC.EXACT(A5:C9)", "Assoc p-value"),
        ("Cramér's V", "B23", "=ASSOC.STRENGTH(A5:C9)", "Assoc strength"),
        ("Power to find a medium effect (w = 0.3) with these candidates", "B25",
         "=ASSOC.POWER(0.3; SUM(D6:D9); ASSOC.DF(A5:C9))", "Assoc rate"),
        ("Power to find an effect the size of the one seen (Cohen's w of this table)", "B26",
         '=ASSOC.POWER(ASSOC.STRENGTH(A5:C9; "w"); SUM(D6:D9); ASSOC.DF(A5:C9))', "Assoc rate"),
        ("Candidates needed for power 0.8 against an effect that size", "B27",
         '=ASSOC.SAMPLESIZE(ASSOC.STRENGTH(A5:C9; "w"); 0.8; ASSOC.DF(A5:C9))', "Assoc count"),
    ]
    for label, cell, text, style in rows:
        s.text(f"A{cell[1:]}", label, "Assoc label")
        s.formula(cell, text, style, show=f"G{cell[1:]}")
    s.text("A22", "Trend across the ordered age bands (Cochran–Armitage): p-value and z", "Assoc label")
    s.array("B22:C22", "=ASSOC.TREND(A5:C9)", "Assoc ratio", show="G22")
    s.cells("B22").CellStyle = "Assoc p-value"
    s.text("A24", "Can the chi-squared test be trusted here?", "Assoc label")
    s.formula("B24", "=ASSOC.CHECK(A5:C9)", "Assoc text")
    s.cells("B24:F24").merge(True)
    s.show_formula("G24", "B24")
    book.name_range("SelectionPValue", s, "B20")
    book.name_range("SelectionExact", s, "B21")
    book.name_range("SelectionTrend", s, "B22:C22")

    heading(s, "A29", "4. Adjusted residuals (heat map)")
    header_row(s, "A30", ["Age band", "Selected", "Not selected", "", "", "", "Formula"])
    for i, r in enumerate(range(31, 35)):
        s.formula(f"A{r}", f"=A{6 + i}")
    s.array("B31:C34", '=ASSOC.RESIDUALS(A5:C9; "adjusted")', "Assoc residual", show="G31")
    s.heat_map("B31:C34")
    s.heat_map_key("A36")

    s.chart("SelectionRates", "I11", (12.5, 7.5), ["I5:K9"], "Selection rate by age band",
            "Share selected", percent=True, line_series=1)
    return s


def selection_notes(s):
    value = lambda cell: s.cells(cell).getValue()  # noqa: E731
    rates = [value(f"B{r}") for r in range(13, 17)]
    ratios = [value(f"C{r}") for r in range(13, 17)]
    flagged = [AGE_BANDS[i][0] for i in range(4) if s.cells(f"D{13 + i}").getString()]
    top, low = rates.index(max(rates)), rates.index(min(rates))
    band, selected, considered = AGE_BANDS[low]
    two_more = (selected + 2) / considered / max(rates)
    expect(flagged == [band], f"only {band} is flagged")
    expect(value("B20") > 0.05 and value("B21") > 0.05 and value("B22") > 0.05, "no test is significant")
    expect(value("B25") > 0.8 and value("B26") < 0.5, "high power for w = 0.3, low for the effect seen")
    expect(two_more >= 0.8, "two more selections lift the flagged band above four-fifths")
    s.text("A39", "Reading the results", "Assoc section")
    s.notes("A40", [
        f"ASSOC.IMPACT divides each band's selection rate by the highest one ({percent(max(rates), 1)}, "
        f"{AGE_BANDS[top][0]}). {band}: {percent(rates[low], 1)}, a ratio of {fixed(ratios[low], 2)}, below "
        f"four-fifths, so it is flagged. With only {considered} candidates in that band the ratio is unstable: two "
        f"more selections ({selected + 2} of {considered}) would give {fixed(two_more, 2)}, above four-fifths.",
        f"The tests do not find the differences significant (Pearson {p_text(value('B20'))}, exact "
        f"{p_text(value('B21'))}, trend {p_text(value('B22'))}). That is not proof of no difference: the test would "
        f"very likely find a medium effect (power {percent(value('B25'), 0)}), but for an effect the size of the one "
        f"seen its power is only {percent(value('B26'), 0)}; about {fixed(value('B27'), 0, grouping=True)} "
        "candidates would be needed. A flag without significance, or significance without a flag, calls for a "
        "closer look, not a conclusion.",
        "The four-fifths ratio is a rule of thumb for screening, not a test, and not a legal threshold everywhere. "
        "For decisions about people a significant result is not proof of discrimination, and a non-significant one "
        "is not proof of fairness. An association is not proof of cause. Follow applicable law and policy, and seek "
        "qualified advice.",
    ], width=165)


def expect(condition, premise):
    """The notes describe these results in words: stop the build if the data no longer fit them."""
    if not condition:
        raise RuntimeError(f"the sample's notes assume that {premise}; rewrite them for the new data")


def p_text(p):
    return "p < 0.001" if p < 0.001 else f"p = {fixed(p, 3)}" if p < 0.1 else f"p = {fixed(p, 2)}"


def fixed(number, places, grouping=False):
    """A number with `places` decimals as Calc displays it: from its 15 significant digits, rounded half
    away from zero. (Python's own formatting rounds the binary value half to even: f"{0.0625:.1%}" gives
    6.2% where the cell shows 6.3%.) Every number the notes quote goes through here or percent()."""
    rounded = decimal.Decimal(f"{number:.15g}").quantize(decimal.Decimal(1).scaleb(-places),
                                                           rounding=decimal.ROUND_HALF_UP)
    return f"{rounded:,.{places}f}" if grouping else f"{rounded:.{places}f}"


def percent(share, places):
    """A share as a percentage with `places` decimals, rounded as Calc displays it (see fixed)."""
    return fixed(float(decimal.Decimal(f"{share:.15g}") * 100), places) + "%"


# ---------------------------------------------------------------------------------------------
# The HR workbook, Departments sheet: promotion rates with intervals, which departments differ, the
# difference in percentage points and the common risk ratio within offices (the figures of a memo).

# Promotion decisions in 2025 by department: promoted, not promoted. Design and Assembly are the same
# people as on the Offices sheet (pooled over the offices).
DEPARTMENT_PROMOTIONS = [("Design", 73, 173),
               ("Assembly", 46, 199),
               ("Sales", 41, 77),
               ("Finance", 10, 44),
               ("Logistics", 13, 84)]


def build_departments_sheet(book):
    """The Departments sheet; returns it with the rows that departments_notes reads."""
    s = book.sheet("Departments", [6.6, 2.6, 2.6, 2.6, 2.6, 2.6, 5.8, 0.5, 3.4, 2.2, 2.2, 2.2])
    s.text("A1", "Larkspur Components Ltd: promotion rates by department, and which departments differ",
           "Assoc title")
    s.text("A2", "Invented data of a fictional company. Every result is a live ASSOC.* formula; the grey text "
                 "beside it is the formula.", "Assoc note")
    count = len(DEPARTMENT_PROMOTIONS)
    pair_count = count * (count - 1) // 2
    last = 5 + count  # the table is A5:C{last}
    table = f"A5:C{last}"

    def as_rates(cells):
        # A percent style given together with a formula gets the office's 0.00% as a hard format; applied
        # afterwards, the style's own 0.0% holds (as on the Selection sheet).
        s.cells(cells).CellStyle = "Assoc rate"

    heading(s, "A4", "1. Promotion decisions in 2025 by department")
    header_row(s, "A5", ["Department / Promotion outcome", "Promoted", "Not promoted"])
    s.put("A6", [[name] for name, _, _ in DEPARTMENT_PROMOTIONS])
    s.put("B6", [[promoted, not_promoted] for _, promoted, not_promoted in DEPARTMENT_PROMOTIONS], "Assoc count")
    book.name_range("DepartmentTable", s, table)
    overall = last + 1
    s.text(f"A{overall}", "p-value of Pearson X²: do the departments differ at all?", "Assoc label")
    s.formula(f"B{overall}", f"=ASSOC.PVALUE({table})", "Assoc p-value", show=f"G{overall}")
    book.name_range("DepartmentPValue", s, f"B{overall}")

    top = overall + 2  # section 2: the rates
    heading(s, f"A{top}", "2. Each department's promotion rate with its 95% interval (Wilson)")
    header_row(s, f"A{top + 1}", ["Department", "People (n)", "Promotion rate", "Lower 95% limit",
                                  "Upper 95% limit", "", "Formula"])
    first_rate, last_rate = top + 2, top + 1 + count
    for i in range(count):
        s.formula(f"A{first_rate + i}", f"=A{6 + i}")
    s.array(f"B{first_rate}:E{last_rate}", f"=ASSOC.RATES({table})", "Assoc count", show=f"G{first_rate}")
    as_rates(f"C{first_rate}:E{last_rate}")
    book.name_range("DepartmentRates", s, f"B{first_rate}:E{last_rate}")

    top = last_rate + 2  # section 3: the pairs
    heading(s, f"A{top}", f"3. Which departments differ? Every pair, with p-values adjusted for the {pair_count} "
                          "comparisons (Holm)")
    header_row(s, f"A{top + 1}", ["First department", "Second department", "p-value", "Adjusted p-value",
                                  "Differs at 5% after adjustment?", "", "Formula"])
    first_pair, last_pair = top + 2, top + 1 + pair_count
    s.array(f"A{first_pair}:D{last_pair}", f"=ASSOC.PAIRWISE({table})", "Assoc p-value", show=f"G{first_pair}")
    s.cells(f"A{first_pair}:B{last_pair}").CellStyle = "Assoc label"
    for r in range(first_pair, last_pair + 1):
        s.formula(f"E{r}", f'=IF(D{r}<0.05;"yes";"no")')
    book.name_range("DepartmentPairs", s, f"A{first_pair}:D{last_pair}")
    s.text(f"A{last_pair + 1}", "Smallest adjusted p-value", "Assoc label")
    s.formula(f"D{last_pair + 1}", f"=MIN(INDEX(ASSOC.PAIRWISE({table});0;4))", "Assoc p-value",
              show=f"G{last_pair + 1}")

    top = last_pair + 3  # section 4: Design against Assembly
    heading(s, f"A{top}", "4. Design against Assembly: in percentage points, and within offices")
    header_row(s, f"A{top + 1}", ["Result", "Estimate", "Lower 95% limit", "Upper 95% limit", "", "", "Formula"])
    difference, ratio, common, screen = top + 2, top + 3, top + 4, top + 5
    s.text(f"A{difference}", "Pooled: Design's promotion rate minus Assembly's (Newcombe's interval)", "Assoc label")
    s.array(f"B{difference}:D{difference}", "=ASSOC.RATEDIFF(A5:C7)", "Assoc ratio", show=f"G{difference}")
    as_rates(f"B{difference}:D{difference}")
    s.text(f"A{ratio}", "Pooled: Design's promotion rate over Assembly's (risk ratio)", "Assoc label")
    s.array(f"B{ratio}:D{ratio}", "=ASSOC.RISKRATIO(A5:C7)", "Assoc ratio", show=f"G{ratio}")
    s.text(f"A{common}", "Within offices: the same ratio, office by office (Mantel–Haenszel common risk ratio; "
                         "the offices of the Offices sheet)", "Assoc label")
    s.array(f"B{common}:D{common}", "=ASSOC.STRATARISK(OfficeStrata)", "Assoc ratio", show=f"G{common}")
    s.text(f"A{screen}", "Four-fifths screen within offices: the lower rate over the higher", "Assoc label")
    s.formula(f"B{screen}", f"=MIN(B{common};1/B{common})", "Assoc ratio", show=f"G{screen}")
    s.formula(f"C{screen}", f'=IF(B{screen}<0.8;"below four-fifths";"not below four-fifths")', "Assoc flag")
    book.name_range("DesignAssemblyDifference", s, f"B{difference}:D{difference}")
    book.name_range("DesignAssemblyRiskRatio", s, f"B{ratio}:D{ratio}")
    book.name_range("CommonRiskRatio", s, f"B{common}:D{common}")

    top = screen + 2  # section 5: the residuals
    heading(s, f"A{top}", "5. Which cells stand out (adjusted residuals, heat map)")
    header_row(s, f"A{top + 1}", ["Department", "Promoted", "Not promoted", "", "", "", "Formula"])
    first_residual, last_residual = top + 2, top + 1 + count
    for i in range(count):
        s.formula(f"A{first_residual + i}", f"=A{6 + i}")
    s.array(f"B{first_residual}:C{last_residual}", f'=ASSOC.RESIDUALS({table}; "adjusted")', "Assoc residual",
            show=f"G{first_residual}")
    s.heat_map(f"B{first_residual}:C{last_residual}")
    s.heat_map_key(f"A{last_residual + 2}")

    # The chart: each rate with its interval as error bars (from the ASSOC.RATES block).
    heading(s, "I4", "Promotion rate with its 95% interval")
    header_row(s, "I5", ["Department", "Promotion rate", "Down to lower", "Up to upper"])
    for i in range(count):
        r, rate = 6 + i, first_rate + i
        s.formula(f"I{r}", f"=A{r}")
        s.formula(f"J{r}", f"=C{rate}", "Assoc ratio")
        s.formula(f"K{r}", f"=C{rate}-D{rate}", "Assoc ratio")
        s.formula(f"L{r}", f"=E{rate}-C{rate}", "Assoc ratio")
    as_rates(f"J6:L{last}")
    chart = s.chart("DepartmentRates", f"I{first_rate}", (12.5, 8.5), [f"I5:J{last}"],
                    "Promotion rate by department, with 95% intervals", "Share promoted", percent=True, legend=False)
    chart.Diagram.YAxis.AutoMax = False
    chart.Diagram.YAxis.Max = 0.5
    bars = chart.Diagram.getDataRowProperties(0)
    bars.ErrorBarStyle = 7  # com.sun.star.chart.ErrorBarStyle.FROM_DATA
    bars.ErrorIndicator = uno_enum("com.sun.star.chart.ChartErrorIndicatorType", "TOP_AND_BOTTOM")
    bars.ErrorBarRangeNegative = f"$Departments.$K$6:$K${last}"
    bars.ErrorBarRangePositive = f"$Departments.$L$6:$L${last}"
    rows = dict(overall=overall, first_rate=first_rate, first_pair=first_pair, last_pair=last_pair,
                difference=difference, ratio=ratio, common=common, screen=screen, notes=last_residual + 5)
    return s, rows


def departments_notes(s, rows):
    value = lambda cell: s.cells(cell).getValue()  # noqa: E731
    text = lambda cell: s.cells(cell).getString()  # noqa: E731
    names = [name for name, _, _ in DEPARTMENT_PROMOTIONS]
    rates = {name: [value(f"{column}{rows['first_rate'] + i}") for column in "CDE"] for i, name in enumerate(names)}
    pairs = [(text(f"A{r}"), text(f"B{r}"), value(f"C{r}"), value(f"D{r}"))
             for r in range(rows["first_pair"], rows["last_pair"] + 1)]
    significant = [f"{a}–{b}" for a, b, _, q in pairs if q < 0.05]
    chance = [(a, b, p, q) for a, b, p, q in pairs if p < 0.05 <= q]
    highest, lowest = max(names, key=lambda n: rates[n][0]), min(names, key=lambda n: rates[n][0])
    widest = max(names, key=lambda n: rates[n][2] - rates[n][1])
    difference = [value(f"{column}{rows['difference']}") for column in "BCD"]
    common = [value(f"{column}{rows['common']}") for column in "BCD"]
    screen = value(f"B{rows['screen']}")
    expect(value(f"B{rows['first_rate'] - 3}") < 0.05, "the departments differ overall")
    expect(len(significant) == 4 and "Design–Assembly" in significant, "four pairs differ, Design–Assembly among them")
    expect(len(chance) == 1 and chance[0][:2] == ("Sales", "Finance"), "only Sales–Finance loses its significance")
    expect(difference[1] > 0 and common[0] < 1 and common[1] < 1 < common[2],
           "pooled, Design is ahead; within offices the ratio is below 1 and not significant")
    expect(screen >= 0.8, "the within-office ratio passes the four-fifths screen")
    a, b, p, q = chance[0]
    row = rows["notes"]
    s.text(f"A{row}", "Reading the results", "Assoc section")
    s.notes(f"A{row + 1}", [
        f"Promotion rates run from {percent(rates[lowest][0], 1)} ({lowest}) to {percent(rates[highest][0], 1)} "
        f"({highest}). Each interval shows how far the department's underlying rate could plausibly be from the rate "
        f"seen: {widest}, with the fewest people, has the widest ({percent(rates[widest][1], 1)} to "
        f"{percent(rates[widest][2], 1)}). Overlapping intervals do not show that two departments are alike; the "
        "pairwise table compares them.",
        f"The pairwise table tests every pair of departments. After adjusting for the {len(pairs)} comparisons, "
        f"{len(significant)} pairs differ at the 5% level: {', '.join(significant[:-1])} and {significant[-1]}. "
        f"{a} and {b} look different on their own ({p_text(p)}) but not after the adjustment (adjusted "
        f"p = {fixed(q, 2)}): with {len(pairs)} comparisons a few small p-values are expected by chance alone, which "
        "is why the adjusted p-value is the one to read.",
        f"Design against Assembly: pooled over the offices, Design's promotion rate is "
        f"{fixed(difference[0] * 100, 1)} percentage points higher (95% limits {fixed(difference[1] * 100, 1)} to "
        f"{fixed(difference[2] * 100, 1)}). Office by office the picture turns: the common risk ratio is "
        f"{fixed(common[0], 2)} (95% limits {fixed(common[1], 2)} to {fixed(common[2], 2)}), so within offices "
        "Design's rate is slightly lower and the difference is not significant (the Offices sheet shows why). "
        f"Within offices neither department falls below four-fifths of the other ({fixed(screen, 2)}).",
        "Cautions: a significant difference between two departments is not proof of discrimination, nor of its "
        "cause: departments differ in roles, grades, offices and the people who apply. Many comparisons inflate "
        "false alarms, and small departments give wide intervals. For decisions about people, follow applicable law "
        "and policy, and seek qualified advice.",
    ], width=165)


# ---------------------------------------------------------------------------------------------
# The finance workbook

RECORD_LAST_ROW = INVOICE_COUNT + 1
RECORD_NAMES = {"InvRegion": "B", "InvChannel": "C", "InvAmount": "D", "InvBand": "E", "InvException": "F",
                "InvReaudit": "G"}


def build_invoice_sheet(book):
    s = book.sheet("Invoices", [2.6, 2.4, 3.6, 2.6, 4.4, 2.2, 2.2, 0.6, 12], records=True)
    header_row(s, "A1", ["Invoice", "Region", "Approval channel", "Amount", "Size band", "Exception",
                         "Re-audit"])
    records = invoice_records()
    s.put("A2", [[r[0], r[1], r[2]] for r in records])
    s.put("D2", [[r[3]] for r in records], "Assoc amount")
    s.put("F2", [[r[4], r[5]] for r in records])
    # The size band is a formula on the amount, so that a corrected amount moves its invoice.
    band = ('=IF(D{r}<1000;"Band 1: under 1,000";IF(D{r}<5000;"Band 2: 1,000 to 4,999";'
            'IF(D{r}<20000;"Band 3: 5,000 to 19,999";"Band 4: 20,000 and over")))')
    first = s.cells("E2")
    first.setFormula(band.format(r=2))
    s.cells(f"E2:E{RECORD_LAST_ROW}").fillAuto(uno_enum("com.sun.star.sheet.FillDirection", "TO_BOTTOM"), 1)
    for name, column in RECORD_NAMES.items():
        book.name_range(name, s, f"{column}2:{column}{RECORD_LAST_ROW}")
    s.notes("I1", [
        f"{INVOICE_COUNT} invented invoices of Larkspur Components Ltd (a fictional company), first quarter of 2025.",
        "Exception: the first check found a problem (Yes) or not (No). Re-audit: a second, independent check of "
        "every fifth invoice; blank where the invoice was not re-audited (ASSOC.COUNTS skips records with a blank "
        "label).",
        "Size band is a formula on the amount. The other sheets count these records live with ASSOC.LEVELS and "
        "ASSOC.COUNTS through the named ranges InvRegion, InvChannel, InvBand, InvException and InvReaudit.",
    ], width=70)
    s.raw.setPrintAreas((s.cells(f"A1:G{RECORD_LAST_ROW}").RangeAddress,))
    s.raw.setTitleRows(s.cells("A1:G1").RangeAddress)
    return s


def uno_enum(kind, value):
    import uno
    return uno.Enum(kind, value)


def counted_table(s, book, corner, labels_name, levels):
    """The table from the records at A5: corner label, exception levels across, `levels` rows of
    ASSOC.LEVELS down, ASSOC.COUNTS in the body, then the invoices and the exception rate."""
    last = 5 + levels
    s.text("A5", corner, "Assoc header")
    s.array("B5:C5", "=TRANSPOSE(ASSOC.LEVELS(InvException))", "Assoc header")
    s.put("D5", [["Invoices", "Exception rate", "Formula"]], "Assoc header")
    s.array(f"A6:A{last}", f"=ASSOC.LEVELS({labels_name})", None, show="F6")
    s.array(f"B6:C{last}", f"=ASSOC.COUNTS({labels_name}; InvException)", "Assoc count", show="F7")
    s.show_formula("F5", "B5")
    for r in range(6, last + 1):
        s.formula(f"D{r}", f"=B{r}+C{r}", "Assoc count")
        s.formula(f"E{r}", f"=C{r}/D{r}", "Assoc rate")
    total = last + 1
    s.text(f"A{total}", "All invoices", "Assoc label")
    for column in "BCD":
        s.formula(f"{column}{total}", f"=SUM({column}6:{column}{last})", "Assoc count")
    s.formula(f"E{total}", f"=C{total}/D{total}", "Assoc rate")
    s.cells(f"A{total}:E{total}").CharWeight = 150.0
    return f"A5:C{last}", total


def finance_tests(s, table, first_row, extra=()):
    """Section 2: the test of the table, its strength and ASSOC.CHECK's verdict. Returns the next row."""
    r = first_row
    header_row(s, f"A{r}", ["Result", "", "", "", "", "Formula"])
    lines = [("Pearson X², degrees of freedom, p-value", "B{r}:D{r}", f"=ASSOC.STATISTIC({table})",
              ("Assoc ratio", "Assoc whole", "Assoc p-value")),
             ("p-value, exact test", "B{r}", f"=ASSOC.EXACT({table})", ("Assoc p-value",)),
             ("Cramér's V", "B{r}", f"=ASSOC.STRENGTH({table})", ("Assoc strength",))] + list(extra)
    placed = {}
    for label, cells, text, styles in lines:
        r += 1
        cells = cells.format(r=r)
        s.text(f"A{r}", label, "Assoc label")
        if ":" in cells:
            s.array(cells, text, None, show=f"F{r}")
        else:
            s.formula(cells, text, None, show=f"F{r}")
        first_column = split_address(cells.split(":")[0])[0]
        for offset, style in enumerate(styles):
            s.raw.getCellByPosition(first_column + offset, r - 1).CellStyle = style
        placed[label] = cells
    r += 1
    s.text(f"A{r}", "Can the chi-squared test be trusted here?", "Assoc label")
    s.formula(f"B{r}", f"=ASSOC.CHECK({table})", "Assoc text")
    s.cells(f"B{r}:E{r}").merge(True)
    s.show_formula(f"F{r}", f"B{r}")
    placed["check"] = f"B{r}"
    return r + 2, placed


def standouts(s, table, first_row, labels_from, levels):
    """Section 3: adjusted residuals with the heat map, and the Holm-adjusted cell p-values."""
    r = first_row
    header_row(s, f"A{r}", ["", "No", "Yes", "", "", "Formula"])
    s.formula(f"B{r}", "=B5", "Assoc header")
    s.formula(f"C{r}", "=C5", "Assoc header")
    s.text(f"A{r}", "Adjusted residuals", "Assoc header")
    last = r + levels
    for i in range(levels):
        s.formula(f"A{r + 1 + i}", f"=A{labels_from + i}")
    s.array(f"B{r + 1}:C{last}", f'=ASSOC.RESIDUALS({table}; "adjusted")', "Assoc residual", show=f"F{r + 1}")
    s.heat_map(f"B{r + 1}:C{last}")
    r = last + 2
    header_row(s, f"A{r}", ["Holm-adjusted p-value of each cell", "", "", "", "", "Formula"])
    s.formula(f"B{r}", "=B5", "Assoc header")
    s.formula(f"C{r}", "=C5", "Assoc header")
    for i in range(levels):
        s.formula(f"A{r + 1 + i}", f"=A{labels_from + i}")
    s.array(f"B{r + 1}:C{r + levels}", f"=ASSOC.CELLTEST({table})", "Assoc p-value", show=f"F{r + 1}")
    cells = f"B{r + 1}:C{r + levels}"
    return r + levels + 2, f"B{first_row + 1}:C{last}", cells


FINANCE_WIDTHS = [6.4, 2.3, 2.3, 2.3, 2.4, 7.8, 0.5, 6.4, 2.4, 2.4, 2.4]


def build_region_sheet(book):
    s = book.sheet("By region", FINANCE_WIDTHS)
    s.text("A1", "Larkspur Components Ltd: invoice exceptions by region", "Assoc title")
    s.text("A2", f"{INVOICE_COUNT} invented invoices (sheet Invoices), counted live with ASSOC.LEVELS and "
                 "ASSOC.COUNTS. The grey text beside a result is its formula.", "Assoc note")
    heading(s, "A4", "1. Invoices by region and exception, counted from the records")
    table, total = counted_table(s, book, "Region / Exception", "InvRegion", 4)
    book.name_range("RegionTable", s, table)
    heading(s, f"A{total + 2}", "2. Is the exception rate related to region?")
    r, placed = finance_tests(s, table, total + 3)
    book.name_range("RegionStatistic", s, placed["Pearson X², degrees of freedom, p-value"])
    book.name_range("RegionExact", s, placed["p-value, exact test"])
    heading(s, f"A{r}", "3. Which regions stand out?")
    r, residuals, celltest = standouts(s, table, r + 1, 6, 4)
    book.name_range("RegionCellTest", s, celltest)
    s.heat_map_key(f"A{r}")
    s.chart("RegionRates", "H4", (12, 7.5), ["A5:A9", "E5:E9"], "Exception rate by region", "Share of invoices",
            percent=True, legend=False)
    p_cell = "D" + placed["Pearson X², degrees of freedom, p-value"].split(":")[0][1:]
    return s, (r + 3, p_cell, int(residuals.split(":")[0][1:]))


def standout_cells(s, first_row, count):
    """(label, column header, adjusted residual, Holm p) of the cells beyond ±2, from section 3."""
    found = []
    for i in range(count):
        for column in "BC":
            residual = s.cells(f"{column}{first_row + i}").getValue()
            if abs(residual) > 2:
                holm = s.cells(f"{column}{first_row + count + 2 + i}").getValue()
                found.append((s.cells(f"A{first_row + i}").getString(), s.cells(f"{column}5").getString(),
                              residual, holm))
    return found


def region_notes(s, row, p_cell, residual_row):
    value = lambda cell: s.cells(cell).getValue()  # noqa: E731
    rates = {s.cells(f"A{r}").getString(): value(f"E{r}") for r in range(6, 10)}
    top = max(rates, key=rates.get)
    beyond = standout_cells(s, residual_row, 4)
    held = sorted({label for label, _, _, holm in beyond if holm < 0.05})
    others = sorted({label for label, _, _, holm in beyond if holm >= 0.05})
    expect(value(p_cell) < 0.01 and held == [top] and others, f"{top} stands out after Holm's adjustment, and "
           "another region only before it")
    s.text(f"A{row}", "Reading the results", "Assoc section")
    s.notes(f"A{row + 1}", [
        f"Exception rates differ between regions ({p_text(value(p_cell))}); {top} has the highest rate "
        f"({percent(rates[top], 1)}). Adjusted residuals beyond ±2: {', '.join(sorted({b[0] for b in beyond}))}. "
        f"After Holm's adjustment for the {2 * len(rates)} cells only {top}'s stay small (p = "
        f"{fixed(min(h for l, _, _, h in beyond if l == top), 4)}): it has more exceptions, and fewer clean "
        f"invoices, than independence predicts. {', '.join(others)} alone would not count as standing out.",
        f"An association is not proof of cause: {top} may route more invoices through manual overrides, or have "
        "larger invoices (see the other sheets), rather than check them worse. Cramér's V is small although the "
        "p-value is small: with many invoices, modest differences become significant.",
        "Many tests mislead: this workbook runs several. ASSOC.CELLTEST's Holm adjustment allows for the cells of "
        "one table, not for every table in the workbook.",
    ], width=150)


def build_channel_sheet(book):
    s = book.sheet("By channel", FINANCE_WIDTHS)
    s.text("A1", "Larkspur Components Ltd: invoice exceptions by approval channel", "Assoc title")
    s.text("A2", f"{INVOICE_COUNT} invented invoices (sheet Invoices), counted live with ASSOC.LEVELS and "
                 "ASSOC.COUNTS. The grey text beside a result is its formula.", "Assoc note")
    heading(s, "A4", "1. Invoices by approval channel and exception, counted from the records")
    table, total = counted_table(s, book, "Approval channel / Exception", "InvChannel", 3)
    book.name_range("ChannelTable", s, table)
    heading(s, f"A{total + 2}", "2. Is the exception rate related to the approval channel?")
    simulate = ("Simulated p-value (20,000 random tables, seed 7), its standard error, trials", "B{r}:D{r}",
                f"=ASSOC.SIMULATE({table}; 20000; 7)", ("Assoc p-value", "Assoc p-value", "Assoc count"))
    r, placed = finance_tests(s, table, total + 3, extra=[simulate])
    book.name_range("ChannelStatistic", s, placed["Pearson X², degrees of freedom, p-value"])
    heading(s, f"A{r}", "3. Which channels stand out?")
    r, residuals, celltest = standouts(s, table, r + 1, 6, 3)
    s.heat_map_key(f"A{r}")
    r += 3
    heading(s, f"A{r}", "4. Does the channel mix follow the planned mix? (goodness of fit)")
    header_row(s, f"A{r + 1}", ["Approval channel", "Invoices", "Planned share", "", "", "Formula"])
    for i in range(3):
        row = r + 2 + i
        s.formula(f"A{row}", f"=A{6 + i}")
        s.formula(f"B{row}", f"=D{6 + i}", "Assoc count")
        # Looked up by name, so the planned share follows its channel whatever the order of the levels.
        # &"" because LibreOffice 7.4 compares text from an add-in's array result as unequal to the same
        # typed text in =, MATCH and VLOOKUP (COUNTIF and SUMIF are not affected).
        s.formula(f"C{row}", f'=VLOOKUP(A{row}&""; $H${r + 2}:$I${r + 4}; 2; 0)', "Assoc rate")
    header_row(s, f"H{r + 1}", ["Planned mix (finance policy)", "Share"])
    s.put(f"H{r + 2}", [[name, share / 100] for name, share in PLANNED_CHANNEL_SHARES.items()])
    s.cells(f"I{r + 2}:I{r + 4}").CellStyle = "Assoc rate"
    s.text(f"A{r + 5}", "Goodness of fit: p-value, X², degrees of freedom", "Assoc label")
    s.array(f"B{r + 5}:D{r + 5}", f"=ASSOC.FIT(B{r + 2}:B{r + 4}; C{r + 2}:C{r + 4})", "Assoc ratio",
            show=f"F{r + 5}")
    s.cells(f"B{r + 5}").CellStyle = "Assoc p-value"
    s.cells(f"D{r + 5}").CellStyle = "Assoc whole"
    book.name_range("ChannelFit", s, f"B{r + 5}:D{r + 5}")
    s.chart("ChannelRates", "H4", (12, 7.5), ["A5:A8", "E5:E8"], "Exception rate by approval channel",
            "Share of invoices", percent=True, legend=False)
    p_cell = "D" + placed["Pearson X², degrees of freedom, p-value"].split(":")[0][1:]
    return s, (r + 7, r + 5, p_cell, placed[simulate[0]].split(":")[0])


def channel_notes(s, row, fit_row, p_cell, simulated_cell):
    value = lambda cell: s.cells(cell).getValue()  # noqa: E731
    rates = {s.cells(f"A{r}").getString(): value(f"E{r}") for r in range(6, 9)}
    trials = 20000
    expect(value(simulated_cell) == 1 / (trials + 1), "no random table was as extreme as the observed one")
    expect(value(f"B{fit_row}") < 0.05, "the channel mix departs from the planned mix")
    s.text(f"A{row}", "Reading the results", "Assoc section")
    s.notes(f"A{row + 1}", [
        f"Manual overrides end in an exception far more often ({percent(rates['Manual override'], 1)}) than "
        f"automatic matches ({percent(rates['Automatic match'], 1)}); {p_text(value(p_cell))}. None of the "
        f"{trials:,} random tables of ASSOC.SIMULATE was as extreme, so its p-value is at its floor, "
        f"1/{trials + 1:,}: a simulated p-value is never 0, only as small as the number of trials allows.",
        "An association is not proof of cause: overrides may be used for invoices that were already unusual. The "
        f"goodness-of-fit test ({p_text(value(f'B{fit_row}'))}) asks another question: the channel mix departs "
        "from the planned mix.",
        f"Small samples and many tests mislead: only {fixed(value('D8'), 0)} invoices went through manual override, "
        "and each extra test adds a chance of a false alarm.",
    ], width=150)


def build_band_sheet(book):
    s = book.sheet("By size", FINANCE_WIDTHS)
    s.text("A1", "Larkspur Components Ltd: invoice exceptions by invoice size", "Assoc title")
    s.text("A2", "The size bands are ordered, so a trend test fits: does the exception rate rise with the size "
                 "of the invoice? The grey text beside a result is its formula.", "Assoc note")
    heading(s, "A4", "1. Invoices by size band and exception, counted from the records")
    table, total = counted_table(s, book, "Size band / Exception", "InvBand", 4)
    book.name_range("BandTable", s, table)
    heading(s, f"A{total + 2}", "2. Does the exception rate rise with invoice size?")
    trend = ("Trend across the ordered bands (Cochran–Armitage): p-value and z", "B{r}:C{r}",
             f"=ASSOC.TREND({table})", ("Assoc p-value", "Assoc ratio"))
    r, placed = finance_tests(s, table, total + 3, extra=[trend])
    book.name_range("BandTrend", s, placed[trend[0]])
    heading(s, f"A{r}", "3. Which bands stand out?")
    r, residuals, celltest = standouts(s, table, r + 1, 6, 4)
    s.heat_map_key(f"A{r}")
    s.chart("BandRates", "H4", (12, 7.5), ["A5:A9", "E5:E9"], "Exception rate by size band", "Share of invoices",
            percent=True, legend=False)
    return s, r + 3, placed[trend[0]].split(":")[0]


def band_notes(s, row, trend_cell):
    value = lambda cell: s.cells(cell).getValue()  # noqa: E731
    column, r = split_address(trend_cell)
    z = s.raw.getCellByPosition(column + 1, r).getValue()
    rates = [value(f"E{r}") for r in range(6, 10)]
    expect(value(trend_cell) < 0.01 and z < 0 and rates == sorted(rates), "the exception rate rises band by band")
    s.text(f"A{row}", "Reading the results", "Assoc section")
    s.notes(f"A{row + 1}", [
        f"The exception rate rises from band to band, from {percent(rates[0], 1)} to {percent(rates[-1], 1)} (trend "
        f"{p_text(value(trend_cell))}). z = {fixed(z, 2)} is negative because the first column of the table is 'No' "
        "(the labels are sorted): the share without an exception falls as invoices grow. The trend test uses the "
        "order of the bands (scores 1 to 4); the Pearson test ignores it.",
        f"The largest band holds only {fixed(value('D9'), 0)} invoices: ASSOC.CHECK reports its small expected "
        "count, and the exact p-value is the safer guide there. Larger invoices may differ in other ways (supplier, "
        "channel): an association is not proof of cause.",
    ], width=150)


def build_reaudit_sheet(book):
    s = book.sheet("Re-audit", FINANCE_WIDTHS)
    s.text("A1", "Larkspur Components Ltd: first check against re-audit", "Assoc title")
    s.text("A2", "Every fifth invoice was checked again, independently. Paired answers: the same invoices "
                 "classified twice. The grey text beside a result is its formula.", "Assoc note")
    heading(s, "A4", "1. First check against re-audit (invoices without a re-audit are skipped)")
    s.text("A5", "First check / Re-audit", "Assoc header")
    s.array("B5:C5", "=TRANSPOSE(ASSOC.LEVELS(InvReaudit))", "Assoc header")
    s.put("D5", [["Re-audited", "", "Formula"]], "Assoc header")
    s.array("A6:A7", "=ASSOC.LEVELS(InvException)", None)
    s.array("B6:C7", "=ASSOC.COUNTS(InvException; InvReaudit)", "Assoc count", show="F6")
    for r in (6, 7):
        s.formula(f"D{r}", f"=B{r}+C{r}", "Assoc count")
    s.text("A8", "All re-audited", "Assoc label")
    for column in "BCD":
        s.formula(f"{column}8", f"=SUM({column}6:{column}7)", "Assoc count")
    s.cells("A8:D8").CharWeight = 150.0
    book.name_range("ReauditTable", s, "A5:C7")

    heading(s, "A10", "2. Did the re-audit change verdicts in one direction more than the other?")
    header_row(s, "A11", ["Result", "", "", "", "", "Formula"])
    s.text("A12", "McNemar's test with continuity correction: p-value, statistic, df", "Assoc label")
    s.array("B12:D12", "=ASSOC.PAIRED(A5:C7)", "Assoc ratio", show="F12")
    s.text("A13", "Exact binomial test of the changes: p-value, smaller count of changes, df", "Assoc label")
    s.array("B13:D13", '=ASSOC.PAIRED(A5:C7; "exact")', "Assoc whole", show="F13")
    for cell in ("B12", "B13"):
        s.cells(cell).CellStyle = "Assoc p-value"
    s.cells("D12").CellStyle = "Assoc whole"
    s.text("A14", "What ASSOC.CHECK says about the paired test", "Assoc label")
    s.formula("B14", '=ASSOC.CHECK(A5:C7; "paired")', "Assoc text")
    s.cells("B14:E14").merge(True)
    s.show_formula("F14", "B14")
    book.name_range("PairedResult", s, "B12:D12")
    book.name_range("PairedExact", s, "B13:D13")

    header_row(s, "H5", ["Verdict", "Invoices"])
    verdicts = [("Both: no exception", "=B6"), ("Missed by the first check", "=C6"),
                ("Cleared by the re-audit", "=B7"), ("Both: exception", "=C7")]
    for i, (label, text) in enumerate(verdicts):
        s.text(f"H{6 + i}", label)
        s.formula(f"I{6 + i}", text, "Assoc count")
    s.chart("ReauditVerdicts", "H11", (12, 7.5), ["H5:I9"], "Re-audited invoices by verdict", "Invoices",
            legend=False)
    return s


def reaudit_notes(s):
    value = lambda cell: s.cells(cell).getValue()  # noqa: E731
    found, cleared, first_no = value("C6"), value("B7"), value("D6")
    expect(value("B13") < 0.05 and found > 3 * cleared, "the changes go mostly one way, significantly")
    s.text("A16", "Reading the results", "Assoc section")
    s.notes("A17", [
        f"The two checks agree on most invoices. Of the changes, {fixed(found, 0)} are exceptions the first check "
        f"missed and {fixed(cleared, 0)} is one the re-audit cleared: the changes go one way (exact "
        f"{p_text(value('B13'))}; McNemar {p_text(value('B12'))}). The paired tests weigh only the changes; "
        "agreement does not enter them.",
        f"So the first check seems to miss exceptions: {fixed(found, 0)} of the {fixed(first_no, 0)} re-audited "
        f"invoices it passed ({percent(found / first_no, 0)}). With only {fixed(found + cleared, 0)} changes that "
        "share is uncertain: small samples mislead, and the re-audit is not proof of why the first check missed "
        "them.",
        "No residual heat map here: for paired answers the question is the balance of the changes, not "
        "whether rows and columns are independent.",
    ], width=100)


# ---------------------------------------------------------------------------------------------
# The demo's workbook (scripts/demo.py prints the named ranges CountTable and AssocReport)

# Promotion decisions in 2025 by department (invented): promoted, not promoted.
DEPARTMENTS = [("Engineering", 22, 98), ("Sales", 18, 62), ("Operations", 9, 111), ("Finance", 7, 38),
               ("Customer Support", 6, 84)]
# The styles of ASSOC.REPORT's 22 values, line by line (see its result in docs/functions.md).
REPORT_STYLES = (["Assoc count"] * 4 + ["Assoc ratio", "Assoc p-value", "Assoc ratio", "Assoc p-value"]
                 + ["Assoc text"] * 2 + ["Assoc p-value", "Assoc ratio", "Assoc text"] + ["Assoc strength"] * 3
                 + ["Assoc ratio", "Assoc rate"] + ["Assoc text"] * 4)


def build_promotions(office, out):
    book = Workbook(office, "Larkspur Components Ltd: promotions in 2025 by department (invented)")
    s = book.sheet("Promotions", [7.0, 2.8, 2.8, 2.8, 0.6, 8.0, 12])
    s.text("A1", "Larkspur Components Ltd: promotions in 2025 by department", "Assoc title")
    s.text("A2", "Invented data of a fictional company, for the Assoc demo. Every result below is a live formula on "
                 "the table A4:C9; the grey text beside a key figure is its formula.", "Assoc note")
    # The corner cell names both variables, for the report's conclusion.
    header_row(s, "A4", ["Department / Promotion outcome", "Promoted", "Not promoted", "Promotion rate"])
    s.put("A5", [[name] for name, _, _ in DEPARTMENTS])
    s.put("B5", [[promoted, not_promoted] for _, promoted, not_promoted in DEPARTMENTS], "Assoc count")
    for r in range(5, 10):
        s.formula(f"D{r}", f"=B{r}/(B{r}+C{r})", "Assoc rate")
    book.name_range("CountTable", s, "A4:C9")

    s.text("F4", "Report: ASSOC.REPORT(A4:C9; 0.05)", "Assoc header", across="G4")
    s.array("F5:G26", "=ASSOC.REPORT(A4:C9; 0.05)", "Assoc label")
    left = uno_enum("com.sun.star.table.CellHoriJustify", "LEFT")
    for offset, style in enumerate(REPORT_STYLES):
        value = s.cells(f"G{5 + offset}")
        value.CellStyle = style
        value.HoriJustify = left
    book.name_range("AssocReport", s, "F5:G26")

    for top, title, formula in ((11, "Expected counts if promotion were unrelated to department",
                                 "=ASSOC.EXPECTED(A4:C9)"),
                                (18, "Adjusted residuals (heat map; beyond ±2 stands out)",
                                 '=ASSOC.RESIDUALS(A4:C9; "adjusted")')):
        s.text(f"A{top}", title, "Assoc header", across=f"C{top}")
        for i in range(5):
            s.formula(f"A{top + 1 + i}", f"=A{5 + i}")
        s.array(f"B{top + 1}:C{top + 5}", formula, "Assoc residual")
    s.cells("B12:C16").NumberFormat = book.number_format("0.0")
    s.heat_map("B19:C23")
    s.heat_map_key("A27")

    s.text("A30", "Key figures", "Assoc header", across="D30")
    s.text("F30", "Formula", "Assoc header")
    rows = [("Pearson X², degrees of freedom, p-value", "B31:D31", "=ASSOC.STATISTIC(A4:C9)",
             ("Assoc ratio", "Assoc whole", "Assoc p-value")),
            ("p-value of the likelihood-ratio G²", "B32", '=ASSOC.PVALUE(A4:C9; "g")', ("Assoc p-value",)),
            ("Critical X² at 5% for these degrees of freedom", "B33", "=ASSOC.CRITICAL(ASSOC.DF(A4:C9); 0.05)",
             ("Assoc ratio",)),
            ("Cramér's V", "B34", "=ASSOC.STRENGTH(A4:C9)", ("Assoc strength",)),
            ("Cramér's V, bias-corrected", "B35", '=ASSOC.STRENGTH(A4:C9; "cramer-corrected")',
             ("Assoc strength",))]
    for label, cells, text, styles in rows:
        r = cells.split(":")[0][1:]
        s.text(f"A{r}", label, "Assoc label")
        if ":" in cells:
            s.array(cells, text, None, show=f"F{r}")
        else:
            s.formula(cells, text, None, show=f"F{r}")
        for offset, style in enumerate(styles):
            s.raw.getCellByPosition(1 + offset, int(r) - 1).CellStyle = style
    for r, label, text in ((36, "Can the test be trusted?", "=ASSOC.CHECK(A4:C9)"),
                           (37, "And with Yates' correction?", '=ASSOC.CHECK(A4:C9; "yates")')):
        s.text(f"A{r}", label, "Assoc label")
        s.formula(f"B{r}", text, "Assoc text")
        s.cells(f"B{r}:D{r}").merge(True)
        s.show_formula(f"F{r}", f"B{r}")
    s.chart("DepartmentRates", "G30", (12, 7.5), ["A4:A9", "D4:D9"], "Promotion rate by department",
            "Share promoted", percent=True, legend=False)

    def tidy():
        s.cells("A4:G26").Rows.OptimalHeight = True
        for r in (36, 37):
            s.fit_text_height(f"B{r}", 46)
    store(office, book, out / "promotions.fods", [tidy, lambda: promotions_notes(s, chart_bottom=("G30", 7500))])


def promotions_notes(s, chart_bottom):
    value = lambda cell: s.cells(cell).getValue()  # noqa: E731
    departments = [s.cells(f"A{r}").getString() for r in range(5, 10)]
    rates = {name: value(f"D{5 + i}") for i, name in enumerate(departments)}
    residuals = {name: value(f"B{19 + i}") for i, name in enumerate(departments)}
    staff = {name: value(f"B{5 + i}") + value(f"C{5 + i}") for i, name in enumerate(departments)}
    promoted = sum(value(f"B{r}") for r in range(5, 10))
    more = [name for name in departments if residuals[name] > 2]
    fewer = [name for name in departments if residuals[name] < -2]
    within = [name for name in departments if abs(residuals[name]) <= 2]
    highest, lowest = max(rates, key=rates.get), min(rates, key=rates.get)
    smallest = min(staff, key=staff.get)
    x2, df, p = value("B31"), value("C31"), value("D31")
    expect(p < 0.05 and len(more) == 1 and len(fewer) == 2 and s.cells("B36").getString().startswith("Sound"),
           "the association is significant, the test sound, and one department has more and two fewer "
           "promotions than independence predicts")

    # The notes start below the chart (and below the key figures).
    cell, height = chart_bottom
    bottom = s.cells(cell).Position.Y + height
    row = next(r for r in range(38, 200) if s.cells(f"A{r}").Position.Y >= bottom) + 1
    s.text(f"A{row}", "Reading the results", "Assoc section")
    listed = lambda names: " and ".join(f"{n} ({fixed(residuals[n], 2)})" for n in names)  # noqa: E731
    s.notes(f"A{row + 1}", [
        f"Promotion rates run from {percent(rates[lowest], 1)} ({lowest}) to {percent(rates[highest], 1)} "
        f"({highest}); over all {fixed(sum(staff.values()), 0)} staff {percent(promoted / sum(staff.values()), 1)} "
        f"were promoted. Pearson X² = {fixed(x2, 2)} with {fixed(df, 0)} degrees of freedom ({p_text(p)}): at the 5% "
        f"level, department and promotion outcome appear associated. Cramér's V of {fixed(value('B34'), 3)} puts "
        "the strength of the association nearer 0 (none) than 1. ASSOC.CHECK finds the test sound.",
        f"The heat map shows where: {listed(more)} had more promotions than independence predicts (orange), "
        f"{listed(fewer)} fewer (purple); {', '.join(within[:-1])} and {within[-1]} stay within ±2. With two columns "
        "the residuals of 'Not promoted' mirror those of 'Promoted'. With ten cells, one just beyond ±2 can arise "
        "by chance: ASSOC.CELLTEST adjusts each cell's p-value for the number of cells.",
        "Cautions: an association is not proof of cause. Departments differ in roles, grades and vacancies, and "
        "another variable can create, hide or reverse a difference (the Offices sheet of hr_review.fods shows a "
        f"pooled difference that vanishes office by office). Small samples and many tests mislead: {smallest} has "
        f"only {fixed(staff[smallest], 0)} staff, and at the 5% level about one test in twenty is 'significant' by "
        "chance alone. For decisions about people a significant result is not proof of discrimination, and a "
        "non-significant one is not proof of fairness. Follow applicable law and policy, and seek qualified advice.",
    ], width=165)


# ---------------------------------------------------------------------------------------------
# The quick-start workbook of the user guide

# Outcome of the invoice check by branch (invented): cleared, queried, returned.
BRANCH_CHECKS = [("Northgate", 84, 15, 6), ("Riverside", 61, 22, 12), ("Hillcrest", 90, 11, 5)]


def build_quick_start(office, out):
    book = Workbook(office, "Assoc quick start: invoice checks by branch (invented)")
    s = book.sheet("Quick start", [0.5, 5.4, 2.2, 2.2, 2.2, 0.6, 8.2, 2.2, 1.6, 2.2, 5.6])
    s.text("B1", "Larkspur Components Ltd: outcome of the invoice check by branch (invented)", "Assoc title")
    s.put("B2", [["Branch / Check outcome", "Cleared", "Queried", "Returned"]], "Assoc header")
    s.put("B3", [[name] for name, *_ in BRANCH_CHECKS])
    s.put("C3", [counts for _, *counts in BRANCH_CHECKS], "Assoc count")
    book.name_range("QuickTable", s, "B2:E5")
    s.put("G2", [["Result", "", "", "", "Formula"]], "Assoc header")
    s.text("G3", "p-value of the test of independence", "Assoc label")
    s.formula("H3", "=ASSOC.PVALUE(B2:E5)", "Assoc p-value", show="K3")
    s.text("G4", "ASSOC.STATISTIC in one cell: X² only", "Assoc label")
    s.formula("H4", "=ASSOC.STATISTIC(B2:E5)", "Assoc ratio", show="K4")
    s.text("G5", "ASSOC.STATISTIC as an array: X², df, p-value", "Assoc label")
    s.array("H5:J5", "=ASSOC.STATISTIC(B2:E5)", "Assoc ratio", show="K5")
    s.cells("I5").CellStyle = "Assoc whole"
    s.cells("J5").CellStyle = "Assoc p-value"
    s.text("G6", "Can the test be trusted?", "Assoc label")
    s.formula("H6", "=ASSOC.CHECK(B2:E5)", "Assoc text")
    s.cells("H6:J6").merge(True)
    s.show_formula("K6", "H6")
    book.name_range("QuickPValue", s, "H3")
    book.name_range("QuickStatistic", s, "H5:J5")

    for title, top, formula in (("Expected counts: one array formula over C10:E12", 8, "=ASSOC.EXPECTED(B2:E5)"),
                                ("Adjusted residuals: one array formula over C16:E18, with the heat map", 14,
                                 '=ASSOC.RESIDUALS(B2:E5; "adjusted")')):
        heading(s, f"B{top}", title)
        s.text(f"B{top + 1}", "Branch", "Assoc header")
        for column in "CDE":
            s.formula(f"{column}{top + 1}", f"={column}2", "Assoc header")
        for i in range(3):
            s.formula(f"B{top + 2 + i}", f"=B{3 + i}")
        s.array(f"C{top + 2}:E{top + 4}", formula, "Assoc ratio" if top == 8 else "Assoc residual",
                show=f"G{top + 2}")
    s.heat_map("C16:E18")
    s.heat_map_key("B20")
    s.chart("BranchOutcomes", "I8", (9.4, 5.8), ["B2:E5"], "Check outcome by branch", "Share of invoices",
            stacked_shares=True)
    s.notes("B23", [
        "Type the table with its labels (B2:E5), then =ASSOC.PVALUE(B2:E5) in an empty cell. For a result that "
        "is an array, select the whole output range first (C10:E12 for the expected counts), type the formula and "
        "press Ctrl+Shift+Enter. Entered in one cell, such a function shows only its first (headline) value.",
        "Riverside returns more invoices than independence predicts (orange) and Hillcrest fewer (purple); the chart "
        "shows each branch's mix of outcomes from the table. An association is not proof of cause: the branches "
        "may receive different kinds of invoices.",
    ], width=120)

    def tidy():
        s.fit_text_height("H6", 40, label_chars=60)
    store(office, book, out / "quick_start.fods", [tidy])


# ---------------------------------------------------------------------------------------------
# Colour scales, storing and checking

def colour_scale_xml(sheet_name, cells):
    first, last = cells.split(":")
    entries = "".join(f'<calcext:color-scale-entry calcext:value="{value}" calcext:type="number" '
                      f'calcext:color="#{colour:06x}"/>' for value, colour, _ in HEAT_MAP)
    name = quoted(sheet_name).replace("&", "&amp;").replace("'", "&apos;")
    return (f'<calcext:conditional-format calcext:target-range-address="{name}.{first}:{name}.{last}">'
            f"<calcext:color-scale>{entries}</calcext:color-scale></calcext:conditional-format>")


def add_colour_scales(path, heat_maps):
    """Writes the heat maps into a stored flat ODS file, at the end of each sheet's table."""
    text = path.read_text(encoding="utf-8")
    for sheet_name in dict.fromkeys(name for name, _ in heat_maps):
        formats = "".join(colour_scale_xml(name, cells) for name, cells in heat_maps if name == sheet_name)
        escaped = sheet_name.replace("&", "&amp;")
        start = text.index(f'<table:table table:name="{escaped}"')
        following = text.find('<table:table table:name="', start + 1)
        while following != -1 and not _is_sheet(text, following):
            following = text.find('<table:table table:name="', following + 1)
        limit = following if following != -1 else text.index("</office:spreadsheet>")
        close = text.rindex("</table:table>", start, limit)  # the sheet's own, after its charts' tables
        if "<calcext:conditional-formats>" in text[start:close]:
            raise RuntimeError(f"{sheet_name} already has conditional formats")
        text = (text[:close] + f"<calcext:conditional-formats>{formats}</calcext:conditional-formats>"
                + text[close:])
    path.write_text(text, encoding="utf-8")


def _is_sheet(text, position):
    """True when the <table:table at `position` is a sheet, not a chart's data table."""
    opened = text.count("<office:chart>", 0, position) - text.count("</office:chart>", 0, position)
    return opened == 0


def stable_metadata(path):
    """Leaves out what changes at every build (dates, editing time), so that rebuilds diff cleanly."""
    text = path.read_text(encoding="utf-8")
    for pattern in (r"<meta:creation-date>[^<]*</meta:creation-date>", r"<dc:date>[^<]*</dc:date>",
                    r"<meta:editing-duration>[^<]*</meta:editing-duration>",
                    r"<meta:editing-cycles>[^<]*</meta:editing-cycles>"):
        text = re.sub(pattern, "", text)
    declaration, _, rest = text.partition("\n")
    note = ("<!-- Assoc sample, built by scripts/build_samples.py (rebuild rather than edit by hand). Larkspur "
            "Components Ltd is a fictional company and every figure is invented. -->")
    path.write_text(f"{declaration}\n{note}{rest}" if declaration.startswith("<?xml") else text, encoding="utf-8")


def error_cells(doc):
    """Addresses of formula cells that show an error, over every sheet."""
    from com.sun.star.sheet.FormulaResult import ERROR
    found = []
    for index in range(doc.Sheets.Count):
        sheet = doc.Sheets.getByIndex(index)
        cells = sheet.queryFormulaCells(ERROR)
        if cells.getCount():
            found.append(cells.RangeAddressesAsString)
    return found


def store(office, book, path, notes):
    """Recalculates, writes the notes (which quote results), stores, adds the colour scales, loads
    the file again to check it, and stores the office's own rendering."""
    doc = book.doc
    doc.calculateAll()
    for write in notes:
        write()
    doc.calculateAll()
    errors = error_cells(doc)
    if errors:
        raise RuntimeError(f"{path.name}: error cells {errors}")
    doc.Sheets.getByIndex(0)  # the first sheet is the one that opens
    doc.CurrentController.setActiveSheet(doc.Sheets.getByIndex(0))
    doc.storeToURL(file_url(path), properties(FilterName=FLAT_ODS))
    doc.close(True)
    add_colour_scales(path, book.heat_maps)

    again = office.load(path)
    try:
        again.calculateAll()
        for name in dict.fromkeys(n for n, _ in book.heat_maps):
            count = again.Sheets.getByName(name).ConditionalFormats.getLength()
            expected = sum(1 for n, _ in book.heat_maps if n == name)
            if count != expected:
                raise RuntimeError(f"{path.name}: sheet {name} has {count} colour scales, not {expected}")
        errors = error_cells(again)
        if errors:
            raise RuntimeError(f"{path.name}: error cells after reloading {errors}")
        again.storeToURL(file_url(path), properties(FilterName=FLAT_ODS))
    finally:
        again.close(True)
    stable_metadata(path)


def build_hr(office, out):
    book = Workbook(office, "Larkspur Components Ltd: promotions by office and selection by age band (invented)")
    offices = build_offices_sheet(book)
    selection = build_selection_sheet(book)
    departments, department_rows = build_departments_sheet(book)

    def tidy():
        offices.fit_text_height("B23", 62)
        selection.fit_text_height("B24", 62)
    store(office, book, out / "hr_review.fods", [lambda: offices_notes(offices), lambda: selection_notes(selection),
                                                lambda: departments_notes(departments, department_rows), tidy])


def build_finance(office, out):
    book = Workbook(office, "Larkspur Components Ltd: invoice exceptions (invented)")
    build_invoice_sheet(book)
    region, region_places = build_region_sheet(book)
    channel, channel_places = build_channel_sheet(book)
    band, band_row, trend_cell = build_band_sheet(book)
    reaudit = build_reaudit_sheet(book)

    def tidy():
        for sheet in (region, channel, band):
            for r in range(10, 30):
                if sheet.cells(f"A{r}").getString() == "Can the chi-squared test be trusted here?":
                    sheet.fit_text_height(f"B{r}", 52)
        reaudit.fit_text_height("B14", 52)
    book.doc.Sheets.moveByName("Invoices", book.doc.Sheets.Count)
    store(office, book, out / "invoice_exceptions.fods",
          [lambda: region_notes(region, *region_places), lambda: channel_notes(channel, *channel_places),
           lambda: band_notes(band, band_row, trend_cell), lambda: reaudit_notes(reaudit), tidy])


def build_staff_survey(office, out):
    from sample_staff_survey import build  # a module of its own; it imports this one's helpers
    build(office, out)


BUILDERS = {"quick_start": build_quick_start, "promotions": build_promotions, "hr_review": build_hr,
            "invoice_exceptions": build_finance, "staff_survey": build_staff_survey}


def main():
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--oxt", required=True, help="the built extension, e.g. build/extension/assoc.oxt")
    parser.add_argument("--out", default=str(HERE.parent / "samples"), help="folder for the .fods files")
    parser.add_argument("--only", nargs="+", choices=sorted(BUILDERS), help="build only these workbooks")
    options = parser.parse_args()
    out = pathlib.Path(options.out).resolve()
    out.mkdir(parents=True, exist_ok=True)
    with ThrowawayOffice(options.oxt, log=lambda message: print(f"[office] {message}", flush=True)) as office:
        for name, build in BUILDERS.items():
            if options.only is None or name in options.only:
                build(office, out)
                print(f"wrote {out / (name + '.fods')}")


if __name__ == "__main__":
    main()
