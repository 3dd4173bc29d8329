"""Where everything landed: quantity id -> cell, table name -> rows and columns."""

from __future__ import annotations

from dataclasses import dataclass, field
from functools import lru_cache

from xlsxwriter.utility import xl_rowcol_to_cell

from latbook.spec.limits import FieldLimits


@lru_cache(maxsize=1 << 16)
def a1(row: int, col: int, absolute: bool = False) -> str:
    """Zero-based (row, col) -> 'C5' (or '$C$5')."""
    return xl_rowcol_to_cell(row, col, row_abs=absolute, col_abs=absolute)


@dataclass(frozen=True)
class Entry:
    """One registered quantity: a calculated cell or an input cell."""

    id: str
    sheet: str
    row: int
    col: int
    kind: str  # "input" or "calc"
    label: str
    unit: str = ""
    clause: str = ""
    name: str | None = None
    spec_path: str | None = None
    table: str | None = None
    limits: FieldLimits | None = None  # an input's allowed range or values (spec models)

    @property
    def address(self) -> str:
        return f"{self.sheet}!{a1(self.row, self.col)}"


@dataclass
class TablePos:
    """A laid-out table: data rows by key, columns by field.

    A table printed in column chunks (layout.py) holds each field's column in the rows of
    its chunk: `rows` are the first chunk's rows and `offsets[field]` is added for the
    field's chunk (0 in the first). A table taller than a page prints on sheets of its own
    (`sheets[field]`, its chunks side by side; companions.py); `sheet` is its first chunk's
    sheet."""

    name: str
    sheet: str
    key: str
    first_row: int
    rows: dict[str, int] = field(default_factory=dict)
    cols: dict[str, int] = field(default_factory=dict)
    patterns: dict[str, str] = field(default_factory=dict)  # field -> quantity id pattern
    bindings: dict[str, dict[str, str]] = field(default_factory=dict)  # key -> ctx used by ids
    offsets: dict[str, int] = field(default_factory=dict)  # field -> rows below the first chunk
    sheets: dict[str, str] = field(default_factory=dict)  # field -> its sheet, where not `sheet`

    @property
    def last_row(self) -> int:
        return self.first_row + len(self.rows) - 1

    def row_of(self, field_name: str, row: int) -> int:
        """Sheet row of `field_name` in the table row whose first-chunk row is `row`."""
        return row + self.offsets.get(field_name, 0)

    def sheet_of(self, field_name: str) -> str:
        """The sheet that holds `field_name`'s column."""
        return self.sheets.get(field_name, self.sheet)

    def cell(self, key: str, field_name: str) -> tuple[int, int]:
        """(row, col) of `field_name` in the row keyed `key`."""
        return self.row_of(field_name, self.rows[key]), self.cols[field_name]


@dataclass
class Registry:
    entries: dict[str, Entry] = field(default_factory=dict)
    tables: dict[str, TablePos] = field(default_factory=dict)
    names: dict[str, str] = field(default_factory=dict)  # defined name -> quantity id

    def add(self, entry: Entry) -> None:
        if entry.id in self.entries:
            raise ValueError(f"quantity id registered twice: {entry.id}")
        if entry.name is not None:
            if entry.name in self.names:
                raise ValueError(f"defined name registered twice: {entry.name}")
            self.names[entry.name] = entry.id
        self.entries[entry.id] = entry

    def add_table(self, table: TablePos) -> None:
        if table.name in self.tables:
            raise ValueError(f"table name laid out twice: {table.name}")
        self.tables[table.name] = table

    def inputs(self) -> list[Entry]:
        return [e for e in self.entries.values() if e.kind == "input"]

    def calcs(self) -> list[Entry]:
        return [e for e in self.entries.values() if e.kind == "calc"]
