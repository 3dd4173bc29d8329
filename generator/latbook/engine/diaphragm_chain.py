"""Flexible diaphragm under a linearly varying load, overhangs continuous over their line.

Model (statics; ASCE 7-16 §12.3.1.1 flexible distribution, AWC SDPWS-2015 §4.2.5.2 cantilevered
diaphragms): the diaphragm spans along s from the plan edge `lo` to the edge `hi` and bears on
the wall lines at sorted positions. Between two consecutive lines it is a simple span; an
overhang past the outermost line is a cantilever whose support moment is carried, as a hogging
end moment, into the adjacent simple span (the sheathing and chords are continuous over that
line). Interior lines are hinges (tributary distribution).

The load is w(s) = w_lo + (w_hi - w_lo) (s - lo) / (hi - lo) in plf: uniform when w_lo = w_hi,
linear for the torsional wind cases of ASCE 7-16 Fig. 27.3-8. Within a span, x runs from the
span's start, p is the load at its start and r the slope (plf per ft). End moments Ma, Mb are
hogging magnitudes (lb-ft). Positions in ft, forces in lb.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from latbook.engine.diaphragm_tributary import Span, spans


def simple_span_reactions_lb(
    p_plf: float, r_plf_per_ft: float, L_ft: float, Ma_lbft: float = 0.0, Mb_lbft: float = 0.0
) -> tuple[float, float]:
    """End reactions (R_a, R_b) of a simple span under w(x) = p + r x with hogging end moments
    Ma, Mb: R_a = pL/2 + rL²/6 + (Ma - Mb)/L, R_b = pL/2 + rL²/3 - (Ma - Mb)/L (statics) [lb]."""
    if L_ft <= 0:
        raise ValueError("span length must be positive")
    carry = (Ma_lbft - Mb_lbft) / L_ft
    R_a = p_plf * L_ft / 2.0 + r_plf_per_ft * L_ft**2 / 6.0 + carry
    R_b = p_plf * L_ft / 2.0 + r_plf_per_ft * L_ft**2 / 3.0 - carry
    return R_a, R_b


def zero_shear_position_ft(
    p_plf: float, r_plf_per_ft: float, L_ft: float, R_a_lb: float, R_b_lb: float
) -> float:
    """x* where V(x) = R_a - p x - r x²/2 = 0, clipped to the span: 0 when R_a <= 0, L when
    R_b <= 0, else x* = 2 R_a / (p + sqrt(p² + 2 r R_a)) (the root that lies in the span) [ft]."""
    if R_a_lb <= 0.0:
        return 0.0
    if R_b_lb <= 0.0:
        return L_ft
    return 2.0 * R_a_lb / (p_plf + math.sqrt(p_plf**2 + 2.0 * r_plf_per_ft * R_a_lb))


def span_moment_at_lbft(
    p_plf: float, r_plf_per_ft: float, R_a_lb: float, Ma_lbft: float, x_ft: float
) -> float:
    """M(x) = R_a x - p x²/2 - r x³/6 - Ma in a simple span, sagging positive (statics) [lb-ft]."""
    return R_a_lb * x_ft - p_plf * x_ft**2 / 2.0 - r_plf_per_ft * x_ft**3 / 6.0 - Ma_lbft


def cantilever_total_lb(p_plf: float, r_plf_per_ft: float, a_ft: float) -> float:
    """Load on an overhang of length a, w(x) = p + r x from its start: p a + r a²/2 [lb]."""
    return p_plf * a_ft + r_plf_per_ft * a_ft**2 / 2.0


def cantilever_moment_lbft(p_plf: float, r_plf_per_ft: float, a_ft: float, support: str) -> float:
    """Support moment of an overhang of length a under w(x) = p + r x (x from the overhang's
    start): support at x = a ("end", an overhang at the plan's start edge): p a²/2 + r a³/6;
    support at x = 0 ("start", an overhang at the plan's end edge): p a²/2 + r a³/3 [lb-ft]."""
    if support == "end":
        return p_plf * a_ft**2 / 2.0 + r_plf_per_ft * a_ft**3 / 6.0
    if support == "start":
        return p_plf * a_ft**2 / 2.0 + r_plf_per_ft * a_ft**3 / 3.0
    raise ValueError("support must be 'start' or 'end'")


@dataclass(frozen=True)
class SpanResult:
    """One span under one load: its geometry and load, end moments and reactions, peak moment.

    For a cantilever, R_a / R_b is the whole overhang load at its supported end and 0 at the
    free edge, Ma / Mb the support moment at the supported end, x_star the support's position
    in the span and M_max that moment.
    """

    span: Span
    p_plf: float
    r_plf_per_ft: float
    Ma_lbft: float
    Mb_lbft: float
    R_a_lb: float
    R_b_lb: float
    x_star_ft: float
    M_sag_lbft: float
    M_max_lbft: float

    @property
    def V_max_lb(self) -> float:
        """Largest end shear of the span [lb]."""
        return max(abs(self.R_a_lb), abs(self.R_b_lb))


def chain_results(
    line_positions_ft: list[float],
    lo_ft: float,
    hi_ft: float,
    w_lo_plf: float,
    w_hi_plf: float,
) -> tuple[list[SpanResult], list[float]]:
    """Every span's result and every line's reaction for the load w(s) (module doc) [lb].

    Reactions are in the order of `line_positions_ft` (sorted, distinct).
    """
    chain = spans(line_positions_ft, lo_ft, hi_ft)
    slope = (w_hi_plf - w_lo_plf) / (hi_ft - lo_ft)

    def w_at(s_ft: float) -> float:
        return w_lo_plf + slope * (s_ft - lo_ft)

    moments: dict[int, float] = {}  # line index -> overhang support moment carried over it
    results: list[SpanResult | None] = [None] * len(chain)
    for i, sp in enumerate(chain):
        if sp.kind != "cantilever":
            continue
        a = sp.length_ft
        p = w_at(sp.start_ft)
        total = cantilever_total_lb(p, slope, a)
        if sp.free_edge == "start":
            M = cantilever_moment_lbft(p, slope, a, "end")
            R_a, R_b, Ma, Mb, x_support = 0.0, total, 0.0, M, a
        else:
            M = cantilever_moment_lbft(p, slope, a, "start")
            R_a, R_b, Ma, Mb, x_support = total, 0.0, M, 0.0, 0.0
        (line,) = sp.line_indices
        moments[line] = M
        results[i] = SpanResult(sp, p, slope, Ma, Mb, R_a, R_b, x_support, -M, M)
    for i, sp in enumerate(chain):
        if sp.kind != "simple":
            continue
        left, right = sp.line_indices
        L = sp.length_ft
        p = w_at(sp.start_ft)
        Ma, Mb = moments.get(left, 0.0), moments.get(right, 0.0)
        R_a, R_b = simple_span_reactions_lb(p, slope, L, Ma, Mb)
        x_star = zero_shear_position_ft(p, slope, L, R_a, R_b)
        M_sag = span_moment_at_lbft(p, slope, R_a, Ma, x_star)
        results[i] = SpanResult(sp, p, slope, Ma, Mb, R_a, R_b, x_star, M_sag, max(M_sag, Ma, Mb))
    reactions = [0.0] * len(line_positions_ft)
    for res in results:
        assert res is not None
        if res.span.kind == "simple":
            left, right = res.span.line_indices
            reactions[left] += res.R_a_lb
            reactions[right] += res.R_b_lb
        else:
            (line,) = res.span.line_indices
            reactions[line] += res.R_a_lb + res.R_b_lb
    return [r for r in results if r is not None], reactions
