"""Flexible diaphragm spans, reactions, unit shear, chord force, shear/moment diagrams.

Published example: R. T. Malone and R. W. Rice, "The Analysis of Irregular Shaped Structures:
Diaphragms and Shear Walls", McGraw-Hill/ICC (2012): Ch. 8 basic shear diagram of a
diaphragm with an opening (Fig. 8.7: w = 200 plf, 100 ft span, 40 ft deep) and Ch. 4 chord
forces at a transfer diaphragm (Fig. 4.2: R = 15,000 lb, w = 200 plf, chord depth 40 ft).
"""

import pytest

from latbook.engine.diaphragm_tributary import (
    Span,
    chord_force_lb,
    diaphragm_unit_shear_plf,
    line_reactions,
    span_diagram,
    span_max_moment_lbft,
    span_max_unit_shear_plf,
    span_moment_at_lbft,
    span_reactions,
    span_shear_at_lb,
    spans,
)

# Malone & Rice Ch. 8, Fig. 8.7: grid line 1 at 0 ft, line 6 at 100 ft.
MALONE_SPAN = Span("simple", 0.0, 100.0, (0, 1))


def test_malone_rice_ch8_reaction_and_unit_shear():
    # Malone & Rice Ch. 8: R1 = R6 = wL/2 = 200(100)/2 = 10,000 lb; v1 = 10,000/40 = 250 plf.
    r_left, r_right = span_reactions(200.0, MALONE_SPAN)
    assert r_left == pytest.approx(10_000.0, rel=1e-9)
    assert r_right == pytest.approx(10_000.0, rel=1e-9)
    assert diaphragm_unit_shear_plf(r_left, 40.0) == pytest.approx(250.0, rel=1e-9)
    assert span_max_unit_shear_plf(200.0, MALONE_SPAN, 40.0) == pytest.approx(250.0, rel=1e-9)


@pytest.mark.parametrize(
    ("x_ft", "shear_lb"),
    [
        (30.0, 4_000.0),  # grid line 2: V = 10,000 - 200(30)
        (60.0, -2_000.0),  # grid line 4
        (75.0, -5_000.0),  # grid line 5
        (100.0, -10_000.0),  # grid line 6
    ],
)
def test_malone_rice_ch8_basic_shear_diagram(x_ft, shear_lb):
    # Malone & Rice Ch. 8, basic shear diagram values at the grid lines.
    assert span_shear_at_lb(200.0, MALONE_SPAN, x_ft) == pytest.approx(shear_lb, rel=1e-9)


def test_malone_rice_ch8_zero_shear_at_grid_line_3():
    # Malone & Rice Ch. 8: "0 lb shear at grid line 3" (x = 50 ft, midspan).
    assert span_shear_at_lb(200.0, MALONE_SPAN, 50.0) == pytest.approx(0.0, abs=1e-9)


@pytest.mark.parametrize(
    ("x_ft", "moment_lbft", "chord_lb"),
    [(15.0, 202_500.0, 5_062.5), (35.0, 402_500.0, 10_062.5)],
)
def test_malone_rice_ch4_chord_forces(x_ft, moment_lbft, chord_lb):
    # Malone & Rice Ch. 4: M = R x - w x^2/2 with R = 15,000 lb, w = 200 plf;
    # F = M / 40 ft. The 150 ft span is inferred from R = wL/2.
    span = Span("simple", 0.0, 150.0, (0, 1))
    assert span_reactions(200.0, span)[0] == pytest.approx(15_000.0, rel=1e-9)
    moment = span_moment_at_lbft(200.0, span, x_ft)
    assert moment == pytest.approx(moment_lbft, rel=1e-9)
    assert chord_force_lb(moment, 40.0) == pytest.approx(chord_lb, rel=1e-9)


def test_symmetric_end_walls_each_take_half():
    # Common practice: two identical end walls on a symmetric plan each take half.
    reactions = line_reactions(150.0, [0.0, 60.0], 0.0, 60.0)
    assert reactions == pytest.approx([4_500.0, 4_500.0], rel=1e-9)


def test_simple_span_max_moment_and_chord():
    # Derived by hand: wL^2/8 = 150(60^2)/8 = 67,500 lb-ft; chord = 67,500/30 = 2,250 lb,
    # tension on one edge and compression on the other (common practice).
    span = spans([0.0, 60.0], 0.0, 60.0)[0]
    moment = span_max_moment_lbft(150.0, span)
    assert moment == pytest.approx(67_500.0, rel=1e-9)
    assert chord_force_lb(moment, 30.0) == pytest.approx(2_250.0, rel=1e-9)


