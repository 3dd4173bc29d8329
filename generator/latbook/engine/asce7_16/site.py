"""ASCE 7-16 §11.4 (with Supplement No. 1): site coefficients Fa, Fv, the §11.4.8 cases that
call for a site-specific study and their exceptions, and the design spectral accelerations.

Tables 11.4-1 and 11.4-2 typed from memory of ASCE 7-16; the Table 11.4-2 Site E row and the
footnote on the Site D and E cells at S1 >= 0.2 g are Supplement No. 1's, as reprinted in
S. K. Ghosh Associates, "More on the New Site Coefficients in ASCE 7-16" (13 Apr 2020). A cell
of None is one the standard marks "See Section 11.4.8" (no tabulated value).

§11.4.8 exceptions (text confirmed in a public forum quotation of ASCE 7-16 §11.4.8; items 1
and 2 match, item 3 from memory): a ground-motion hazard analysis is not required for
1. Site E with Ss >= 1.0 g, provided Fa is taken as that of Site C;
2. Site D with S1 >= 0.2 g, provided Cs is Eq. 12.8-2 for T <= 1.5 Ts and 1.5 times Eq. 12.8-3
   (TL >= T > 1.5 Ts) or Eq. 12.8-4 (T > TL);
3. Site E with S1 >= 0.2 g, provided T <= Ts and the equivalent lateral force procedure is used.
"""

from latbook.engine.asce7_16._interpolate import interpolate_clamped
from latbook.engine.errors import CodeLimitError

SITE_CLASSES: tuple[str, ...] = ("A", "B", "C", "D", "E", "F")

#: How the site class was set: from site data (ch. 20), the §11.4.3 default (Site D where soil
#: properties are not known), or Site B without measured shear-wave velocity (§11.4.3).
SITE_CLASS_BASES: tuple[str, ...] = ("site_data", "default_D", "B_unmeasured_vs")

#: ASCE 7-16 Table 11.4-1 column heads, Ss (g); the first reads "<= 0.25", the last ">= 1.5".
TABLE_11_4_1_SS_G: tuple[float, ...] = (0.25, 0.50, 0.75, 1.00, 1.25, 1.50)

#: Fa by site class, one value per column; None = "See Section 11.4.8".
TABLE_11_4_1_FA: dict[str, tuple[float | None, ...]] = {
    "A": (0.8, 0.8, 0.8, 0.8, 0.8, 0.8),
    "B": (0.9, 0.9, 0.9, 0.9, 0.9, 0.9),
    "C": (1.3, 1.3, 1.2, 1.2, 1.2, 1.2),
    "D": (1.6, 1.4, 1.2, 1.1, 1.0, 1.0),
    "E": (2.4, 1.7, 1.3, None, None, None),
    "F": (None, None, None, None, None, None),
}

#: ASCE 7-16 Table 11.4-2 column heads, S1 (g); the first reads "<= 0.1", the last ">= 0.6".
TABLE_11_4_2_S1_G: tuple[float, ...] = (0.1, 0.2, 0.3, 0.4, 0.5, 0.6)

#: Fv by site class (Supplement No. 1); None = "See Section 11.4.8". Site D and E cells at
#: S1 >= 0.2 g carry footnote a: "These values of Fv shall be used only for calculation of TS."
TABLE_11_4_2_FV: dict[str, tuple[float | None, ...]] = {
    "A": (0.8, 0.8, 0.8, 0.8, 0.8, 0.8),
    "B": (0.8, 0.8, 0.8, 0.8, 0.8, 0.8),
    "C": (1.5, 1.5, 1.5, 1.5, 1.5, 1.4),
    "D": (2.4, 2.2, 2.0, 1.9, 1.8, 1.7),
    "E": (4.2, 3.3, 2.8, 2.4, 2.2, 2.0),
    "F": (None, None, None, None, None, None),
}

#: S1 (g) from which Table 11.4-2 footnote a applies to Site D and E cells.
FV_FOOTNOTE_A_FROM_S1_G = 0.2

#: §11.4.8 thresholds: Site E with Ss >= 1.0 g; Site D or E with S1 >= 0.2 g.
SS_SITE_E_STUDY_G = 1.0
S1_SITE_D_E_STUDY_G = 0.2

#: §11.4.4 (from memory): Fa not less than 1.2 where Site D is the §11.4.3 default.
FA_MIN_DEFAULT_D = 1.2

#: §11.4.3 (from memory): Fa = Fv = 1.0 for Site B without measured shear-wave velocity.
F_SITE_B_UNMEASURED = 1.0

#: Design-to-MCE_R ratio in ASCE 7-16 Eqs. 11.4-3 and 11.4-4.
DESIGN_FRACTION = 2.0 / 3.0


def _check_site_class(site_class: str) -> str:
    if site_class not in SITE_CLASSES:
        raise ValueError(f"site class must be one of {SITE_CLASSES}, got {site_class!r}")
    return site_class


def _check_basis(site_class: str, basis: str) -> None:
    if basis not in SITE_CLASS_BASES:
        raise ValueError(f"site class basis must be one of {SITE_CLASS_BASES}, got {basis!r}")
    if basis == "default_D" and site_class != "D":
        raise ValueError("the §11.4.3 default site class is D")
    if basis == "B_unmeasured_vs" and site_class != "B":
        raise ValueError("'B_unmeasured_vs' applies to site class B only")


