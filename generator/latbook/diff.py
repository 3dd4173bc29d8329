"""Compare two sides (specs or workbooks): inputs by spec JSON path, results by quantity id,
and the Summary's checks that crossed a demand/capacity ratio of 1.0.

Inputs are the validated specs with their defaults filled in, so a default written out
is no change. A result moved when |new - old| > max(rel_tol * max(|old|, |new|), abs_tol);
text and booleans when they differ. Ids present on one side only (levels, lines or segments
added or removed) are listed apart.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import Any

from latbook.diff_sides import Side
from latbook.problems import json_path

REL_TOL = 1e-6
ABS_TOL = 1e-9
DCR_LIMIT = 1.0  # a check fails when its DCR exceeds this (the Summary's rule)
_CHECK_PREFIX, _CHECK_SUFFIX = "summary.", ".dcr"


@dataclass(frozen=True)
class Change:
    """A value present on both sides (an input by path, a result by id) that differs."""

    key: str
    old: Any
    new: Any


@dataclass(frozen=True)
class CheckCrossing:
    """A Summary check whose DCR is above 1.0 on one side and not on the other."""

    check: str  # the Summary row key, e.g. wall.L2.seis
    element: str
    old_dcr: Any  # a number, or the text the Summary shows when no capacity is given
    new_dcr: Any
    old_status: str
    new_status: str

    @property
    def now_fails(self) -> bool:
        return fails(self.new_dcr)


@dataclass
class Diff:
    """Everything that differs between `old` and `new`."""

    old: Side
    new: Side
    rel_tol: float = REL_TOL
    abs_tol: float = ABS_TOL
    inputs_changed: list[Change] = field(default_factory=list)
    inputs_added: dict[str, Any] = field(default_factory=dict)  # path -> new value
    inputs_removed: dict[str, Any] = field(default_factory=dict)  # path -> old value
    checks_crossed: list[CheckCrossing] = field(default_factory=list)
    results_moved: list[Change] = field(default_factory=list)
    results_added: dict[str, Any] = field(default_factory=dict)
    results_removed: dict[str, Any] = field(default_factory=dict)

    @property
    def changed(self) -> bool:
        return any(
            (
                self.inputs_changed,
                self.inputs_added,
                self.inputs_removed,
                self.results_moved,
                self.results_added,
                self.results_removed,
            )
        )


def diff_sides(old: Side, new: Side, rel_tol: float = REL_TOL, abs_tol: float = ABS_TOL) -> Diff:
    """Compare `old` with `new`; results within the tolerances count as unchanged."""
    d = Diff(old, new, rel_tol, abs_tol)
    a, b = flatten(old.inputs), flatten(new.inputs)
    d.inputs_changed = [Change(p, a[p], b[p]) for p in a if p in b and not _same_input(a[p], b[p])]
    d.inputs_added = {p: b[p] for p in b if p not in a}
    d.inputs_removed = {p: a[p] for p in a if p not in b}
    r0, r1 = old.results, new.results
    d.results_moved = [
        Change(k, r0[k], r1[k])
        for k in sorted(r0)
        if k in r1 and moved(r0[k], r1[k], rel_tol, abs_tol)
    ]
    d.results_added = {k: r1[k] for k in sorted(r1) if k not in r0}
    d.results_removed = {k: r0[k] for k in sorted(r0) if k not in r1}
    d.checks_crossed = crossings(r0, r1)
    return d


def flatten(data: Any, path: tuple[str | int, ...] = ()) -> dict[str, Any]:
    """JSON path -> leaf value (an empty object or list is a leaf of its own)."""
    if isinstance(data, dict) and data:
        items = data.items()
    elif isinstance(data, list) and data:
        items = enumerate(data)
    else:
        return {json_path(path): data}
    out: dict[str, Any] = {}
    for key, value in items:
        out.update(flatten(value, (*path, key)))
    return out


def _same_input(old: Any, new: Any) -> bool:
    if isinstance(old, bool) or isinstance(new, bool):
        return old is new
    return old == new


def moved(old: Any, new: Any, rel_tol: float, abs_tol: float) -> bool:
    """Whether a result differs beyond the tolerances (text and booleans: at all)."""
    if _number(old) and _number(new):
        return abs(new - old) > max(rel_tol * max(abs(old), abs(new)), abs_tol)
    return not _same_input(old, new)


def _number(value: Any) -> bool:
    return isinstance(value, int | float) and not isinstance(value, bool) and math.isfinite(value)


def fails(dcr: Any) -> bool:
    """A check fails when its DCR is a number above 1.0 (text: no capacity was given)."""
    return _number(dcr) and dcr > DCR_LIMIT


def crossings(old: dict[str, Any], new: dict[str, Any]) -> list[CheckCrossing]:
    """The Summary checks on both sides whose DCR crossed 1.0, in id order."""
    out = []
    for qid in sorted(old):
        if not (qid.startswith(_CHECK_PREFIX) and qid.endswith(_CHECK_SUFFIX)) or qid not in new:
            continue
        if fails(old[qid]) == fails(new[qid]):
            continue
        base = qid.removesuffix(_CHECK_SUFFIX)
        element = new.get(f"{base}.element", old.get(f"{base}.element", ""))
        out.append(
            CheckCrossing(
                base.removeprefix(_CHECK_PREFIX),
                str(element),
                old[qid],
                new[qid],
                str(old.get(f"{base}.status", "")),
                str(new.get(f"{base}.status", "")),
            )
        )
    return out
