"""ASCE 7-16 §2.3 / §2.4 load combinations that govern lateral design, with §12.4 seismic forms.

Seismic load effect (§12.4.2): E = E_h +/- E_v, E_h = rho Q_E (Eq. 12.4-3), E_v = 0.2 S_DS D
(Eq. 12.4-4a). With overstrength (§12.4.3): E_mh = Omega_0 Q_E (Eq. 12.4-7) replaces E_h.
Substituting E_v into the basic combinations gives the dead-load factors used here:

* ASD §2.4.1 / §2.4.5: D + 0.6W (5); 0.6D + 0.6W (7); (1.0 + 0.14 S_DS)D + 0.7 rho Q_E (8);
  (0.6 - 0.14 S_DS)D + 0.7 rho Q_E (10); the same two with 0.7 Omega_0 Q_E for overstrength.
* LRFD §2.3.1 / §2.3.6: 1.2D + 1.0W + L + 0.5(Lr or S or R) (4); 0.9D + 1.0W (5);
  (1.2 + 0.2 S_DS)D + 1.0 rho Q_E + L + 0.2S (6); (0.9 - 0.2 S_DS)D + 1.0 rho Q_E (7); the same two
  with Omega_0 Q_E for overstrength.

Live and snow terms are named in the combination strings only; the lateral engine carries D, W
and Q_E. §12.4.3.3 permits a 1.2 allowable-stress increase with the ASD overstrength forms (not
applied here).
"""

import math
from dataclasses import dataclass

METHODS: tuple[str, ...] = ("ASD", "LRFD")

#: ASCE 7-16 §12.3.4: the redundancy factor rho is either 1.0 or 1.3.
REDUNDANCY_FACTORS: tuple[float, ...] = (1.0, 1.3)


@dataclass(frozen=True)
class LoadCombination:
    """One combination as factors on D, W and Q_E (ASCE 7-16 §2.3 / §2.4 with §12.4)."""

    name: str
    D_factor: float
    W_factor: float
    QE_factor: float


@dataclass(frozen=True)
class LateralFactors:
    """Lateral-design load factors of one method (ASCE 7-16 §2.3.1, §2.3.6, §2.4.1, §2.4.5)."""

    method: str
    wind_lateral: float
    wind_dead_additive: float
    wind_dead_resisting: float
    seismic_lateral: float
    seismic_dead_additive: float
    seismic_dead_resisting: float
    overstrength_lateral: float
    wind_additive_name: str
    wind_resisting_name: str
    seismic_additive_name: str
    seismic_resisting_name: str
    overstrength_additive_name: str
    overstrength_resisting_name: str

    def combinations(self) -> list[LoadCombination]:
        """The six lateral combinations as LoadCombination rows (ASCE 7-16 §2.3 / §2.4)."""
        return [
            LoadCombination(
                self.wind_additive_name, self.wind_dead_additive, self.wind_lateral, 0.0
            ),
            LoadCombination(
                self.wind_resisting_name, self.wind_dead_resisting, self.wind_lateral, 0.0
            ),
            LoadCombination(
                self.seismic_additive_name, self.seismic_dead_additive, 0.0, self.seismic_lateral
            ),
            LoadCombination(
                self.seismic_resisting_name, self.seismic_dead_resisting, 0.0, self.seismic_lateral
            ),
            LoadCombination(
                self.overstrength_additive_name,
                self.seismic_dead_additive,
                0.0,
                self.overstrength_lateral,
            ),
            LoadCombination(
                self.overstrength_resisting_name,
                self.seismic_dead_resisting,
                0.0,
                self.overstrength_lateral,
            ),
        ]


def validate_redundancy_factor(rho: float) -> float:
    """Return rho if it is 1.0 or 1.3, else raise ValueError (ASCE 7-16 §12.3.4, dimensionless)."""
    for allowed in REDUNDANCY_FACTORS:
        if math.isclose(rho, allowed, abs_tol=1e-9):
            return allowed
    raise ValueError(f"redundancy factor rho must be 1.0 or 1.3 (ASCE 7-16 §12.3.4), got {rho}")


