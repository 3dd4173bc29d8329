"""The diaphragm analysis step (latbook.analysis.diaphragm) against published examples and
trade facts, fed the level forces directly so the numbers are the sources' own.

Sources:
- R. T. Malone and R. W. Rice, "The Analysis of Irregular Shaped Structures: Diaphragms and
  Shear Walls", McGraw-Hill/ICC (2012), Ch. 8, Fig. 8.7 basic shear diagram: w = 200 plf,
  100 ft span, 40 ft deep; R = 10,000 lb, v = 250 plf, V = -5,000 lb at 75 ft, 0 at midspan.
- American Wood Council, "ASD Manual for Engineered Wood Construction, 2001 Edition, Wood
  Structural Panel Shear Wall and Diaphragm Supplement", design example Step 8, p. SW-35:
  110 ft lines, diaphragm shear 280 plf; West line 45 ft wall / 20 ft opening / 45 ft wall
  (2,800 lb at the opening); East line 40 ft open then 70 ft of wall (11,200 lb at 40 ft).
- Common practice: two identical end walls on a symmetric plan each take half; chords carry
  T = C = M/b, tension on one edge and compression on the other.
- ASCE 7-16 §12.10.2.1 (from memory): collectors in SDC C-F take the overstrength forces;
  exception for structures braced entirely by light-frame shear walls.
"""

from __future__ import annotations

from typing import Any

import pytest

from latbook.analysis.diaphragm import diaphragm_results
from latbook.spec.load import parse_spec

FACTORS_ASD = {
    "combo.Fac_E_dia": 0.7,
    "combo.Fac_E": 0.7,
    "combo.Fac_Em": 0.7 * 2.5,
    "combo.Fac_W": 0.6,
    "combo.seismic_additive": "seismic comb.",
    "combo.seismic_additive_dia": "seismic comb., rho 1.0",
    "combo.overstrength_additive": "overstrength comb.",
    "combo.wind_additive": "wind comb.",
}


def _wall(seg_id: str, start_ft: float, length_ft: float) -> dict[str, Any]:
    return {"id": seg_id, "start_ft": start_ft, "length_ft": length_ft, "assembly": "SW"}


def _line(line_id, direction, position_ft, segments) -> dict[str, Any]:
    return {
        "id": line_id,
        "direction": direction,
        "position_ft": position_ft,
        "stories": [{"level": "RF", "segments": segments}],
    }


def one_level_spec(x_len_ft, y_len_ft, x_lines, y_lines, *, wind=True, exception=False):
    """A one-level building: lines as (id, position, [(start, length), ...])."""
    lines = [
        _line(i, d, pos, [_wall(f"{i}{n}", s, L) for n, (s, L) in enumerate(segs, 1)])
        for d, group in (("x", x_lines), ("y", y_lines))
        for i, pos, segs in group
    ]
    data = {
        "project": {"name": "diaphragm analysis test (invented)"},
        "design_method": "ASD",
        "building": {
            "levels": [
                {
                    "id": "RF",
                    "elevation_ft": 10.0,
                    "seismic_weight_kip": 100.0,
                    "plan": {"x_max_ft": x_len_ft, "y_max_ft": y_len_ft},
                    "diaphragm_assembly": "D1",
                }
            ]
        },
        "seismic": {
            "ground_motion": {"method": "direct", "SDS_g": 1.0, "SD1_g": 0.6, "S1_g": 0.5},
            "system": {"label": "light-frame walls", "R": 6.5, "Cd": 4.0, "Omega0": 2.5},
            "collector_light_frame_exception": exception,
        },
        "assemblies": {
            "diaphragms": [
                {
                    "id": "D1",
                    "vs_nominal_plf": 500.0,
                    "vw_nominal_plf": 700.0,
                    "chord_capacity_lb": 10_000.0,
                }
            ],
            "shear_walls": [
                {
                    "id": "SW",
                    "vs_nominal_plf": 500.0,
                    "vw_nominal_plf": 700.0,
                    "Ga_seismic_kips_per_in": 15.0,
                    "end_post_A_in2": 16.5,
                    "hold_down_delta_in": 0.1,
                }
            ],
        },
        "wall_lines": lines,
    }
    if wind:
        data["wind"] = {"V_mph": 110, "exposure": "C", "mean_roof_height_ft": 10.0}
    return parse_spec(data)