def test_spans_with_interior_line_and_overhangs():
    # Derived by hand: lines at 5, 30, 70 ft on a 0-80 ft diaphragm.
    result = spans([5.0, 30.0, 70.0], 0.0, 80.0)
    assert [s.kind for s in result] == ["cantilever", "simple", "simple", "cantilever"]
    assert [s.line_indices for s in result] == [(0,), (0, 1), (1, 2), (2,)]
    assert [s.length_ft for s in result] == pytest.approx([5.0, 25.0, 40.0, 10.0], rel=1e-12)
    assert [s.free_edge for s in result] == ["start", None, None, "end"]


def test_line_reactions_with_overhangs_by_hand():
    # Derived by hand, w = 100 plf: line 0 = 100(5) + 100(25)/2 = 1,750 lb;
    # line 1 = 100(25)/2 + 100(40)/2 = 3,250 lb; line 2 = 100(40)/2 + 100(10) = 3,000 lb.
    reactions = line_reactions(100.0, [5.0, 30.0, 70.0], 0.0, 80.0)
    assert reactions == pytest.approx([1_750.0, 3_250.0, 3_000.0], rel=1e-9)
    # Statics: the reactions add up to w times the diaphragm length, 8,000 lb.
    assert sum(reactions) == pytest.approx(8_000.0, rel=1e-9)


def test_cantilever_reaction_moment_and_unit_shear_by_hand():
    # Derived by hand: 10 ft overhang, w = 100 plf: R = 1,000 lb all to its line,
    # M = wL^2/2 = 5,000 lb-ft, v = wL/b = 1,000/20 = 50 plf.
    overhang = spans([5.0, 30.0, 70.0], 0.0, 80.0)[-1]
    assert span_reactions(100.0, overhang) == pytest.approx((1_000.0, 0.0), rel=1e-9)
    assert span_max_moment_lbft(100.0, overhang) == pytest.approx(5_000.0, rel=1e-9)
    assert span_max_unit_shear_plf(100.0, overhang, 20.0) == pytest.approx(50.0, rel=1e-9)
    left = spans([5.0, 30.0, 70.0], 0.0, 80.0)[0]
    assert span_reactions(100.0, left) == pytest.approx((0.0, 500.0), rel=1e-9)


def test_span_diagram_points_match_malone_rice_span():
    # Malone & Rice Ch. 8 span at 11 points: V(0) = 10,000, V(30) = 4,000, V(50) = 0,
    # V(100) = -10,000 lb; M at midspan = wL^2/8 = 250,000 lb-ft (derived by hand).
    xs, shears, moments = span_diagram(200.0, MALONE_SPAN)
    assert xs == pytest.approx([10.0 * i for i in range(11)], abs=1e-9)
    assert shears[0] == pytest.approx(10_000.0, rel=1e-9)
    assert shears[3] == pytest.approx(4_000.0, rel=1e-9)
    assert shears[5] == pytest.approx(0.0, abs=1e-9)
    assert shears[10] == pytest.approx(-10_000.0, rel=1e-9)
    assert moments[5] == pytest.approx(250_000.0, rel=1e-9)
    assert moments[0] == pytest.approx(0.0, abs=1e-9)
    assert moments[10] == pytest.approx(0.0, abs=1e-6)


def test_cantilever_diagram_is_hogging_and_zero_at_free_edge():
    # Derived by hand: right overhang 70-80 ft, w = 100 plf: at the line V = 1,000 lb,
    # M = -5,000 lb-ft; at the free edge V = M = 0.
    overhang = spans([5.0, 30.0, 70.0], 0.0, 80.0)[-1]
    xs, shears, moments = span_diagram(100.0, overhang, n_points=3)
    assert xs == pytest.approx([70.0, 75.0, 80.0], rel=1e-12)
    assert shears == pytest.approx([1_000.0, 500.0, 0.0], abs=1e-9)
    assert moments == pytest.approx([-5_000.0, -1_250.0, 0.0], abs=1e-9)


@pytest.mark.parametrize(
    ("lines", "start", "end"),
    [([], 0.0, 10.0), ([5.0, 2.0], 0.0, 10.0), ([-1.0, 5.0], 0.0, 10.0), ([3.0, 3.0], 0.0, 10.0)],
)
def test_invalid_lines_are_refused(lines, start, end):
    with pytest.raises(ValueError):
        spans(lines, start, end)
