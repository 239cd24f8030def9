#!/usr/bin/python3
"""The precision battery: how many digits Assoc's functions keep, against 40-digit references, beside
the reference libraries on the same inputs.

Random inputs (seeded; tables of every size from a handful of counts to a hundred million, p-values from
1 down to far tails) are drawn for each function, plus the hard cases of issue 15. For each input:
- the reference, from exact fractions where the quantity is rational and mpmath at 50 digits otherwise,
  kept to 40 significant digits (mp_reference.py);
- Assoc's value, from the core as the worksheet functions call it (precision_eval.cpp);
- the values of scipy 1.10.1, statsmodels 0.13.5 and R 4.2.2 where they compute the same quantity
  under the same convention (library_values.py).
The relative error is |value − reference| / |reference| (the absolute error where the reference is 0).

Usage (from the repository root, after cmake --build build):
  tests/precision/battery.py --long              the README's "Precision" table (about 10 minutes;
                                                 needs python3-mpmath, -scipy, -statsmodels and R)
  tests/precision/battery.py --write-short       regenerate short_battery.json (inputs and references)
  tests/precision/battery.py --check             the short form, run by the test command: Assoc's worst
                                                 error per quantity on short_battery.json must stay within
                                                 BOUNDS (Python standard library only)
Options: --seed N (default 15), --cases N (random cases per function; default 200 long, 12 short),
--eval PATH (default build/tests/precision/precision_eval).
"""

import argparse
import json
import math
import pathlib
import random
import subprocess
import sys
from decimal import MAX_EMAX, MIN_EMIN, Decimal, getcontext

HERE = pathlib.Path(__file__).resolve().parent
ROOT = HERE.parents[1]
SHORT_BATTERY = HERE / "short_battery.json"
getcontext().prec = 60
getcontext().Emax, getcontext().Emin = MAX_EMAX, MIN_EMIN  # references go far below the doubles' range

# What each evaluated function returns, in order (precision_eval.cpp). `shape` is (rows, columns).
def layout(function, shape):
    rows, columns = shape
    cells = rows * columns
    if function in ("pearson", "g", "yates"):
        return [f"{function}.statistic", f"{function}.p"]
    if function == "expected":
        return ["expected"] * cells
    if function == "residuals":
        return ["residuals.pearson"] * cells + ["residuals.adjusted"] * cells
    if function == "strength":
        keys = ["strength.cramer", "strength.cramer_corrected", "strength.contingency", "strength.w"]
        return keys + (["strength.phi"] if shape == (2, 2) else [])
    if function == "exact":
        return ["exact.two_sided", "exact.lower", "exact.upper"] if shape == (2, 2) else ["exact.rxc"]
    if function == "ratios":
        return ["oddsratio.estimate", "oddsratio.lower", "oddsratio.upper",
                "riskratio.estimate", "riskratio.lower", "riskratio.upper"]
    if function == "celltest":
        return ["celltest.holm"] * cells
    if function == "vinterval":
        return ["vinterval.lower", "vinterval.upper"]
    if function == "fit":
        return ["fit.p", "fit.statistic"]
    if function in ("critical", "power", "samplesize"):
        return [function]
    if function == "strata":
        return ["strata.p_corrected", "strata.statistic_corrected", "strata.p", "strata.statistic",
                "strata.odds_ratio", "strata.lower", "strata.upper"]
    if function == "homogeneity":
        return ["homogeneity.p", "homogeneity.statistic"]
    if function == "paired":
        if shape == (2, 2):
            return ["mcnemar.p_corrected", "mcnemar.statistic_corrected", "mcnemar.p", "mcnemar.statistic",
                    "mcnemar.exact_p"]
        return ["bowker.p", "bowker.statistic", "bowker.df"]
    if function == "trend":
        return ["trend.p", "trend.z"]
    raise ValueError(function)


