"""The seismic-basis parts of a workbook (ASCE 7-16 §11.4.8, §12.7.2, §12.3.4, §12.3.2): what
the Tables, Seismic, Weights, Regularity, Summary sheets and the Cover show, and edits that flow
through the live formulas (recomputed with the `formulas` package)."""

from __future__ import annotations

import copy
import json
from pathlib import Path

import openpyxl
import pytest

from latbook.analysis import compute_results
from latbook.analysis.build_check import EDITED, INPUTS_EDITED_ID, STATUS_ID
from latbook.build import build_workbook
from latbook.engine.asce7_16 import elf
from latbook.spec.load import parse_spec
from tests.helpers.evaluator import evaluate_workbook
from tests.helpers.parity import compare
from tests.test_parity_generated import basis_spec

CEDAR = Path(__file__).resolve().parents[1] / "out_examples" / "cedar_row"


@pytest.fixture(scope="module")
def cedar(tmp_path_factory):
    data = json.loads((CEDAR / "spec.json").read_text(encoding="utf-8"))
    return build_workbook(data, tmp_path_factory.mktemp("cedar") / "calc.xlsx")


def _cells(path: Path, sheet: str) -> list:
    book = openpyxl.load_workbook(path, data_only=True, read_only=True)
    try:
        return [c.value for row in book[sheet].iter_rows() for c in row if c.value is not None]
    finally:
        book.close()


def _value(built, qid: str):
    e = built.registry.entries[qid]
    book = openpyxl.load_workbook(built.path, data_only=True, read_only=True)
    try:
        return book[e.sheet].cell(row=e.row + 1, column=e.col + 1).value
    finally:
        book.close()


def test_tables_print_see_11_4_8_where_the_standard_has_no_value(cedar):
    book = openpyxl.load_workbook(cedar.path)
    ws = book["Tables"]
    rows = [[c.value for c in row] for row in ws.iter_rows()]
    site_e = [r for r in rows if r and r[0] == "E"]
    fa_e, fv_e = site_e[0], site_e[1]
    assert fa_e[1:7] == [2.4, 1.7, 1.3, "See §11.4.8", "See §11.4.8", "See §11.4.8"]
    # Supplement No. 1 Table 11.4-2 Site E row (S. K. Ghosh Associates reprint, 13 Apr 2020)
    assert fv_e[1:7] == [4.2, 3.3, 2.8, 2.4, 2.2, 2.0]
    assert any("used only for calculation of TS" in str(r[0]) for r in rows if r)


def test_seismic_sheet_shows_ts_and_the_exception_2_branch(cedar):
    # cedar_row: Site D, Ss 1.5, S1 0.6 -> Fa 1.0, Fv 1.7 (footnote a), SDS 1.0, SD1 0.68,
    # Ts 0.68 s (derived from Tables 11.4-1/11.4-2); T = Ta = 0.189 s <= 1.5 Ts
    assert _value(cedar, "seismic.Ts") == pytest.approx(0.68, rel=1e-9)
    assert _value(cedar, "seismic.exc2") == "applies"
    assert _value(cedar, "seismic.Cs_exc2_branch") == elf.EXC2_SHORT
    assert _value(cedar, "seismic.Cs") == pytest.approx(1.0 / 6.5, rel=1e-9)
    assert "footnote a" in _value(cedar, "seismic.Fv_note")
    assert _value(cedar, "seismic.Cs_governs") == "exc. 2: " + elf.EXC2_SHORT


def test_weights_feed_the_seismic_sheet(cedar):
    # derived: roof 15 psf x 2160 sf = 32.4 kip ... the level total is the sum of its parts
    r = cedar.results
    assert r["weights.area.RF.0.w_kip"] == pytest.approx(32.4, rel=1e-12)
    # snow: pf = 35 psf > 30 -> 0.2 x 35 = 7 psf (§12.7.2 item 4)
    assert r["weights.snow.RF.psf_used"] == pytest.approx(7.0, rel=1e-12)
    # partitions: actual 6 psf < 10 -> 10 psf (item 2)
    assert r["weights.partitions.L2.psf_used"] == 10.0
    # roof walls: half the 10 ft story below plus a 2.5 ft parapet
    assert r["weights.wall.RF.0.h_ft"] == pytest.approx(7.5, rel=1e-12)
    assert _value(cedar, "seismic.level.RF.wx") == pytest.approx(r["weights.level.RF.w_x"])
    assert r["seismic.W"] == pytest.approx(r["weights.level.RF.w_x"] + r["weights.level.L2.w_x"])


def test_regularity_sheet_reports_rho_and_every_irregularity(cedar):
    assert _value(cedar, "seismic.rho") == 1.0
    assert _value(cedar, "rho.cond_a_x") == "met"
    outcomes = {t: _value(cedar, f"irr.{t}.outcome") for t in ("H1a", "H2", "V1a", "V4", "V5a")}
    assert set(outcomes.values()) == {"none"}
    cells = _cells(cedar.path, "Regularity")
    assert "declared by the designer" in cells and "checked by this workbook" in cells


