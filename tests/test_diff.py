"""`latbook diff OLD NEW` on specs and workbooks that differ in known ways. The demo building
(out_examples/maple_terrace) is invented; the expected changes are derived from the edits
made (W is the sum of the level weights; V = Cs W with Cs independent of W, ASCE 7-16
Eq. 12.8-1) and the ratios are the engine's own, run on each spec separately.
"""

from __future__ import annotations

import copy
import json
import math
from pathlib import Path

import openpyxl
import pytest

from latbook.build import build_workbook, check_spec
from latbook.cli import main
from latbook.diff import diff_sides, flatten, moved
from latbook.diff_sides import load_side

ROOT = Path(__file__).resolve().parents[1]
DEMO = ROOT / "out_examples/maple_terrace/spec.json"
ONE_STOREY = ROOT / "out_examples/harbor_workshop/spec.json"
WEIGHT_PATH = "$.building.levels[0].seismic_weight_kip"  # level L2: 132 kip in the demo
WEIGHT_ID = "level.L2.seismic_weight_kip"
HEAVIER_KIP = 280.0  # pushes the L2 seismic shear walls past a DCR of 1.0 (and nothing else)


def _demo() -> dict:
    return json.loads(DEMO.read_text(encoding="utf-8"))


def _write(data: dict, path: Path) -> Path:
    path.write_text(json.dumps(data), encoding="utf-8")
    return path


@pytest.fixture(scope="module")
def specs(tmp_path_factory):
    """(old spec path, new spec path with L2 heavier, old data, new data)."""
    folder = tmp_path_factory.mktemp("diff")
    old = _demo()
    new = copy.deepcopy(old)
    new["building"]["levels"][0]["seismic_weight_kip"] = HEAVIER_KIP
    return _write(old, folder / "old.json"), _write(new, folder / "new.json"), old, new


@pytest.fixture(scope="module")
def built(specs, tmp_path_factory):
    old_path, _, old, _ = specs
    return build_workbook(old, tmp_path_factory.mktemp("diff_book") / "calc.xlsx")


def test_one_weight_changed(specs, capsys):
    old_path, new_path, old, new = specs
    d = diff_sides(load_side(old_path), load_side(new_path))
    assert [(c.key, c.old, c.new) for c in d.inputs_changed] == [(WEIGHT_PATH, 132.0, HEAVIER_KIP)]
    assert not d.inputs_added and not d.inputs_removed
    assert not d.results_added and not d.results_removed
    moves = {c.key: (c.old, c.new) for c in d.results_moved}
    # derived: W = 132 + 128 + 88 = 348 kip -> 496 kip; V scales with W
    assert moves["seismic.W"] == pytest.approx((348.0, 496.0), rel=1e-12)
    v_old, v_new = moves["seismic.V"]
    assert v_new / v_old == pytest.approx(496.0 / 348.0, rel=1e-12)
    # every moved result moved by what the engine gives for each spec on its own
    _, r0 = check_spec(old)
    _, r1 = check_spec(new)
    expected = {k for k in r0 if moved(r0[k], r1[k], 1e-6, 1e-9)}
    assert set(moves) == expected
    assert all(moves[k] == (r0[k], r1[k]) for k in moves)
    # unaffected: wind pressures do not depend on a seismic weight
    assert not any(k.startswith("wind.") for k in moves)
    # the check that crossed 1.0, with its ratios before and after
    [crossed] = d.checks_crossed
    assert crossed.check == "wall.L2.seis"
    assert crossed.old_dcr == r0["summary.wall.L2.seis.dcr"] < 1.0
    assert crossed.new_dcr == r1["summary.wall.L2.seis.dcr"] > 1.0
    assert (crossed.old_status, crossed.new_status) == ("ok", "FAILS")
    assert main(["diff", str(old_path), str(new_path)]) == 1
    text = capsys.readouterr().out
    assert f"inputs changed (1):\n    {WEIGHT_PATH}: 132.0 -> 280.0" in text
    assert "checks crossing a DCR of 1.0 (1):" in text
    assert "wall.L2.seis" in text and "now FAILS" in text
    assert "relative tolerance of 1e-06" in text


