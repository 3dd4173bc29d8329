"""Read a spec file into a validated `Spec`, turning every failure into `Problem`s."""

from __future__ import annotations

import json
from pathlib import Path
from typing import Any

from pydantic import ValidationError

from latbook.problems import Problem, SpecError, json_path
from latbook.spec.json_data import MAX_DEPTH, as_stored, nesting_depth, parse_int
from latbook.spec.models import Spec
from latbook.spec.rules import check_rules

# pydantic puts the tag of a discriminated union into the location; a JSON path has none.
_UNION_TAGS = {"ground_motion": {"site_class", "direct"}}


def load_spec(path: Path) -> Spec:
    """Load and validate the spec at `path`; raise `SpecError` listing every problem."""
    return parse_spec(load_json(path))


def load_json(path: Path) -> Any:
    """Read a JSON file; raise `SpecError` when it cannot be read or parsed."""
    try:
        text = Path(path).read_text(encoding="utf-8")
    except OSError as exc:
        raise SpecError([Problem("$", "file", f"cannot read {path}: {exc.strerror}")]) from None
    except UnicodeDecodeError:
        raise SpecError([Problem("$", "file", f"{path} is not UTF-8 text")]) from None
    try:
        data = json.loads(text, parse_int=parse_int)
    except json.JSONDecodeError as exc:
        problem = Problem("$", "json", f"not valid JSON: {exc.msg} at line {exc.lineno}")
        raise SpecError([problem]) from None
    except RecursionError:
        raise SpecError([_too_deep()]) from None
    except ValueError as exc:  # any other refusal of the JSON reader
        raise SpecError([Problem("$", "json", f"not valid JSON: {exc}")]) from None
    return data


def _too_deep() -> Problem:
    return Problem("$", "json", f"JSON nested more than {MAX_DEPTH} deep; not a latbook spec")


def stored_spec_data(data: Any) -> Any:
    """`data` with its depth checked and floats rounded as the workbook stores them;
    raise `SpecError` for data nested too deeply."""
    if nesting_depth(data) > MAX_DEPTH:
        raise SpecError([_too_deep()])
    return as_stored(data)


def parse_spec(data: Any) -> Spec:
    """Validate already-parsed JSON data; raise `SpecError` listing every problem.
    Floats are read as the workbook stores them (`latbook.spec.json_data`)."""
    data = stored_spec_data(data)
    if not isinstance(data, dict):
        raise SpecError([Problem("$", "type", "the spec must be a JSON object")])
    try:
        # strict: JSON types as written (no true -> 1.0, "10" -> 10.0, "yes" -> True)
        spec = Spec.model_validate(data, strict=True)
    except ValidationError as exc:
        raise SpecError([_problem_from_pydantic(err) for err in exc.errors()]) from None
    problems = check_rules(spec)
    if problems:
        raise SpecError(problems)
    return spec


def _problem_from_pydantic(err: dict[str, Any]) -> Problem:
    raw = list(err["loc"])
    loc = [
        part
        for i, part in enumerate(raw)
        if not (i and part in _UNION_TAGS.get(str(raw[i - 1]), ()))
    ]
    message = err["msg"].removeprefix("Value error, ")
    kind = err["type"]
    if kind == "extra_forbidden":
        message = "unknown field (check the spelling against the schema)"
    elif kind == "missing":
        message = "required field is missing"
    elif kind == "string_unicode":
        message = "text holds a lone surrogate (U+D800 to U+DFFF), not a character; remove it"
    elif kind == "finite_number":
        message = "not a finite number (NaN, Infinity, or too large to represent)"
    elif kind == "literal_error" and "ctx" in err:
        message = f"must be one of {err['ctx'].get('expected')}"
    return Problem(json_path(loc), kind, message)
