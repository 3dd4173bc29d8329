"""Sheathing types and their limits: AWC SDPWS-2015 Table 4.3.4 (shear-wall aspect ratios),
§4.3.4.2 / §4.3.4.3 (aspect-ratio factors), §4.3.3.4.1 Exception (2bs/h), §4.3.3.2 (both
faces / dissimilar materials) and Table 4.2.4 (diaphragm aspect ratios).

Every value here is typed from memory of the 2015 edition (medium confidence; the 3.5:1 WSP
limit is confirmed by an AWC FAQ): check against the standard before relying on it.

Factor form: 1.0 for h/bs <= r0, else a + b bs/h + c h/bs, 0 past the limit. Two factors per
sheathing: `defl` for a line shared by deflection (the strength factor of §4.3.4.2 / §4.3.4.3)
and `cap` for a line shared by capacity (the §4.3.3.4.1 Exception, 2bs/h for WSP).
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Literal

ASPECT_TOLERANCE = 1e-12
"""h/bs within this of a limit counts as meeting it (both paths use the same)."""


@dataclass(frozen=True)
class WallSheathing:
    """One row of SDPWS-2015 Table 4.3.4 with its aspect-ratio factors."""

    limit: float
    r0: float
    defl: tuple[float, float, float]
    cap: tuple[float, float, float]
    wind_sum_group: int
    """1: WSP, fiberboard (summed with gypsum opposite for wind); 2: gypsum; 0: other."""


_ONE = (1.0, 0.0, 0.0)

WALL_SHEATHING: dict[str, WallSheathing] = {
    "wsp_blocked": WallSheathing(3.5, 2.0, (1.25, 0.0, -0.125), (0.0, 2.0, 0.0), 1),
    "wsp_unblocked": WallSheathing(2.0, 2.0, _ONE, _ONE, 1),
    "particleboard_blocked": WallSheathing(2.0, 2.0, _ONE, _ONE, 0),
    "structural_fiberboard": WallSheathing(3.5, 1.0, (0.1, 0.9, 0.0), (0.1, 0.9, 0.0), 1),
    "gypsum_board_blocked": WallSheathing(2.0, 2.0, _ONE, _ONE, 2),
    "gypsum_board_unblocked": WallSheathing(1.5, 1.5, _ONE, _ONE, 2),
    "portland_cement_plaster_blocked": WallSheathing(2.0, 2.0, _ONE, _ONE, 0),
    "portland_cement_plaster_unblocked": WallSheathing(1.5, 1.5, _ONE, _ONE, 0),
    "lumber_diagonal": WallSheathing(2.0, 2.0, _ONE, _ONE, 0),
}
"""Shear-wall sheathing -> limit h/bs (Table 4.3.4), ratio above which the factor applies, and
the factors: WSP blocked 1.25 - 0.125 h/bs (§4.3.4.2) or 2bs/h (§4.3.3.4.1 Exception);
structural fiberboard 0.1 + 0.9 bs/h above 1:1 (§4.3.4.3); gypsum board and portland cement
plaster 2:1 blocked, 1.5:1 unblocked (Table 4.3.4 footnote). From memory."""

DIAPHRAGM_ASPECT_LIMITS: dict[str, float] = {
    "wsp_blocked": 4.0,
    "wsp_unblocked": 3.0,
    "lumber_single_straight": 2.0,
    "lumber_single_diagonal": 3.0,
    "lumber_double_diagonal": 4.0,
}
"""Maximum diaphragm aspect ratio L/W, SDPWS-2015 Table 4.2.4 (from memory)."""

Basis = Literal["deflection", "capacity"]


def wall_aspect_limit(sheathing: str) -> float:
    """Maximum h/bs of a shear-wall segment, SDPWS-2015 Table 4.3.4 [-]."""
    return WALL_SHEATHING[sheathing].limit


def meets_wall_aspect_limit(ratio: float, sheathing: str) -> bool:
    """True where h/bs <= the Table 4.3.4 limit of the sheathing [-]."""
    return ratio <= wall_aspect_limit(sheathing) + ASPECT_TOLERANCE


def wall_aspect_factor(ratio: float, sheathing: str, basis: Basis) -> float:
    """Capacity factor of a face at h/bs = ratio: 1 up to r0, a + b/ratio + c ratio above it,
    0 past the limit; `basis` "deflection" (SDPWS-2015 §4.3.4.2 / §4.3.4.3) or "capacity"
    (§4.3.3.4.1 Exception) [-]."""
    row = WALL_SHEATHING[sheathing]
    if not meets_wall_aspect_limit(ratio, sheathing):
        return 0.0
    if ratio <= row.r0:
        return 1.0
    a, b, c = row.defl if basis == "deflection" else row.cap
    return a + b / ratio + c * ratio


def combined_nominal_plf(
    v1_plf: float, v2_plf: float, source: Literal["seis", "wind"], wind_sum: bool
) -> float:
    """Nominal unit shear of a wall sheathed on both faces, SDPWS-2015 §4.3.3.2 (from memory):
    the larger of the larger face and twice the smaller (same material on both faces: twice
    one face); for wind, WSP or structural fiberboard on one face with gypsum board on the other
    are summed [plf]. A face that does not count is passed as 0."""
    if source == "wind" and wind_sum:
        return v1_plf + v2_plf
    return max(max(v1_plf, v2_plf), 2.0 * min(v1_plf, v2_plf))


def wind_sum_pair(sheathing1: str, sheathing2: str | None) -> bool:
    """True where the faces are WSP or structural fiberboard with gypsum board opposite, whose
    wind capacities SDPWS-2015 §4.3.3.2 adds (from memory) [-]."""
    if sheathing2 is None:
        return False
    groups = {WALL_SHEATHING[sheathing1].wind_sum_group, WALL_SHEATHING[sheathing2].wind_sum_group}
    return groups == {1, 2}


def diaphragm_aspect_limit(sheathing: str) -> float:
    """Maximum diaphragm L/W, SDPWS-2015 Table 4.2.4 [-]."""
    return DIAPHRAGM_ASPECT_LIMITS[sheathing]
