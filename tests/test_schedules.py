"""The Schedules sheet gathers what the walls and diaphragm sheets computed (derived: each row
equals its source cell; the ratio is force / capacity, AWC SDPWS-2015 §4.3.6.4.2)."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from latbook.analysis import compute_results
from latbook.spec.load import parse_spec

ROOT = Path(__file__).resolve().parents[1]


@pytest.fixture(scope="module")
def harbor() -> dict:
    data = json.loads((ROOT / "out_examples/harbor_workshop/spec.json").read_text())
    return compute_results(parse_spec(data))


def test_hold_down_rows_take_the_larger_tension_and_its_ratio(harbor):
    r = harbor
    T = max(r["walls.RF.seg.S.S1.T_seis"], r["walls.RF.seg.S.S1.T_wind"])
    assert r["sched.hd.RF.S.S1.T"] == T
    assert r["sched.hd.RF.S.S1.capacity_lb"] == 3000.0
    assert r["sched.hd.RF.S.S1.ratio"] == pytest.approx(T / 3000.0, rel=1e-12)
    # S2 has no capacity in the example: a segment that lifts reads "not given"
    assert r["sched.hd.RF.S.S2.capacity_lb"] == "not given"
    assert r["sched.hd.RF.S.S2.ratio"] in ("not given", "no uplift")


def test_assembly_schedule_counts_its_segments(harbor):
    # harbor_workshop: every one of its 7 segments uses assembly W1
    assert harbor["sched.wall.W1.n_segments"] == 7


def test_collector_rows_repeat_the_diaphragm_sheets(harbor):
    r = harbor
    assert r["sched.coll.RF.y.E.peak_W_lb"] == r["diaph.RF.y.line.E.peak_W_lb"]
    assert r["sched.coll.RF.y.E.ratio"] == r["diaph.RF.y.line.E.coll_dcr"]


def test_foundation_rows_take_the_larger_of_seismic_and_wind(harbor):
    # derived: the foundation schedule repeats the Found sheet's larger design-level value
    r = harbor
    for name in ("V", "T", "C"):
        seis, wind = r[f"found.S.S1.{name}_seis"], r[f"found.S.S1.{name}_wind"]
        assert r[f"sched.found.S.S1.{name}"] == max(seis, wind)
    assert r["sched.found.S.S1.T"] > 0  # the roof uplift lifts S1 (the example fails there)
