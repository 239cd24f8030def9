"""40-digit references for the precision battery (battery.py): exact fractions where the quantity is
rational, mpmath 1.2.1 at 50 digits where it needs logarithms, roots, distributions or inversions.
Each definition is written from the formula Assoc documents (docs/functions.md, docs/guide.md
"Conventions"), not from Assoc's code; the inputs are the exact doubles Assoc reads.
"""
import math
from fractions import Fraction as F

import mpmath as mp

mp.mp.dps = 50
HALF = F(1, 2)
CONFIDENCE = F(0.95)  # the double 0.95, as Assoc's default confidence level
TIE = F(1, 10**7)     # the exact test's tie margin


def text(x):
    """40 significant digits of a Fraction, an integer or an mpf."""
    if isinstance(x, F):
        x = mp.mpf(x.numerator) / x.denominator
    return mp.nstr(mp.mpf(x), 40) if x != 0 else "0"


def exact(value_text):
    """The number Assoc reads: the double nearest the decimal text (integers are exact)."""
    return F(float(value_text)) if any(ch in value_text for ch in ".eEn") else F(int(value_text))


def block(case):
    v = [exact(x) for x in case["values"]]
    return [v[r * case["columns"]:(r + 1) * case["columns"]] for r in range(case["rows"])]


def mpf(x):
    return mp.mpf(x.numerator) / x.denominator if isinstance(x, F) else mp.mpf(x)


def sqrt(x):
    return mp.sqrt(mpf(x))


# ---------------------------------------------------------------- distributions
def chi2_sf(x, df):
    """P(X ≥ x), X ~ χ²(df): the regularised upper incomplete gamma Q(df/2, x/2)."""
    return mp.gammainc(mpf(df) / 2, mpf(x) / 2, mp.inf, regularized=True)


def normal_two_sided(z):
    return mp.erfc(abs(mpf(z)) / mp.sqrt(2))


def z_of(confidence):
    return mp.sqrt(2) * mp.erfinv(mpf(confidence))


def noncentral_sf(x, df, lam):
    """P(X ≥ x), X ~ noncentral χ²(df, λ) = Σ_j Pois(j; λ/2) Q(df/2 + j, x/2), summed from about 40
    standard deviations below the Poisson mode (the terms below are far beneath 50 digits) upwards,
    with Q(a + 1, y) = Q(a, y) + y^a e^(−y) / Γ(a + 1)."""
    x, lam = mpf(x), mpf(lam)
    if lam == 0:
        return chi2_sf(x, df)
    h, y, a0 = lam / 2, x / 2, mpf(df) / 2
    j = max(0, int(h - 40 * mp.sqrt(h) - 40))
    weight = mp.exp(-h + j * mp.log(h) - mp.loggamma(j + 1)) if j > 0 else mp.exp(-h)
    q = mp.gammainc(a0 + j, y, mp.inf, regularized=True)
    step = mp.exp((a0 + j) * mp.log(y) - y - mp.loggamma(a0 + j + 1)) if y > 0 else mp.mpf(0)
    total = mp.mpf(0)
    while True:
        total += weight * q
        if j > h and weight < total * mp.mpf(10) ** -55:
            return total
        q += step
        step *= y / (a0 + j + 1)
        weight *= h / (j + 1)
        j += 1


def solve_increasing(f, target, start):
    """The x ≥ 0 with f(x) = target for f increasing (bracketed by doubling, then Anderson–Björck)."""
    lo, hi = mp.mpf(0), mp.mpf(max(start, 1))
    while f(hi) < target:
        lo, hi = hi, hi * 2
    return mp.findroot(lambda x: f(x) - target, (lo, hi), solver="anderson", tol=mp.mpf(10) ** -45)


def critical_value(df, alpha):
    """The c with P(X ≥ c) = alpha, solved in logarithms (alpha may be 1e-310)."""
    log_alpha = mp.log(mpf(alpha))
    return solve_increasing(lambda c: -mp.log(chi2_sf(c, df)), -log_alpha, mpf(df))


# ---------------------------------------------------------------- tables
def kept(t):
    """Rows and columns with counts (Assoc sets the others aside)."""
    t = [row for row in t if any(row)]
    keep = [j for j in range(len(t[0])) if any(row[j] for row in t)]
    return [[row[j] for j in keep] for row in t]


