"""Flexible diaphragm with overhangs continuous over their line, under uniform and linear loads.

Every expected value here is derived by hand from statics (stated beside each check): reactions
sum to the applied load, moments about a support close, and the simple-span results reduce to
wL/2 and wL²/8 when there is no overhang.
"""

from __future__ import annotations

import pytest

from latbook.engine import diaphragm_chain as dc

TOL = 1e-12


def test_uniform_simple_spans_reduce_to_tributary():
    # derived: two equal spans of 20 ft, w = 100 plf: ends 1000 lb, middle 2000 lb, M = wL²/8
    spans, R = dc.chain_results([0.0, 20.0, 40.0], 0.0, 40.0, 100.0, 100.0)
    assert pytest.approx([1000.0, 2000.0, 1000.0], rel=TOL) == R
    assert [s.M_max_lbft for s in spans] == pytest.approx([5000.0, 5000.0], rel=TOL)
    assert [s.x_star_ft for s in spans] == pytest.approx([10.0, 10.0], rel=TOL)


def test_overhang_moment_carried_into_the_adjacent_span():
    # derived: lines at 0 and 20 ft, overhang 0..-5 -> extent -5..20, w = 100 plf.
    # Overhang load 500 lb, support moment w a²/2 = 1250 lb-ft carried into the span:
    # R(line 0) = 500 + 1000 + 1250/20 = 1562.5; R(line 1) = 1000 - 62.5 = 937.5
    spans, R = dc.chain_results([0.0, 20.0], -5.0, 20.0, 100.0, 100.0)
    assert pytest.approx([1562.5, 937.5], rel=TOL) == R
    assert sum(R) == pytest.approx(100.0 * 25.0, rel=TOL)  # statics: total load
    cant, span = spans
    assert cant.M_max_lbft == pytest.approx(1250.0, rel=TOL)
    # span: V(x) = 1062.5 - 100 x = 0 at x* = 10.625; M(x*) = 1062.5²/200 - 1250 = 4394.53
    assert span.R_a_lb == pytest.approx(1062.5, rel=TOL)
    assert span.x_star_ft == pytest.approx(10.625, rel=TOL)
    assert span.M_sag_lbft == pytest.approx(1062.5**2 / 200.0 - 1250.0, rel=TOL)
    # the moment diagram closes: M(L) = -M_b = 0 at the far line
    M_end = dc.span_moment_at_lbft(100.0, 0.0, span.R_a_lb, span.Ma_lbft, 20.0)
    assert M_end == pytest.approx(0.0, abs=1e-9)


def test_overhangs_at_both_ends():
    # derived: extent -4..24, lines 0 and 20, w = 50 plf: both overhangs 4 ft, M = 400 lb-ft each;
    # symmetric, so each line takes half of 50 x 28 = 700 lb and the span moment is
    # wL²/8 - 400 = 2500 - 400 = 2100 lb-ft
    spans, R = dc.chain_results([0.0, 20.0], -4.0, 24.0, 50.0, 50.0)
    assert pytest.approx([700.0, 700.0], rel=TOL) == R
    assert spans[1].M_max_lbft == pytest.approx(2100.0, rel=TOL)


def test_linear_load_on_a_simple_span():
    # derived: w(x) = 0 + 10 x on L = 12: total 720 lb, R_a = wL... R_a = r L²/6 = 240,
    # R_b = r L²/3 = 480; V = 240 - 5 x² = 0 at x* = √48; M = 240 x* - 10 x*³/6
    spans, R = dc.chain_results([0.0, 12.0], 0.0, 12.0, 0.0, 120.0)
    assert pytest.approx([240.0, 480.0], rel=TOL) == R
    x = 48.0**0.5
    assert spans[0].x_star_ft == pytest.approx(x, rel=1e-12)
    assert spans[0].M_max_lbft == pytest.approx(240.0 * x - 10.0 * x**3 / 6.0, rel=1e-12)


@pytest.mark.parametrize(
    ("n_spans", "ratio"),
    # derived (hand check, the 1.20 / 1.28 / 1.31 of the torsional wind case): the Case 2 line load
    # 0.75 w (1 ± 0.9 (2s/B - 1)) on n equal spans gives the exterior line 0.6, 0.6375, 0.65625 wL
    # against wL/2 for Case 1
    [(2, 1.20), (3, 1.275), (4, 1.3125)],
)
def test_torsional_case_on_equal_spans(n_spans, ratio):
    from latbook.engine.asce7_16.wind_cases import eccentric_line_load_plf

    L = 25.0
    B = n_spans * L
    F_kip = 100.0 * B / 1000.0  # w = 100 plf
    w_lo, w_hi = eccentric_line_load_plf(F_kip, 0.75, B, +1)
    _, R2 = dc.chain_results([i * L for i in range(n_spans + 1)], 0.0, B, w_lo, w_hi)
    _, R1 = dc.chain_results([i * L for i in range(n_spans + 1)], 0.0, B, 100.0, 100.0)
    assert R2[-1] / R1[-1] == pytest.approx(ratio, rel=1e-9)
    assert sum(R2) == pytest.approx(0.75 * F_kip * 1000.0, rel=1e-12)  # statics
