"""No false alarms: `verify` calls every fresh, unedited build of a valid spec intact, for
specs at the edges of what the schema allows (weights 1e-9 to 1e6 kip, floats with 17
significant digits, 1 to 12 levels, level ids equal to parts of sheet names). The input
limits of the workbook are the schema's own, and ties and near-zero values come out the
same in the engine and in the workbook's formulas.

References: xlsxwriter stores a number cell as `format(x, ".16G")` (its xmlwriter, read
from its source); the JSON Schema keywords `exclusiveMinimum`/`maximum` (JSON Schema
validation §6.2); tie rule and zero snap are the project's own (derived).
"""

from __future__ import annotations

import json
import math
import random
import tempfile
import zipfile
from pathlib import Path

import pytest
from hypothesis import HealthCheck, given, settings

from latbook.analysis.shear_walls import near_largest
from latbook.build import build_workbook
from latbook.engine import collector
from latbook.spec.json_data import stored_float
from latbook.spec.limits import field_limits
from latbook.spec.schema import schema_text
from latbook.verify import verify_workbook
from latbook.workbook.builder import layout
from tests.helpers.specgen import make_spec, specs
from tests.test_parity_generated import assert_parity

REPEATABLE = settings(
    derandomize=True,
    deadline=None,
    database=None,
    suppress_health_check=[HealthCheck.too_slow, HealthCheck.data_too_large],
)


def assert_intact(spec: dict, out: Path) -> None:
    build_workbook(spec, out)
    report = verify_workbook(out)
    assert report.intact, "\n".join(str(f) for f in report.findings[:10])


@settings(REPEATABLE, max_examples=12)
@given(spec=specs(max_levels=4, max_lines_per_dir=4, extreme=True))
def test_fresh_build_of_an_extreme_spec_verifies_intact(spec):
    with tempfile.TemporaryDirectory() as folder:
        assert_intact(spec, Path(folder) / "calc.xlsx")


def test_fresh_build_of_twelve_levels_verifies_intact(tmp_path):
    spec = make_spec(random.Random(12), 12, 2, seismic="direct", wind=True, extreme=True)
    assert_intact(spec, tmp_path / "calc.xlsx")


@pytest.mark.parametrize("weight_kip", [1e-9, 1e6])
def test_weights_at_the_schema_limits_verify_intact(weight_kip, tmp_path):
    spec = make_spec(random.Random(3), 2, 2, seismic="site_class", wind=True)
    for level in spec["building"]["levels"]:
        level.pop("weight_takeoff", None)  # a typed weight at the limit replaces any takeoff
        level["seismic_weight_kip"] = weight_kip
    assert_intact(spec, tmp_path / "calc.xlsx")


def test_17_digit_numbers_are_read_as_the_workbook_stores_them(tmp_path):
    spec = make_spec(random.Random(4), 1, 2, seismic="site_class", wind=True)
    typed = 0.1 + 0.2  # 0.30000000000000004: 17 significant digits
    spec["seismic"]["ground_motion"]["Ss_g"] = typed
    spec["building"]["levels"][0]["seismic_weight_kip"] = 123.45678901234567
    out = tmp_path / "calc.xlsx"
    result = build_workbook(spec, out)
    assert result.spec.seismic.ground_motion.Ss_g == stored_float(typed) == 0.3
    assert result.results["seismic.Ss"] == 0.3
    assert verify_workbook(out).intact


# --- one set of limits -------------------------------------------------------------------------


