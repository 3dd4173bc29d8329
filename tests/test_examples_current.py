"""The committed example workbooks and schema are what the current code generates.

Builds are byte-identical for the same spec and version (fixed document timestamps), so
a plain byte comparison is the check. Fix a failure with scripts/regenerate_examples.py.
"""

from __future__ import annotations

import json
from pathlib import Path

import jsonschema
import pytest

from latbook.build import build_workbook
from latbook.spec.schema import SCHEMA_PATH, schema_text

ROOT = Path(__file__).resolve().parents[1]
SPECS = sorted((ROOT / "out_examples").glob("*/spec.json"))
HINT = "run `python scripts/regenerate_examples.py` and commit the result"


def test_schema_file_is_current():
    assert SCHEMA_PATH.read_text(encoding="utf-8") == schema_text(), HINT


@pytest.mark.parametrize("spec_path", SPECS, ids=lambda p: p.parent.name)
def test_example_validates_against_published_schema(spec_path):
    schema = json.loads(SCHEMA_PATH.read_text(encoding="utf-8"))
    jsonschema.validate(json.loads(spec_path.read_text(encoding="utf-8")), schema)


@pytest.mark.parametrize("spec_path", SPECS, ids=lambda p: p.parent.name)
def test_example_workbook_is_current(spec_path, tmp_path):
    committed = spec_path.with_name("calc.xlsx")
    assert committed.exists(), HINT
    fresh = tmp_path / "calc.xlsx"
    build_workbook(json.loads(spec_path.read_text(encoding="utf-8")), fresh)
    assert fresh.read_bytes() == committed.read_bytes(), HINT
