"""Open a latbook workbook that may have been edited elsewhere: its cells and its embedded spec.

Two read-only passes with openpyxl: the formula text of every cell, and the values the
last program that saved the file stored (none when that program did not recalculate).

A workbook may be hostile: before anything is parsed, the archive's members are bounded in
size (a small file can unpack to gigabytes), then the cells read per pass and the embedded
spec's chunk count and nesting are bounded, so any file is refused quickly with a message.
"""

from __future__ import annotations

import hashlib
import json
import zipfile
from dataclasses import dataclass
from pathlib import Path
from typing import Any

import openpyxl

from latbook.spec.json_data import MAX_DEPTH, nesting_depth, parse_int
from latbook.workbook.sheet_names import SPEC_SHEET

# Bounds on what the readers accept. The largest workbook the benchmarks build (12 levels,
# 60 lines) is 1.9 MB, unpacks to about 15 MB and holds about 150,000 cells; its members
# compress at most about 20:1.
MAX_MEMBER_BYTES = 64 * 2**20
MAX_TOTAL_BYTES = 256 * 2**20
MAX_COMPRESSION_RATIO = 200
MAX_CELLS = 5_000_000
MAX_SPEC_CHUNKS = 1000  # 30 MB of spec JSON

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
    _check_archive(path)
    try:
        formulas = _cells(path, data_only=False)
        values = _cells(path, data_only=True)
    except UnreadableWorkbook:
        raise
    except Exception as exc:  # openpyxl raises many kinds on a damaged file
        raise UnreadableWorkbook(f"{path}: cannot be read as a workbook ({exc})") from None
    return WorkbookCells(path, formulas, values, _embedded_spec(path, formulas))


def _check_archive(path: Path) -> None:
    """Refuse an archive whose members would unpack past the bounds (sizes as declared in
    the archive; the zip reader never inflates a member past its declared size)."""
    try:
        with zipfile.ZipFile(path) as archive:
            members = archive.infolist()
    except (zipfile.BadZipFile, OSError, ValueError) as exc:
        raise UnreadableWorkbook(f"{path}: cannot be read as a workbook ({exc})") from None
    total = 0
    for m in members:
        total += m.file_size
        ratio = m.file_size / max(m.compress_size, 1)
        if m.file_size > MAX_MEMBER_BYTES or total > MAX_TOTAL_BYTES:
            raise UnreadableWorkbook(
                f"{path}: {m.filename} unpacks to more than a latbook workbook can hold "
                f"({_mb(m.file_size)}; at most {_mb(MAX_MEMBER_BYTES)} a part, "
                f"{_mb(MAX_TOTAL_BYTES)} in all)"
            )
        if m.file_size > 2**20 and ratio > MAX_COMPRESSION_RATIO:
            raise UnreadableWorkbook(
                f"{path}: {m.filename} is compressed {ratio:.0f}:1, far past any workbook "
                f"(at most {MAX_COMPRESSION_RATIO}:1 accepted); not read"
            )


def _mb(n: int) -> str:
    return f"{n / 2**20:.0f} MB"


def _cells(path: Path, data_only: bool) -> dict[CellKey, Any]:
    wb = openpyxl.load_workbook(path, read_only=True, data_only=data_only)
    try:
        out: dict[CellKey, Any] = {}
        seen = 0
        for ws in wb.worksheets:
            if not hasattr(ws, "iter_rows"):
                continue  # a chart sheet
            ws.reset_dimensions()  # the stored dimension may claim a million rows: ignore it
            for row in ws.iter_rows():
                seen += len(row)
                if seen > MAX_CELLS:
                    raise UnreadableWorkbook(
                        f"{path}: more than {MAX_CELLS:,} cells; not a latbook workbook"
                    )
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
    except (TypeError, ValueError, OverflowError) as exc:
        raise UnreadableWorkbook(f"{path}: the embedded spec is damaged ({exc})") from None
    present = sum(1 for key in cells if key[0] == SPEC_SHEET and key[1] >= 3 and key[2] == 1)
    if not 1 <= n_chunks <= min(present, MAX_SPEC_CHUNKS):
        raise UnreadableWorkbook(
            f"{path}: the embedded spec is damaged (it claims {n_chunks} parts; "
            f"the sheet holds {present})"
        )
    try:
        text = "".join(str(at(3 + i)) for i in range(n_chunks))
        data = json.loads(text, parse_int=parse_int)
    except RecursionError:
        raise UnreadableWorkbook(_too_deep(path)) from None
    except (TypeError, ValueError) as exc:
        raise UnreadableWorkbook(f"{path}: the embedded spec is damaged ({exc})") from None
    if nesting_depth(data) > MAX_DEPTH:
        raise UnreadableWorkbook(_too_deep(path))
    if not isinstance(data, dict):
        raise UnreadableWorkbook(f"{path}: the embedded spec is not a JSON object")
    return EmbeddedSpec(data, str(at(1) or ""), str(at(0) or ""))


def _too_deep(path: Path) -> str:
    return f"{path}: the embedded spec is nested more than {MAX_DEPTH} deep; not a latbook spec"
