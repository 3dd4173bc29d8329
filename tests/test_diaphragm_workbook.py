"""Diaphragm sheets on generated wall-line layouts: the workbook recomputed by the
general-purpose `formulas` package equals the engine, quantity by quantity.

Layouts (invented data, for tests only): 2 to 6 lines per direction, full and partial-length
walls, openings, segments touching each other and the line ends, cantilever overhangs at
either edge, both design methods, seismic and wind alone and together, the collector
light-frame exception on and off. Also checked on the built file: chord edges named
(tension on the edge the load pushes toward in a simple span, reversed in a cantilever,
common practice) and the chart objects present.
"""

from __future__ import annotations

import zipfile
from pathlib import Path
from typing import Any

import openpyxl
import pytest

from latbook.build import build_workbook
from tests.helpers.evaluator import evaluate_workbook
from tests.helpers.parity import compare, formula_errors

DIAPHRAGM_IDS = ("diaph.", "line.", "dassembly.", "segment.", "seismic.collector")


def _segments(prefix: str, walls: list[tuple[float, float]]) -> list[dict[str, Any]]:
    return [
        {"id": f"{prefix}{n}", "start_ft": s, "length_ft": L, "assembly": "SW1"}
        for n, (s, L) in enumerate(walls, 1)
    ]


def layout_spec(
    *,
    plan_ft: tuple[float, float],
    x_lines: list[tuple[float, list[tuple[float, float]]]],
    y_lines: list[tuple[float, list[tuple[float, float]]]],
    levels: int = 1,
    method: str = "ASD",
    seismic: bool = True,
    wind: bool = True,
    exception: bool = False,
    openings: bool = False,
) -> dict[str, Any]:
    """A building whose every level has the same plan and walls; lines (position, walls)."""
    x_len, y_len = plan_ft
    level_ids = [f"L{i + 2}" for i in range(levels - 1)] + ["RF"]
    lines = []
    for d, group in (("x", x_lines), ("y", y_lines)):
        for n, (pos, walls) in enumerate(group, 1):
            line_id = f"{d.upper()}{n}"
            stories = []
            for lv in level_ids:
                story: dict[str, Any] = {"level": lv, "segments": _segments(line_id, walls)}
                if openings and len(walls) > 1:
                    (s0, L0), (s1, _) = walls[0], walls[1]
                    gap = s1 - (s0 + L0)
                    if gap > 2:
                        story["openings"] = [{"start_ft": s0 + L0 + 1, "length_ft": gap - 2}]
                stories.append(story)
            lines.append({"id": line_id, "direction": d, "position_ft": pos, "stories": stories})
    spec: dict[str, Any] = {
        "project": {"name": "generated diaphragm layout (invented, test only)"},
        "design_method": method,
        "building": {
            "levels": [
                {
                    "id": lv,
                    "elevation_ft": 10.0 * (i + 1),
                    "seismic_weight_kip": 80.0 + 10 * i,
                    "plan": {"x_max_ft": x_len, "y_max_ft": y_len},
                    "diaphragm_assembly": "D1" if lv == "RF" else "D2",
                }
                for i, lv in enumerate(level_ids)
            ]
        },
        "assemblies": {
            "diaphragms": [
                {"id": "D1", "vs_nominal_plf": 425, "vw_nominal_plf": 595},
                {
                    "id": "D2",
                    "vs_nominal_plf": 640,
                    "vw_nominal_plf": 895,
                    "chord_capacity_lb": 9000,
                    "collector_capacity_lb": 6000,
                },
            ],
            "shear_walls": [
                {
                    "id": "SW1",
                    "vs_nominal_plf": 520,
                    "vw_nominal_plf": 730,
                    "Ga_seismic_kips_per_in": 13.0,
                    "end_post_A_in2": 16.5,
                    "hold_down_delta_in": 0.12,
                }
            ],
        },
        "wall_lines": lines,
    }
    if seismic:
        spec["seismic"] = {
            "ground_motion": {"method": "site_class", "Ss_g": 1.1, "S1_g": 0.4, "site_class": "C"},
            "system": {"label": "light-frame wood walls", "R": 6.5, "Cd": 4.0, "Omega0": 2.5},
            "collector_light_frame_exception": exception,
        }
    if wind:
        spec["wind"] = {
            "V_mph": 115,
            "exposure": "B",
            "mean_roof_height_ft": 10.0 * levels,
        }
    return spec


