"""Spreadsheet functions the workbook generator may write into live formulas.

A function is allowed only when LibreOffice Calc 7.4 and the `formulas` package (the two
engines the tests recompute workbooks with) were measured to give the same value for it;
tests/test_recalc_libreoffice.py holds one check row per allowed function.
"""

from __future__ import annotations

import re

__all__ = [
    "ALLOWED_FUNCTIONS",
    "EXCLUDED_FUNCTIONS",
    "TEXT_FORMATS",
    "disallowed_functions",
    "functions_used",
]

ALLOWED_FUNCTIONS: frozenset[str] = frozenset(
    {
        "ABS",
        "AND",
        "CHOOSE",
        "EXP",
        "IF",
        "IFERROR",
        "INDEX",  # with explicit positive row/column numbers (INDEX(r, 0) differs)
        "ISNUMBER",
        "LN",
        "LOG10",
        "MATCH",  # match_type 0 (exact) or 1 (sorted ascending)
        "MAX",
        "MIN",
        "NOT",
        "OR",
        "PI",
        "POWER",
        "SQRT",
        "SUM",
        "SUMPRODUCT",
        "TEXT",  # display only, in TEXT_FORMATS
    }
)

# The number formats TEXT may print with. Display only: LibreOffice (and Excel) round half
# away from zero on the decimal value (TEXT(0.125,"0.00") = "0.13"), formulas 1.3.4 rounds the
# binary value half to even ("0.12"), so a value on an exact decimal half reads differently;
# no result is ever computed from TEXT. The printed equations (workbook/equation_text.py) use
# the fixed-decimal formats.
TEXT_FORMATS: tuple[str, ...] = ("0.0#", "0", "0.0", "0.00", "0.000", "0.0000")

# Measured to disagree between LibreOffice 7.4.7 and formulas 1.3.4; the reason is kept so
# a generator refusing one can say why.
EXCLUDED_FUNCTIONS: dict[str, str] = {
    "ROUND": "formulas rounds the binary value: ROUND(1.005,2) gives 1.00, LibreOffice 1.01",
    "ROUNDUP": "formulas: ROUNDUP(0.1+0.2,1) gives 0.4, LibreOffice 0.3",
    "ROUNDDOWN": "formulas: ROUNDDOWN(4.35,2) gives 4.34, LibreOffice 4.35",
    "CEILING": "formulas: CEILING(2.1,0.3) gives 2.4, LibreOffice 2.1",
    "FLOOR": "formulas: FLOOR(0.3,0.1) gives 0.2, LibreOffice 0.3",
    "MOD": "formulas: MOD(1,0.1) gives 0.09999999999999995, LibreOffice 0",
}

# Scanned left to right so a quote inside the other kind of quotes is handled.
_STRING_LITERAL_OR_QUOTED_SHEET = re.compile(r""""(?:[^"]|"")*"|'(?:[^']|'')*'""")
# A name directly followed by "(" that is not part of a longer name, a cell or a sheet ref.
_FUNCTION_CALL = re.compile(r"(?<![\w.$!])([A-Za-z_][\w.]*)\s*\(")
_FUTURE_FUNCTION_PREFIXES = ("_XLFN._XLWS.", "_XLFN.", "_XLWS.")


def functions_used(formula: str) -> set[str]:
    """Upper-case names of the functions called in ``formula`` (text in string literals and
    quoted sheet names is ignored; defined names not followed by "(" are not functions).
    Excel's storage prefixes such as "_xlfn." are removed."""
    code_only = _STRING_LITERAL_OR_QUOTED_SHEET.sub(" ", formula)
    names: set[str] = set()
    for match in _FUNCTION_CALL.finditer(code_only):
        name = match.group(1).upper()
        for prefix in _FUTURE_FUNCTION_PREFIXES:
            if name.startswith(prefix):
                name = name[len(prefix) :]
                break
        names.add(name)
    return names


def disallowed_functions(formula: str) -> set[str]:
    """Functions in ``formula`` that are not in ALLOWED_FUNCTIONS."""
    return functions_used(formula) - ALLOWED_FUNCTIONS
