"""The reference libraries' values on the battery's inputs: scipy 1.10.1, statsmodels 0.13.5 and
R 4.2.2 (one Rscript run for all cases), each only where it computes the same quantity under the same
convention as Assoc (docs/guide.md, "Conventions"); inputs where a library's convention differs are
left out for that library:
- Mantel–Haenszel with continuity correction when |D| < ½ (R drops the correction, statsmodels
  subtracts ½ regardless);
- McNemar with continuity correction when b = c (statsmodels gives (|b − c| − 1)² / (b + c) = 1/(b + c));
- Bowker's test of a table with a pair nobody moved between (R gives NaN, statsmodels keeps the
  pair's degree of freedom).
R's trend test gives z², compared as ±√(z²) with the reference's sign.
"""
import math
import subprocess
import warnings

import numpy as np
import scipy
import statsmodels
from scipy import stats
from scipy.stats import contingency
from statsmodels.stats import contingency_tables as ct
from statsmodels.stats.multitest import multipletests
from statsmodels.stats.power import GofChisquarePower

from mp_reference import block

assert scipy.__version__ == "1.10.1", scipy.__version__
assert statsmodels.__version__.startswith("0.13.5"), statsmodels.__version__


def numbers(case):
    return [[float(v) for v in row] for row in block(case)]


def mantel_haenszel_difference(rows):
    return sum(a - (a + b) * (a + c) / (a + b + c + d) for a, b, c, d in rows)


def has_empty_pair(t):
    k = len(t)
    return any(t[i][j] + t[j][i] == 0 for i in range(k) for j in range(i + 1, k))


def scipy_values(case):
    kind, t = case["kind"], numbers(case)
    a = np.array(t)
    if kind == "pearson":
        x2, p, _, _ = stats.chi2_contingency(a, correction=False)
        return {"pearson.statistic": [x2], "pearson.p": [p]}
    if kind == "g":
        g2, p, _, _ = stats.chi2_contingency(a, correction=False, lambda_="log-likelihood")
        return {"g.statistic": [g2], "g.p": [p]}
    if kind == "yates":
        y, p, _, _ = stats.chi2_contingency(a, correction=True)
        return {"yates.statistic": [y], "yates.p": [p]}
    if kind == "expected":
        return {"expected": list(contingency.expected_freq(a).ravel())}
    if kind == "strength":
        return {"strength.cramer": [contingency.association(a.astype(int), method="cramer")],
                "strength.contingency": [contingency.association(a.astype(int), method="pearson")]}
    if kind == "exact2x2":
        return {f"exact.{side}": [stats.fisher_exact(a, alternative=alt)[1]]
                for side, alt in (("two_sided", "two-sided"), ("lower", "less"), ("upper", "greater"))}
    if kind == "ratios":
        if (a == 0).any():
            a = a + 0.5
        odds = contingency.odds_ratio(a, kind="sample")
        oci = odds.confidence_interval(0.95)
        risk = contingency.relative_risk(a[0, 0], a[0].sum(), a[1, 0], a[1].sum())
        rci = risk.confidence_interval(0.95)
        return {"oddsratio.estimate": [odds.statistic], "oddsratio.lower": [oci.low], "oddsratio.upper": [oci.high],
                "riskratio.estimate": [risk.relative_risk], "riskratio.lower": [rci.low],
                "riskratio.upper": [rci.high]}
    if kind == "fit":
        observed, shares = a
        x2, p = stats.chisquare(observed, shares * observed.sum() / shares.sum())
        return {"fit.statistic": [x2], "fit.p": [p]}
    if kind == "critical":
        return {"critical": [stats.chi2.isf(t[0][1], t[0][0])]}
    if kind == "power":
        w, n, df, alpha = t[0]
        return {"power": [stats.ncx2.sf(stats.chi2.isf(alpha, df), df, n * w * w)]}
    return {}


