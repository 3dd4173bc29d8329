"""Wind quantities: ASCE 7-16 ch. 26-27 Part 1 (MWFRS, directional procedure), both directions.

Direction "x" is wind acting in +x: the loaded walls face x, so the building width B (across
the wind) is the plan y-length and the depth L (along the wind) the plan x-length; "y" the
other way round. L and B for Fig. 27.3-1 are the largest plan dimensions over the levels; the
band forces use each level's own width. Story-force rule: see `latbook.engine.asce7_16.wind`.
"""

from __future__ import annotations

from typing import Any

from latbook.analysis.seismic import levels_top_down
from latbook.engine.asce7_16 import wind, wind_cases
from latbook.spec.models import Level, Spec

#: direction -> (axis along the wind, axis across the wind)
DIRECTION_AXES: dict[str, tuple[str, str]] = {"x": ("x", "y"), "y": ("y", "x")}


def plan_length_ft(level: Level, axis: str) -> float:
    """Plan extent of `level` along `axis` ("x" or "y"), ft."""
    plan = level.plan
    if axis == "x":
        return plan.x_max_ft - plan.x_min_ft
    return plan.y_max_ft - plan.y_min_ft


def wind_input_results(spec: Spec, out: dict[str, Any]) -> None:
    """The wind inputs, keyed by the ids of their Inputs cells."""
    w = spec.wind
    assert w is not None
    out["wind.V_mph"] = w.V_mph
    out["wind.exposure"] = w.exposure
    out["wind.Kzt"] = w.Kzt
    out["wind.Kd"] = w.Kd
    out["wind.ground_elevation_ft"] = w.ground_elevation_ft
    out["wind.use_Ke"] = w.use_Ke
    out["wind.G"] = w.G
    out["wind.enclosure"] = w.enclosure
    out["wind.mean_roof_height_ft"] = w.mean_roof_height_ft
    out["wind.parapet_height_ft"] = w.parapet_height_ft
    out["wind.roof_slope_deg"] = w.roof_slope_deg
    out["wind.roof_projection_above_h_ft"] = w.roof_projection_above_h_ft
    out["wind.torsional_load_cases"] = w.torsional_load_cases


def torsional_cases_apply(spec: Spec) -> bool:
    """True when the diaphragms take Load Cases 2 and 4 of ASCE 7-16 Fig. 27.3-8: chosen, or
    by Appendix D, D1.1 for a building it does not exempt (every diaphragm flexible here)."""
    w = spec.wind
    if w is None:
        return False
    if w.torsional_load_cases == "all_cases":
        return True
    if w.torsional_load_cases == "cases_1_and_3":
        return False
    n = len(spec.building.levels)
    return not wind_cases.torsional_cases_exempt(n, w.mean_roof_height_ft, True)


def wind_results(spec: Spec, out: dict[str, Any]) -> None:
    """Every wind quantity id -> value; nothing when the spec has no wind block."""
    if spec.wind is None:
        return
    wind_input_results(spec, out)
    for direction in DIRECTION_AXES:
        direction_results(spec, direction, out)


