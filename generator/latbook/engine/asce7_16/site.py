"""ASCE 7-16 §11.4: site coefficients Fa, Fv and the design spectral accelerations SDS, SD1.

Table values typed from memory (ASCE 7-16 Tables 11.4-1 and 11.4-2). A cell of None is a cell
the standard marks "See Section 11.4.8" (site-specific ground-motion procedure required).
"""

from latbook.engine.asce7_16._interpolate import interpolate_clamped
from latbook.engine.errors import CodeLimitError

SITE_CLASSES: tuple[str, ...] = ("A", "B", "C", "D", "E", "F")

#: Tabulated mapped MCE_R short-period accelerations, ASCE 7-16 Table 11.4-1 column heads (g).
#: The first and last columns read "Ss <= 0.25" and "Ss >= 1.5".
TABLE_11_4_1_SS_G: tuple[float, ...] = (0.25, 0.50, 0.75, 1.00, 1.25, 1.50)

#: Fa by site class, one value per column of TABLE_11_4_1_SS_G; None = "See Section 11.4.8".
TABLE_11_4_1_FA: dict[str, tuple[float | None, ...]] = {
    "A": (0.8, 0.8, 0.8, 0.8, 0.8, 0.8),
    "B": (0.9, 0.9, 0.9, 0.9, 0.9, 0.9),
    "C": (1.3, 1.3, 1.2, 1.2, 1.2, 1.2),
    "D": (1.6, 1.4, 1.2, 1.1, 1.0, 1.0),
    "E": (2.4, 1.7, 1.3, None, None, None),
    "F": (None, None, None, None, None, None),
}

#: Tabulated mapped MCE_R 1-s accelerations, ASCE 7-16 Table 11.4-2 column heads (g).
#: The first and last columns read "S1 <= 0.1" and "S1 >= 0.6".
TABLE_11_4_2_S1_G: tuple[float, ...] = (0.1, 0.2, 0.3, 0.4, 0.5, 0.6)

#: Fv by site class, one value per column of TABLE_11_4_2_S1_G; None = "See Section 11.4.8".
#: Site class D cells for S1 >= 0.2 are printed with a footnote to §11.4.8 (see
#: FV_SITE_SPECIFIC_FROM_S1_G: this tool refuses them).
TABLE_11_4_2_FV: dict[str, tuple[float | None, ...]] = {
    "A": (0.8, 0.8, 0.8, 0.8, 0.8, 0.8),
    "B": (0.8, 0.8, 0.8, 0.8, 0.8, 0.8),
    "C": (1.5, 1.5, 1.5, 1.5, 1.5, 1.4),
    "D": (2.4, 2.2, 2.0, 1.9, 1.8, 1.7),
    "E": (4.2, None, None, None, None, None),
    "F": (None, None, None, None, None, None),
}

#: Ss (g) at and above which §11.4.8 requires a site-specific study, by site class (F: always).
FA_SITE_SPECIFIC_FROM_SS_G: dict[str, float] = {"E": 1.0, "F": 0.0}

#: S1 (g) at and above which §11.4.8 requires a site-specific study, by site class (F: always).
FV_SITE_SPECIFIC_FROM_S1_G: dict[str, float] = {"D": 0.2, "E": 0.2, "F": 0.0}

#: Design-to-MCE_R ratio in ASCE 7-16 Eqs. 11.4-3 and 11.4-4.
DESIGN_FRACTION = 2.0 / 3.0


def _check_site_class(site_class: str) -> str:
    if site_class not in SITE_CLASSES:
        raise ValueError(f"site class must be one of {SITE_CLASSES}, got {site_class!r}")
    return site_class


def _site_class_f_error(name: str) -> CodeLimitError:
    return CodeLimitError(
        f"{name}: site class F requires a site response analysis (ASCE 7-16 §11.4.8 and "
        "§20.3.1); Table 11.4-1/11.4-2 values may not be used."
    )


