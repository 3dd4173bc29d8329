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

from latbook.build import build_workbook
from latbook.spec.load import parse_spec
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
# ground-motion inputs, wind on and off, wind alone, one level and several.
FIXED_CASES = [
    (11, 1, 2, "site_class", False, "ASD"),
    (12, 3, 3, "direct", True, "LRFD"),
    (13, 2, 2, None, True, "ASD"),
    (14, 4, 4, "site_class", True, "LRFD"),
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


@settings(REPEATABLE, max_examples=4)
@given(spec=specs(max_levels=3, max_lines_per_dir=3))
def test_random_small_building_parity(spec):
    with tempfile.TemporaryDirectory() as folder:
        assert_parity(spec, Path(folder) / "calc.xlsx")


@settings(REPEATABLE, max_examples=200)
@given(spec=specs(long_ids=None))
def test_generated_specs_are_valid(spec):
    parse_spec(spec)  # raises SpecError listing every problem


@settings(REPEATABLE, max_examples=12)
@given(spec=specs(long_ids=None))
def test_random_building_of_any_allowed_size_builds(spec):
    with tempfile.TemporaryDirectory() as folder:
        result = build_workbook(spec, Path(folder) / "calc.xlsx")
        assert result.path.stat().st_size > 0
        assert len(result.registry.entries) > 0


def test_generator_is_repeatable_for_a_seed():
    assert make_spec(random.Random(5), 3, 4) == make_spec(random.Random(5), 3, 4)
    assert make_spec(random.Random(5), 3, 4) != make_spec(random.Random(6), 3, 4)
