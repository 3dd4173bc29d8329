"""Ie (ASCE 7-16 Table 1.5-2) and seismic design category (Tables 11.6-1, 11.6-2, §11.6).

Table values typed from memory (ASCE 7-16 Table 1.5-2, Tables 11.6-1 and 11.6-2).
"""

import pytest

from latbook.engine.asce7_16.importance import Ie_seismic
from latbook.engine.asce7_16.sdc import (
    sdc_one_second,
    sdc_short_period,
    seismic_design_category,
)


@pytest.mark.parametrize(
    ("risk_category", "expected"),
    [("I", 1.0), ("II", 1.0), ("III", 1.25), ("IV", 1.5)],  # from memory (Table 1.5-2)
)
def test_Ie_matches_table_1_5_2(risk_category, expected):
    assert Ie_seismic(risk_category) == pytest.approx(expected, rel=1e-12)


def test_Ie_rejects_unknown_category():
    with pytest.raises(ValueError, match="risk category"):
        Ie_seismic("V")


# from memory (ASCE 7-16 Table 11.6-1): SDS just below / at each row boundary
@pytest.mark.parametrize(
    ("SDS_g", "rc_i_to_iii", "rc_iv"),
    [
        (0.0, "A", "A"),
        (0.166, "A", "A"),
        (0.167, "B", "C"),
        (0.329, "B", "C"),
        (0.33, "C", "D"),
        (0.499, "C", "D"),
        (0.50, "D", "D"),
        (1.5, "D", "D"),
    ],
)
def test_sdc_short_period_table_11_6_1(SDS_g, rc_i_to_iii, rc_iv):
    for rc in ("I", "II", "III"):
        assert sdc_short_period(SDS_g, rc) == rc_i_to_iii
    assert sdc_short_period(SDS_g, "IV") == rc_iv


# from memory (ASCE 7-16 Table 11.6-2): SD1 just below / at each row boundary
@pytest.mark.parametrize(
    ("SD1_g", "rc_i_to_iii", "rc_iv"),
    [
        (0.0, "A", "A"),
        (0.066, "A", "A"),
        (0.067, "B", "C"),
        (0.132, "B", "C"),
        (0.133, "C", "D"),
        (0.199, "C", "D"),
        (0.20, "D", "D"),
        (0.9, "D", "D"),
    ],
)
def test_sdc_one_second_table_11_6_2(SD1_g, rc_i_to_iii, rc_iv):
    for rc in ("I", "II", "III"):
        assert sdc_one_second(SD1_g, rc) == rc_i_to_iii
    assert sdc_one_second(SD1_g, "IV") == rc_iv


@pytest.mark.parametrize(
    ("SDS_g", "SD1_g", "S1_g", "risk_category", "expected"),
    [
        (0.20, 0.15, 0.10, "II", "C"),  # more severe of B (11.6-1) and C (11.6-2)
        (0.40, 0.10, 0.08, "II", "C"),  # more severe of C (11.6-1) and B (11.6-2)
        (0.40, 0.10, 0.08, "IV", "D"),
        (1.00, 0.60, 0.74, "II", "D"),
        (1.00, 0.60, 0.75, "I", "E"),  # §11.6: S1 >= 0.75, RC I-III -> E
        (1.00, 0.60, 0.75, "III", "E"),
        (1.00, 0.60, 0.75, "IV", "F"),  # §11.6: S1 >= 0.75, RC IV -> F
    ],
)
def test_seismic_design_category(SDS_g, SD1_g, S1_g, risk_category, expected):
    assert seismic_design_category(SDS_g, SD1_g, S1_g, risk_category) == expected
