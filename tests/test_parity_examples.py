"""Parity: for every example spec, engine == workbook recomputed by `formulas` == cached
values in the file. This is the contract between the engine and the workbook."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from latbook.build import build_workbook
from tests.helpers.evaluator import evaluate_workbook
from tests.helpers.parity import cached_values, compare, formula_errors

EXAMPLES = sorted(Path(__file__).resolve().parents[1].glob("out_examples/*/spec.json"))


@pytest.fixture(scope="module", params=EXAMPLES, ids=lambda p: p.parent.name)
def built(request, tmp_path_factory):
    out = tmp_path_factory.mktemp("parity") / "calc.xlsx"
    result = build_workbook(json.loads(request.param.read_text()), out)
    return result, evaluate_workbook(out)


def test_examples_exist():
    assert EXAMPLES, "out_examples/ holds no example spec"


def test_recomputed_workbook_equals_engine(built):
    result, values = built
    mismatches = compare(result.registry, result.results, values)
    assert not mismatches, "\n".join(map(str, mismatches[:20]))


def test_recomputed_workbook_has_no_error_values(built):
    _, values = built
    assert formula_errors(values) == []


def test_cached_values_equal_engine(built):
    result, _ = built
    mismatches = compare(result.registry, result.results, cached_values(result.path))
    assert not mismatches, "\n".join(map(str, mismatches[:20]))
