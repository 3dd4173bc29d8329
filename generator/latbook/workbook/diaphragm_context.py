"""Row collections of the wall-line inputs and the diaphragm sheets (layout only).

Collections (each row's fields go into its cells' ctx):
- `wall_lines_all`: every wall line in spec order (line, direction, index).
- `diaphragm_assemblies`: every diaphragm assembly (dassembly, description, index).
- `segments_all`: one row per (line, story, segment), stories roof first, lines and segments
  in spec order: line, level, seg, key "<line>.<level>.<seg>", li / si / gi (spec indices of
  line, story, segment), assembly.
- `diaphragm_cases`: one per (level, direction), roof first: level, dir, ax (span axis),
  bx (depth axis), assembly, T_edge / C_edge; one `Dia_<level>_<dir>` sheet each.
- per case `spans_<level>_<dir>`, `lines_<level>_<dir>`, `collector_<level>_<dir>` (one row
  per line and collector breakpoint) and `diag_<level>_<dir>` (chart points per span).
"""

from __future__ import annotations

from typing import Any

from latbook.spec.models import Spec
from latbook.spec.overhangs import overhangs
from latbook.spec.plan_geometry import (
    CHORD_EDGES,
    DIAGRAM_FRACTIONS,
    DIRECTIONS,
    collector_points,
    depth_ft,
    diaphragm_spans,
    resisting_lines,
    span_axis,
    span_extent_ft,
)

Rows = list[dict[str, Any]]


def _levels_top_down(spec: Spec):
    return sorted(spec.building.levels, key=lambda lv: -lv.elevation_ft)


def wall_input_collections(spec: Spec) -> dict[str, Rows]:
    """Input rows of the Lines and Walls_in sheets."""
    lines = [
        {"line": ln.id, "direction": ln.direction, "index": i, "row_label": f"line {ln.id}"}
        for i, ln in enumerate(spec.wall_lines)
    ]
    assemblies = [
        {
            "dassembly": a.id,
            "description": a.description,
            "index": i,
            "row_label": f"diaphragm {a.id}",
        }
        for i, a in enumerate(spec.assemblies.diaphragms)
    ]
    segments: Rows = []
    for level in _levels_top_down(spec):
        for li, line in enumerate(spec.wall_lines):
            for si, story in enumerate(line.stories):
                if story.level != level.id:
                    continue
                for gi, seg in enumerate(story.segments):
                    key = f"{line.id}.{level.id}.{seg.id}"
                    segments.append(
                        {
                            "line": line.id,
                            "level": level.id,
                            "seg": seg.id,
                            "key": key,
                            "li": li,
                            "si": si,
                            "gi": gi,
                            "assembly": seg.assembly,
                            "row_label": f"segment {key}",
                        }
                    )
    return {"wall_lines_all": lines, "diaphragm_assemblies": assemblies, "segments_all": segments}


def diaphragm_collections(spec: Spec) -> dict[str, Rows]:
    """The diaphragm sheets' collections; empty when the spec has no wall lines."""
    if not spec.wall_lines:
        return {}
    out: dict[str, Rows] = {"diaphragm_cases": []}
    for level in _levels_top_down(spec):
        for d in DIRECTIONS:
            t_edge, c_edge = CHORD_EDGES[d]
            out["diaphragm_cases"].append(
                {
                    "level": level.id,
                    "dir": d,
                    "ax": span_axis(d),
                    "bx": d,
                    "assembly": level.diaphragm_assembly or "",
                    "level_name": level.name or level.id,
                    "T_edge": t_edge,
                    "C_edge": c_edge,
                    "row_label": f"level {level.id}, load in {d}",
                }
            )
            out.update(_case_rows(spec, level, d))
    return out


