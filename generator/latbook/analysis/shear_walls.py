"""Shear walls story by story: line shear, distribution to segments, unit shear and DCR,
overturning, hold-downs, end posts, sliding and deflection (AWC SDPWS-2015 §4.3).

Rules used (the Walls_<level> sheets state the same):
- Line story shear: the line's diaphragm reaction at this level plus the line's story shear
  in the story above (statics; the reactions come from the diaphragm step, strength level).
- Capacity of a segment: each face's nominal unit shear times its aspect-ratio factor (by
  sheathing, `engine.sdpws.sheathing`; 0 past the face's Table 4.3.4 limit), the two faces
  combined by §4.3.3.2. Face 1 decides whether the segment is a shear wall at all.
- Distribution (§4.3.3.4.1): by deflection (`engine.sdpws.line_distribution`: the capacity
  shares, then two passes of secant stiffness from Eq. 4.3-1 with Δa at the hold-down force),
  or, where the spec chooses the Exception, by capacity L v_n (v_n with k = 2bs/h for WSP).
- Check: v = factor V_i / L_i against the segment's capacity v_n x Cap_factor.
- Overturning per story: M_ot = factor V_i h; the stories above reach this story through the
  stacked hold-down and end-post forces, so M_r is this story's own dead load (w L^2/2 + P L,
  P the smaller end point load; the load reverses).
- Wind: the roof bearing on the segment lifts with the concurrent MWFRS roof pressure
  qh (GCpi - G Cp); w_net = Fac_D_W w_D - Fac_W p_up b_roof, never clipped at zero.
- End posts: the larger of the combination with D (dead point load + post D) and the one with
  post L and Lr or S (ASCE 7-16 §2.4.1 6a / §2.4.5 9, LRFD §2.3.1 4 / §2.3.6 6).
- Deflection at strength level; rotation of the stacked segments below carried up
  (`shear_wall.chord_rotation_rad`, `anchorage_rotation_rad`); 0 where a segment does not
  stack on one below.
"""

from __future__ import annotations

from typing import Any

from latbook.engine.asce7_16 import drift, wind_cases
from latbook.engine.sdpws import line_distribution as ld
from latbook.engine.sdpws import shear_wall as sw
from latbook.engine.sdpws import sheathing
from latbook.spec.models import ShearWallAssembly, Spec
from latbook.spec.wall_heights import level_wall_height_ft, segment_height_ft, story_height_ft
from latbook.spec.wall_stories import LinePlace, SegmentPlace, StoryPlace, wall_stories

SOURCES = {"seis": "R_seis", "wind": "R_wind"}
"""Load source key -> the diaphragm line reaction field it comes from."""

_COMBO = {
    "seis": ("combo.Fac_E", "combo.Fac_D_E", "combo.Fac_D_E_add"),
    "wind": ("combo.Fac_W", "combo.Fac_D_W", "combo.Fac_D_W_add"),
}
"""Load source -> (lateral factor, dead factor resisting, dead factor adding)."""

_GRAVITY = {
    "seis": ("Fac_E_g", "Fac_D_E_g", "Fac_L_E_g", "Fac_Lr_E_g", "Fac_S_E_g"),
    "wind": ("Fac_W_g", "Fac_D_W_g", "Fac_L_W_g", "Fac_Lr_W_g", "Fac_S_W_g"),
}
"""Load source -> factors of the combination with L and Lr or S (lateral, D, L, Lr, S)."""


def active_sources(spec: Spec) -> list[str]:
    """'seis' and/or 'wind', by which loads the spec has."""
    return [s for s, on in (("seis", spec.seismic), ("wind", spec.wind)) if on is not None]


def _need(out: dict[str, Any], qid: str) -> Any:
    if qid not in out:
        raise KeyError(f"shear walls need '{qid}' from an earlier step (diaphragms / combinations)")
    return out[qid]


