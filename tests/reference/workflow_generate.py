#!/usr/bin/python3
"""Expected values for the stratified, paired, trend and selection-impact tests of Assoc.

Run with Debian's python3 (numpy 1.24.2, scipy 1.10.1, statsmodels 0.13.5):
    /usr/bin/python3 tests/reference/workflow_generate.py > tests/reference/workflow_statsmodels_values.hpp
The R script beside it (workflow_generate.R) computes the same quantities a second way.
p-values are recomputed from the statistics with scipy's upper-tail functions (chi2.sf, norm.sf):
statsmodels 0.13.5 forms them as 1 - cdf, which loses digits in the tail.
"""
import numpy as np
import scipy
import statsmodels
from scipy import stats
from statsmodels.stats.contingency_tables import StratifiedTable, SquareTable, mcnemar

out = []


def emit(name, value):
    out.append(f"inline constexpr double {name} = {value!r};")


# --- Bickel, Hammel & O'Connell (1975): Berkeley admissions, strata = departments A..F.
# Counts as in R's UCBAdmissions. Each stratum: rows men, women; columns admitted, rejected.
ucb = [
    (512, 313, 89, 19),
    (353, 207, 17, 8),
    (120, 205, 202, 391),
    (138, 279, 131, 244),
    (53, 138, 94, 299),
    (22, 351, 24, 317),
]
tables = [np.array([[a, b], [c, d]], dtype=float) for a, b, c, d in ucb]
st = StratifiedTable(tables)
corrected = st.test_null_odds(correction=True)
uncorrected = st.test_null_odds(correction=False)
lower, upper = st.oddsratio_pooled_confint(alpha=0.05)
equal = st.test_equal_odds(adjust=False)
tarone = st.test_equal_odds(adjust=True)
out.append("// Bickel et al. (1975) admissions (R UCBAdmissions): statsmodels StratifiedTable")
emit("ucb_mh_statistic_corrected", corrected.statistic)
emit("ucb_mh_p_corrected", stats.chi2.sf(corrected.statistic, 1))
emit("ucb_mh_statistic_uncorrected", uncorrected.statistic)
emit("ucb_mh_p_uncorrected", stats.chi2.sf(uncorrected.statistic, 1))
emit("ucb_mh_odds_ratio", st.oddsratio_pooled)
emit("ucb_mh_lower_95", lower)
emit("ucb_mh_upper_95", upper)
lower90, upper90 = st.oddsratio_pooled_confint(alpha=0.10)
emit("ucb_mh_lower_90", lower90)
emit("ucb_mh_upper_90", upper90)
emit("ucb_breslow_day_statistic", equal.statistic)
emit("ucb_breslow_day_tarone_statistic", tarone.statistic)
emit("ucb_breslow_day_tarone_p", stats.chi2.sf(tarone.statistic, len(ucb) - 1))

# --- McNemar: the approval-rating table [[794,150],[86,570]] (R ?mcnemar.test, citing Agresti 1990 p.350).
approval = np.array([[794, 150], [86, 570]])
m_corr = mcnemar(approval, exact=False, correction=True)
m_unc = mcnemar(approval, exact=False, correction=False)
m_exact = mcnemar(approval, exact=True)
out.append("// McNemar, approval table: statsmodels mcnemar")
emit("approval_corrected_statistic", m_corr.statistic)
emit("approval_corrected_p", stats.chi2.sf(m_corr.statistic, 1))
emit("approval_uncorrected_statistic", m_unc.statistic)
emit("approval_uncorrected_p", stats.chi2.sf(m_unc.statistic, 1))
emit("approval_exact_p", m_exact.pvalue)
emit("approval_exact_statistic", m_exact.statistic)

# --- Bowker: invented appraisal ratings of the same staff in two years (below / meets / exceeds).
ratings = np.array([[24, 14, 6], [4, 41, 15], [1, 5, 19]])
sym = SquareTable(ratings, shift_zeros=False).symmetry()
out.append("// Bowker, invented 3x3 ratings table: statsmodels SquareTable.symmetry")
emit("ratings_bowker_statistic", sym.statistic)
emit("ratings_bowker_df", sym.df)
emit("ratings_bowker_p", stats.chi2.sf(sym.statistic, sym.df))
# A 4x4 table with one pair (rows 1 and 2) empty: SquareTable would divide 0 by 0, so the same
# sum is formed over the pairs that hold counts and df counts only those pairs.
sparse = np.array([[14, 0, 5, 2], [0, 22, 7, 1], [1, 3, 11, 4], [0, 2, 6, 9]])
num, df = 0.0, 0
for i in range(4):
    for j in range(i + 1, 4):
        s = sparse[i, j] + sparse[j, i]
        if s > 0:
            num += (sparse[i, j] - sparse[j, i]) ** 2 / s
            df += 1
out.append("// Bowker, invented 4x4 table with an empty pair: the formula over non-empty pairs, scipy chi2.sf")
emit("sparse_bowker_statistic", num)
emit("sparse_bowker_df", df)
emit("sparse_bowker_p", stats.chi2.sf(num, df))

# --- Cochran-Armitage: Agresti (2007) malformation x maternal alcohol, scores 0, .5, 1.5, 4, 7.
def trend(events, totals, scores):
    events, totals, scores = (np.asarray(v, dtype=float) for v in (events, totals, scores))
    n = totals.sum()
    pbar = events.sum() / n
    sbar = (totals * scores).sum() / n
    num = (events * (scores - sbar)).sum()
    var = pbar * (1 - pbar) * (totals * (scores - sbar) ** 2).sum()  # the variance with N
    z = num / np.sqrt(var)
    return z, 2 * stats.norm.sf(abs(z))


present = [48, 38, 5, 1, 1]
absent = [17066, 14464, 788, 126, 37]
totals = [p + a for p, a in zip(present, absent)]
z, p = trend(present, totals, [0, 0.5, 1.5, 4.0, 7.0])
out.append("// Cochran-Armitage, alcohol table: the prop.trend.test formula (variance with N) in numpy/scipy")
emit("alcohol_trend_z", z)
emit("alcohol_trend_p", p)
# Invented: promotions of staff by training sessions attended (0..3), default scores 1..4.
z, p = trend([4, 7, 11, 15], [40, 40, 40, 40], [1, 2, 3, 4])
out.append("// Cochran-Armitage, invented training table, scores 1..4")
emit("training_trend_z", z)
emit("training_trend_p", p)

print("#pragma once")
print("// Generated by tests/reference/workflow_generate.py: do not edit.")
print(f"// numpy {np.__version__}, scipy {scipy.__version__}, statsmodels {statsmodels.__version__}")
print("namespace assoc::reference::statsmodels_values {")
print("\n".join(out))
print("}  // namespace assoc::reference::statsmodels_values")
