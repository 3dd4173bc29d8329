"""Formulas a checker can read: no formula in any sheet is longer than 200 characters.

Long expressions go through visible, labelled helper cells instead (table look-ups in steps,
the end posts' gravity loads and hold-down arm, the hold-down slip slope of each pass, the
plate-washer faces, the segments below spanning a segment, the per-method combination
names, the Summary's list of checks not made). Checked on every example and on generated
buildings with long ids (12-character ids quoted in sheet names), many levels, every option.
"""

from __future__ import annotations

import json
import random
from pathlib import Path

import openpyxl
import pytest

from latbook.build import build_workbook
from tests.helpers.specgen import make_spec

LIMIT = 200
EXAMPLES = sorted(Path(__file__).resolve().parents[1].glob("out_examples/*/spec.json"))


def longest_formulas(path: Path, top: int = 5) -> tuple[int, list[tuple[int, str]]]:
    """(number of formula cells, the `top` longest as (length, 'Sheet!A1'))."""
    wb = openpyxl.load_workbook(path, read_only=True)
    found: list[tuple[int, str]] = []
    for ws in wb.worksheets:
        for row in ws.iter_rows():
            for cell in row:
                v = cell.value
                if isinstance(v, str) and v.startswith("="):
                    found.append((len(v), f"{ws.title}!{cell.coordinate}"))
    wb.close()
    found.sort(reverse=True)
    return len(found), found[:top]


def _generated(seed, levels, lines, **options) -> dict:
    capacity = options.pop("capacity", False)
    spec = make_spec(random.Random(seed), levels, lines, **options)
    if spec.get("wind"):
        spec["wind"]["torsional_load_cases"] = "all_cases"  # the longest wind-case names
    if capacity:
        spec["shear_walls"] = {"line_distribution": "capacity"}
    return spec


# (seed, levels, lines per direction, options): long ids everywhere but one; ASD and LRFD;
# site class and direct ground motion; wind alone; capacity shares; extreme values; 8 levels
GENERATED = {
    "3lv-short-ids": (21, 3, 3, dict(seismic="site_class", wind=True, design_method="ASD")),
    "2lv-long-ids-lrfd": (
        9,
        2,
        3,
        dict(seismic="site_class", wind=True, long_ids=True, design_method="LRFD"),
    ),
    "wind-only": (8, 2, 3, dict(seismic=None, wind=True, long_ids=True)),
    "capacity-direct": (
        31,
        3,
        4,
        dict(seismic="direct", wind=True, long_ids=True, capacity=True),
    ),
    "extreme": (41, 3, 3, dict(long_ids=True, extreme=True)),
    "8lv": (7, 8, 3, dict(seismic="site_class", wind=True, long_ids=True)),
}


def _assert_short(path: Path) -> None:
    count, top = longest_formulas(path)
    assert count > 1000, f"only {count} formula cells"
    longest, cell = top[0]
    too_long = [(n, c) for n, c in top if n > LIMIT]
    assert not too_long, f"formulas over {LIMIT} characters (longest first): {too_long}"
    assert 100 < longest <= LIMIT, (longest, cell)


@pytest.mark.parametrize("spec_path", EXAMPLES, ids=lambda p: p.parent.name)
def test_every_formula_of_the_examples_is_at_most_200_characters(spec_path, tmp_path):
    out = tmp_path / "calc.xlsx"
    build_workbook(json.loads(spec_path.read_text(encoding="utf-8")), out)
    _assert_short(out)


@pytest.mark.parametrize("case", list(GENERATED))
def test_every_formula_of_generated_buildings_is_at_most_200_characters(case, tmp_path):
    seed, levels, lines, options = GENERATED[case]
    out = tmp_path / "calc.xlsx"
    build_workbook(_generated(seed, levels, lines, **dict(options)), out)
    _assert_short(out)


def test_the_check_sees_a_long_formula(tmp_path):
    # the scan reads every sheet: a 250-character formula written by hand is the longest
    import xlsxwriter

    path = tmp_path / "long.xlsx"
    wb = xlsxwriter.Workbook(path)
    wb.add_worksheet("A").write_formula("B2", "=1" + "+1" * 124, None, 125)
    wb.add_worksheet("Other").write_formula("C3", "=1+1", None, 2)
    wb.close()
    assert longest_formulas(path) == (2, [(250, "A!B2"), (4, "Other!C3")])


def test_interpolation_steps_are_visible():
    # Table 12.8-1 (from memory): Cu 1.5 at SD1 0.2 g and 1.4 at 0.3 g; SD1 = 0.25 g is midway,
    # so the sheet shows the pair (1.5, 1.4) and Cu = 1.45 (derived)
    from latbook.analysis import compute_results
    from latbook.spec.load import parse_spec

    spec = make_spec(random.Random(3), 1, 2, seismic="direct", wind=False)
    spec["seismic"]["ground_motion"]["SD1_g"] = 0.25
    r = compute_results(parse_spec(spec))
    assert (r["seismic.Cu_lo"], r["seismic.Cu_hi"]) == (1.5, 1.4)
    assert r["seismic.Cu"] == pytest.approx(1.45, rel=1e-12)


@pytest.mark.parametrize(("seed", "levels", "long_ids"), [(21, 3, False), (9, 2, True)])
def test_printed_equations_stay_within_200_characters(seed, levels, long_ids):
    # the equation column's formulas: a shorter form is chosen where a line would be longer
    from latbook.build import check_spec
    from latbook.workbook.builder import layout
    from latbook.workbook.equation_layout import EQUATION_STYLE
    from latbook.workbook.rendered import cell_formula

    spec = make_spec(
        random.Random(seed), levels, 3, seismic="site_class", wind=True, long_ids=long_ids
    )
    plans, registry = layout(check_spec(spec)[0])
    lengths = {
        f"{p.name}!{c.row}": len(cell_formula(c, p.name, registry))
        for p in plans
        for c in p.cells
        if c.style == EQUATION_STYLE and c.formula is not None
    }
    assert len(lengths) > 200
    assert {k: n for k, n in lengths.items() if n > LIMIT} == {}
