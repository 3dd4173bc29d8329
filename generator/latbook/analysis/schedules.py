"""The Schedules sheet: shear-wall assemblies, hold-downs, collectors and foundation
reactions gathered from the calculation results (no new engineering: the sheet collects what
the walls, diaphragm and Found sheets computed, AWC SDPWS-2015 §4.3.6.4.2 and ASCE 7-16
§12.10.2)."""

from __future__ import annotations

from typing import Any

from latbook.spec.models import Spec
from latbook.spec.schedule_rows import schedule_collections
from latbook.spec.wall_stories import wall_stories

NOT_GIVEN = "not given"
NO_UPLIFT = "no uplift"


def schedule_results(spec: Spec, out: dict[str, Any]) -> None:
    """Every Schedules quantity; nothing when the spec has no wall lines."""
    rows = schedule_collections(spec)
    if not rows:
        return
    segments = {
        (st.level, ln.id, seg.id): seg
        for ln in spec.wall_lines
        for st in ln.stories
        for seg in st.segments
    }
    for a in spec.assemblies.shear_walls:
        base = f"sched.wall.{a.id}"
        out[f"{base}.vs_nominal_plf"] = a.vs_nominal_plf
        out[f"{base}.vw_nominal_plf"] = a.vw_nominal_plf
        out[f"{base}.n_segments"] = sum(1 for s in segments.values() if s.assembly == a.id)
    for r in rows["sched_hold_downs"]:
        base = f"sched.hd.{r['hkey']}"
        seg_base = f"walls.{r['level']}.seg.{r['sid']}"
        forces = []
        for src in ("seis", "wind"):
            if f"{seg_base}.T_{src}" in out:
                out[f"{base}.T_{src}"] = out[f"{seg_base}.T_{src}"]
                forces.append(out[f"{seg_base}.T_{src}"])
        T = out[f"{base}.T"] = max(forces)
        line, level, seg_id = r["seg_in"].split(".")[0], r["level"], r["sid"].split(".", 1)[1]
        capacity = segments[(level, line, seg_id)].hold_down_capacity_lb
        out[f"{base}.capacity_lb"] = NOT_GIVEN if capacity is None else capacity
        if capacity is not None:
            out[f"{base}.ratio"] = T / capacity
        else:
            out[f"{base}.ratio"] = NOT_GIVEN if T > 0 else NO_UPLIFT
    _foundation_schedule(spec, out)
    caps = {a.id: a.collector_capacity_lb for a in spec.assemblies.diaphragms}
    for r in rows["sched_collectors"]:
        base = f"sched.coll.{r['ckey']}"
        line_base = f"diaph.{r['level']}.{r['dir']}.line.{r['line']}"
        for tag in ("E", "W"):
            if f"{line_base}.peak_{tag}_lb" in out:
                out[f"{base}.peak_{tag}_lb"] = out[f"{line_base}.peak_{tag}_lb"]
        capacity = caps.get(r["assembly"])
        out[f"{base}.capacity_lb"] = NOT_GIVEN if capacity is None else capacity
        out[f"{base}.ratio"] = out[f"{line_base}.coll_dcr"]


def _foundation_schedule(spec: Spec, out: dict[str, Any]) -> None:
    """Per bottom-story segment: the larger seismic or wind shear, uplift and compression
    the foundation receives (the Found sheet's design-level values)."""
    base_story = wall_stories(spec)[-1]
    for seg in base_story.segments:
        found = f"found.{seg.key}"
        for name in ("V", "T", "C"):
            values = [out[k] for k in (f"{found}.{name}_seis", f"{found}.{name}_wind") if k in out]
            out[f"sched.found.{seg.key}.{name}"] = max(values)
