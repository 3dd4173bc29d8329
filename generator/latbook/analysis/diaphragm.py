"""Diaphragm quantities: flexible (tributary) spans, line reactions, unit shear, chords,
collectors (ASCE 7-16 §12.3.1.1, §12.10; AWC SDPWS-2015 §4.2).

Per level and load direction: the uniform load w = F / (diaphragm length along the span)
for each load source (seismic Fx for the line reactions to the walls, Fpx for the diaphragm
itself, wind F_level), spans between consecutive resisting lines (simple beams) and overhangs
(cantilevers), the reactions to each line, unit shears and their demand/capacity ratios,
chord forces M/b and collector force diagrams along every line.

Load factors are applied where a check is made: diaphragm shear and chords from Fpx with
Fac_E_dia (rho = 1.0, ASCE 7-16 §12.3.4.1), wind with Fac_W; collectors in SDC C-F with
overstrength (Fac_Em, §12.10.2.1) unless the light-frame exception is taken, else Fac_E.
Runs after the seismic, wind and combination steps (reads their results from `out`).
"""

from __future__ import annotations

from dataclasses import replace
from typing import Any

from latbook.analysis import diaphragm_deflection
from latbook.analysis.wind import torsional_cases_apply
from latbook.engine import collector, diaphragm_chain, diaphragm_tributary
from latbook.engine.asce7_16 import collectors, wind_cases
from latbook.engine.sdpws import capacity, shear_wall, sheathing
from latbook.spec.models import DiaphragmAssembly, Level, Spec
from latbook.spec.plan_geometry import (
    DIAGRAM_FRACTIONS,
    DIRECTIONS,
    Direction,
    ResistingLine,
    collector_points,
    depth_ft,
    diaphragm_spans,
    resisting_lines,
    span_extent_ft,
)
from latbook.spec.wall_heights import level_below, segment_height_ft

NOT_GIVEN = "not given"
"""Shown where a demand/capacity ratio needs a capacity the spec does not give."""

OVERSTRENGTH_SDCS = ("C", "D", "E", "F")
"""Seismic design categories whose collectors need overstrength, ASCE 7-16 §12.10.2.1."""


def levels_top_down(spec: Spec) -> list[Level]:
    return sorted(spec.building.levels, key=lambda lv: -lv.elevation_ft)


def collector_exception_taken(spec: Spec) -> bool:
    """ASCE 7-16 §12.10.2.1 Exception 1: as declared, else by the Table 12.2-1 entry."""
    s = spec.seismic
    if s is None:
        return False
    if s.collector_light_frame_exception is not None:
        return s.collector_light_frame_exception
    return collectors.light_frame_exception_default(s.system.table_12_2_1_entry)


def collector_overstrength_applies(spec: Spec, sdc: str) -> bool:
    """True when collectors take the overstrength load effect: SDC C-F and Exception 1 of
    ASCE 7-16 §12.10.2.1 not taken."""
    return (
        spec.seismic is not None
        and sdc in OVERSTRENGTH_SDCS
        and not collector_exception_taken(spec)
    )


def diaphragm_results(spec: Spec, out: dict[str, Any]) -> None:
    """Every diaphragm quantity id -> value; nothing when the spec has no wall lines."""
    if not spec.wall_lines:
        return
    _input_results(spec, out)
    omega = False
    if spec.seismic is not None:
        omega = collector_overstrength_applies(spec, out["seismic.SDC"])
        out["diaph.collector_exception"] = "yes" if collector_exception_taken(spec) else "no"
        out["diaph.collector_overstrength"] = "yes" if omega else "no"
    assemblies = {a.id: a for a in spec.assemblies.diaphragms}
    for level in levels_top_down(spec):
        assembly = assemblies[level.diaphragm_assembly or ""]
        for direction in DIRECTIONS:
            _case_results(spec, level, direction, assembly, omega, out)


