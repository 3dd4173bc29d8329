"""Recompute an .xlsx with the `formulas` package and return plain Python values per cell.

`formulas` keys its results like "'[book.xlsx]SHEET NAME'!C5" with the sheet name
upper-cased, and wraps every value in a 2-D numpy array. This helper gives
{(real sheet name, "C5"): value} with Python scalars, None for empty cells, and Excel
error values as their text ("#DIV/0!", "#N/A", ...), so tests can compare them directly.

The evaluation costs about 8 ms a formula cell (a 3-story example takes over a minute), and
several test files recompute the same workbook (the examples, the seismic-basis cases).
Within a test run each distinct file (by its bytes' SHA-256) is evaluated once: the result
goes to a run-wide cache folder the test session sets (`use_cache`, from tests/conftest.py),
shared by the pytest-xdist workers. One worker evaluates while the other waits on a lock
file; the result is written to a temporary name and renamed into place, so a reader never
sees half a file. Without a cache folder (a script calling the helper) every call evaluates.
"""

from __future__ import annotations

import contextlib
import hashlib
import os
import pickle
import re
from collections.abc import Iterator
from pathlib import Path

import formulas
import numpy as np
import openpyxl
import openpyxl.worksheet._reader
import schedula
from formulas.tokens.operand import XlError

try:  # POSIX; elsewhere two workers may evaluate the same file once each (same result)
    import fcntl
except ImportError:  # pragma: no cover - Windows
    fcntl = None

__all__ = ["EXCEL_ERROR_TEXTS", "cache_folder", "evaluate_workbook", "use_cache"]

EXCEL_ERROR_TEXTS = frozenset(
    {"#NULL!", "#DIV/0!", "#VALUE!", "#REF!", "#NAME?", "#NUM!", "#N/A", "#GETTING_DATA"}
)

# "'[book.xlsx]SHEET'!C5"; the sheet part may hold doubled quotes; defined names have no sheet.
_RESULT_KEY = re.compile(r"^'?\[(?P<book>[^\]]*)\](?P<sheet>.*?)'?!(?P<ref>.+)$")
_SINGLE_CELL = re.compile(r"^\$?[A-Z]{1,3}\$?\d+$")

_cache_folder: Path | None = None


def use_cache(folder: Path | None) -> None:
    """Keep evaluated results in `folder` (one file per workbook digest); None: no cache."""
    global _cache_folder
    _cache_folder = None if folder is None else Path(folder)
    if _cache_folder is not None:
        _cache_folder.mkdir(parents=True, exist_ok=True)


def cache_folder() -> Path | None:
    return _cache_folder


def evaluate_workbook(path: Path) -> dict[tuple[str, str], object]:
    """Every single cell `formulas` computed or read, keyed by (sheet name, "C5")."""
    path = Path(path)
    folder = _cache_folder
    if folder is None:
        return _evaluate(path)
    digest = hashlib.sha256(path.read_bytes()).hexdigest()
    stored = folder / f"{digest}.pickle"
    with _exclusive(folder / f"{digest}.lock"):
        if not stored.exists():
            values = _evaluate(path)
            partial = folder / f"{digest}.{os.getpid()}.partial"
            partial.write_bytes(pickle.dumps(values, protocol=pickle.HIGHEST_PROTOCOL))
            os.replace(partial, stored)
            return values
    return pickle.loads(stored.read_bytes())


@contextlib.contextmanager
def _exclusive(lock_path: Path) -> Iterator[None]:
    """Hold an exclusive lock on `lock_path` (released when the process ends, too)."""
    if fcntl is None:  # pragma: no cover - Windows
        yield
        return
    with open(lock_path, "a+b") as handle:
        fcntl.flock(handle, fcntl.LOCK_EX)
        try:
            yield
        finally:
            fcntl.flock(handle, fcntl.LOCK_UN)


@contextlib.contextmanager
def _merged_ranges_left_unbound() -> Iterator[None]:
    """While `formulas` reads the file, openpyxl does not bind merged ranges.

    Binding gives each range's border cells their styles and turns the cells under a range
    into empty MergedCells; the file already holds those cells blank (xlsxwriter writes a
    merged range as its first cell plus blank styled cells), so the values read are the
    same (checked: identical results for harbor_workshop) and the load is about a third
    faster.
    """
    reader = openpyxl.worksheet._reader.WorksheetReader
    original = reader.__dict__.get("bind_merged_cells")
    if original is None:  # another openpyxl: read as it reads
        yield
        return
    reader.bind_merged_cells = lambda self: None
    try:
        yield
    finally:
        reader.bind_merged_cells = original


def _evaluate(path: Path) -> dict[tuple[str, str], object]:
    sheet_by_upper_name = _sheet_names_by_upper_name(path)
    with _merged_ranges_left_unbound():
        model = formulas.ExcelModel().loads(str(path))
    model.finish()
    solution = model.calculate()

    values: dict[tuple[str, str], object] = {}
    for key, result in solution.items():
        match = _RESULT_KEY.match(str(key))
        if match is None:
            continue
        upper_sheet = match.group("sheet").replace("''", "'")
        ref = match.group("ref").replace("$", "")
        if not upper_sheet or not _SINGLE_CELL.match(ref):
            continue  # defined names and multi-cell ranges; their cells appear on their own
        sheet_name = sheet_by_upper_name.get(upper_sheet)
        if sheet_name is None:
            continue  # a cell of another (linked) book
        values[(sheet_name, ref)] = _to_python_scalar(result)
    return values


def _sheet_names_by_upper_name(path: Path) -> dict[str, str]:
    workbook = openpyxl.load_workbook(path, read_only=True)
    try:
        return {name.upper(): name for name in workbook.sheetnames}
    finally:
        workbook.close()


def _to_python_scalar(result: object) -> object:
    value = getattr(result, "value", result)
    if isinstance(value, np.ndarray):
        value = value.ravel()[0] if value.size else schedula.EMPTY
    if value is schedula.EMPTY:
        return None
    if isinstance(value, XlError):
        return str(value)
    if isinstance(value, np.generic):
        return value.item()
    return value
