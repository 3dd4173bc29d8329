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

from latbook.engine import collector, diaphragm_tributary
from latbook.engine.sdpws import capacity
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

NOT_GIVEN = "not given"
"""Shown where a demand/capacity ratio needs a capacity the spec does not give."""

OVERSTRENGTH_SDCS = ("C", "D", "E", "F")
"""Seismic design categories whose collectors need overstrength, ASCE 7-16 §12.10.2.1."""


def levels_top_down(spec: Spec) -> list[Level]:
    return sorted(spec.building.levels, key=lambda lv: -lv.elevation_ft)


def collector_overstrength_applies(spec: Spec, sdc: str) -> bool:
    """True when collectors take the overstrength load effect: SDC C-F and the light-frame
    exception not taken, ASCE 7-16 §12.10.2.1 (exception from memory: structures braced
    entirely by light-frame shear walls may use the §12.10.1.1 forces)."""
    s = spec.seismic
    return s is not None and sdc in OVERSTRENGTH_SDCS and not s.collector_light_frame_exception


def diaphragm_results(spec: Spec, out: dict[str, Any]) -> None:
    """Every diaphragm quantity id -> value; nothing when the spec has no wall lines."""
    if not spec.wall_lines:
        return
    _input_results(spec, out)
    omega = False
    if spec.seismic is not None:
        omega = collector_overstrength_applies(spec, out["seismic.SDC"])
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
    for line in spec.wall_lines:
        out[f"line.{line.id}.position_ft"] = line.position_ft
        for story in line.stories:
            for seg in story.segments:
                base = f"segment.{line.id}.{story.level}.{seg.id}"
                out[f"{base}.start_ft"] = seg.start_ft
                out[f"{base}.length_ft"] = seg.length_ft
    for a in spec.assemblies.diaphragms:
        out[f"dassembly.{a.id}.vs_nominal_plf"] = a.vs_nominal_plf
        out[f"dassembly.{a.id}.vw_nominal_plf"] = a.vw_nominal_plf
        out[f"dassembly.{a.id}.chord_capacity_lb"] = a.chord_capacity_lb
        out[f"dassembly.{a.id}.collector_capacity_lb"] = a.collector_capacity_lb


def _ratio(demand: float, capacity_value: float | None) -> float | str:
    return NOT_GIVEN if capacity_value is None else demand / capacity_value


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
    lines = resisting_lines(spec, level.id, direction)
    lo, hi = span_extent_ft(level, direction)
    b = depth_ft(level, direction)
    length = hi - lo
    q: dict[str, Any] = {"depth_ft": b, "span_length_ft": length}
    w: dict[str, float] = {}
    if seismic:
        row = f"seismic.level.{level.id}"
        for src, key in (
            ("seis", "Fx"),
            ("fpx", "Fpx"),
            ("fpx_eq", "Fpx_eq"),
            ("fpx_min", "Fpx_min"),
        ):
            q[f"{key}_kip"] = out[f"{row}.{key}"]
            w[src] = q[f"w_{src}_plf"] = 1000.0 * out[f"{row}.{key}"] / length
    if wind:
        q["F_wind_kip"] = out[f"wind.{direction}.level.{level.id}.F_level"]
        w["wind"] = q["w_wind_plf"] = 1000.0 * q["F_wind_kip"] / length
    method = spec.design_method
    q["vs_cap_plf"] = capacity.unit_shear_capacity(assembly.vs_nominal_plf, method)
    q["vw_cap_plf"] = capacity.unit_shear_capacity(assembly.vw_nominal_plf, method)
    fac_E_dia = out.get("combo.Fac_E_dia", 0.0)
    fac_W = out.get("combo.Fac_W", 0.0)

    positions = [ln.position_ft for ln in lines]
    engine_spans = diaphragm_tributary.spans(positions, lo, hi)
    layout_spans = diaphragm_spans(lines, (lo, hi))
    assert len(engine_spans) == len(layout_spans), "layout and engine spans disagree"
    span_rows: list[dict[str, Any]] = []
    for lay, span in zip(layout_spans, engine_spans, strict=True):
        r: dict[str, Any] = {"start_ft": span.start_ft, "end_ft": span.end_ft}
        r["L_ft"] = span.length_ft
        r["trib_start_ft"], r["trib_end_ft"] = diaphragm_tributary.span_reactions(1.0, span)
        T_design: list[float] = []
        for src, fac in (("fpx", fac_E_dia), ("wind", fac_W)):
            if src not in w:
                continue
            tag = "E" if src == "fpx" else "W"
            r[f"V_{src}_lb"] = max(diaphragm_tributary.span_reactions(w[src], span))
            r[f"v_{src}_plf"] = diaphragm_tributary.span_max_unit_shear_plf(w[src], span, b)
            cap = q["vs_cap_plf"] if src == "fpx" else q["vw_cap_plf"]
            r[f"dcr_{tag}"] = fac * r[f"v_{src}_plf"] / cap
            r[f"M_{src}_lbft"] = diaphragm_tributary.span_max_moment_lbft(w[src], span)
            r[f"T_{src}_lb"] = diaphragm_tributary.chord_force_lb(r[f"M_{src}_lbft"], b)
            T_design.append(fac * r[f"T_{src}_lb"])
        r["T_design_lb"] = max(T_design)
        r["chord_dcr"] = _ratio(r["T_design_lb"], assembly.chord_capacity_lb)
        span_rows.append(r)
        for key, value in r.items():
            out[f"{P}.span.{lay.number}.{key}"] = value
        _diagram_results(P, lay.number, span, w, out)

    reactions = {src: diaphragm_tributary.line_reactions(w[src], positions, lo, hi) for src in w}
    tribs = diaphragm_tributary.line_reactions(1.0, positions, lo, hi)
    peaks_E: list[float] = []
    peaks_W: list[float] = []
    for i, ln in enumerate(lines):
        r = {"pos_ft": ln.position_ft, "trib_ft": tribs[i]}
        if seismic:
            r["R_seis"] = reactions["seis"][i]
            r["R_seis_fpx"] = reactions["fpx"][i]
            r["v_line_fpx_plf"] = diaphragm_tributary.diaphragm_unit_shear_plf(r["R_seis_fpx"], b)
        if wind:
            r["R_wind"] = reactions["wind"][i]
            r["v_line_wind_plf"] = diaphragm_tributary.diaphragm_unit_shear_plf(r["R_wind"], b)
        r["L_walls_ft"] = sum(seg.length_ft for seg in ln.story.segments)
        if seismic:
            if omega:
                r["R_coll_E"] = max(
                    out["combo.Fac_Em"] * max(r["R_seis"], w["fpx_eq"] * tribs[i]),
                    out["combo.Fac_E"] * w["fpx_min"] * tribs[i],
                )
            else:
                r["R_coll_E"] = out["combo.Fac_E"] * max(r["R_seis"], r["R_seis_fpx"])
        if wind:
            r["R_coll_W"] = fac_W * r["R_wind"]
        segs = [(seg.start_ft, seg.length_ft) for seg in ln.story.segments]
        for tag in ("E", "W"):
            if f"R_coll_{tag}" not in r:
                continue
            peak, where = collector.collector_peak(b, r[f"R_coll_{tag}"], segs)
            r[f"peak_{tag}_lb"], r[f"peak_{tag}_s_ft"] = peak, where
            (peaks_E if tag == "E" else peaks_W).append(peak)
        r["coll_dcr"] = _ratio(
            max(r.get("peak_E_lb", 0.0), r.get("peak_W_lb", 0.0)), assembly.collector_capacity_lb
        )
        for key, value in r.items():
            out[f"{P}.line.{ln.id}.{key}"] = value
        _collector_results(P, ln, b, r, out)

    _summary(q, span_rows, peaks_E, peaks_W, assembly, omega, out)
    for key, value in q.items():
        out[f"{P}.{key}"] = value


