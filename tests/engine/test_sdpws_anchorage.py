"""Anchorage: Δa at the induced force (AWC SDPWS-2015 Eq. 4.3-1), sill anchor spacing
(§4.3.6.4.1, statics) and plate washers (§4.3.6.4.3, from memory). Hand values derived."""

from __future__ import annotations

import pytest

from latbook.engine.sdpws import anchorage, shear_wall


def test_hold_down_elongation_scales_with_the_force():
    # Derived: 0.12 in at 4,500 lb -> 0.04 in at 1,500 lb; none in compression
    assert anchorage.hold_down_elongation_in(0.12, 4500.0, 1500.0) == pytest.approx(0.04)
    assert anchorage.hold_down_elongation_in(0.12, 4500.0, -10.0) == 0.0
    assert anchorage.anchorage_elongation_in(0.04, 0.05, 0.02) == pytest.approx(0.11)


def test_sill_anchor_spacing_is_capacity_over_unit_shear():
    # Statics: 1,200 lb per anchor at 300 plf -> 4 ft
    assert anchorage.sill_anchor_spacing_ft(1200.0, 300.0) == pytest.approx(4.0)
    assert anchorage.sill_anchor_spacing_ft(1200.0, 0.0) is None


def test_plate_washer_extends_to_the_edge_above_400_plf():
    # §4.3.6.4.3 (from memory): 0.229 x 3 x 3 in.; within 1/2 in. of the edge where the face's
    # nominal unit shear exceeds 400 plf
    assert anchorage.plate_washer_text([380.0, 0.0]) == anchorage.PLATE_WASHER_TEXT
    assert anchorage.plate_washer_text([730.0, 0.0]).endswith("on face 1")
    assert anchorage.plate_washer_text([730.0, 560.0]).endswith("on face 1 and 2")


def test_chord_rotation_is_the_slope_of_the_bending_term():
    # Derived: with no moment from above, θ = V h² / (E A b²) = 1.5 δ_bend / (12 h)
    v_plf, h_ft, E, A, b_ft = 400.0, 9.0, 1.4e6, 16.5, 8.0
    d_bend = shear_wall.deflection_bending_in(v_plf, h_ft, E, A, b_ft)
    theta = shear_wall.chord_rotation_rad(0.0, v_plf * b_ft * h_ft, h_ft, E, A, b_ft)
    assert theta == pytest.approx(1.5 * d_bend / (12 * h_ft), rel=1e-12)
    assert shear_wall.anchorage_rotation_rad(0.12, 8.0) == pytest.approx(0.12 / 96.0)
