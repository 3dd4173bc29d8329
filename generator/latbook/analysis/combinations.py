"""Load-combination quantities: ASCE 7-16 §2.3 / §2.4 with §12.4, and the SDPWS capacity factor.

Runs after the seismic step (the seismic dead-load factors need SDS, read from `out`). Wind
factors exist only with a wind block, seismic ones only with a seismic block; the capacity
factor always.
"""

from __future__ import annotations

from typing import Any

from latbook.engine.asce7_16 import collectors, combinations
from latbook.engine.sdpws import capacity
from latbook.spec.models import Spec

#: Which combination each later check applies: (use id, check, combination key, lateral factor,
#: dead-load factor, clause, load source). Keys are `combo.<key>` quantities and defined names.
COMBINATION_USES: tuple[tuple[str, str, str, str, str, str, str], ...] = (
    (
        "W_shear",
        "Diaphragm and shear-wall unit shear, wind",
        "wind_additive",
        "Fac_W",
        "Fac_D_W_add",
        "ASCE 7-16 §2.3.1 / §2.4.1",
        "wind",
    ),
    (
        "W_uplift",
        "Hold-down tension and overturning, wind (dead load resisting)",
        "wind_resisting",
        "Fac_W",
        "Fac_D_W",
        "ASCE 7-16 §2.3.1 / §2.4.1",
        "wind",
    ),
    (
        "W_comp",
        "End-post compression, wind (D adding; with post L, Lr, S also comb. 6a / 4)",
        "wind_additive",
        "Fac_W",
        "Fac_D_W_add",
        "ASCE 7-16 §2.3.1 / §2.4.1",
        "wind",
    ),
    (
        "E_wall",
        "Shear-wall unit shear from Fx, seismic",
        "seismic_additive",
        "Fac_E",
        "Fac_D_E_add",
        "ASCE 7-16 §2.3.6 / §2.4.5, §12.4.2",
        "seismic",
    ),
    (
        "E_dia",
        "Diaphragm unit shear and chords from Fpx, seismic (rho = 1.0)",
        "seismic_additive_dia",
        "Fac_E_dia",
        "Fac_D_E_add",
        "ASCE 7-16 §12.3.4.1, §12.10.1.1",
        "seismic",
    ),
    (
        "E_uplift",
        "Hold-down tension and overturning, seismic (dead load resisting)",
        "seismic_resisting",
        "Fac_E",
        "Fac_D_E",
        "ASCE 7-16 §2.3.6 / §2.4.5, §12.4.2",
        "seismic",
    ),
    (
        "E_coll",
        "Collectors and their connections (overstrength, where §12.10.2.1 requires it)",
        "overstrength_additive",
        "Fac_Em",
        "Fac_D_E_add",
        "ASCE 7-16 §12.10.2.1, §12.4.3",
        "seismic",
    ),
)


def combination_uses(spec: Spec) -> list[dict[str, str]]:
    """The rows of COMBINATION_USES whose load source the spec has, as dicts."""
    present = {"wind": spec.wind is not None, "seismic": spec.seismic is not None}
    fields = ("use", "check", "combination", "lateral", "dead", "clause", "source")
    return [dict(zip(fields, row, strict=True)) for row in COMBINATION_USES if present[row[6]]]


#: ASCE 7-16 §12.3.4.1: rho = 1.0 for diaphragm loads from Eq. 12.10-1 to 12.10-3.
RHO_DIAPHRAGM = 1.0


def cap_factor(method: str) -> float:
    """Nominal -> allowable (1/2.0) or design (0.80) unit shear, AWC SDPWS-2015 §4.2.3/§4.3.3."""
    if combinations.validate_method(method) == "ASD":
        return 1.0 / capacity.ASD_REDUCTION
    return capacity.LRFD_PHI


def combination_results(spec: Spec, out: dict[str, Any]) -> None:
    """Combination names and factors by id `combo.<name>`; the uses table `combo.use.<use>.*`."""
    method = spec.design_method
    q: dict[str, Any] = {"method": method, "Cap_factor": cap_factor(method)}
    if spec.wind is not None:
        f = combinations.lateral_factors(method, 0.0, 1.0, 1.0)  # wind terms need no SDS
        q["wind_additive"] = f.wind_additive_name
        q["wind_resisting"] = f.wind_resisting_name
        q["Fac_W"] = f.wind_lateral
        q["Fac_D_W_add"] = f.wind_dead_additive
        q["Fac_D_W"] = f.wind_dead_resisting
        g = combinations.gravity_lateral_combination(method, "wind")
        q.update(
            wind_gravity=g.name,
            Fac_W_g=g.lateral,
            Fac_D_W_g=g.D,
            Fac_L_W_g=g.L,
            Fac_Lr_W_g=g.Lr,
            Fac_S_W_g=g.S,
        )
    if spec.seismic is not None:
        SDS_g, rho = out["seismic.SDS"], out["seismic.rho"]
        Omega0 = collectors.omega0_used(
            spec.seismic.system.Omega0, spec.seismic.omega0_flexible_diaphragm_reduction
        )
        f = combinations.lateral_factors(method, SDS_g, rho, Omega0)
        f_dia = combinations.lateral_factors(method, SDS_g, RHO_DIAPHRAGM, Omega0)
        q["rho"] = rho
        q["SDS"] = SDS_g
        q["Omega0_used"] = Omega0
        q["seismic_additive"] = f.seismic_additive_name
        q["seismic_additive_dia"] = f_dia.seismic_additive_name
        q["seismic_resisting"] = f.seismic_resisting_name
        q["overstrength_additive"] = f.overstrength_additive_name
        q["overstrength_resisting"] = f.overstrength_resisting_name
        for m in ("ASD", "LRFD"):  # both methods' names, each on its own row
            fm = combinations.lateral_factors(m, SDS_g, rho, Omega0)
            fm_dia = combinations.lateral_factors(m, SDS_g, RHO_DIAPHRAGM, Omega0)
            tag = m.lower()
            q[f"seismic_additive_{tag}"] = fm.seismic_additive_name
            q[f"seismic_additive_dia_{tag}"] = fm_dia.seismic_additive_name
            q[f"seismic_resisting_{tag}"] = fm.seismic_resisting_name
            q[f"overstrength_additive_{tag}"] = fm.overstrength_additive_name
            q[f"overstrength_resisting_{tag}"] = fm.overstrength_resisting_name
            gm = combinations.gravity_lateral_combination(m, "seis", SDS_g, rho)
            q[f"seismic_gravity_{tag}"] = gm.name
        q["Fac_E"] = f.seismic_lateral
        q["Fac_E_dia"] = f_dia.seismic_lateral
        q["Fac_D_E_add"] = f.seismic_dead_additive
        q["Fac_D_E"] = f.seismic_dead_resisting
        q["Fac_Em"] = f.overstrength_lateral
        g = combinations.gravity_lateral_combination(method, "seis", SDS_g, rho)
        q.update(
            seismic_gravity=g.name,
            Fac_E_g=g.lateral,
            Fac_D_E_g=g.D,
            Fac_L_E_g=g.L,
            Fac_Lr_E_g=g.Lr,
            Fac_S_E_g=g.S,
        )
    for key, value in q.items():
        out[f"combo.{key}"] = value
    for use in combination_uses(spec):
        base = f"combo.use.{use['use']}"
        out[f"{base}.combination"] = q[use["combination"]]
        out[f"{base}.lateral"] = q[use["lateral"]]
        out[f"{base}.dead"] = q[use["dead"]]
