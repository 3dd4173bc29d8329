"""ASCE 7-16 ch. 27 Part 1 load cases beyond Case 1: roof uplift, the §27.1.5 minimum case and
the torsional cases of Fig. 27.3-8 (with the Appendix D exemption).

Values of Fig. 27.3-1 (roof, wind normal to ridge with θ < 10° and parallel to ridge) and Table
26.13-1 are typed from memory and were compared with a copy of the same figure in a later
edition (unchanged there); the tests name the source of each value.
"""

from __future__ import annotations

from latbook.engine.asce7_16._interpolate import interpolate_clamped

#: ASCE 7-16 Table 26.13-1: internal pressure coefficient magnitude by enclosure class (±).
GCPI_BY_ENCLOSURE: dict[str, float] = {
    "enclosed": 0.18,
    "partially_enclosed": 0.55,
    "partially_open": 0.18,
}

#: ASCE 7-16 Fig. 27.3-1, roof (θ < 10°, or wind parallel to the ridge): the more negative Cp of
#: each zone by horizontal distance from the windward edge, at h/L <= 0.5 and h/L >= 1.0. Zones:
#: 0 to h/2, h/2 to h, h to 2h, beyond 2h. Every zone also lists Cp = -0.18 (never governs uplift).
ROOF_CP_H_OVER_L: tuple[float, float] = (0.5, 1.0)
ROOF_CP_ZONES: tuple[tuple[float, float], ...] = (
    (-0.9, -1.3),  # 0 to h/2
    (-0.9, -0.7),  # h/2 to h
    (-0.5, -0.7),  # h to 2h
    (-0.3, -0.7),  # > 2h
)
ROOF_CP_OTHER = -0.18
#: Zone boundaries as multiples of the mean roof height h.
ROOF_ZONE_EDGES_H: tuple[float, float, float] = (0.5, 1.0, 2.0)

#: ASCE 7-16 Fig. 27.3-8: pressure fractions of Cases 2/3 and Case 4, eccentricity / B.
CASE_2_3_FRACTION = 0.75
CASE_4_FRACTION = 0.563
ECCENTRICITY_FRACTION = 0.15

#: §27.1.5 minimum design wind loads (psf) on walls and on the roof projected on a vertical plane.
MIN_WALL_PSF = 16.0
MIN_ROOF_PSF = 8.0

#: Appendix D, D1.1: height limit (ft) of the one-story exemption.
ONE_STORY_EXEMPT_HEIGHT_FT = 30.0


def roof_zone_cp(h_over_L: float, zone: int) -> float:
    """The more negative roof Cp of zone 0..3 (0 to h/2, h/2 to h, h to 2h, > 2h), linear in h/L
    between 0.5 and 1.0 and held beyond, ASCE 7-16 Fig. 27.3-1 (Note: interpolation between
    values of the same sign) [-]."""
    if h_over_L <= 0:
        raise ValueError("h/L must be > 0")
    lo, hi = ROOF_CP_ZONES[zone]
    return interpolate_clamped(h_over_L, ROOF_CP_H_OVER_L, (lo, hi))


def roof_zone_index(distance_ft: float, h_ft: float) -> int:
    """Zone of a point at `distance_ft` from the windward edge: 0 to h/2 -> 0, to h -> 1, to 2h
    -> 2, beyond -> 3 (a boundary belongs to the zone nearer the edge), Fig. 27.3-1."""
    for i, edge in enumerate(ROOF_ZONE_EDGES_H):
        if distance_ft <= edge * h_ft:
            return i
    return len(ROOF_ZONE_EDGES_H)


def roof_cp_near_edge(h_over_L: float, distance_ft: float, h_ft: float) -> float:
    """Roof Cp at the point of a wall's roof strip nearest a windward edge (the most negative
    value over the strip, as |Cp| falls with distance), Fig. 27.3-1 [-]."""
    return roof_zone_cp(h_over_L, roof_zone_index(max(distance_ft, 0.0), h_ft))


def roof_net_uplift_psf(qh_psf: float, G: float, Cp_roof: float, GCpi: float) -> float:
    """Net upward roof pressure qh (GCpi - G Cp) for Cp < 0 and internal pressure acting up,
    ASCE 7-16 Eq. 27.3-1 with the signs that maximise uplift (psf, positive upward)."""
    return qh_psf * (GCpi - G * Cp_roof)


def minimum_case_force_kip(
    wall_height_ft: float, width_ft: float, roof_projection_ft: float = 0.0
) -> float:
    """§27.1.5 minimum case force on a band: 16 psf x wall area + 8 psf x roof area projected
    on a vertical plane, ASCE 7-16 §27.1.5 (kip; heights and width in ft)."""
    return (MIN_WALL_PSF * wall_height_ft + MIN_ROOF_PSF * roof_projection_ft) * width_ft / 1000.0


def torsional_cases_exempt(n_stories: int, h_ft: float, flexible_diaphragms: bool) -> bool:
    """ASCE 7-16 Appendix D, D1.1: one-story buildings with h <= 30 ft, and buildings of two
    stories or less with flexible diaphragms, need only Load Cases 1 and 3 of Fig. 27.3-8.
    (Two stories or less of light-frame construction are exempt as well; with every diaphragm
    flexible that condition adds nothing here.)"""
    one_story = n_stories == 1 and h_ft <= ONE_STORY_EXEMPT_HEIGHT_FT
    return one_story or (n_stories <= 2 and flexible_diaphragms)


def eccentric_line_load_plf(
    F_kip: float, fraction: float, width_ft: float, sign: int
) -> tuple[float, float]:
    """Linear line load (w at the start, w at the end) across the building width B that carries
    `fraction` x F with the torsional moment fraction x F x 0.15 B of Fig. 27.3-8 (ASCE 7-16):
    w(s) = w_avg (1 + 0.9 sign (2 s / B - 1)), since a linear load of that shape has the moment
    0.9 w_avg B² / 6 = 0.15 B x w_avg B about the centre (plf)."""
    if sign not in (1, -1):
        raise ValueError("sign must be +1 or -1")
    w_avg = 1000.0 * fraction * F_kip / width_ft
    k = 6.0 * ECCENTRICITY_FRACTION
    return w_avg * (1.0 - k * sign), w_avg * (1.0 + k * sign)
