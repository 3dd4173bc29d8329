"""Shear-wall, drift and summary sheets: the workbook recomputed by `formulas` equals the
engine (parity), and the recomputed numbers obey statics and the trade facts named below.

The specs are the demo building (invented data) with loads and lengths changed to reach
the cases: a segment whose dead load holds it down, one with net uplift stacked over three
stories, a segment past 2:1 (k = 2bs/h) and one past 3.5:1 (not a shear wall). Each keeps
only the wall lines its checks read plus two lines the other way (the stacked case all three
stories, the narrow one two: tests/helpers/demo_variants.py), which halves the `formulas`
package's work; the full demo is recomputed by tests/test_parity_examples.py.
"""

from __future__ import annotations

import pytest

from latbook.build import build_workbook
from latbook.workbook.registry import a1
from tests.helpers.demo_variants import demo_with_lines
from tests.helpers.evaluator import evaluate_workbook
from tests.helpers.parity import compare, formula_errors

STORIES_TOP_DOWN = ("RF", "L3", "L2")
WALL_FT = 9.25  # the demo's sheathed wall height in every story (10.5 ft stories)
REL = 1e-9


def _segments(data, line_id):
    line = next(ln for ln in data["wall_lines"] if ln["id"] == line_id)
    return [(story["level"], seg) for story in line["stories"] for seg in story["segments"]]


def _stacked_uplift_spec() -> dict:
    data = demo_with_lines(("A", "C", "1", "3"))  # three stories
    for _, seg in _segments(data, "A"):
        if seg["id"] == "A1":
            seg["dead_load_plf"] = 4000.0  # holds the segment down in every story
        if seg["id"] == "A3":
            seg["dead_load_plf"] = 0.0  # nothing resists: net uplift, stacked down
    return data


def _narrow_segments_wind_lrfd_spec() -> dict:
    data = demo_with_lines(("B", "C", "1", "3"), stories=2)
    del data["seismic"]
    data["design_method"] = "LRFD"
    for level, seg in _segments(data, "B"):
        if level == "RF" and seg["id"] == "B1":
            seg["length_ft"] = 4.0  # h/bs = 9.25 / 4 = 2.3125: k = 2bs/h
        if level == "RF" and seg["id"] == "B2":
            seg["length_ft"] = 2.5  # h/bs = 3.7 > 3.5: not a shear wall
    return data


def _build(data, tmp_path_factory):
    out = tmp_path_factory.mktemp("walls") / "calc.xlsx"
    result = build_workbook(data, out)
    values = evaluate_workbook(out)

    def cell(qid):
        entry = result.registry.entries[qid]
        return values[(entry.sheet, a1(entry.row, entry.col))]

    return result, values, cell


@pytest.fixture(scope="module")
def stacked(tmp_path_factory):
    return _build(_stacked_uplift_spec(), tmp_path_factory)


@pytest.fixture(scope="module")
def narrow(tmp_path_factory):
    return _build(_narrow_segments_wind_lrfd_spec(), tmp_path_factory)


@pytest.mark.parametrize("case", ["stacked", "narrow"])
def test_recomputed_workbook_equals_engine(case, request):
    result, values, _ = request.getfixturevalue(case)
    assert any(e.sheet.startswith("Walls_") for e in result.registry.calcs())
    mismatches = compare(result.registry, result.results, values)
    assert not mismatches, "\n".join(map(str, mismatches[:20]))
    assert formula_errors(values) == []


def test_line_story_shear_accumulates_the_reactions_above(stacked):
    # Statics: the story shear below a level is the sum of the line's reactions at that
    # level and at every level above it.
    _, _, cell = stacked
    reactions = [cell(f"walls.{lv}.line.A.R_seis") for lv in STORIES_TOP_DOWN]
    assert cell("walls.L2.line.A.V_seis") == pytest.approx(sum(reactions), rel=REL)
    assert cell("walls.L3.line.A.V_seis") == pytest.approx(sum(reactions[:2]), rel=REL)


def test_segment_shears_add_up_to_the_line_shear(stacked):
    # Statics: the distribution (SDPWS-2015 §4.3.3.4.1) only splits the line's shear.
    _, _, cell = stacked
    parts = [cell(f"walls.L2.seg.A.{s}.V_seis") for s in ("A1", "A2", "A3")]
    assert sum(parts) == pytest.approx(cell("walls.L2.line.A.V_seis"), rel=REL)


@pytest.mark.parametrize("level", STORIES_TOP_DOWN)
@pytest.mark.parametrize("source", ["seis", "wind"])
def test_dead_load_moment_above_overturning_needs_no_hold_down(stacked, level, source):
    # Common practice: where the factored dead-load moment exceeds the overturning moment
    # the net uplift is negative and the hold-down force is zero.
    _, _, cell = stacked
    base = f"walls.{level}.seg.A.A1"
    assert cell(f"{base}.uplift_{source}") < 0
    assert cell(f"{base}.T_{source}") == 0


