"""Diaphragm overhangs (cantilevers past the outermost line) of a level and direction, with
the line that supports each and the overhang of the level below at the same edge (analysis
and layout share these, so both paths check the same edges)."""

from __future__ import annotations

from dataclasses import dataclass

from latbook.spec.models import Spec
from latbook.spec.plan_geometry import (
    DiaphragmSpan,
    Direction,
    diaphragm_spans,
    resisting_lines,
    span_extent_ft,
)
from latbook.spec.wall_heights import level_below


@dataclass(frozen=True)
class Overhang:
    """One overhang: its span, the supporting line, and the level below's overhang at the
    same edge on the same line (None where that level does not overhang there)."""

    span: DiaphragmSpan
    line: str
    below_level: str | None
    below_span: int | None


def level_spans(spec: Spec, level_id: str, direction: Direction) -> list[DiaphragmSpan]:
    level = next(lv for lv in spec.building.levels if lv.id == level_id)
    lines = resisting_lines(spec, level_id, direction)
    return diaphragm_spans(lines, span_extent_ft(level, direction))


def _line_of(span: DiaphragmSpan) -> str:
    line = span.left if span.kind == "cantilever_end" else span.right
    assert line is not None
    return line


def overhangs(spec: Spec, level_id: str, direction: Direction) -> list[Overhang]:
    """The overhangs of one diaphragm, in span order."""
    level = next(lv for lv in spec.building.levels if lv.id == level_id)
    below = level_below(spec, level)
    below_spans = level_spans(spec, below.id, direction) if below is not None else []
    found = []
    for span in level_spans(spec, level_id, direction):
        if span.kind == "simple":
            continue
        line = _line_of(span)
        match = next(
            (s for s in below_spans if s.kind == span.kind and _line_of(s) == line),
            None,
        )
        found.append(
            Overhang(
                span,
                line,
                below.id if match is not None and below is not None else None,
                match.number if match is not None else None,
            )
        )
    return found