def margins(t):
    rows = [sum(row) for row in t]
    columns = [sum(col) for col in zip(*t)]
    return rows, columns, sum(rows)


def expected(t):
    R, C, n = margins(t)
    return [[R[i] * C[j] / n for j in range(len(C))] for i in range(len(R))]


def pearson_statistic(t):
    E = expected(t)
    return sum((o - e) ** 2 / e for row, erow in zip(t, E) for o, e in zip(row, erow))


def df_of(t):
    return (len(t) - 1) * (len(t[0]) - 1)


def flat(m):
    return [x for row in m for x in row]


def adjusted_residuals(t):
    R, C, n = margins(t)
    E = expected(t)
    return [[mpf(t[i][j] - E[i][j]) / sqrt(E[i][j] * (1 - R[i] / n) * (1 - C[j] / n)) for j in range(len(C))]
            for i in range(len(R))]


def holm(p_values):
    m = len(p_values)
    order = sorted(range(m), key=lambda i: p_values[i])
    adjusted, running = [None] * m, mp.mpf(0)
    for rank, i in enumerate(order):
        running = max(running, min(mp.mpf(1), (m - rank) * p_values[i]))
        adjusted[i] = running
    return adjusted


# ---------------------------------------------------------------- exact tests
def log_hypergeometric(x, r1, r2, c1):
    """ln P(a = x) for a 2×2 table with row totals r1, r2 and first column total c1."""
    lg = mp.loggamma
    return (lg(r1 + 1) - lg(x + 1) - lg(r1 - x + 1) + lg(r2 + 1) - lg(c1 - x + 1) - lg(r2 - c1 + x + 1)
            - lg(r1 + r2 + 1) + lg(c1 + 1) + lg(r1 + r2 - c1 + 1))


def tail_sum(first, step, first_term, ratio, stop):
    """Σ P(x) for x = first, first + step, … up to `stop` (inclusive), from P(first) = first_term and
    P(x + step) = P(x)·ratio(x); ends when the terms fall below 1e-55 of the sum (they only fall, since
    the tail runs away from the mode)."""
    if (stop - first) * step < 0:
        return mp.mpf(0)
    term, x, total = first_term, first, mp.mpf(0)
    while True:
        total += term
        if x == stop or term < total * mp.mpf(10) ** -55:
            return total
        term *= ratio(x)
        x += step


