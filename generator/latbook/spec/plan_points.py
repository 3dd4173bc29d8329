"""The points of each level's key plan, in drawing order (layout only, no coordinates).

Shared by the analysis (which computes each point's x, y from the spec) and the workbook
context (which lays out one row per point, with formulas on the input cells), so both walk
the same points in the same order. A key plan is drawn for each story that has walls, on the
plan of the level the walls support: the outline (5 corners, closed), each wall line of the
story across the plan, then the story's segments grouped by shear-wall assembly (first use
order). A gap point (no coordinates) separates two pieces, so one chart series can hold many
disjoint pieces. Groups name the rows a chart series takes (`outline`, `lines`, `lines_x`,
`lines_y`, `seg`, `seg:<assembly>`); a gap belongs to the groups of both its neighbours, so
each group is one run of rows.
"""

from __future__ import annotations

from dataclasses import dataclass

from latbook.spec.models import Spec
from latbook.spec.wall_stories import wall_stories

OUTLINE_CORNERS = (
    ("x_min_ft", "y_min_ft"),
    ("x_max_ft", "y_min_ft"),
    ("x_max_ft", "y_max_ft"),
    ("x_min_ft", "y_max_ft"),
    ("x_min_ft", "y_min_ft"),
)
"""Plan extents (field names of `Plan`) at each outline corner, counter-clockwise, closed."""


@dataclass(frozen=True)
class PlanPoint:
    """One row of a key plan. `kind`: outline, line, segment or gap; `end`: "start" / "end"
    of a line or segment; `corner`: index into OUTLINE_CORNERS."""

    pid: str
    kind: str
    groups: frozenset[str]
    line: str | None = None
    direction: str | None = None
    segment: str | None = None
    assembly: str | None = None
    end: str | None = None
    corner: int | None = None


def plan_points(spec: Spec) -> dict[str, list[PlanPoint]]:
    """Level id -> its key plan's points, for every story with walls (roof first)."""
    return {story.level.id: _story_points(story) for story in wall_stories(spec)}


def _story_points(story) -> list[PlanPoint]:
    pieces: list[list[PlanPoint]] = [
        [
            PlanPoint(f"outline.{i + 1}", "outline", frozenset({"outline"}), corner=i)
            for i in range(5)
        ]
    ]
    for ln in sorted(story.lines, key=lambda ln: ln.line.direction):  # x-lines, then y-lines
        pieces.append(
            [
                PlanPoint(
                    f"line.{ln.line.id}.{end}",
                    "line",
                    frozenset({"lines", f"lines_{ln.line.direction}"}),
                    line=ln.line.id,
                    direction=ln.line.direction,
                    end=end,
                )
                for end in ("start", "end")
            ]
        )
    by_assembly: dict[str, list] = {}
    for seg in story.segments:
        by_assembly.setdefault(seg.segment.assembly, []).append(seg)
    for assembly, segs in by_assembly.items():
        for seg in segs:
            pieces.append(
                [
                    PlanPoint(
                        f"seg.{seg.line.id}.{seg.segment.id}.{end}",
                        "segment",
                        frozenset({"seg", f"seg:{assembly}"}),
                        line=seg.line.id,
                        direction=seg.line.direction,
                        segment=seg.segment.id,
                        assembly=assembly,
                        end=end,
                    )
                    for end in ("start", "end")
                ]
            )
    points: list[PlanPoint] = []
    for n, piece in enumerate(pieces):
        if n:
            shared = points[-1].groups & piece[0].groups
            points.append(PlanPoint(f"gap.{n}", "gap", shared))
        points += piece
    return points
