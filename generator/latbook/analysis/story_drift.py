"""Story drift of each wall line in each story (ASCE 7-16 §12.8.6, Table 12.12-1) and wind
drift at a serviceability level against a ratio (no code limit; common practice).

Each line's elastic story drift delta_xe is the largest, over its segments in that story, of
the SDPWS-2015 Eq. 4.3-1 deflection at strength-level forces plus the displacement carried up
by the rotation of the stacked segments below (hold-down elongation and chord strain; 0 where
a segment does not stack on one below). Flexible diaphragm: lines drift independently. Wind
drift: the force-driven part scaled by the serviceability factor, shrinkage and crushing (and a
Δa given without a rated load) kept whole.
"""

from __future__ import annotations

from typing import Any

from latbook.analysis.shear_walls import active_sources
from latbook.engine.asce7_16 import drift
from latbook.spec.models import Spec
from latbook.spec.wall_stories import wall_stories


def drift_label(level: str, line: str) -> str:
    return f"story below {level}, line {line}"


def drift_results(spec: Spec, out: dict[str, Any]) -> None:
    """Every Drift quantity; nothing when the spec has no wall lines."""
    if not spec.wall_lines:
        return
    sources = active_sources(spec)
    out["input.drift.seismic_row"] = spec.drift.seismic_row
    out["input.drift.wind_ratio"] = spec.drift.wind_ratio
    out["input.drift.wind_serviceability_factor"] = spec.drift.wind_serviceability_factor
    rc = spec.building.risk_category
    coefficient = drift.ALLOWABLE_DRIFT[spec.drift.seismic_row][drift.risk_category_group(rc)]
    if "seis" in sources:
        out["drift.coef"] = coefficient
    rows: dict[str, list[tuple[float, str]]] = {src: [] for src in sources}
    for story in wall_stories(spec):
        lv = story.level.id
        h_ft = out[f"walls.{lv}.h_story_ft"]
        for line in story.lines:
            ln = line.line.id
            base = f"drift.{lv}.{ln}"
            out[f"{base}.h"] = h_ft
            label = drift_label(lv, ln)
            if "seis" in sources:
                delta_xe = out[f"walls.{lv}.line.{ln}.delta_seis_max"]
                out[f"{base}.delta_own"] = out[f"walls.{lv}.line.{ln}.delta_seis_own_max"]
                out[f"{base}.delta_rot"] = out[f"walls.{lv}.line.{ln}.delta_seis_rot_max"]
                Delta = drift.design_story_drift_in(delta_xe, out["seismic.Cd"], out["seismic.Ie"])
                Delta_a = drift.allowable_story_drift_in(spec.drift.seismic_row, rc, h_ft)
                out[f"{base}.delta_xe"] = delta_xe
                out[f"{base}.Delta"] = Delta
                out[f"{base}.Delta_a"] = Delta_a
                out[f"{base}.dcr_seis"] = Delta / Delta_a
                rows["seis"].append((Delta / Delta_a, label))
            if "wind" in sources:
                out[f"{base}.delta_w"] = out[f"walls.{lv}.line.{ln}.delta_wind_max"]
                out[f"{base}.delta_w_rot"] = out[f"walls.{lv}.line.{ln}.delta_wind_rot_max"]
                delta_s = out[f"walls.{lv}.line.{ln}.delta_wind_serv_max"]
                ratio = drift.drift_ratio(delta_s, h_ft)
                out[f"{base}.delta_s"] = delta_s
                out[f"{base}.ratio_w"] = ratio
                out[f"{base}.dcr_wind"] = ratio * spec.drift.wind_ratio
                rows["wind"].append((ratio * spec.drift.wind_ratio, label))
    for src, found in rows.items():
        values = [v for v, _ in found]
        i = values.index(max(values))
        out[f"drift.dcr_{src}_max"] = values[i]
        out[f"drift.gov_{src}"] = found[i][1]