def _input_results(spec: Spec, out: dict[str, Any]) -> None:
    if spec.seismic is not None:
        out["seismic.collector_light_frame_exception"] = (
            spec.seismic.collector_light_frame_exception
        )
    out["diaphragms.cantilever_deflection_tolerated"] = (
        spec.diaphragms.cantilever_deflection_tolerated
    )
    for line in spec.wall_lines:
        out[f"line.{line.id}.position_ft"] = line.position_ft
        for story in line.stories:
            for seg in story.segments:
                base = f"segment.{line.id}.{story.level}.{seg.id}"
                out[f"{base}.start_ft"] = seg.start_ft
                out[f"{base}.length_ft"] = seg.length_ft
    for a in spec.assemblies.diaphragms:
        out[f"dassembly.{a.id}.sheathing"] = a.sheathing
        out[f"dassembly.{a.id}.ar_limit"] = sheathing.diaphragm_aspect_limit(a.sheathing)
        out[f"dassembly.{a.id}.vs_nominal_plf"] = a.vs_nominal_plf
        out[f"dassembly.{a.id}.vw_nominal_plf"] = a.vw_nominal_plf
        out[f"dassembly.{a.id}.chord_capacity_lb"] = a.chord_capacity_lb
        out[f"dassembly.{a.id}.collector_capacity_lb"] = a.collector_capacity_lb
    diaphragm_deflection.deflection_input_results(spec, out)


def _ratio(demand: float, capacity_value: float | None) -> float | str:
    return NOT_GIVEN if capacity_value is None else demand / capacity_value


WIND_CASE_NAMES = {
    "w1": "Case 1",
    "wmin": "minimum (§27.1.5)",
    "w3": "Case 3",
    "w2p": "Case 2 (+e)",
    "w2n": "Case 2 (-e)",
    "w4p": "Case 4 (+e)",
    "w4n": "Case 4 (-e)",
}
"""Wind load cases carried to a line, in the order a tie is resolved (first wins)."""

TIE_TOLERANCE = 1e-9
"""Relative tolerance of 'equal' when a governing case or element is named (both paths)."""


def governing_name(values: dict[str, float], names: dict[str, str]) -> tuple[float, str]:
    """The largest magnitude and the name of the first entry within TIE_TOLERANCE of it (the
    wind reverses, so a line designed for a case's force takes its magnitude)."""
    best = max(abs(v) for v in values.values())
    for key, value in values.items():
        if abs(value) >= best * (1.0 - TIE_TOLERANCE):
            return best, names[key]
    raise AssertionError("unreachable")  # pragma: no cover


def _segment_factors(spec: Spec, level: Level, ln: ResistingLine) -> list[float]:
    """k of each segment's face 1 (SDPWS-2015 §4.3.3.4.1 Exception; 0 past the Table 4.3.4
    limit of its sheathing): the collectors share the line's force by L k."""
    below = level_below(spec, level)
    kinds = {a.id: a.sheathing for a in spec.assemblies.shear_walls}
    factors = []
    for seg in ln.story.segments:
        h = segment_height_ft(level, below, seg)
        ratio = shear_wall.aspect_ratio(h, seg.length_ft)
        factors.append(sheathing.wall_aspect_factor(ratio, kinds[seg.assembly], "capacity"))
    return factors


