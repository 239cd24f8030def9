#!/usr/bin/python3
"""Writes tests/reference/samples_values.json: expected results for the sample workbooks, computed
with reference libraries (never with Assoc) from the input cells of the committed .fods files.
tests/calc/samples_test.py compares the recalculated workbooks with these values. Run from the
repository root after rebuilding the samples:

    /usr/bin/python3 tests/reference/samples_generate.py

Tools: scipy 1.10.1, numpy 1.24.2, statsmodels 0.13.5 (Debian 12 python3-scipy, python3-numpy,
python3-statsmodels) and R 4.2.2 (Rscript: fisher.test, prop.trend.test, mantelhaen.test, mcnemar.test). The workbooks' data are
invented (Larkspur Components Ltd is a fictional company).

Only typed cells are read: the pooled table, the size bands and the other formula cells of the
workbooks are recomputed here from their inputs, so that a wrong formula in a sample shows up as a
difference rather than being copied into the reference.
"""

import itertools
import json
import math
import pathlib
import subprocess
import xml.etree.ElementTree as ET
from fractions import Fraction

import numpy as np
import scipy
import scipy.stats as st
import statsmodels
from statsmodels.stats.contingency_tables import StratifiedTable, Table, Table2x2, mcnemar
from statsmodels.stats.multitest import multipletests
from statsmodels.stats.proportion import confint_proportions_2indep, proportion_confint

ROOT = pathlib.Path(__file__).resolve().parents[2]
SAMPLES = ROOT / "samples"
OUT = pathlib.Path(__file__).with_name("samples_values.json")

OFFICE = "urn:oasis:names:tc:opendocument:xmlns:office:1.0"
TABLE = "urn:oasis:names:tc:opendocument:xmlns:table:1.0"
TEXT = "urn:oasis:names:tc:opendocument:xmlns:text:1.0"
ROW_GROUPS = {f"{{{TABLE}}}{tag}" for tag in ("table-header-rows", "table-rows", "table-row-group")}


# --- reading typed cells from a flat ODS file --------------------------------------------------

def sheet_cells(path, sheet, max_rows=2000, max_columns=30):
    """The sheet's cells as rows of values (float, str, or None for blank and formula cells)."""
    spreadsheet = ET.parse(path).getroot().find(f"{{{OFFICE}}}body/{{{OFFICE}}}spreadsheet")
    table = next(t for t in spreadsheet.findall(f"{{{TABLE}}}table") if t.get(f"{{{TABLE}}}name") == sheet)
    rows = []

    def walk(element):
        for child in element:
            if child.tag in ROW_GROUPS:
                walk(child)
            elif child.tag == f"{{{TABLE}}}table-row":
                row = []
                for cell in child:
                    if cell.tag not in (f"{{{TABLE}}}table-cell", f"{{{TABLE}}}covered-table-cell"):
                        continue
                    repeat = min(int(cell.get(f"{{{TABLE}}}number-columns-repeated", "1")), max_columns)
                    row.extend([typed_value(cell)] * repeat)
                repeat = min(int(child.get(f"{{{TABLE}}}number-rows-repeated", "1")), max_rows - len(rows))
                rows.extend([row[:max_columns]] * repeat)
    walk(table)
    return rows


def typed_value(cell):
    if cell.get(f"{{{TABLE}}}formula") is not None:
        return None  # a result, not an input
    kind = cell.get(f"{{{OFFICE}}}value-type")
    if kind in ("float", "percentage", "currency"):
        return float(cell.get(f"{{{OFFICE}}}value"))
    if kind == "string":
        return cell.get(f"{{{OFFICE}}}string-value") or "\n".join(
            "".join(p.itertext()) for p in cell.findall(f"{{{TEXT}}}p"))
    return None


def block(rows, top_left, columns, count):
    column = ord(top_left[0]) - ord("A")
    row = int(top_left[1:]) - 1
    return [[(rows[r][c] if c < len(rows[r]) else None) for c in range(column, column + columns)]
            for r in range(row, row + count)]


# --- reference computations --------------------------------------------------------------------

def r_numbers(expression):
    out = subprocess.run(["Rscript", "-e", f"cat(format({expression}, digits = 17), sep = '\\n')"],
                         check=True, capture_output=True, text=True).stdout
    return [float(x) for x in out.split()]


def r_matrix(counts):
    flat = ", ".join(str(int(v)) for row in counts for v in row)
    return f"matrix(c({flat}), nrow = {len(counts)}, byrow = TRUE)"


def pearson(counts):
    x2, p, df, _ = st.chi2_contingency(np.array(counts, dtype=float), correction=False)
    return [float(x2), float(df), float(p)]


