"""Row collections of the Walls_<level>, Drift and Summary sheets (layout only).

Registered in `latbook.workbook.context.COLLECTION_BUILDERS`. Row keys: a line by its id,
a segment by '<line>.<segment>' (field `sid`), a drift row by '<level>.<line>'.
"""

from __future__ import annotations

from typing import Any

from latbook.spec.models import Spec
from latbook.spec.summary_items import SOURCE_TEXT, summary_items
from latbook.spec.wall_stories import StoryPlace, wall_stories

Rows = list[dict[str, Any]]


def segment_input_key(level: str, line: str, segment: str) -> str:
    """Key of a segment's row in the segment input table (sheet Walls_in, table segments)."""
    return f"{line}.{level}.{segment}"


def wall_collections(spec: Spec) -> dict[str, Rows]:
    """`wall_stories` (one Walls_<level> sheet each) and, per story, `wall_story_<level>`,
    `wall_lines_<level>`, `wall_segs_<level>`; `drift_rows`; `summary_items`."""
    if not spec.wall_lines:
        return {}
    out: dict[str, Rows] = {"wall_stories": [], "drift_rows": []}
    stories = wall_stories(spec)
    for story in stories:
        lv = story.level.id
        story_ctx = {
            "level": lv,
            "below": story.below.id if story.below is not None else None,
            "row_label": f"story below {lv}",
            "variants": ["lowest"] if story.below is None else [],
        }
        out["wall_stories"].append(story_ctx)
        out[f"wall_story_{lv}"] = [story_ctx]
        out[f"wall_lines_{lv}"] = _line_rows(story)
        out[f"wall_segs_{lv}"] = _segment_rows(story, top=story is stories[0])
        out["drift_rows"] += [
            {
                "level": lv,
                "line": ln.line.id,
                "dir": ln.line.direction,
                "did": f"{lv}.{ln.line.id}",
                "row_label": f"{lv} line {ln.line.id}",
            }
            for ln in story.lines
        ]
    base = stories[-1]
    variants = [
        v
        for v, on in (("seismic_wind", spec.seismic and spec.wind), ("seismic", spec.seismic))
        if on
    ]
    out["base_segments"] = [
        {
            "level": base.level.id,
            "sid": seg.key,
            "label": f"line {seg.line.id} seg {seg.segment.id}",
            "assembly": seg.segment.assembly,
            "seg_in": segment_input_key(base.level.id, seg.line.id, seg.segment.id),
            "row_label": f"base line {seg.line.id} seg {seg.segment.id}",
            "variants": variants,
        }
        for seg in base.segments
    ]
    out["sw_assemblies"] = [
        {
            "assembly": a.id,
            "description": a.description,
            "index": i,
            "row_label": f"shear-wall assembly {a.id}",
        }
        for i, a in enumerate(spec.assemblies.shear_walls)
    ]
    out["summary_items"] = [
        {
            "key": item.key,
            "family": item.family,
            "source_text": SOURCE_TEXT.get(item.source, "seismic or wind, governing"),
            "level": item.level,
            "dir": item.dir,
            "src": item.source,
            "unit": item.unit,
            "row_label": item.key,
            "variants": item.variants + (["first"] if n == 0 else []),
        }
        for n, item in enumerate(summary_items(spec))
    ]
    return out


def _line_rows(story: StoryPlace) -> Rows:
    return [
        {
            "level": story.level.id,
            "line": ln.line.id,
            "dir": ln.line.direction,
            "above": ln.above,
            "last_seg": ln.segments[-1].key,
            "li": ln.line_index,
            "row_label": f"line {ln.line.id}",
            "variants": ["has_above"] if ln.above else [],
        }
        for ln in story.lines
    ]


def _segment_rows(story: StoryPlace, top: bool) -> Rows:
    rows: Rows = []
    for ln in story.lines:
        for seg in ln.segments:
            variants = ["top"] if top else []
            if seg.segment_index == 0:
                variants.append("first_in_line")
            if not rows:
                variants.append("first_in_story")
            if seg.stacked_from_above:
                variants.append("stacked")
            if seg.segment.hold_down_continues_below and story.below is not None:
                variants.append("stacks_below")
            rows.append(
                {
                    "level": story.level.id,
                    "line": ln.line.id,
                    "dir": ln.line.direction,
                    "seg": seg.segment.id,
                    "sid": seg.key,
                    "assembly": seg.segment.assembly,
                    "above": ln.above,
                    "li": ln.line_index,
                    "seg_in": segment_input_key(story.level.id, ln.line.id, seg.segment.id),
                    "label": f"line {ln.line.id} seg {seg.segment.id}",
                    "row_label": f"line {ln.line.id} seg {seg.segment.id}",
                    "variants": variants,
                }
            )
    return rows