def capacity_factor_k(spec: Spec, place: SegmentPlace, level, below) -> float:
    """k of face 1 on the capacity basis (SDPWS-2015 §4.3.3.4.1 Exception; 0 past the
    Table 4.3.4 limit): the share factor the collectors use [-]."""
    a = next(x for x in spec.assemblies.shear_walls if x.id == place.segment.assembly)
    h = segment_height_ft(level, below, place.segment)
    ratio = sw.aspect_ratio(h, place.segment.length_ft)
    return sheathing.wall_aspect_factor(ratio, a.sheathing, "capacity")


def shear_wall_results(spec: Spec, out: dict[str, Any]) -> None:
    """Every Walls_<level> quantity; nothing when the spec has no wall lines."""
    if not spec.wall_lines:
        return
    assemblies = {a.id: a for a in spec.assemblies.shear_walls}
    _input_values(spec, out)
    _assembly_values(spec, out)
    sources = active_sources(spec)
    cap = _need(out, "combo.Cap_factor")
    stories = wall_stories(spec)
    for story in stories:
        lv = story.level.id
        out[f"walls.{lv}.h_story_ft"] = story_height_ft(story.level, story.below)
        out[f"walls.{lv}.h_wall_ft"] = level_wall_height_ft(story.level, story.below)
        for line in story.lines:
            if "wind" in sources:
                for seg in line.segments:
                    _roof_uplift(spec, out, story, line, seg, top=story is stories[0])
            _line_results(spec, out, story, line, assemblies, sources, cap)
        _story_governing(out, story, sources)
    # rotation carried up needs the stories below: a second walk, bottom story first
    for story in reversed(stories):
        for line in story.lines:
            for src in sources:
                _rotation_carried_up(spec, out, story, line, src)
    for story in stories:
        _excluded_list(out, story)


SEGMENT_INPUTS = (
    "height_ft",
    "dead_load_plf",
    "point_load_start_lb",
    "point_load_end_lb",
    "hold_down_offset_ft",
    "hold_down_capacity_lb",
    "hold_down_elongation_in",
    "hold_down_rated_load_lb",
    "shrinkage_in",
    "crushing_in",
    "post_D_lb",
    "post_L_lb",
    "post_Lr_lb",
    "post_S_lb",
    "sill_anchor_capacity_lb",
)
ASSEMBLY_INPUTS = (
    "sheathing",
    "vs_nominal_plf",
    "vw_nominal_plf",
    "Ga_seismic_kips_per_in",
    "Ga_wind_kips_per_in",
    "face2_sheathing",
    "face2_vs_nominal_plf",
    "face2_vw_nominal_plf",
    "face2_Ga_kips_per_in",
    "end_post_E_psi",
    "end_post_A_in2",
    "hold_down_delta_in",
)


def _input_values(spec: Spec, out: dict[str, Any]) -> None:
    """The Walls_in input cells' values (segment loads and heights, assemblies)."""
    for line in spec.wall_lines:
        for story in line.stories:
            for seg in story.segments:
                base = f"segment.{line.id}.{story.level}.{seg.id}"
                for field in SEGMENT_INPUTS:
                    out[f"{base}.{field}"] = getattr(seg, field)
    for a in spec.assemblies.shear_walls:
        for field in ASSEMBLY_INPUTS:
            out[f"swassembly.{a.id}.{field}"] = getattr(a, field)
    for level in spec.building.levels:
        out[f"level.{level.id}.wall_height_ft"] = level.wall_height_ft
    out["input.shear_walls.line_distribution"] = spec.shear_walls.line_distribution


def _basis(spec: Spec) -> sheathing.Basis:
    return spec.shear_walls.line_distribution


