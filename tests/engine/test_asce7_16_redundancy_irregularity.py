"""Redundancy factor (ASCE 7-16 §12.3.4, Table 12.3-3) and the story irregularity tests
(Table 12.3-2). Thresholds from memory of ASCE 7-16; cases are hand calculations (derived).
The stiffness check uses AWC SDPWS-2015 Eq. 4.3-1 (from memory) against the engine's own
deflection functions (an independent route to the same number)."""

import pytest

from latbook.engine.asce7_16 import irregularity as irr
from latbook.engine.asce7_16 import redundancy as red
from latbook.engine.sdpws import shear_wall as sw


@pytest.mark.parametrize("sdc", ["A", "B", "C"])
def test_rho_is_1_in_sdc_b_and_c_whatever_the_tests_say(sdc):
    # from memory (§12.3.4.1)
    assert red.rho(sdc, condition_met=False, extreme_torsion_1b=True) == 1.0


@pytest.mark.parametrize(
    ("sdc", "met", "torsion", "expected"),
    [
        ("D", True, False, 1.0),
        ("D", False, False, 1.3),
        ("D", True, True, 1.3),  # SDC D with extreme torsional irregularity: 1.3
        ("E", True, False, 1.0),
        ("F", False, False, 1.3),
    ],
)
def test_rho_in_sdc_d_to_f(sdc, met, torsion, expected):
    # from memory (§12.3.4.2)
    assert red.rho(sdc, met, torsion) == expected


def test_story_shear_threshold_is_strictly_more_than_35_percent():
    assert not red.story_is_significant(0.35)
    assert red.story_is_significant(0.3501)


def test_removal_test_hand_case():
    # derived: four 4 ft segments of 8 ft height (h/L = 2 > 1.0) and one 16 ft segment; strength
    # k L v with k = 1 (h/L <= 2) and equal v: removing a 4 ft wall loses 4 / 32 = 12.5 %
    assert red.wall_is_removable(8.0 / 4.0) and not red.wall_is_removable(8.0 / 16.0)
    assert not red.wall_is_removable(1.0)  # "greater than 1.0"
    loss = red.strength_reduction(4.0, 4 * 4.0 + 16.0)
    assert loss == pytest.approx(0.125, rel=1e-12)
    assert red.removal_test_ok(loss)
    assert red.removal_test_ok(0.33) and not red.removal_test_ok(0.331)


def test_light_frame_bays_and_perimeter_condition():
    # from memory (§12.3.4.2 b): light-frame bays = 2 L / hsx; 10 ft of wall, 10 ft story = 2
    assert red.light_frame_bays(10.0, 10.0) == pytest.approx(2.0, rel=1e-12)
    assert red.perimeter_ok(2.0, 3.5)
    assert not red.perimeter_ok(1.99, 10.0)


@pytest.mark.parametrize(
    ("above", "avg3", "expected"),
    [
        (0.75, None, "none"),
        (0.69, None, "1a"),
        (0.59, None, "1b"),
        (0.95, 0.79, "1a"),
        (0.95, 0.69, "1b"),
        (0.70, 0.80, "none"),  # limits are "less than"
    ],
)
def test_soft_story(above, avg3, expected):
    # from memory (Table 12.3-2 Types 1a, 1b)
    assert irr.soft_story(above, avg3) == expected


@pytest.mark.parametrize(
    ("ratio", "expected"),
    [(0.81, "none"), (0.8, "none"), (0.79, "5a"), (0.65, "5a"), (0.64, "5b"), (None, "none")],
)
def test_weak_story(ratio, expected):
    # from memory (Table 12.3-2 Types 5a, 5b)
    assert irr.weak_story(ratio) == expected


def test_mass_irregularity_with_light_roof_exception():
    # from memory (Table 12.3-2 Type 2): > 150 % of an adjacent story; a roof lighter than the
    # floor below is not considered
    assert irr.mass_irregular(160.0, None, 100.0, above_is_roof=False)  # heavier than below
    assert not irr.mass_irregular(150.0, None, 100.0, above_is_roof=False)
    assert not irr.mass_irregular(200.0, 50.0, 190.0, above_is_roof=True)  # light roof above
    assert irr.mass_irregular(200.0, 50.0, 190.0, above_is_roof=False)


def test_segment_stiffness_matches_the_deflection_terms():
    # SDPWS-2015 Eq. 4.3-1 bending + shear terms at v = 1,000 plf: V / delta = stiffness
    h, b, E, A, Ga = 9.0, 4.0, 1.6e6, 16.5, 15.0
    v = 1000.0
    delta = sw.deflection_bending_in(v, h, E, A, b) + sw.deflection_shear_in(v, h, Ga)
    assert irr.segment_stiffness_lb_per_in(h, b, E, A, Ga) == pytest.approx(
        v * b / delta, rel=1e-12
    )
