"""Change inputs in the built workbook (as a user would in a spreadsheet), recompute it,
and check every quantity moves to what the engine gives for the same changed inputs.

The building is the demo (maple_terrace, invented data) cut to two stories and two wall
lines each way (tests/helpers/demo_variants.py): seismic and wind, a floor and a roof, so a
weight, a ground-motion value and an elevation each still move the story forces, the walls
and the diaphragms, at half the recomputation cost of the full demo.
"""

from __future__ import annotations

import copy

import openpyxl

from latbook.analysis import compute_results
from latbook.analysis.build_check import EDITED, INPUTS_EDITED_ID, STATUS_ID
from latbook.build import build_workbook
from latbook.spec.load import parse_spec
from tests.helpers.demo_variants import demo_with_lines
from tests.helpers.evaluator import evaluate_workbook
from tests.helpers.parity import compare


def test_changed_weight_and_ss_flow_through(tmp_path):
    data = demo_with_lines(("A", "C", "1", "3"), stories=2)
    built = build_workbook(data, tmp_path / "calc.xlsx")
    entries = built.registry.entries
    edits = {
        "level.L2.seismic_weight_kip": 151.5,
        "seismic.Ss": 1.31,
        "level.RF.elevation_ft": 22.5,
    }
    wb = openpyxl.load_workbook(built.path)
    for qid, value in edits.items():
        e = entries[qid]
        wb[e.sheet].cell(row=e.row + 1, column=e.col + 1).value = value
    edited = tmp_path / "edited.xlsx"
    wb.save(edited)

    changed = copy.deepcopy(data)
    levels = {lv["id"]: lv for lv in changed["building"]["levels"]}
    levels["L2"]["seismic_weight_kip"] = 151.5
    levels["RF"]["elevation_ft"] = 22.5
    changed["seismic"]["ground_motion"]["Ss_g"] = 1.31
    expected = compute_results(parse_spec(changed))
    # the Cover's live check counts the input cells that no longer hold the embedded spec
    expected |= {INPUTS_EDITED_ID: len(edits), STATUS_ID: EDITED}

    # The edit really moves the story forces and Fpx (so the comparison below can fail).
    for key in ("seismic.level.RF.Fx", "seismic.level.L2.Fpx", "seismic.V"):
        assert abs(expected[key] - built.results[key]) > 1e-3 * abs(built.results[key])

    mismatches = compare(built.registry, expected, evaluate_workbook(edited))
    assert not mismatches, "\n".join(map(str, mismatches[:20]))
