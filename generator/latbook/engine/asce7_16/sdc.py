"""ASCE 7-16 §11.6: seismic design category from SDS, SD1 and S1.

Thresholds and categories from memory (ASCE 7-16 Tables 11.6-1 and 11.6-2, §11.6).
Not implemented: the §11.6 permission to use Table 11.6-1 alone where S1 < 0.75 and all four
of its conditions are met, and the §11.1.2 / §11.4.1 shortcuts to SDC A.
"""

from latbook.engine.asce7_16.importance import check_risk_category

#: Lower bounds (g) of the 2nd, 3rd and 4th rows of Table 11.6-1 (SDS < 0.167 is the 1st row).
TABLE_11_6_1_SDS_BOUNDS_G: tuple[float, ...] = (0.167, 0.33, 0.50)

#: Lower bounds (g) of the 2nd, 3rd and 4th rows of Table 11.6-2 (SD1 < 0.067 is the 1st row).
TABLE_11_6_2_SD1_BOUNDS_G: tuple[float, ...] = (0.067, 0.133, 0.20)

#: Category per row (1st..4th) for risk categories I, II, III and for IV; same in both tables.
SDC_BY_ROW: dict[str, tuple[str, ...]] = {
    "I": ("A", "B", "C", "D"),
    "II": ("A", "B", "C", "D"),
    "III": ("A", "B", "C", "D"),
    "IV": ("A", "C", "D", "D"),
}

#: S1 (g) at or above which §11.6 assigns SDC E (risk category I-III) or F (IV).
S1_SDC_E_OR_F_G = 0.75

SDC_ORDER: tuple[str, ...] = ("A", "B", "C", "D", "E", "F")


def _row(value_g: float, bounds_g: tuple[float, ...]) -> int:
    return sum(1 for bound in bounds_g if value_g >= bound)


def sdc_short_period(SDS_g: float, risk_category: str) -> str:
    """SDC from the short-period response, ASCE 7-16 §11.6, Table 11.6-1 (SDS in g)."""
    check_risk_category(risk_category)
    return SDC_BY_ROW[risk_category][_row(SDS_g, TABLE_11_6_1_SDS_BOUNDS_G)]


def sdc_one_second(SD1_g: float, risk_category: str) -> str:
    """SDC from the 1-s period response, ASCE 7-16 §11.6, Table 11.6-2 (SD1 in g)."""
    check_risk_category(risk_category)
    return SDC_BY_ROW[risk_category][_row(SD1_g, TABLE_11_6_2_SD1_BOUNDS_G)]


def seismic_design_category(SDS_g: float, SD1_g: float, S1_g: float, risk_category: str) -> str:
    """Seismic design category, ASCE 7-16 §11.6: E/F where S1 >= 0.75 g, else the more severe."""
    check_risk_category(risk_category)
    if S1_g >= S1_SDC_E_OR_F_G:
        return "F" if risk_category == "IV" else "E"
    by_short = sdc_short_period(SDS_g, risk_category)
    by_one_second = sdc_one_second(SD1_g, risk_category)
    return max(by_short, by_one_second, key=SDC_ORDER.index)
