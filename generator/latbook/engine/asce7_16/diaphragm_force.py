"""ASCE 7-16 §12.10.1.1: diaphragm design force Fpx with its minimum and maximum."""

LABEL_FPX_EQ = "Eq. 12.10-1"
LABEL_FPX_MIN = "Eq. 12.10-2 (min)"
LABEL_FPX_MAX = "Eq. 12.10-3 (max)"


def Fpx_eq_12_10_1(F_above_kip: list[float], w_above_kip: list[float], wpx_kip: float) -> float:
    """Fpx = (sum Fi / sum wi) wpx for i = x..n, ASCE 7-16 §12.10.1.1, Eq. 12.10-1 (kip).

    F_above_kip and w_above_kip hold the story forces and weights of level x and every level
    above it.
    """
    if len(F_above_kip) != len(w_above_kip) or not F_above_kip:
        raise ValueError("F_above_kip and w_above_kip must be non-empty and of equal length")
    total_weight_kip = sum(w_above_kip)
    if total_weight_kip <= 0:
        raise ValueError("sum of weights at and above level x must be > 0 kip")
    return sum(F_above_kip) / total_weight_kip * wpx_kip


def Fpx_min(SDS_g: float, Ie: float, wpx_kip: float) -> float:
    """Minimum diaphragm force 0.2 SDS Ie wpx, ASCE 7-16 §12.10.1.1, Eq. 12.10-2 (kip)."""
    return 0.2 * SDS_g * Ie * wpx_kip


def Fpx_max(SDS_g: float, Ie: float, wpx_kip: float) -> float:
    """Maximum required diaphragm force 0.4 SDS Ie wpx, ASCE 7-16 §12.10.1.1, Eq. 12.10-3 (kip)."""
    return 0.4 * SDS_g * Ie * wpx_kip


def Fpx(
    F_above_kip: list[float],
    w_above_kip: list[float],
    wpx_kip: float,
    SDS_g: float,
    Ie: float,
) -> tuple[float, str]:
    """Diaphragm design force and governing equation, ASCE 7-16 §12.10.1.1 (kip).

    Eq. 12.10-1 held between Eq. 12.10-2 (minimum) and Eq. 12.10-3 (maximum); a value equal to
    a bound is labelled Eq. 12.10-1.
    """
    value = Fpx_eq_12_10_1(F_above_kip, w_above_kip, wpx_kip)
    lower = Fpx_min(SDS_g, Ie, wpx_kip)
    upper = Fpx_max(SDS_g, Ie, wpx_kip)
    if value < lower:
        return lower, LABEL_FPX_MIN
    if value > upper:
        return upper, LABEL_FPX_MAX
    return value, LABEL_FPX_EQ
