"""The one call that turns a spec into a workbook: validate, compute, write."""

from __future__ import annotations

import hashlib
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from latbook.analysis import compute_results
from latbook.spec.load import parse_spec
from latbook.spec.models import Spec
from latbook.workbook.builder import canonical_json, write_workbook
from latbook.workbook.registry import Registry


@dataclass(frozen=True)
class BuildResult:
    spec: Spec
    results: dict[str, Any]
    registry: Registry
    spec_sha256: str
    path: Path


def spec_digest(data: Any) -> tuple[str, str]:
    """(canonical JSON, its SHA-256 hex digest) of the raw spec data."""
    text = canonical_json(data)
    return text, hashlib.sha256(text.encode("utf-8")).hexdigest()


def build_workbook(data: dict[str, Any], out: Path, *, protect: bool = True) -> BuildResult:
    """Validate `data` (raises SpecError), run the engine, write the workbook to `out`."""
    spec = parse_spec(data)
    results = compute_results(spec)
    text, digest = spec_digest(data)
    registry = write_workbook(
        spec, results, Path(out), spec_json=text, spec_sha256=digest, protect=protect
    )
    return BuildResult(spec, results, registry, digest, Path(out))