def test_json_report(specs, capsys):
    old_path, new_path, old, new = specs
    assert main(["diff", str(old_path), str(new_path), "--json"]) == 1
    report = json.loads(capsys.readouterr().out)
    assert report["changed"] is True
    assert report["tolerance"] == {"relative": 1e-6, "absolute": 1e-9}
    assert (report["old"]["kind"], report["new"]["kind"]) == ("spec", "spec")
    assert report["inputs"] == {
        "changed": [{"path": WEIGHT_PATH, "old": 132.0, "new": HEAVIER_KIP}],
        "added": [],
        "removed": [],
    }
    [crossed] = report["checks_crossed"]
    assert crossed["check"] == "wall.L2.seis" and crossed["now"] == "fails"
    _, r1 = check_spec(new)
    assert crossed["new_dcr"] == r1["summary.wall.L2.seis.dcr"]
    w = next(m for m in report["results"]["moved"] if m["id"] == "seismic.W")
    assert w["change"] == pytest.approx(148.0, rel=1e-12)
    assert w["relative_change"] == pytest.approx(148.0 / 348.0, rel=1e-12)


def test_check_that_now_passes(tmp_path, capsys):
    # softer walls for wind (0.3 x Ga) fail the demo's wind drift row; the demo's own pass
    new = _demo()
    old = copy.deepcopy(new)
    for assembly in old["assemblies"]["shear_walls"]:
        assembly["Ga_wind_kips_per_in"] *= 0.3
    d = diff_sides(
        load_side(_write(old, tmp_path / "a.json")), load_side(_write(new, tmp_path / "b.json"))
    )
    assert {c.key for c in d.inputs_changed} == {
        f"$.assemblies.shear_walls[{i}].Ga_wind_kips_per_in"
        for i in range(len(old["assemblies"]["shear_walls"]))
    }
    [crossed] = d.checks_crossed
    assert crossed.check == "drift.wind" and not crossed.now_fails
    assert crossed.old_dcr > 1.0 >= crossed.new_dcr


def test_identical_inputs_spec_against_its_workbook(specs, built, capsys):
    old_path = specs[0]
    assert main(["diff", str(old_path), str(built.path)]) == 0
    text = capsys.readouterr().out
    assert "no changes" in text
    assert "workbook; the engine run on its current input cells" in text
    assert main(["diff", str(built.path), str(old_path), "--json"]) == 0
    report = json.loads(capsys.readouterr().out)
    assert report["changed"] is False and report["results"]["moved"] == []


def test_workbook_edited_by_a_script(specs, built, tmp_path, capsys):
    _, new_path, _, _ = specs
    entry = built.registry.entries[WEIGHT_ID]
    wb = openpyxl.load_workbook(built.path)
    wb[entry.sheet].cell(entry.row + 1, entry.col + 1).value = HEAVIER_KIP
    edited = tmp_path / "edited.xlsx"
    wb.save(edited)
    d = diff_sides(load_side(specs[0]), load_side(edited))
    assert [(c.key, c.new) for c in d.inputs_changed] == [(WEIGHT_PATH, HEAVIER_KIP)]
    assert [c.check for c in d.checks_crossed] == ["wall.L2.seis"]
    # the edited workbook holds the same inputs as the spec with that weight
    assert main(["diff", str(edited), str(new_path)]) == 0
    assert "no changes" in capsys.readouterr().out


def test_tolerance_option(tmp_path):
    old = _demo()
    new = copy.deepcopy(old)
    new["building"]["levels"][0]["seismic_weight_kip"] = 132.0001
    a, b = load_side(_write(old, tmp_path / "a.json")), load_side(_write(new, tmp_path / "b.json"))
    # derived: W moves by 1e-4 / 348 = 2.9e-7 of itself, under the default 1e-6
    assert "seismic.W" not in {c.key for c in diff_sides(a, b).results_moved}
    fine = {c.key: c for c in diff_sides(a, b, rel_tol=1e-9).results_moved}
    assert math.isclose(fine["seismic.W"].new - fine["seismic.W"].old, 1e-4, rel_tol=1e-6)
    # the input changed all the same
    assert diff_sides(a, b).changed


