"""The Wind_x / Wind_y and Combos sheets: live formulas checked against outside values.

Sources named beside each check: ASCE 7-16 Table 26.10-1 (Kz), Table 26.11-1 (alpha, zg),
Fig. 27.3-1 (leeward Cp), §27.1.5 (16 psf minimum), §2.3 / §2.4 (combination factors);
all typed from memory. Edited workbooks are recomputed with `formulas`
(tests/helpers/evaluator.py), so these tests exercise the formulas, not the cached values.
"""

from __future__ import annotations

import copy
import json
from pathlib import Path
from typing import Any

import openpyxl
import pytest

from latbook.build import BuildResult, build_workbook
from latbook.engine.asce7_16 import wind
from latbook.workbook.templates import reference_tables
from tests.helpers.evaluator import evaluate_workbook
from tests.helpers.parity import compare

ROOT = Path(__file__).resolve().parents[1]
# The demo without its wall lines: every wind and combination quantity stays, and the
# evaluator (about 20 ms a formula cell) has a tenth of the cells to recompute.
DEMO = {
    **json.loads((ROOT / "out_examples/maple_terrace/spec.json").read_text(encoding="utf-8")),
    "wall_lines": [],
}


def _build(data: dict[str, Any], tmp_path: Path, name: str = "calc.xlsx") -> BuildResult:
    return build_workbook(data, tmp_path / name)


def _edit_and_recompute(
    result: BuildResult, edits: dict[str, Any], tmp_path: Path
) -> dict[tuple[str, str], Any]:
    """Set input cells (by quantity id) in a copy of the workbook and recompute it."""
    wb = openpyxl.load_workbook(result.path)
    for qid, value in edits.items():
        entry = result.registry.entries[qid]
        wb[entry.sheet].cell(row=entry.row + 1, column=entry.col + 1).value = value
    edited = tmp_path / "edited.xlsx"
    wb.save(edited)
    return evaluate_workbook(edited)


def _value(result: BuildResult, values: dict[tuple[str, str], Any], qid: str) -> Any:
    entry = result.registry.entries[qid]
    sheet, ref = entry.address.split("!")
    return values[(sheet, ref)]


# --- parity on variants of the demo (both directions, both methods, no seismic, ...) -----


def _variant(name: str) -> dict[str, Any]:
    data = copy.deepcopy(DEMO)
    w = data["wind"]
    if name == "lrfd":
        data["design_method"] = "LRFD"
    elif name == "wind_only":
        data.pop("seismic")
    elif name == "no_Ke_no_parapet_exposure_B":
        w.update(use_Ke=False, parapet_height_ft=0.0, exposure="B", enclosure="partially_enclosed")
    elif name == "one_level_exposure_D_long_plan":
        data["building"]["levels"] = [data["building"]["levels"][0]]
        data["building"]["levels"][0]["plan"] = {"x_max_ft": 200.0, "y_max_ft": 40.0}
        data["wall_lines"] = []
        w.update(exposure="D", mean_roof_height_ft=12.0, V_mph=95.0)
    return data


@pytest.mark.parametrize(
    "variant",
    ["lrfd", "wind_only", "no_Ke_no_parapet_exposure_B", "one_level_exposure_D_long_plan"],
)
def test_recomputed_variant_equals_engine(variant, tmp_path):
    result = _build(_variant(variant), tmp_path)
    mismatches = compare(result.registry, result.results, evaluate_workbook(result.path))
    assert not mismatches, "\n".join(map(str, mismatches[:20]))
    assert any(e.id.startswith("wind.y.level.") for e in result.registry.calcs())


# --- live formulas: level forces scale with V^2; the 16 psf minimum takes over --------------


@pytest.fixture(scope="module")
def demo(tmp_path_factory) -> BuildResult:
    return _build(copy.deepcopy(DEMO), tmp_path_factory.mktemp("wind"))


@pytest.mark.parametrize("direction", ["x", "y"])
def test_level_forces_scale_with_V_squared(demo, direction, tmp_path):
    # ASCE 7-16 Eq. 26.10-1: q_z is proportional to V^2, so every level force of the computed
    # pressure case (parapet included, Eq. 27.3-3) scales by (V_new/V_old)^2 = (150/110)^2.
    # The §27.1.5 minimum is a load case of its own, so nothing is mixed in at any speed.
    values = _edit_and_recompute(demo, {"wind.V_mph": 150.0}, tmp_path)
    ratio = (150.0 / 110.0) ** 2
    for level in ("RF", "L3", "L2"):
        base = f"wind.{direction}.level.{level}"
        got = _value(demo, values, f"{base}.F_level")
        assert got == pytest.approx(demo.results[f"{base}.F_level"] * ratio, rel=1e-9)
        # the minimum case does not depend on V
        assert _value(demo, values, f"{base}.F_min") == pytest.approx(
            demo.results[f"{base}.F_min"], rel=1e-12
        )


