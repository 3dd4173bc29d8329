"""Recompute an .xlsx with the `formulas` package and return plain Python values per cell.

`formulas` keys its results like "'[book.xlsx]SHEET NAME'!C5" with the sheet name
upper-cased, and wraps every value in a 2-D numpy array. This helper gives
{(real sheet name, "C5"): value} with Python scalars, None for empty cells, and Excel
error values as their text ("#DIV/0!", "#N/A", ...), so tests can compare them directly.
"""

from __future__ import annotations

import re
from pathlib import Path

import formulas
import numpy as np
import openpyxl
import schedula
from formulas.tokens.operand import XlError

__all__ = ["EXCEL_ERROR_TEXTS", "evaluate_workbook"]

EXCEL_ERROR_TEXTS = frozenset(
    {"#NULL!", "#DIV/0!", "#VALUE!", "#REF!", "#NAME?", "#NUM!", "#N/A", "#GETTING_DATA"}
)

# "'[book.xlsx]SHEET'!C5"; the sheet part may hold doubled quotes; defined names have no sheet.
_RESULT_KEY = re.compile(r"^'?\[(?P<book>[^\]]*)\](?P<sheet>.*?)'?!(?P<ref>.+)$")
_SINGLE_CELL = re.compile(r"^\$?[A-Z]{1,3}\$?\d+$")


def evaluate_workbook(path: Path) -> dict[tuple[str, str], object]:
    """Every single cell `formulas` computed or read, keyed by (sheet name, "C5")."""
    path = Path(path)
    sheet_by_upper_name = _sheet_names_by_upper_name(path)
    model = formulas.ExcelModel().loads(str(path)).finish()
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