def statsmodels_values(case):
    kind, t = case["kind"], numbers(case)
    a = np.array(t)
    if kind == "pearson":
        result = ct.Table(a.copy(), shift_zeros=False).test_nominal_association()
        return {"pearson.statistic": [result.statistic], "pearson.p": [result.pvalue]}
    if kind == "expected":
        return {"expected": list(np.asarray(ct.Table(a.copy(), shift_zeros=False).fittedvalues).ravel())}
    if kind == "residuals":
        table = ct.Table(a.copy(), shift_zeros=False)
        return {"residuals.pearson": list(np.asarray(table.resid_pearson).ravel()),
                "residuals.adjusted": list(np.asarray(table.standardized_resids).ravel())}
    if kind == "celltest":
        z = np.asarray(ct.Table(a.copy(), shift_zeros=False).standardized_resids).ravel()
        return {"celltest.holm": list(multipletests(2 * stats.norm.sf(np.abs(z)), method="holm")[1])}
    if kind == "ratios":
        table = ct.Table2x2(a + 0.5 if (a == 0).any() else a, shift_zeros=False)
        olo, ohi = table.oddsratio_confint(0.05, method="normal")
        rlo, rhi = table.riskratio_confint(0.05, method="normal")
        return {"oddsratio.estimate": [table.oddsratio], "oddsratio.lower": [olo], "oddsratio.upper": [ohi],
                "riskratio.estimate": [table.riskratio], "riskratio.lower": [rlo], "riskratio.upper": [rhi]}
    if kind == "power":
        w, n, df, alpha = t[0]
        return {"power": [GofChisquarePower().power(w, n, alpha, n_bins=int(df) + 1)]}
    if kind == "samplesize":
        w, power, df, alpha = t[0]
        n = GofChisquarePower().solve_power(effect_size=w, nobs=None, alpha=alpha, power=power, n_bins=int(df) + 1)
        return {"samplesize": [float(math.ceil(float(np.squeeze(n))))]}
    if kind in ("strata", "homogeneity"):
        tables = np.array([[[r[0], r[1]], [r[2], r[3]]] for r in t]).transpose(1, 2, 0)
        st = ct.StratifiedTable(tables)
        if kind == "homogeneity":
            result = st.test_equal_odds(adjust=True)
            return {"homogeneity.statistic": [result.statistic], "homogeneity.p": [result.pvalue]}
        plain = st.test_null_odds(correction=False)
        out = {"strata.statistic": [plain.statistic], "strata.p": [plain.pvalue],
               "strata.odds_ratio": [st.oddsratio_pooled]}
        lo, hi = st.oddsratio_pooled_confint(0.05)
        out.update({"strata.lower": [lo], "strata.upper": [hi]})
        if abs(mantel_haenszel_difference(t)) >= 0.5:
            corrected = st.test_null_odds(correction=True)
            out.update({"strata.statistic_corrected": [corrected.statistic], "strata.p_corrected": [corrected.pvalue]})
        return out
    if kind == "mcnemar":
        plain = ct.mcnemar(a, exact=False, correction=False)
        out = {"mcnemar.statistic": [plain.statistic], "mcnemar.p": [plain.pvalue],
               "mcnemar.exact_p": [ct.mcnemar(a, exact=True).pvalue]}
        if t[0][1] != t[1][0]:
            corrected = ct.mcnemar(a, exact=False, correction=True)
            out.update({"mcnemar.statistic_corrected": [corrected.statistic],
                        "mcnemar.p_corrected": [corrected.pvalue]})
        return out
    if kind == "bowker" and not has_empty_pair(t):
        result = ct.SquareTable(a, shift_zeros=False).symmetry()
        return {"bowker.statistic": [result.statistic], "bowker.p": [result.pvalue], "bowker.df": [float(result.df)]}
    return {}


def r_matrix(t):
    return f"matrix(c({','.join(repr(float(v)) for row in t for v in row)}), nrow={len(t)}, byrow=TRUE)"


