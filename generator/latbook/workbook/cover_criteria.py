"""Place the Cover's live design criteria: one formula cell per criterion, referring to the
calc or input cell it shows by its defined name (or its address where it has none), each
registered as the quantity `cover.<key>` (the engine gives it the same value)."""

from __future__ import annotations

from latbook.analysis.criteria import criteria_rows
from latbook.spec.models import Spec
from latbook.workbook.cover import COL_VALUE, COVER_SHEET, CRITERIA_FIRST_ROW
from latbook.workbook.layout import Cell
from latbook.workbook.registry import Entry, Registry


def plan_cover_criteria(spec: Spec, registry: Registry) -> list[Cell]:
    """The criteria's formula cells (rows as `cover.write_cover` lays them out); registers
    each as a calc quantity."""
    cells: list[Cell] = []
    for i, item in enumerate(criteria_rows(spec)):
        if item.qid is None or item.source is None:
            continue
        source = registry.entries.get(item.source)
        if source is None:
            raise ValueError(f"the Cover's criterion {item.qid} shows {item.source}, not laid out")
        formula = f"={source.name}" if source.name else f"={{q:{item.source}}}"
        row = CRITERIA_FIRST_ROW + i
        cells.append(
            Cell(row, COL_VALUE, "cover_live", formula=formula, qid=item.qid, fmt=item.fmt)
        )
        registry.add(
            Entry(item.qid, COVER_SHEET, row, COL_VALUE, "calc", item.label, item.unit, item.basis)
        )
    return cells