def _schema_bounds(schema: dict, path: str) -> tuple:
    """(minimum, exclusive, maximum) of a spec field in the JSON Schema."""
    defs = schema["$defs"]
    node = schema
    for part in path.replace("]", "").split("."):
        name = part.split("[")[0]
        node = node["properties"][name]
        while True:
            if "$ref" in node:
                node = defs[node["$ref"].split("/")[-1]]
            elif "items" in node:
                node = node["items"]
            elif "anyOf" in node:
                node = next(n for n in node["anyOf"] if n.get("type") != "null")
            elif "oneOf" in node:
                options = [defs[n["$ref"].split("/")[-1]] for n in node["oneOf"]]
                nxt = path.split(".")[path.split(".").index(part) + 1].split("[")[0]
                node = next(o for o in options if nxt in o.get("properties", {}))
            else:
                break
    if "exclusiveMinimum" in node:
        return node["exclusiveMinimum"], True, node.get("maximum")
    return node.get("minimum"), False, node.get("maximum")


def test_every_input_cell_takes_its_limits_from_the_schema():
    spec = make_spec(random.Random(9), 2, 3, seismic="site_class", wind=True)
    spec["seismic"]["T_computed_s"] = 0.4
    from latbook.spec.load import parse_spec

    _, registry = layout(parse_spec(spec))
    schema = json.loads(schema_text())
    checked = 0
    for entry in registry.inputs():
        limits = entry.limits
        assert limits == field_limits(entry.spec_path)
        if limits.choices is not None or limits.minimum is None:
            continue
        lo, exclusive, hi = _schema_bounds(schema, entry.spec_path)
        assert (limits.minimum, limits.min_exclusive, limits.maximum) == (lo, exclusive, hi)
        checked += 1
    assert checked >= 30


def test_data_validation_accepts_the_smallest_value_the_schema_accepts(tmp_path):
    """An exclusive minimum of 0 is written as a custom rule `>0`, not as `>= 0.001`."""
    spec = make_spec(random.Random(9), 1, 2, seismic="direct", wind=True)
    out = tmp_path / "calc.xlsx"
    build_workbook(spec, out)
    with zipfile.ZipFile(out) as archive:
        xml = "".join(
            archive.read(n).decode("utf-8")
            for n in archive.namelist()
            if n.startswith("xl/worksheets/sheet")
        )
    assert ">0.0,C" in xml.replace("&gt;", ">")  # e.g. AND(ISNUMBER(C9),C9>0.0,C9<=4.0)
    for stale in ("0.001<", "0.0001<", "<formula1>0.01<"):
        assert stale not in xml


# --- ties and near-zero values -------------------------------------------------------------


def test_values_one_rounding_step_apart_tie_and_the_first_governs():
    a = 1234.5678
    top, flags = near_largest([a, math.nextafter(a, math.inf), a / 2, "not given"])
    assert top == math.nextafter(a, math.inf)
    assert flags == [1, 1, 0, 0]
    assert near_largest(["not given"]) == (0.0, [0])


def test_collector_force_at_the_line_end_is_exactly_zero():
    """F(b) = R - R: rounding noise (up to ~1e-7 lb at R ~ 1e9 lb) is snapped to 0."""
    rng = random.Random(5)
    for _ in range(200):
        b = rng.uniform(10, 300)
        R = 10 ** rng.uniform(-6, 9)
        segs = [(0.1 * b, 0.3 * b), (0.55 * b, rng.uniform(0.05, 0.4) * b)]
        assert collector.collector_force_at_lb(b, R, segs, b) == 0.0
        assert collector.collector_force_at_lb(b, R, segs, 0.0) == 0.0


@pytest.mark.parametrize("weight_kip", [1e6, 3.3e5], ids=["1e6", "3.3e5"])
def test_workbook_formulas_equal_engine_at_extreme_weights(weight_kip, tmp_path):
    """Recomputed by the `formulas` package: collector forces near zero and governing labels
    agree with the engine (before: noise of ~1e-8 lb at F = 0 failed the comparison)."""
    seed = {1e6: 31, 3.3e5: 33}[weight_kip]
    spec = make_spec(random.Random(seed), 1, 2, extreme=True, seismic="site_class", wind=True)
    for level in spec["building"]["levels"]:
        level["seismic_weight_kip"] = weight_kip
    assert_parity(spec, tmp_path / "calc.xlsx")
