"""Seismic quantities: ASCE 7-16 §11.4 (with Supplement No. 1), §11.6, §12.3 (irregularities,
rho), §12.7.2 (weights), §12.8 (ELF) and §12.10 (Fpx)."""

from __future__ import annotations

from typing import Any

from latbook.analysis.regularity import regularity_results
from latbook.analysis.weights import level_weights_kip
from latbook.engine.asce7_16 import diaphragm_force, elf, importance, sdc, site
from latbook.engine.errors import CodeLimitError
from latbook.spec.models import Level, SiteClassMotion, Spec

APPLIES, NOT_APPLICABLE = "applies", "does not apply"
DIRECT_TEXT = "not applicable (SDS and SD1 given directly)"
EXC3_MET = "applies: T <= Ts"
EXC3_NOT_MET = "NOT MET: T > Ts, site-specific study required"
SITE_STUDY_ADVICE = (
    "a site-specific ground motion hazard analysis is required (§21.2): give SDS and SD1 "
    "from it with ground_motion.method = direct"
)
FV_NOTE = "Fv (footnote a) also used for SD1: assumption"
YES, NO = "yes", "NO"
RHO_BASIS = {
    "typed": "typed by the designer (override)",
    "removal_test": "(a) removal test, Regularity sheet",
    "perimeter_bays": "(b) perimeter bays, Regularity sheet",
}


def levels_top_down(spec: Spec) -> list[Level]:
    """Levels ordered roof first (highest elevation first)."""
    return sorted(spec.building.levels, key=lambda lv: -lv.elevation_ft)


def _match(x: float, columns: tuple[float, ...]) -> int:
    """Spreadsheet MATCH(x, columns, 1): 1-based index of the last column <= x."""
    return sum(1 for c in columns if c <= x)


def site_results(gm: SiteClassMotion, q: dict[str, Any]) -> None:
    """Fa and Fv step by step as the Seismic sheet shows them (ASCE 7-16 §11.4.3, §11.4.4,
    Tables 11.4-1 and 11.4-2, §11.4.8 exception 1)."""
    sc, Ss, S1, basis = gm.site_class, gm.Ss_g, gm.S1_g, gm.site_class_basis
    q["Ss"], q["site_class"], q["site_class_basis"] = Ss, sc, basis
    row = site.Fa_row(sc, Ss)
    n_tab = len(site.tabulated_part(site.TABLE_11_4_1_SS_G, site.TABLE_11_4_1_FA[row])[0])
    q["Fa_row"] = row
    q["Fa_Ss"] = min(max(Ss, site.TABLE_11_4_1_SS_G[0]), site.TABLE_11_4_1_SS_G[n_tab - 1])
    q["Fa_col"] = min(_match(q["Fa_Ss"], site.TABLE_11_4_1_SS_G), n_tab - 1)
    q["Fa_lo"] = site.TABLE_11_4_1_FA[row][q["Fa_col"] - 1]
    q["Fa_hi"] = site.TABLE_11_4_1_FA[row][q["Fa_col"]]
    q["Fa_tab"] = site.Fa_table(row, Ss)
    q["Fa"] = site.Fa(sc, Ss, basis)
    cols = site.TABLE_11_4_2_S1_G
    q["Fv_S1"] = min(max(S1, cols[0]), cols[-1])
    q["Fv_col"] = min(_match(q["Fv_S1"], cols), len(cols) - 1)
    q["Fv_lo"] = site.TABLE_11_4_2_FV[sc][q["Fv_col"] - 1]
    q["Fv_hi"] = site.TABLE_11_4_2_FV[sc][q["Fv_col"]]
    q["Fv_tab"] = site.Fv_table(sc, S1)
    q["Fv"] = site.Fv(sc, S1, basis)
    q["Fv_note"] = FV_NOTE if site.fv_footnote_a(sc, S1) else "-"
    q["SMS"] = site.SMS(q["Fa"], Ss)
    q["SM1"] = site.SM1(q["Fv"], S1)
    q["SDS"] = site.SDS(q["SMS"])
    q["SD1"] = site.SD1(q["SM1"])
    q["exc1"] = APPLIES if site.exception_1_applies(sc, Ss) else NOT_APPLICABLE
    q["exc2"] = APPLIES if site.exception_2_applies(sc, S1) else NOT_APPLICABLE


