"""Rebuild every out_examples/<name>/calc.xlsx from its spec.json (and the schema file).

Run after changing templates, the engine or the models:  python scripts/regenerate_examples.py
tests/test_examples_current.py fails until this has been run and the files committed.
"""

from __future__ import annotations

import json
from pathlib import Path

from latbook.build import build_workbook
from latbook.spec.schema import SCHEMA_PATH, schema_text

ROOT = Path(__file__).resolve().parents[1]
EXAMPLE_WORKBOOK = "calc.xlsx"


def main() -> None:
    SCHEMA_PATH.write_text(schema_text(), encoding="utf-8")
    print(f"wrote {SCHEMA_PATH.relative_to(ROOT)}")
    for spec_path in sorted((ROOT / "out_examples").glob("*/spec.json")):
        out = spec_path.with_name(EXAMPLE_WORKBOOK)
        build_workbook(json.loads(spec_path.read_text(encoding="utf-8")), out)
        print(f"wrote {out.relative_to(ROOT)}")


if __name__ == "__main__":
    main()
