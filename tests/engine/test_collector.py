"""Collector (drag strut) forces along a wall line.

Published example: American Wood Council, "ASD Manual for Engineered Wood Construction,
2001 Edition, Wood Structural Panel Shear Wall and Diaphragm Supplement", design example,
Step 8 "Drag Strut Forces and Drag Connections (East & West Walls Only)", p. SW-35:
110 ft wall lines, diaphragm shear 280 plf; West wall = 45 ft wall, 20 ft opening, 45 ft
wall (drag force 280(20)(45)/(110 - 20) = 2,800 lb each side of the opening); East wall =
40 ft open at the south end then 70 ft of wall (280 x 40 = 11,200 lb; 8,500 lb reached 30 ft
from the south end and 53 ft from the north end).
The geometry is read from those equations.
"""

import pytest

from latbook.engine.collector import (
    collector_breakpoints,
    collector_force_at_lb,
    collector_forces,
    collector_overstrength,
    collector_peak,
)

AWC_LINE_FT = 110.0
AWC_REACTION_LB = 280.0 * AWC_LINE_FT  # diaphragm shear 280 plf over the 110 ft line
AWC_WEST_SEGMENTS = [(0.0, 45.0), (65.0, 45.0)]
AWC_EAST_SEGMENTS = [(40.0, 70.0)]


def test_awc_2001_west_wall_drag_force_at_opening():
    # AWC 2001 Supplement p. SW-35: 2,800 lb at each end of the 20 ft opening.
    left = collector_force_at_lb(AWC_LINE_FT, AWC_REACTION_LB, AWC_WEST_SEGMENTS, 45.0)
    right = collector_force_at_lb(AWC_LINE_FT, AWC_REACTION_LB, AWC_WEST_SEGMENTS, 65.0)
    assert abs(left) == pytest.approx(2_800.0, rel=1e-9)
    assert abs(right) == pytest.approx(2_800.0, rel=1e-9)
    # Statics (derived by hand): one end of the opening pushes, the other pulls.
    assert left == pytest.approx(-right, rel=1e-9)


def test_awc_2001_east_wall_peak_drag_force():
    # AWC 2001 Supplement p. SW-35: maximum force in drag strut = 280 x 40 = 11,200 lb,
    # at the south end of the wall (40 ft from the south end of the line).
    peak_lb, at_ft = collector_peak(AWC_LINE_FT, AWC_REACTION_LB, AWC_EAST_SEGMENTS)
    assert peak_lb == pytest.approx(11_200.0, rel=1e-9)
    assert at_ft == pytest.approx(40.0, rel=1e-12)


def test_awc_2001_east_wall_force_along_the_wall():
    # AWC 2001 Supplement p. SW-35: 8,500 lb reached 53 ft from the north end (whole feet,
    # hence rel=0.01) and 30 ft from the south end (rel=0.02 for the rounding).
    in_wall = collector_force_at_lb(AWC_LINE_FT, AWC_REACTION_LB, AWC_EAST_SEGMENTS, 110.0 - 53.0)
    in_opening = collector_force_at_lb(AWC_LINE_FT, AWC_REACTION_LB, AWC_EAST_SEGMENTS, 30.0)
    assert abs(in_wall) == pytest.approx(8_500.0, rel=0.01)
    assert abs(in_opening) == pytest.approx(8_500.0, rel=0.02)


def test_breakpoints_and_closure():
    # Statics: the diagram closes, F(0) = F(b) = 0.
    assert collector_breakpoints(AWC_LINE_FT, AWC_WEST_SEGMENTS) == pytest.approx(
        [0.0, 45.0, 65.0, 110.0], rel=1e-12
    )
    diagram = collector_forces(AWC_LINE_FT, AWC_REACTION_LB, AWC_WEST_SEGMENTS)
    assert diagram[0][1] == pytest.approx(0.0, abs=1e-6)
    assert diagram[-1][1] == pytest.approx(0.0, abs=1e-6)


def test_two_walls_with_gap_by_hand():
    # Derived by hand: b = 60 ft, walls (0, 10) and (45, 15), R = 6,000 lb:
    # v_d = 100 plf, v_w = 6,000/25 = 240 plf; F(10) = 1,000 - 2,400 = -1,400 lb;
    # F(45) = 4,500 - 2,400 = +2,100 lb; F(60) = 0.
    diagram = collector_forces(60.0, 6_000.0, [(45.0, 15.0), (0.0, 10.0)])
    positions = [s for s, _ in diagram]
    forces = [f for _, f in diagram]
    assert positions == pytest.approx([0.0, 10.0, 45.0, 60.0], rel=1e-12)
    assert forces == pytest.approx([0.0, -1_400.0, 2_100.0, 0.0], abs=1e-6)
    assert collector_peak(60.0, 6_000.0, [(0.0, 10.0), (45.0, 15.0)]) == pytest.approx(
        (2_100.0, 45.0), rel=1e-9
    )


def test_full_length_wall_has_no_collector_force():
    # Statics: a wall over the whole line takes the shear where it is delivered.
    for _, force in collector_forces(40.0, 8_000.0, [(0.0, 40.0)]):
        assert force == pytest.approx(0.0, abs=1e-9)


def test_overstrength_multiplies_force():
    # ASCE 7-16 §12.10.2.1: Omega0 x F; light-frame walls sheathed with WSP have
    # Omega0 = 3 in Table 12.2-1 line A.15 (from memory): 3 x 11,200 = 33,600 lb.
    assert collector_overstrength(11_200.0, 3.0) == pytest.approx(33_600.0, rel=1e-9)


@pytest.mark.parametrize(
    "segments",
    [[(0.0, 0.0)], [(-1.0, 5.0)], [(100.0, 20.0)], [(0.0, 30.0), (20.0, 10.0)], []],
)
def test_invalid_segments_are_refused(segments):
    with pytest.raises(ValueError):
        collector_breakpoints(110.0, segments)
