"""Diaphragm deflection per span (AWC SDPWS-2015 Eq. 4.2-1, the cantilever form for overhangs)
and the story drift at an overhang's edge (SDPWS-2015 §4.2.5.2 against ASCE 7-16 Table
12.12-1's Δa; wind against h/ratio, common practice).

Expected values are derived by hand from the equations named beside each check (see
tests/engine/test_sdpws_diaphragm_deflection.py for the equations' own checks); the examples'
assembly values (Ga, chord E and A, splice slip and spacing) are invented, demo only.
"""

from __future__ import annotations

import copy
import json
import random
from pathlib import Path
from typing import Any

import pytest

from latbook.analysis import compute_results
from latbook.analysis.overhang_drift import NOT_CHECKED
from latbook.cli import main
from latbook.spec.load import parse_spec
from tests.helpers.specgen import make_spec
from tests.test_parity_generated import assert_parity

ROOT = Path(__file__).resolve().parents[1]
HARBOR = json.loads((ROOT / "out_examples/harbor_workshop/spec.json").read_text(encoding="utf-8"))
DEFLECTION_INPUTS = {
    "Ga_kips_per_in": 12.0,
    "chord_E_psi": 1.6e6,
    "chord_A_in2": 16.5,
    "chord_splice_slip_in": 0.03,
    "chord_splice_spacing_ft": 16.0,
}


def results(data: dict[str, Any]) -> dict[str, Any]:
    return compute_results(parse_spec(data))


def test_harbor_span_terms_by_hand():
    # harbor, load in y: W = b = 50 ft; RD1: Ga 15 kips/in, E 1.6e6 psi, A 16.5 in², Δc 0.03
    # in, s 20 ft (demo values). Span 1 (W to M, L = 40 ft), v from F_px as on the sheet:
    r = results(HARBOR)
    P = "diaph.RF.y.span"
    v = r[f"{P}.1.v_fpx_plf"]
    assert r[f"{P}.1.bend_E"] == pytest.approx(5 * v * 40**3 / (8 * 1.6e6 * 16.5 * 50), rel=1e-12)
    assert r[f"{P}.1.shear_E"] == pytest.approx(0.25 * v * 40 / (1000 * 15.0), rel=1e-12)
    # splice bound 0.03 (40²/(2 x 20) + 40) = 2.4 ft·in; slip term 2.4 / (2 x 50) = 0.024 in
    assert r[f"{P}.1.sx_ftin"] == pytest.approx(2.4, rel=1e-12)
    assert r[f"{P}.1.slip_in"] == pytest.approx(0.024, rel=1e-12)
    # the 8 ft overhang past E (span 3), cantilever form: v = w_px x 8 / 50
    vc = r[f"{P}.3.v_fpx_plf"]
    assert vc == pytest.approx(r["diaph.RF.y.w_fpx_plf"] * 8.0 / 50.0, rel=1e-12)
    assert r[f"{P}.3.bend_E"] == pytest.approx(3 * vc * 8**3 / (1.6e6 * 16.5 * 50), rel=1e-12)
    assert r[f"{P}.3.shear_E"] == pytest.approx(0.5 * vc * 8 / (1000 * 15.0), rel=1e-12)
    # 0.03 (64/20 + 16) = 0.576 ft·in; / 50 = 0.01152 in
    assert r[f"{P}.3.slip_in"] == pytest.approx(0.01152, rel=1e-12)
    total = r[f"{P}.3.bend_E"] + r[f"{P}.3.shear_E"] + 0.01152
    assert r[f"{P}.3.defl_E"] == pytest.approx(total, rel=1e-12)


def test_harbor_edge_drift_by_hand():
    # SDPWS-2015 §4.2.5.2: line E's story drift (Drift sheet, already Cd/Ie) + Cd/Ie x the
    # overhang's deflection; one story, so nothing below to subtract. Δa = 0.015 hsx for
    # Risk Category III, 'all other' row of Table 12.12-1: 0.015 x 16 x 12 = 2.88 in.
    r = results(HARBOR)
    c = "diaph.RF.y.cant.3"
    Cd, Ie = r["seismic.Cd"], r["seismic.Ie"]
    expected = r["drift.RF.E.Delta"] + Cd / Ie * r["diaph.RF.y.span.3.defl_E"]
    assert r[f"{c}.edge_E"] == pytest.approx(expected, rel=1e-12)
    assert r[f"{c}.Delta_a"] == pytest.approx(2.88, rel=1e-12)
    assert r[f"{c}.dcr_E"] == pytest.approx(expected / 2.88, rel=1e-12)
    # wind: the serviceability drift of line E + 0.42 x the overhang's δ at strength W,
    # against h / 400 = 0.48 in
    edge_w = r["drift.RF.E.delta_s"] + 0.42 * r["diaph.RF.y.span.3.defl_W"]
    assert r[f"{c}.edge_W"] == pytest.approx(edge_w, rel=1e-12)
    assert r[f"{c}.dcr_W"] == pytest.approx(edge_w / 192.0 * 400, rel=1e-12)
    assert r[f"{c}.edge_dcr"] == max(r[f"{c}.dcr_E"], r[f"{c}.dcr_W"])
    assert r[f"{c}.edge_status"] == "ok"
    assert r["summary.cantilever.RF.y.status"] == "ok"
    assert r["summary.cantilever.RF.y.dcr"] == max(r[f"{c}.dcr"], r[f"{c}.edge_dcr"])


