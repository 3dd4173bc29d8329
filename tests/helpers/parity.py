"""The contract between the two halves: recompute a built workbook and compare it with
the engine, quantity by quantity."""

from __future__ import annotations

import math
from dataclasses import dataclass
from pathlib import Path
from typing import Any

import openpyxl

from latbook.workbook.registry import Registry, a1

REL_TOL = 1e-9
ABS_TOL = 1e-9


@dataclass(frozen=True)
class Mismatch:
    qid: str
    address: str
    expected: Any
    got: Any

    def __str__(self) -> str:
        return f"{self.qid} at {self.address}: engine {self.expected!r}, workbook {self.got!r}"


def same(expected: Any, got: Any, rel: float = REL_TOL) -> bool:
    """Engine value vs a cell value: text exactly, numbers within rel (and 1e-9 absolute)."""
    if isinstance(expected, str):
        return isinstance(got, str) and got == expected
    if isinstance(expected, bool):
        return got == expected
    if isinstance(got, bool) or not isinstance(got, int | float):
        return False
    return math.isclose(float(got), float(expected), rel_tol=rel, abs_tol=ABS_TOL)


def compare(
    registry: Registry,
    results: dict[str, Any],
    values: dict[tuple[str, str], Any],
    rel: float = REL_TOL,
) -> list[Mismatch]:
    """Every calculated quantity whose cell value differs from the engine's."""
    out = []
    for entry in registry.calcs():
        got = values.get((entry.sheet, a1(entry.row, entry.col)))
        if not same(results[entry.id], got, rel):
            out.append(Mismatch(entry.id, entry.address, results[entry.id], got))
    return out


def cached_values(path: Path) -> dict[tuple[str, str], Any]:
    """The values stored in the file (what a viewer that does not recalculate shows).

    Read-only mode: the same values, without openpyxl binding thousands of merged ranges
    (its full load of a 3-story example takes minutes, the read-only pass seconds)."""
    wb = openpyxl.load_workbook(path, data_only=True, read_only=True)
    try:
        return {
            (ws.title, cell.coordinate): cell.value
            for ws in wb.worksheets
            for row in ws.iter_rows()
            for cell in row
            if cell.value is not None
        }
    finally:
        wb.close()


def formula_errors(values: dict[tuple[str, str], Any]) -> list[str]:
    """Cells holding an error value."""
    from tests.helpers.evaluator import EXCEL_ERROR_TEXTS

    return [
        f"{s}!{c}: {v}"
        for (s, c), v in values.items()
        if isinstance(v, str) and v in EXCEL_ERROR_TEXTS
    ]
