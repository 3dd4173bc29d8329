"""Shear walls story by story: line shear, distribution to segments, unit shear and DCR,
overturning, hold-downs, end posts, sliding and deflection (AWC SDPWS-2015 §4.3).

Rules used (the Walls_<level> sheets state the same):
- Line story shear: the line's diaphragm reaction at this level plus the line's story shear
  in the story above (statics; the reactions come from the diaphragm step, strength level).
- Distribution: in proportion to L k, k = 1 for h/bs <= 2, 2bs/h for 2 < h/bs <= 3.5, 0 for a
  segment past the Table 4.3.4 limit (SDPWS-2015 §4.3.3.4.1 Exception). The check is
  v_eff = factor V / sum(L k) against the unreduced capacity (same DCR for each segment).
- Overturning per story: the segment's share of the story shear times its height (its top
  is where the story's shear enters). The stories above reach this story through the stacked
  hold-down and end-post forces (T and C from above), so the resisting dead load is this
  story's own (dead_load_plf is the load added at this story, not the walls above).
- Resisting moment w L^2/2 + P L with P the smaller end point load (the load reverses, so
  either end may lift), times the combination's dead-load factor.
- Wind: the roof bearing on the segment lifts with the concurrent MWFRS roof pressure
  qh (GCpi - G Cp) (ASCE 7-16 Fig. 27.3-1 roof Cp at the segment's end nearest a windward
  edge, Table 26.13-1 GCpi acting up); its line load times Fac_W is taken off the factored
  dead load: w_net = Fac_D_W w_D - Fac_W p_up b_roof, never clipped at zero.
"""

from __future__ import annotations

from typing import Any

from latbook.engine.asce7_16 import wind_cases
from latbook.engine.sdpws import shear_wall as sw
from latbook.spec.models import ShearWallAssembly, Spec
from latbook.spec.wall_stories import LinePlace, SegmentPlace, StoryPlace, wall_stories

SOURCES = {"seis": "R_seis", "wind": "R_wind"}
"""Load source key -> the diaphragm line reaction field it comes from."""

_COMBO = {
    "seis": ("combo.Fac_E", "combo.Fac_D_E", "combo.Fac_D_E_add"),
    "wind": ("combo.Fac_W", "combo.Fac_D_W", "combo.Fac_D_W_add"),
}
"""Load source -> (lateral factor, dead factor resisting, dead factor adding)."""


def story_height_ft(story: StoryPlace) -> float:
    """Height of the story below the level: h_x - h_(x-1), the base at 0 ft [ft]."""
    base_ft = story.below.elevation_ft if story.below is not None else 0.0
    return story.level.elevation_ft - base_ft


def active_sources(spec: Spec) -> list[str]:
    """'seis' and/or 'wind', by which loads the spec has."""
    return [s for s, on in (("seis", spec.seismic), ("wind", spec.wind)) if on is not None]


def qualifying_factor(ar: float) -> float:
    """k of SDPWS-2015 §4.3.3.4.1: 1, 2bs/h, or 0 past the Table 4.3.4 limit [-]."""
    if ar > sw.ASPECT_RATIO_LIMIT_WSP + 1e-12:
        return 0.0
    return 1.0 if ar <= sw.WSP_FULL_STRENGTH_ASPECT_RATIO else 2.0 / ar


def aspect_factor(ar: float) -> float:
    """SDPWS-2015 §4.3.4.2 factor 1.25 - 0.125 h/bs (shown; k above governs), 0 past the
    limit [-]."""
    if ar > sw.ASPECT_RATIO_LIMIT_WSP + 1e-12:
        return 0.0
    return 1.0 if ar <= sw.WSP_FULL_STRENGTH_ASPECT_RATIO else 1.25 - 0.125 * ar


def _need(out: dict[str, Any], qid: str) -> Any:
    if qid not in out:
        raise KeyError(f"shear walls need '{qid}' from an earlier step (diaphragms / combinations)")
    return out[qid]


def shear_wall_results(spec: Spec, out: dict[str, Any]) -> None:
    """Every Walls_<level> quantity; nothing when the spec has no wall lines."""
    if not spec.wall_lines:
        return
    assemblies = {a.id: a for a in spec.assemblies.shear_walls}
    _input_values(spec, out)
    sources = active_sources(spec)
    cap = _need(out, "combo.Cap_factor")
    stories = wall_stories(spec)
    for story in stories:
        lv = story.level.id
        h_story = story_height_ft(story)
        out[f"walls.{lv}.h_story_ft"] = h_story
        for line in story.lines:
            if "wind" in sources:
                for seg in line.segments:
                    _roof_uplift(spec, out, story, line, seg, top=story is stories[0])
            _line_results(out, story, line, h_story, assemblies, sources, cap)
        _story_governing(out, story, sources)


