"""Parity on generated buildings: engine == workbook recomputed by `formulas` == cached values.

The reference for the recomputation is the general-purpose `formulas` package (an Excel
formula engine independent of latbook). Specs come from tests/helpers/specgen.py. The
`formulas` evaluator costs a few ms per formula cell, so the recomputed buildings stay
small; larger random buildings are only built (every size the spec allows must build).
Hypothesis runs derandomized so CI sees the same examples every time.
"""

from __future__ import annotations

import random
import tempfile
from pathlib import Path

import pytest
from hypothesis import HealthCheck, given, settings

from latbook.analysis import compute_results
from latbook.build import build_workbook
from latbook.engine.asce7_16 import elf
from latbook.spec.load import parse_spec
from latbook.workbook.builder import layout
from tests.helpers.evaluator import evaluate_workbook
from tests.helpers.parity import cached_values, compare, formula_errors
from tests.helpers.specgen import make_spec, specs

REPEATABLE = settings(
    derandomize=True,
    deadline=None,
    database=None,
    suppress_health_check=[HealthCheck.too_slow, HealthCheck.data_too_large],
)

# (seed, levels, lines per direction, seismic, wind, design method): both methods, both
# ground-motion inputs, wind on and off, wind alone, one level, two and three. One level with two
# lines each way is already ~500-800 formula cells (~20 ms each to recompute).
FIXED_CASES = [
    (11, 1, 2, "site_class", False, "ASD"),
    (12, 1, 2, "direct", True, "LRFD"),
    (13, 1, 2, None, True, "ASD"),
    (14, 2, 2, "site_class", True, "LRFD"),
    # three stories: the torsional wind cases apply (App. D); partially open; overhangs above
    (56, 3, 2, "site_class", True, "ASD"),
]


def fixed_spec(case_id: str) -> dict:
    """The spec of a FIXED_CASES entry by its test id ("seed12-1lv-2ln")."""
    for seed, n_levels, n_lines, seismic, wind, method in FIXED_CASES:
        if f"seed{seed}-{n_levels}lv-{n_lines}ln" == case_id:
            return make_spec(
                random.Random(seed),
                n_levels,
                n_lines,
                seismic=seismic,
                wind=wind,
                design_method=method,
            )
    raise KeyError(case_id)


def assert_parity(spec: dict, out: Path) -> None:
    """Build `spec` to `out`, recompute it, and check all three agree with no error value."""
    result = build_workbook(spec, out)
    recomputed = evaluate_workbook(out)
    assert formula_errors(recomputed) == []
    mismatches = compare(result.registry, result.results, recomputed)
    assert not mismatches, "\n".join(map(str, mismatches[:20]))
    mismatches = compare(result.registry, result.results, cached_values(out))
    assert not mismatches, "cached: " + "\n".join(map(str, mismatches[:20]))


@pytest.mark.parametrize(
    ("seed", "n_levels", "n_lines", "seismic", "wind", "method"),
    FIXED_CASES,
    ids=[f"seed{c[0]}-{c[1]}lv-{c[2]}ln" for c in FIXED_CASES],
)
def test_fixed_generated_building_parity(seed, n_levels, n_lines, seismic, wind, method, tmp_path):
    spec = fixed_spec(f"seed{seed}-{n_levels}lv-{n_lines}ln")
    assert (len(spec["building"]["levels"]), spec["design_method"]) == (n_levels, method)
    assert_parity(spec, tmp_path / "calc.xlsx")


# Seismic basis cases (ASCE 7-16 §11.4.8, §12.7.2, §12.3.4, §12.8.1.3): site classes A to E with
# S1 on both sides of 0.2 g and 0.6 g, takeoff and typed weights mixed, rho both ways.
SITE = "site_class"
BASIS_CASES = {
    "siteD-S1-0.6-takeoff-removal": dict(
        seed=21,
        n_levels=1,
        site={"site_class": "D", "Ss_g": 1.5, "S1_g": 0.6},
        rho_method="removal_test",
        takeoff="all",
        design_method="LRFD",
    ),
    "siteE-S1-0.3-mixed-perimeter": dict(
        seed=22,
        n_levels=2,
        site={"site_class": "E", "Ss_g": 1.2, "S1_g": 0.3},
        rho_method="perimeter_bays",
        takeoff="some",
        design_method="ASD",
        declare_H3=True,  # plan irregular: rho = 1.3 by (b), collectors +25 % (§12.3.3.4)
    ),
    "siteB-unmeasured-S1-0.1-typed": dict(
        seed=23,
        n_levels=1,
        site={"site_class": "B", "Ss_g": 0.4, "S1_g": 0.1, "site_class_basis": "B_unmeasured_vs"},
        rho_method="typed",
        takeoff="none",
        design_method="ASD",
    ),
    "siteA-S1-0.7-Ss-limit": dict(
        seed=24,
        n_levels=1,
        site={"site_class": "A", "Ss_g": 2.2, "S1_g": 0.7},
        rho_method="typed",
        takeoff="all",
        limit_Ss_for_Cs=True,
        design_method="LRFD",
    ),
    # Ts = SD1/SDS = 0.29/2.0 = 0.15 s, so T > 1.5 Ts: exception 2 takes 1.5 x Eq. 12.8-3
    "siteD-default-S1-0.2-exc2-long": dict(
        seed=25,
        n_levels=2,
        site={"site_class": "D", "Ss_g": 3.0, "S1_g": 0.2, "site_class_basis": "default_D"},
        rho_method="removal_test",
        takeoff="some",
        design_method="LRFD",
        T_computed_s=0.5,
    ),
}
EXPECTED_BRANCH = {
    "siteD-S1-0.6-takeoff-removal": elf.EXC2_SHORT,
    "siteD-default-S1-0.2-exc2-long": elf.EXC2_MID,
}