def r_expressions(case):
    """{quantity: an R expression for its values (row by row)} for one case."""
    kind, t = case["kind"], numbers(case)
    m = r_matrix(t)
    by_rows = "as.vector(t({}))"
    if kind == "pearson":
        return {"pearson.statistic": f"chisq.test({m}, correct=FALSE)$statistic",
                "pearson.p": f"chisq.test({m}, correct=FALSE)$p.value"}
    if kind == "yates":
        return {"yates.statistic": f"chisq.test({m}, correct=TRUE)$statistic",
                "yates.p": f"chisq.test({m}, correct=TRUE)$p.value"}
    if kind == "expected":
        return {"expected": by_rows.format(f"suppressWarnings(chisq.test({m}))$expected")}
    if kind == "residuals":
        return {"residuals.pearson": by_rows.format(f"suppressWarnings(chisq.test({m}))$residuals"),
                "residuals.adjusted": by_rows.format(f"suppressWarnings(chisq.test({m}))$stdres")}
    if kind == "celltest":
        return {"celltest.holm": f"p.adjust(2 * pnorm(-abs({by_rows.format(f'suppressWarnings(chisq.test({m}))$stdres')})), 'holm')"}
    if kind == "exact2x2":
        return {f"exact.{side}": f"fisher.test({m}, alternative='{alt}')$p.value"
                for side, alt in (("two_sided", "two.sided"), ("lower", "less"), ("upper", "greater"))}
    if kind == "exactrxc":
        return {"exact.rxc": f"fisher.test({m}, workspace=2e8)$p.value"}
    if kind == "fit":
        observed, shares = t
        return {"fit.statistic": f"chisq.test(c({','.join(map(repr, observed))}), p=c({','.join(map(repr, shares))}), rescale.p=TRUE)$statistic",
                "fit.p": f"chisq.test(c({','.join(map(repr, observed))}), p=c({','.join(map(repr, shares))}), rescale.p=TRUE)$p.value"}
    if kind == "critical":
        df, alpha = t[0]
        return {"critical": f"qchisq({alpha!r}, {df!r}, lower.tail=FALSE)"}
    if kind == "power":
        w, n, df, alpha = t[0]
        return {"power": f"pchisq(qchisq({alpha!r}, {df!r}, lower.tail=FALSE), {df!r}, ncp={n!r}*{w!r}^2, lower.tail=FALSE)"}
    if kind == "strata":
        cells = ",".join(repr(float(v)) for r in t for v in (r[0], r[2], r[1], r[3]))  # column-major 2×2 per stratum
        array = f"array(c({cells}), dim=c(2, 2, {len(t)}))"
        out = {"strata.statistic": f"mantelhaen.test({array}, correct=FALSE)$statistic",
               "strata.p": f"mantelhaen.test({array}, correct=FALSE)$p.value",
               "strata.odds_ratio": f"mantelhaen.test({array})$estimate",
               "strata.lower": f"mantelhaen.test({array})$conf.int[1]",
               "strata.upper": f"mantelhaen.test({array})$conf.int[2]"}
        if abs(mantel_haenszel_difference(t)) >= 0.5:
            out.update({"strata.statistic_corrected": f"mantelhaen.test({array}, correct=TRUE)$statistic",
                        "strata.p_corrected": f"mantelhaen.test({array}, correct=TRUE)$p.value"})
        return out
    if kind == "mcnemar":
        b, c = int(t[0][1]), int(t[1][0])
        return {"mcnemar.statistic_corrected": f"mcnemar.test({m}, correct=TRUE)$statistic",
                "mcnemar.p_corrected": f"mcnemar.test({m}, correct=TRUE)$p.value",
                "mcnemar.statistic": f"mcnemar.test({m}, correct=FALSE)$statistic",
                "mcnemar.p": f"mcnemar.test({m}, correct=FALSE)$p.value",
                "mcnemar.exact_p": f"binom.test({min(b, c)}, {b + c})$p.value"}
    if kind == "bowker" and not has_empty_pair(t):
        return {"bowker.statistic": f"mcnemar.test({m})$statistic", "bowker.p": f"mcnemar.test({m})$p.value",
                "bowker.df": f"mcnemar.test({m})$parameter"}
    if kind == "trend":
        events, others, scores = t
        totals = [x + y for x, y in zip(events, others)]
        call = (f"prop.trend.test(c({','.join(map(repr, events))}), c({','.join(map(repr, totals))}), "
                f"c({','.join(map(repr, scores))}))")
        return {"trend.z": f"sqrt({call}$statistic)", "trend.p": f"{call}$p.value"}
    return {}


def r_values(cases):
    lines = ["options(warn=-1)"]
    for case in cases:
        for key, expression in r_expressions(case).items():
            lines.append(f"tryCatch(cat('{case['id']}', '{key}', sprintf('%.17g', as.numeric({expression})), '\\n'), "
                         "error=function(e) NULL)")
    out = subprocess.run(["Rscript", "-"], input="\n".join(lines), capture_output=True, text=True, check=True).stdout
    values = {}
    for line in out.splitlines():
        id_, key, *rest = line.split()
        values.setdefault(id_, {})[key] = [float(v) for v in rest]
    # R gives z²: the trend's z takes the reference's sign.
    for case in cases:
        got = values.get(case["id"], {})
        if "trend.z" in got and case["reference"]["trend.z"][0].startswith("-"):
            got["trend.z"] = [-v for v in got["trend.z"]]
    return values


def worst_by_library(cases, worst_errors):
    version = subprocess.run(["Rscript", "-e", "cat(R.version.string)"], capture_output=True, text=True).stdout
    assert "4.2.2" in version, version
    found = {"scipy": {}, "statsmodels": {}}
    for case in cases:
        for name, values in (("scipy", scipy_values), ("statsmodels", statsmodels_values)):
            with warnings.catch_warnings():
                warnings.simplefilter("ignore")
                try:
                    got = values(case)
                except Exception:  # the library refuses this input: no value to compare
                    got = {}
            if got:
                found[name][case["id"]] = {k: [float(x) for x in v] for k, v in got.items()}
    found["R"] = r_values(cases)
    return {name: worst_errors(cases, values) for name, values in found.items()}
