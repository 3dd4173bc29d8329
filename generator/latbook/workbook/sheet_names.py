"""The names the workbook's sheets can take, from the templates, without laying anything out.

Used by the spec rules: a level id becomes part of sheet names (`Dia_<level>_<dir>`,
`Walls_<level>`), and spreadsheet sheet names must be unique ignoring case.
"""

from __future__ import annotations

from latbook.workbook.cover import COVER_SHEET
from latbook.workbook.formula import substitute_ctx
from latbook.workbook.index_sheet import INDEX_SHEET
from latbook.workbook.tables_sheet import TABLES_SHEET
from latbook.workbook.templates import all_templates

SPEC_SHEET = "SpecData"
"""The hidden sheet holding the embedded spec (written by `latbook.workbook.builder`)."""

FIXED_SHEETS = (COVER_SHEET, TABLES_SHEET, INDEX_SHEET, SPEC_SHEET)
DIRECTIONS = ("x", "y")


def _names(pattern: str, level_id: str | None) -> set[str]:
    ctx = {"level": level_id} if level_id is not None else {}
    return {substitute_ctx(pattern, {**ctx, "dir": d}) for d in DIRECTIONS}


def level_sheet_names(level_id: str) -> set[str]:
    """Every sheet name a level id can produce (whether or not the spec draws that sheet)."""
    return {
        name
        for tpl in all_templates()
        if "<level>" in tpl.name
        for name in _names(tpl.name, level_id)
    }


def other_sheet_names() -> set[str]:
    """Every sheet name that does not come from a level id."""
    found = set(FIXED_SHEETS)
    for tpl in all_templates():
        if "<level>" not in tpl.name:
            found |= _names(tpl.name, None)
    return found
