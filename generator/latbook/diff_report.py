"""`latbook diff` output: text for a reader, JSON for a script (the same content)."""

from __future__ import annotations

import json
from typing import Any

from latbook.diff import Change, CheckCrossing, Diff
from latbook.diff_sides import HOW_READ, Side


def diff_as_dict(d: Diff) -> dict[str, Any]:
    """Every difference as JSON-ready data."""
    return {
        "changed": d.changed,
        "old": _side(d.old),
        "new": _side(d.new),
        "tolerance": {"relative": d.rel_tol, "absolute": d.abs_tol},
        "inputs": {
            "changed": [{"path": c.key, "old": c.old, "new": c.new} for c in d.inputs_changed],
            "added": [{"path": p, "new": v} for p, v in d.inputs_added.items()],
            "removed": [{"path": p, "old": v} for p, v in d.inputs_removed.items()],
        },
        "checks_crossed": [_crossing(c) for c in d.checks_crossed],
        "results": {
            "moved": [_moved(c) for c in d.results_moved],
            "added": [{"id": k, "new": v} for k, v in d.results_added.items()],
            "removed": [{"id": k, "old": v} for k, v in d.results_removed.items()],
        },
        "notes": [*d.old.notes, *d.new.notes],
    }


def diff_text(d: Diff) -> str:
    """The report a reviewer reads: what changed in the inputs, which checks crossed 1.0,
    which results moved beyond the tolerance."""
    lines = [
        f"latbook diff {d.old.path} {d.new.path}",
        f"  old: {d.old.path} ({HOW_READ[d.old.kind]})",
        f"  new: {d.new.path} ({HOW_READ[d.new.kind]})",
        f"  results compared with a relative tolerance of {d.rel_tol:g} "
        f"(absolute floor {d.abs_tol:g})",
    ]
    lines += [f"  note: {n}" for n in (*d.old.notes, *d.new.notes)]
    if not d.changed:
        lines.append("  no changes: the inputs and every result are the same")
        return "\n".join(lines)
    _section(
        lines,
        "inputs changed",
        [f"{c.key}: {_json(c.old)} -> {_json(c.new)}" for c in d.inputs_changed],
    )
    _section(lines, "inputs added", [f"{p}: {_json(v)}" for p, v in d.inputs_added.items()])
    _section(lines, "inputs removed", [f"{p}: {_json(v)}" for p, v in d.inputs_removed.items()])
    _section(lines, "checks crossing a DCR of 1.0", [_crossing_line(c) for c in d.checks_crossed])
    _section(lines, "results moved", [_moved_line(c) for c in d.results_moved])
    added = [f"{k} = {_num(v)}" for k, v in d.results_added.items()]
    removed = [f"{k} = {_num(v)}" for k, v in d.results_removed.items()]
    _section(lines, "results only in new (layout changed)", added)
    _section(lines, "results only in old (layout changed)", removed)
    n_inputs = len(d.inputs_changed) + len(d.inputs_added) + len(d.inputs_removed)
    lines.append(
        f"  changes: {n_inputs} input(s), {len(d.checks_crossed)} check(s) crossing 1.0, "
        f"{len(d.results_moved)} result(s) moved, "
        f"{len(d.results_added) + len(d.results_removed)} result(s) only on one side"
    )
    return "\n".join(lines)


def _section(lines: list[str], title: str, items: list[str]) -> None:
    if items:
        lines.append(f"  {title} ({len(items)}):")
        lines += [f"    {item}" for item in items]


def _side(side: Side) -> dict[str, str]:
    return {"path": str(side.path), "kind": side.kind, "read_as": HOW_READ[side.kind]}


def _crossing(c: CheckCrossing) -> dict[str, Any]:
    return {
        "check": c.check,
        "element": c.element,
        "old_dcr": c.old_dcr,
        "new_dcr": c.new_dcr,
        "old_status": c.old_status,
        "new_status": c.new_status,
        "now": "fails" if c.now_fails else "passes",
    }


def _crossing_line(c: CheckCrossing) -> str:
    now = "now FAILS" if c.now_fails else "now passes"
    return (
        f"{c.check} ({c.element}): DCR {_num(c.old_dcr)} -> {_num(c.new_dcr)}, {now} "
        f"({c.old_status} -> {c.new_status})"
    )


def _delta(c: Change) -> tuple[float | None, float | None]:
    """(new - old, (new - old) / |old|) for numbers; None where it does not apply."""
    if isinstance(c.old, bool) or isinstance(c.new, bool):
        return None, None
    if not (isinstance(c.old, int | float) and isinstance(c.new, int | float)):
        return None, None
    delta = c.new - c.old
    return delta, (delta / abs(c.old) if c.old else None)


def _moved(c: Change) -> dict[str, Any]:
    delta, rel = _delta(c)
    return {"id": c.key, "old": c.old, "new": c.new, "change": delta, "relative_change": rel}


def _moved_line(c: Change) -> str:
    delta, rel = _delta(c)
    line = f"{c.key}: {_num(c.old)} -> {_num(c.new)}"
    if delta is not None:
        line += f" ({delta:+.6g}" + (f", {rel:+.3%})" if rel is not None else ")")
    return line


def _num(value: Any) -> str:
    if isinstance(value, float):
        return format(value, ".10g")
    return _json(value)


def _json(value: Any) -> str:
    return json.dumps(value, ensure_ascii=False)
