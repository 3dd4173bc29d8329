"""Collector (drag strut) force diagram along one wall line.

Model (statics of the strut, ASCE 7-16 §12.10.2 collectors; SDPWS-2015 §4.1.4 load path):
the line runs along s from 0 to b_ft (the diaphragm depth at that line). The diaphragm delivers
its reaction R uniformly, v_d = R/b (plf); each shear wall segment i takes the share of R that
the walls sheets give it, R L_i k_i / sum(L k) (SDPWS-2015 §4.3.3.4.1; k = 1 for every segment
when no factors are given), spread uniformly over its length. The strut's axial force at s is

    F(s) = v_d * s - R * (sum of L k within [0, s]) / sum(L k)

so F(0) = F(b) = 0, F is linear between breakpoints and its peak lies at a breakpoint.

Sign convention: measure s in the direction the load acts. Then F > 0 is compression (the
strut pushes the diaphragm force ahead into the wall) and F < 0 is tension. For the load in
the opposite direction (toward s = 0) the same numbers hold with the senses swapped: F > 0 is
tension. Wind and seismic reverse, so design each strut for |F| in both tension and compression.
"""

Segment = tuple[float, float]
"""A shear wall segment on the line as (start_ft, length_ft)."""

_POSITION_TOLERANCE_FT = 1e-9
ZERO_FORCE_REL = 1e-9
"""|F| at most this fraction of |R| is taken as exactly 0: F is a difference of two terms
of size R, so a zero (F(b), or a point where the walls have taken all of R) comes out as
rounding noise of either sign. The workbook's formula applies the same rule."""


def _validate(b_ft: float, segments: list[Segment]) -> list[Segment]:
    if b_ft <= 0:
        raise ValueError("line length b_ft must be positive")
    if not segments:
        raise ValueError("a wall line needs at least one shear wall segment")
    ordered = sorted(segments)
    for start_ft, length_ft in ordered:
        if length_ft <= 0:
            raise ValueError("segment lengths must be positive")
        if (
            start_ft < -_POSITION_TOLERANCE_FT
            or start_ft + length_ft > b_ft + _POSITION_TOLERANCE_FT
        ):
            raise ValueError("segments must lie within [0, b_ft]")
    for (s1, l1), (s2, _) in zip(ordered, ordered[1:], strict=False):
        if s2 < s1 + l1 - _POSITION_TOLERANCE_FT:
            raise ValueError("segments on a line must not overlap")
    return ordered


def _weighted_length_within_ft(segments: list[Segment], factors: list[float], s_ft: float) -> float:
    """sum of k_i x (length of segment i within [0, s])."""
    return sum(
        k * min(max(s_ft - start_ft, 0.0), length_ft)
        for (start_ft, length_ft), k in zip(segments, factors, strict=True)
    )


def _ordered_with_factors(
    b_ft: float, segments: list[Segment], factors: list[float] | None
) -> tuple[list[Segment], list[float]]:
    ks = [1.0] * len(segments) if factors is None else list(factors)
    if len(ks) != len(segments):
        raise ValueError("one factor k per segment is required")
    _validate(b_ft, segments)
    pairs = sorted(zip(segments, ks, strict=True))
    if sum(L * k for (_, L), k in pairs) <= 0:
        raise ValueError("no segment on the line takes shear (sum of L k is 0)")
    return [p[0] for p in pairs], [p[1] for p in pairs]


def collector_breakpoints(b_ft: float, segments: list[Segment]) -> list[float]:
    """Sorted unique positions 0, every segment start and end, and b, where the collector
    force diagram changes slope (statics) [ft]."""
    ordered = _validate(b_ft, segments)
    raw = [0.0, b_ft]
    for start_ft, length_ft in ordered:
        raw.extend([start_ft, start_ft + length_ft])
    unique: list[float] = []
    for s_ft in sorted(raw):
        if not unique or s_ft - unique[-1] > _POSITION_TOLERANCE_FT:
            unique.append(s_ft)
    return unique


def collector_force_at_lb(
    b_ft: float,
    R_lb: float,
    segments: list[Segment],
    s_ft: float,
    factors: list[float] | None = None,
) -> float:
    """Collector force F(s) = R s / b - R (sum of L k in [0, s]) / sum(L k), sign as in the
    module doc, 0 where |F| <= ZERO_FORCE_REL |R| (rounding noise), ASCE 7-16 §12.10.2 with the
    wall shares of SDPWS-2015 §4.3.3.4.1 [lb]."""
    ordered, ks = _ordered_with_factors(b_ft, segments, factors)
    if s_ft < -_POSITION_TOLERANCE_FT or s_ft > b_ft + _POSITION_TOLERANCE_FT:
        raise ValueError("s_ft must lie within [0, b_ft]")
    total_Lk_ft = sum(L * k for (_, L), k in zip(ordered, ks, strict=True))
    force_lb = (
        R_lb / b_ft * s_ft - R_lb * _weighted_length_within_ft(ordered, ks, s_ft) / total_Lk_ft
    )
    return force_lb if abs(force_lb) > ZERO_FORCE_REL * abs(R_lb) else 0.0


def collector_forces(
    b_ft: float, R_lb: float, segments: list[Segment], factors: list[float] | None = None
) -> list[tuple[float, float]]:
    """Collector force diagram as (s_ft, F_lb) at every breakpoint; F(0) = F(b) = 0,
    ASCE 7-16 §12.10.2 [ft, lb]."""
    return [
        (s_ft, collector_force_at_lb(b_ft, R_lb, segments, s_ft, factors))
        for s_ft in collector_breakpoints(b_ft, segments)
    ]


def collector_peak(
    b_ft: float, R_lb: float, segments: list[Segment], factors: list[float] | None = None
) -> tuple[float, float]:
    """Largest collector force magnitude on the line and where it occurs (first if tied),
    ASCE 7-16 §12.10.2 [lb, ft]."""
    peak_lb, peak_s_ft = 0.0, 0.0
    for s_ft, force_lb in collector_forces(b_ft, R_lb, segments, factors):
        if abs(force_lb) > peak_lb + 1e-9 * max(1.0, abs(peak_lb)):
            peak_lb, peak_s_ft = abs(force_lb), s_ft
    return peak_lb, peak_s_ft


def collector_overstrength(F_lb: float, Omega0: float) -> float:
    """Collector force with overstrength, Omega0 x F, for SDC C-F, ASCE 7-16 §12.10.2.1
    (load combinations of §12.4.3) [lb].

    From memory: §12.10.2.1 has an exception for structures braced entirely by light-frame
    shear walls (design collectors for the §12.10.1.1 diaphragm forces without Omega0);
    whether to apply Omega0 is the caller's decision.
    """
    if Omega0 < 1.0:
        raise ValueError("Omega0 is at least 1.0 (ASCE 7-16 Table 12.2-1)")
    return Omega0 * F_lb