def odds_ratio(counts):
    table = Table2x2(np.array(counts, dtype=float))
    lower, upper = table.oddsratio_confint(alpha=0.05)  # Woolf: log odds ratio ± z·SE
    return [float(table.oddsratio), float(lower), float(upper)]


def risk_ratio(counts):
    table = Table2x2(np.array(counts, dtype=float))
    lower, upper = table.riskratio_confint(alpha=0.05)  # log method
    return [float(table.riskratio), float(lower), float(upper)]


def holm_cell_p_values(counts):
    residuals = Table(np.array(counts, dtype=float)).standardized_resids  # adjusted residuals
    raw = 2 * st.norm.sf(np.abs(np.asarray(residuals).ravel()))
    adjusted = multipletests(raw, method="holm")[1]
    return [[float(v) for v in row] for row in adjusted.reshape(np.shape(counts))]


def trend(first_outcome, totals):
    """Cochran–Armitage by R's prop.trend.test with scores 1, 2, …: [p-value, |z|]."""
    vector = lambda v: "c(" + ", ".join(str(int(x)) for x in v) + ")"  # noqa: E731
    statistic, p = r_numbers(f"unlist(prop.trend.test({vector(first_outcome)}, {vector(totals)})"
                             "[c('statistic', 'p.value')])")
    return [p, math.sqrt(statistic)]


def crosstab(records, row_key, column_key):
    """Counts of records with both labels present, rows and columns in sorted order."""
    kept = [r for r in records if r[row_key] and r[column_key]]
    rows = sorted({r[row_key] for r in records if r[row_key]})
    columns = sorted({r[column_key] for r in records if r[column_key]})
    counts = [[sum(1 for r in kept if r[row_key] == a and r[column_key] == b) for b in columns] for a in rows]
    return {"rows": rows, "columns": columns, "counts": counts}


def size_band(amount):
    # The bands as the sample's notes and formulas define them (limits 1,000, 5,000 and 20,000).
    for limit, name in ((1000, "Band 1: under 1,000"), (5000, "Band 2: 1,000 to 4,999"),
                        (20000, "Band 3: 5,000 to 19,999")):
        if amount < limit:
            return name
    return "Band 4: 20,000 and over"


# --- the workbooks -----------------------------------------------------------------------------

def quick_start():
    body = block(sheet_cells(SAMPLES / "quick_start.fods", "Quick start"), "B3", 4, 3)
    counts = [[int(v) for v in row[1:]] for row in body]
    return {"branches": [row[0] for row in body], "counts": counts, "pearson": pearson(counts),
            "expected": [[float(v) for v in row] for row in st.contingency.expected_freq(np.array(counts))]}


def promotions():
    rows = sheet_cells(SAMPLES / "promotions.fods", "Promotions")
    body = block(rows, "A5", 3, 5)
    counts = [[int(a), int(b)] for _, a, b in body]
    return {"departments": [name for name, _, _ in body], "counts": counts, "pearson": pearson(counts)}


def hr():
    offices = block(sheet_cells(SAMPLES / "hr_review.fods", "Offices"), "A6", 5, 4)
    strata = [[int(v) for v in row[1:]] for row in offices]
    pooled = [[sum(s[0] for s in strata), sum(s[1] for s in strata)],
              [sum(s[2] for s in strata), sum(s[3] for s in strata)]]
    stratified = StratifiedTable([np.array([[a, b], [c, d]], dtype=float) for a, b, c, d in strata])
    mh = stratified.test_null_odds(correction=True)
    lower, upper = stratified.oddsratio_pooled_confint(alpha=0.05)  # Robins–Breslow–Greenland variance
    tarone = stratified.test_equal_odds(adjust=True)
    departments = [[a + b, c + d] for a, b, c, d in strata]
    outcomes = [[a + c, b + d] for a, b, c, d in strata]

    selection_rows = sheet_cells(SAMPLES / "hr_review.fods", "Selection")
    bands = block(selection_rows, "A6", 4, 4)
    selected = [int(row[1]) for row in bands]
    considered = [int(row[3]) for row in bands]
    table = [[s, c - s] for s, c in zip(selected, considered)]
    rates = [Fraction(s, c) for s, c in zip(selected, considered)]
    exact = r_numbers(f"fisher.test({r_matrix(table)})$p.value")[0]
    return {
        "offices": [row[0] for row in offices], "strata": strata, "pooled": pooled,
        "pooled_pearson": pearson(pooled), "pooled_odds_ratio": odds_ratio(pooled),
        "pooled_risk_ratio": risk_ratio(pooled),
        "strata_result": [float(st.chi2.sf(mh.statistic, 1)), float(mh.statistic),
                          float(stratified.oddsratio_pooled), float(lower), float(upper)],
        "homogeneity": [float(st.chi2.sf(tarone.statistic, len(strata) - 1)), float(tarone.statistic),
                        float(len(strata) - 1)],
        "department_mix_pearson": pearson(departments), "office_outcome_pearson": pearson(outcomes),
        "age_bands": [row[0] for row in bands], "selected": selected, "considered": considered,
        "selection_pearson": pearson(table), "selection_exact": exact,
        "selection_trend": trend(selected, considered),
        "impact_rates": [float(r) for r in rates], "impact_ratios": [float(r / max(rates)) for r in rates],
    }