def test_layout_changes_listed_apart(capsys):
    d = diff_sides(load_side(DEMO), load_side(ONE_STOREY))
    assert "seismic.level.L3.Vx" in d.results_removed  # the demo's third storey
    assert d.inputs_removed or d.inputs_added
    assert main(["diff", str(DEMO), str(ONE_STOREY)]) == 1
    text = capsys.readouterr().out
    assert "results only in old (layout changed)" in text


@pytest.mark.parametrize(
    ("make", "message"),
    [
        (lambda p: p, "cannot read"),  # missing
        (lambda p: (p.write_text("{not json", encoding="utf-8"), p)[1], "not valid JSON"),
        (lambda p: (p.write_text('{"project": 3}', encoding="utf-8"), p)[1], "$.project"),
        (lambda p: (openpyxl.Workbook().save(p), p)[1], "not written by latbook"),
    ],
    ids=["missing", "not-json", "invalid-spec", "foreign-xlsx"],
)
def test_bad_files_exit_2_with_a_message(make, message, tmp_path, capsys):
    bad = make(tmp_path / "bad.xlsx")
    assert main(["diff", str(DEMO), str(bad)]) == 2
    err = capsys.readouterr().err
    assert "new side" in err and message in err and "Traceback" not in err
    assert main(["diff", str(bad), str(DEMO)]) == 2
    assert "old side" in capsys.readouterr().err


def test_workbook_with_invalid_inputs_exits_2(built, tmp_path, capsys):
    entry = built.registry.entries[WEIGHT_ID]
    wb = openpyxl.load_workbook(built.path)
    wb[entry.sheet].cell(entry.row + 1, entry.col + 1).value = "heavy"
    edited = tmp_path / "bad_input.xlsx"
    wb.save(edited)
    assert main(["diff", str(DEMO), str(edited)]) == 2
    err = capsys.readouterr().err
    assert f"{entry.address} ({WEIGHT_PATH})" in err and "expected a number" in err


def test_negative_tolerance_is_a_usage_error(capsys):
    with pytest.raises(SystemExit) as stop:
        main(["diff", str(DEMO), str(DEMO), "--rel-tol", "-1"])
    assert stop.value.code == 2
    assert "must be a finite number >= 0" in capsys.readouterr().err


def test_flatten_and_moved():
    # derived
    assert flatten({"a": {"b": [1, {"c": True}], "e": []}}) == {
        "$.a.b[0]": 1,
        "$.a.b[1].c": True,
        "$.a.e": [],
    }
    assert not moved(100.0, 100.00005, 1e-6, 1e-9)  # 5e-7 of itself
    assert moved(100.0, 100.0002, 1e-6, 1e-9)
    assert not moved(0.0, 5e-10, 1e-6, 1e-9)  # under the absolute floor
    assert moved("ok", "FAILS", 1e-6, 1e-9)
    assert moved("no capacity", 0.5, 1e-6, 1e-9)


def test_output_to_a_reader_that_stops_early(specs):
    """`latbook diff ... | head -1`: the pipe closes under a long report; exit 3, no
    traceback."""
    import os
    import subprocess
    import sys

    old_path, new_path, _, _ = specs
    env = {**os.environ, "PYTHONPATH": str(ROOT / "generator")}
    proc = subprocess.Popen(
        [sys.executable, "-m", "latbook", "diff", str(old_path), str(new_path), "--json"],
        stdout=subprocess.PIPE,
        stderr=subprocess.PIPE,
        env=env,
    )
    assert proc.stdout.readline() == b"{\n"  # the report runs far past a pipe's buffer
    proc.stdout.close()
    err = proc.stderr.read().decode()
    assert proc.wait() == 3
    assert "Traceback" not in err
