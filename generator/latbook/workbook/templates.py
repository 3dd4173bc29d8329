"""Load the declarative calc-block templates of templates_src/ (TOML) into dataclasses.

A sheet template lists blocks; a block is a list of scalar rows, a table over a
collection of rows, a note, or a chart (`kind = "chart"` with a `[blocks.chart]` table:
series drawn from a table's columns by field name; keys in
`latbook.workbook.layout._place_chart`). Formulas are patterns: see `latbook.workbook.formula`.
An input's allowed range or values are not written here: they come from the spec models
(`latbook.spec.limits`), so the schema, the workbook and `verify` share one set.
"""

from __future__ import annotations

import tomllib
from dataclasses import dataclass, field
from functools import cache
from pathlib import Path
from typing import Any

TEMPLATES_DIR = Path(__file__).resolve().parents[3] / "templates_src"


@dataclass(frozen=True)
class Row:
    """One scalar row: description | symbol | value | unit | clause."""

    label: str
    id: str | None = None
    name: str | None = None
    symbol: str = ""
    unit: str = ""
    clause: str = ""
    formula: str | None = None
    input: str | None = None
    text: str | None = None
    when: str | None = None
    fmt: str | None = None
    key: bool = False
    equation: str | None = None  # printed right-hand side, see workbook/equation_text.py


@dataclass(frozen=True)
class Column:
    """One table column; each row of the collection gets one cell of it."""

    field: str
    header: str
    id: str | None = None
    unit: str = ""
    clause: str = ""
    formula: str | dict[str, str] | None = None
    input: str | None = None
    text: str | None = None
    when: str | None = None
    fmt: str | None = None
    width: float | None = None
    equation: str | None = None  # the header's equation where it cannot be generated


@dataclass(frozen=True)
class Block:
    kind: str
    title: str = ""
    when: str | None = None
    rows: tuple[Row, ...] = ()
    table: str | None = None
    over: str | None = None
    key: str | None = None
    columns: tuple[Column, ...] = ()
    text: str = ""
    chart: dict[str, Any] | None = None
    skip_empty: bool = False
    """A table block left out where its collection has no rows (e.g. a plan with no overhang)."""


@dataclass(frozen=True)
class SheetTemplate:
    name: str
    title: str
    order: int
    source: str
    when: str | None = None
    repeat: str | None = None
    landscape: bool = False  # read for archived templates; every calc sheet prints landscape
    value_width: float | None = None  # unused: the print grid fixes widths; long text wraps
    blocks: tuple[Block, ...] = field(default_factory=tuple)


def _block(raw: dict[str, Any]) -> Block:
    raw = dict(raw)
    rows = tuple(Row(**r) for r in raw.pop("rows", []))
    columns = tuple(Column(**c) for c in raw.pop("columns", []))
    return Block(rows=rows, columns=columns, **raw)


def load_template(path: Path) -> SheetTemplate:
    """Parse one template file; unknown keys are an error (a typo must not pass silently)."""
    with path.open("rb") as fh:
        raw = tomllib.load(fh)
    sheet = dict(raw["sheet"])
    blocks = tuple(_block(b) for b in raw.get("blocks", []))
    return SheetTemplate(source=path.name, blocks=blocks, **sheet)


@cache
def all_templates(directory: Path = TEMPLATES_DIR) -> tuple[SheetTemplate, ...]:
    """Every sheet template, in workbook order."""
    found = [load_template(p) for p in sorted(directory.glob("*.toml"))]
    return tuple(sorted(found, key=lambda t: t.order))


@cache
def reference_tables(directory: Path = TEMPLATES_DIR) -> dict[str, Any]:
    """The workbook's own copy of the standards' tables (templates_src/tables/*.toml)."""
    tables: dict[str, Any] = {}
    for path in sorted((directory / "tables").glob("*.toml")):
        with path.open("rb") as fh:
            tables.update(tomllib.load(fh))
    return tables
