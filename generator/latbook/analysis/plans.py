"""Coordinates of each level's key plan (the Plan_<level> sheets): plan geometry from the
spec, ft, by the same points as `latbook.spec.plan_points`.

An x-line runs parallel to x at y = position, a y-line parallel to y at x = position; both
cross the plan of the level the story's walls support. A segment starts `start_ft` along its
line from the plan minimum of that level (x_min for an x-line, y_min for a y-line).
"""

from __future__ import annotations

from typing import Any

from latbook.spec.models import Spec
from latbook.spec.plan_points import OUTLINE_CORNERS, PlanPoint, plan_points


def plan_results(spec: Spec, out: dict[str, Any]) -> None:
    """`plan.<level>.<pid>.x_ft` and `.y_ft` of every point but the gaps."""
    if not spec.wall_lines:
        return
    levels = {lv.id: lv for lv in spec.building.levels}
    lines = {ln.id: ln for ln in spec.wall_lines}
    for level_id, points in plan_points(spec).items():
        plan = levels[level_id].plan.model_dump()
        segments = {
            (ln.id, seg.id): seg
            for ln in spec.wall_lines
            for story in ln.stories
            if story.level == level_id
            for seg in story.segments
        }
        for point in points:
            if point.kind == "gap":
                continue
            x, y = _point_ft(point, plan, lines, segments)
            out[f"plan.{level_id}.{point.pid}.x_ft"] = x
            out[f"plan.{level_id}.{point.pid}.y_ft"] = y


def _point_ft(point: PlanPoint, plan: dict[str, float], lines, segments) -> tuple[float, float]:
    if point.kind == "outline":
        xf, yf = OUTLINE_CORNERS[point.corner]
        return plan[xf], plan[yf]
    position = lines[point.line].position_ft
    axis = point.direction  # the axis the line runs along
    if point.kind == "line":
        along = plan[f"{axis}_{'min' if point.end == 'start' else 'max'}_ft"]
    else:
        seg = segments[(point.line, point.segment)]
        along = plan[f"{axis}_min_ft"] + seg.start_ft
        if point.end == "end":
            along = along + seg.length_ft
    return (along, position) if axis == "x" else (position, along)