def _case_results(
    spec: Spec,
    level: Level,
    direction: Direction,
    assembly: DiaphragmAssembly,
    omega: bool,
    out: dict[str, Any],
) -> None:
    P = f"diaph.{level.id}.{direction}"
    seismic, wind = spec.seismic is not None, spec.wind is not None
    torsion = torsional_cases_apply(spec)
    lines = resisting_lines(spec, level.id, direction)
    lo, hi = span_extent_ft(level, direction)
    b = depth_ft(level, direction)
    length = hi - lo
    q: dict[str, Any] = {"depth_ft": b, "span_length_ft": length}
    q.update(diaphragm_deflection.case_results(assembly))
    w: dict[str, float] = {}
    if seismic:
        row = f"seismic.level.{level.id}"
        for src, key in (
            ("seis", "Fx"),
            ("fpx", "Fpx"),
            ("fpx_eq", "Fpx_eq"),
            ("fpx_min", "Fpx_min"),
            ("fpx_max", "Fpx_max"),
        ):
            q[f"{key}_kip"] = out[f"{row}.{key}"]
            w[src] = q[f"w_{src}_plf"] = 1000.0 * out[f"{row}.{key}"] / length
    if wind:
        row = f"wind.{direction}.level.{level.id}"
        q["F_wind_kip"] = out[f"{row}.F_level"]
        q["F_wind_min_kip"] = out[f"{row}.F_min"]
        w["wind"] = q["w_wind_plf"] = 1000.0 * q["F_wind_kip"] / length
        w["wmin"] = q["w_wmin_plf"] = 1000.0 * q["F_wind_min_kip"] / length
    method = spec.design_method
    q["vs_cap_plf"] = capacity.unit_shear_capacity(assembly.vs_nominal_plf, method)
    q["vw_cap_plf"] = capacity.unit_shear_capacity(assembly.vw_nominal_plf, method)
    fac_E_dia = out.get("combo.Fac_E_dia", 0.0)
    fac_W = out.get("combo.Fac_W", 0.0)

    positions = [ln.position_ft for ln in lines]
    unit_spans, unit_R = diaphragm_chain.chain_results(positions, lo, hi, 1.0, 1.0)
    tor: dict[str, tuple[list[diaphragm_chain.SpanResult], list[float]]] = {}
    if wind and torsion:
        for tag, sign in (("p", 1), ("n", -1)):
            w_lo, w_hi = wind_cases.eccentric_line_load_plf(
                q["F_wind_kip"], wind_cases.CASE_2_3_FRACTION, length, sign
            )
            q[f"w2{tag}_lo_plf"], q[f"w2{tag}_hi_plf"] = w_lo, w_hi
            q[f"r2{tag}_plf_per_ft"] = (w_hi - w_lo) / length
            tor[tag] = diaphragm_chain.chain_results(positions, lo, hi, w_lo, w_hi)
    layout_spans = diaphragm_spans(lines, (lo, hi))
    assert len(unit_spans) == len(layout_spans), "layout and engine spans disagree"
    span_rows: list[dict[str, Any]] = []
    w_wind_env = max(w["wind"], w["wmin"]) if wind else 0.0
    for n, (lay, u) in enumerate(zip(layout_spans, unit_spans, strict=True)):
        r: dict[str, Any] = {"start_ft": u.span.start_ft, "end_ft": u.span.end_ft}
        r["L_ft"] = u.span.length_ft
        r["LW"] = 0.0 if u.span.kind == "cantilever" else u.span.length_ft / b
        r["Ma_unit_ft2"], r["Mb_unit_ft2"] = u.Ma_lbft, u.Mb_lbft
        r["trib_start_ft"], r["trib_end_ft"] = u.R_a_lb, u.R_b_lb
        r["xs_unit_ft"], r["M_unit_ft2"] = u.x_star_ft, u.M_max_lbft
        r["geo_start_ft"], r["geo_end_ft"] = _geometric_shares_ft(u.span)
        share = max(u.R_a_lb, u.R_b_lb)
        T_design: list[float] = []
        if seismic:
            r["V_fpx_lb"] = w["fpx"] * share
            r["v_fpx_plf"] = diaphragm_tributary.diaphragm_unit_shear_plf(r["V_fpx_lb"], b)
            r["dcr_E"] = fac_E_dia * r["v_fpx_plf"] / q["vs_cap_plf"]
            r["M_fpx_lbft"] = w["fpx"] * u.M_max_lbft
            r["T_fpx_lb"] = diaphragm_tributary.chord_force_lb(r["M_fpx_lbft"], b)
            T_design.append(fac_E_dia * r["T_fpx_lb"])
        if wind:
            V_cases = [w_wind_env * share]
            M_cases = [w_wind_env * u.M_max_lbft]
            for tag, (results, _) in tor.items():
                t = results[n]
                out[f"{P}.tspan.{lay.number}.L_ft"] = t.span.length_ft
                values = {
                    "p": t.p_plf,
                    "Ma": t.Ma_lbft,
                    "Mb": t.Mb_lbft,
                    "Ra": t.R_a_lb,
                    "Rb": t.R_b_lb,
                    "xs": t.x_star_ft,
                    "M": t.M_max_lbft,
                }
                for key, value in values.items():
                    out[f"{P}.tspan.{lay.number}.{key}_{tag}"] = value
                V_cases.append(t.V_max_lb)
                M_cases.append(t.M_max_lbft)
            r["V_wind_lb"] = max(V_cases)
            r["v_wind_plf"] = diaphragm_tributary.diaphragm_unit_shear_plf(r["V_wind_lb"], b)
            r["dcr_W"] = fac_W * r["v_wind_plf"] / q["vw_cap_plf"]
            r["M_wind_lbft"] = max(M_cases)
            r["T_wind_lb"] = diaphragm_tributary.chord_force_lb(r["M_wind_lbft"], b)
            T_design.append(fac_W * r["T_wind_lb"])
        r["T_design_lb"] = max(T_design)
        r["chord_dcr"] = _ratio(r["T_design_lb"], assembly.chord_capacity_lb)
        span_rows.append(r)
        for key, value in r.items():
            out[f"{P}.span.{lay.number}.{key}"] = value
        v_plf = {"E": r["v_fpx_plf"]} if seismic else {}
        if wind:
            v_plf["W"] = r["v_wind_plf"]
        kind = "simple" if u.span.kind == "simple" else "cantilever"
        defl = diaphragm_deflection.span_deflection(assembly, kind, r["L_ft"], b, v_plf)
        for key, value in defl.items():
            out[f"{P}.span.{lay.number}.{key}"] = value
        _diagram_results(P, lay.number, u, w, out)
        if u.span.kind == "cantilever":
            _cantilever_limits(spec, P, lay.number, u.span.length_ft, b, out)

    out[f"{P}.ar_max"] = max(r["LW"] for r in span_rows)
    out[f"{P}.ar_dcr"] = out[f"{P}.ar_max"] / sheathing.diaphragm_aspect_limit(assembly.sheathing)
    geo = _geometric_tributary_ft(positions, lo, hi)
    peaks_E: list[float] = []
    peaks_W: list[float] = []
    for i, ln in enumerate(lines):
        trib = unit_R[i]
        r = {"pos_ft": ln.position_ft, "trib_ft": trib, "trib_geo_ft": geo[i]}
        if seismic:
            r["R_seis"] = w["seis"] * trib
            r["R_seis_fpx"] = w["fpx"] * trib
            r["v_line_fpx_plf"] = diaphragm_tributary.diaphragm_unit_shear_plf(r["R_seis_fpx"], b)
        if wind:
            cases = {"w1": w["wind"] * trib, "wmin": w["wmin"] * trib}
            cases["w3"] = wind_cases.CASE_2_3_FRACTION * cases["w1"]
            if torsion:
                ratio = wind_cases.CASE_4_FRACTION / wind_cases.CASE_2_3_FRACTION
                cases["w2p"], cases["w2n"] = tor["p"][1][i], tor["n"][1][i]
                cases["w4p"], cases["w4n"] = ratio * cases["w2p"], ratio * cases["w2n"]
            for key, value in cases.items():
                r[f"R_{key}"] = value
            r["R_wind"], r["wind_case"] = governing_name(cases, WIND_CASE_NAMES)
            if torsion:  # the sheet names the case in two steps (formulas stay short)
                direct = ("w1", "wmin", "w3")
                r["case_a"] = (
                    r["wind_case"]
                    if any(WIND_CASE_NAMES[k] == r["wind_case"] for k in direct)
                    else "-"
                )
            r["v_line_wind_plf"] = diaphragm_tributary.diaphragm_unit_shear_plf(r["R_wind"], b)
        r["L_walls_ft"] = sum(seg.length_ft for seg in ln.story.segments)
        factors = _segment_factors(spec, level, ln)
        r["sum_Lk"] = sum(
            seg.length_ft * k for seg, k in zip(ln.story.segments, factors, strict=True)
        )
        if seismic:
            fac_E, fac_Em = out["combo.Fac_E"], out["combo.Fac_Em"]
            # magnitudes: a line beside a long overhang may be pulled the other way
            share = abs(trib)
            if omega:
                r["R_coll_E"] = collectors.collector_force_overstrength_lb(
                    fac_Em * abs(r["R_seis"]),
                    fac_Em * w["fpx_eq"] * share,
                    fac_Em * w["fpx_max"] * share,
                    fac_E_dia * w["fpx_min"] * share,
                )
            else:  # §12.3.3.4: +25 % on the §12.10.1.1 force where an irregularity calls for it
                fac_irr = out.get("irr.collector_factor", 1.0)
                r["R_coll_E"] = collectors.collector_force_basic_lb(
                    fac_E * abs(r["R_seis"]), fac_E_dia * fac_irr * abs(r["R_seis_fpx"])
                )
        if wind:
            r["R_coll_W"] = fac_W * r["R_wind"]
        segs = [(seg.start_ft, seg.length_ft) for seg in ln.story.segments]
        for tag in ("E", "W"):
            if f"R_coll_{tag}" not in r:
                continue
            peak, where = collector.collector_peak(b, r[f"R_coll_{tag}"], segs, factors)
            r[f"peak_{tag}_lb"], r[f"peak_{tag}_s_ft"] = peak, where
            (peaks_E if tag == "E" else peaks_W).append(peak)
        r["coll_dcr"] = _ratio(
            max(r.get("peak_E_lb", 0.0), r.get("peak_W_lb", 0.0)), assembly.collector_capacity_lb
        )
        for key, value in r.items():
            out[f"{P}.line.{ln.id}.{key}"] = value
        _collector_results(P, level, ln, b, r, factors, out)

    _summary(q, span_rows, peaks_E, peaks_W, assembly, omega, out)
    for key, value in q.items():
        out[f"{P}.{key}"] = value


