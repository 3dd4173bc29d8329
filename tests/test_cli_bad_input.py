"""Bad input is refused with a message naming the JSON path and the rule, exit code 2,
and no output written (an existing output left byte-for-byte untouched)."""

from __future__ import annotations

import copy
import json
import subprocess
import sys
from pathlib import Path

import pytest

from latbook.cli import main

DEMO = Path(__file__).resolve().parents[1] / "out_examples" / "maple_terrace" / "spec.json"
SENTINEL = b"previous workbook bytes"


def demo() -> dict:
    return json.loads(DEMO.read_text(encoding="utf-8"))


def _set(data: dict, path: str, value) -> dict:
    data = copy.deepcopy(data)
    node = data
    parts = path.split(".")
    for part in parts[:-1]:
        node = node[int(part)] if isinstance(node, list) else node[part]
    last = parts[-1]
    if value is _DELETE:
        del node[last]
    elif isinstance(node, list):
        node[int(last)] = value
    else:
        node[last] = value
    return data


_DELETE = object()

CASES = [
    # (mutation path, new value, expected JSON path in the message, expected rule)
    ("building.levels.0.elevation_ft", -3.0, "$.building.levels[0].elevation_ft", "greater_than"),
    ("building.levels.0.elevation_ft", 0.0, "$.building.levels[0].elevation_ft", "greater_than"),
    ("building.levels.1.elevation_ft", 5.0, "$.building.levels[1].elevation_ft", "elevation_order"),
    (
        "building.levels.0.seismic_weight_kip",
        "heavy",
        "$.building.levels[0].seismic_weight_kip",
        "float_type",
    ),
    (
        "seismic.ground_motion.site_class",
        "Q",
        "$.seismic.ground_motion.site_class",
        "literal_error",
    ),
    ("design_method", "WSD", "$.design_method", "literal_error"),
    ("seismic.system.R", 0.5, "$.seismic.system.R", "greater_than_equal"),
    ("seismic.rho", 1.1, "$.seismic.rho", "literal_error"),
    ("project.name", _DELETE, "$.project.name", "missing"),
    ("building.levels.0.colour", "red", "$.building.levels[0].colour", "extra_forbidden"),
    # a case choice the building does not allow: the demo has 3 stories (App. D, D1.1)
    ("wind.torsional_load_cases", "cases_1_and_3", "$.wind.torsional_load_cases", "appendix_d"),
    (
        "wall_lines.0.stories.0.segments.0.roof_bearing_width_ft",
        -5.0,
        "$.wall_lines[0].stories[0].segments[0].roof_bearing_width_ft",
        "greater_than_equal",
    ),
    ("wind.enclosure", "open", "$.wind.enclosure", "literal_error"),
    ("wind.roof_slope_deg", 20.0, "$.wind.roof_slope_deg", "less_than_equal"),
    # a rated hold-down elongation is scaled from its rated load (SDPWS-2015 Eq. 4.3-1 Δa)
    (
        "wall_lines.0.stories.0.segments.0.hold_down_rated_load_lb",
        _DELETE,  # the demo gives the elongation: without its load it cannot be scaled
        "$.wall_lines[0].stories[0].segments[0].hold_down_rated_load_lb",
        "rated_load",
    ),
    # a sheathed wall taller than its story (the demo's stories are 10.5 ft)
    (
        "wall_lines.0.stories.0.segments.0.height_ft",
        11.0,
        "$.wall_lines[0].stories[0].segments[0].height_ft",
        "wall_height",
    ),
    (
        "building.levels.0.wall_height_ft",
        12.0,
        "$.building.levels[0].wall_height_ft",
        "wall_height",
    ),
    (
        "assemblies.shear_walls.0.sheathing",
        "cardboard",
        "$.assemblies.shear_walls[0].sheathing",
        "literal_error",
    ),
    (
        "drift.wind_serviceability_factor",
        0.1,
        "$.drift.wind_serviceability_factor",
        "greater_than_equal",
    ),
    # the Cover's revision block and mark (limits: latbook's own, common practice)
    ("project.preliminary", "yes", "$.project.preliminary", "bool_type"),
    (
        "project.revisions",
        [{"revision": "A", "description": "x" * 201}],
        "$.project.revisions[0].description",
        "string_too_long",
    ),
    ("project.revisions", [{"date": "2026-12-02"}], "$.project.revisions[0].revision", "missing"),
    (
        "project.revisions",
        [{"revision": "A"}, {"revision": "a"}],
        "$.project.revisions[1].revision",
        "unique",
    ),
    # the demo gives revision "A": the last listed revision must be that one
    ("project.revisions", [{"revision": "1"}], "$.project.revision", "consistent"),
    ("project.revisions", [{"revision": "A"}] * 21, "$.project.revisions", "too_long"),
]