# The rows of the table: quantity, the worksheet function (and option) that shows it, what it is.
QUANTITIES = [
    ("pearson.statistic", "ASSOC.STATISTIC", "Pearson X²"),
    ("pearson.p", "ASSOC.PVALUE", "p of X²"),
    ("g.statistic", "ASSOC.STATISTIC \"g\"", "G²"),
    ("g.p", "ASSOC.PVALUE \"g\"", "p of G²"),
    ("yates.statistic", "ASSOC.STATISTIC \"yates\"", "Yates X² (2×2)"),
    ("yates.p", "ASSOC.PVALUE \"yates\"", "p of Yates X²"),
    ("critical", "ASSOC.CRITICAL", "critical value"),
    ("expected", "ASSOC.EXPECTED", "expected counts"),
    ("residuals.pearson", "ASSOC.RESIDUALS", "Pearson residuals"),
    ("residuals.adjusted", "ASSOC.RESIDUALS \"adjusted\"", "adjusted residuals"),
    ("celltest.holm", "ASSOC.CELLTEST", "Holm-adjusted cell p-values"),
    ("strength.cramer", "ASSOC.STRENGTH", "Cramér's V"),
    ("strength.cramer_corrected", "ASSOC.STRENGTH \"cramer-corrected\"", "bias-corrected V"),
    ("strength.contingency", "ASSOC.STRENGTH \"contingency\"", "contingency coefficient"),
    ("strength.w", "ASSOC.STRENGTH \"w\"", "Cohen's w"),
    ("strength.phi", "ASSOC.STRENGTH \"phi\"", "phi (2×2)"),
    ("vinterval.lower", "ASSOC.REPORT", "Cramér's V, lower 95% limit"),
    ("vinterval.upper", "ASSOC.REPORT", "Cramér's V, upper 95% limit"),
    ("exact.two_sided", "ASSOC.EXACT", "2×2 two-sided p"),
    ("exact.lower", "ASSOC.EXACT \"lower\"", "2×2 lower p"),
    ("exact.upper", "ASSOC.EXACT \"upper\"", "2×2 upper p"),
    ("exact.rxc", "ASSOC.EXACT", "r×c two-sided p"),
    ("oddsratio.estimate", "ASSOC.ODDSRATIO", "odds ratio"),
    ("oddsratio.lower", "ASSOC.ODDSRATIO", "lower 95% limit"),
    ("oddsratio.upper", "ASSOC.ODDSRATIO", "upper 95% limit"),
    ("riskratio.estimate", "ASSOC.RISKRATIO", "risk ratio"),
    ("riskratio.lower", "ASSOC.RISKRATIO", "lower 95% limit"),
    ("riskratio.upper", "ASSOC.RISKRATIO", "upper 95% limit"),
    ("fit.statistic", "ASSOC.FIT", "X² of fit"),
    ("fit.p", "ASSOC.FIT", "p of fit"),
    ("power", "ASSOC.POWER", "power"),
    ("samplesize", "ASSOC.SAMPLESIZE", "sample size"),
    ("strata.statistic_corrected", "ASSOC.STRATA", "Mantel–Haenszel X², corrected"),
    ("strata.p_corrected", "ASSOC.STRATA", "p, corrected"),
    ("strata.statistic", "ASSOC.STRATA \"uncorrected\"", "Mantel–Haenszel X²"),
    ("strata.p", "ASSOC.STRATA \"uncorrected\"", "p"),
    ("strata.odds_ratio", "ASSOC.STRATA", "common odds ratio"),
    ("strata.lower", "ASSOC.STRATA", "lower 95% limit"),
    ("strata.upper", "ASSOC.STRATA", "upper 95% limit"),
    ("homogeneity.statistic", "ASSOC.HOMOGENEITY", "Breslow–Day–Tarone statistic"),
    ("homogeneity.p", "ASSOC.HOMOGENEITY", "p"),
    ("mcnemar.statistic_corrected", "ASSOC.PAIRED", "McNemar, corrected"),
    ("mcnemar.p_corrected", "ASSOC.PAIRED", "p, corrected"),
    ("mcnemar.statistic", "ASSOC.PAIRED \"uncorrected\"", "McNemar"),
    ("mcnemar.p", "ASSOC.PAIRED \"uncorrected\"", "p"),
    ("mcnemar.exact_p", "ASSOC.PAIRED \"exact\"", "exact binomial p"),
    ("bowker.statistic", "ASSOC.PAIRED (k×k)", "Bowker's statistic"),
    ("bowker.p", "ASSOC.PAIRED (k×k)", "p"),
    ("trend.z", "ASSOC.TREND", "Cochran–Armitage z"),
    ("trend.p", "ASSOC.TREND", "p"),
]
LIBRARIES = ["scipy", "statsmodels", "R"]

# Assoc's documented worst relative error per quantity on the short battery (README, "Precision").
# Every quantity keeps 1e-12 since the digits lost that issue 15 listed were fixed (the 2×2 exact
# test, the exact paired test, Cochran–Armitage, Yates, the bias-corrected V, subnormal alpha, and the
# cancellation in the Mantel–Haenszel and Breslow–Day sums); BOUNDS holds any exception, with its reason.
DEFAULT_BOUND = 1e-12
BOUNDS = {}