def _assembly_values(spec: Spec, out: dict[str, Any]) -> None:
    """Per assembly: each face's Table 4.3.4 limit, the ratio above which its factor applies,
    the factor's coefficients on the method's basis, and whether wind sums the faces."""
    basis = _basis(spec)
    for a in spec.assemblies.shear_walls:
        base = f"swassembly.{a.id}"
        order = list(sheathing.WALL_SHEATHING)
        for face, kind in (("1", a.sheathing), ("2", a.face2_sheathing)):
            if kind is None:
                values = {"row": 0, "lim": 0.0, "r0": 0.0, "fa": 0.0, "fb": 0.0, "fc": 0.0}
            else:
                row = sheathing.WALL_SHEATHING[kind]
                fa, fb, fc = row.defl if basis == "deflection" else row.cap
                values = {"row": order.index(kind) + 1, "lim": row.limit, "r0": row.r0}
                values.update(fa=fa, fb=fb, fc=fc)
            if face == "1":
                del values["fa"], values["fb"], values["fc"]
            for key, value in values.items():
                out[f"{base}.{key}{face}"] = value
        out[f"{base}.wind_sum"] = int(sheathing.wind_sum_pair(a.sheathing, a.face2_sheathing))
        out[f"{base}.vs2"] = a.face2_vs_nominal_plf or 0.0
        out[f"{base}.vw2"] = a.face2_vw_nominal_plf or 0.0
        out[f"{base}.Ga2"] = a.face2_Ga_kips_per_in or 0.0


def _face_factor(ratio: float, kind: str | None, basis: sheathing.Basis) -> float:
    return 0.0 if kind is None else sheathing.wall_aspect_factor(ratio, kind, basis)


def _line_results(spec, out, story, line: LinePlace, assemblies, sources, cap) -> None:
    lv, ln, d = story.level.id, line.line.id, line.line.direction
    lbase = f"walls.{lv}.line.{ln}"
    geo = [_geometry(spec, out, story, seg, assemblies) for seg in line.segments]
    cum_Lk = 0.0
    for seg, g in zip(line.segments, geo, strict=True):
        cum_Lk += g["Lk"]
        out[f"walls.{lv}.seg.{seg.key}.cum_Lk"] = cum_Lk
        out[f"walls.{lv}.seg.{seg.key}.line_no"] = line.line_index
    if cum_Lk <= 0:
        raise ValueError(
            f"line '{ln}', story below '{lv}': no segment meets its sheathing's aspect-ratio "
            "limit (SDPWS-2015 Table 4.3.4); the line has no shear wall"
        )
    out[f"{lbase}.sum_Lk"] = cum_Lk
    for src in sources:
        combo = tuple(_need(out, q) for q in _COMBO[src])
        # magnitude: the load reverses, and a line beside a long overhang may be pulled back
        R = abs(_need(out, f"diaph.{lv}.{d}.line.{ln}.{SOURCES[src]}"))
        V_line = R + (out[f"walls.{line.above}.line.{ln}.V_{src}"] if line.above else 0.0)
        out[f"{lbase}.R_{src}"] = R
        out[f"{lbase}.V_{src}"] = V_line
        shares = _distribute(spec, out, story, line, geo, assemblies, src, V_line, combo)
        running = {"delta": 0.0, "own": 0.0}
        for seg, g, V_seg in zip(line.segments, geo, shares, strict=True):
            a = assemblies[seg.segment.assembly]
            base = f"walls.{lv}.seg.{seg.key}"
            above = f"walls.{line.above}.seg.{seg.key}" if seg.stacked_from_above else None
            _segment_forces(spec, out, base, above, seg, g, src, V_seg, combo, cap, a)
            own = _deflection(spec, out, base, above, seg, g, src, V_seg, a, combo)
            running["own"] = max(running["own"], own)
            out[f"{base}.cum_own_{src}"] = running["own"]
        out[f"{lbase}.delta_{src}_own_max"] = running["own"]


def _combined_nominal(a: ShearWallAssembly, g, src: str) -> float:
    """v_n: each face's nominal unit shear times its factor, combined by SDPWS-2015 §4.3.3.2."""
    v1 = (a.vs_nominal_plf if src == "seis" else a.vw_nominal_plf) * g["f1"]
    v2_nominal = a.face2_vs_nominal_plf if src == "seis" else a.face2_vw_nominal_plf
    v2 = (v2_nominal or 0.0) * g["f2"]
    wind_sum = sheathing.wind_sum_pair(a.sheathing, a.face2_sheathing)
    return sheathing.combined_nominal_plf(v1, v2, src, wind_sum)  # type: ignore[arg-type]