def _site_class_f_error(name: str) -> CodeLimitError:
    return CodeLimitError(
        f"{name}: site class F requires a site response analysis (ASCE 7-16 §11.4.8 and "
        "§20.3.1); Table 11.4-1/11.4-2 values may not be used."
    )


def tabulated_part(
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


def Fa_row(site_class: str, Ss_g: float) -> str:
    """Table 11.4-1 row Fa is read from: Site C's for Site E at Ss >= 1.0 g (§11.4.8
    exception 1), else the site class's own row."""
    _check_site_class(site_class)
    if site_class == "F":
        raise _site_class_f_error("Fa")
    if site_class == "E" and Ss_g >= SS_SITE_E_STUDY_G:
        return "C"
    return site_class


def Fa_table(row: str, Ss_g: float) -> float:
    """Fa from one row of Table 11.4-1 by straight-line interpolation, held constant beyond the
    row's tabulated cells (ASCE 7-16 §11.4.4; dimensionless, Ss in g). Site E between Ss = 0.75
    and 1.0 holds 1.3: its next column is not tabulated."""
    if Ss_g < 0:
        raise ValueError(f"Ss must be >= 0 g, got {Ss_g}")
    xs, ys = tabulated_part(TABLE_11_4_1_SS_G, TABLE_11_4_1_FA[_check_site_class(row)])
    if not xs:
        raise _site_class_f_error("Fa")
    return interpolate_clamped(Ss_g, xs, ys)


def Fa(site_class: str, Ss_g: float, basis: str = "site_data") -> float:
    """Short-period site coefficient Fa used, ASCE 7-16 §11.4.4, Table 11.4-1, with §11.4.8
    exception 1 (Site E, Ss >= 1.0 g: Site C's Fa), the §11.4.4 floor of 1.2 for the default
    Site D and 1.0 for Site B without measured shear-wave velocity (§11.4.3) [-]."""
    _check_basis(site_class, basis)
    if basis == "B_unmeasured_vs":
        return F_SITE_B_UNMEASURED
    value = Fa_table(Fa_row(site_class, Ss_g), Ss_g)
    if basis == "default_D":
        return max(value, FA_MIN_DEFAULT_D)
    return value


def Fv_table(site_class: str, S1_g: float) -> float:
    """Fv from Table 11.4-2 (Supplement No. 1) by straight-line interpolation, held constant
    beyond the ends (ASCE 7-16 §11.4.4; dimensionless, S1 in g)."""
    _check_site_class(site_class)
    if S1_g < 0:
        raise ValueError(f"S1 must be >= 0 g, got {S1_g}")
    if site_class == "F":
        raise _site_class_f_error("Fv")
    return interpolate_clamped(S1_g, TABLE_11_4_2_S1_G, TABLE_11_4_2_FV[site_class])


def Fv(site_class: str, S1_g: float, basis: str = "site_data") -> float:
    """Long-period site coefficient Fv used, ASCE 7-16 §11.4.4, Table 11.4-2 (Supplement No. 1);
    1.0 for Site B without measured shear-wave velocity (§11.4.3) [-].

    For Sites D and E at S1 >= 0.2 g the tabulated value carries footnote a (for TS only); the
    standard gives no other Fv for the §11.4.8 exceptions, so this value is also used for SD1
    (an assumption the workbook states where it acts)."""
    _check_basis(site_class, basis)
    if basis == "B_unmeasured_vs":
        return F_SITE_B_UNMEASURED
    return Fv_table(site_class, S1_g)


def fv_footnote_a(site_class: str, S1_g: float) -> bool:
    """True where the Fv cell carries Table 11.4-2 footnote a (Site D or E, S1 >= 0.2 g)."""
    return site_class in ("D", "E") and S1_g >= FV_FOOTNOTE_A_FROM_S1_G


def exception_1_applies(site_class: str, Ss_g: float) -> bool:
    """§11.4.8 exception 1: Site E with Ss >= 1.0 g (Fa of Site C)."""
    return site_class == "E" and Ss_g >= SS_SITE_E_STUDY_G


def exception_2_applies(site_class: str, S1_g: float) -> bool:
    """§11.4.8 exception 2: Site D with S1 >= 0.2 g (Cs modified, see elf.Cs_exception_2)."""
    return site_class == "D" and S1_g >= S1_SITE_D_E_STUDY_G


def exception_3_applies(site_class: str, S1_g: float) -> bool:
    """§11.4.8 exception 3: Site E with S1 >= 0.2 g (permitted only where T <= Ts, ELF)."""
    return site_class == "E" and S1_g >= S1_SITE_D_E_STUDY_G


def exception_3_met(T_s: float, Ts_s: float) -> bool:
    """§11.4.8 exception 3 condition T <= Ts (the ELF procedure is what latbook uses)."""
    return T_s <= Ts_s


def Ts(SDS_g: float, SD1_g: float) -> float:
    """Ts = SD1 / SDS, ASCE 7-16 §11.4.6 (s)."""
    if SDS_g <= 0:
        raise ValueError(f"SDS must be > 0 g, got {SDS_g}")
    return SD1_g / SDS_g


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