def _geometric_shares_ft(span) -> tuple[float, float]:
    """Roof width a span gives the line at its start and at its end: L/2 each for a simple
    span, the whole overhang to its line for a cantilever (statics) [ft]."""
    if span.kind == "simple":
        return span.length_ft / 2.0, span.length_ft / 2.0
    if span.free_edge == "start":
        return 0.0, span.length_ft
    return span.length_ft, 0.0


def _geometric_tributary_ft(positions: list[float], lo: float, hi: float) -> list[float]:
    """Half the distance to each neighbouring line; the whole overhang at an outermost line
    (the roof width a line carries, statics) [ft]."""
    out = []
    for i, pos in enumerate(positions):
        left = (pos - positions[i - 1]) / 2.0 if i > 0 else pos - lo
        right = (positions[i + 1] - pos) / 2.0 if i + 1 < len(positions) else hi - pos
        out.append(left + right)
    return out


def cantilever_ratio_limit(spec: Spec) -> float:
    """Largest cantilever length / width L'/W, AWC SDPWS-2015 §4.2.5.2 (from memory, see the
    tests): 1.5 where the designer shows the deflections can be tolerated (wood structural
    panels), else 1.0 for a one-story structure and 0.67 above one story [-]."""
    if spec.diaphragms.cantilever_deflection_tolerated:
        return CANTILEVER_RATIO_TOLERATED
    return CANTILEVER_RATIO_ONE_STORY if len(spec.building.levels) == 1 else CANTILEVER_RATIO_MULTI