def test_16_psf_minimum_is_its_own_load_case_at_85_mph(demo, tmp_path):
    # ASCE 7-16 §27.1.5: not less than 16 psf on the wall area and 8 psf on the roof projected on a
    # vertical plane, as a separate load case. Wind in x, B = 42 ft; bands (hand): RF 26.25-34 ft
    # (7.75 ft) plus the 2.5 ft parapet as wall area -> 16 x 10.25 x 42 / 1000 = 6.888 kip; L3 and
    # L2 (10.5 ft) -> 16 x 10.5 x 42 / 1000 = 7.056 kip. At 85 mph the computed forces are
    # (85/110)^2 of those at 110 mph and are never replaced band by band.
    values = _edit_and_recompute(demo, {"wind.V_mph": 85.0}, tmp_path)
    ratio = (85.0 / 110.0) ** 2
    for level, minimum_kip in (("RF", 6.888), ("L3", 7.056), ("L2", 7.056)):
        base = f"wind.x.level.{level}"
        assert _value(demo, values, f"{base}.F_min") == pytest.approx(minimum_kip, rel=1e-9)
        got = _value(demo, values, f"{base}.F_level")
        assert got == pytest.approx(demo.results[f"{base}.F_level"] * ratio, rel=1e-9)
    V_min = _value(demo, values, "wind.x.V_base_min_kip")
    assert V_min == pytest.approx(6.888 + 2 * 7.056, rel=1e-9)
    V = _value(demo, values, "wind.x.V_base_kip")
    expected = "computed pressures" if V_min <= V else "§27.1.5 minimum"
    assert _value(demo, values, "wind.x.base_case") == expected


def test_roof_projection_loads_the_minimum_case(demo, tmp_path):
    # §27.1.5 (from memory): 8 psf on the roof projected on a vertical plane; a 4 ft projection
    # above h on the 42 ft width adds 8 x 4 x 42 / 1000 = 1.344 kip at the roof, moment arm
    # h + 4/2 = 36 ft (derived)
    values = _edit_and_recompute(demo, {"wind.roof_projection_above_h_ft": 4.0}, tmp_path)
    F = _value(demo, values, "wind.x.level.RF.F_min")
    assert pytest.approx(demo.results["wind.x.level.RF.F_min"] + 1.344, rel=1e-9) == F
    M = _value(demo, values, "wind.x.M_base_min_kipft")
    assert pytest.approx(demo.results["wind.x.M_base_min_kipft"] + 1.344 * 36.0, rel=1e-9) == M


# --- the workbook's Kz against ASCE 7-16 Table 26.10-1 --------------------------------------

# ASCE 7-16 Table 26.10-1 (from memory), z in ft -> (B, C, D). Two-decimal table entries read
# as truncated against the note formula, hence abs=0.01 (see tests/engine/test_asce7_16_wind.py).
TABLE_26_10_1 = {
    15.0: (0.57, 0.85, 1.03),
    25.0: (0.66, 0.94, 1.12),
    40.0: (0.76, 1.04, 1.22),
    60.0: (0.85, 1.13, 1.31),
    70.0: (0.89, 1.17, 1.34),
}


def _tall_spec() -> dict[str, Any]:
    """Levels at 10, 20, 30, 50 ft, h = 60 ft, parapet 10 ft: band tops 15, 25, 40, 60 ft, qh at
    60 ft and qp at 70 ft, i.e. rows of Table 26.10-1."""
    data = copy.deepcopy(DEMO)
    plan = {"x_max_ft": 64.0, "y_max_ft": 42.0}
    data["building"]["levels"] = [
        {"id": f"L{i}", "elevation_ft": z, "seismic_weight_kip": 100.0, "plan": plan}
        for i, z in enumerate((10.0, 20.0, 30.0, 50.0), start=2)
    ]
    data["wall_lines"] = []
    data["wind"].update(mean_roof_height_ft=60.0, parapet_height_ft=10.0)
    return data


@pytest.fixture(scope="module")
def tall(tmp_path_factory) -> BuildResult:
    return _build(_tall_spec(), tmp_path_factory.mktemp("tall"))


@pytest.mark.parametrize(("exposure", "column"), [("B", 0), ("C", 1), ("D", 2)])
def test_workbook_Kz_matches_table_26_10_1(tall, exposure, column, tmp_path):
    values = _edit_and_recompute(tall, {"wind.exposure": exposure}, tmp_path)
    band_tops = {"L2": 15.0, "L3": 25.0, "L4": 40.0, "L5": 60.0}
    for level, z_ft in band_tops.items():
        assert _value(tall, values, f"wind.x.level.{level}.z_hi_ft") == pytest.approx(z_ft)
        kz = _value(tall, values, f"wind.x.level.{level}.Kz")
        assert kz == pytest.approx(TABLE_26_10_1[z_ft][column], abs=0.01)  # Table 26.10-1
    kz_h = _value(tall, values, "wind.y.Kz_h")
    assert kz_h == pytest.approx(TABLE_26_10_1[60.0][column], abs=0.01)  # Table 26.10-1
    kz_p = _value(tall, values, "wind.y.parapet_Kz")
    assert kz_p == pytest.approx(TABLE_26_10_1[70.0][column], abs=0.01)  # Table 26.10-1


