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
    spec = make_spec(
        random.Random(seed), n_levels, n_lines, seismic=seismic, wind=wind, design_method=method
    )
    assert_parity(spec, tmp_path / "calc.xlsx")


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