def hr_departments():
    """The Departments sheet of hr_review.fods: promotion rates by department with Wilson intervals
    (statsmodels proportion_confint), every pair of departments (scipy chi2_contingency without
    correction, Holm's adjustment by statsmodels multipletests, checked against R p.adjust), Design
    against Assembly as a difference with Newcombe's interval (statsmodels confint_proportions_2indep) and
    as a risk ratio (statsmodels Table2x2), and the common risk ratio within the offices of the Offices
    sheet (statsmodels StratifiedTable.riskratio_pooled; the interval from the variance of Greenland &
    Robins (1985), Biometrics 41:55-68, written out in numpy)."""
    path = SAMPLES / "hr_review.fods"
    body = []
    for row in block(sheet_cells(path, "Departments"), "A6", 3, 12):  # the typed rows below the header
        if row[1] is None:
            break
        body.append(row)
    counts = [[int(a), int(b)] for _, a, b in body]
    rates = []
    for promoted, not_promoted in counts:
        n = promoted + not_promoted
        lower, upper = proportion_confint(promoted, n, alpha=0.05, method="wilson")
        rates.append([float(n), promoted / n, float(lower), float(upper)])
    pairs, p_values = [], []
    for (i, first), (j, second) in itertools.combinations(enumerate(counts), 2):
        pairs.append([body[i][0], body[j][0]])
        p_values.append(pearson([first, second])[2])
    holm = [float(p) for p in multipletests(p_values, method="holm")[1]]
    r_holm = r_numbers(f"p.adjust(c({', '.join(repr(p) for p in p_values)}), method = 'holm')")
    assert all(math.isclose(a, b, rel_tol=1e-12) for a, b in zip(holm, r_holm)), (holm, r_holm)
    (x1, y1), (x2, y2) = counts[0], counts[1]
    lower, upper = confint_proportions_2indep(x1, x1 + y1, x2, x2 + y2, method="newcomb", compare="diff",
                                              alpha=0.05)

    offices = block(sheet_cells(path, "Offices"), "A6", 5, 4)
    strata = np.array([[float(v) for v in row[1:]] for row in offices])
    a, b, c, d = strata.T
    n1, n0 = a + b, c + d
    n = n1 + n0
    r, s = np.sum(a * n0 / n), np.sum(c * n1 / n)
    log_se = math.sqrt(np.sum((n1 * n0 * (a + c) - a * c * n) / n ** 2) / (r * s))
    ratio = float(StratifiedTable([np.array([[w, x], [y, z]]) for w, x, y, z in strata]).riskratio_pooled)
    z = float(st.norm.isf(0.025))
    return {
        "departments": [row[0] for row in body], "counts": counts, "pearson": pearson(counts), "rates": rates,
        "pairs": pairs, "pair_p_values": p_values, "pair_holm": holm,
        "design_assembly_difference": [x1 / (x1 + y1) - x2 / (x2 + y2), float(lower), float(upper)],
        "design_assembly_risk_ratio": risk_ratio(counts[:2]),
        "common_risk_ratio": [ratio, ratio * math.exp(-z * log_se), ratio * math.exp(z * log_se)],
    }


