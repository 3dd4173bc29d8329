"""Formulas a checker can read: no formula longer than about 200 characters (issue: a table
look-up with interpolation goes through visible steps, not one long expression).

Bound: 200 characters on the examples; generated buildings with 12-character ids (the longest
the schema allows, repeated inside SUMPRODUCT text comparisons) are allowed 240.
"""

from __future__ import annotations

import random
from pathlib import Path

import openpyxl
import pytest

from latbook.build import build_workbook
from tests.helpers.specgen import make_spec

ROOT = Path(__file__).resolve().parents[1]
EXAMPLES = sorted((ROOT / "out_examples").glob("*/calc.xlsx"))


def longest_formulas(path: Path, limit: int) -> list[tuple[str, int, str]]:
    wb = openpyxl.load_workbook(path)
    found = []
    for ws in wb.worksheets:
        for row in ws.iter_rows():
            for cell in row:
                v = cell.value
                if isinstance(v, str) and v.startswith("=") and len(v) > limit:
                    found.append((f"{ws.title}!{cell.coordinate}", len(v), v[:80]))
    return found


@pytest.mark.parametrize("book", EXAMPLES, ids=lambda p: p.parent.name)
def test_example_formulas_are_at_most_200_characters(book):
    assert longest_formulas(book, 200) == []


def test_generated_formulas_stay_short_with_the_longest_ids(tmp_path):
    spec = make_spec(random.Random(9), 2, 3, seismic="site_class", wind=True, long_ids=True)
    out = tmp_path / "calc.xlsx"
    build_workbook(spec, out)
    assert longest_formulas(out, 240) == []


def test_interpolation_steps_are_visible(tmp_path):
    # Table 12.8-1 (from memory): Cu 1.5 at SD1 0.2 g and 1.4 at 0.3 g; SD1 = 0.25 g is midway,
    # so the sheet shows the pair (1.5, 1.4) and Cu = 1.45 (derived)
    from latbook.analysis import compute_results
    from latbook.spec.load import parse_spec

    spec = make_spec(random.Random(3), 1, 2, seismic="direct", wind=False)
    spec["seismic"]["ground_motion"]["SD1_g"] = 0.25
    r = compute_results(parse_spec(spec))
    assert (r["seismic.Cu_lo"], r["seismic.Cu_hi"]) == (1.5, 1.4)
    assert r["seismic.Cu"] == pytest.approx(1.45, rel=1e-12)
