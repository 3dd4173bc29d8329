"""The one call that turns a spec into a workbook: validate, compute, write."""

from __future__ import annotations

import hashlib
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from latbook.analysis import compute_results
from latbook.problems import Problem, SpecError
from latbook.spec.load import parse_spec, stored_spec_data
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


def check_spec(data: Any) -> tuple[Spec, dict[str, Any]]:
    """Validate `data` and run the engine: every check `validate`, `results` and `build`
    share. Raise SpecError; a case the engine refuses although every spec rule holds is a
    problem at `$` (a last resort: each such case should become a spec rule)."""
    spec = parse_spec(data)
    try:
        return spec, compute_results(spec)
    except (ArithmeticError, ValueError) as exc:  # CodeLimitError is a ValueError
        raise SpecError([Problem("$", "engine", f"the engine cannot compute: {exc}")]) from None


def build_workbook(data: dict[str, Any], out: Path, *, protect: bool = True) -> BuildResult:
    """Validate `data` (raises SpecError), run the engine, write the workbook to `out`.
    Floats are taken as the workbook stores them (see `latbook.spec.json_data`)."""
    data = stored_spec_data(data)
    spec, results = check_spec(data)
    text, digest = spec_digest(data)
    registry = write_workbook(
        spec, results, Path(out), spec_json=text, spec_sha256=digest, protect=protect
    )
    return BuildResult(spec, results, registry, digest, Path(out))