def finance():
    rows = sheet_cells(SAMPLES / "invoice_exceptions.fods", "Invoices")
    records = []
    for row in rows[1:]:
        if not row or row[0] is None:
            break
        invoice, region, channel, amount, _, exception, reaudit = (row + [None] * 7)[:7]
        records.append({"invoice": invoice, "region": region, "channel": channel, "amount": amount,
                        "band": size_band(amount), "exception": exception, "reaudit": reaudit or ""})
    tables = {name: crosstab(records, key, "exception") for name, key in
              (("region", "region"), ("channel", "channel"), ("band", "band"))}
    tables["reaudit"] = crosstab(records, "exception", "reaudit")
    region, channel, band, reaudit = (tables[k]["counts"] for k in ("region", "channel", "band", "reaudit"))

    planned = {name: share for name, share in block(
        sheet_cells(SAMPLES / "invoice_exceptions.fods", "By channel"), "H35", 2, 3)}
    observed = [sum(row) for row in channel]
    shares = np.array([planned[name] for name in tables["channel"]["rows"]])
    fit = st.chisquare(observed, shares / shares.sum() * sum(observed))

    corrected = mcnemar(np.array(reaudit), exact=False, correction=True)
    exact_paired = mcnemar(np.array(reaudit), exact=True)
    return {
        "invoices": len(records), "tables": tables,
        "region_pearson": pearson(region),
        "region_exact": r_numbers(f"fisher.test({r_matrix(region)})$p.value")[0],
        "region_holm": holm_cell_p_values(region),
        "channel_pearson": pearson(channel),
        "channel_fit": [float(fit.pvalue), float(fit.statistic), float(len(observed) - 1)],
        "planned_shares": {k: float(v) for k, v in planned.items()},
        "band_pearson": pearson(band),
        "band_trend": trend([row[0] for row in band], [sum(row) for row in band]),
        "paired_corrected": [float(st.chi2.sf(corrected.statistic, 1)), float(corrected.statistic), 1.0],
        "paired_exact": [float(exact_paired.pvalue), float(exact_paired.statistic), 0.0],
    }


def staff_survey():
    """The staff-survey workbook (scripts/sample_staff_survey.py), with the tools and helpers of
    ordered_generate.py: statsmodels (linear-by-linear test, Cochran's Q), scipy (Pearson, Kendall's tau-b
    on the expanded data), numpy (pairs for gamma) and R (mantelhaen.test, fisher.test, mcnemar.test)."""
    from ordered_generate import cochran, gamma_by_pairs, linear_by_linear, mantelhaen, tau_b
    path = SAMPLES / "staff_survey.fods"
    tenure_rows = sheet_cells(path, "By tenure")
    body = block(tenure_rows, "A6", 6, 5)
    counts = [[int(v) for v in row[1:]] for row in body]
    years = [row[0] for row in block(tenure_rows, "H6", 1, 5)]

    long = []
    for row in sheet_cells(path, "Within offices")[5:]:
        if not row or row[0] is None:
            break
        long.append(row[:5])
    offices = list(dict.fromkeys(row[0] for row in long))
    bands = list(dict.fromkeys(row[1] for row in long))
    strata = [[next(([int(v) for v in r[2:5]] for r in long if r[0] == office and r[1] == band), [0, 0, 0])
               for band in bands] for office in offices]
    lakeview = strata[offices.index("Lakeview")]

    answers = []
    for row in sheet_cells(path, "Wave answers")[1:]:
        if not row or row[0] is None:
            break
        answers.append([(row + [None] * 4)[c] or "" for c in (1, 2, 3)])
    complete = [[1 if a == "Yes" else 0 for a in row] for row in answers if "" not in row]
    two = [[1 if a == "Yes" else 0 for a in row[:2]] for row in answers if "" not in row[:2]]
    pairs = [[sum(1 for a, b in two if (a, b) == (x, y)) for y in (1, 0)] for x in (1, 0)]
    mcnemar_statistic, mcnemar_p = r_numbers(
        f"unlist(mcnemar.test({r_matrix(pairs)}, correct = FALSE)[c('statistic', 'p.value')])")
    return {
        "bands": [row[0] for row in body], "counts": counts, "years": years,
        "ordinal": linear_by_linear(counts), "ordinal_years": linear_by_linear(counts, years),
        "pearson": pearson(counts), "gamma": gamma_by_pairs(counts)[2], "tau_b": tau_b(counts),
        "offices": offices, "office_bands": bands, "strata": strata, "within": mantelhaen(strata),
        "lakeview": lakeview, "lakeview_exact": r_numbers(f"fisher.test({r_matrix(lakeview)})$p.value")[0],
        "staff": len(answers), "complete": len(complete), "repeated": cochran(complete),
        "march_july_pairs": pairs, "march_july_repeated": cochran(two),
        "march_july_mcnemar": [mcnemar_p, mcnemar_statistic, 1.0],
    }


def main():
    r_version = subprocess.run(["Rscript", "-e", "cat(R.version.string)"], check=True, capture_output=True,
                               text=True).stdout
    data = {
        "generated_by": "tests/reference/samples_generate.py",
        "tools": {"scipy": scipy.__version__, "numpy": np.__version__, "statsmodels": statsmodels.__version__,
                  "R": r_version},
        "quick_start": quick_start(), "promotions": promotions(), "hr": hr(), "finance": finance(),
        "staff_survey": staff_survey(),
    }
    data["hr_departments"] = hr_departments()
    OUT.write_text(json.dumps(data, indent=1, ensure_ascii=False) + "\n")
    print(f"wrote {OUT}")


if __name__ == "__main__":
    main()
