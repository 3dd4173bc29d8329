"""ASCE 7-16 Tables 12.3-1 and 12.3-2: the irregularity tests latbook can make from story
strengths, stiffnesses and weights (from memory of the 2016 text).

Vertical Type 1a soft story: story stiffness < 70 % of the story above or < 80 % of the
average of the three stories above; 1b extreme soft story: < 60 % / < 70 %.
Type 2 weight (mass): effective mass of a story > 150 % of an adjacent story's (a roof lighter
than the floor below is not considered). Type 5a weak story: story lateral strength < 80 % of
the story above; 5b extreme weak story: < 65 %.
"""

SOFT_ABOVE, SOFT_AVG3 = 0.70, 0.80
EXTREME_SOFT_ABOVE, EXTREME_SOFT_AVG3 = 0.60, 0.70
WEAK, EXTREME_WEAK = 0.80, 0.65
MASS_RATIO = 1.50

NONE = "none"


def soft_story(ratio_above: float | None, ratio_avg3: float | None) -> str:
    """'1b', '1a' or 'none' from stiffness ratios to the story above and to the average of
    the three stories above (None where there are not that many stories above)."""

    def below(ratio: float | None, limit: float) -> bool:
        return ratio is not None and ratio < limit

    if below(ratio_above, EXTREME_SOFT_ABOVE) or below(ratio_avg3, EXTREME_SOFT_AVG3):
        return "1b"
    if below(ratio_above, SOFT_ABOVE) or below(ratio_avg3, SOFT_AVG3):
        return "1a"
    return NONE


def weak_story(ratio_above: float | None) -> str:
    """'5b', '5a' or 'none' from the story strength ratio to the story above."""
    if ratio_above is None:
        return NONE
    if ratio_above < EXTREME_WEAK:
        return "5b"
    if ratio_above < WEAK:
        return "5a"
    return NONE


def mass_irregular(
    w_kip: float, w_above_kip: float | None, w_below_kip: float | None, above_is_roof: bool
) -> bool:
    """Type 2: w > 150 % of an adjacent level's w; the comparison with a roof above that is
    lighter than this level is skipped (Table 12.3-2, Type 2)."""
    if w_below_kip is not None and w_kip > MASS_RATIO * w_below_kip:
        return True
    if w_above_kip is None or (above_is_roof and w_above_kip < w_kip):
        return False
    return w_kip > MASS_RATIO * w_above_kip


def segment_stiffness_lb_per_in(
    h_ft: float, b_ft: float, E_psi: float, A_in2: float, Ga_kips_per_in: float
) -> float:
    """Lateral stiffness of a wood shear-wall segment from the bending and shear terms of AWC
    SDPWS-2015 Eq. 4.3-1, b / (8 h^3 / (E A b) + h / (1000 Ga)) (lb/in). The anchorage-slip
    term h Δa / b does not scale with load and is left out of this screen."""
    if min(h_ft, b_ft, E_psi, A_in2, Ga_kips_per_in) <= 0:
        raise ValueError("segment dimensions and properties must be > 0")
    return b_ft / (8.0 * h_ft**3 / (E_psi * A_in2 * b_ft) + h_ft / (1000.0 * Ga_kips_per_in))
