"""ASCE 7-16 §12.10.2.1: the force a collector line is designed for, and the Ω0 it uses.

Every function takes line forces already multiplied by their combination's lateral factor
(Fac_E = 0.7ρ / 1.0ρ, Fac_E_dia with ρ = 1.0 per §12.3.4.1, Fac_Em = 0.7Ω0 / Ω0) [lb].
Table 12.2-1 entries and footnote g are typed from memory (see the tests for the source notes).
"""

from __future__ import annotations

#: ASCE 7-16 Table 12.2-1 light-frame shear-wall systems for which §12.10.2.1 Exception 1
#: ("structures or portions thereof braced entirely by light-frame shear walls") is taken by
#: default: A.15 light-frame (wood) walls sheathed with wood structural panels rated for shear
#: resistance; A.16 light-frame (cold-formed steel) walls sheathed with wood structural panels
#: or steel sheets; A.17 light-frame walls with shear panels of all other materials; B.22, B.23,
#: B.24 the same three as building frame systems. (A.18, flat-strap bracing, is not a sheathed
#: shear wall and is not included; the designer may still declare the exception.)
LIGHT_FRAME_SHEAR_WALL_ENTRIES: frozenset[str] = frozenset(
    {"A.15", "A.16", "A.17", "B.22", "B.23", "B.24"}
)

#: Table 12.2-1 footnote g: Ω0 may be reduced by this much with flexible diaphragms where the
#: tabulated Ω0 is at least OMEGA0_REDUCTION_MIN.
OMEGA0_FLEXIBLE_REDUCTION = 0.5
OMEGA0_REDUCTION_MIN = 2.5


def light_frame_exception_default(entry: str) -> bool:
    """True where §12.10.2.1 Exception 1 applies by default: the system is one of the
    light-frame shear-wall entries of Table 12.2-1 (ASCE 7-16)."""
    return entry in LIGHT_FRAME_SHEAR_WALL_ENTRIES


def omega0_used(Omega0: float, flexible_reduction: bool) -> float:
    """Ω0 applied: tabulated, or Ω0 - 0.5 with flexible diaphragms where Ω0 >= 2.5, ASCE 7-16
    Table 12.2-1 footnote g [-]."""
    if flexible_reduction:
        if Omega0 < OMEGA0_REDUCTION_MIN:
            raise ValueError("Table 12.2-1 footnote g applies only where Ω0 >= 2.5")
        return Omega0 - OMEGA0_FLEXIBLE_REDUCTION
    return Omega0


def collector_force_basic_lb(E_Fx_lb: float, E_Fpx_lb: float) -> float:
    """Collector force without overstrength: the larger of the factored line force from the
    story forces F_x and from the diaphragm force F_px (ρ = 1.0), ASCE 7-16 §12.10.2.1
    Exception 1 (forces of §12.10.1.1 with the §12.4.2 combinations) or SDC B [lb]."""
    return max(E_Fx_lb, E_Fpx_lb)


def collector_force_overstrength_lb(
    Em_Fx_lb: float, Em_Fpx_eq_lb: float, Em_Fpx_max_lb: float, E_Fpx_min_lb: float
) -> float:
    """Collector force in SDC C-F, ASCE 7-16 §12.10.2.1: the largest of (1) Ω0 x the ELF line
    force, (2) Ω0 x the Eq. 12.10-1 line force, (3) the Eq. 12.10-2 line force with the §12.4.2
    combinations; by Exception 2, (1) and (2) need not exceed Ω0 x the Eq. 12.10-3 line force
    [lb]."""
    items_1_2 = min(max(Em_Fx_lb, Em_Fpx_eq_lb), Em_Fpx_max_lb)
    return max(items_1_2, E_Fpx_min_lb)
