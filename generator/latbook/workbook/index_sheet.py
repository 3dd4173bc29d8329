"""The index sheet: every registered quantity id with its cell, for scripts and checkers."""

from __future__ import annotations

from xlsxwriter.worksheet import Worksheet

from latbook.workbook.registry import Registry
from latbook.workbook.styles import Styles

INDEX_SHEET = "Index"
INDEX_HEADERS = ("Quantity id", "Kind", "Cell", "Defined name", "Description", "Unit", "Clause")


def write_index(ws: Worksheet, registry: Registry, styles: Styles) -> int:
    """One row per quantity; returns the last row used."""
    for col, width in enumerate((44, 7, 18, 14, 50, 10, 28)):
        ws.set_column(col, col, width)
    ws.write_string(0, 0, "Index of quantities (id -> cell)", styles.get("title"))
    for col, head in enumerate(INDEX_HEADERS):
        ws.write_string(2, col, head, styles.get("th"))
    row = 3
    for entry in registry.entries.values():
        values = (
            entry.id,
            entry.kind,
            entry.address,
            entry.name or "",
            entry.label,
            entry.unit,
            entry.clause,
        )
        for col, value in enumerate(values):
            ws.write_string(row, col, value, styles.get("text"))
        row += 1
    ws.repeat_rows(2)
    return row