def validate_method(method: str) -> str:
    """Return "ASD" or "LRFD" (any case in), else raise ValueError (ASCE 7-16 §2.3 / §2.4)."""
    normalized = method.strip().upper()
    if normalized not in METHODS:
        raise ValueError(f"method must be one of {METHODS}, got {method!r}")
    return normalized


def Eh(rho: float, QE: float) -> float:
    """Horizontal seismic load effect E_h = rho Q_E, ASCE 7-16 Eq. 12.4-3 (units of Q_E)."""
    return validate_redundancy_factor(rho) * QE


def Ev(SDS_g: float, D: float) -> float:
    """Vertical seismic load effect E_v = 0.2 S_DS D, ASCE 7-16 Eq. 12.4-4a (units of D)."""
    return 0.2 * SDS_g * D


def Emh(Omega0: float, QE: float) -> float:
    """Horizontal seismic effect with overstrength E_mh = Omega_0 Q_E, ASCE 7-16 Eq. 12.4-7."""
    return Omega0 * QE


def number_text(x: float) -> str:
    """A factor as the workbook prints it in a combination's name, TEXT(x, "0.0#"): two
    decimals with one trailing zero dropped ("3.0", "2.5", "2.25")."""
    text = f"{x:.2f}"
    return text[:-1] if text.endswith("0") else text


def rho_text(rho: float) -> str:
    """ρ as printed in a combination's name: "1.0" or "1.3" (ASCE 7-16 §12.3.4)."""
    return "1.3" if math.isclose(validate_redundancy_factor(rho), 1.3) else "1.0"


def _asd_factors(SDS_g: float, rho: float, Omega0: float) -> LateralFactors:
    r, om = rho_text(rho), number_text(Omega0)
    return LateralFactors(
        method="ASD",
        wind_lateral=0.6,
        wind_dead_additive=1.0,
        wind_dead_resisting=0.6,
        seismic_lateral=0.7 * rho,
        seismic_dead_additive=1.0 + 0.14 * SDS_g,
        seismic_dead_resisting=0.6 - 0.14 * SDS_g,
        overstrength_lateral=0.7 * Omega0,
        wind_additive_name="ASD D + 0.6W (ASCE 7-16 §2.4.1, comb. 5)",
        wind_resisting_name="ASD 0.6D + 0.6W (ASCE 7-16 §2.4.1, comb. 7)",
        seismic_additive_name=(
            f"ASD (1.0 + 0.14SDS)D + 0.7ρQE, ρ = {r} (ASCE 7-16 §2.4.5, comb. 8; §12.4.2)"
        ),
        seismic_resisting_name=(
            f"ASD (0.6 - 0.14SDS)D + 0.7ρQE, ρ = {r} (ASCE 7-16 §2.4.5, comb. 10; §12.4.2)"
        ),
        overstrength_additive_name=(
            f"ASD (1.0 + 0.14SDS)D + 0.7Ω0QE, Ω0 = {om} (ASCE 7-16 §2.4.5, comb. 8 with Em; "
            "§12.4.3)"
        ),
        overstrength_resisting_name=(
            f"ASD (0.6 - 0.14SDS)D + 0.7Ω0QE, Ω0 = {om} (ASCE 7-16 §2.4.5, comb. 10 with Em; "
            "§12.4.3)"
        ),
    )


