"""Shear of a wall line shared by its segments so that their tops displace alike
(AWC SDPWS-2015 §4.3.3.4.1: the same deflection δsw by Eq. 4.3-1 in every segment).

Δa of Eq. 4.3-1 depends on the hold-down force, which depends on the segment's shear, so the
shares are found in a fixed number of passes, starting from the capacity shares (L v_n). Each
pass evaluates every segment's deflection δ(V) at its current shear (Δa at the hold-down force
that shear induces) and the line δ = a V + b through it (a: the slope, with dΔa/dV =
(elongation / rated load) h / (L - offset) while the hold-down lifts, else 0; b = δ - a V),
then solves the lines for one common displacement: Δ = (V + Σ b/a) / Σ 1/a,
V_i' = max(0, (Δ - b_i)/a_i), scaled so that Σ V_i = V. Where δ is linear in V over the step
(no hold-down changes between lifting and not) one pass is exact. The workbook shows each pass
as columns; both paths stop after PASSES.
"""

from __future__ import annotations

from dataclasses import dataclass

from latbook.engine.sdpws import anchorage
from latbook.engine.sdpws import shear_wall as sw

PASSES = 2
"""Passes after the start (V0 capacity shares -> V1 -> V2 = the shares used)."""


@dataclass(frozen=True)
class SegmentFlexibility:
    """What Eq. 4.3-1 and the hold-down force need of one segment (one load source)."""

    h_ft: float
    b_ft: float
    E_psi: float
    A_in2: float
    Ga_kips_per_in: float
    arm_ft: float
    """L - hold-down offset."""
    M_resist_lbft: float
    """Factored dead-load resisting moment of the design combination (net of roof uplift)."""
    T_above_lb: float
    """Design-level hold-down force delivered from the stacked segment above."""
    lateral_factor: float
    """Lateral load factor of the design combination (ASD 0.7ρ / 0.6, LRFD ρ / 1.0)."""
    elongation_at_rated_in: float | None
    rated_load_lb: float | None
    given_delta_in: float
    """Δa taken as given where no rated elongation is given."""
    shrinkage_in: float = 0.0
    crushing_in: float = 0.0


def hold_down_force_at_deflection_lb(V_lb: float, seg: SegmentFlexibility) -> float:
    """Hold-down force at the deflection level (strength level, E = QE or W): the design-level
    tension max(0, (F V h - M_r)/(L - offset)) + T from above, divided by the combination's
    lateral factor F (so ASD 0.6D + 0.7E reads as 0.86D + 1.0E) [lb]."""
    F = seg.lateral_factor
    uplift = (F * V_lb * seg.h_ft - seg.M_resist_lbft) / seg.arm_ft
    return (max(0.0, uplift) + seg.T_above_lb) / F


def anchorage_delta_in(T_defl_lb: float, seg: SegmentFlexibility) -> float:
    """Δa: the rated elongation scaled to the force (or the given Δa) plus shrinkage and
    crushing, SDPWS-2015 Eq. 4.3-1 [in]."""
    if seg.elongation_at_rated_in is not None and seg.rated_load_lb is not None:
        hd = anchorage.hold_down_elongation_in(
            seg.elongation_at_rated_in, seg.rated_load_lb, T_defl_lb
        )
    else:
        hd = seg.given_delta_in
    return anchorage.anchorage_elongation_in(hd, seg.shrinkage_in, seg.crushing_in)


@dataclass(frozen=True)
class PassState:
    V_lb: float
    T_defl_lb: float
    delta_a_in: float
    delta_in: float
    inv_slope_lb_per_in: float
    """1/a of the line δ = a V + b (0 for a segment that is not a shear wall)."""
    b_over_a_lb: float
    """b/a = δ/a - V."""
    anchorage_slope_in_per_lb: float = 0.0
    """dΔa/dV at V (shown for every segment; 1/a ignores it where the segment carries none)."""


def lifts(V_lb: float, seg: SegmentFlexibility) -> bool:
    """True where the design-level net uplift at shear V is positive [-]."""
    return seg.lateral_factor * V_lb * seg.h_ft - seg.M_resist_lbft > 0