# ---------------------------------------------------------------- drawing inputs
def log_uniform(rng, low, high):
    return math.exp(rng.uniform(math.log(low), math.log(high)))


def draw_table(rng, rows, columns, total, zeros=False):
    """Counts around total·p_ij, p_ij = a_i b_j (1 + s e_ij): s spreads the p-values from 1 to far tails."""
    a = [rng.uniform(0.2, 1) for _ in range(rows)]
    b = [rng.uniform(0.2, 1) for _ in range(columns)]
    strength = log_uniform(rng, 0.3 / math.sqrt(total), 1.0) if rng.random() < 0.8 else 0.0
    weights = [[a[i] * b[j] * (1 + strength * rng.uniform(-0.9, 0.9)) for j in range(columns)] for i in range(rows)]
    scale = total / sum(map(sum, weights))
    while True:
        table = [[max(0, round(scale * w + rng.gauss(0, math.sqrt(scale * w)))) for w in row] for row in weights]
        if zeros and rng.random() < 0.3:
            table[rng.randrange(rows)][rng.randrange(columns)] = 0
        if all(sum(row) > 0 for row in table) and all(sum(col) > 0 for col in zip(*table)):
            return table


def draw_total(rng, low=5, high=1e8):
    return log_uniform(rng, low, high)


def shape(rng, max_rows=5, max_columns=6):
    return rng.randint(2, max_rows), rng.randint(2, max_columns)


def case(kind, function, rows):
    """A case: the evaluated function and its numbers as a rows × columns block."""
    return {"kind": kind, "function": function, "rows": len(rows), "columns": len(rows[0]),
            "values": [repr(float(v)) if isinstance(v, float) else str(v) for row in rows for v in row]}


def random_cases(rng, count):
    cases = []
    for _ in range(count):
        r, c = shape(rng)
        t = draw_table(rng, r, c, draw_total(rng), zeros=True)
        cases += [case("pearson", "pearson", t), case("g", "g", t), case("expected", "expected", t),
                  case("residuals", "residuals", t), case("celltest", "celltest", t),
                  case("strength", "strength", t)]
        t2 = draw_table(rng, 2, 2, draw_total(rng))
        cases += [case("yates", "yates", t2), case("strength", "strength", t2),
                  case("ratios", "ratios", draw_table(rng, 2, 2, draw_total(rng, 5, 1e6), zeros=True))]
        df = rng.choice([rng.randint(1, 30), round(log_uniform(rng, 0.1, 1e4), 3)])
        alpha = log_uniform(rng, 1e-300, 0.9) if rng.random() < 0.9 else log_uniform(rng, 5e-324, 1e-300)
        cases.append(case("critical", "critical", [[df, alpha]]))
        cases.append(case("power", "power", [[round(log_uniform(rng, 0.01, 1), 4), rng.randint(5, 100000),
                                              rng.randint(1, 20), rng.choice([0.05, 0.01, 0.1, 0.001])]]))
        k = rng.randint(2, 8)
        observed = [max(0, round(draw_total(rng, 1, 1e6))) for _ in range(k)]
        shares = [rng.randint(1, 50) for _ in range(k)]
        cases.append(case("fit", "fit", [observed, shares]))
        strata = [sum(draw_table(rng, 2, 2, draw_total(rng, 8, 1e6)), []) for _ in range(rng.randint(2, 6))]
        cases += [case("strata", "strata", strata), case("homogeneity", "homogeneity", strata)]
        b, cc = round(draw_total(rng, 1, 1e6)), round(draw_total(rng, 1, 1e6))
        if rng.random() < 0.5:
            cc = max(0, b + rng.randint(-3, 3))
        cases.append(case("mcnemar", "paired", [[rng.randint(0, 1000), b], [cc, rng.randint(0, 1000)]]))
        k = rng.randint(3, 5)
        square = draw_table(rng, k, k, draw_total(rng, 20, 1e6))
        if rng.random() < 0.3:  # a pair nobody moved between
            i, j = rng.sample(range(k), 2)
            square[i][j] = square[j][i] = 0
        if sum(square[i][j] for i in range(k) for j in range(k) if i != j) > 0:
            cases.append(case("bowker", "paired", square))
        k = rng.randint(2, 6)
        t = draw_table(rng, 2, k, draw_total(rng, 20, 1e7))
        scores = sorted(rng.sample(range(0, 60), k)) if rng.random() < 0.6 else list(range(1, k + 1))
        if len(set(scores[j] for j in range(k) if t[0][j] + t[1][j] > 0)) > 1 and 0 < sum(t[0]) < sum(map(sum, t)):
            cases.append(case("trend", "trend", t + [scores]))
    return cases