def _lrfd_factors(SDS_g: float, rho: float, Omega0: float) -> LateralFactors:
    r, om = rho_text(rho), number_text(Omega0)
    return LateralFactors(
        method="LRFD",
        wind_lateral=1.0,
        wind_dead_additive=1.2,
        wind_dead_resisting=0.9,
        seismic_lateral=1.0 * rho,
        seismic_dead_additive=1.2 + 0.2 * SDS_g,
        seismic_dead_resisting=0.9 - 0.2 * SDS_g,
        overstrength_lateral=Omega0,
        wind_additive_name="LRFD 1.2D + 1.0W + L + 0.5(Lr or S or R) (ASCE 7-16 §2.3.1, comb. 4)",
        wind_resisting_name="LRFD 0.9D + 1.0W (ASCE 7-16 §2.3.1, comb. 5)",
        seismic_additive_name=(
            f"LRFD (1.2 + 0.2SDS)D + 1.0ρQE + L + 0.2S, ρ = {r} (ASCE 7-16 §2.3.6, comb. 6; "
            "§12.4.2)"
        ),
        seismic_resisting_name=(
            f"LRFD (0.9 - 0.2SDS)D + 1.0ρQE, ρ = {r} (ASCE 7-16 §2.3.6, comb. 7; §12.4.2)"
        ),
        overstrength_additive_name=(
            f"LRFD (1.2 + 0.2SDS)D + Ω0QE + L + 0.2S, Ω0 = {om} (ASCE 7-16 §2.3.6, comb. 6 "
            "with Em; §12.4.3)"
        ),
        overstrength_resisting_name=(
            f"LRFD (0.9 - 0.2SDS)D + Ω0QE, Ω0 = {om} (ASCE 7-16 §2.3.6, comb. 7 with Em; §12.4.3)"
        ),
    )


def lateral_factors(method: str, SDS_g: float, rho: float, Omega0: float) -> LateralFactors:
    """Load factors on D, W and Q_E for "ASD" or "LRFD", ASCE 7-16 §2.3.1/§2.3.6/§2.4.1/§2.4.5.

    S_DS in g; rho per §12.3.4 (1.0 or 1.3); Omega_0 from Table 12.2-1.
    """
    normalized = validate_method(method)
    rho = validate_redundancy_factor(rho)
    if SDS_g < 0.0:
        raise ValueError(f"SDS must be >= 0 g, got {SDS_g}")
    if Omega0 <= 0.0:
        raise ValueError(f"Omega0 must be > 0, got {Omega0}")
    if normalized == "ASD":
        return _asd_factors(SDS_g, rho, Omega0)
    return _lrfd_factors(SDS_g, rho, Omega0)


@dataclass(frozen=True)
class GravityLateralCombination:
    """A combination with live and roof/snow loads and a reduced lateral term, the one that
    bounds end-post compression with gravity (ASCE 7-16 §2.3.1, §2.3.6, §2.4.1, §2.4.5)."""

    name: str
    lateral: float
    D: float
    L: float
    Lr: float
    S: float


def gravity_lateral_combination(
    method: str, source: str, SDS_g: float = 0.0, rho: float = 1.0
) -> GravityLateralCombination:
    """ASD D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R) (§2.4.1 comb. 6a) and
    (1.0 + 0.105SDS)D + 0.525ρQE + 0.75L + 0.75(Lr or S or R) (§2.4.5 comb. 9); LRFD
    1.2D + 1.0W + L + 0.5(Lr or S or R) (§2.3.1 comb. 4) and (1.2 + 0.2SDS)D + ρQE + L + 0.2S
    (§2.3.6 comb. 6); source "wind" or "seis". The 0.5L exception is not taken."""
    m = validate_method(method)
    if source == "wind":
        if m == "ASD":
            name = "ASD D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R) (ASCE 7-16 §2.4.1, comb. 6a)"
            return GravityLateralCombination(name, 0.45, 1.0, 0.75, 0.75, 0.75)
        name = "LRFD 1.2D + 1.0W + L + 0.5(Lr or S or R) (ASCE 7-16 §2.3.1, comb. 4)"
        return GravityLateralCombination(name, 1.0, 1.2, 1.0, 0.5, 0.5)
    r = validate_redundancy_factor(rho)
    if m == "ASD":
        name = (
            "ASD (1.0 + 0.105SDS)D + 0.525ρQE + 0.75L + 0.75(Lr or S or R), ρ = "
            f"{rho_text(r)} (ASCE 7-16 §2.4.5, comb. 9)"
        )
        return GravityLateralCombination(name, 0.525 * r, 1.0 + 0.105 * SDS_g, 0.75, 0.75, 0.75)
    name = (
        f"LRFD (1.2 + 0.2SDS)D + 1.0ρQE + L + 0.2S, ρ = {rho_text(r)} (ASCE 7-16 §2.3.6, comb. 6)"
    )
    return GravityLateralCombination(name, r, 1.2 + 0.2 * SDS_g, 1.0, 0.0, 0.2)
