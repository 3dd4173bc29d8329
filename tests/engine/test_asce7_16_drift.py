"""ASCE 7-16 §12.8.6 (Eq. 12.8-15) and Table 12.12-1 allowable story drift.

Table 12.12-1 coefficients are from memory of ASCE 7-16.
"""

import pytest

from latbook.engine.asce7_16.drift import (
    ALLOWABLE_DRIFT,
    WIND_DRIFT_RATIO_COMMON_PRACTICE,
    allowable_story_drift_in,
    design_story_drift_in,
    drift_ratio,
)

TABLE_12_12_1 = [
    # ASCE 7-16 Table 12.12-1 (from memory): row, (I or II, III, IV) x hsx
    ("four_story_drift_tolerant", (0.025, 0.020, 0.015)),
    ("masonry_cantilever", (0.010, 0.010, 0.010)),
    ("other_masonry", (0.007, 0.007, 0.007)),
    ("all_other", (0.020, 0.015, 0.010)),
]


@pytest.mark.parametrize(("row", "coefficients"), TABLE_12_12_1)
def test_table_12_12_1_coefficients(row, coefficients):
    table_row = ALLOWABLE_DRIFT[row]
    assert (table_row["I_II"], table_row["III"], table_row["IV"]) == pytest.approx(
        coefficients, rel=1e-12
    )


@pytest.mark.parametrize(
    ("row", "risk_category", "expected_in"),
    [
        ("four_story_drift_tolerant", "II", 0.025 * 120.0),  # 3.0 in for a 10 ft story
        ("four_story_drift_tolerant", "III", 0.020 * 120.0),
        ("all_other", 2, 0.020 * 120.0),
        ("all_other", "IV", 0.010 * 120.0),
        ("other_masonry", "I", 0.007 * 120.0),
    ],
)
def test_allowable_story_drift_for_ten_foot_story(row, risk_category, expected_in):
    # ASCE 7-16 Table 12.12-1 (from memory) x hsx = 10 ft = 120 in (derived by hand).
    assert allowable_story_drift_in(row, risk_category, 10.0) == pytest.approx(
        expected_in, rel=1e-9
    )


def test_eq_12_8_15_amplification():
    # ASCE 7-16 Eq. 12.8-15, light-frame WSP shear walls Cd = 4 (Table 12.2-1 A.15,
    # from memory): 4 x 0.25 / 1.0 = 1.0 in; with Ie = 1.25: 0.8 in (derived by hand).
    assert design_story_drift_in(0.25, 4.0, 1.0) == pytest.approx(1.0, rel=1e-9)
    assert design_story_drift_in(0.25, 4.0, 1.25) == pytest.approx(0.8, rel=1e-9)


def test_wind_drift_ratio():
    # Derived by hand: 0.3 in over a 10 ft story = 0.0025 = h/400 (common practice limit).
    assert drift_ratio(0.3, 10.0) == pytest.approx(0.0025, rel=1e-9)
    assert drift_ratio(0.3, 10.0) == pytest.approx(WIND_DRIFT_RATIO_COMMON_PRACTICE, rel=1e-9)


def test_bad_inputs_are_refused():
    with pytest.raises(ValueError):
        allowable_story_drift_in("no_such_row", "II", 10.0)
    with pytest.raises(ValueError):
        allowable_story_drift_in("all_other", "V", 10.0)


def test_serviceability_wind_scales_the_force_driven_part_only():
    # Derived: 0.42 x (1.0 - 0.2) + 0.2 = 0.536 in; default factor 0.42 (common practice)
    from latbook.engine.asce7_16 import drift

    assert drift.serviceability_deflection_in(1.0, 0.2, 0.42) == pytest.approx(0.536)
    assert drift.WIND_SERVICEABILITY_FACTOR == 0.42
