"""Which rows the Summary sheet has: one per element family, story and load source.

Layout only, shared by the analysis and the workbook context. A row exists only when the
quantity it shows exists (seismic rows need seismic, wind rows need wind).
"""

from __future__ import annotations

from dataclasses import dataclass

from latbook.spec.models import Spec
from latbook.spec.plan_geometry import diaphragm_spans, resisting_lines, span_extent_ft
from latbook.spec.wall_stories import levels_top_down, wall_stories

SOURCE_TEXT = {"seis": "seismic", "wind": "wind"}
DIAPHRAGM_FAMILIES = (
    ("diaph", "diaphragm", "-"),
    ("diaph_ar", "diaphragm aspect ratio", "-"),
    ("chord", "chord", "lb"),
    ("collector", "collector", "lb"),
)
"""(kind, family, demand unit) of the rows per level and load direction."""


@dataclass(frozen=True)
class SummaryItem:
    key: str
    kind: str  # "diaph", "diaph_ar", "chord", "collector", "cantilever", "wall", "hold_down",
    # "drift"
    family: str
    source: str  # "seis", "wind" or "both"
    level: str = ""
    dir: str = ""
    unit: str = "-"

    @property
    def variants(self) -> list[str]:
        """Most specific first: the formula variant picked for each column."""
        return [f"{self.kind}_{self.source}", self.kind, self.source]


def _has_overhang(spec: Spec, level, direction) -> bool:
    lines = resisting_lines(spec, level.id, direction)
    spans = diaphragm_spans(lines, span_extent_ft(level, direction))
    return any(sp.kind != "simple" for sp in spans)


def summary_items(spec: Spec) -> list[SummaryItem]:
    """Every Summary row: diaphragms, chords, collectors, overhangs, then walls, hold-downs and
    drift."""
    if not spec.wall_lines:
        return []
    sources = [s for s, on in (("seis", spec.seismic), ("wind", spec.wind)) if on is not None]
    items = [
        SummaryItem(f"{kind}.{lv.id}.{d}", kind, family, "both", lv.id, d, unit)
        for kind, family, unit in DIAPHRAGM_FAMILIES
        for lv in levels_top_down(spec)
        for d in ("x", "y")
    ]
    items += [
        SummaryItem(f"cantilever.{lv.id}.{d}", "cantilever", "diaphragm overhang", "both", lv.id, d)
        for lv in levels_top_down(spec)
        for d in ("x", "y")
        if _has_overhang(spec, lv, d)
    ]
    stories = [st.level.id for st in wall_stories(spec)]
    for kind, family, unit in (("wall", "shear wall", "-"), ("hold_down", "hold-down", "lb")):
        items += [
            SummaryItem(f"{kind}.{lv}.{src}", kind, family, src, lv, unit=unit)
            for lv in stories
            for src in sources
        ]
    items += [SummaryItem(f"drift.{src}", "drift", "story drift", src) for src in sources]
    return items
