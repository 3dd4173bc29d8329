"""Row collections of the Regularity sheet (layout only): `reg_segs` (segments grouped by
story and direction, roof first), `story_dirs` (one row per story and direction),
`reg_mass` (levels roof first) and `irregularities` (Tables 12.3-1 / 12.3-2 rows)."""

from __future__ import annotations

from typing import Any

from latbook.analysis.regularity import DECLARED, IRREGULARITIES, STATIC_DETAIL, story_dirs
from latbook.spec.models import Spec

Rows = list[dict[str, Any]]
PLAN_FIELDS = {"x": ("y_min_ft", "y_max_ft"), "y": ("x_min_ft", "x_max_ft")}
CHECKED_DETAIL = {
    "V1a": "stiffness ratios by story and direction, table above",
    "V1b": "stiffness ratios by story and direction, table above",
    "V2": "w_x ratios by level, table above",
    "V4": "segments not spanned by a segment below, table above",
    "V5a": "strength ratios by story and direction, table above",
    "V5b": "strength ratios by story and direction, table above",
}


def regularity_collections(spec: Spec) -> dict[str, Rows]:
    """The collections; empty without seismic or wall lines."""
    if spec.seismic is None or not spec.wall_lines:
        return {}
    segs: Rows = []
    sds: Rows = []
    for sd in story_dirs(spec):
        lv = sd.story.level.id
        lo, hi = PLAN_FIELDS[sd.dir]
        for n, seg in enumerate(sd.segments):
            variants = []
            if n == 0:
                variants.append("first_in_group")
            if sd.story.below is None:
                variants.append("lowest")
            segs.append(
                {
                    "level": lv,
                    "dir": sd.dir,
                    "line": seg.line.id,
                    "seg": seg.segment.id,
                    "sid": seg.key,
                    "rkey": f"{lv}.{seg.key}",
                    "sd": sd.key,
                    "assembly": seg.segment.assembly,
                    "below": sd.story.below.id if sd.story.below is not None else None,
                    "lo_field": lo,
                    "hi_field": hi,
                    "row_label": f"{lv} line {seg.line.id} seg {seg.segment.id}",
                    "variants": variants,
                }
            )
        above3 = dict(zip(("a1", "a2", "a3"), (f"{a}.{sd.dir}" for a in sd.above3), strict=False))
        sds.append(
            {
                "level": lv,
                "dir": sd.dir,
                "sd": sd.key,
                "above_sd": f"{sd.above}.{sd.dir}" if sd.above else None,
                **above3,
                "last_rkey": f"{lv}.{sd.segments[-1].key}",
                "row_label": f"story below {lv}, {sd.dir}",
                "variants": [
                    v for v, on in (("top", not sd.above), ("three_above", sd.above3)) if on
                ],
            }
        )
    return {
        "reg_segs": segs,
        "story_dirs": sds,
        "reg_mass": _mass_rows(spec),
        "irregularities": [
            {
                "typ": typ,
                "name": name,
                "basis_text": DECLARED if basis == "declared" else "checked by this workbook",
                "detail": STATIC_DETAIL.get(typ, CHECKED_DETAIL.get(typ, "declaration above")),
                "consequence": consequence,
                "row_label": typ,
                "variants": [typ],
            }
            for typ, name, basis, consequence in IRREGULARITIES
        ],
    }


def _mass_rows(spec: Spec) -> Rows:
    levels = sorted(spec.building.levels, key=lambda lv: -lv.elevation_ft)
    n = len(levels)
    rows: Rows = []
    for i, lv in enumerate(levels):
        top, lowest = i == 0, i == n - 1
        variants = [
            v
            for v, on in (
                ("single", n == 1),
                ("second_lowest", i == 1 and lowest),
                ("top", top),
                ("second", i == 1),
                ("lowest", lowest),
            )
            if on
        ]
        rows.append(
            {
                "level": lv.id,
                "above": levels[i - 1].id if i > 0 else None,
                "below": levels[i + 1].id if i + 1 < n else None,
                "row_label": f"level {lv.id}",
                "variants": variants,
            }
        )
    return rows
