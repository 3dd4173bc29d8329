"""Diaphragm deflection, AWC SDPWS-2015 §4.2.2 Eq. 4.2-1 and its cantilever form.

Sources beside each check:
- The bending and splice-slip terms of Eq. 4.2-1 are those of IBC 2018 Eq. 23-1 (§2305.2, as
  printed on up.codes): 5vL^3/(8EAW) and Σ(xΔc)/(2W); the shear term's 0.25 v L / (1000 Ga) is
  the SDPWS three-term form (from memory of SDPWS-2015 §4.2.2).
- 'derived': the terms recomputed here from beam theory in consistent inch-pound units (w from
  v, I = 2 A (W/2)^2 of two edge chords, the shear strain v(x)/Ga integrated numerically), a
  path that shares no code with the engine.
"""

import random

import pytest

from latbook.engine.asce7_16.drift import overhang_edge_drift_in
from latbook.engine.sdpws import diaphragm_deflection as dd

TOL = 1e-12


def _inch_units(v_plf, L_ft, W_ft):
    """(w lb/in, L in, W in) of a span whose support unit shear is v."""
    return v_plf / 12.0, L_ft * 12.0, W_ft * 12.0


def test_simple_span_bending_is_the_uniform_load_beam_formula():
    # derived: 5 w L^4 / (384 E I), w = 2 V / L with V = v W (lb), I = A W^2 / 2
    v, L, E, A, W = 300.0, 60.0, 1.6e6, 16.5, 40.0
    w_lb_per_in = 2.0 * v * W / (L * 12.0)
    I_in4 = A * (W * 12.0) ** 2 / 2.0
    expected = 5.0 * w_lb_per_in * (L * 12.0) ** 4 / (384.0 * E * I_in4)
    assert dd.bending_simple_in(v, L, E, A, W) == pytest.approx(expected, rel=TOL)


def test_cantilever_bending_is_the_uniform_load_cantilever_formula():
    # derived: w L^4 / (8 E I), w = V / L with V = v W at the line
    v, L, E, A, W = 250.0, 12.0, 1.4e6, 24.75, 30.0
    w_lb_per_in = v * W / (L * 12.0)
    I_in4 = A * (W * 12.0) ** 2 / 2.0
    expected = w_lb_per_in * (L * 12.0) ** 4 / (8.0 * E * I_in4)
    assert dd.bending_cantilever_in(v, L, E, A, W) == pytest.approx(expected, rel=TOL)


def _shear_strain_integral_in(v_plf, L_ft, Ga, n=20000):
    """Σ γ dx over a length on which the unit shear falls linearly from v to 0 (midpoint rule;
    Ga kips/in = 1000 lb/in of shear stiffness per unit width)."""
    dx = L_ft / n
    return sum(v_plf * (1.0 - (k + 0.5) / n) / (1000.0 * Ga) * dx for k in range(n))


def test_shear_terms_integrate_the_shear_strain():
    # derived: a simple span's mid-span shear deflection is the strain over a half span (shear
    # v -> 0 over L/2); a cantilever's tip, over its whole length
    v, L, Ga = 420.0, 48.0, 14.0
    assert dd.shear_simple_in(v, L, Ga) == pytest.approx(
        _shear_strain_integral_in(v, L / 2.0, Ga), rel=1e-9
    )
    assert dd.shear_cantilever_in(v, L, Ga) == pytest.approx(
        _shear_strain_integral_in(v, L, Ga), rel=1e-9
    )