CANTILEVER_LENGTH_LIMIT_FT = 25.0
CANTILEVER_RATIO_ONE_STORY = 1.0
CANTILEVER_RATIO_MULTI = 0.67
CANTILEVER_RATIO_TOLERATED = 1.5


def _cantilever_limits(spec: Spec, P: str, number: int, a_ft: float, W_ft: float, out) -> None:
    """SDPWS-2015 §4.2.5.2 length and L'/W limits of one overhang, as a ratio to the limit
    (the story drift at its edge: analysis/overhang_drift.py, after the Drift step)."""
    limit = cantilever_ratio_limit(spec)
    values = {
        "a_ft": a_ft,
        "W_ft": W_ft,
        "a_over_W": a_ft / W_ft,
        "ratio_limit": limit,
        "dcr": max(a_ft / CANTILEVER_LENGTH_LIMIT_FT, a_ft / W_ft / limit),
    }
    for key, value in values.items():
        out[f"{P}.cant.{number}.{key}"] = value


def _diagram_results(P: str, number: int, u, w: dict[str, float], out: dict[str, Any]) -> None:
    """Quarter points of a span's shear and moment under the uniform loads (F_px; wind Case 1),
    with the overhang moments carried over the line (statics)."""
    span = u.span
    local = replace(span, start_ft=0.0, end_ft=span.length_ft)
    for k, frac in enumerate(DIAGRAM_FRACTIONS):
        xi = frac * span.length_ft
        base = f"{P}.diag.{number}.{k}"
        out[f"{base}.xi_ft"] = xi
        out[f"{base}.x_ft"] = span.start_ft + xi
        for src in ("fpx", "wind"):
            if src not in w:
                continue
            if span.kind == "simple":
                L = span.length_ft
                V = w[src] * (u.R_a_lb - xi)
                # the form that is exactly -M_a at x = 0 and -M_b at x = L (no rounding residue)
                M = w[src] * (xi * (L - xi) / 2.0 - u.Ma_lbft * (1.0 - xi / L) - u.Mb_lbft * xi / L)
            else:
                V = diaphragm_tributary.span_shear_at_lb(w[src], local, xi)
                M = diaphragm_tributary.span_moment_at_lbft(w[src], local, xi)
            out[f"{base}.V_{src}_lb"] = V
            out[f"{base}.M_{src}_lbft"] = M


