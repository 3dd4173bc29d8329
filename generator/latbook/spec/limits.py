"""The allowed range or values of every spec field, read from the spec models.

One source of limits: the JSON Schema, the workbook's data validation and `verify`'s input
check all come from the pydantic field definitions in `latbook.spec.models`.
"""

from __future__ import annotations

import re
import types
import typing
from dataclasses import dataclass
from functools import cache
from typing import Any, Literal

import annotated_types
from pydantic import BaseModel

from latbook.spec.models import Spec


@dataclass(frozen=True)
class FieldLimits:
    """A field's allowed numbers (bounds, each inclusive or not) or its allowed values."""

    minimum: float | None = None
    maximum: float | None = None
    min_exclusive: bool = False
    max_exclusive: bool = False
    choices: tuple[Any, ...] | None = None

    def allows(self, value: Any) -> bool:
        """True when `value` is one of the choices, or a number within the bounds."""
        if self.choices is not None:
            return any(_same_choice(c, value) for c in self.choices)
        if isinstance(value, bool) or not isinstance(value, int | float):
            return self.minimum is None and self.maximum is None
        low_ok = self.minimum is None or (
            value > self.minimum if self.min_exclusive else value >= self.minimum
        )
        high_ok = self.maximum is None or (
            value < self.maximum if self.max_exclusive else value <= self.maximum
        )
        return low_ok and high_ok

    def describe(self) -> str:
        """'more than 0 and at most 400', 'one of: ASD, LRFD'."""
        if self.choices is not None:
            return "one of: " + ", ".join(str(c) for c in self.choices)
        parts = []
        if self.minimum is not None:
            word = "more than" if self.min_exclusive else "at least"
            parts.append(f"{word} {self.minimum:g}")
        if self.maximum is not None:
            word = "less than" if self.max_exclusive else "at most"
            parts.append(f"{word} {self.maximum:g}")
        return " and ".join(parts) or "any value"


def _same_choice(choice: Any, value: Any) -> bool:
    if isinstance(choice, bool) or isinstance(value, bool):
        return choice is value
    if isinstance(choice, int | float) and isinstance(value, int | float):
        return float(choice) == float(value)
    return str(choice) == str(value)


_INDEX = re.compile(r"\[\d+\]")


def field_limits(spec_path: str) -> FieldLimits:
    """Limits of the field at a dotted spec path such as `building.levels[2].elevation_ft`."""
    return _limits_of(_INDEX.sub("", spec_path))


@cache
def _limits_of(bare_path: str) -> FieldLimits:
    models: list[type[BaseModel]] = [Spec]
    parts = bare_path.split(".")
    for i, name in enumerate(parts):
        found = [m.model_fields[name] for m in models if name in m.model_fields]
        if not found:
            raise KeyError(f"no spec field at {bare_path!r}")
        info = found[0]
        leaves = list(_leaf_types(info.annotation))
        if i < len(parts) - 1:
            models = [t for t, _ in leaves if isinstance(t, type) and issubclass(t, BaseModel)]
            continue
        constraints = list(info.metadata) + [c for _, meta in leaves for c in meta]
        return _limits(leaves, constraints)
    raise KeyError(bare_path)


def _leaf_types(annotation: Any, meta: tuple = ()) -> typing.Iterator[tuple[Any, tuple]]:
    """(type, metadata) of each alternative of an annotation: unions, lists and Annotated
    unwrapped; None left out."""
    origin = typing.get_origin(annotation)
    if origin is typing.Annotated:
        base, *extra = typing.get_args(annotation)
        yield from _leaf_types(base, meta + tuple(extra))
    elif origin in (typing.Union, types.UnionType):
        for arg in typing.get_args(annotation):
            yield from _leaf_types(arg, meta)
    elif origin is list:
        yield from _leaf_types(typing.get_args(annotation)[0], meta)
    elif annotation is not type(None):
        yield annotation, meta


def _flatten(constraints: list[Any]) -> typing.Iterator[Any]:
    for c in constraints:
        inner = getattr(c, "metadata", None)  # a FieldInfo inside Annotated
        if isinstance(inner, list):
            yield from _flatten(inner)
        else:
            yield c


def _limits(leaves: list[tuple[Any, tuple]], constraints: list[Any]) -> FieldLimits:
    kinds = [t for t, _ in leaves]
    if any(typing.get_origin(t) is Literal for t in kinds):
        values = tuple(v for t in kinds if typing.get_origin(t) is Literal for v in t.__args__)
        return FieldLimits(choices=values)
    if kinds == [bool]:
        return FieldLimits(choices=(True, False))
    lo = hi = None
    lo_x = hi_x = False
    for c in _flatten(constraints):
        if isinstance(c, annotated_types.Gt):
            lo, lo_x = float(c.gt), True
        elif isinstance(c, annotated_types.Ge):
            lo, lo_x = float(c.ge), False
        elif isinstance(c, annotated_types.Lt):
            hi, hi_x = float(c.lt), True
        elif isinstance(c, annotated_types.Le):
            hi, hi_x = float(c.le), False
    if not any(t in (int, float) for t in kinds):
        return FieldLimits()
    return FieldLimits(lo, hi, lo_x, hi_x)
