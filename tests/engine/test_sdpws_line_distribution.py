"""Shares of a wall line by deflection (AWC SDPWS-2015 §4.3.3.4.1, Eq. 4.3-1), hand cases
(derived): where Eq. 4.3-1 is linear in V (Δa fixed, or the hold-downs stay lifting) the
common-displacement solution has a closed form, V_i = (Δ - c_i)/f_i with Δ from Σ V_i = V."""

from __future__ import annotations

import pytest

from latbook.engine.sdpws import line_distribution as ld

REL = 1e-9


def _seg(b_ft, Ga, A_in2=16.5, delta_in=0.12, M_res=0.0, elongation=None, rated=None, **kw):
    return ld.SegmentFlexibility(
        h_ft=9.0,
        b_ft=b_ft,
        E_psi=1.4e6,
        A_in2=A_in2,
        Ga_kips_per_in=Ga,
        arm_ft=b_ft - 0.3,
        M_resist_lbft=M_res,
        T_above_lb=0.0,
        lateral_factor=0.7,
        elongation_at_rated_in=elongation,
        rated_load_lb=rated,
        given_delta_in=delta_in,
        **kw,
    )


def _flex_in_per_lb(s):
    return 8 * s.h_ft**3 / (s.E_psi * s.A_in2 * s.b_ft**2) + s.h_ft / (
        1000 * s.Ga_kips_per_in * s.b_ft
    )


def test_fixed_slip_gives_the_closed_form_common_displacement():
    # Derived: δ_i = f_i V_i + c_i, c_i = h Δa / b; equal δ and Σ V = V.
    segs = [_seg(14.0, 13.0), _seg(16.0, 25.0, A_in2=41.25, delta_in=0.15), _seg(10.0, 13.0)]
    V = 6000.0
    f = [_flex_in_per_lb(s) for s in segs]
    c = [s.h_ft * s.given_delta_in / s.b_ft for s in segs]
    Delta = (V + sum(ci / fi for ci, fi in zip(c, f, strict=True))) / sum(1 / fi for fi in f)
    expected = [(Delta - ci) / fi for ci, fi in zip(c, f, strict=True)]
    start = [V * s.b_ft / 40.0 for s in segs]
    passes, shares = ld.distribute_by_deflection(V, start, segs, [True] * 3)
    assert shares == pytest.approx(expected, rel=REL)
    assert passes[0].Delta_in == pytest.approx(Delta, rel=REL)
    deflections = [ld.evaluate(v, s).delta_in for v, s in zip(shares, segs, strict=True)]
    assert deflections == pytest.approx([Delta] * 3, rel=REL)


def test_scaled_hold_down_slip_converges_to_equal_deflections():
    # Derived: hold-downs lifting in both segments at every pass, so δ is linear in V and
    # pass 2 gives equal deflections; Σ V = V (statics).
    segs = [
        _seg(8.0, 13.0, elongation=0.12, rated=4500.0, shrinkage_in=0.05),
        _seg(12.0, 20.0, A_in2=30.25, elongation=0.10, rated=7500.0),
    ]
    V = 5000.0
    start = [2000.0, 3000.0]
    _, shares = ld.distribute_by_deflection(V, start, segs, [True, True])
    assert sum(shares) == pytest.approx(V, rel=REL)
    d = [ld.evaluate(v, s).delta_in for v, s in zip(shares, segs, strict=True)]
    assert d[0] == pytest.approx(d[1], rel=1e-9)


def test_hold_down_force_at_deflection_level_is_design_tension_over_lateral_factor():
    # Derived: T = max(0, (F V h - M_r)/arm)/F with F = 0.7, V = 3000 lb, h = 9 ft, arm 7.7 ft.
    s = _seg(8.0, 13.0, M_res=5000.0)
    expected = (0.7 * 3000 * 9 - 5000) / 7.7 / 0.7
    assert ld.hold_down_force_at_deflection_lb(3000.0, s) == pytest.approx(expected, rel=REL)
    assert ld.hold_down_force_at_deflection_lb(100.0, s) == 0.0


def test_no_load_gives_no_shares_and_a_wall_past_its_limit_carries_nothing():
    segs = [_seg(8.0, 13.0, shrinkage_in=0.1), _seg(2.0, 13.0)]
    _, shares = ld.distribute_by_deflection(0.0, [0.0, 0.0], segs, [True, False])
    assert shares == [0.0, 0.0]
    _, shares = ld.distribute_by_deflection(4000.0, [4000.0, 0.0], segs, [True, False])
    assert shares == pytest.approx([4000.0, 0.0], rel=REL)


def test_a_segment_with_more_slack_than_the_common_displacement_takes_no_shear():
    # Derived: a 4 ft segment with Δa = 0.12 in has c = 9 x 0.12 / 4 = 0.27 in, more than the
    # common displacement; it would need negative shear, so it takes none and the others share V.
    segs = [_seg(14.0, 13.0), _seg(16.0, 25.0, A_in2=41.25, delta_in=0.15), _seg(4.0, 13.0)]
    _, shares = ld.distribute_by_deflection(6000.0, [2500.0, 2800.0, 700.0], segs, [True] * 3)
    assert shares[2] == 0.0
    assert sum(shares) == pytest.approx(6000.0, rel=REL)


def test_anchorage_slope_is_the_scaled_elongation_term_while_the_hold_down_lifts():
    # Derived: Δa = e T / P_rated with T = (F V h - M_r)/arm / F, so dΔa/dV = e/P_rated h/arm
    # = 0.12/4500 x 9/7.7 while F V h > M_r (0.7 x 3000 x 9 = 18900 > 5000), else 0; 0 where
    # Δa is given instead of scaled.
    s = _seg(8.0, 13.0, M_res=5000.0, elongation=0.12, rated=4500.0)
    expected = 0.12 / 4500.0 * 9.0 / 7.7
    assert ld.anchorage_slope_in_per_lb(3000.0, s) == pytest.approx(expected, rel=REL)
    assert ld.anchorage_slope_in_per_lb(500.0, s) == 0.0  # 0.7 x 500 x 9 = 3150 < 5000
    assert ld.anchorage_slope_in_per_lb(3000.0, _seg(8.0, 13.0, M_res=5000.0)) == 0.0
    slope = _flex_in_per_lb(s) + 9.0 / 8.0 * expected
    assert ld.evaluate(3000.0, s).inv_slope_lb_per_in == pytest.approx(1 / slope, rel=REL)
    assert ld.evaluate(3000.0, s).anchorage_slope_in_per_lb == pytest.approx(expected, rel=REL)
