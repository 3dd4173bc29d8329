"""Which wall lines a level's diaphragm bears on, and the points of each collector diagram.

Layout only (positions and order, no engineering numbers): shared by the analysis and the
workbook context so both walk the diaphragm spans, lines and collector breakpoints in the
same order. Coordinates follow the project convention: load "in x" is resisted by the
x-lines (they run parallel to x at y = position_ft); the diaphragm spans along y between
them; its depth b is the plan's x-length and its chords are the x_min and x_max edges.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Literal

from latbook.spec.models import Level, LineStory, Segment, Spec, WallLine

Direction = Literal["x", "y"]
DIRECTIONS: tuple[Direction, Direction] = ("x", "y")
POSITION_TOLERANCE_FT = 1e-9
"""Breakpoints closer than this are one point (the engine's collector uses the same)."""

DIAGRAM_FRACTIONS = (0.0, 0.25, 0.5, 0.75, 1.0)
"""Points of each span's shear and moment diagram (quarter points; the moment chart is drawn
smooth through them)."""

CHORD_EDGES = {"x": ("x_max edge", "x_min edge"), "y": ("y_max edge", "y_min edge")}
"""direction -> (chord edge in tension, in compression) of a simple span, load acting in +dir
(the edge the load pushes toward is the tension side; a cantilever has them the other way)."""


def span_axis(direction: Direction) -> str:
    """Plan axis the diaphragm spans along for a load in `direction` (the other axis)."""
    return "y" if direction == "x" else "x"


def depth_axis(direction: Direction) -> str:
    """Plan axis of the diaphragm depth b (parallel to the load)."""
    return direction


def _extent(level: Level, axis: str) -> tuple[float, float]:
    plan = level.plan
    if axis == "x":
        return plan.x_min_ft, plan.x_max_ft
    return plan.y_min_ft, plan.y_max_ft


def span_extent_ft(level: Level, direction: Direction) -> tuple[float, float]:
    """(start, end) of the diaphragm along its span axis, ft."""
    return _extent(level, span_axis(direction))


def depth_ft(level: Level, direction: Direction) -> float:
    """Diaphragm depth b parallel to the load (= chord spacing = collector line length), ft."""
    lo, hi = _extent(level, depth_axis(direction))
    return hi - lo


@dataclass(frozen=True)
class ResistingLine:
    """A wall line with walls in the story below a level, and its spec indices."""

    line: WallLine
    story: LineStory
    line_index: int
    story_index: int

    @property
    def id(self) -> str:
        return self.line.id

    @property
    def position_ft(self) -> float:
        return self.line.position_ft


def resisting_lines(spec: Spec, level_id: str, direction: Direction) -> list[ResistingLine]:
    """Lines of `direction` with segments in the story below `level_id`, sorted by position
    (spec order among equal positions)."""
    found: list[ResistingLine] = []
    for li, line in enumerate(spec.wall_lines):
        if line.direction != direction:
            continue
        for si, story in enumerate(line.stories):
            if story.level == level_id and story.segments:
                found.append(ResistingLine(line, story, li, si))
                break
    return sorted(found, key=lambda r: r.position_ft)


@dataclass(frozen=True)
class DiaphragmSpan:
    """One span: between two lines ("simple") or an overhang past the outermost line."""

    number: int  # 1-based, in order along the span axis
    kind: Literal["simple", "cantilever_start", "cantilever_end"]
    left: str | None  # line id at the start (None: the plan edge)
    right: str | None  # line id at the end (None: the plan edge)

    @property
    def label(self) -> str:
        return f"{self.left or 'edge'} to {self.right or 'edge'}"


def diaphragm_spans(
    lines: list[ResistingLine], extent_ft: tuple[float, float]
) -> list[DiaphragmSpan]:
    """Spans in order: overhang at the start (if the first line is off the edge), one simple
    span per pair of consecutive lines, overhang at the end (if any)."""
    start, end = extent_ft
    kinds: list[tuple[str, str | None, str | None]] = []
    if lines and lines[0].position_ft - start > POSITION_TOLERANCE_FT:
        kinds.append(("cantilever_start", None, lines[0].id))
    for a, b in zip(lines, lines[1:], strict=False):
        kinds.append(("simple", a.id, b.id))
    if lines and end - lines[-1].position_ft > POSITION_TOLERANCE_FT:
        kinds.append(("cantilever_end", lines[-1].id, None))
    return [DiaphragmSpan(n, k, left, right) for n, (k, left, right) in enumerate(kinds, 1)]  # type: ignore[arg-type]


@dataclass(frozen=True)
class CollectorPoint:
    """A breakpoint of a line's collector force diagram.

    at: "line_start", "line_end", "seg_start" or "seg_end" (of `segment`);
    after_wall: the stretch from the previous point to this one lies within a wall segment.
    """

    index: int
    s_ft: float
    at: str
    segment: Segment | None
    segment_index: int | None
    after_wall: bool

    @property
    def label(self) -> str:
        if self.segment is None:
            return "line start" if self.at == "line_start" else "line end"
        return f"{self.segment.id} {'start' if self.at == 'seg_start' else 'end'}"


def collector_points(b_ft: float, story: LineStory) -> list[CollectorPoint]:
    """Distinct breakpoints 0, every segment start and end, b along the line, sorted; where
    two coincide (within POSITION_TOLERANCE_FT) the first one listed here is kept, line ends
    before segment ends before segment starts."""
    raw: list[tuple[float, int, str, Segment | None, int | None]] = [
        (0.0, 0, "line_start", None, None),
        (b_ft, 1, "line_end", None, None),
    ]
    for gi, seg in enumerate(story.segments):
        raw.append((seg.start_ft, 3, "seg_start", seg, gi))
        raw.append((seg.start_ft + seg.length_ft, 2, "seg_end", seg, gi))
    raw.sort(key=lambda p: (p[0], p[1]))
    spans = [(seg.start_ft, seg.start_ft + seg.length_ft) for seg in story.segments]
    points: list[CollectorPoint] = []
    for s_ft, _, at, seg, gi in raw:
        if points and s_ft - points[-1].s_ft <= POSITION_TOLERANCE_FT:
            continue
        prev = points[-1].s_ft if points else None
        inside = prev is not None and any(
            a - POSITION_TOLERANCE_FT <= prev and s_ft <= b + POSITION_TOLERANCE_FT
            for a, b in spans
        )
        points.append(CollectorPoint(len(points), s_ft, at, seg, gi, inside))
    return points
