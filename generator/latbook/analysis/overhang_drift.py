"""Story drift at the free edge of each diaphragm overhang, AWC SDPWS-2015 §4.2.5.2 ("story
drift at each edge of the diaphragm shall not exceed the ASCE 7 allowable story drift").

Model (stated on the Dia sheets): the edge moves with its supporting line plus the overhang's
own deflection (cantilever fixed against rotation at the line; the adjoining span's rotation
is not added). Story drift at the edge = the line's story drift on the Drift sheet + the
amplification x (the overhang's deflection - the deflection of the overhang of the level
below at the same edge on the same line, 0 where that level does not overhang there).
Seismic: Cd / Ie (ASCE 7-16 Eq. 12.8-15) on the deflection at F_px, against Δa (Table
12.12-1). Wind: the serviceability factor on the deflection at strength-level W, against
h / ratio (common practice; ASCE 7-16 has no wind drift limit). Runs after the Drift step.
"""

from __future__ import annotations

from typing import Any

from latbook.analysis.diaphragm import levels_top_down
from latbook.analysis.shear_walls import active_sources
from latbook.engine.asce7_16 import drift
from latbook.spec.models import Spec
from latbook.spec.overhangs import overhangs
from latbook.spec.plan_geometry import DIRECTIONS

NOT_CHECKED = "not checked: diaphragm deflection not computed (assembly inputs, Lines sheet)"
OK, NG = "ok", "NG"


def overhang_drift_results(spec: Spec, out: dict[str, Any]) -> None:
    """Every overhang edge-drift quantity; nothing when the spec has no wall lines."""
    if not spec.wall_lines:
        return
    sources = active_sources(spec)
    if not sources:
        return
    for level in levels_top_down(spec):
        for d in DIRECTIONS:
            for oh in overhangs(spec, level.id, d):
                _edge_results(spec, sources, level.id, d, oh, out)


def _edge_results(spec: Spec, sources, lv: str, d: str, oh, out: dict[str, Any]) -> None:
    n = oh.span.number
    base = f"diaph.{lv}.{d}.cant.{n}"
    row = f"drift.{lv}.{oh.line}"
    r: dict[str, Any] = {}
    dcrs: list[float] = []
    checked = True
    for src, tag in (("seis", "E"), ("wind", "W")):
        if src not in sources:
            continue
        dia = out[f"diaph.{lv}.{d}.span.{n}.defl_{tag}"]
        below = 0.0
        if oh.below_span is not None:
            below = out[f"diaph.{oh.below_level}.{d}.span.{oh.below_span}.defl_{tag}"]
        r[f"dia_{tag}"], r[f"dia_below_{tag}"] = dia, below
        if tag == "E":
            line, factor = out[f"{row}.Delta"], out["seismic.Cd"] / out["seismic.Ie"]
            r["Delta_line"], r["Delta_a"] = line, out[f"{row}.Delta_a"]
        else:
            line, factor = out[f"{row}.delta_s"], spec.drift.wind_serviceability_factor
            r["delta_s_line"], r["h"] = line, out[f"{row}.h"]
        if isinstance(dia, str) or isinstance(below, str):
            r[f"edge_{tag}"] = r[f"dcr_{tag}"] = NOT_CHECKED
            checked = False
            continue
        edge = drift.overhang_edge_drift_in(line, dia, below, factor)
        r[f"edge_{tag}"] = edge
        if tag == "E":
            r["dcr_E"] = edge / r["Delta_a"]
        else:
            r["dcr_W"] = drift.drift_ratio(edge, r["h"]) * spec.drift.wind_ratio
        dcrs.append(r[f"dcr_{tag}"])
    r["edge_dcr"] = max(dcrs) if checked else NOT_CHECKED
    r["edge_status"] = (NG if r["edge_dcr"] > 1 else OK) if checked else NOT_CHECKED
    r["edge_open"] = 0 if checked else 1
    for key, value in r.items():
        out[f"{base}.{key}"] = value