def _flexibility(spec, out, base, above, seg: SegmentPlace, g, a, src, combo):
    s = seg.segment
    fac, fac_d, _ = combo
    M_res = out[f"{base}.M_r_net_wind"] if src == "wind" else fac_d * g["M_r"]
    Ga1 = (
        a.Ga_seismic_kips_per_in
        if src == "seis"
        else (a.Ga_wind_kips_per_in or a.Ga_seismic_kips_per_in)
    )
    Ga = Ga1 + ((a.face2_Ga_kips_per_in or 0.0) if g["f2"] > 0 else 0.0)
    return ld.SegmentFlexibility(
        h_ft=g["h"],
        b_ft=g["L"],
        E_psi=a.end_post_E_psi,
        A_in2=a.end_post_A_in2,
        Ga_kips_per_in=Ga,
        arm_ft=s.length_ft - s.hold_down_offset_ft,
        M_resist_lbft=M_res,
        T_above_lb=out[f"{above}.T_{src}"] if above else 0.0,
        lateral_factor=fac,
        elongation_at_rated_in=s.hold_down_elongation_in,
        rated_load_lb=s.hold_down_rated_load_lb,
        given_delta_in=a.hold_down_delta_in,
        shrinkage_in=s.shrinkage_in,
        crushing_in=s.crushing_in,
    )


def _distribute(spec, out, story, line, geo, assemblies, src, V_line, combo) -> list[float]:
    """The segments' shares of V_line, with every pass recorded (module doc)."""
    lv, ln = story.level.id, line.line.id
    lbase = f"walls.{lv}.line.{ln}"
    nominal, flex = [], []
    cum = 0.0
    for seg, g in zip(line.segments, geo, strict=True):
        a = assemblies[seg.segment.assembly]
        base = f"walls.{lv}.seg.{seg.key}"
        above = f"walls.{line.above}.seg.{seg.key}" if seg.stacked_from_above else None
        v_n = _combined_nominal(a, g, src) if g["k"] > 0 else 0.0
        nominal.append(v_n)
        cum += g["L"] * v_n
        out[f"{base}.v_n_{src}"] = v_n
        out[f"{base}.Lv_{src}"] = g["L"] * v_n
        flex.append(_flexibility(spec, out, base, above, seg, g, a, src, combo))
        out[f"{base}.M_res_{src}"] = flex[-1].M_resist_lbft
        out[f"{base}.Ga_{src}"] = flex[-1].Ga_kips_per_in
    out[f"{lbase}.sum_Lv_{src}"] = cum
    start = [V_line * g["L"] * v / cum for g, v in zip(geo, nominal, strict=True)]
    carries = [g["k"] > 0 for g in geo]
    passes, final = ld.distribute_by_deflection(V_line, start, flex, carries)
    for j, p in enumerate(passes):
        for seg, st, raw in zip(line.segments, p.states, p.raw_lb, strict=True):
            base = f"walls.{lv}.seg.{seg.key}"
            for key, value in (
                ("V", st.V_lb),
                ("T", st.T_defl_lb),
                ("da", st.delta_a_in),
                ("d", st.delta_in),
                ("dda", st.anchorage_slope_in_per_lb),
                ("ia", st.inv_slope_lb_per_in),
                ("ba", st.b_over_a_lb),
                ("Vr", raw),
            ):
                out[f"{base}.p{j}_{key}_{src}"] = value
        out[f"{lbase}.p{j}_sum_ia_{src}"] = sum(st.inv_slope_lb_per_in for st in p.states)
        out[f"{lbase}.p{j}_sum_ba_{src}"] = sum(st.b_over_a_lb for st in p.states)
        out[f"{lbase}.p{j}_Delta_{src}"] = p.Delta_in
        out[f"{lbase}.p{j}_sum_Vr_{src}"] = sum(p.raw_lb)
    for seg, V in zip(line.segments, final, strict=True):
        out[f"walls.{lv}.seg.{seg.key}.p{ld.PASSES}_V_{src}"] = V
    return start if _basis(spec) == "capacity" else final


