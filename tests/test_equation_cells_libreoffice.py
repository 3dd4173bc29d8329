"""The printed equations are live: edit inputs of a built workbook, recalculate it with
LibreOffice Calc (headless), and every equation's text shows the values its cells now hold.

Reference: LibreOffice Calc, a spreadsheet program independent of latbook. The demo building
is invented data.
"""

from __future__ import annotations

import json
from pathlib import Path

import openpyxl
import pytest

from latbook.build import build_workbook
from latbook.recalc import recalculate_with_libreoffice
from latbook.workbook.builder import layout
from latbook.workbook.equation_layout import EQUATION_STYLE
from latbook.workbook.equation_text import cached_text, text_value
from latbook.workbook.registry import a1
from latbook.workbook.sheet_names import SPEC_SHEET
from tests.helpers.parity import cached_values

DEMO = Path(__file__).resolve().parents[1] / "out_examples" / "maple_terrace" / "spec.json"
EDITS = {"level.L3.seismic_weight_kip": 151.5, "seismic.Ss": 1.31}


@pytest.fixture(scope="module")
def edited_and_recalculated(soffice, tmp_path_factory):
    tmp = tmp_path_factory.mktemp("eq_lo")
    built = build_workbook(json.loads(DEMO.read_text(encoding="utf-8")), tmp / "calc.xlsx")
    wb = openpyxl.load_workbook(built.path)
    for qid, value in EDITS.items():
        e = built.registry.entries[qid]
        wb[e.sheet].cell(row=e.row + 1, column=e.col + 1).value = value
    edited = tmp / "edited.xlsx"
    wb.save(edited)
    values = cached_values(recalculate_with_libreoffice(edited, tmp / "lo"))
    return built, values


def _value(values, registry, qid):
    e = registry.entries[qid]
    return values.get((e.sheet, a1(e.row, e.col)))


@pytest.mark.libreoffice
def test_every_equation_shows_the_recalculated_values(edited_and_recalculated):
    built, values = edited_and_recalculated
    plans, registry = layout(built.spec)
    checked, differ = 0, []
    for plan in plans:
        if plan.name == SPEC_SHEET or not hasattr(plan, "template"):
            continue
        for cell in plan.cells:
            if cell.style != EQUATION_STYLE or cell.parts is None:
                continue
            expected = cached_text(cell.parts, lambda q: _value(values, registry, q))
            got = values.get((plan.name, a1(cell.row, cell.col)))
            checked += 1
            if got != expected:
                differ.append(f"{plan.name}!{a1(cell.row, cell.col)}: {got!r} != {expected!r}")
    assert checked > 300
    assert not differ, "\n".join(differ[:20])


@pytest.mark.libreoffice
def test_edited_rows_print_their_new_numbers(edited_and_recalculated):
    built, values = edited_and_recalculated
    registry = built.registry

    def line(qid):
        e = registry.entries[qid]
        return values[(e.sheet, a1(e.row, e.col + 2))]  # value | unit | equation

    def shown(qid, fmt="0.000"):
        return text_value(_value(values, registry, qid), fmt)

    # the edit moves these results (so the checks below can fail)
    for qid in ("seismic.SMS", "seismic.W", "seismic.V"):
        assert _value(values, registry, qid) != pytest.approx(built.results[qid], rel=1e-6)
    assert shown("seismic.Ss") == "1.310"
    assert line("seismic.SMS") == (
        f"SMS = Fa·Ss = {shown('seismic.Fa')}·1.310 = {shown('seismic.SMS')}"
    )
    assert (
        line("seismic.SDS")
        == f"SDS = 2/3·SMS = 2/3·{shown('seismic.SMS')} = {shown('seismic.SDS')}"
    )
    assert line("seismic.V") == (
        f"V = Cs·W = {shown('seismic.Cs', '0.0000')}·{shown('seismic.W', '0.00')}"
        f" = {shown('seismic.V', '0.00')}"
    )
    assert line("seismic.Cs_basic").endswith(f" = {shown('seismic.Cs_basic')}")
