"""Row collections of the key plans (Plan_<level> sheets; layout only).

`plan_pts_<level>`: one row per point of `latbook.spec.plan_points`, with the variant that
picks its x and y formulas (outline, line_<axis>_<end>, seg_<axis>_<end>, gap), the plan
extents of an outline corner (`xf`, `yf`), the line and segment-input keys the formulas look
up, the chart groups and the wall-line name shown at a line's start.
"""

from __future__ import annotations

from typing import Any

from latbook.spec.models import Spec
from latbook.spec.plan_points import OUTLINE_CORNERS, PlanPoint, plan_points
from latbook.workbook.wall_collections import segment_input_key

Rows = list[dict[str, Any]]


def plan_collections(spec: Spec) -> dict[str, Rows]:
    if not spec.wall_lines:
        return {}
    return {
        f"plan_pts_{level}": [_row(level, p) for p in points]
        for level, points in plan_points(spec).items()
    }


def _row(level: str, p: PlanPoint) -> dict[str, Any]:
    row: dict[str, Any] = {
        "level": level,
        "pid": p.pid,
        "groups": sorted(p.groups),
        "label": "",
        "row_label": f"plan {level} {p.pid}",
    }
    if p.kind == "gap":
        return {**row, "item": "(gap between pieces)", "variants": ["gap"]}
    if p.kind == "outline":
        xf, yf = OUTLINE_CORNERS[p.corner]
        return {
            **row,
            "item": f"outline corner {p.corner + 1}",
            "variants": ["outline"],
            "xf": xf,
            "yf": yf,
        }
    row["line"] = p.line
    if p.kind == "line":
        return {
            **row,
            "item": f"line {p.line} {p.end}",
            "label": p.line if p.end == "start" else "",
            "variants": [f"line_{p.direction}_{p.end}"],
        }
    return {
        **row,
        "item": f"line {p.line} seg {p.segment} {p.end} ({p.assembly})",
        "seg_in": segment_input_key(level, p.line, p.segment),
        "variants": [f"seg_{p.direction}_{p.end}"],
    }