def _case_rows(spec: Spec, level, d) -> dict[str, Rows]:
    suffix = f"{level.id}_{d}"
    lines = resisting_lines(spec, level.id, d)
    spans = diaphragm_spans(lines, span_extent_ft(level, d))
    t_edge, c_edge = CHORD_EDGES[d]
    edges = {oh.span.number: oh for oh in overhangs(spec, level.id, d)}
    span_rows: Rows = []
    diag_rows: Rows = []
    cant_rows: Rows = []
    for i, sp in enumerate(spans):
        kind_text = "simple" if sp.kind == "simple" else "cantilever"
        simple = sp.kind == "simple"
        variants = [sp.kind]
        if simple and i > 0 and spans[i - 1].kind == "cantilever_start":
            variants.append("after_cant")
        if simple and i + 1 < len(spans) and spans[i + 1].kind == "cantilever_end":
            variants.append("before_cant")
        if not simple:
            oh = edges[sp.number]
            cant_rows.append(
                {
                    "span": str(sp.number),
                    "span_label": sp.label,
                    "line": oh.line,
                    "did": f"{level.id}.{oh.line}",
                    "below": oh.below_level or "",
                    "bspan": str(oh.below_span or ""),
                    "variants": ["below"] if oh.below_span is not None else [],
                    "row_label": f"overhang {sp.label}",
                }
            )
        span_rows.append(
            {
                "span": str(sp.number),
                "span_label": sp.label,
                "kind_text": kind_text,
                "left": sp.left or "",
                "right": sp.right or "",
                "T_edge_span": t_edge if simple else c_edge,
                "C_edge_span": c_edge if simple else t_edge,
                "variants": variants,
                "row_label": f"span {sp.label}",
            }
        )
        for k, frac in enumerate(DIAGRAM_FRACTIONS):
            diag_rows.append(
                {
                    "key": f"{sp.number}.{k}",
                    "k": k,
                    "span": str(sp.number),
                    "span_label": sp.label,
                    "frac": repr(frac),
                    "variants": [sp.kind],
                    "row_label": f"span {sp.label} at {frac:g} L",
                }
            )
    left_of = {sp.right: str(sp.number) for sp in spans if sp.right}
    right_of = {sp.left: str(sp.number) for sp in spans if sp.left}
    line_rows: Rows = []
    coll_rows: Rows = []
    b = depth_ft(level, d)
    for ln in lines:
        points = collector_points(b, ln.story)
        variants = [
            v
            for v, on in (("no_left", ln.id not in left_of), ("no_right", ln.id not in right_of))
            if on
        ]
        line_rows.append(
            {
                "line": ln.id,
                "lspan": left_of.get(ln.id, ""),
                "rspan": right_of.get(ln.id, ""),
                "last_bp": f"{ln.id}.{points[-1].index}",
                "variants": variants,
                "row_label": f"line {ln.id}",
            }
        )
        for p, prev in zip(points, [None, *points[:-1]], strict=True):
            wall = _wall_under(ln.story.segments, prev.s_ft, p.s_ft) if p.after_wall else None
            coll_rows.append(
                {
                    "key": f"{ln.id}.{p.index}",
                    "line": ln.id,
                    "at_label": p.label,
                    "bp": p.index,
                    "wseg": f"{ln.id}.{wall.id}" if wall is not None else "",
                    "seg_key": f"{ln.id}.{level.id}.{p.segment.id}" if p.segment else "",
                    "variants": [p.at, *(["after_wall"] if p.after_wall else [])],
                    "row_label": f"line {ln.id}, {p.label}",
                }
            )
    return {
        f"spans_{suffix}": span_rows,
        f"lines_{suffix}": line_rows,
        f"collector_{suffix}": coll_rows,
        f"diag_{suffix}": diag_rows,
        f"cant_{suffix}": cant_rows,
    }


def _wall_under(segments, s0_ft: float, s1_ft: float):
    """The segment that covers the stretch s0..s1 of a line (collector breakpoints)."""
    mid = (s0_ft + s1_ft) / 2.0
    for seg in segments:
        if seg.start_ft <= mid <= seg.start_ft + seg.length_ft:
            return seg
    raise AssertionError("a stretch marked as within a wall has no wall")