def _collector_results(
    P: str,
    level: Level,
    ln: ResistingLine,
    b: float,
    r: dict[str, Any],
    factors: list[float],
    out: dict[str, Any],
) -> None:
    segs = [(seg.start_ft, seg.length_ft) for seg in ln.story.segments]
    points = collector_points(b, ln.story)
    assert len(points) == len(collector.collector_breakpoints(b, segs))
    peak = {"E": 0.0, "W": 0.0}
    where = {"E": 0.0, "W": 0.0}
    for p in points:
        base = f"{P}.coll.{ln.id}.{p.index}"
        out[f"{base}.s_ft"] = p.s_ft
        out[f"{base}.Lk_ft"] = sum(
            k * min(max(p.s_ft - s, 0.0), L) for (s, L), k in zip(segs, factors, strict=True)
        )
        for tag in ("E", "W"):
            R = r.get(f"R_coll_{tag}")
            if R is None:
                continue
            F = collector.collector_force_at_lb(b, R, segs, p.s_ft, factors)
            out[f"{base}.F_{tag}_lb"] = F
            # running peak, the rule of collector.collector_peak (first of near-equal peaks)
            if abs(F) > peak[tag] + 1e-9 * max(1.0, peak[tag]):
                peak[tag], where[tag] = abs(F), p.s_ft
            out[f"{base}.peak_{tag}_lb"] = peak[tag]
            out[f"{base}.peak_{tag}_s_ft"] = where[tag]


def _summary(q, span_rows, peaks_E, peaks_W, assembly, omega, out) -> None:
    """Governing factored unit shear, DCR, chord and collector force with their source."""
    keys = ("seismic_additive", "seismic_additive_dia", "wind_additive")
    names = {k: out.get(f"combo.{k}") for k in keys}
    coll_E = out.get("combo.overstrength_additive") if omega else names["seismic_additive"]
    fac = {"fpx": out.get("combo.Fac_E_dia"), "wind": out.get("combo.Fac_W")}
    text = {"fpx": names["seismic_additive_dia"], "wind": names["wind_additive"]}
    srcs = [s for s in ("fpx", "wind") if f"v_{s}_plf" in span_rows[0]]

    def governing(values: dict[str, float]) -> tuple[float, str]:
        # seismic first: it wins a tie (the workbook's IF(seismic >= wind, ...))
        best = max(srcs, key=lambda s: (values[s], s == "fpx"))
        return values[best], text[best]

    v = {s: fac[s] * max(r[f"v_{s}_plf"] for r in span_rows) for s in srcs}
    q["v_max_plf"], q["v_source"] = governing(v)
    dcr = {s: max(r[f"dcr_{'E' if s == 'fpx' else 'W'}"] for r in span_rows) for s in srcs}
    q["dcr_max"], q["dcr_source"] = governing(dcr)
    chord = {s: fac[s] * max(r[f"T_{s}_lb"] for r in span_rows) for s in srcs}
    q["chord_max_lb"], q["chord_source"] = governing(chord)
    q["chord_dcr_max"] = _ratio(q["chord_max_lb"], assembly.chord_capacity_lb)
    coll = {}
    if peaks_E:
        coll["fpx"] = max(peaks_E)
    if peaks_W:
        coll["wind"] = max(peaks_W)
    text["fpx"] = coll_E
    q["collector_max_lb"], q["collector_source"] = governing(coll)
    q["collector_dcr_max"] = _ratio(q["collector_max_lb"], assembly.collector_capacity_lb)