def test_net_uplift_is_overturning_over_the_hold_down_arm(stacked):
    # Statics (AWC Manual M14.3 form): with no dead load, T = M_ot / (L - offset),
    # M_ot = factored segment shear x wall height (9.25 ft, demo); 14 ft segment, offset 0.29 ft.
    _, _, cell = stacked
    base = "walls.RF.seg.A.A3"
    M_ot = cell("combo.Fac_E") * cell(f"{base}.V_seis") * WALL_FT
    assert cell(f"{base}.M_ot_seis") == pytest.approx(M_ot, rel=REL)
    assert cell(f"{base}.uplift_seis") == pytest.approx(M_ot / (14.0 - 0.29), rel=REL)
    assert cell(f"{base}.uplift_seis") > 0


def test_stacked_hold_down_carries_the_stories_above(stacked):
    # Statics: a hold-down continuing down carries this story's net uplift plus the
    # hold-down force delivered from the segment above.
    _, _, cell = stacked
    T = {lv: cell(f"walls.{lv}.seg.A.A3.T_seis") for lv in STORIES_TOP_DOWN}
    up = {lv: cell(f"walls.{lv}.seg.A.A3.uplift_seis") for lv in STORIES_TOP_DOWN}
    assert T["RF"] == pytest.approx(up["RF"], rel=REL)
    assert T["L3"] == pytest.approx(up["L3"] + T["RF"], rel=REL)
    assert T["L2"] == pytest.approx(up["L2"] + T["L3"], rel=REL)


def test_design_story_drift_is_cd_over_ie_times_elastic_drift(stacked):
    # ASCE 7-16 Eq. 12.8-15 with the demo's Cd = 4.0, Ie = 1.0 (risk category II), and
    # Table 12.12-1 "4 stories or less" row, RC II: 0.025 hsx (from memory).
    _, _, cell = stacked
    delta_xe = cell("drift.L2.A.delta_xe")
    assert cell("drift.L2.A.Delta") == pytest.approx(4.0 * delta_xe, rel=REL)
    assert cell("drift.L2.A.Delta_a") == pytest.approx(0.025 * 10.5 * 12, rel=REL)


def test_summary_marks_failing_rows_in_text(stacked):
    # The summary must read without colour: a DCR above 1 gives "FAILS" and a marker.
    result, _, cell = stacked
    keys = [e.id[: -len(".dcr")] for e in result.registry.calcs() if e.id.endswith(".dcr")]
    assert keys, "no summary rows"
    for key in keys:
        dcr = cell(f"{key}.dcr")
        if isinstance(dcr, str):
            continue
        assert cell(f"{key}.status") == ("FAILS" if dcr > 1 else "ok")
        assert cell(f"{key}.marker") == ("<<<" if dcr > 1 else "-")


def test_segment_past_two_to_one_takes_k_two_b_over_h(narrow):
    # SDPWS-2015 §4.3.3.4.1 Exception (from memory): k = 2bs/h = 2 x 4 / 9.25.
    _, _, cell = narrow
    assert cell("walls.RF.seg.B.B1.k") == pytest.approx(2 * 4.0 / WALL_FT, rel=REL)
    assert cell("walls.RF.line.B.sum_Lk") == pytest.approx(4.0 * 2 * 4.0 / WALL_FT, rel=REL)


def test_segment_past_the_limit_is_not_a_shear_wall(narrow):
    # SDPWS-2015 Table 4.3.4 (from memory): h/bs = 9.25 / 2.5 = 3.7 > 3.5.
    _, _, cell = narrow
    assert cell("walls.RF.seg.B.B2.k") == 0
    assert cell("walls.RF.seg.B.B2.ok") == "no: h/bs > 3.5"
    assert cell("walls.RF.seg.B.B2.V_wind") == 0


def test_lrfd_wind_capacity_is_point_eight_nominal(narrow):
    # SDPWS-2015 §4.3.3: LRFD design unit shear = 0.80 x nominal; SW1 vw = 730 plf (demo);
    # shared by deflection, B1 at h/bs = 2.3125 takes the §4.3.4.2 factor 1.25 - 0.125 h/bs
    # (from memory); C1 at h/bs = 0.46 takes none.
    _, _, cell = narrow
    f_ar = 1.25 - 0.125 * WALL_FT / 4.0
    assert cell("walls.RF.seg.B.B1.cap_wind") == pytest.approx(0.8 * 730 * f_ar, rel=REL)
    assert cell("walls.RF.seg.C.C1.cap_wind") == pytest.approx(0.8 * 730, rel=REL)