def _diagram_results(P: str, number: int, span, w: dict[str, float], out: dict[str, Any]) -> None:
    # the span in its own coordinate (0 to L), so xi is exactly the position the sheet uses
    local = replace(span, start_ft=0.0, end_ft=span.length_ft)
    for k, frac in enumerate(DIAGRAM_FRACTIONS):
        xi = frac * span.length_ft
        base = f"{P}.diag.{number}.{k}"
        out[f"{base}.xi_ft"] = xi
        out[f"{base}.x_ft"] = span.start_ft + xi
        for src in ("fpx", "wind"):
            if src in w:
                out[f"{base}.V_{src}_lb"] = diaphragm_tributary.span_shear_at_lb(w[src], local, xi)
                out[f"{base}.M_{src}_lbft"] = diaphragm_tributary.span_moment_at_lbft(
                    w[src], local, xi
                )


def _collector_results(
    P: str, ln: ResistingLine, b: float, r: dict[str, Any], out: dict[str, Any]
) -> None:
    segs = [(seg.start_ft, seg.length_ft) for seg in ln.story.segments]
    points = collector_points(b, ln.story)
    assert len(points) == len(collector.collector_breakpoints(b, segs))
    peak = {"E": 0.0, "W": 0.0}
    where = {"E": 0.0, "W": 0.0}
    for p in points:
        base = f"{P}.coll.{ln.id}.{p.index}"
        out[f"{base}.s_ft"] = p.s_ft
        out[f"{base}.walls_ft"] = sum(min(max(p.s_ft - s, 0.0), L) for s, L in segs)
        for tag in ("E", "W"):
            R = r.get(f"R_coll_{tag}")
            if R is None:
                continue
            F = collector.collector_force_at_lb(b, R, segs, p.s_ft)
            out[f"{base}.F_{tag}_lb"] = F
            # running peak, the rule of collector.collector_peak (first of near-equal peaks)
            if abs(F) > peak[tag] + 1e-9 * max(1.0, peak[tag]):
                peak[tag], where[tag] = abs(F), p.s_ft
            out[f"{base}.peak_{tag}_lb"] = peak[tag]
            out[f"{base}.peak_{tag}_s_ft"] = where[tag]


def _summary(q, span_rows, peaks_E, peaks_W, assembly, omega, out) -> None:
    """Governing factored unit shear, DCR, chord and collector force with their source."""
    names = {k: out.get(f"combo.{k}") for k in ("seismic_additive", "wind_additive")}
    coll_E = out.get("combo.overstrength_additive") if omega else names["seismic_additive"]
    fac = {"fpx": out.get("combo.Fac_E_dia"), "wind": out.get("combo.Fac_W")}
    text = {"fpx": names["seismic_additive"], "wind": names["wind_additive"]}
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