@pytest.mark.parametrize("missing", sorted(DEFLECTION_INPUTS))
def test_a_missing_input_is_never_zero_nor_ok(missing):
    data = copy.deepcopy(HARBOR)
    del data["assemblies"]["diaphragms"][0][missing]
    r = results(data)
    assert r["diaph.RF.y.defl_given"] == 0
    assert r["diaph.RF.y.defl_basis"].startswith("not computed")
    for n in (1, 2, 3):
        assert r[f"diaph.RF.y.span.{n}.defl_E"] == "not computed"
        assert r[f"diaph.RF.y.span.{n}.defl_W"] == "not computed"
    assert r["diaph.RF.y.cant.3.edge_status"] == NOT_CHECKED
    assert r["diaph.RF.y.cant.3.edge_open"] == 1
    status = r["summary.cantilever.RF.y.status"]
    assert status.startswith("limits ok; edge drift not checked")
    assert "edge drift not checked" in r["summary.overall"]


def test_a_large_overhang_deflection_fails_the_edge_drift():
    # a soft diaphragm (Ga 0.5 kips/in, demo): the overhang's shear term alone is
    # 0.5 v 8 / 500, and the edge drift exceeds Δa once Cd/Ie x δ passes 2.88 in - Δ line
    data = copy.deepcopy(HARBOR)
    data["assemblies"]["diaphragms"][0].update(Ga_kips_per_in=0.5, chord_A_in2=0.5)
    data["building"]["levels"][0]["seismic_weight_kip"] = 400.0
    r = results(data)
    c = "diaph.RF.y.cant.3"
    assert r[f"{c}.dcr_E"] > 1
    assert r[f"{c}.edge_status"] == "NG"
    assert r["summary.cantilever.RF.y.status"] == "FAILS"


def _stacked_overhang_spec() -> dict[str, Any]:
    """Generated three-story building (seed 56) whose y-overhangs stack on line Y2 at L2, L3
    and RF4, with invented deflection inputs on every diaphragm assembly."""
    spec = make_spec(random.Random(56), 3, 2, seismic="site_class", wind=True, design_method="ASD")
    for a in spec["assemblies"]["diaphragms"]:
        a.update(DEFLECTION_INPUTS)
    return spec


def test_overhang_below_is_subtracted():
    # the edge's story drift is the difference of the edge displacements at the two levels:
    # line drift + Cd/Ie (δ at this level - δ of the overhang below on the same line)
    r = results(_stacked_overhang_spec())
    Cd, Ie = r["seismic.Cd"], r["seismic.Ie"]
    top, mid = "diaph.RF4.y", "diaph.L3.y"
    assert r[f"{top}.cant.2.dia_below_E"] == r[f"{mid}.span.2.defl_E"]
    expected = r["drift.RF4.Y2.Delta"] + Cd / Ie * (
        r[f"{top}.span.2.defl_E"] - r[f"{mid}.span.2.defl_E"]
    )
    assert r[f"{top}.cant.2.edge_E"] == pytest.approx(expected, rel=1e-12)
    assert r["diaph.L2.y.cant.2.dia_below_E"] == 0.0  # L2 is the lowest level


def test_stacked_overhangs_parity(tmp_path):
    assert_parity(_stacked_overhang_spec(), tmp_path / "calc.xlsx")


@pytest.mark.parametrize(
    ("field", "value", "rule"),
    [
        ("Ga_kips_per_in", -12.0, "greater_than"),
        ("chord_E_psi", 0.0, "greater_than"),
        ("chord_A_in2", -1.0, "greater_than"),
        ("chord_splice_slip_in", -0.01, "greater_than_equal"),
        ("chord_splice_spacing_ft", -20.0, "greater_than"),
    ],
)
def test_bad_deflection_input_refused(field, value, rule, tmp_path, capsys):
    data = copy.deepcopy(HARBOR)
    data["assemblies"]["diaphragms"][0][field] = value
    spec = tmp_path / "spec.json"
    spec.write_text(json.dumps(data), encoding="utf-8")
    out = tmp_path / "calc.xlsx"
    code = main(["build", str(spec), "-o", str(out)])
    err = capsys.readouterr().err
    assert code == 2
    assert f"$.assemblies.diaphragms[0].{field}" in err
    assert f"[{rule}]" in err
    assert "Traceback" not in err
    assert not out.exists()