def _roof_uplift(spec: Spec, out, story, line: LinePlace, seg: SegmentPlace, top: bool) -> None:
    """Roof wind uplift on the roof strip the segment carries (module doc) and the net
    resisting line load of the wind overturning combination."""
    w = spec.wind
    assert w is not None
    d = line.line.direction
    roof = max(spec.building.levels, key=lambda lv: lv.elevation_ft)
    lo_roof, hi_roof = _extent(roof, d)
    lo_seg, _ = _extent(story.level, d)
    start = lo_seg + seg.segment.start_ft
    end = start + seg.segment.length_ft
    dist = max(0.0, min(start - lo_roof, hi_roof - end))
    zone = wind_cases.roof_zone_index(dist, w.mean_roof_height_ft)
    Cp = out[f"wind.{d}.roof_Cp_{zone}"]
    p_up = wind_cases.roof_net_uplift_psf(out[f"wind.{d}.qh_psf"], w.G, Cp, out[f"wind.{d}.GCpi"])
    given = seg.segment.roof_bearing_width_ft
    if given is not None:
        width = given
    elif top:
        width = out[f"diaph.{story.level.id}.{d}.line.{line.line.id}.trib_geo_ft"]
    else:
        width = 0.0
    w_up = p_up * width
    w_net = out["combo.Fac_D_W"] * seg.segment.dead_load_plf - out["combo.Fac_W"] * w_up
    values = {
        "roof_dist_ft": dist,
        "roof_Cp": Cp,
        "p_up_psf": p_up,
        "roof_width_ft": width,
        "w_up_plf": w_up,
        "w_net_plf": w_net,
    }
    for key, value in values.items():
        out[f"walls.{story.level.id}.seg.{seg.key}.{key}"] = value
    s = seg.segment
    P_far = min(s.point_load_start_lb, s.point_load_end_lb)
    M_r = sw.resisting_moment_lbft(w_net, s.length_ft, out["combo.Fac_D_W"] * P_far, 0.0)
    out[f"walls.{story.level.id}.seg.{seg.key}.M_r_net_wind"] = M_r


def _extent(level, axis: str) -> tuple[float, float]:
    plan = level.plan
    return (plan.x_min_ft, plan.x_max_ft) if axis == "x" else (plan.y_min_ft, plan.y_max_ft)


def _geometry(spec: Spec, out, story, seg: SegmentPlace, assemblies) -> dict[str, Any]:
    s = seg.segment
    a = assemblies[s.assembly]
    base = f"walls.{story.level.id}.seg.{seg.key}"
    h = segment_height_ft(story.level, story.below, s)
    ar = sw.aspect_ratio(h, s.length_ft)
    limit = sheathing.wall_aspect_limit(a.sheathing)
    k = sheathing.wall_aspect_factor(ar, a.sheathing, "capacity")
    f_ar = sheathing.wall_aspect_factor(ar, a.sheathing, "deflection")
    basis = _basis(spec)
    posts = (s.post_D_lb, s.post_L_lb, s.post_Lr_lb, s.post_S_lb)
    g = {
        "L": s.length_ft,
        "h": h,
        "ar": ar,
        "lim": limit,
        "ok": "yes" if k > 0 else f"no: h/bs > {limit:g}",
        "f_ar": f_ar,
        "k": k,
        "f1": k if basis == "capacity" else f_ar,
        "f2": _face_factor(ar, a.face2_sheathing, basis),
        "Lk": s.length_ft * k,
        "M_r": sw.resisting_moment_lbft(
            s.dead_load_plf, s.length_ft, min(s.point_load_start_lb, s.point_load_end_lb), 0.0
        ),
        # hold-down arm and the end post's gravity loads (a blank post load counts 0)
        "arm": s.length_ft - s.hold_down_offset_ft,
        "P_D": max(s.point_load_start_lb, s.point_load_end_lb) + (s.post_D_lb or 0.0),
        "P_L": s.post_L_lb or 0.0,
        "P_Lr": s.post_Lr_lb or 0.0,
        "P_S": s.post_S_lb or 0.0,
        "post_given": "yes" if any(v is not None for v in posts) else "no",
    }
    for key, value in g.items():
        out[f"{base}.{key}"] = value
    return g


