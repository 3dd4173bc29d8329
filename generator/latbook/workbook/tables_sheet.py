"""The Tables sheet: the standards' tables the formulas look up, with defined names.

These cells are reference data typed from the published tables (templates_src/tables),
not calculations; they are locked like every non-input cell.
"""

from __future__ import annotations

from typing import Any

from xlsxwriter.workbook import Workbook
from xlsxwriter.worksheet import Worksheet

from latbook.workbook.print_grid import (
    ROW_MIN_PT,
    col_width_pt,
    row_height_for,
    wrapped_lines,
)
from latbook.workbook.registry import a1
from latbook.workbook.styles import Styles, font_of

TABLES_TITLE = "Reference tables (ASCE 7-16, AWC SDPWS-2015)"
TABLES_SHEET = "Tables"
# Print grid of this sheet (Excel width units): row labels, then up to 8 value columns; fits
# US letter landscape at 100 % (print_grid.col_width_pt).
LABEL_WIDTH, VALUE_WIDTH, VALUE_COLS = 22, 8.5, 8
LAST_COL = VALUE_COLS


def write_tables(wb: Workbook, ws: Worksheet, tables: dict[str, Any], styles: Styles) -> int:
    """Write every reference table and define its names; returns the last row used."""
    ws.set_column(0, 0, LABEL_WIDTH)
    ws.set_column(1, VALUE_COLS, VALUE_WIDTH)
    heights: dict[int, float] = {}
    _full_width(ws, 0, TABLES_TITLE, "title", styles, heights)
    row = 2
    for table in tables.values():
        row = _write_table(wb, ws, table, row, styles, heights) + 1
    for r in range(row + 1):
        ws.set_row(r, heights.get(r, ROW_MIN_PT))
    return row


def _width_pt(col: int, span: int = 1) -> float:
    return sum(col_width_pt(LABEL_WIDTH if c == 0 else VALUE_WIDTH) for c in range(col, col + span))


def _fit(heights: dict[int, float], row: int, text: str, style: str, width_pt: float) -> None:
    size, bold = font_of(style)
    need = row_height_for(wrapped_lines(text, width_pt, size, bold), size)
    heights[row] = max(heights.get(row, ROW_MIN_PT), need)


def _full_width(ws: Worksheet, row: int, text: str, style: str, styles, heights) -> None:
    """A title, heading or note across the sheet, wrapped."""
    ws.merge_range(row, 0, row, LAST_COL, "", styles.get(style))
    ws.write_string(row, 0, text, styles.get(style))
    _fit(heights, row, text, style, _width_pt(0, LAST_COL + 1))


def _write_table(wb: Workbook, ws: Worksheet, t: dict[str, Any], row: int, styles, heights) -> int:
    _full_width(ws, row, t["title"], "heading", styles, heights)
    row += 1
    ws.write_string(row, 0, t.get("row_header", ""), styles.get("th"))
    _fit(heights, row, t.get("row_header", ""), "th", _width_pt(0))
    for c, head in enumerate(t["columns"], start=1):
        _write_value(ws, row, c, head, styles.get("th"))
        _fit(heights, row, str(head), "th", _width_pt(c))
    names = t["names"]
    ncols = len(t["columns"])
    if "columns" in names:
        _define(wb, names["columns"], row, 1, row, ncols)
    first = row + 1
    for r, (label, values) in enumerate(zip(t["rows"], t["values"], strict=True), start=first):
        _write_value(ws, r, 0, label, styles.get("label"))
        _fit(heights, r, str(label), "label", _width_pt(0))
        for c, value in enumerate(values, start=1):
            _write_value(ws, r, c, value, styles.get("calc"))
            _fit(heights, r, str(value), "calc", _width_pt(c))
    last = first + len(t["rows"]) - 1
    _define(wb, names["values"], first, 1, last, ncols)
    _define(wb, names["rows"], first, 0, last, 0)
    for n, note in enumerate(t.get("notes", ()), start=1):
        _full_width(ws, last + n, note, "note", styles, heights)
    return last + 1 + len(t.get("notes", ()))


def _write_value(ws: Worksheet, row: int, col: int, value: Any, fmt) -> None:
    if isinstance(value, int | float) and not isinstance(value, bool):
        ws.write_number(row, col, value, fmt)
    else:
        ws.write_string(row, col, str(value), fmt)


def _define(wb: Workbook, name: str, r0: int, c0: int, r1: int, c1: int) -> None:
    wb.define_name(name, f"={TABLES_SHEET}!{a1(r0, c0, True)}:{a1(r1, c1, True)}")
