"""Open a latbook workbook that may have been edited elsewhere: its cells and its embedded spec.

Two read-only passes with openpyxl: the formula text of every cell, and the values the
last program that saved the file stored (none when that program did not recalculate).
"""

from __future__ import annotations

import hashlib
import json
import zipfile
from dataclasses import dataclass
from pathlib import Path
from typing import Any

import openpyxl

from latbook.workbook.builder import SPEC_SHEET

CellKey = tuple[str, int, int]  # (sheet, zero-based row, zero-based col)


class UnreadableWorkbook(Exception):
    """The file is missing, is not an .xlsx, or holds no latbook spec."""


@dataclass(frozen=True)
class EmbeddedSpec:
    """The spec the workbook was built from, as stored in its hidden SpecData sheet."""

    data: dict[str, Any]
    sha256_stored: str
    generator_version: str

    @property
    def sha256_actual(self) -> str:
        from latbook.workbook.builder import canonical_json

        return hashlib.sha256(canonical_json(self.data).encode("utf-8")).hexdigest()

    @property
    def intact(self) -> bool:
        return self.sha256_actual == self.sha256_stored


@dataclass(frozen=True)
class WorkbookCells:
    """Every non-empty cell: formula text (or constant) and stored value, by cell."""

    path: Path
    formulas: dict[CellKey, Any]
    values: dict[CellKey, Any]
    spec: EmbeddedSpec

    def is_formula(self, key: CellKey) -> bool:
        text = self.formulas.get(key)
        return isinstance(text, str) and text.startswith("=")


def read_workbook(path: Path) -> WorkbookCells:
    """Read `path`; raise UnreadableWorkbook when it is not a latbook workbook."""
    path = Path(path)
    if not path.is_file():
        raise UnreadableWorkbook(f"{path}: no such file")
    if not zipfile.is_zipfile(path):
        raise UnreadableWorkbook(f"{path}: not an .xlsx file (not a zip archive)")
    try:
        formulas = _cells(path, data_only=False)
        values = _cells(path, data_only=True)
    except Exception as exc:  # openpyxl raises many kinds on a damaged file
        raise UnreadableWorkbook(f"{path}: cannot be read as a workbook ({exc})") from None
    return WorkbookCells(path, formulas, values, _embedded_spec(path, formulas))


def _cells(path: Path, data_only: bool) -> dict[CellKey, Any]:
    wb = openpyxl.load_workbook(path, read_only=True, data_only=data_only)
    try:
        out: dict[CellKey, Any] = {}
        for ws in wb.worksheets:
            for row in ws.iter_rows():
                for cell in row:
                    if cell.value is not None:
                        out[(ws.title, cell.row - 1, cell.column - 1)] = cell.value
        return out
    finally:
        wb.close()


def _embedded_spec(path: Path, cells: dict[CellKey, Any]) -> EmbeddedSpec:
    def at(row: int) -> Any:
        return cells.get((SPEC_SHEET, row, 1))

    if (SPEC_SHEET, 0, 0) not in cells:
        raise UnreadableWorkbook(f"{path}: no {SPEC_SHEET} sheet; not written by latbook")
    try:
        n_chunks = int(at(2))
        text = "".join(str(at(3 + i)) for i in range(n_chunks))
        data = json.loads(text)
    except (TypeError, ValueError) as exc:
        raise UnreadableWorkbook(f"{path}: the embedded spec is damaged ({exc})") from None
    if not isinstance(data, dict):
        raise UnreadableWorkbook(f"{path}: the embedded spec is not a JSON object")
    return EmbeddedSpec(data, str(at(1) or ""), str(at(0) or ""))