def _segment_forces(spec, out, base, above, seg: SegmentPlace, g, src, V_seg, combo, cap, a):
    s = seg.segment
    fac, fac_d, fac_d_add = combo
    capacity = out[f"{base}.v_n_{src}"] * cap
    M_ot = sw.overturning_moment_lbft([fac * V_seg], [g["h"]])
    if src == "wind":
        M_r, fac_r = out[f"{base}.M_r_net_wind"], 1.0  # factored, roof uplift taken off
    else:
        M_r, fac_r = g["M_r"], fac_d
    uplift = sw.net_uplift_lb(M_ot, M_r, fac_r, s.length_ft, s.hold_down_offset_ft)
    T_story = sw.hold_down_tension_lb(M_ot, M_r, fac_r, s.length_ft, s.hold_down_offset_ft)
    C_d_story = sw.end_post_compression_lb(
        M_ot, s.length_ft, s.hold_down_offset_ft, fac_d_add * g["P_D"]
    )
    f_lat, f_D, f_L, f_Lr, f_S = (out[f"combo.{name}"] for name in _GRAVITY[src])
    gravity = f_D * g["P_D"] + f_L * g["P_L"] + max(f_Lr * g["P_Lr"], f_S * g["P_S"])
    C_g_story = sw.end_post_compression_lb(
        f_lat * V_seg * g["h"], s.length_ft, s.hold_down_offset_ft, gravity
    )
    T_above = out[f"{above}.T_{src}"] if above else 0.0
    C_d = C_d_story + (out[f"{above}.C_d_{src}"] if above else 0.0)
    C_g = C_g_story + (out[f"{above}.C_g_{src}"] if above else 0.0)
    T = sw.accumulate_hold_down(T_story, T_above)
    values = {
        "V": V_seg,
        "cap": capacity,
        "dcr": fac * V_seg / s.length_ft / capacity if g["k"] > 0 else 0.0,
        "v_slide": fac * sw.sliding_unit_shear_plf(V_seg, s.length_ft),
        "M_ot": M_ot,
        "uplift": uplift,
        "T": T,
        "T_dcr": hold_down_dcr(T, s.hold_down_capacity_lb),
        "C_d": C_d,
        "C_g": C_g,
        "C": max(C_d, C_g),
    }
    for key, value in values.items():
        out[f"{base}.{key}_{src}"] = value
    given = g["post_given"] == "yes"
    out[f"{base}.C_basis_{src}"] = POST_LOADS_TEXT if given else NO_POST_LOADS_TEXT


POST_LOADS_TEXT = "with the post loads D, L, Lr, S"
NO_POST_LOADS_TEXT = "overturning + dead point load only (no post loads given)"
NOT_GIVEN = "not given"


def hold_down_dcr(T_lb: float, capacity_lb: float | None) -> float | str:
    """Hold-down demand/capacity ratio T / capacity (AWC SDPWS-2015 §4.3.6.4.2; T at the
    design level, capacity allowable for ASD or design for LRFD, from the manufacturer) [-].
    Without a capacity: "not given" where the segment lifts, 0 where it does not."""
    if capacity_lb is not None:
        return T_lb / capacity_lb
    return NOT_GIVEN if T_lb > 0 else 0.0


