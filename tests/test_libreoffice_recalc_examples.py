"""Every example workbook recalculated by a real spreadsheet program (LibreOffice Calc,
headless) equals the engine and the `formulas` package, quantity by quantity; and every
formula the generator writes stays inside the function set both programs agree on.

References: LibreOffice Calc 7.4 and the `formulas` package, two spreadsheet engines
independent of latbook. Generated buildings (tests/helpers/specgen.py) are invented data.
"""

from __future__ import annotations

import functools
import json
import random
import re
from pathlib import Path

import openpyxl
import pytest

from latbook.build import build_workbook
from latbook.recalc import recalculate_with_libreoffice
from latbook.workbook_functions import ALLOWED_FUNCTIONS, functions_used
from tests.helpers.evaluator import evaluate_workbook
from tests.helpers.parity import cached_values, compare, formula_errors, same
from tests.helpers.specgen import make_spec

EXAMPLES = sorted(Path(__file__).resolve().parents[1].glob("out_examples/*/spec.json"))

# Small generated buildings that switch on the rows the examples may not reach (direct
# ground motion, wind only, LRFD, three stories with the torsional wind cases, extreme
# values). The first three are buildings of tests/test_parity_generated.py (FIXED_CASES), so
# the `formulas` package recomputes each once per run (tests/helpers/evaluator.py caches by
# the file's digest); gen_extreme is recomputed here only.
GENERATED = {
    "gen_direct_lrfd": "seed12-1lv-2ln",  # direct ground motion, wind, LRFD, one level
    "gen_wind_only": "seed13-1lv-2ln",  # no seismic block, ASD
    "gen_site_class_wind": "seed56-3lv-2ln",  # site class, wind, ASD, three levels
    # weights far from 1 kip, 17-digit inputs, level ids equal to sheet-name parts
    "gen_extreme": dict(
        seed=31, n_levels=2, n_lines_per_dir=2, seismic="site_class", wind=True, extreme=True
    ),
}

VOLATILE = {"NOW", "TODAY", "RAND", "RANDBETWEEN", "OFFSET", "INDIRECT", "CELL", "INFO"}
_STRINGS_AND_QUOTED_SHEETS = re.compile(r""""(?:[^"]|"")*"|'(?:[^']|'')*'""")
_WHOLE_COLUMN = re.compile(r"(?<![\w.])\$?[A-Za-z]{1,3}:\$?[A-Za-z]{1,3}(?![\w(!])")
_WHOLE_ROW = re.compile(r"(?<![\w.$])\$?\d+:\$?\d+(?![\w.])")
_NAME_TOKEN = re.compile(r"(?<![\w.$!:])([A-Za-z_][\w.]*)(?![\w.(!])")
_CELL_REF = re.compile(r"^[A-Za-z]{1,3}\d+$")


# Seismic-basis cases of tests/test_parity_generated.py: §12.8.1.3 rows, Site E with a mixed
# takeoff, perimeter-bay rho and a declared irregularity.
BASIS = ["siteA-S1-0.7-Ss-limit", "siteE-S1-0.3-mixed-perimeter"]


def _spec_data(case: str) -> dict:
    if case in BASIS:
        from tests.test_parity_generated import basis_spec

        return basis_spec(case)
    if isinstance(GENERATED.get(case), str):
        from tests.test_parity_generated import fixed_spec

        return fixed_spec(GENERATED[case])
    if case in GENERATED:
        opts = dict(GENERATED[case])
        return make_spec(random.Random(opts.pop("seed")), **opts)
    return json.loads(Path(case).read_text(encoding="utf-8"))


CASES = [str(p) for p in EXAMPLES] + list(GENERATED) + BASIS


def _case_id(case: str) -> str:
    return Path(case).parent.name if case.endswith(".json") else case


@pytest.fixture(scope="module", params=CASES, ids=_case_id)
def built(request, tmp_path_factory):
    out = tmp_path_factory.mktemp("lo_examples") / "calc.xlsx"
    return build_workbook(_spec_data(request.param), out)


@pytest.fixture(scope="module")
def recalculated(built, soffice, tmp_path_factory):
    """Values LibreOffice stored after a full recalculation of the fresh build."""
    copy = recalculate_with_libreoffice(built.path, tmp_path_factory.mktemp("lo_out"))
    return cached_values(copy)


def test_examples_exist():
    assert EXAMPLES, "out_examples/ holds no example spec"


