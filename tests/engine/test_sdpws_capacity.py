"""AWC SDPWS-2015 §4.2.3 / §4.3.3: nominal unit shear to ASD and LRFD capacity.

Cross-check: the IBC allowable (ASD, seismic) tables for wood structural panels list half
of the SDPWS nominal seismic value for the same construction (values from memory).
"""

import pytest

from latbook.engine.sdpws.capacity import (
    ASD_REDUCTION,
    LRFD_PHI,
    allowable_unit_shear,
    design_unit_shear_lrfd,
    unit_shear_capacity,
)


def test_factors_are_the_sdpws_2015_values():
    # SDPWS-2015 §4.3.3: ASD reduction factor 2.0, LRFD phi_D 0.80 (from memory).
    assert pytest.approx(2.0, rel=1e-12) == ASD_REDUCTION
    assert pytest.approx(0.80, rel=1e-12) == LRFD_PHI


def test_shear_wall_nominal_to_ibc_allowable():
    # SDPWS-2015 Table 4.3A: 15/32" Structural I, 10d common, 6" edge spacing,
    # nominal seismic vs = 680 plf (from memory); IBC-2015 Table 2306.3(1) lists 340 plf
    # allowable for the same wall (from memory).
    assert allowable_unit_shear(680.0) == pytest.approx(340.0, rel=1e-9)


def test_diaphragm_nominal_to_ibc_allowable():
    # SDPWS-2015 Table 4.2A: 15/32" Structural I, 10d, blocked, 6" boundary/6" edges,
    # 2x framing, nominal seismic 640 plf (from memory); IBC-2015 Table 2306.2(1): 320 plf.
    assert allowable_unit_shear(640.0) == pytest.approx(320.0, rel=1e-9)


def test_lrfd_is_080_times_nominal():
    # SDPWS-2015 §4.3.3: LRFD factored resistance = 0.80 x 680 = 544 plf (derived by hand).
    assert design_unit_shear_lrfd(680.0) == pytest.approx(544.0, rel=1e-9)


@pytest.mark.parametrize(("method", "expected_plf"), [("ASD", 340.0), ("LRFD", 544.0)])
def test_unit_shear_capacity_dispatch(method, expected_plf):
    # Derived by hand from the two factors above.
    assert unit_shear_capacity(680.0, method) == pytest.approx(expected_plf, rel=1e-9)


def test_unknown_method_is_refused():
    with pytest.raises(ValueError):
        unit_shear_capacity(680.0, "WSD")
