"""Rows of the Schedules sheet (layout only, shared by the analysis and the workbook):
shear-wall assemblies with the segments that use them, every segment's hold-down, and every
collector line."""

from __future__ import annotations

from typing import Any

from latbook.spec.models import Spec
from latbook.spec.plan_geometry import DIRECTIONS, resisting_lines
from latbook.spec.wall_stories import wall_stories

Rows = list[dict[str, Any]]


def schedule_collections(spec: Spec) -> dict[str, Rows]:
    """`sched_walls`, `sched_hold_downs`, `sched_collectors`; empty without wall lines."""
    if not spec.wall_lines:
        return {}
    users: dict[str, list[str]] = {a.id: [] for a in spec.assemblies.shear_walls}
    hold_downs: Rows = []
    for story in wall_stories(spec):
        lv = story.level.id
        for line in story.lines:
            for seg in line.segments:
                name = f"{lv} line {line.line.id} seg {seg.segment.id}"
                users[seg.segment.assembly].append(f"{lv}/{line.line.id}/{seg.segment.id}")
                hold_downs.append(
                    {
                        "hkey": f"{lv}.{seg.key}",
                        "level": lv,
                        "sid": seg.key,
                        "seg_in": f"{line.line.id}.{lv}.{seg.segment.id}",
                        "label": name,
                        "row_label": name,
                    }
                )
    walls = [
        {
            "assembly": a.id,
            "description": a.description,
            "used_by": ", ".join(users[a.id]) or "(not used)",
            "row_label": f"assembly {a.id}",
        }
        for a in spec.assemblies.shear_walls
    ]
    collectors: Rows = []
    for level in sorted(spec.building.levels, key=lambda lv: -lv.elevation_ft):
        for d in DIRECTIONS:
            for ln in resisting_lines(spec, level.id, d):
                collectors.append(
                    {
                        "ckey": f"{level.id}.{d}.{ln.id}",
                        "level": level.id,
                        "dir": d,
                        "line": ln.id,
                        "assembly": level.diaphragm_assembly or "",
                        "label": f"{level.id} line {ln.id} (load in {d})",
                        "row_label": f"collector {level.id} {d} {ln.id}",
                    }
                )
    return {"sched_walls": walls, "sched_hold_downs": hold_downs, "sched_collectors": collectors}
