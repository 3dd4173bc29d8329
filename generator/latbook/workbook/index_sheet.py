"""The Index sheet: where every quantity id lives, compact enough for large buildings.

Three parts. Scalars: one row per quantity outside a table (id -> cell). Table columns: one
row per column, its id pattern (e.g. `seismic.level.<level>.Fx`) and cell range. Table rows:
one row per table, its first sheet row and, row after row, the values of the patterns'
`<fields>` ("level=L2;line=A|level=L2;line=B|..." continued in the next cells when long). To
find an id in a table, match it to a pattern, read the field values, find the row with those
values and take the column of the range; a table printed in column chunks holds a column's
range lower down, so the row moves down by as much as the range's first row lies below the
table's. `locate_in_index` does exactly that.
"""

from __future__ import annotations

import re
from functools import lru_cache
from pathlib import Path

from xlsxwriter.worksheet import Worksheet

from latbook.workbook.registry import Registry, a1
from latbook.workbook.styles import Styles

INDEX_SHEET = "Index"
SCALAR_HEADERS = ("Quantity id", "Kind", "Cell", "Defined name", "Description", "Unit", "Clause")
COLUMN_HEADERS = ("Id pattern", "Kind", "Cells", "Table", "Column heading", "Unit", "Clause")
ROW_HEADERS = (
    "Table",
    "First sheet row",
    "Field values of each row, in order (field=value;...|...)",
)
ROW_SEP, FIELD_SEP = "|", ";"
CHUNK_CHARS = 30000
PART_TITLES = ("Scalars and inputs", "Table columns", "Table rows")


def write_index(ws: Worksheet, registry: Registry, styles: Styles) -> int:
    """Write the three parts; returns the last row used."""
    for col, width in enumerate((48, 7, 22, 22, 40, 10, 28)):
        ws.set_column(col, col, width)
    ws.write_string(0, 0, "Index of quantities (id -> cell)", styles.get("title"))
    ws.write_string(1, 0, __doc__.split("\n\n")[1].replace("\n", " "), styles.get("note"))
    row = 3
    scalars = [e for e in registry.entries.values() if e.table is None]
    row = _part(
        ws,
        row,
        0,
        SCALAR_HEADERS,
        styles,
        ((e.id, e.kind, e.address, e.name or "", e.label, e.unit, e.clause) for e in scalars),
    )
    first_in_column = {}
    for e in registry.entries.values():
        if e.table is not None:
            first_in_column.setdefault((e.table, e.row, e.col), e)
    columns = []
    for t in registry.tables.values():
        for fld, pattern in t.patterns.items():
            c = t.cols[fld]
            top, bottom = t.row_of(fld, t.first_row), t.row_of(fld, t.last_row)
            first = first_in_column.get((t.name, top, c))
            if first is None:
                continue
            cells = f"{t.sheet_of(fld)}!{a1(top, c)}:{a1(bottom, c)}"
            label = first.label.split(" [")[0]
            columns.append((pattern, first.kind, cells, t.name, label, first.unit, first.clause))
    row = _part(ws, row + 1, 1, COLUMN_HEADERS, styles, columns)
    rows = (
        (
            t.name,
            str(t.first_row + 1),
            *_chunks(
                ROW_SEP.join(
                    FIELD_SEP.join(f"{k}={v}" for k, v in t.bindings[key].items()) for key in t.rows
                )
            ),
        )
        for t in registry.tables.values()
        if t.patterns and t.rows
    )
    return _part(ws, row + 1, 2, ROW_HEADERS, styles, rows)


def _chunks(text: str) -> list[str]:
    return [text[i : i + CHUNK_CHARS] for i in range(0, len(text), CHUNK_CHARS)] or [""]


def _part(ws, row, n, headers, styles, values) -> int:
    ws.write_string(row, 0, PART_TITLES[n], styles.get("heading"))
    row += 1
    for col, head in enumerate(headers):
        ws.write_string(row, col, head, styles.get("th"))
    row += 1
    text = styles.get("text")
    for record in values:
        for col, value in enumerate(record):
            ws.write_string(row, col, value, text)
        row += 1
    return row


def locate_in_index(path: Path, qid: str) -> str | None:
    """The `Sheet!C5` address of quantity `qid`, read from a workbook's Index sheet only."""
    scalars, columns, rows = _read_index(str(path), Path(path).stat().st_mtime_ns)
    if qid in scalars:
        return scalars[qid]
    for regex, cells, table in columns:
        match = regex.fullmatch(qid)
        if not match:
            continue
        found = rows.get((table, _binding(match.groupdict().items())))
        if found is not None:
            # The column's range may sit in a later column chunk, below the table's first
            # data row: shift by the distance between the two.
            table_row, first_row = found
            sheet, rng = cells.split("!")
            top = rng.split(":")[0]
            shift = int(re.sub(r"[^0-9]", "", top)) - first_row
            return f"{sheet}!{re.sub(r'[0-9]+', '', top)}{table_row + shift}"
    return None


@lru_cache(maxsize=4)
def _read_index(path: str, _mtime_ns: int):
    import openpyxl

    ws = openpyxl.load_workbook(path, read_only=True)[INDEX_SHEET]
    part, scalars, columns, rows = -1, {}, [], {}
    headers = (SCALAR_HEADERS[0], COLUMN_HEADERS[0], ROW_HEADERS[0])
    for values in ws.iter_rows(min_row=4, values_only=True):
        first = values[0]
        if first in PART_TITLES:
            part = PART_TITLES.index(first)
        elif first is None or first in headers:
            continue
        elif part == 0:
            scalars[first] = values[2]
        elif part == 1:
            columns.append((re.compile(_pattern_regex(first)), values[2], values[3]))
        elif part == 2:
            text = "".join(v for v in values[2:] if v)
            for i, row_text in enumerate(text.split(ROW_SEP)):
                pairs = (item.split("=", 1) for item in row_text.split(FIELD_SEP) if item)
                rows[(first, _binding(pairs))] = (int(values[1]) + i, int(values[1]))
    return scalars, columns, rows


def _binding(pairs) -> tuple[tuple[str, str], ...]:
    return tuple(sorted((k, v) for k, v in pairs))


def _pattern_regex(pattern: str) -> str:
    parts = re.split(r"<([A-Za-z_][A-Za-z0-9_]*)>", pattern)
    seen: set[str] = set()
    out = []
    for i, part in enumerate(parts):
        if i % 2 == 0:
            out.append(re.escape(part))
        elif part in seen:
            out.append(f"(?P={part})")
        else:
            seen.add(part)
            out.append(f"(?P<{part}>.+?)")
    return "".join(out)