def direction_results(spec: Spec, direction: str, out: dict[str, Any]) -> None:
    """Parameters, band pressures, level forces and Case 2 torsion for one wind direction."""
    w = spec.wind
    assert w is not None
    along, across = DIRECTION_AXES[direction]
    levels = levels_top_down(spec)
    z_ft = [lv.elevation_ft for lv in levels]
    B_ft = [plan_length_ft(lv, across) for lv in levels]
    L_ft = [plan_length_ft(lv, along) for lv in levels]
    h_ft, hp_ft = w.mean_roof_height_ft, w.parapet_height_ft
    exposure = wind.EXPOSURE_CONSTANTS[w.exposure]
    Ke = wind.Ke_used(w.ground_elevation_ft, take_Ke_as_1=not w.use_Ke)
    Kz_h = wind.Kz(h_ft, w.exposure)
    L_over_B = max(L_ft) / max(B_ft)
    Cp_lw = wind.Cp_leeward(L_over_B)
    lb_rows = wind.LEEWARD_L_OVER_B
    LB_used = min(max(L_over_B, lb_rows[0]), lb_rows[-1])
    lb_col = min(sum(1 for r in lb_rows if r <= LB_used), len(lb_rows) - 1)
    qh_psf = wind.qz(Kz_h, w.Kzt, w.Kd, Ke, w.V_mph)
    q: dict[str, Any] = {
        "V_mph": w.V_mph,
        "exposure": w.exposure,
        "Kzt": w.Kzt,
        "Kd": w.Kd,
        "G": w.G,
        "h_ft": h_ft,
        "alpha": exposure.alpha,
        "zg_ft": exposure.zg_ft,
        "Ke": Ke,
        "Kz_h": Kz_h,
        "qh_psf": qh_psf,
        "L_ft": max(L_ft),
        "B_ft": max(B_ft),
        "L_over_B": L_over_B,
        "Cp_windward": wind.CP_WINDWARD,
        "Cp_lw_LB": LB_used,
        "Cp_lw_col": lb_col,
        "Cp_lw_lo": wind.LEEWARD_CP[lb_col - 1],
        "Cp_lw_hi": wind.LEEWARD_CP[lb_col],
        "Cp_leeward": Cp_lw,
        "p_leeward_psf": wind.wall_pressure(qh_psf, w.G, Cp_lw),
    }
    forces = wind.level_forces(
        z_ft, B_ft, h_ft, L_over_B, w.exposure, w.V_mph, w.Kzt, Ke, w.Kd, w.G, hp_ft
    )
    # Shown even with no parapet (h_p = 0 gives F = 0), so the cell stays live in the workbook.
    parapet = wind.parapet_force(h_ft, hp_ft, B_ft[0], w.exposure, w.V_mph, w.Kzt, Ke, w.Kd)
    q["hp_ft"] = hp_ft
    q["parapet_z_top_ft"] = parapet["z_top_ft"]
    q["parapet_Kz"] = parapet["Kz_top"]
    q["parapet_qp_psf"] = parapet["qp_psf"]
    q["parapet_p_windward_psf"] = parapet["p_windward_psf"]
    q["parapet_p_leeward_psf"] = parapet["p_leeward_psf"]
    q["parapet_p_net_psf"] = parapet["p_net_psf"]
    q["parapet_width_ft"] = B_ft[0]
    q["parapet_F_kip"] = parapet["F_kip"]
    q["parapet_z_centroid_ft"] = parapet["z_centroid_ft"]
    F_level = [f["F_kip"] + f["F_parapet_kip"] for f in forces]
    shears = wind.story_shears(F_level)
    q["V_base_kip"] = shears[-1]
    q["M_base_kipft"] = wind.base_overturning_kipft(
        [f["F_kip"] for f in forces], z_ft, parapet["F_kip"], parapet["z_centroid_ft"]
    )
    hr_ft = w.roof_projection_above_h_ft
    F_min, M_min = [], []
    for i, f in enumerate(forces):
        band = wind_cases.minimum_case_force_kip(f["z_hi_ft"] - f["z_lo_ft"], f["width_ft"])
        F_i, M_i = band, band * f["z_ft"]
        if i == 0:
            F_par = wind_cases.minimum_case_force_kip(hp_ft, f["width_ft"])
            F_roof = wind_cases.minimum_case_force_kip(0.0, f["width_ft"], hr_ft)
            F_i += F_par + F_roof
            M_i += F_par * (h_ft + hp_ft / 2.0) + F_roof * (h_ft + hr_ft / 2.0)
        F_min.append(F_i)
        M_min.append(M_i)
    shears_min = wind.story_shears(F_min)
    q["V_base_min_kip"] = shears_min[-1]
    q["M_base_min_kipft"] = sum(M_min)
    q["base_case"] = (
        "computed pressures" if q["V_base_kip"] >= q["V_base_min_kip"] else "§27.1.5 minimum"
    )
    q["roof_L_ft"] = L_ft[0]
    q["roof_h_over_L"] = h_ft / L_ft[0]
    for zone in range(4):
        q[f"roof_Cp_{zone}"] = wind_cases.roof_zone_cp(q["roof_h_over_L"], zone)
    q.update(_torsion_and_roof_parameters(spec))
    for key, value in q.items():
        out[f"wind.{direction}.{key}"] = value

    rows = zip(levels, forces, shears, L_ft, F_min, shears_min, M_min, strict=True)
    for level, f, V_kip, L_i, F_min_kip, V_min_kip, M_min_kipft in rows:
        F_case1_kip = f["F_kip"] + f["F_parapet_kip"]
        row: dict[str, Any] = {
            "z_ft": f["z_ft"],
            "z_lo_ft": f["z_lo_ft"],
            "z_hi_ft": f["z_hi_ft"],
            "Kz": f["Kz_top"],
            "qz_psf": f["qz_top_psf"],
            "p_windward_psf": f["p_windward_psf"],
            "p_leeward_psf": f["p_leeward_psf"],
            "p_net_psf": f["p_net_psf"],
            "w_plf": f["w_plf"],
            "B_ft": f["width_ft"],
            "L_ft": L_i,
            "F_pressure": f["F_kip"],
            "F_parapet": f["F_parapet_kip"],
            "F_level": F_case1_kip,
            "V_story": V_kip,
            "M_contrib": f["F_kip"] * f["z_ft"],
            "F_min": F_min_kip,
            "V_story_min": V_min_kip,
            "M_contrib_min": M_min_kipft,
            "F_case1": F_case1_kip,
            "F_case2": wind.case2_force(F_case1_kip),
            "e_case2_ft": wind.case2_eccentricity_ft(f["width_ft"]),
            "MT_case2": wind.case2_torsion(F_case1_kip, f["width_ft"]),
            "F_case3": wind_cases.CASE_2_3_FRACTION * F_case1_kip,
            "F_case4": wind_cases.CASE_4_FRACTION * F_case1_kip,
            "MT_case4": wind_cases.CASE_4_FRACTION
            * F_case1_kip
            * wind_cases.ECCENTRICITY_FRACTION
            * f["width_ft"],
        }
        for key, value in row.items():
            out[f"wind.{direction}.level.{level.id}.{key}"] = value


def _torsion_and_roof_parameters(spec: Spec) -> dict[str, Any]:
    """Appendix D, D1.1 test and the Table 26.13-1 GCpi (the same on both Wind sheets)."""
    w = spec.wind
    assert w is not None
    n = len(spec.building.levels)
    exempt = wind_cases.torsional_cases_exempt(n, w.mean_roof_height_ft, True)
    return {
        "n_stories": n,
        "D1_one_story": "yes" if n == 1 and w.mean_roof_height_ft <= 30.0 else "no",
        "D1_two_story_flexible": "yes" if n <= 2 else "no",
        "D1_exempt": "yes" if exempt else "no",
        "torsion_applied": "yes" if torsional_cases_apply(spec) else "no",
        "GCpi": wind_cases.GCPI_BY_ENCLOSURE[w.enclosure],
    }
