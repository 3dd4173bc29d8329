"""`latbook read-back`: a workbook's current inputs become a spec that validates against
the published JSON Schema, and building from it reproduces the edited workbook's values.
The reference for the edited workbook's values is LibreOffice Calc 7.4 recalculating it;
the schema check uses the general-purpose `jsonschema` package. Demo data is invented.
"""

from __future__ import annotations

import json
from pathlib import Path

import jsonschema
import openpyxl
import pytest

from latbook.analysis.build_check import EDITED, INPUTS_EDITED_ID, STATUS_ID
from latbook.build import build_workbook
from latbook.cli import main
from latbook.readback import read_back_spec, set_path
from latbook.recalc import recalculate_with_libreoffice
from latbook.workbook_file import read_workbook
from tests.helpers.parity import cached_values, compare

ROOT = Path(__file__).resolve().parents[1]
DEMO = ROOT / "out_examples/maple_terrace/spec.json"
SCHEMA = json.loads((ROOT / "schemas/latbook-spec.schema.json").read_text(encoding="utf-8"))

# Invented edits inside each input's range, by quantity id: (new cell value, spec path).
EDITS = {
    "seismic.Ss": (1.31, "seismic.ground_motion.Ss_g"),
    "seismic.site_class": ("B", "seismic.ground_motion.site_class"),
    "seismic.rho": (1.3, "seismic.rho"),
    "level.L2.seismic_weight_kip": (140.5, "building.levels[0].seismic_weight_kip"),
    "level.RF.elevation_ft": (32.25, "building.levels[2].elevation_ft"),
}


@pytest.fixture(scope="module")
def demo(tmp_path_factory):
    out = tmp_path_factory.mktemp("readback") / "demo.xlsx"
    return build_workbook(json.loads(DEMO.read_text(encoding="utf-8")), out)


@pytest.fixture(scope="module")
def edited(demo, tmp_path_factory) -> Path:
    wb = openpyxl.load_workbook(demo.path)
    for qid, (value, _) in EDITS.items():
        e = demo.registry.entries[qid]
        wb[e.sheet].cell(e.row + 1, e.col + 1).value = value
    out = tmp_path_factory.mktemp("readback_edit") / "edited.xlsx"
    wb.save(out)
    return out


def _at(data, path: str):
    node = data
    for part in path.replace("]", "").replace("[", ".").split("."):
        node = node[int(part)] if isinstance(node, list) else node[part]
    return node


def test_unedited_workbook_reads_back_to_its_spec(demo):
    original = json.loads(DEMO.read_text(encoding="utf-8"))
    assert read_back_spec(read_workbook(demo.path)) == original


def test_edited_inputs_read_back_as_a_valid_spec(edited):
    data = read_back_spec(read_workbook(edited))
    jsonschema.validate(data, SCHEMA)
    for value, path in EDITS.values():
        assert _at(data, path) == value


@pytest.mark.libreoffice
def test_rebuild_from_read_back_reproduces_the_edited_workbook(edited, tmp_path, soffice):
    data = read_back_spec(read_workbook(edited))
    rebuilt = build_workbook(data, tmp_path / "rebuilt.xlsx")
    lo_values = cached_values(recalculate_with_libreoffice(edited, tmp_path / "lo"))
    # the edited file's Cover counts its edited inputs; the rebuilt one is "as built"
    expected = rebuilt.results | {INPUTS_EDITED_ID: len(EDITS), STATUS_ID: EDITED}
    mismatches = compare(rebuilt.registry, expected, lo_values, rel=1e-9)
    assert not mismatches, "\n".join(map(str, mismatches[:20]))


def test_cli_writes_the_spec(edited, tmp_path):
    out = tmp_path / "spec.json"
    assert main(["read-back", str(edited), "-o", str(out)]) == 0
    jsonschema.validate(json.loads(out.read_text(encoding="utf-8")), SCHEMA)


def test_cli_refuses_an_invalid_input_naming_its_cell(demo, tmp_path, capsys):
    wb = openpyxl.load_workbook(demo.path)
    e = demo.registry.entries["seismic.Ss"]
    wb[e.sheet].cell(e.row + 1, e.col + 1).value = "about one"
    bad = tmp_path / "bad.xlsx"
    wb.save(bad)
    out = tmp_path / "spec.json"
    assert main(["read-back", str(bad), "-o", str(out)]) == 2
    assert e.address in capsys.readouterr().err
    assert not out.exists()


def test_set_path_creates_missing_objects():
    data = {"a": [{"b": 1}]}
    set_path(data, "a[0].c.d", 2.5)
    assert data == {"a": [{"b": 1, "c": {"d": 2.5}}]}
