"""Diaphragm design force Fpx, ASCE 7-16 §12.10.1.1, Eqs. 12.10-1, 12.10-2, 12.10-3.

Values derived by hand from the equations; the building case is the hand case of
test_asce7_16_elf.py (not a published example).
"""

import pytest

from latbook.engine.asce7_16.diaphragm_force import Fpx, Fpx_eq_12_10_1, Fpx_max, Fpx_min


def test_bounds_hand_values():
    # derived by hand: 0.2 * 1.0 * 1.5 * 100 = 30; 0.4 * 1.0 * 1.5 * 100 = 60
    assert Fpx_min(1.0, 1.5, 100.0) == pytest.approx(30.0, rel=1e-12)
    assert Fpx_max(1.0, 1.5, 100.0) == pytest.approx(60.0, rel=1e-12)


def test_eq_12_10_1_sums_level_and_levels_above():
    # derived by hand: (10 + 20) / (100 + 200) * 200 = 20
    assert Fpx_eq_12_10_1([10.0, 20.0], [100.0, 200.0], 200.0) == pytest.approx(20.0, rel=1e-12)


@pytest.mark.parametrize(
    ("F_above", "w_above", "wpx", "SDS_g", "Ie", "expected", "label"),
    [
        # derived by hand from Eqs. 12.10-1..12.10-3
        ([30.0], [100.0], 100.0, 1.0, 1.0, 30.0, "Eq. 12.10-1"),  # between 20 and 40
        ([10.0], [100.0], 100.0, 1.0, 1.0, 20.0, "Eq. 12.10-2 (min)"),  # 10 < 0.2*100
        ([50.0], [100.0], 100.0, 1.0, 1.0, 40.0, "Eq. 12.10-3 (max)"),  # 50 > 0.4*100
        ([25.0], [100.0], 100.0, 1.0, 1.5, 30.0, "Eq. 12.10-2 (min)"),  # Ie raises the min
        ([20.0], [100.0], 100.0, 1.0, 1.0, 20.0, "Eq. 12.10-1"),  # equal to min: 12.10-1
    ],
)
def test_Fpx_governing(F_above, w_above, wpx, SDS_g, Ie, expected, label):
    value, governing = Fpx(F_above, w_above, wpx, SDS_g, Ie)
    assert value == pytest.approx(expected, rel=1e-12)
    assert governing == label


@pytest.mark.parametrize(
    ("level", "expected_kip", "label"),
    [
        # building case derived by hand (SDS = 1.0, Ie = 1.0; roof, level 3, level 2):
        # roof: 24.615/100*100 = 24.615 (min 20, max 40)
        (0, 24.615, "Eq. 12.10-1"),
        # level 3: (24.615+24.615)/250*150 = 29.538 < min 0.2*150 = 30
        (1, 30.0, "Eq. 12.10-2 (min)"),
        # level 2: 61.538/400*150 = 23.077 < min 30
        (2, 30.0, "Eq. 12.10-2 (min)"),
    ],
)
def test_building_case_Fpx(level, expected_kip, label):
    Fx_kip = [24.615, 24.615, 12.308]
    weights_kip = [100.0, 150.0, 150.0]
    value, governing = Fpx(
        Fx_kip[: level + 1], weights_kip[: level + 1], weights_kip[level], 1.0, 1.0
    )
    assert value == pytest.approx(expected_kip, rel=1e-4)
    assert governing == label


def test_building_case_eq_12_10_1_rows():
    # derived by hand (see above): 24.615, 29.538, 23.077
    Fx_kip = [24.615, 24.615, 12.308]
    weights_kip = [100.0, 150.0, 150.0]
    rows = [Fpx_eq_12_10_1(Fx_kip[: i + 1], weights_kip[: i + 1], weights_kip[i]) for i in range(3)]
    assert rows == pytest.approx([24.615, 29.538, 23.077], rel=1e-4)