def basis_spec(case: str) -> dict:
    opts = dict(BASIS_CASES[case])
    seed, n_levels = opts.pop("seed"), opts.pop("n_levels")
    t_computed = opts.pop("T_computed_s", None)
    declare_h3 = opts.pop("declare_H3", False)
    spec = make_spec(random.Random(seed), n_levels, 2, seismic=SITE, wind=False, **opts)
    for key, value in opts["site"].items():
        assert spec["seismic"]["ground_motion"][key] == value  # not changed by the generator
    if declare_h3:
        spec["seismic"]["declared_irregularities"] = {"diaphragm_discontinuity_3": True}
        spec["seismic"]["collector_light_frame_exception"] = True
    if t_computed is not None:
        spec["seismic"]["T_computed_s"] = t_computed
        spec["seismic"]["structure_type"] = "all_other"
    return spec


@pytest.mark.parametrize("case", list(BASIS_CASES))
def test_seismic_basis_generated_parity(case, tmp_path):
    spec = basis_spec(case)
    assert_parity(spec, tmp_path / "calc.xlsx")
    results = compute_results(parse_spec(spec))
    expected_basis = {"typed": "typed", "removal_test": "(a)", "perimeter_bays": "(b)"}
    method = spec["seismic"].get("rho_method", "typed")
    assert results["seismic.rho_basis"].startswith(expected_basis[method])
    if BASIS_CASES[case].get("declare_H3"):
        assert results["seismic.SDC"] in ("D", "E", "F")
        assert results["seismic.rho"] == 1.3 and results["irr.collector_factor"] == 1.25
    if case in EXPECTED_BRANCH:
        assert results["seismic.Cs_exc2_branch"] == EXPECTED_BRANCH[case]
    if spec["seismic"].get("limit_Ss_for_Cs"):
        Ss = spec["seismic"]["ground_motion"]["Ss_g"]
        assert results["seismic.Ss_Cs"] == min(Ss, 1.5) and results["seismic.cap_ok"] == "yes"


def test_longest_ids_parity(tmp_path):
    """12-character ids with '-' and '_' name sheets that formulas must quote."""
    spec = make_spec(random.Random(16), 1, 2, seismic="direct", wind=True, long_ids=True)
    assert any("-" in lv["id"] for lv in spec["building"]["levels"])
    assert_parity(spec, tmp_path / "calc.xlsx")


@settings(REPEATABLE, max_examples=2)
@given(spec=specs(max_levels=2, max_lines_per_dir=2))
def test_random_small_building_parity(spec):
    with tempfile.TemporaryDirectory() as folder:
        assert_parity(spec, Path(folder) / "calc.xlsx")


@settings(REPEATABLE, max_examples=200)
@given(spec=specs(long_ids=None))
def test_generated_specs_are_valid(spec):
    parse_spec(spec)  # raises SpecError listing every problem


@settings(REPEATABLE, max_examples=4)
@given(spec=specs(max_levels=4, max_lines_per_dir=5, long_ids=None))
def test_random_building_builds(spec):
    with tempfile.TemporaryDirectory() as folder:
        result = build_workbook(spec, Path(folder) / "calc.xlsx")
        assert result.path.stat().st_size > 0
        assert len(result.registry.calcs()) > 0


@settings(REPEATABLE, max_examples=6)
@given(spec=specs(long_ids=None))
def test_random_building_of_any_allowed_size_lays_out_with_every_value(spec):
    """Up to 12 levels and 30 lines each way (writing the largest takes ~25 s: see
    benchmarks/bench.py); the layout must find an engine value for every formula cell."""
    parsed = parse_spec(spec)
    results = compute_results(parsed)
    _, registry = layout(parsed)
    missing = [e.id for e in registry.calcs() if e.id not in results]
    assert missing == []
    assert len(registry.calcs()) > 0


def test_generator_is_repeatable_for_a_seed():
    assert make_spec(random.Random(5), 3, 4) == make_spec(random.Random(5), 3, 4)
    assert make_spec(random.Random(5), 3, 4) != make_spec(random.Random(6), 3, 4)