def test_summary_and_cover_state_the_options_and_assumptions(cedar):
    summary = _cells(cedar.path, "Summary")
    assert any(isinstance(v, str) and "footnote a" in v for v in summary)
    assert "all declared not present" in summary
    cover = " ".join(str(v) for v in _cells(cedar.path, "Cover"))
    assert "exception 2" in cover and "footnote a" in cover and "removal test" in cover
    assert "anchorage slip left out" in cover


def test_edited_takeoff_and_site_flow_through(tmp_path):
    """Edit a takeoff psf, the site class and S1 in the workbook; the recomputed workbook
    equals the engine run on the same edits."""
    data = basis_spec("siteD-S1-0.6-takeoff-removal")
    built = build_workbook(data, tmp_path / "calc.xlsx")
    level = data["building"]["levels"][0]["id"]
    edits = {f"weights.area.{level}.0.dead_psf": 31.0, "seismic.S1": 0.45}
    wb = openpyxl.load_workbook(built.path)
    for qid, value in edits.items():
        e = built.registry.entries[qid]
        wb[e.sheet].cell(row=e.row + 1, column=e.col + 1).value = value
    edited = tmp_path / "edited.xlsx"
    wb.save(edited)
    changed = copy.deepcopy(data)
    changed["building"]["levels"][0]["weight_takeoff"]["areas"][0]["dead_psf"] = 31.0
    changed["seismic"]["ground_motion"]["S1_g"] = 0.45
    expected = compute_results(parse_spec(changed))
    assert abs(expected["seismic.W"] - built.results["seismic.W"]) > 1.0
    # the Cover's live check counts the input cells that no longer hold the embedded spec
    expected |= {INPUTS_EDITED_ID: len(edits), STATUS_ID: EDITED}
    mismatches = compare(built.registry, expected, evaluate_workbook(edited))
    assert not mismatches, "\n".join(map(str, mismatches[:20]))


def test_workbook_edited_into_a_site_specific_case_shows_a_message_never_a_number(tmp_path):
    """Site E, Ss 5.0, S1 0.2 and a 30 ft roof: Ts = SD1/SDS = 0.44/4.0 = 0.11 s < Ta = 0.26 s, so
    §11.4.8 exception 3 fails (derived); Cs must read as a message."""
    data = basis_spec("siteD-S1-0.6-takeoff-removal")
    built = build_workbook(data, tmp_path / "calc.xlsx")
    level = data["building"]["levels"][0]["id"]
    edits = {
        "seismic.site_class": "E",
        "seismic.Ss": 5.0,
        "seismic.S1": 0.2,
        f"level.{level}.elevation_ft": 30.0,
    }
    wb = openpyxl.load_workbook(built.path)
    for qid, value in edits.items():
        e = built.registry.entries[qid]
        wb[e.sheet].cell(row=e.row + 1, column=e.col + 1).value = value
    edited = tmp_path / "edited.xlsx"
    wb.save(edited)
    values = evaluate_workbook(edited)

    def at(qid):
        e = built.registry.entries[qid]
        return values[(e.sheet, e.address.split("!")[1])]

    assert str(at("seismic.exc3")).startswith("NOT MET: T > Ts")
    cs = at("seismic.Cs")
    assert isinstance(cs, str) and cs.startswith("not permitted: see §11.4.8")
    assert not isinstance(at("seismic.V"), int | float)


def test_declared_irregularity_raises_collector_forces_by_25_percent():
    """ASCE 7-16 §12.3.3.4 (from memory): SDC D-F with horizontal Type 3 -> collector forces
    from §12.10.1.1 x 1.25 where overstrength is not used (light-frame exception taken)."""
    data = basis_spec("siteE-S1-0.3-mixed-perimeter")
    plain = copy.deepcopy(data)
    plain["seismic"]["declared_irregularities"] = {}
    r = compute_results(parse_spec(data))
    r0 = compute_results(parse_spec(plain))
    assert r["irr.H3.outcome"] == "present" and r0["irr.H3.outcome"] == "none"
    assert r["irr.collector_factor"] == 1.25 and r0["irr.collector_factor"] == 1.0
    keys = [k for k in r if k.endswith(".R_coll_E")]
    assert keys
    for k in keys:
        base = k.removesuffix(".R_coll_E")
        # F_x-based force with the story's rho; F_px-based at rho = 1.0 (§12.3.4.1), x 1.25
        expected = max(
            r["combo.Fac_E"] * abs(r[f"{base}.R_seis"]),
            r["combo.Fac_E_dia"] * 1.25 * abs(r[f"{base}.R_seis_fpx"]),
        )
        assert r[k] == pytest.approx(expected, rel=1e-12)
    assert any(r[k] > r0[k] * (1 + 1e-9) for k in keys)  # the increase acts somewhere


def test_takeoff_workbook_verifies_and_reads_back_to_its_spec(cedar):
    """Weights-sheet inputs and the blank typed weights read back to the spec that built the
    workbook; verify finds it intact."""
    from latbook.readback import read_back_spec
    from latbook.verify import verify_workbook
    from latbook.workbook_file import read_workbook

    report = verify_workbook(cedar.path)
    assert report.findings == [] and report.cells_checked == len(cedar.registry.calcs())
    data = json.loads((CEDAR / "spec.json").read_text(encoding="utf-8"))
    assert read_back_spec(read_workbook(cedar.path)) == data
