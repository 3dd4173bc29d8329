"""Shape checks on raw JSON data before validation: nesting depth, and numbers as the
workbook stores them.

xlsxwriter writes a number cell as `format(x, ".16G")`, so a float with 17 significant digits
is stored rounded to 16. The spec is read with every float already rounded that way, so the
engine, the layout, the embedded spec and the input cells all hold the same number.
"""

from __future__ import annotations

from typing import Any

MAX_DEPTH = 32
"""Deepest nesting of objects and arrays a spec may have (a valid spec nests 7 deep)."""

MAX_INT_DIGITS = 300
"""Longer JSON integers are read as floats (infinite past 1e308): no field takes them."""


def parse_int(text: str) -> int | float:
    """`json.loads(parse_int=...)`: Python refuses to convert integers over 4300 digits;
    a long one becomes a float, reported later as out of range or not finite."""
    if len(text.lstrip("-")) > MAX_INT_DIGITS:
        return float(text)
    return int(text)


def nesting_depth(data: Any, limit: int = MAX_DEPTH) -> int:
    """Depth of nested objects and arrays (a scalar is 0), counted up to `limit + 1`
    without recursion, so any depth is measured safely."""
    deepest = 0
    stack: list[tuple[Any, int]] = [(data, 0)]
    while stack:
        node, depth = stack.pop()
        if isinstance(node, dict | list):
            depth += 1
            deepest = max(deepest, depth)
            if depth > limit:
                return depth
            children = node.values() if isinstance(node, dict) else node
            stack.extend((child, depth) for child in children)
    return deepest


def stored_float(x: float) -> float:
    """`x` as a workbook number cell stores it (16 significant digits)."""
    return float(format(x, ".16G"))


def as_stored(data: Any) -> Any:
    """A copy of JSON data with every float rounded as the workbook stores it (call after
    `nesting_depth` has bounded the depth)."""
    if isinstance(data, float):
        return stored_float(data)
    if isinstance(data, dict):
        return {key: as_stored(value) for key, value in data.items()}
    if isinstance(data, list):
        return [as_stored(value) for value in data]
    return data