def run(
    spec,
    *,
    Fx_kip,
    Fpx_kip,
    Fpx_eq_kip=None,
    Fpx_min_kip=0.0,
    Fpx_max_kip=1.0e6,
    F_wind_kip=None,
    sdc="D",
    factors=FACTORS_ASD,
) -> dict[str, Any]:
    """diaphragm_results with the level forces given (the earlier steps' ids)."""
    out: dict[str, Any] = {"seismic.SDC": sdc, **factors}
    base = "seismic.level.RF"
    out[f"{base}.Fx"], out[f"{base}.Fpx"] = Fx_kip, Fpx_kip
    out[f"{base}.Fpx_eq"] = Fpx_kip if Fpx_eq_kip is None else Fpx_eq_kip
    out[f"{base}.Fpx_min"] = Fpx_min_kip
    out[f"{base}.Fpx_max"] = Fpx_max_kip  # large: Exception 2 of §12.10.2.1 does not cap
    for d in ("x", "y"):
        out[f"wind.{d}.level.RF.F_level"] = F_wind_kip if F_wind_kip is not None else Fx_kip
        out[f"wind.{d}.level.RF.F_min"] = 0.0  # the minimum case does not govern here
    diaphragm_results(spec, out)
    return out


# Malone & Rice Ch. 8: load in x spans 100 ft along y between x-lines at y = 0 and 100;
# depth b = 40 ft (plan x-length). w = Fpx / 100 ft = 200 plf -> Fpx = 20 kip.
MALONE = one_level_spec(
    40.0,
    100.0,
    x_lines=[("S", 0.0, [(0.0, 40.0)]), ("N", 100.0, [(0.0, 40.0)])],
    y_lines=[("W", 0.0, [(0.0, 100.0)]), ("E", 40.0, [(0.0, 100.0)])],
)


def test_malone_rice_ch8_reactions_and_unit_shear():
    out = run(MALONE, Fx_kip=20.0, Fpx_kip=20.0)
    assert out["diaph.RF.x.w_fpx_plf"] == pytest.approx(200.0, rel=1e-12)
    # Malone & Rice Ch. 8: R1 = R6 = wL/2 = 10,000 lb; v = 10,000 / 40 = 250 plf.
    for line in ("S", "N"):
        assert out[f"diaph.RF.x.line.{line}.R_seis_fpx"] == pytest.approx(10_000.0, rel=1e-9)
        assert out[f"diaph.RF.x.line.{line}.v_line_fpx_plf"] == pytest.approx(250.0, rel=1e-9)
    assert out["diaph.RF.x.span.1.v_fpx_plf"] == pytest.approx(250.0, rel=1e-9)
    # DCR = Fac_E_dia v / (vs / 2.0) = 0.7 x 250 / 250 (SDPWS-2015 §4.2.3 ASD reduction 2.0).
    assert out["diaph.RF.x.span.1.dcr_E"] == pytest.approx(0.7, rel=1e-9)


@pytest.mark.parametrize(("k", "shear_lb"), [(2, 0.0), (3, -5_000.0), (4, -10_000.0)])
def test_malone_rice_ch8_shear_diagram_points(k, shear_lb):
    # Malone & Rice Ch. 8: 0 lb at grid line 3 (50 ft), -5,000 lb at line 5 (75 ft),
    # -10,000 lb at line 6 (100 ft); the chart points are the span's quarter points.
    out = run(MALONE, Fx_kip=20.0, Fpx_kip=20.0)
    assert out[f"diaph.RF.x.diag.1.{k}.V_fpx_lb"] == pytest.approx(shear_lb, rel=1e-9, abs=1e-9)