@pytest.mark.libreoffice
def test_libreoffice_recalculation_equals_engine(built, recalculated):
    # rel 1e-9: both sides are IEEE doubles; LibreOffice stores 15-17 significant digits.
    mismatches = compare(built.registry, built.results, recalculated, rel=1e-9)
    assert not mismatches, "\n".join(map(str, mismatches[:20]))


@pytest.mark.libreoffice
def test_libreoffice_recalculation_equals_formulas_package(built, recalculated):
    evaluated = evaluate_workbook(built.path)
    differ = []
    for entry in built.registry.calcs():
        key = (entry.sheet, entry.address.split("!")[1])
        lo, fp = recalculated.get(key), evaluated.get(key)
        if not same(fp, lo, rel=1e-9):
            differ.append(f"{entry.id} at {entry.address}: LibreOffice {lo!r}, formulas {fp!r}")
    assert not differ, "\n".join(differ[:20])


@pytest.mark.libreoffice
def test_libreoffice_recalculation_has_no_error_values(recalculated):
    assert formula_errors(recalculated) == []


# --- Formula hygiene (no spreadsheet program needed) --------------------------------------


# Read-only loads (the full load binds every merged range: minutes for a 3-story example),
# once per built workbook: four tests read the same file.
@functools.lru_cache(maxsize=2)
def _formulas(path: Path) -> dict[str, str]:
    wb = openpyxl.load_workbook(path, read_only=True)
    try:
        return {
            f"{ws.title}!{c.coordinate}": c.value
            for ws in wb.worksheets
            for row in ws.iter_rows()
            for c in row
            if isinstance(c.value, str) and c.value.startswith("=")
        }
    finally:
        wb.close()


@functools.lru_cache(maxsize=2)
def _defined_names(path: Path) -> frozenset[str]:
    wb = openpyxl.load_workbook(path, read_only=True)
    try:
        return frozenset(wb.defined_names.keys())
    finally:
        wb.close()


def names_used(formula: str) -> set[str]:
    """Identifiers in `formula` that are neither functions, sheet names, cell refs nor
    TRUE/FALSE: the defined names it needs."""
    code = _STRINGS_AND_QUOTED_SHEETS.sub(" ", formula)
    tokens = {m.group(1) for m in _NAME_TOKEN.finditer(code)}
    return {t for t in tokens if not _CELL_REF.match(t) and t.upper() not in ("TRUE", "FALSE")}


def test_names_used_parses_names_not_refs():
    # common practice: A1 refs, sheet-qualified ranges and functions are not defined names
    got = names_used('=IF(Risk_cat="IV",MAX(Inputs!$C$5:$C$9,C5)*S_DS,x_exp)')
    assert got == {"Risk_cat", "S_DS", "x_exp"}


@pytest.mark.parametrize(
    ("formula", "whole"),
    [
        ("=SUM(C:C)", True),
        ("=SUM(Inputs!$C:$C)", True),
        ("=SUM(3:3)", True),
        ("=SUM($C$5:$C$9)", False),
        ('=IF(A1="C:C",1,2)', False),
    ],
)
def test_whole_range_pattern(formula, whole):
    # common practice: A:A and 3:3 are whole-column / whole-row references
    code = _STRINGS_AND_QUOTED_SHEETS.sub(" ", formula)
    assert bool(_WHOLE_COLUMN.search(code) or _WHOLE_ROW.search(code)) is whole


def test_formulas_use_only_allowed_functions(built):
    bad = {
        where: sorted(functions_used(f) - ALLOWED_FUNCTIONS)
        for where, f in _formulas(built.path).items()
        if functions_used(f) - ALLOWED_FUNCTIONS
    }
    assert bad == {}


def test_formulas_use_no_volatile_functions(built):
    bad = {w: f for w, f in _formulas(built.path).items() if functions_used(f) & VOLATILE}
    assert bad == {}


def test_formulas_use_no_whole_column_or_row_ranges(built):
    bad = {
        w: f
        for w, f in _formulas(built.path).items()
        if _WHOLE_COLUMN.search(_STRINGS_AND_QUOTED_SHEETS.sub(" ", f))
        or _WHOLE_ROW.search(_STRINGS_AND_QUOTED_SHEETS.sub(" ", f))
    }
    assert bad == {}


def test_every_defined_name_a_formula_uses_exists(built):
    defined = _defined_names(built.path)
    missing = {
        w: sorted(names_used(f) - defined)
        for w, f in _formulas(built.path).items()
        if names_used(f) - defined
    }
    assert missing == {}


def test_every_registered_name_was_written(built):
    # xlsxwriter silently drops a defined name that looks like a cell reference.
    assert set(built.registry.names) - _defined_names(built.path) == set()