def slow_random_cases(rng, count):
    """Functions whose references take longer: fewer cases."""
    cases = []
    for _ in range(count):
        cases.append(case("exact2x2", "exact", draw_table(rng, 2, 2, draw_total(rng, 4, 2e6), zeros=True)))
        r, c = rng.choice([(2, 3), (2, 4), (3, 3), (2, 5)])
        cases.append(case("exactrxc", "exact", draw_table(rng, r, c, rng.randint(6, 28))))
        r, c = shape(rng, 4, 4)
        cases.append(case("vinterval", "vinterval", draw_table(rng, r, c, draw_total(rng, 10, 3000))))
        cases.append(case("samplesize", "samplesize", [[round(log_uniform(rng, 0.05, 0.8), 3),
                                                        rng.choice([0.5, 0.8, 0.9, 0.95, 0.99]),
                                                        rng.randint(1, 12), rng.choice([0.05, 0.01])]]))
    return cases


# The hard cases of issue 15 (digits lost); the Breslow–Day case near a bound is not given there.
ISSUE_CASES = [
    case("exact2x2", "exact", [[2184746, 1745229], [2218678, 1809224]]),
    case("trend", "trend", [[2, 273083], [18, 4549], [24, 20]]),
    case("yates", "yates", [[99999997, 99999999], [99999999, 99999999]]),
    case("strength", "strength", [[1, 0], [2, 3]]),
    case("power", "power", [[0, 100, 1, 0.05]]),
    case("power", "power", [[0, 37, 4, 0.05]]),
    case("critical", "critical", [[1, 1e-310]]),
    case("critical", "critical", [[1, 5e-324]]),
    case("critical", "critical", [[0.5, 1e-320]]),
    case("critical", "critical", [[50, 3e-322]]),
]


# Found by the battery: Assoc loses digits here too.
FOUND_CASES = [
    case("mcnemar", "paired", [[172, 1149], [18, 536]]),  # an exact p-value below 2.2e-308
]


def draw(seed, count, slow_count):
    rng = random.Random(seed)
    cases = random_cases(rng, count) + slow_random_cases(rng, slow_count) + \
        [dict(c) for c in ISSUE_CASES + FOUND_CASES]
    for i, c in enumerate(cases):
        c["id"] = f"{c['kind']}-{i}"
    return cases


# ---------------------------------------------------------------- evaluating and comparing
def run_assoc(cases, program):
    lines = "".join(f"{c['id']} {c['function']} {c['rows']} {c['columns']} {' '.join(c['values'])}\n" for c in cases)
    out = subprocess.run([str(program)], input=lines, capture_output=True, text=True, check=True).stdout
    values = {}
    for line in out.splitlines():
        id_, _, rest = line.partition(" ")
        values[id_] = rest if rest.startswith("error") else [float(v) for v in rest.split()]
    return values


def spread(function, shape_, values):
    """{quantity: [values]} from a function's output in layout order."""
    result = {}
    for key, value in zip(layout(function, shape_), values):
        result.setdefault(key, []).append(value)
    return result


SMALLEST_NORMAL = Decimal(sys.float_info.min)  # 2.2e-308: below it a double holds fewer digits


def relative_error(value, reference):
    """|value − reference| / |reference| (reference: a decimal text); |value| where the reference is 0,
    and relative to the smallest normal double where the reference is below it (a p-value of 1e-1000
    can only be shown as 0)."""
    if value is None or (isinstance(value, float) and not math.isfinite(value)):
        return math.inf
    r = Decimal(reference)
    d = abs(Decimal(value) - r)
    return float(d / max(abs(r), SMALLEST_NORMAL)) if r != 0 else float(d)


def worst_errors(cases, source):
    """{quantity: (worst error, case id, cases)} of one source's values ({id: {quantity: [values]}})."""
    worst = {}
    for c in cases:
        got = source.get(c["id"])
        if got is None:
            continue
        for key, refs in c["reference"].items():
            if key not in got:
                continue
            errors = [relative_error(v, r) for v, r in zip(got[key], refs)] if len(got[key]) == len(refs) else [math.inf]
            w = worst.setdefault(key, [-1.0, "", 0])
            w[2] += 1
            if max(errors) > w[0]:
                w[0], w[1] = max(errors), c["id"]
    return worst


def assoc_values(cases, program):
    raw = run_assoc(cases, program)
    values, failures = {}, []
    for c in cases:
        out = raw.get(c["id"], "error no output")
        if isinstance(out, str):
            failures.append(f"{c['id']}: {out}")
            continue
        values[c["id"]] = spread(c["function"], (c["rows"], c["columns"]), out)
    return values, failures