def _deflection(
    spec, out, base, above, seg: SegmentPlace, g, src, V_seg, a: ShearWallAssembly, combo
) -> float:
    """SDPWS-2015 Eq. 4.3-1 at the shares used, strength level (E = QE, or W), with Δa at the
    hold-down force they induce; the moments for the chord rotation carried up [in]."""
    flex = _flexibility(spec, out, base, above, seg, g, a, src, combo)
    st = ld.evaluate(V_seg, flex)
    v = sw.segment_unit_shear_plf(V_seg, g["L"])
    M_top = out[f"{above}.M_base_{src}"] if above else 0.0
    M_base = V_seg * g["h"] + M_top
    s = seg.segment
    da_const = s.shrinkage_in + s.crushing_in
    if s.hold_down_elongation_in is None:
        da_const += a.hold_down_delta_in
    terms = {
        "v_defl": v,
        "d_bend": sw.deflection_bending_in(v, g["h"], a.end_post_E_psi, a.end_post_A_in2, g["L"]),
        "d_shear": sw.deflection_shear_in(v, g["h"], flex.Ga_kips_per_in),
        "T_defl": st.T_defl_lb,
        "da": st.delta_a_in,
        "d_anch": sw.deflection_anchorage_in(g["h"], st.delta_a_in, g["L"]),
        "M_top": M_top,
        "M_base": M_base,
        "th_chord": sw.chord_rotation_rad(
            M_top, M_base, g["h"], a.end_post_E_psi, a.end_post_A_in2, g["L"]
        ),
        "th_anch": sw.anchorage_rotation_rad(st.delta_a_in, g["L"]),
    }
    delta = terms["d_bend"] + terms["d_shear"] + terms["d_anch"] if g["k"] > 0 else 0.0
    terms["delta"] = delta
    terms["th"] = terms["th_chord"] + terms["th_anch"]
    if src == "wind":
        terms["da_c"] = da_const
        terms["th_c"] = sw.anchorage_rotation_rad(da_const, g["L"])
    for key, value in terms.items():
        out[f"{base}.{key}_{src}"] = value
    return delta


def _rotation_carried_up(spec, out, story: StoryPlace, line: LinePlace, src: str) -> None:
    """θ below, cumulative θ, the displacement it carries up and the segment's total
    deflection; the line's largest (runs bottom story first)."""
    lv, ln = story.level.id, line.line.id
    h_story = out[f"walls.{lv}.h_story_ft"]
    running = {"tot": 0.0, "rot": 0.0, "serv": 0.0}
    factor = spec.drift.wind_serviceability_factor
    for seg in line.segments:
        base = f"walls.{lv}.seg.{seg.key}"
        stacks = seg.segment.hold_down_continues_below and story.below is not None
        below = f"walls.{story.below.id}.seg.{seg.key}" if stacks else None
        qualifies = out[f"{base}.k"] > 0
        th_below = out[f"{below}.th_cum_{src}"] if below else 0.0
        values = {
            "th_below": th_below,
            "th_cum": out[f"{base}.th_{src}"] + th_below,
            "d_rot": 12.0 * h_story * th_below if qualifies else 0.0,
        }
        values["d_tot"] = out[f"{base}.delta_{src}"] + values["d_rot"]
        if src == "wind":
            th_c_below = out[f"{below}.th_c_cum_wind"] if below else 0.0
            values["th_c_below"] = th_c_below
            values["th_c_cum"] = out[f"{base}.th_c_wind"] + th_c_below
            d_c = 0.0
            if qualifies:
                d_c = sw.deflection_anchorage_in(
                    out[f"{base}.h"], out[f"{base}.da_c_wind"], seg.segment.length_ft
                )
                d_c += 12.0 * h_story * th_c_below
            values["d_c"] = d_c
            values["d_serv"] = drift.serviceability_deflection_in(values["d_tot"], d_c, factor)
            running["serv"] = max(running["serv"], values["d_serv"])
            values["cum_serv"] = running["serv"]
        running["tot"] = max(running["tot"], values["d_tot"])
        running["rot"] = max(running["rot"], values["d_rot"])
        values["cum_delta"] = running["tot"]
        values["cum_rot"] = running["rot"]
        for key, value in values.items():
            out[f"{base}.{key}_{src}"] = value
    lbase = f"walls.{lv}.line.{ln}"
    out[f"{lbase}.delta_{src}_max"] = running["tot"]
    out[f"{lbase}.delta_{src}_rot_max"] = running["rot"]
    if src == "wind":
        out[f"{lbase}.delta_wind_serv_max"] = running["serv"]


GOVERNING_REL = 1e-9
"""Values within this fraction of the largest (at least 1e-9 absolute) count as equal: the
first of them governs. Two paths to one number (engine, spreadsheet) differ by a few
rounding steps, far less than this, so both pick the same segment."""