def run_build(spec_data, tmp_path: Path, capsys) -> tuple[int, str, Path]:
    spec = tmp_path / "spec.json"
    spec.write_text(json.dumps(spec_data), encoding="utf-8")
    out = tmp_path / "calc.xlsx"
    out.write_bytes(SENTINEL)
    code = main(["build", str(spec), "-o", str(out)])
    return code, capsys.readouterr().err, out


@pytest.mark.parametrize("path,value,where,rule", CASES)
def test_refused_with_path_and_rule(path, value, where, rule, tmp_path, capsys):
    code, err, out = run_build(_set(demo(), path, value), tmp_path, capsys)
    assert code == 2
    assert where in err
    assert f"[{rule}]" in err
    assert "Traceback" not in err
    assert out.read_bytes() == SENTINEL


def test_omega0_reduction_needs_omega0_of_2_5(tmp_path, capsys):
    # ASCE 7-16 Table 12.2-1 note g (from memory): only where the tabulated Ω0 is 2.5 or more
    data = _set(
        _set(demo(), "seismic.system.Omega0", 2.0),
        "seismic.omega0_flexible_diaphragm_reduction",
        True,
    )
    code, err, out = run_build(data, tmp_path, capsys)
    assert code == 2
    assert "$.seismic.omega0_flexible_diaphragm_reduction" in err
    assert "[table_12_2_1_note_g]" in err
    assert out.read_bytes() == SENTINEL


def test_site_specific_study_refused(tmp_path, capsys):
    # ASCE 7-16 §11.4.8: Site E with S1 >= 0.2 g needs a site-specific study unless T <= Ts
    # (exception 3, from memory). Derived: Ss 3.0 (Fa of Site C, 1.2, by exception 1) gives
    # SDS = 2.4 g; S1 = 0.2 (Fv 3.3) gives SD1 = 0.44 g; Ts = 0.18 s < Ta = 0.27 s.
    data = _set(demo(), "seismic.ground_motion.site_class", "E")
    data = _set(_set(data, "seismic.ground_motion.Ss_g", 3.0), "seismic.ground_motion.S1_g", 0.2)
    code, err, out = run_build(data, tmp_path, capsys)
    assert code == 2
    assert "$.seismic.ground_motion.S1_g" in err and "11.4.8" in err
    assert "[site_specific]" in err and "method = direct" in err
    assert out.read_bytes() == SENTINEL


def test_every_problem_listed_at_once(tmp_path, capsys):
    data = _set(_set(demo(), "design_method", "WSD"), "seismic.system.Cd", 99)
    code, err, _ = run_build(data, tmp_path, capsys)
    assert code == 2
    assert "$.design_method" in err and "$.seismic.system.Cd" in err


def test_bad_json_names_line(tmp_path, capsys):
    spec = tmp_path / "spec.json"
    spec.write_text('{"project": {"name": "x",}}', encoding="utf-8")
    out = tmp_path / "calc.xlsx"
    assert main(["build", str(spec), "-o", str(out)]) == 2
    err = capsys.readouterr().err
    assert "$: not valid JSON" in err and "line 1" in err
    assert not out.exists()


def test_missing_file(tmp_path, capsys):
    assert main(["validate", str(tmp_path / "nope.json")]) == 2
    assert "cannot read" in capsys.readouterr().err


def test_validate_ok_and_results_json(capsys):
    assert main(["validate", str(DEMO)]) == 0
    assert main(["results", str(DEMO), "--json"]) == 0
    out = capsys.readouterr().out
    results = json.loads(out[out.index("{") :])
    assert results["seismic.V"] == pytest.approx(results["seismic.Cs"] * results["seismic.W"])


def test_python_dash_m_and_schema(tmp_path):
    proc = subprocess.run(
        [sys.executable, "-m", "latbook", "schema"], capture_output=True, text=True, check=False
    )
    assert proc.returncode == 0
    assert json.loads(proc.stdout)["title"] == "Spec"


def test_build_prints_caution(tmp_path, capsys):
    out = tmp_path / "demo.xlsx"
    assert main(["build", str(DEMO), "-o", str(out)]) == 0
    assert "licensed engineer" in capsys.readouterr().out
    assert out.stat().st_size > 10_000