@pytest.mark.parametrize(("L_ft", "cp"), [(42.0, -0.5), (84.0, -0.3), (168.0, -0.2), (63.0, -0.4)])
def test_workbook_leeward_Cp_follows_fig_27_3_1(demo, L_ft, cp, tmp_path):
    # ASCE 7-16 Fig. 27.3-1 (from memory): leeward Cp -0.5 at L/B = 1, -0.3 at 2, -0.2 at 4,
    # linear between (L/B = 1.5 -> -0.4). Wind in x: L = plan x-length, B = 42 ft on every level.
    edits = {f"level.{lv}.x_max_ft": L_ft for lv in ("RF", "L3", "L2")}
    values = _edit_and_recompute(demo, edits, tmp_path)
    assert _value(demo, values, "wind.x.L_over_B") == pytest.approx(L_ft / 42.0)
    assert _value(demo, values, "wind.x.Cp_leeward") == pytest.approx(cp, rel=1e-9)


# --- the workbook's copy of the tables equals the engine's ----------------------------------


def test_workbook_exposure_constants_equal_engine():
    # Both copies typed from ASCE 7-16 Table 26.11-1 (from memory).
    t = reference_tables()["Wind_exposure"]
    assert t["rows"] == list(wind.EXPOSURE_CONSTANTS)
    for exposure, (alpha, zg_ft) in zip(t["rows"], t["values"], strict=True):
        assert (alpha, zg_ft) == tuple(wind.EXPOSURE_CONSTANTS[exposure])


def test_workbook_leeward_Cp_table_equals_engine():
    # Both copies typed from ASCE 7-16 Fig. 27.3-1 (from memory).
    t = reference_tables()["Wind_Cp_leeward"]
    assert tuple(t["rows"]) == wind.LEEWARD_L_OVER_B
    assert tuple(v[0] for v in t["values"]) == wind.LEEWARD_CP


# --- Combos: the method switch is live ------------------------------------------------------


def test_switching_to_LRFD_changes_every_factor(demo, tmp_path):
    # ASCE 7-16 §2.3.1 comb. 4-5, §2.3.6 comb. 6-7, §12.4.3 (from memory); SDPWS-2015 §4.3.3
    # phi_D = 0.80. Demo SDS = 2/3 x Fa x Ss = 2/3 x 1.2 x 1.12 = 0.896 g (Table 11.4-1, site C).
    values = _edit_and_recompute(demo, {"input.design_method": "LRFD"}, tmp_path)
    sds = 0.896
    expected = {
        "combo.Fac_W": 1.0,
        "combo.Fac_D_W": 0.9,
        "combo.Fac_E": 1.0,  # rho = 1.0 in the demo
        "combo.Fac_D_E": 0.9 - 0.2 * sds,
        "combo.Fac_D_E_add": 1.2 + 0.2 * sds,
        "combo.Fac_Em": 3.0,  # Omega0 of the demo system
        "combo.Cap_factor": 0.8,
    }
    for qid, value in expected.items():
        assert _value(demo, values, qid) == pytest.approx(value, rel=1e-9), qid
    assert _value(demo, values, "combo.wind_resisting").startswith("LRFD 0.9D + 1.0W")
    assert _value(demo, values, "combo.use.E_uplift.dead") == pytest.approx(0.9 - 0.2 * sds)


def test_asd_factors_in_the_built_workbook(demo):
    # ASCE 7-16 §2.4.1 comb. 5, 7 and §2.4.5 comb. 8, 10 (from memory), SDS = 0.896 g:
    # 0.6 - 0.14 x 0.896 = 0.47456; 0.7 Omega0 = 2.1; SDPWS-2015 §4.3.3 ASD: 1/2.0.
    r = demo.results
    assert r["combo.Fac_W"] == pytest.approx(0.6)
    assert r["combo.Fac_D_W"] == pytest.approx(0.6)
    assert r["combo.Fac_E"] == pytest.approx(0.7)
    assert r["combo.Fac_D_E"] == pytest.approx(0.47456, rel=1e-9)
    assert r["combo.Fac_Em"] == pytest.approx(2.1, rel=1e-9)
    assert r["combo.Cap_factor"] == pytest.approx(0.5)
    names = demo.registry.names
    for name in ("Fac_W", "Fac_D_W", "Fac_E", "Fac_D_E", "Fac_Em", "Cap_factor"):
        assert names[name] == f"combo.{name}"
