"""ASCE 7-16 §1.5.1, Table 1.5-2: seismic importance factor Ie by risk category.

Values from memory (ASCE 7-16 Table 1.5-2).
"""

RISK_CATEGORIES: tuple[str, ...] = ("I", "II", "III", "IV")

#: Seismic importance factor Ie by risk category (dimensionless).
TABLE_1_5_2_IE: dict[str, float] = {"I": 1.00, "II": 1.00, "III": 1.25, "IV": 1.50}


def check_risk_category(risk_category: str) -> str:
    """Return the risk category unchanged, or raise ValueError if it is not I, II, III or IV."""
    if risk_category not in RISK_CATEGORIES:
        raise ValueError(f"risk category must be one of {RISK_CATEGORIES}, got {risk_category!r}")
    return risk_category


def Ie_seismic(risk_category: str) -> float:
    """Seismic importance factor Ie, ASCE 7-16 Table 1.5-2 (dimensionless)."""
    return TABLE_1_5_2_IE[check_risk_category(risk_category)]