def test_chord_force_is_moment_over_depth():
    # Common practice: T = C = M/b. Derived by hand: M = wL^2/8 = 200(100^2)/8 = 250,000 lb-ft;
    # T = 250,000 / 40 = 6,250 lb; design force 0.7 x 6,250 = 4,375 lb; DCR 4,375 / 10,000.
    out = run(MALONE, Fx_kip=20.0, Fpx_kip=20.0, F_wind_kip=0.001)
    assert out["diaph.RF.x.span.1.M_fpx_lbft"] == pytest.approx(250_000.0, rel=1e-9)
    assert out["diaph.RF.x.span.1.T_fpx_lb"] == pytest.approx(6_250.0, rel=1e-9)
    assert out["diaph.RF.x.chord_max_lb"] == pytest.approx(4_375.0, rel=1e-9)
    assert out["diaph.RF.x.chord_dcr_max"] == pytest.approx(0.4375, rel=1e-9)
    # chords from F_px take the rho = 1.0 combination (ASCE 7-16 §12.3.4.1), named as such
    assert out["diaph.RF.x.chord_source"] == "seismic comb., rho 1.0"


def test_symmetric_end_walls_each_take_half():
    # Common practice: two identical end walls on a symmetric plan each take half.
    out = run(MALONE, Fx_kip=37.0, Fpx_kip=41.0, F_wind_kip=23.0)
    for d, (a, b) in (("x", ("S", "N")), ("y", ("W", "E"))):
        for src, total in (("R_seis", 37_000.0), ("R_seis_fpx", 41_000.0), ("R_wind", 23_000.0)):
            ra, rb = out[f"diaph.RF.{d}.line.{a}.{src}"], out[f"diaph.RF.{d}.line.{b}.{src}"]
            assert ra == pytest.approx(total / 2, rel=1e-9)
            assert rb == pytest.approx(total / 2, rel=1e-9)


# AWC 2001 Supplement p. SW-35: 110 ft lines (plan x-length), load in x, diaphragm shear
# 280 plf at each line: R = 280 x 110 = 30,800 lb per line. LRFD factors 1.0 so the factored
# collector forces are the example's; F_wind = 2 x 30,800 lb over the two lines.
FACTORS_UNIT = {**FACTORS_ASD, "combo.Fac_W": 1.0, "combo.Fac_E": 1.0, "combo.Fac_E_dia": 1.0}
AWC = one_level_spec(
    110.0,
    60.0,
    x_lines=[("West", 0.0, [(0.0, 45.0), (65.0, 45.0)]), ("East", 60.0, [(40.0, 70.0)])],
    y_lines=[("A", 0.0, [(0.0, 60.0)]), ("B", 110.0, [(0.0, 60.0)])],
)


def test_awc_2001_drag_strut_forces():
    out = run(AWC, Fx_kip=1.0, Fpx_kip=1.0, F_wind_kip=61.6, factors=FACTORS_UNIT)
    base = "diaph.RF.x.line"
    assert out[f"{base}.West.v_line_wind_plf"] == pytest.approx(280.0, rel=1e-9)
    # East line: maximum drag force 280 x 40 = 11,200 lb at the wall's south end (40 ft).
    assert out[f"{base}.East.peak_W_lb"] == pytest.approx(11_200.0, rel=1e-9)
    assert out[f"{base}.East.peak_W_s_ft"] == pytest.approx(40.0, rel=1e-12)
    # West line: 2,800 lb at each end of the 20 ft opening (points: 0, 45, 65, 110).
    coll = "diaph.RF.x.coll.West"
    assert abs(out[f"{coll}.1.F_W_lb"]) == pytest.approx(2_800.0, rel=1e-9)
    assert abs(out[f"{coll}.2.F_W_lb"]) == pytest.approx(2_800.0, rel=1e-9)
    assert out[f"{base}.West.peak_W_lb"] == pytest.approx(2_800.0, rel=1e-9)
    assert out[f"{base}.West.peak_W_s_ft"] == pytest.approx(45.0, rel=1e-12)


