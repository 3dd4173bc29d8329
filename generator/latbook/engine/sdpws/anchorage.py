"""Wall anchorage: hold-down elongation at the induced force, sill anchor spacing and plate
washers (AWC SDPWS-2015 Eq. 4.3-1 Δa, §4.3.6.4.1, §4.3.6.4.3)."""

from __future__ import annotations

PLATE_WASHER_TEXT = "plate washers 0.229 x 3 x 3 in. between sill and nut"
PLATE_WASHER_EDGE_PLF = 400.0
"""Nominal unit shear above which the plate washer extends to within 1/2 in. of the sill edge
on the sheathed side, SDPWS-2015 §4.3.6.4.3 (from memory)."""


def hold_down_elongation_in(
    elongation_at_rated_in: float, rated_load_lb: float, force_lb: float
) -> float:
    """Hold-down elongation at `force_lb`, scaled linearly from the manufacturer's elongation
    at its rated load (SDPWS-2015 Eq. 4.3-1: Δa at the induced force) [in]."""
    if rated_load_lb <= 0:
        raise ValueError("rated load must be positive")
    return elongation_at_rated_in * max(0.0, force_lb) / rated_load_lb


def anchorage_elongation_in(
    hold_down_in: float, shrinkage_in: float = 0.0, crushing_in: float = 0.0
) -> float:
    """Total vertical elongation of the wall anchorage Δa: hold-down elongation plus wood
    shrinkage and crushing, SDPWS-2015 Eq. 4.3-1 (its listed contributions) [in]."""
    return hold_down_in + shrinkage_in + crushing_in


def sill_anchor_spacing_ft(capacity_lb: float, unit_shear_plf: float) -> float | None:
    """Largest spacing of sill anchors that carries the sliding unit shear,
    s = capacity / v, SDPWS-2015 §4.3.6.4.1 (statics) [ft]; None where v <= 0 (no shear)."""
    if capacity_lb <= 0:
        raise ValueError("anchor capacity must be positive")
    return capacity_lb / unit_shear_plf if unit_shear_plf > 0 else None


def plate_washer_text(face_nominals_plf: list[float]) -> str:
    """The plate-washer requirement of SDPWS-2015 §4.3.6.4.3 (from memory) for a wall whose
    faces have these largest nominal unit shears (face 1 first)."""
    faces = [str(i + 1) for i, v in enumerate(face_nominals_plf) if v > PLATE_WASHER_EDGE_PLF]
    if not faces:
        return PLATE_WASHER_TEXT
    return PLATE_WASHER_TEXT + "; to within 1/2 in. of the sill edge on face " + " and ".join(faces)
