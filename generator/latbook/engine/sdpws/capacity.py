"""Design unit shear capacity from nominal unit shear (AWC SDPWS-2015 §4.2.3, §4.3.3).

SDPWS tabulates nominal unit shear capacities (Tables 4.2A-C diaphragms, 4.3A-D shear walls).
ASD allowable = nominal / 2.0; LRFD factored resistance = 0.80 x nominal. Both factors are the
same for wind and seismic; the wind vs seismic difference lives in the tabulated nominal value.
"""

from typing import Literal

ASD_REDUCTION = 2.0
"""ASD reduction factor applied to nominal unit shear, SDPWS-2015 §4.2.3 / §4.3.3."""

LRFD_PHI = 0.8
"""LRFD resistance factor phi_D applied to nominal unit shear, SDPWS-2015 §4.2.3 / §4.3.3."""

DesignMethod = Literal["ASD", "LRFD"]


def allowable_unit_shear(nominal_plf: float) -> float:
    """ASD allowable unit shear = nominal / 2.0, SDPWS-2015 §4.2.3 / §4.3.3 [plf]."""
    return nominal_plf / ASD_REDUCTION


def design_unit_shear_lrfd(nominal_plf: float) -> float:
    """LRFD factored unit shear resistance = 0.80 x nominal, SDPWS-2015 §4.2.3 / §4.3.3 [plf]."""
    return LRFD_PHI * nominal_plf


def unit_shear_capacity(nominal_plf: float, method: DesignMethod) -> float:
    """Design unit shear capacity for "ASD" or "LRFD", SDPWS-2015 §4.2.3 / §4.3.3 [plf]."""
    if method == "ASD":
        return allowable_unit_shear(nominal_plf)
    if method == "LRFD":
        return design_unit_shear_lrfd(nominal_plf)
    raise ValueError(f"method must be 'ASD' or 'LRFD', got {method!r}")