def anchorage_slope_in_per_lb(V_lb: float, seg: SegmentFlexibility) -> float:
    """dΔa/dV at V (SDPWS-2015 Eq. 4.3-1, Δa scaled to the hold-down force): (rated
    elongation / rated load) h / (L - offset) while the hold-down lifts, else 0; 0 where Δa is
    given rather than scaled [in/lb]."""
    scaled = seg.elongation_at_rated_in is not None and seg.rated_load_lb is not None
    if scaled and lifts(V_lb, seg):
        return seg.elongation_at_rated_in / seg.rated_load_lb * seg.h_ft / seg.arm_ft  # type: ignore[operator]
    return 0.0


def slope_in_per_lb(V_lb: float, seg: SegmentFlexibility) -> float:
    """dδ/dV of Eq. 4.3-1 at V: 8h^3/(E A b^2) + h/(1000 Ga b) + (h/b) dΔa/dV [in/lb]."""
    bend = 8.0 * seg.h_ft**3 / (seg.E_psi * seg.A_in2 * seg.b_ft**2)
    shear = seg.h_ft / (1000.0 * seg.Ga_kips_per_in * seg.b_ft)
    return bend + shear + seg.h_ft / seg.b_ft * anchorage_slope_in_per_lb(V_lb, seg)


def evaluate(V_lb: float, seg: SegmentFlexibility, carries: bool = True) -> PassState:
    """Eq. 4.3-1 at shear V with Δa at the force it induces, and the line through it;
    `carries` False (past the aspect-ratio limit): 1/a = b/a = 0."""
    T = hold_down_force_at_deflection_lb(V_lb, seg)
    da = anchorage_delta_in(T, seg)
    v = sw.segment_unit_shear_plf(V_lb, seg.b_ft)
    delta = sw.shear_wall_deflection_in(
        v, seg.h_ft, seg.E_psi, seg.A_in2, seg.b_ft, seg.Ga_kips_per_in, da
    )
    d_da = anchorage_slope_in_per_lb(V_lb, seg)
    if not carries:
        return PassState(V_lb, T, da, delta, 0.0, 0.0, d_da)
    ia = 1.0 / slope_in_per_lb(V_lb, seg)
    return PassState(V_lb, T, da, delta, ia, delta * ia - V_lb, d_da)


def common_displacement_in(V_line_lb: float, states: list[PassState]) -> float:
    """Δ = (V + Σ b/a) / Σ 1/a: the displacement at which the lines carry V [in]."""
    total = sum(s.inv_slope_lb_per_in for s in states)
    if total <= 0:
        raise ValueError("a line needs a segment that carries shear")
    return (V_line_lb + sum(s.b_over_a_lb for s in states)) / total


def next_shares(
    V_line_lb: float, states: list[PassState]
) -> tuple[float, list[float], list[float]]:
    """(Δ, V_i' = max(0, Δ/a_i - b_i/a_i), V_i = V V_i'/Σ V_i' (0 where Σ V_i' = 0))."""
    Delta = common_displacement_in(V_line_lb, states)
    raw = [max(0.0, Delta * s.inv_slope_lb_per_in - s.b_over_a_lb) for s in states]
    total = sum(raw)
    return Delta, raw, [V_line_lb * r / total if total > 0 else 0.0 for r in raw]


@dataclass(frozen=True)
class Pass:
    states: list[PassState]
    Delta_in: float
    raw_lb: list[float]


def distribute_by_deflection(
    V_line_lb: float,
    start_lb: list[float],
    segments: list[SegmentFlexibility],
    carries: list[bool],
) -> tuple[list[Pass], list[float]]:
    """Every pass and the shares it ends with (the shares used after PASSES) [lb]."""
    V = list(start_lb)
    passes = []
    for _ in range(PASSES):
        states = [evaluate(v, s, c) for v, s, c in zip(V, segments, carries, strict=True)]
        Delta, raw, V = next_shares(V_line_lb, states)
        passes.append(Pass(states, Delta, raw))
    return passes, V