def near_largest(values: list[float | str]) -> tuple[float, list[int]]:
    """The largest number among `values` (0 when none is a number, like a spreadsheet MAX)
    and a flag per value: 1 where it is a number within GOVERNING_REL of the largest [-]."""
    numeric = [v for v in values if not isinstance(v, str)]
    top = max(numeric, default=0.0)
    threshold = top - GOVERNING_REL * max(1.0, abs(top))
    return top, [0 if isinstance(v, str) else int(v > threshold) for v in values]


LIST_MAX = 6
"""Segments named in a list cell (the rest are counted): keeps a cell's text short."""


def _story_governing(out, story: StoryPlace, sources) -> None:
    """Largest unit-shear DCR, hold-down tension and hold-down DCR of the story and the
    first segment within GOVERNING_REL of each (the workbook's near-max flags and MATCH);
    the segments with uplift and no hold-down capacity, named."""
    lv = story.level.id
    segs = story.segments
    prefix = story_prefix(lv)
    for src in sources:
        for field in ("dcr", "T", "T_dcr"):
            values = [out[f"walls.{lv}.seg.{s.key}.{field}_{src}"] for s in segs]
            top, flags = near_largest(values)
            for seg, flag in zip(segs, flags, strict=True):
                out[f"walls.{lv}.seg.{seg.key}.{field}_gov_{src}"] = flag
            out[f"walls.{lv}.{field}_{src}_max"] = top
            label = prefix + segment_label(segs[flags.index(1)]) if 1 in flags else NONE_WITH_CAP
            out[f"walls.{lv}.{field}_{src}_gov"] = label
        missing = [isinstance(out[f"walls.{lv}.seg.{s.key}.T_dcr_{src}"], str) for s in segs]
        out[f"walls.{lv}.T_dcr_{src}_missing"] = sum(missing)
        text, count = prefix, 0
        for seg, miss in zip(segs, missing, strict=True):
            count += miss
            item = segment_label(seg) + "; " if miss and count <= LIST_MAX else NOTHING
            text += "" if item == NOTHING else item
            out[f"walls.{lv}.seg.{seg.key}.hd_miss_n_{src}"] = count
            out[f"walls.{lv}.seg.{seg.key}.hd_miss_{src}"] = item
            out[f"walls.{lv}.seg.{seg.key}.hd_miss_cum_{src}"] = text
        out[f"walls.{lv}.T_dcr_{src}_missing_list"] = listed(text, sum(missing))


NONE_WITH_CAP = "none with a capacity"


NOTHING = "-"
"""A list item cell that names nothing (a spreadsheet stores an empty text as no value)."""


def listed(text: str, count: int) -> str:
    """A list cell: 'story below X: a; b; (n in all)', or 'none'."""
    if count == 0:
        return "none"
    return f"{text}({count:g} in all)"


def _excluded_list(out, story: StoryPlace) -> None:
    """Segments of the story past their sheathing's aspect-ratio limit (not shear walls)."""
    lv = story.level.id
    text, count = story_prefix(lv), 0
    for seg in story.segments:
        excluded = out[f"walls.{lv}.seg.{seg.key}.k"] <= 0
        count += excluded
        item = segment_label(seg) + "; " if excluded and count <= LIST_MAX else NOTHING
        text += "" if item == NOTHING else item
        out[f"walls.{lv}.seg.{seg.key}.excl_n"] = count
        out[f"walls.{lv}.seg.{seg.key}.excl"] = item
        out[f"walls.{lv}.seg.{seg.key}.excl_cum"] = text
    out[f"walls.{lv}.excluded_count"] = count
    out[f"walls.{lv}.excluded_list"] = listed(text, count)


def story_prefix(level: str) -> str:
    """How a story is named before its segments in text cells."""
    return f"story below {level}: "


def segment_label(seg: SegmentPlace) -> str:
    """How a segment is named in the workbook's text cells (within its story)."""
    return f"line {seg.line.id} seg {seg.segment.id}"
