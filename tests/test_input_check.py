"""The live check on the Cover (do the input cells still hold the spec the workbook was built
from?) and `verify`'s list of the inputs changed since the build. Edits are made the ways a
colleague makes them: a script (openpyxl, no stored results) or a spreadsheet program
(LibreOffice Calc recalculating the edited file, an independent engine). The demo building
is invented; the expected counts are derived from the edits made.
"""

from __future__ import annotations

import json
from pathlib import Path

import openpyxl
import pytest

from latbook.analysis.build_check import AS_BUILT, EDITED, INPUTS_EDITED_ID, STATUS_ID
from latbook.build import build_workbook
from latbook.cli import main
from latbook.recalc import recalculate_with_libreoffice
from latbook.verify import verify_workbook
from latbook.workbook.input_check import counts_as_edited

DEMO = Path(__file__).resolve().parents[1] / "out_examples/maple_terrace/spec.json"
WEIGHT = "level.L2.seismic_weight_kip"  # $.building.levels[0].seismic_weight_kip
SITE_CLASS = "seismic.site_class"  # $.seismic.ground_motion.site_class


@pytest.fixture(scope="module")
def demo(tmp_path_factory):
    out = tmp_path_factory.mktemp("input_check") / "demo.xlsx"
    return build_workbook(json.loads(DEMO.read_text(encoding="utf-8")), out)


def _edited(demo, tmp_path: Path, edits: dict[str, object]) -> Path:
    """A copy saved by openpyxl with `edits` (quantity id -> new cell value)."""
    wb = openpyxl.load_workbook(demo.path)
    for qid, value in edits.items():
        e = demo.registry.entries[qid]
        wb[e.sheet].cell(e.row + 1, e.col + 1).value = value
    out = tmp_path / "edited.xlsx"
    wb.save(out)
    return out


def _cover(path: Path, data_only: bool, demo) -> tuple[object, object]:
    """(status, count) cells of the Cover: formulas or the values stored."""
    wb = openpyxl.load_workbook(path, data_only=data_only, read_only=True)
    try:
        return tuple(
            wb[e.sheet].cell(e.row + 1, e.col + 1).value
            for e in (demo.registry.entries[STATUS_ID], demo.registry.entries[INPUTS_EDITED_ID])
        )
    finally:
        wb.close()


def test_fresh_build_shows_inputs_as_built_live(demo):
    status_formula, count_formula = _cover(demo.path, False, demo)
    assert count_formula.startswith("=SUM(SpecData!")
    assert status_formula.startswith("=IF(") and AS_BUILT in status_formula
    assert EDITED in status_formula
    assert _cover(demo.path, True, demo) == (AS_BUILT, 0)
    report = verify_workbook(demo.path)
    assert report.intact and report.inputs_changed == []
    assert "inputs as built" in report.text()
    assert report.as_dict()["inputs_as_built"] is True


def test_spec_data_keeps_one_check_row_per_input(demo):
    wb = openpyxl.load_workbook(demo.path)
    ws = wb["SpecData"]
    inputs = demo.registry.inputs()
    rows = [r for r in ws.iter_rows(min_row=2, min_col=4, max_col=7, values_only=True) if r[0]]
    assert len(rows) == len(inputs)
    by_address = {r[0]: r for r in rows}
    weight = demo.registry.entries[WEIGHT]
    address, path, built, differs = by_address[weight.address]
    assert path == "$.building.levels[0].seismic_weight_kip"
    assert built == demo.spec.building.levels[0].seismic_weight_kip
    assert differs == f"=IF(ISNUMBER({_abs(weight)}),IF({_abs(weight)}=F{_row(ws, address)},0,1),1)"


def _abs(entry) -> str:
    col, row = "".join(c for c in entry.address.split("!")[1] if c.isalpha()), entry.row + 1
    return f"{entry.sheet}!${col}${row}"


def _row(ws, address: str) -> int:
    return next(c.row for c in ws["D"] if c.value == address)


def test_verify_lists_inputs_edited_by_a_script(demo, tmp_path, capsys):
    path = _edited(demo, tmp_path, {WEIGHT: 140.5, SITE_CLASS: "B"})
    report = verify_workbook(path)
    changed = {c.spec_path: (c.address, c.built, c.current) for c in report.inputs_changed}
    weight = demo.spec.building.levels[0].seismic_weight_kip
    site_class = demo.spec.seismic.ground_motion.site_class
    assert changed == {
        "$.building.levels[0].seismic_weight_kip": (
            demo.registry.entries[WEIGHT].address,
            weight,
            140.5,
        ),
        "$.seismic.ground_motion.site_class": (
            demo.registry.entries[SITE_CLASS].address,
            site_class,
            "B",
        ),
    }
    text = report.text()
    assert "inputs changed since the build (2):" in text
    assert f"$.building.levels[0].seismic_weight_kip: {weight!r} -> 140.5" in text
    # a script stores no results: the change alone is not a finding
    assert {f.kind for f in report.findings} == {"no_stored_values"}
    assert main(["verify", str(path), "--json"]) == 1
    data = json.loads(capsys.readouterr().out)
    assert data["inputs_as_built"] is False
    assert {c["spec_path"] for c in data["inputs_changed"]} == set(changed)
    assert {c["current"] for c in data["inputs_changed"]} == {140.5, "B"}


def test_altered_check_formula_on_spec_data_is_reported(demo, tmp_path):
    wb = openpyxl.load_workbook(demo.path)
    wb["SpecData"]["G2"].value = "=0"
    out = tmp_path / "check_altered.xlsx"
    wb.save(out)
    altered = [f for f in verify_workbook(out).findings if f.kind == "formula_altered"]
    assert [f.address for f in altered] == ["SpecData!G2"]


@pytest.mark.libreoffice
def test_cover_counts_edits_after_recalculation(demo, tmp_path, soffice):
    # three inputs edited (invented values inside their ranges): a number, a text, a number
    path = _edited(demo, tmp_path, {WEIGHT: 140.5, SITE_CLASS: "B", "seismic.Ss": 1.31})
    recalculated = recalculate_with_libreoffice(path, tmp_path / "lo")
    assert _cover(recalculated, True, demo) == (EDITED, 3)
    report = verify_workbook(recalculated)
    assert report.findings == [], report.text()
    assert len(report.inputs_changed) == 3


@pytest.mark.parametrize(
    ("built", "current", "edited"),
    [
        (1.5, 1.5, False),
        (1.5, 1.6, True),
        (1.5, None, True),  # cleared
        (1.5, "1.5", True),  # typed as text
        (2, 2.0, False),
        (True, True, False),
        (True, False, True),
        ("D", "D", False),
        ("D", "d", False),  # spreadsheet '=' ignores the case of text
        ("D", "C", True),
        ("D", 4, True),
        ("", None, False),
        (None, "", False),
        (None, "x", True),
        (None, 0, True),
    ],
)
def test_counts_as_edited_follows_the_check_formula(built, current, edited):
    # derived from the formulas of input_check.differs_formula and the spreadsheet '=' rules
    assert counts_as_edited(built, current) is edited
