"""Summary sheet: chord, collector and hold-down rows with and without capacities.

A one-level box (invented data, seismic only, two wall lines each way) built three ways:
- "fails": chord and collector capacities given; one hold-down with a small capacity, the
  others blank;
- "passes": no chord or collector capacity; every lifting hold-down with a large capacity,
  one segment held down by its dead load with no capacity;
- "unchecked": no capacity anywhere.
The workbook recomputed by `formulas` must equal the engine (parity), and the recomputed
numbers must obey the statics and the DCR <= 1.0 rule named beside each check.
"""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from latbook.analysis.summary import NO_CAPACITY
from latbook.build import build_workbook
from latbook.workbook.registry import a1
from tests.helpers.evaluator import evaluate_workbook
from tests.helpers.parity import compare, formula_errors

DEMO = Path(__file__).resolve().parents[1] / "out_examples/maple_terrace/spec.json"
REL = 1e-9
PLAN_X_FT, PLAN_Y_FT = 40.0, 30.0
OFFSET_FT = 0.25
SMALL_CAPACITY_LB = 100.0
LARGE_CAPACITY_LB = 1.0e6
CHORD_CAPACITY_LB, COLLECTOR_CAPACITY_LB = 2000.0, 3000.0


def _segment(seg_id, start_ft, length_ft, capacity_lb=None, dead_load_plf=0.0):
    seg = {
        "id": seg_id,
        "start_ft": start_ft,
        "length_ft": length_ft,
        "assembly": "SW",
        "dead_load_plf": dead_load_plf,
        "hold_down_offset_ft": OFFSET_FT,
    }
    if capacity_lb is not None:
        seg["hold_down_capacity_lb"] = capacity_lb
    return seg


def _line(line_id, direction, position_ft, segments):
    return {
        "id": line_id,
        "direction": direction,
        "position_ft": position_ft,
        "stories": [{"level": "RF", "segments": segments}],
    }


def _box_spec(case: str) -> dict:
    demo = json.loads(DEMO.read_text())
    wall = dict(demo["assemblies"]["shear_walls"][1], id="SW")  # demo SW2, invented values
    diaphragm = {"id": "D1", "description": "invented", "vs_nominal_plf": 530}
    diaphragm["vw_nominal_plf"] = 740
    hold_down = {"fails": SMALL_CAPACITY_LB, "passes": LARGE_CAPACITY_LB}.get(case)
    if case == "fails":
        diaphragm["chord_capacity_lb"] = CHORD_CAPACITY_LB
        diaphragm["collector_capacity_lb"] = COLLECTOR_CAPACITY_LB
    others = LARGE_CAPACITY_LB if case == "passes" else None
    held_down = {"dead_load_plf": 4000.0} if case == "passes" else {"capacity_lb": others}
    return {
        "project": {"name": "Summary test box (invented)"},
        "design_method": "ASD",
        "building": {
            "levels": [
                {
                    "id": "RF",
                    "name": "Roof",
                    "elevation_ft": 10.0,
                    "seismic_weight_kip": 60.0,
                    "plan": {
                        "x_min_ft": 0,
                        "x_max_ft": PLAN_X_FT,
                        "y_min_ft": 0,
                        "y_max_ft": PLAN_Y_FT,
                    },
                    "diaphragm_assembly": "D1",
                }
            ]
        },
        # the demo's light-frame entry takes §12.10.2.1 Exception 1 by default; declined here so
        # the collectors keep their overstrength forces (and the failing case still fails)
        "seismic": {**demo["seismic"], "collector_light_frame_exception": False},
        "assemblies": {"diaphragms": [diaphragm], "shear_walls": [wall]},
        "wall_lines": [
            _line("A", "x", 0.0, [_segment("A1", 0.0, 10.0, hold_down)]),
            _line(
                "B", "x", PLAN_Y_FT, [_segment("B1", 0, 8, others), _segment("B2", 30, 10, others)]
            ),
            _line("W", "y", 0.0, [_segment("W1", 0.0, 12.0, others)]),
            _line("E", "y", PLAN_X_FT, [_segment("E1", 18.0, 12.0, **held_down)]),
        ],
    }


_BUILT: dict[str, tuple] = {}


def _built(case: str, tmp_path_factory):
    """(case, build result, recomputed values, cell lookup), built once per case."""
    if case not in _BUILT:
        out = tmp_path_factory.mktemp("summary") / "calc.xlsx"
        result = build_workbook(_box_spec(case), out)
        values = evaluate_workbook(out)

        def cell(qid):
            entry = result.registry.entries[qid]
            return values[(entry.sheet, a1(entry.row, entry.col))]

        _BUILT[case] = (case, result, values, cell)
    return _BUILT[case]


@pytest.fixture(scope="module", params=["fails", "passes", "unchecked"])
def box(request, tmp_path_factory):
    return _built(request.param, tmp_path_factory)


@pytest.fixture(scope="module")
def fails(tmp_path_factory):
    return _built("fails", tmp_path_factory)[3]


@pytest.fixture(scope="module")
def passes(tmp_path_factory):
    return _built("passes", tmp_path_factory)[3]


@pytest.fixture(scope="module")
def unchecked(tmp_path_factory):
    return _built("unchecked", tmp_path_factory)[3]


def test_recomputed_workbook_equals_engine(box):
    _, result, values, _ = box
    assert any(e.id.startswith("summary.chord.") for e in result.registry.calcs())
    mismatches = compare(result.registry, result.results, values)
    assert not mismatches, "\n".join(map(str, mismatches[:20]))
    assert formula_errors(values) == []


