"""The published JSON Schema of the spec, exported from the pydantic models."""

from __future__ import annotations

import json
from pathlib import Path
from typing import Any

from latbook.spec.models import Spec

SCHEMA_ID = "https://latbook.invalid/schemas/latbook-spec.schema.json"
SCHEMA_PATH = Path(__file__).resolve().parents[3] / "schemas" / "latbook-spec.schema.json"


def spec_schema() -> dict[str, Any]:
    """The JSON Schema (draft 2020-12) a spec must satisfy."""
    schema = Spec.model_json_schema(by_alias=True, mode="validation")
    return {
        "$schema": "https://json-schema.org/draft/2020-12/schema",
        "$id": SCHEMA_ID,
        **schema,
    }


def schema_text() -> str:
    return json.dumps(spec_schema(), indent=2, sort_keys=False) + "\n"