def test_collector_overstrength_by_sdc_and_light_frame_exception():
    # ASCE 7-16 §12.10.2.1 (from memory): SDC C-F -> max(Omega0-level forces from Fx and
    # Eq. 12.10-1, standard combination with Eq. 12.10-2); the light-frame exception and
    # SDC A-B -> standard combination. One line takes half of each force (common practice).
    forces = {"Fx_kip": 20.0, "Fpx_kip": 30.0, "Fpx_eq_kip": 24.0, "Fpx_min_kip": 28.0}
    half = 500.0  # lb per kip of level force, to one of the two end lines
    with_omega = run(MALONE, sdc="D", **forces)
    assert with_omega["diaph.collector_overstrength"] == "yes"
    expected = max(1.75 * half * 24.0, 0.7 * half * 28.0)  # Fac_Em = 0.7 x 2.5
    assert with_omega["diaph.RF.x.line.S.R_coll_E"] == pytest.approx(expected, rel=1e-9)
    assert with_omega["diaph.RF.x.collector_source"] == "overstrength comb."

    low_sdc = run(MALONE, sdc="B", **forces)
    assert low_sdc["diaph.collector_overstrength"] == "no"
    assert low_sdc["diaph.RF.x.line.S.R_coll_E"] == pytest.approx(0.7 * half * 30.0, rel=1e-9)

    exc = one_level_spec(
        40.0,
        100.0,
        x_lines=[("S", 0.0, [(0.0, 40.0)]), ("N", 100.0, [(0.0, 40.0)])],
        y_lines=[("W", 0.0, [(0.0, 100.0)]), ("E", 40.0, [(0.0, 100.0)])],
        exception=True,
    )
    excepted = run(exc, sdc="D", **forces)
    assert excepted["diaph.collector_overstrength"] == "no"
    assert excepted["diaph.RF.x.line.S.R_coll_E"] == pytest.approx(0.7 * half * 30.0, rel=1e-9)


def test_cantilever_overhang_goes_to_the_last_line():
    # Statics (derived by hand): lines at y = 0 and 60 of a 80 ft plan, w = 100 plf:
    # simple span 60 ft -> 3,000 lb each; overhang 20 ft -> 2,000 lb more to the line at 60;
    # overhang moment wL^2/2 = 20,000 lb-ft; chord 20,000 / 40 = 500 lb, tension on x_min.
    # The diaphragm is continuous over line M (SDPWS-2015 §4.2.5.2 cantilever), so the
    # overhang moment moves 20,000 / 60 = 333.3 lb from line S to line M (was ignored before).
    spec = one_level_spec(
        40.0,
        80.0,
        x_lines=[("S", 0.0, [(0.0, 40.0)]), ("M", 60.0, [(5.0, 10.0), (25.0, 10.0)])],
        y_lines=[("W", 0.0, [(0.0, 80.0)]), ("E", 40.0, [(0.0, 80.0)])],
    )
    out = run(spec, Fx_kip=8.0, Fpx_kip=8.0)
    assert out["diaph.RF.x.line.S.R_seis"] == pytest.approx(3_000.0 - 20_000.0 / 60, rel=1e-9)
    assert out["diaph.RF.x.line.M.R_seis"] == pytest.approx(5_000.0 + 20_000.0 / 60, rel=1e-9)
    # span 1 with the hogging moment at M: zero shear at 30 - 333.3/100 = 26.67 ft
    xs = 30.0 - 20_000.0 / 60 / 100.0
    M_sag = 100.0 * (26.0 + 2.0 / 3.0) ** 2 / 2.0
    assert out["diaph.RF.x.span.1.xs_unit_ft"] == pytest.approx(xs, rel=1e-9)
    assert out["diaph.RF.x.span.1.M_fpx_lbft"] == pytest.approx(max(M_sag, 20_000.0), rel=1e-9)
    assert out["diaph.RF.x.span.2.M_fpx_lbft"] == pytest.approx(20_000.0, rel=1e-9)
    assert out["diaph.RF.x.span.2.T_fpx_lb"] == pytest.approx(500.0, rel=1e-9)
    assert out["diaph.RF.x.span.2.V_fpx_lb"] == pytest.approx(2_000.0, rel=1e-9)