def fisher_2x2(t):
    (a, b), (c, d) = [[int(v) for v in row] for row in t]
    r1, r2, c1 = a + b, c + d, a + c
    low, high = max(0, c1 - r2), min(r1, c1)
    log_p = lambda x: log_hypergeometric(x, r1, r2, c1)  # noqa: E731
    up = lambda x: mp.mpf((r1 - x) * (c1 - x)) / ((x + 1) * (r2 - c1 + x + 1))  # noqa: E731  P(x+1)/P(x)
    down = lambda x: mp.mpf(x * (r2 - c1 + x)) / ((r1 - x + 1) * (c1 - x + 1))  # noqa: E731  P(x-1)/P(x)

    def tail(x, step, stop):
        return tail_sum(x, step, mp.exp(log_p(x)), up if step > 0 else down, stop)

    mode = min(high, max(low, (r1 + 1) * (c1 + 1) // (r1 + r2 + 2)))
    # The tails that run away from the mode are summed term by term; the side that holds the mode is 1
    # minus the other side, which never loses digits that matter.
    if a <= mode:
        lower = tail(a, -1, low)
        upper = 1 - lower + mp.exp(log_p(a))
    else:
        upper = tail(a, 1, high)
        lower = 1 - upper + mp.exp(log_p(a))
    threshold = log_p(a) + mp.log1p(mpf(TIE))
    if log_p(mode) <= threshold:
        return {"exact.two_sided": [text(1)], "exact.lower": [text(min(1, lower))], "exact.upper": [text(min(1, upper))]}

    def crossing(lo, hi, falls_to_the_left):
        """The point nearest the mode whose probability is at most the threshold, or None."""
        edge = lo if falls_to_the_left else hi
        if log_p(edge) > threshold:
            return None
        while hi - lo > 1:  # probabilities rise towards the mode
            middle = (lo + hi) // 2
            if (log_p(middle) <= threshold) == falls_to_the_left:
                lo = middle
            else:
                hi = middle
        return lo if falls_to_the_left else hi

    left = crossing(low, mode, True)
    right = crossing(mode, high, False)
    two_sided = (tail(left, -1, low) if left is not None else 0) + (tail(right, 1, high) if right is not None else 0)
    return {"exact.two_sided": [text(two_sided)], "exact.lower": [text(lower)], "exact.upper": [text(upper)]}


def tables_with_margins(rows, columns):
    """Every table with these row and column totals, as a tuple of its cells row by row."""
    if len(rows) == 1:
        yield (tuple(columns),)
        return

    def first_rows(j, left, columns_left):
        if j == len(columns_left) - 1:
            if left <= columns_left[j]:
                yield (left,)
            return
        room = sum(columns_left[j + 1:])
        for v in range(max(0, left - room), min(left, columns_left[j]) + 1):
            for rest in first_rows(j + 1, left - v, columns_left):
                yield (v,) + rest

    for first in first_rows(0, rows[0], columns):
        for rest in tables_with_margins(rows[1:], [c - v for c, v in zip(columns, first)]):
            yield (first,) + rest


def fisher_rxc(t):
    t = [[int(v) for v in row] for row in t]
    R, C, n = margins(t)
    numerator = math.prod(map(math.factorial, R)) * math.prod(map(math.factorial, C))
    denominator = lambda table: math.factorial(n) * math.prod(math.factorial(x) for row in table for x in row)  # noqa
    observed = F(numerator, denominator(t))
    p = sum((q for q in (F(numerator, denominator(s)) for s in tables_with_margins(R, C))
             if q <= observed * (1 + TIE)), F(0))
    return {"exact.rxc": [text(p)]}


# ---------------------------------------------------------------- the battery's kinds
def table_references(kind, t):
    t = kept(t)
    X2, df = pearson_statistic(t), df_of(t)
    R, C, n = margins(t)
    E = expected(t)
    if kind == "pearson":
        return {"pearson.statistic": [text(X2)], "pearson.p": [text(chi2_sf(X2, df))]}
    if kind == "g":
        G2 = 2 * mp.fsum(mpf(o) * mp.log(mpf(o) / mpf(e)) for o, e in zip(flat(t), flat(E)) if o > 0)
        return {"g.statistic": [text(G2)], "g.p": [text(chi2_sf(G2, df))]}
    if kind == "yates":
        Y = sum(max(F(0), abs(o - e) - HALF) ** 2 / e for o, e in zip(flat(t), flat(E)))
        return {"yates.statistic": [text(Y)], "yates.p": [text(chi2_sf(Y, df))]}
    if kind == "expected":
        return {"expected": [text(e) for e in flat(E)]}
    if kind == "residuals":
        return {"residuals.pearson": [text(mpf(o - e) / sqrt(e)) for o, e in zip(flat(t), flat(E))],
                "residuals.adjusted": [text(z) for z in flat(adjusted_residuals(t))]}
    if kind == "celltest":
        return {"celltest.holm": [text(p) for p in holm([normal_two_sided(z) for z in flat(adjusted_residuals(t))])]}
    if kind == "strength":
        r, c = len(t), len(t[0])
        phi2 = max(F(0), X2 / n - F((r - 1) * (c - 1)) / (n - 1))
        rt, ct = r - F((r - 1) ** 2) / (n - 1), c - F((c - 1) ** 2) / (n - 1)
        out = {"strength.cramer": [text(sqrt(X2 / (n * (min(r, c) - 1))))],
               "strength.cramer_corrected": [text(sqrt(phi2 / min(rt - 1, ct - 1)) if phi2 > 0 else 0)],
               "strength.contingency": [text(sqrt(X2 / (X2 + n)))],
               "strength.w": [text(sqrt(X2 / n))]}
        if (r, c) == (2, 2):
            (a, b), (cc, d) = t
            out["strength.phi"] = [text(mpf(a * d - b * cc) / sqrt(R[0] * R[1] * C[0] * C[1]))]
        return out
    if kind == "vinterval":
        x, alpha = mpf(X2), 1 - CONFIDENCE
        central = chi2_sf(x, df)

        def bound(tail):
            tail = mpf(tail)
            if central >= tail:
                return 0
            lam = solve_increasing(lambda l: noncentral_sf(x, df, l), mpf(tail), x)
            return min(1, sqrt(lam / (n * (min(len(t), len(t[0])) - 1))))
        return {"vinterval.lower": [text(bound(alpha / 2))], "vinterval.upper": [text(bound(1 - alpha / 2))]}
    raise ValueError(kind)


def ratios(t):
    if any(v == 0 for row in t for v in row):
        t = [[v + HALF for v in row] for row in t]
    (a, b), (c, d) = t
    z = z_of(CONFIDENCE)
    out = {}
    for name, estimate, variance in (("oddsratio", a * d / (b * c), 1 / a + 1 / b + 1 / c + 1 / d),
                                     ("riskratio", (a / (a + b)) / (c / (c + d)), 1 / a - 1 / (a + b) + 1 / c - 1 / (c + d))):
        half_width = z * sqrt(variance)
        out[f"{name}.estimate"] = [text(estimate)]
        out[f"{name}.lower"] = [text(mpf(estimate) * mp.exp(-half_width))]
        out[f"{name}.upper"] = [text(mpf(estimate) * mp.exp(half_width))]
    return out


def strata_references(kind, rows):
    strata = [(a, b, c, d) for a, b, c, d in rows]
    D = sum(a - (a + b) * (a + c) / (a + b + c + d) for a, b, c, d in strata)
    V = sum((a + b) * (c + d) * (a + c) * (b + d) / ((a + b + c + d) ** 2 * (a + b + c + d - 1))
            for a, b, c, d in strata)
    Rs = sum(a * d / (a + b + c + d) for a, b, c, d in strata)
    Ss = sum(b * c / (a + b + c + d) for a, b, c, d in strata)
    if kind == "strata":
        corrected = (abs(D) - min(HALF, abs(D))) ** 2 / V
        out = {"strata.statistic_corrected": [text(corrected)], "strata.p_corrected": [text(chi2_sf(corrected, 1))],
               "strata.statistic": [text(D * D / V)], "strata.p": [text(chi2_sf(D * D / V, 1))]}
        if Rs > 0 and Ss > 0:
            psi = Rs / Ss
            PR = sum((a + d) * a * d / (a + b + c + d) ** 2 for a, b, c, d in strata)
            PSQR = sum(((a + d) * b * c + (b + c) * a * d) / (a + b + c + d) ** 2 for a, b, c, d in strata)
            QS = sum((b + c) * b * c / (a + b + c + d) ** 2 for a, b, c, d in strata)
            half_width = z_of(CONFIDENCE) * sqrt(PR / (2 * Rs * Rs) + PSQR / (2 * Rs * Ss) + QS / (2 * Ss * Ss))
            out.update({"strata.odds_ratio": [text(psi)], "strata.lower": [text(mpf(psi) * mp.exp(-half_width))],
                        "strata.upper": [text(mpf(psi) * mp.exp(half_width))]})
        return out
    # Breslow–Day with Tarone's correction, at the Mantel–Haenszel common odds ratio.
    if Rs == 0 or Ss == 0:
        return {}
    with mp.workdps(80):
        psi = mpf(Rs / Ss)
        squares, sum_a, sum_fitted, sum_variance = mp.mpf(0), mp.mpf(0), mp.mpf(0), mp.mpf(0)
        for a, b, c, d in strata:
            r1, r2, c1 = mpf(a + b), mpf(c + d), mpf(a + c)
            low, high = max(mp.mpf(0), c1 - r2), min(r1, c1)
            qa, qb, qc = 1 - psi, r2 - c1 + psi * (r1 + c1), -psi * r1 * c1
            roots = [-qc / qb] if qa == 0 else [(-qb + s * mp.sqrt(qb * qb - 4 * qa * qc)) / (2 * qa) for s in (1, -1)]
            fitted = min(roots, key=lambda x: max(low - x, x - high, 0))
            if not low < fitted < high:
                return {}  # a fitted count on its bound: the variance is 0
            variance = 1 / (1 / fitted + 1 / (r1 - fitted) + 1 / (c1 - fitted) + 1 / (r2 - c1 + fitted))
            squares += (mpf(a) - fitted) ** 2 / variance
            sum_a, sum_fitted, sum_variance = sum_a + a, sum_fitted + fitted, sum_variance + variance
        statistic = squares - (sum_a - sum_fitted) ** 2 / sum_variance
    return {"homogeneity.statistic": [text(statistic)], "homogeneity.p": [text(chi2_sf(statistic, len(strata) - 1))]}


def binomial_lower_tail(k, n):
    """P(X ≤ k), X ~ Binomial(n, ½), for k ≤ n/2 (summed downwards from k)."""
    first = mp.exp(mp.loggamma(n + 1) - mp.loggamma(k + 1) - mp.loggamma(n - k + 1) - n * mp.log(2))
    return tail_sum(k, -1, first, lambda x: mp.mpf(x) / (n - x + 1), 0)


def paired_references(kind, t):
    if kind == "mcnemar":
        b, c = t[0][1], t[1][0]
        corrected = max(F(0), abs(b - c) - 1) ** 2 / (b + c)
        plain = (b - c) ** 2 / (b + c)
        exact_p = min(mp.mpf(1), 2 * binomial_lower_tail(int(min(b, c)), int(b + c)))
        return {"mcnemar.statistic_corrected": [text(corrected)], "mcnemar.p_corrected": [text(chi2_sf(corrected, 1))],
                "mcnemar.statistic": [text(plain)], "mcnemar.p": [text(chi2_sf(plain, 1))],
                "mcnemar.exact_p": [text(exact_p)]}
    k = len(t)
    pairs = [(t[i][j], t[j][i]) for i in range(k) for j in range(i + 1, k) if t[i][j] + t[j][i] > 0]
    statistic = sum((u - v) ** 2 / (u + v) for u, v in pairs)
    return {"bowker.statistic": [text(statistic)], "bowker.p": [text(chi2_sf(statistic, len(pairs)))],
            "bowker.df": [text(len(pairs))]}


def trend_references(rows):
    events, others, scores = rows
    totals = [x + y for x, y in zip(events, others)]
    n, e = sum(totals), sum(events)
    mean = sum(t * s for t, s in zip(totals, scores)) / n
    numerator = sum(x * (s - mean) for x, s in zip(events, scores))
    spread = sum(t * (s - mean) ** 2 for t, s in zip(totals, scores))
    share = e / n
    z = sqrt(numerator ** 2 / (share * (1 - share) * spread)) * (1 if numerator >= 0 else -1)
    return {"trend.z": [text(z)], "trend.p": [text(normal_two_sided(z))]}


def power_of(w, n, df, alpha):
    return noncentral_sf(critical_value(df, alpha), df, mpf(n) * mpf(w) ** 2)


def sample_size(w, target, df, alpha):
    c = critical_value(df, alpha)
    lam = solve_increasing(lambda l: noncentral_sf(c, df, l), mpf(target), mpf(df))
    n = int(mp.ceil(lam / mpf(w) ** 2))
    while n > 1 and noncentral_sf(c, df, (n - 1) * mpf(w) ** 2) >= mpf(target):
        n -= 1
    while noncentral_sf(c, df, n * mpf(w) ** 2) < mpf(target):
        n += 1
    return n


def reference(case):
    """{quantity: [40-digit texts]} for one case of the battery."""
    kind, m = case["kind"], block(case)
    if kind in ("pearson", "g", "yates", "expected", "residuals", "celltest", "strength", "vinterval"):
        return table_references(kind, m)
    if kind == "exact2x2":
        return fisher_2x2(m)
    if kind == "exactrxc":
        return fisher_rxc(kept(m))
    if kind == "ratios":
        return ratios(m)
    if kind == "fit":
        observed, shares = m
        n, total_shares = sum(observed), sum(shares)
        E = [s * n / total_shares for s in shares]
        X2 = sum((o - e) ** 2 / e for o, e in zip(observed, E))
        return {"fit.statistic": [text(X2)], "fit.p": [text(chi2_sf(X2, len(observed) - 1))]}
    if kind == "critical":
        df, alpha = m[0]
        return {"critical": [text(critical_value(df, alpha))]}
    if kind == "power":
        return {"power": [text(power_of(*m[0]))]}
    if kind == "samplesize":
        return {"samplesize": [text(sample_size(*m[0]))]}
    if kind in ("strata", "homogeneity"):
        return strata_references(kind, m)
    if kind in ("mcnemar", "bowker"):
        return paired_references(kind, m)
    if kind == "trend":
        return trend_references(m)
    raise ValueError(kind)
