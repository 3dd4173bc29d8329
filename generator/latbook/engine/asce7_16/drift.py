"""Story drift: seismic amplification and allowable drift (ASCE 7-16 §12.8.6, §12.12.1).

Wind drift has no code limit in ASCE 7-16; it is a serviceability matter (Appendix C and its
commentary). A limit near h/400 is common practice; latbook reports the ratio only.
"""

from typing import Literal

RiskCategoryGroup = Literal["I_II", "III", "IV"]

ALLOWABLE_DRIFT: dict[str, dict[RiskCategoryGroup, float]] = {
    # Structures, other than masonry shear wall structures, 4 stories or less above the base,
    # with interior walls, partitions, ceilings and exterior wall systems designed to
    # accommodate the story drifts.
    "four_story_drift_tolerant": {"I_II": 0.025, "III": 0.020, "IV": 0.015},
    # Masonry cantilever shear wall structures.
    "masonry_cantilever": {"I_II": 0.010, "III": 0.010, "IV": 0.010},
    # Other masonry shear wall structures.
    "other_masonry": {"I_II": 0.007, "III": 0.007, "IV": 0.007},
    # All other structures.
    "all_other": {"I_II": 0.020, "III": 0.015, "IV": 0.010},
}
"""Allowable story drift Delta_a as a coefficient of hsx, ASCE 7-16 Table 12.12-1
(from memory); keys are latbook's own row names."""

WIND_SERVICEABILITY_FACTOR = 0.42
"""Factor on strength-level W for drift: about the 10-year mean recurrence interval wind of
the ASCE 7-16 Appendix C commentary (CC.2.2); IBC 2018 Table 1604.3 note f allows 0.42 for
deflection (common practice; the IBC note from memory, its equivalence to the 10-year wind as
read in an ASCE standards forum discussion)."""

WIND_DRIFT_RATIO_COMMON_PRACTICE = 1.0 / 400.0
"""Serviceability wind drift ratio often used, h/400 (common practice; no ASCE 7-16 limit)."""

_RISK_CATEGORY_GROUPS: dict[str, RiskCategoryGroup] = {
    "I": "I_II",
    "II": "I_II",
    "III": "III",
    "IV": "IV",
    "1": "I_II",
    "2": "I_II",
    "3": "III",
    "4": "IV",
}


def design_story_drift_in(delta_xe_in: float, Cd: float, Ie: float) -> float:
    """Amplified drift Cd delta_xe / Ie, ASCE 7-16 Eq. 12.8-15 [in]; pass the elastic story
    drift (delta_xe at top minus bottom of the story) to get the design story drift Delta."""
    if Ie <= 0:
        raise ValueError("Ie must be positive")
    return Cd * delta_xe_in / Ie


def risk_category_group(risk_category: str | int) -> RiskCategoryGroup:
    """Column of ASCE 7-16 Table 12.12-1 for a risk category I, II, III or IV [-]."""
    key = str(risk_category).strip().upper()
    if key not in _RISK_CATEGORY_GROUPS:
        raise ValueError(f"risk category must be I, II, III or IV, got {risk_category!r}")
    return _RISK_CATEGORY_GROUPS[key]


def allowable_story_drift_in(row_key: str, risk_category: str | int, hsx_ft: float) -> float:
    """Allowable story drift Delta_a = coefficient x hsx, ASCE 7-16 Table 12.12-1 [in]
    (hsx = story height below level x, ft)."""
    if row_key not in ALLOWABLE_DRIFT:
        raise ValueError(f"unknown Table 12.12-1 row {row_key!r}; one of {sorted(ALLOWABLE_DRIFT)}")
    if hsx_ft <= 0:
        raise ValueError("story height must be positive")
    coefficient = ALLOWABLE_DRIFT[row_key][risk_category_group(risk_category)]
    return coefficient * hsx_ft * 12.0


def drift_ratio(delta_in: float, h_ft: float) -> float:
    """Drift ratio delta / h (e.g. wind drift; no ASCE 7-16 limit, h/400 common practice per
    ASCE 7-16 Appendix C commentary) [-]."""
    if h_ft <= 0:
        raise ValueError("height must be positive")
    return delta_in / (h_ft * 12.0)


def serviceability_deflection_in(delta_in: float, constant_in: float, factor: float) -> float:
    """Deflection at the serviceability wind: the force-driven part scaled by `factor`, the
    part that does not depend on the force (shrinkage, crushing) whole:
    factor (delta - constant) + constant, elastic scaling (ASCE 7-16 App. C commentary) [in]."""
    if not 0 < factor <= 1:
        raise ValueError("the serviceability factor must be in (0, 1]")
    return factor * (delta_in - constant_in) + constant_in


def overhang_edge_drift_in(
    line_story_drift_in: float,
    edge_deflection_in: float,
    edge_deflection_below_in: float,
    amplification: float,
) -> float:
    """Story drift at the free edge of a cantilevered diaphragm (AWC SDPWS-2015 §4.2.5.2):
    the supporting line's story drift (already amplified) plus the amplification times the
    overhang's own deflection less that of the overhang below it [in]. Seismic: amplification
    Cd / Ie, ASCE 7-16 Eq. 12.8-15; wind: the serviceability factor on strength-level W."""
    if amplification <= 0:
        raise ValueError("the amplification must be positive")
    return line_story_drift_in + amplification * (edge_deflection_in - edge_deflection_below_in)
