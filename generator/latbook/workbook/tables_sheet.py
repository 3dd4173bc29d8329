"""The Tables sheet: the standards' tables the formulas look up, with defined names.

These cells are reference data typed from the published tables (templates_src/tables),
not calculations; they are locked like every non-input cell.
"""

from __future__ import annotations

from typing import Any

from xlsxwriter.workbook import Workbook
from xlsxwriter.worksheet import Worksheet

from latbook.workbook.registry import a1
from latbook.workbook.styles import Styles

TABLES_SHEET = "Tables"


def write_tables(wb: Workbook, ws: Worksheet, tables: dict[str, Any], styles: Styles) -> int:
    """Write every reference table and define its names; returns the last row used."""
    ws.set_column(0, 0, 30)
    ws.set_column(1, 8, 12)
    ws.write_string(0, 0, "Reference tables (ASCE 7-16, AWC SDPWS-2015)", styles.get("title"))
    row = 2
    for table in tables.values():
        row = _write_table(wb, ws, table, row, styles) + 1
    return row


def _write_table(wb: Workbook, ws: Worksheet, t: dict[str, Any], row: int, styles) -> int:
    ws.write_string(row, 0, t["title"], styles.get("heading"))
    row += 1
    ws.write_string(row, 0, t.get("row_header", ""), styles.get("th"))
    for c, head in enumerate(t["columns"], start=1):
        _write_value(ws, row, c, head, styles.get("th"))
    names = t["names"]
    ncols = len(t["columns"])
    if "columns" in names:
        _define(wb, names["columns"], row, 1, row, ncols)
    first = row + 1
    for r, (label, values) in enumerate(zip(t["rows"], t["values"], strict=True), start=first):
        _write_value(ws, r, 0, label, styles.get("label"))
        for c, value in enumerate(values, start=1):
            _write_value(ws, r, c, value, styles.get("calc"))
    last = first + len(t["rows"]) - 1
    _define(wb, names["values"], first, 1, last, ncols)
    _define(wb, names["rows"], first, 0, last, 0)
    for n, note in enumerate(t.get("notes", ()), start=1):
        ws.write_string(last + n, 0, note, styles.get("note"))
    return last + 1 + len(t.get("notes", ()))


def _write_value(ws: Worksheet, row: int, col: int, value: Any, fmt) -> None:
    if isinstance(value, int | float) and not isinstance(value, bool):
        ws.write_number(row, col, value, fmt)
    else:
        ws.write_string(row, col, str(value), fmt)


def _define(wb: Workbook, name: str, r0: int, c0: int, r1: int, c1: int) -> None:
    wb.define_name(name, f"={TABLES_SHEET}!{a1(r0, c0, True)}:{a1(r1, c1, True)}")
