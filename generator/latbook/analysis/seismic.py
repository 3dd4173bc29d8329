"""Seismic quantities: ASCE 7-16 §11.4, §11.6, §12.8 (ELF) and §12.10 (Fpx)."""

from __future__ import annotations

from typing import Any

from latbook.engine.asce7_16 import diaphragm_force, elf, importance, sdc, site
from latbook.spec.models import Level, Spec


def levels_top_down(spec: Spec) -> list[Level]:
    """Levels ordered roof first (highest elevation first)."""
    return sorted(spec.building.levels, key=lambda lv: -lv.elevation_ft)


def seismic_results(spec: Spec, out: dict[str, Any]) -> None:
    """Every seismic quantity id -> value; nothing when the spec has no seismic block."""
    s = spec.seismic
    if s is None:
        return
    gm = s.ground_motion
    rc = spec.building.risk_category
    q: dict[str, Any] = {"S1": gm.S1_g}
    if gm.method == "site_class":
        q["Ss"] = gm.Ss_g
        q["site_class"] = gm.site_class
        q["Fa"] = site.Fa(gm.site_class, gm.Ss_g)
        q["Fv"] = site.Fv(gm.site_class, gm.S1_g)
        q["site_specific_flag"] = "no"  # the spec rules refuse the cases that need a study
        q["SMS"] = site.SMS(q["Fa"], gm.Ss_g)
        q["SM1"] = site.SM1(q["Fv"], gm.S1_g)
        q["SDS"] = site.SDS(q["SMS"])
        q["SD1"] = site.SD1(q["SM1"])
    else:
        q["SDS"], q["SD1"] = gm.SDS_g, gm.SD1_g
    q["system_label"] = s.system.label
    q["R"], q["Cd"], q["Omega0"] = s.system.R, s.system.Cd, s.system.Omega0
    q["table_12_2_1_entry"] = s.system.table_12_2_1_entry
    q["omega0_flexible_diaphragm_reduction"] = s.omega0_flexible_diaphragm_reduction
    q["rho"], q["structure_type"], q["TL"] = s.rho, s.structure_type, s.TL_s
    if s.T_computed_s is not None:
        q["T_computed"] = s.T_computed_s
    q["Ie"] = importance.Ie_seismic(rc)
    q["SDC_short"] = sdc.sdc_short_period(q["SDS"], rc)
    q["SDC_long"] = sdc.sdc_one_second(q["SD1"], rc)
    q["SDC"] = sdc.seismic_design_category(q["SDS"], q["SD1"], gm.S1_g, rc)

    levels = levels_top_down(spec)
    heights = [lv.elevation_ft for lv in levels]
    weights = [lv.seismic_weight_kip for lv in levels]
    q["Ct"], q["x"], _ = elf.STRUCTURE_TYPES[s.structure_type]
    q["hn"] = heights[0]
    q["Ta"] = elf.Ta(q["Ct"], q["hn"], q["x"])
    q["Cu"] = elf.Cu(q["SD1"])
    q["T"] = elf.period_used(q["Ta"], q["Cu"], s.T_computed_s)
    R, Ie, T = s.system.R, q["Ie"], q["T"]
    q["Cs_basic"] = elf.Cs_basic(q["SDS"], R, Ie)
    q["Cs_upper"] = elf.Cs_upper(q["SD1"], T, s.TL_s, R, Ie)
    q["Cs_min"] = elf.Cs_min(q["SDS"], Ie)
    q["Cs_near_fault"] = elf.Cs_min_near_fault(gm.S1_g, R, Ie)
    q["Cs"], q["Cs_governs"] = elf.Cs(q["SDS"], q["SD1"], gm.S1_g, T, s.TL_s, R, Ie)
    q["W"] = sum(weights)
    q["V"] = elf.base_shear(q["Cs"], q["W"])
    q["k"] = elf.k_exponent(T)
    dist = elf.vertical_distribution(weights, heights, q["V"], q["k"])
    shears = elf.story_shears(dist["Fx_kip"], heights)
    moments = elf.overturning_moments(dist["Fx_kip"], heights)
    q["M_base"] = elf.base_overturning_moment(dist["Fx_kip"], heights)
    for key, value in q.items():
        out[f"seismic.{key}"] = value

    for i, level in enumerate(levels):
        F_above, w_above = dist["Fx_kip"][: i + 1], weights[: i + 1]
        wpx = level.seismic_weight_kip
        fpx, governs = diaphragm_force.Fpx(F_above, w_above, wpx, q["SDS"], Ie)
        row = {
            "hx": level.elevation_ft,
            "wx": wpx,
            "wxhxk": dist["wx_hx_k"][i],
            "Cvx": dist["Cvx"][i],
            "Fx": dist["Fx_kip"][i],
            "Vx": shears[i],
            "Mx": moments[i],
            "sum_F": sum(F_above),
            "sum_w": sum(w_above),
            "wpx": wpx,
            "Fpx_eq": diaphragm_force.Fpx_eq_12_10_1(F_above, w_above, wpx),
            "Fpx_min": diaphragm_force.Fpx_min(q["SDS"], Ie, wpx),
            "Fpx_max": diaphragm_force.Fpx_max(q["SDS"], Ie, wpx),
            "Fpx": fpx,
            "Fpx_governs": governs,
        }
        for key, value in row.items():
            out[f"seismic.level.{level.id}.{key}"] = value