def test_simple_span_hand_case():
    # derived by hand: v = 200 plf, L = 40 ft, W = 20 ft, E = 1.6e6 psi, A = 16.5 in^2,
    # Ga = 10 kips/in, one splice pair at mid-span with 0.03 in slip each:
    # bending 5(200)(64000)/(8(1.6e6)(16.5)(20)) = 64e6/4.224e9 = 0.0151515 in;
    # shear 0.25(200)(40)/10000 = 0.2 in; slip 2(20)(0.03)/(2(20)) = 0.03 in.
    assert dd.bending_simple_in(200, 40, 1.6e6, 16.5, 20) == pytest.approx(0.0151515, rel=1e-5)
    assert dd.shear_simple_in(200, 40, 10) == pytest.approx(0.2, rel=TOL)
    assert dd.slip_simple_in(2 * 20 * 0.03, 20) == pytest.approx(0.03, rel=TOL)
    total = dd.deflection_simple_in(200, 40, 1.6e6, 16.5, 20, 10, 2 * 20 * 0.03)
    assert total == pytest.approx(0.0151515 + 0.2 + 0.03, rel=1e-5)


def _splice_sum_simple_exact(L, s, slip):
    """Σ(x Δc) of splices at s, 2s, ... (< L) on both chords, x to the nearest support."""
    xs = [k * s for k in range(1, 1000) if k * s < L - 1e-12]
    return 2.0 * slip * sum(min(x, L - x) for x in xs)


def _splice_sum_cantilever_exact(L, s, slip, offset):
    """Σ(x Δc) of splices at offset + k s from the line, x to the free edge."""
    xs = [offset + k * s for k in range(0, 1000) if 0 < offset + k * s < L - 1e-12]
    return 2.0 * slip * sum(L - x for x in xs)


def test_splice_bounds_cover_every_splice_layout():
    # derived: the bound is never below the exact sum for splices at any offset and spacing
    rng = random.Random(5)
    for _ in range(300):
        L, s, slip = rng.uniform(4, 90), rng.uniform(6, 40), rng.uniform(0, 0.1)
        offset = rng.uniform(0, s)
        exact_simple = (
            2.0
            * slip
            * sum(min(x, L - x) for x in (offset + k * s for k in range(0, 100)) if 0 < x < L)
        )
        assert dd.splice_sum_simple_bound_ft_in(L, s, slip) >= exact_simple - 1e-12
        exact_cant = _splice_sum_cantilever_exact(L, s, slip, offset)
        assert dd.splice_sum_cantilever_bound_ft_in(L, s, slip) >= exact_cant - 1e-12


def test_splice_bound_hand_values():
    # derived: L = 40, s = 20: one splice per chord at mid-span, exact 2(20)(0.03) = 1.2;
    # the bound 0.03 (40²/(2 x 20) + 40) = 2.4 (never below a layout: the test above)
    assert _splice_sum_simple_exact(40, 20, 0.03) == pytest.approx(1.2, rel=TOL)
    assert dd.splice_sum_simple_bound_ft_in(40, 20, 0.03) == pytest.approx(2.4, rel=TOL)
    # an 8 ft overhang, s = 20: at most one splice, x < 8: 2(0.03)(8) = 0.48 < 0.03 (3.2 + 16)
    assert dd.splice_sum_cantilever_bound_ft_in(8, 20, 0.03) == pytest.approx(0.576, rel=TOL)


def test_inputs_must_be_positive():
    with pytest.raises(ValueError):
        dd.bending_simple_in(100, 20, 0, 16.5, 20)
    with pytest.raises(ValueError):
        dd.shear_cantilever_in(100, 20, 0)
    with pytest.raises(ValueError):
        dd.splice_sum_simple_bound_ft_in(20, 0, 0.03)


def test_overhang_edge_drift():
    # derived: line drift 0.60 in (already Cd/Ie), overhang 0.05 in, overhang below 0.02 in,
    # Cd/Ie = 4.0/1.25 = 3.2: 0.60 + 3.2 (0.03) = 0.696 in
    assert overhang_edge_drift_in(0.60, 0.05, 0.02, 4.0 / 1.25) == pytest.approx(0.696, rel=TOL)
    with pytest.raises(ValueError):
        overhang_edge_drift_in(0.6, 0.05, 0.0, 0.0)
