"""Deflection of a blocked wood structural panel diaphragm, AWC SDPWS-2015 §4.2.2.

Simple span, Eq. 4.2-1 (three terms, as printed in SDPWS-2015 §4.2.2; the IBC 2018 Eq. 23-1
is the four-term form of the same model, its bending and chord-slip terms identical):

    delta_dia = 5 v L^3 / (8 E A W) + 0.25 v L / (1000 Ga) + sum(x delta_c) / (2 W)

v induced unit shear at the support [plf], L diaphragm length perpendicular to the load [ft],
W diaphragm width parallel to the load [ft], E chord modulus [psi], A chord area [in^2],
Ga apparent diaphragm shear stiffness [kips/in] (SDPWS-2015 Tables 4.2A-C), x distance from a
chord splice to the nearest support [ft], delta_c the splice slip at the induced shear [in].

Cantilever (overhang of length L past its line, uniform load, fixed against rotation at the
line): the same three terms for a cantilever beam whose chords take the bending
(I = A W^2 / 2), whose web takes the shear (strain v(x) / Ga) and whose splice slips turn it
by 2 delta_c / W per splice pair (derived; the same form as the cantilevered-diaphragm
equation of the SDPWS-2015 commentary, from memory):

    delta_c = 3 v L^3 / (E A W) + 0.5 v L / (1000 Ga) + sum(x delta_c) / W

with x the distance from a splice to the free edge [ft].
"""

from __future__ import annotations


def _positive(name: str, value: float) -> None:
    if value <= 0:
        raise ValueError(f"{name} must be positive")


def bending_simple_in(v_plf: float, L_ft: float, E_psi: float, A_in2: float, W_ft: float) -> float:
    """Chord bending term of SDPWS-2015 Eq. 4.2-1, 5 v L^3 / (8 E A W) [in] (simple span,
    uniform load; chords at the two edges carry the moment)."""
    for name, value in (("E", E_psi), ("A", A_in2), ("W", W_ft)):
        _positive(name, value)
    return 5.0 * v_plf * L_ft**3 / (8.0 * E_psi * A_in2 * W_ft)


def shear_simple_in(v_plf: float, L_ft: float, Ga_kips_per_in: float) -> float:
    """Panel shear and nail slip term of SDPWS-2015 Eq. 4.2-1, 0.25 v L / (1000 Ga) [in]."""
    _positive("Ga", Ga_kips_per_in)
    return 0.25 * v_plf * L_ft / (1000.0 * Ga_kips_per_in)


def slip_simple_in(sum_x_delta_c_ft_in: float, W_ft: float) -> float:
    """Chord splice slip term of SDPWS-2015 Eq. 4.2-1, sum(x delta_c) / (2 W) [in]; the sum
    over every splice of both chords, x to the nearest support [ft x in]."""
    _positive("W", W_ft)
    return sum_x_delta_c_ft_in / (2.0 * W_ft)


def deflection_simple_in(
    v_plf: float,
    L_ft: float,
    E_psi: float,
    A_in2: float,
    W_ft: float,
    Ga_kips_per_in: float,
    sum_x_delta_c_ft_in: float,
) -> float:
    """Mid-span deflection of a simple-span blocked WSP diaphragm, SDPWS-2015 Eq. 4.2-1 [in]."""
    return (
        bending_simple_in(v_plf, L_ft, E_psi, A_in2, W_ft)
        + shear_simple_in(v_plf, L_ft, Ga_kips_per_in)
        + slip_simple_in(sum_x_delta_c_ft_in, W_ft)
    )


def bending_cantilever_in(
    v_plf: float, L_ft: float, E_psi: float, A_in2: float, W_ft: float
) -> float:
    """Chord bending term of a cantilevered diaphragm under uniform load, 3 v L^3 / (E A W)
    [in]: w L^4 / (8 E I) with w = v W / L and I = A W^2 / 2, in ft, in, lb (derived)."""
    for name, value in (("E", E_psi), ("A", A_in2), ("W", W_ft)):
        _positive(name, value)
    return 3.0 * v_plf * L_ft**3 / (E_psi * A_in2 * W_ft)


def shear_cantilever_in(v_plf: float, L_ft: float, Ga_kips_per_in: float) -> float:
    """Shear term of a cantilevered diaphragm, 0.5 v L / (1000 Ga) [in]: the shear strain
    v(x) / Ga, falling linearly from v at the line to 0 at the free edge, summed over L
    (derived, the integration behind the 0.25 of Eq. 4.2-1)."""
    _positive("Ga", Ga_kips_per_in)
    return 0.5 * v_plf * L_ft / (1000.0 * Ga_kips_per_in)


def slip_cantilever_in(sum_x_delta_c_ft_in: float, W_ft: float) -> float:
    """Chord splice slip term of a cantilevered diaphragm, sum(x delta_c) / W [in]; x from the
    splice to the free edge (a splice pair turns the overhang by 2 delta_c / W; derived)."""
    _positive("W", W_ft)
    return sum_x_delta_c_ft_in / W_ft


def deflection_cantilever_in(
    v_plf: float,
    L_ft: float,
    E_psi: float,
    A_in2: float,
    W_ft: float,
    Ga_kips_per_in: float,
    sum_x_delta_c_ft_in: float,
) -> float:
    """Free-edge deflection of a cantilevered blocked WSP diaphragm (three terms above) [in]."""
    return (
        bending_cantilever_in(v_plf, L_ft, E_psi, A_in2, W_ft)
        + shear_cantilever_in(v_plf, L_ft, Ga_kips_per_in)
        + slip_cantilever_in(sum_x_delta_c_ft_in, W_ft)
    )


def splice_sum_simple_bound_ft_in(L_ft: float, spacing_ft: float, slip_in: float) -> float:
    """Upper bound of sum(x delta_c) over a simple span whose two chords are spliced at most
    `spacing_ft` apart, at points not known: x = min(d, L - d) is unimodal, so over splices s
    apart s sum(x) <= its integral L^2/4 + s L/2, and sum(x delta_c) <= delta_c (L^2 / (2 s) + L)
    for both chords [ft x in] (derived)."""
    _positive("splice spacing", spacing_ft)
    return slip_in * (L_ft**2 / (2.0 * spacing_ft) + L_ft)


def splice_sum_cantilever_bound_ft_in(L_ft: float, spacing_ft: float, slip_in: float) -> float:
    """Upper bound of sum(x delta_c) over an overhang of length L, x from a splice to the free
    edge: s sum(x) <= L^2/2 + s L per chord, so delta_c (L^2 / s + 2 L) for both chords
    [ft x in] (derived)."""
    _positive("splice spacing", spacing_ft)
    return slip_in * (L_ft**2 / spacing_ft + 2.0 * L_ft)