def format_error(e):
    if e is None:
        return "—"
    if e == 0:
        return "0"
    if math.isinf(e):
        return "fails"
    return f"{e:.0e}".replace("e-0", "e-").replace("e+0", "e+")


def print_table(worst_by_source, cases):
    counts = {}
    for c in cases:
        for key in c["reference"]:
            counts[key] = counts.get(key, 0) + 1
    print("| function | quantity | cases | Assoc | " + " | ".join(LIBRARIES) + " |")
    print("|---|---|---|---|" + "---|" * len(LIBRARIES))
    for key, function, what in QUANTITIES:
        if key not in counts:
            continue
        cells = []
        for source in ["Assoc"] + LIBRARIES:
            w = worst_by_source[source].get(key)
            text = format_error(w[0] if w else None)
            if w and source != "Assoc" and w[2] < counts[key]:
                text += f" ({w[2]})"
            cells.append(text)
        print(f"| `{function}` | {what} | {counts[key]} | " + " | ".join(cells) + " |")


# ---------------------------------------------------------------- modes
def references_for(cases):
    import mp_reference  # mpmath and fractions: only for the long form and for --write-short
    for i, c in enumerate(cases):
        c["reference"] = mp_reference.reference(c)
        if (i + 1) % 200 == 0:
            print(f"  references: {i + 1} of {len(cases)}", file=sys.stderr, flush=True)
    return cases


def long_form(args):
    import library_values
    cases = references_for(draw(args.seed, args.cases or 200, (args.cases or 200) // 4))
    assoc, failures = assoc_values(cases, args.eval)
    worst = {"Assoc": worst_errors(cases, assoc)}
    worst.update(library_values.worst_by_library(cases, worst_errors))
    print(f"{len(cases)} cases, seed {args.seed}; worst relative error against 40-digit references")
    print_table(worst, cases)
    print("\nWhere Assoc's error is largest:")
    for key, (e, where, _) in sorted(worst["Assoc"].items(), key=lambda kv: -kv[1][0])[:8]:
        c = next(c for c in cases if c["id"] == where)
        print(f"  {key}: {format_error(e)} at {c['function']} {c['rows']}×{c['columns']} {' '.join(c['values'])}")
    for f in failures:
        print("  Assoc error:", f)


def write_short(args):
    cases = references_for(draw(args.seed, args.cases or 12, (args.cases or 12) // 2))
    SHORT_BATTERY.write_text(json.dumps({
        "about": "Inputs and 40-digit references of the short precision battery; written by "
                 "tests/precision/battery.py --write-short (mpmath 1.2.1 at 50 digits, exact fractions).",
        "seed": args.seed, "cases": cases}, indent=1, ensure_ascii=False) + "\n")
    print(f"wrote {SHORT_BATTERY.relative_to(ROOT)}: {len(cases)} cases")


def check(args):
    cases = json.loads(SHORT_BATTERY.read_text())["cases"]
    assoc, failures = assoc_values(cases, args.eval)
    worst = worst_errors(cases, assoc)
    beyond = []
    print(f"{len(cases)} cases of the short battery; Assoc's worst relative error against 40-digit references:")
    for key, function, what in QUANTITIES:
        if key not in worst:
            continue
        e, where, n = worst[key]
        bound = BOUNDS.get(key, DEFAULT_BOUND)
        flag = "" if e <= bound else "   BEYOND THE BOUND"
        print(f"  {key:30} {format_error(e):>7}  (bound {bound:.0e}, {n} cases){flag}")
        if e > bound:
            beyond.append(f"{key}: {e:.2e} > {bound:.0e} at case {where}")
    for f in failures:
        print("Assoc could not compute", f)
    if beyond or failures:
        print("\n".join(beyond))
        sys.exit(1)


def main():
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    mode = parser.add_mutually_exclusive_group(required=True)
    mode.add_argument("--long", action="store_true")
    mode.add_argument("--write-short", action="store_true")
    mode.add_argument("--check", action="store_true")
    parser.add_argument("--seed", type=int, default=15)
    parser.add_argument("--cases", type=int)
    parser.add_argument("--eval", default=str(ROOT / "build" / "tests" / "precision" / "precision_eval"))
    args = parser.parse_args()
    sys.path.insert(0, str(HERE))
    if args.long:
        long_form(args)
    elif args.write_short:
        write_short(args)
    else:
        check(args)


if __name__ == "__main__":
    main()
