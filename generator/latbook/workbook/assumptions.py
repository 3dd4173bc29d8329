"""The seismic options, assumptions and designer's declarations a spec makes, as plain
sentences for the Cover (the Summary sheet shows the same points as live formulas)."""

from __future__ import annotations

from latbook.engine.asce7_16 import site
from latbook.spec.models import Spec

BASIS_TEXT = {
    "site_data": "site class from site data (ASCE 7-16 ch. 20)",
    "default_D": "Site D as the §11.4.3 default (soil not known): Fa not less than 1.2",
    "B_unmeasured_vs": "Site B without measured shear-wave velocity: Fa = Fv = 1.0 (§11.4.3)",
}
RHO_TEXT = {
    "typed": "rho typed by the designer: an override of §12.3.4.2",
    "removal_test": "rho by §12.3.4.2 (a), the Table 12.3-3 removal test",
    "perimeter_bays": "rho by §12.3.4.2 (b), two perimeter bays (2 L / hsx per wall) each side",
}
STIFFNESS_SCREEN = (
    "soft-story screen: stiffness from the bending and shear terms of SDPWS Eq. 4.3-1 "
    "(anchorage slip left out)"
)
DECLARED = {
    "torsional_1a": "1a torsional",
    "extreme_torsional_1b": "1b extreme torsional",
    "diaphragm_discontinuity_3": "H3 diaphragm discontinuity",
    "vertical_geometric_3": "V3 vertical geometric",
}


def seismic_basis_lines(spec: Spec) -> list[str]:
    """One sentence per option or assumption; empty without seismic."""
    s = spec.seismic
    if s is None:
        return []
    lines: list[str] = []
    gm = s.ground_motion
    if gm.method == "site_class":
        sc = gm.site_class
        lines.append(f"Site class {sc}: {BASIS_TEXT[gm.site_class_basis]}")
        if site.exception_1_applies(sc, gm.Ss_g):
            lines.append("§11.4.8 exception 1: Site E, Ss >= 1.0 g, Fa of Site C")
        if site.exception_2_applies(sc, gm.S1_g):
            lines.append("§11.4.8 exception 2: Site D, S1 >= 0.2 g, Cs per the exception")
        if site.exception_3_applies(sc, gm.S1_g):
            lines.append("§11.4.8 exception 3: Site E, S1 >= 0.2 g, T <= Ts with ELF")
        if site.fv_footnote_a(sc, gm.S1_g):
            lines.append(
                "assumption: the Table 11.4-2 Fv (footnote a: for TS) is used for SD1 as well"
            )
        if sc == "E" and 0.75 < gm.Ss_g < 1.0:
            lines.append("assumption: Site E, 0.75 < Ss < 1.0 g, Fa held at 1.3")
    else:
        lines.append("SDS and SD1 given directly (e.g. from a site-specific study)")
    if s.limit_Ss_for_Cs:
        lines.append("§12.8.1.3 taken: Ss = 1.5 g for Cs (Ev keeps the full SDS)")
    lines.append(RHO_TEXT[s.rho_method])
    if s.rho_method != "typed":
        lines.append("one rho for both directions, the larger")
    if spec.wall_lines:
        decl = s.declared_irregularities
        present = [text for field, text in DECLARED.items() if getattr(decl, field)]
        lines.append(
            "declared by the designer: "
            + (", ".join(present) + " present" if present else "no 1a, 1b, H3 or V3 irregularity")
        )
        lines.append(STIFFNESS_SCREEN)
    takeoff = [lv.id for lv in spec.building.levels if lv.weight_takeoff is not None]
    if takeoff:
        lines.append(
            f"seismic weight taken off for {', '.join(takeoff)} (walls: half the story below "
            "and above, parapet to the roof); typed for the other levels"
        )
    return lines