def _tabulated_part(
    breakpoints: tuple[float, ...], row: tuple[float | None, ...]
) -> tuple[tuple[float, ...], tuple[float, ...]]:
    """Leading run of tabulated (non-None) cells of a row, with their breakpoints."""
    xs: list[float] = []
    ys: list[float] = []
    for x, y in zip(breakpoints, row, strict=True):
        if y is None:
            break
        xs.append(x)
        ys.append(y)
    return tuple(xs), tuple(ys)


def Fa(site_class: str, Ss_g: float) -> float:
    """Short-period site coefficient Fa, ASCE 7-16 §11.4.4, Table 11.4-1 (dimensionless; Ss in g).

    Straight-line interpolation between the tabulated Ss values, held constant beyond the ends.
    Site class E between Ss = 0.75 and 1.0 holds the last tabulated value, 1.3.
    """
    _check_site_class(site_class)
    if Ss_g < 0:
        raise ValueError(f"Ss must be >= 0 g, got {Ss_g}")
    if site_class == "F":
        raise _site_class_f_error("Fa")
    if site_class == "E" and Ss_g >= FA_SITE_SPECIFIC_FROM_SS_G["E"]:
        raise CodeLimitError(
            f"Fa: site class E with Ss = {Ss_g:g} g >= 1.0 g is marked 'See Section 11.4.8' in "
            "ASCE 7-16 Table 11.4-1; a site-specific ground-motion hazard analysis is required "
            "(the §11.4.8 exception 1 is not implemented by this tool)."
        )
    xs, ys = _tabulated_part(TABLE_11_4_1_SS_G, TABLE_11_4_1_FA[site_class])
    return interpolate_clamped(Ss_g, xs, ys)


def Fv(site_class: str, S1_g: float) -> float:
    """Long-period site coefficient Fv, ASCE 7-16 §11.4.4, Table 11.4-2 (dimensionless; S1 in g).

    Straight-line interpolation between the tabulated S1 values, held constant beyond the ends.
    Site class D between S1 = 0.1 and 0.2 interpolates to the printed 2.2; site class E holds 4.2.
    """
    _check_site_class(site_class)
    if S1_g < 0:
        raise ValueError(f"S1 must be >= 0 g, got {S1_g}")
    if site_class == "F":
        raise _site_class_f_error("Fv")
    if site_class == "E" and S1_g >= FV_SITE_SPECIFIC_FROM_S1_G["E"]:
        raise CodeLimitError(
            f"Fv: site class E with S1 = {S1_g:g} g >= 0.2 g is marked 'See Section 11.4.8' in "
            "ASCE 7-16 Table 11.4-2; a site-specific ground-motion hazard analysis is required "
            "(the §11.4.8 exception 3 is not implemented by this tool)."
        )
    if site_class == "D" and S1_g >= FV_SITE_SPECIFIC_FROM_S1_G["D"]:
        raise CodeLimitError(
            f"Fv: site class D with S1 = {S1_g:g} g >= 0.2 g requires a site-specific "
            "ground-motion hazard analysis per ASCE 7-16 §11.4.8; the tabulated Fv is only "
            "permitted under §11.4.8 exception 2 (Cs per §12.8 with the 1.5 factor), which this "
            "tool does not implement."
        )
    xs, ys = _tabulated_part(TABLE_11_4_2_S1_G, TABLE_11_4_2_FV[site_class])
    return interpolate_clamped(S1_g, xs, ys)


def SMS(Fa: float, Ss_g: float) -> float:
    """Site-adjusted MCE_R short-period spectral acceleration, ASCE 7-16 Eq. 11.4-1 (g)."""
    return Fa * Ss_g


def SM1(Fv: float, S1_g: float) -> float:
    """Site-adjusted MCE_R 1-s spectral acceleration, ASCE 7-16 Eq. 11.4-2 (g)."""
    return Fv * S1_g


def SDS(SMS_g: float) -> float:
    """Design short-period spectral acceleration, ASCE 7-16 §11.4.5, Eq. 11.4-3 (g)."""
    return DESIGN_FRACTION * SMS_g


def SD1(SM1_g: float) -> float:
    """Design 1-s spectral acceleration, ASCE 7-16 §11.4.5, Eq. 11.4-4 (g)."""
    return DESIGN_FRACTION * SM1_g