SEGMENT_INPUTS = (
    "height_ft",
    "dead_load_plf",
    "point_load_start_lb",
    "point_load_end_lb",
    "hold_down_offset_ft",
    "hold_down_capacity_lb",
)
ASSEMBLY_INPUTS = (
    "vs_nominal_plf",
    "vw_nominal_plf",
    "Ga_seismic_kips_per_in",
    "Ga_wind_kips_per_in",
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


def _line_results(out, story, line: LinePlace, h_story, assemblies, sources, cap) -> None:
    lv, ln, d = story.level.id, line.line.id, line.line.direction
    lbase = f"walls.{lv}.line.{ln}"
    geo = [_geometry(out, story, seg, h_story) for seg in line.segments]
    cum_Lk = 0.0
    for seg, g in zip(line.segments, geo, strict=True):
        cum_Lk += g["Lk"]
        out[f"walls.{lv}.seg.{seg.key}.cum_Lk"] = cum_Lk
    sum_Lk = cum_Lk
    if sum_Lk <= 0:
        raise ValueError(
            f"line '{ln}', story below '{lv}': no segment meets h/bs <= "
            f"{sw.ASPECT_RATIO_LIMIT_WSP} (SDPWS-2015 Table 4.3.4); the line has no shear wall"
        )
    out[f"{lbase}.sum_Lk"] = sum_Lk
    for src in sources:
        combo = tuple(_need(out, q) for q in _COMBO[src])
        # magnitude: the load reverses, and a line beside a long overhang may be pulled back
        R = abs(_need(out, f"diaph.{lv}.{d}.line.{ln}.{SOURCES[src]}"))
        V_line = R + (out[f"walls.{line.above}.line.{ln}.V_{src}"] if line.above else 0.0)
        out[f"{lbase}.R_{src}"] = R
        out[f"{lbase}.V_{src}"] = V_line
        carrying = [g for g in geo if g["k"] > 0]
        lengths, factors = [g["L"] for g in carrying], [g["k"] for g in carrying]
        shares = iter(sw.distribute_line_shear(V_line, lengths, factors))
        v_eff = combo[0] * sw.line_unit_shear_plf(V_line, lengths, factors)
        out[f"{lbase}.v_eff_{src}"] = v_eff
        running_max = 0.0
        for seg, g in zip(line.segments, geo, strict=True):
            a = assemblies[seg.segment.assembly]
            base = f"walls.{lv}.seg.{seg.key}"
            V_seg = next(shares) if g["k"] > 0 else 0.0
            above = f"walls.{line.above}.seg.{seg.key}" if seg.stacked_from_above else None
            _segment_forces(out, base, above, seg, g, src, V_seg, v_eff, combo, cap, a)
            delta = _deflection(out, base, g, src, V_seg, a)
            running_max = max(running_max, delta)
            out[f"{base}.cum_delta_{src}"] = running_max
        out[f"{lbase}.delta_{src}_max"] = running_max


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


def _extent(level, axis: str) -> tuple[float, float]:
    plan = level.plan
    return (plan.x_min_ft, plan.x_max_ft) if axis == "x" else (plan.y_min_ft, plan.y_max_ft)


def _geometry(out, story, seg: SegmentPlace, h_story: float) -> dict[str, Any]:
    s = seg.segment
    base = f"walls.{story.level.id}.seg.{seg.key}"
    h = s.height_ft if s.height_ft is not None else h_story
    ar = sw.aspect_ratio(h, s.length_ft)
    k = qualifying_factor(ar)
    g = {
        "L": s.length_ft,
        "h": h,
        "ar": ar,
        "f_ar": aspect_factor(ar),
        "k": k,
        "ok": "yes" if k > 0 else f"no: h/bs > {sw.ASPECT_RATIO_LIMIT_WSP:g}",
        "Lk": s.length_ft * k,
        "M_r": sw.resisting_moment_lbft(
            s.dead_load_plf, s.length_ft, min(s.point_load_start_lb, s.point_load_end_lb), 0.0
        ),
    }
    for key, value in g.items():
        out[f"{base}.{key}"] = value
    return g


def _segment_forces(out, base, above, seg: SegmentPlace, g, src, V_seg, v_eff, combo, cap, a):
    s = seg.segment
    fac, fac_d, fac_d_add = combo
    nominal = a.vs_nominal_plf if src == "seis" else a.vw_nominal_plf
    capacity = nominal * cap
    M_ot = sw.overturning_moment_lbft([fac * V_seg], [g["h"]])
    if src == "wind":
        # factored resisting moment with the roof uplift taken off (module doc)
        P_far = min(s.point_load_start_lb, s.point_load_end_lb)
        w_net = out[f"{base}.w_net_plf"]
        M_r = sw.resisting_moment_lbft(w_net, s.length_ft, fac_d * P_far, 0.0)
        out[f"{base}.M_r_net_wind"] = M_r
        fac_r = 1.0
    else:
        M_r, fac_r = g["M_r"], fac_d
    uplift = sw.net_uplift_lb(M_ot, M_r, fac_r, s.length_ft, s.hold_down_offset_ft)
    T_story = sw.hold_down_tension_lb(M_ot, M_r, fac_r, s.length_ft, s.hold_down_offset_ft)
    P_end_lb = fac_d_add * max(s.point_load_start_lb, s.point_load_end_lb)
    C_story = sw.end_post_compression_lb(M_ot, s.length_ft, s.hold_down_offset_ft, P_end_lb)
    T_above = out[f"{above}.T_{src}"] if above else 0.0
    C_above = out[f"{above}.C_{src}"] if above else 0.0
    T = sw.accumulate_hold_down(T_story, T_above)
    values = {
        "V": V_seg,
        "cap": capacity,
        "dcr": v_eff / capacity if g["k"] > 0 else 0.0,
        "v_slide": fac * sw.sliding_unit_shear_plf(V_seg, s.length_ft),
        "M_ot": M_ot,
        "uplift": uplift,
        "T": T,
        "T_dcr": hold_down_dcr(T, s.hold_down_capacity_lb),
        "C": C_story + C_above,
    }
    for key, value in values.items():
        out[f"{base}.{key}_{src}"] = value


NOT_GIVEN = "not given"


def hold_down_dcr(T_lb: float, capacity_lb: float | None) -> float | str:
    """Hold-down demand/capacity ratio T / capacity (AWC SDPWS-2015 §4.3.6.4.2; T at the
    design level, capacity allowable for ASD or design for LRFD, from the manufacturer) [-].
    Without a capacity: "not given" where the segment lifts, 0 where it does not."""
    if capacity_lb is not None:
        return T_lb / capacity_lb
    return NOT_GIVEN if T_lb > 0 else 0.0


def _deflection(out, base, g, src, V_seg, a: ShearWallAssembly) -> float:
    """SDPWS-2015 Eq. 4.3-1 at strength-level forces (E = QE, or W) [in]."""
    Ga = (
        a.Ga_seismic_kips_per_in
        if src == "seis"
        else (a.Ga_wind_kips_per_in or a.Ga_seismic_kips_per_in)
    )
    v = sw.segment_unit_shear_plf(V_seg, g["L"])
    terms = {
        "v_defl": v,
        "d_bend": sw.deflection_bending_in(v, g["h"], a.end_post_E_psi, a.end_post_A_in2, g["L"]),
        "d_shear": sw.deflection_shear_in(v, g["h"], Ga),
        "d_anch": sw.deflection_anchorage_in(g["h"], a.hold_down_delta_in, g["L"]),
    }
    delta = terms["d_bend"] + terms["d_shear"] + terms["d_anch"] if g["k"] > 0 else 0.0
    terms["delta"] = delta
    for key, value in terms.items():
        out[f"{base}.{key}_{src}"] = value
    return delta


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


def _story_governing(out, story: StoryPlace, sources) -> None:
    """Largest unit-shear DCR, hold-down tension and hold-down DCR of the story and the
    first segment within GOVERNING_REL of each (the workbook's near-max flags and MATCH)."""
    lv = story.level.id
    segs = story.segments
    for src in sources:
        for field in ("dcr", "T", "T_dcr"):
            values = [out[f"walls.{lv}.seg.{s.key}.{field}_{src}"] for s in segs]
            top, flags = near_largest(values)
            for seg, flag in zip(segs, flags, strict=True):
                out[f"walls.{lv}.seg.{seg.key}.{field}_gov_{src}"] = flag
            out[f"walls.{lv}.{field}_{src}_max"] = top
            label = segment_label(segs[flags.index(1)]) if 1 in flags else "none with a capacity"
            out[f"walls.{lv}.{field}_{src}_gov"] = label
        out[f"walls.{lv}.T_dcr_{src}_missing"] = sum(
            isinstance(out[f"walls.{lv}.seg.{s.key}.T_dcr_{src}"], str) for s in segs
        )


def segment_label(seg: SegmentPlace) -> str:
    """How a segment is named in the workbook's text cells."""
    return f"line {seg.line.id} seg {seg.segment.id}"