CASES = {
    # two full-length end walls each way, symmetric: each line takes half (common practice)
    "2x2-symmetric-ASD": dict(
        plan_ft=(40.0, 60.0),
        x_lines=[(0.0, [(0.0, 40.0)]), (60.0, [(0.0, 40.0)])],
        y_lines=[(0.0, [(0.0, 60.0)]), (40.0, [(0.0, 60.0)])],
    ),
    # partial walls with openings, overhangs at the start (y-lines) and the end (x-lines),
    # two levels, LRFD, seismic only with the light-frame exception
    "3x4-overhangs-LRFD-seismic": dict(
        plan_ft=(72.0, 50.0),
        x_lines=[
            (0.0, [(2.0, 14.0), (30.0, 12.0), (58.0, 14.0)]),
            (24.0, [(10.0, 8.0), (50.0, 8.0)]),
            (44.0, [(0.0, 20.0), (52.0, 20.0)]),
        ],
        y_lines=[
            (6.0, [(0.0, 12.0), (38.0, 12.0)]),
            (30.0, [(20.0, 10.0)]),
            (48.0, [(5.0, 40.0)]),
            (72.0, [(0.0, 50.0)]),
        ],
        levels=2,
        method="LRFD",
        wind=False,
        exception=True,
        openings=True,
    ),
    # six lines each way, touching segments, walls at the line ends, wind only
    "6x6-wind-only": dict(
        plan_ft=(100.0, 90.0),
        x_lines=[(y, [(0.0, 10.0), (10.0, 15.0), (60.0, 40.0)]) for y in (5, 20, 38, 52, 70, 84)],
        y_lines=[(x, [(0.0, 30.0), (45.0, 45.0)]) for x in (0, 18, 40, 61, 80, 100)],
        seismic=False,
    ),
    # four and five lines, seismic and wind, ASD, overstrength collectors
    "4x5-both-ASD": dict(
        plan_ft=(80.0, 64.0),
        x_lines=[
            (0.0, [(4.0, 30.0)]),
            (20.0, [(0.0, 12.0), (68.0, 12.0)]),
            (40.0, [(30.0, 20.0)]),
            (64.0, [(0.0, 80.0)]),
        ],
        y_lines=[
            (0.0, [(0.0, 64.0)]),
            (16.0, [(8.0, 8.0)]),
            (40.0, [(20.0, 24.0)]),
            (60.0, [(0.0, 10.0), (54.0, 10.0)]),
            (76.0, [(10.0, 44.0)]),
        ],
        openings=True,
    ),
}


@pytest.fixture(scope="module", params=sorted(CASES), ids=str)
def built(request, tmp_path_factory):
    out = tmp_path_factory.mktemp("dia") / "calc.xlsx"
    result = build_workbook(layout_spec(**CASES[request.param]), out)
    return request.param, result, evaluate_workbook(out)


def test_recomputed_diaphragm_quantities_equal_engine(built):
    _, result, values = built
    mismatches = [
        m
        for m in compare(result.registry, result.results, values)
        if m.qid.startswith(DIAPHRAGM_IDS)
    ]
    assert not mismatches, "\n".join(map(str, mismatches[:20]))
    assert formula_errors(values) == []


def test_every_level_and_direction_has_a_sheet_with_a_summary(built):
    name, result, _ = built
    spec = result.spec
    for level in spec.building.levels:
        for d in ("x", "y"):
            assert f"Dia_{level.id}_{d}" in {e.sheet for e in result.registry.entries.values()}
            assert isinstance(result.results[f"diaph.{level.id}.{d}.dcr_max"], float)
            collector = result.results[f"diaph.{level.id}.{d}.collector_max_lb"]
            if name == "2x2-symmetric-ASD":
                # statics: walls along the whole line need no collector
                assert collector == pytest.approx(0.0, abs=1e-6)
            else:
                assert collector > 100.0


def test_symmetric_end_walls_each_take_half(built):
    # Common practice: two identical end walls on a symmetric plan each take half.
    name, result, values = built
    if name != "2x2-symmetric-ASD":
        pytest.skip("symmetric layout only")
    Fx = result.results["seismic.level.RF.Fx"] * 1000
    W = result.results["wind.y.level.RF.F_level"] * 1000
    for line in ("X1", "X2"):
        entry = result.registry.entries[f"diaph.RF.x.line.{line}.R_seis"]
        got = values[(entry.sheet, entry.address.split("!")[1])]
        assert got == pytest.approx(Fx / 2, rel=1e-9)
    for line in ("Y1", "Y2"):
        assert result.results[f"diaph.RF.y.line.{line}.R_wind"] == pytest.approx(W / 2, rel=1e-9)


def test_chord_edges_are_named_and_charts_drawn(built):
    # Common practice: a simple span under load in +x has its tension chord on the x_max
    # edge (the side the load pushes toward), a cantilever the other way round.
    name, result, _ = built
    wb = openpyxl.load_workbook(result.path)
    level = result.spec.building.levels[-1].id
    for d in ("x", "y"):
        tpos = result.registry.tables[f"spans_{level}_{d}"]
        ws = wb[tpos.sheet]
        for key in tpos.rows:
            kind, tension, compression = (
                ws.cell(r + 1, c + 1).value
                for r, c in (tpos.cell(key, f) for f in ("kind", "T_edge", "C_edge"))
            )
            expected = (f"{d}_max edge", f"{d}_min edge")
            if kind == "cantilever":
                expected = expected[::-1]
            assert (tension, compression) == expected
    with zipfile.ZipFile(Path(result.path)) as z:
        charts = [z.read(n).decode() for n in z.namelist() if n.startswith("xl/charts/chart")]
    n_levels = len(result.spec.building.levels)
    assert sum("Diaphragm shear V" in c for c in charts) == 2 * n_levels
    assert sum("Diaphragm moment M" in c for c in charts) == 2 * n_levels