def seismic_results(spec: Spec, out: dict[str, Any]) -> None:
    """Every seismic quantity id -> value; nothing when the spec has no seismic block."""
    s = spec.seismic
    if s is None:
        return
    gm = s.ground_motion
    rc = spec.building.risk_category
    q: dict[str, Any] = {"S1": gm.S1_g}
    by_class = gm.method == "site_class"
    if by_class:
        site_results(gm, q)
    else:
        q["SDS"], q["SD1"] = gm.SDS_g, gm.SD1_g
        q["exc1"] = q["exc2"] = q["exc3"] = DIRECT_TEXT
    q["system_label"] = s.system.label
    q["R"], q["Cd"], q["Omega0"] = s.system.R, s.system.Cd, s.system.Omega0
    q["table_12_2_1_entry"] = s.system.table_12_2_1_entry
    q["omega0_flexible_diaphragm_reduction"] = s.omega0_flexible_diaphragm_reduction
    q["rho_method"], q["structure_type"], q["TL"] = s.rho_method, s.structure_type, s.TL_s
    if s.T_computed_s is not None:
        q["T_computed"] = s.T_computed_s
    q["Ie"] = importance.Ie_seismic(rc)
    q["SDC_short"] = sdc.sdc_short_period(q["SDS"], rc)
    q["SDC_long"] = sdc.sdc_one_second(q["SD1"], rc)
    q["SDC"] = sdc.seismic_design_category(q["SDS"], q["SD1"], gm.S1_g, rc)

    levels = levels_top_down(spec)
    heights = [lv.elevation_ft for lv in levels]
    w_by_level = level_weights_kip(spec)
    weights = [w_by_level[lv.id] for lv in levels]
    q["Ct"], q["x"], _ = elf.STRUCTURE_TYPES[s.structure_type]
    q["hn"] = heights[0]
    q["Ta"] = elf.Ta(q["Ct"], q["hn"], q["x"])
    cu_rows = elf.TABLE_12_8_1_SD1_G
    q["Cu_SD1"] = min(max(q["SD1"], cu_rows[0]), cu_rows[-1])
    q["Cu_col"] = min(_match(q["Cu_SD1"], cu_rows), len(cu_rows) - 1)
    q["Cu_lo"] = elf.TABLE_12_8_1_CU[q["Cu_col"] - 1]
    q["Cu_hi"] = elf.TABLE_12_8_1_CU[q["Cu_col"]]
    q["Cu"] = elf.Cu(q["SD1"])
    q["T"] = T = elf.period_used(q["Ta"], q["Cu"], s.T_computed_s)
    q["Ts"] = site.Ts(q["SDS"], q["SD1"])
    if by_class:
        exc3 = site.exception_3_applies(gm.site_class, gm.S1_g)
        q["exc3"] = (
            (EXC3_MET if site.exception_3_met(T, q["Ts"]) else EXC3_NOT_MET)
            if exc3
            else (NOT_APPLICABLE)
        )
    q["k"] = elf.k_exponent(T)
    dist = elf.vertical_distribution(weights, heights, 1.0, q["k"])
    shares = [sum(dist["Cvx"][: i + 1]) for i in range(len(levels))]
    share_by_level = {lv.id: shares[i] for i, lv in enumerate(levels)}

    q["rho"] = regularity_results(spec, q["SDC"], share_by_level, w_by_level, out)
    q["rho_basis"] = RHO_BASIS[s.rho_method]
    q["rho_used"] = q["rho"]
    _ss_cap(spec, q, out)

    R, Ie = s.system.R, q["Ie"]
    q["Cs_basic"] = elf.Cs_basic(q["SDS_Cs"], R, Ie)
    q["Cs_upper"] = elf.Cs_upper(q["SD1"], T, s.TL_s, R, Ie)
    q["Cs_min"] = elf.Cs_min(q["SDS_Cs"], Ie)
    q["Cs_near_fault"] = elf.Cs_min_near_fault(gm.S1_g, R, Ie)
    exc2 = q["exc2"] == APPLIES
    if by_class:
        q["Cs_exc2"], branch = elf.Cs_exception_2(q["SDS_Cs"], q["SD1"], T, s.TL_s, R, Ie, q["Ts"])
        q["Cs_exc2_branch"] = branch if exc2 else NOT_APPLICABLE
    q["Cs_range"] = q["Cs_exc2"] if exc2 else min(q["Cs_basic"], q["Cs_upper"])
    if q["exc3"] == EXC3_NOT_MET:
        raise CodeLimitError(f"ASCE 7-16 §11.4.8 exception 3 {EXC3_NOT_MET}")
    q["Cs"], q["Cs_governs"] = elf.Cs(
        q["SDS_Cs"], q["SD1"], gm.S1_g, T, s.TL_s, R, Ie, q["Ts"] if exc2 else None
    )
    q["W"] = sum(weights)
    q["V"] = elf.base_shear(q["Cs"], q["W"])
    dist = elf.vertical_distribution(weights, heights, q["V"], q["k"])
    shears = elf.story_shears(dist["Fx_kip"], heights)
    moments = elf.overturning_moments(dist["Fx_kip"], heights)
    q["M_base"] = elf.base_overturning_moment(dist["Fx_kip"], heights)
    for key, value in q.items():
        out[f"seismic.{key}"] = value

    for i, level in enumerate(levels):
        F_above, w_above = dist["Fx_kip"][: i + 1], weights[: i + 1]
        wpx = weights[i]
        fpx, governs = diaphragm_force.Fpx(F_above, w_above, wpx, q["SDS"], Ie)
        row = {
            "hx": level.elevation_ft,
            "wx": wpx,
            "wxhxk": dist["wx_hx_k"][i],
            "Cvx": dist["Cvx"][i],
            "Vx_share": shares[i],
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


SS_CAP_CONDITIONS = ("stories", "T", "rho", "site", "rc", "regular")


def _ss_cap(spec: Spec, q: dict[str, Any], out: dict[str, Any]) -> None:
    """§12.8.1.3 (from memory): Ss = 1.5 for Cs where every condition holds; SDS for Cs."""
    s = spec.seismic
    assert s is not None
    if not s.limit_Ss_for_Cs or s.ground_motion.method != "site_class":
        q["SDS_Cs"] = q["SDS"]
        return
    n = len(spec.building.levels)
    checks = {
        "stories": n <= elf.SS_CAP_MAX_STORIES,
        "T": q["T"] <= elf.SS_CAP_MAX_T_S,
        "rho": q["rho"] == 1.0,
        "site": q["site_class"] not in ("E", "F"),
        "rc": spec.building.risk_category in ("I", "II"),
        "regular": out.get("irr.any") == "no",
    }
    q["cap_n_stories"] = n
    for key in SS_CAP_CONDITIONS:
        q[f"cap_{key}"] = YES if checks[key] else NO
    ok = all(checks.values())
    q["cap_ok"] = YES if ok else "NO: conditions not met, Ss not limited"
    q["Ss_Cs"] = elf.Ss_for_Cs(q["Ss"], ok)
    q["SDS_Cs"] = site.DESIGN_FRACTION * q["Fa"] * q["Ss_Cs"]


def ss_cap_failures(out: dict[str, Any]) -> list[str]:
    """The §12.8.1.3 conditions that fail in a results dict (empty when all hold)."""
    return [k for k in SS_CAP_CONDITIONS if out.get(f"seismic.cap_{k}") == NO]