def _hold_down_tension_by_statics(cell, base: str) -> float:
    # Statics (AWC Manual M14.3 form): no dead load, T = M_ot / (L - offset) with
    # M_ot = Fac_E x segment shear x height (10 ft story).
    return cell("combo.Fac_E") * cell(f"{base}.V_seis") * 10.0 / (10.0 - OFFSET_FT)


def test_hold_down_over_its_capacity_fails_in_text(fails):
    # DCR = T / capacity; DCR > 1.0 fails, marked in text (not colour alone).
    cell = fails
    T = cell("walls.RF.seg.A.A1.T_seis")
    by_statics = _hold_down_tension_by_statics(cell, "walls.RF.seg.A.A1")
    assert cell("walls.RF.seg.A.A1.T_seis") == pytest.approx(by_statics, rel=REL)
    assert cell("walls.RF.seg.A.A1.T_dcr_seis") == pytest.approx(T / SMALL_CAPACITY_LB, rel=REL)
    assert cell("walls.RF.seg.B.B1.T_dcr_seis") == "not given"  # lifts, no capacity
    assert cell("walls.RF.T_dcr_seis_missing") == 4
    # A given capacity that fails shows even while others are blank.
    assert cell("summary.hold_down.RF.seis.dcr") == pytest.approx(T / SMALL_CAPACITY_LB, rel=REL)
    assert cell("summary.hold_down.RF.seis.element") == "story below RF: line A seg A1"
    assert cell("summary.hold_down.RF.seis.status") == "FAILS"
    assert cell("summary.hold_down.RF.seis.marker") == "<<<"
    # the overall status also names the hold-downs that were not checked, with their story
    overall = cell("summary.overall")
    assert overall.startswith("FAILS")
    assert "no capacity for story below RF: line B seg B1; " in overall


def test_hold_down_within_its_capacity_is_ok(passes):
    # DCR = T / capacity <= 1.0 passes; a segment whose dead-load moment exceeds the
    # overturning moment has no uplift (common practice), so its blank capacity is no gap.
    cell = passes
    assert cell("walls.RF.seg.E.E1.T_seis") == 0
    assert cell("walls.RF.seg.E.E1.T_dcr_seis") == 0
    assert cell("walls.RF.T_dcr_seis_missing") == 0
    T_max = cell("walls.RF.T_seis_max")
    assert cell("summary.hold_down.RF.seis.dcr") == pytest.approx(
        T_max / LARGE_CAPACITY_LB, rel=REL
    )
    assert cell("summary.hold_down.RF.seis.status") == "ok"
    assert cell("summary.hold_down.RF.seis.marker") == "-"


def test_hold_down_without_capacity_says_so(unchecked):
    # A check that could not be made is never ok: the row says so and names every segment
    # (with its story) that lifts without a capacity; the overall status is INCOMPLETE.
    cell = unchecked
    assert cell("walls.RF.T_dcr_seis_gov") == "none with a capacity"
    assert cell("summary.hold_down.RF.seis.dcr") == 0
    assert cell("summary.hold_down.RF.seis.status") == "not checked: no hold-down capacity"
    assert cell("summary.hold_down.RF.seis.marker") == "-"
    assert cell("summary.hold_down.RF.seis.demand") == pytest.approx(
        cell("walls.RF.T_seis_max"), rel=REL
    )
    missing = cell("walls.RF.T_dcr_seis_missing")
    assert missing >= 1
    element = cell("summary.hold_down.RF.seis.element")
    assert element.startswith("story below RF: line ") and f"({missing:g} in all)" in element
    assert cell("summary.overall").startswith("INCOMPLETE")
    assert element in cell("summary.overall")


def test_chord_row_is_the_simple_span_chord_force(box):
    # Statics of a simple span (SDPWS-2015 §4.2, derived): load in x spans PLAN_Y_FT between
    # lines A and B, chord force T = (Fac_E_dia w L^2 / 8) / b with b = PLAN_X_FT.
    case, _, _, cell = box
    w_plf = cell("diaph.RF.x.w_fpx_plf")
    T = cell("combo.Fac_E_dia") * w_plf * PLAN_Y_FT**2 / 8 / PLAN_X_FT
    assert cell("summary.chord.RF.x.demand") == pytest.approx(T, rel=REL)
    assert cell("summary.chord.RF.x.combination") == cell("combo.seismic_additive")
    if case == "fails":
        assert cell("summary.chord.RF.x.dcr") == pytest.approx(T / CHORD_CAPACITY_LB, rel=REL)
        assert cell("summary.chord.RF.x.status") == ("FAILS" if T > CHORD_CAPACITY_LB else "ok")
    else:
        assert cell("summary.chord.RF.x.dcr") == "not given"
        assert cell("summary.chord.RF.x.status") == NO_CAPACITY
        assert cell("summary.chord.RF.x.marker") == "-"


def test_collector_row_is_the_peak_drag_force(box):
    # Statics of a collector (derived): line A is PLAN_X_FT long with one 10 ft wall at its
    # start; the diaphragm delivers R uniformly, the wall takes it over its length, so the
    # peak at the wall's end is |R 10/40 - R| = 0.75 R (line B's peak is smaller: 0.31 R).
    case, _, _, cell = box
    F = 0.75 * cell("diaph.RF.x.line.A.R_coll_E")
    assert cell("summary.collector.RF.x.demand") == pytest.approx(F, rel=REL)
    if case == "fails":
        dcr = F / COLLECTOR_CAPACITY_LB
        assert dcr > 1
        assert cell("summary.collector.RF.x.dcr") == pytest.approx(dcr, rel=REL)
        assert cell("summary.collector.RF.x.status") == "FAILS"
        assert cell("summary.collector.RF.x.marker") == "<<<"
    else:
        assert cell("summary.collector.RF.x.dcr") == "not given"
        assert cell("summary.collector.RF.x.status") == NO_CAPACITY
