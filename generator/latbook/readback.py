"""Read a workbook's current input cells back into a spec (the one it was built from,
with every edited input put back at its spec path).

Unedited inputs leave the embedded spec untouched, so reading back an unedited workbook
gives the spec that built it, key for key.
"""

from __future__ import annotations

import copy
import re
from dataclasses import dataclass
from typing import Any

from latbook.problems import Problem, SpecError
from latbook.spec.load import parse_spec
from latbook.spec.models import Spec
from latbook.workbook.builder import layout
from latbook.workbook.context import build_context
from latbook.workbook.layout import spec_value
from latbook.workbook.registry import Entry, Registry
from latbook.workbook_file import UnreadableWorkbook, WorkbookCells

_BOOLEAN_FORMULAS = {"=TRUE()": True, "=FALSE()": False, "=TRUE": True, "=FALSE": False}
MAX_PROBLEMS_SHOWN = 10
_PATH_PART = re.compile(r"([^.\[\]]+)|\[(\d+)\]")


@dataclass(frozen=True)
class InputReading:
    """One input cell: the value the spec had, the value the cell holds now."""

    entry: Entry
    built_value: Any
    cell_value: Any

    @property
    def changed(self) -> bool:
        return not _same_input(self.built_value, self.cell_value)


@dataclass(frozen=True)
class ReadBack:
    """The workbook's inputs as spec data, and where each input came from."""

    data: dict[str, Any]
    readings: list[InputReading]
    problems: list[Problem]  # inputs that cannot go back into the spec as typed

    def entry_for(self, path: str) -> Entry | None:
        """The input cell behind a JSON path such as `$.seismic.rho`."""
        bare = path.removeprefix("$").removeprefix(".")
        return next((r.entry for r in self.readings if r.entry.spec_path == bare), None)


def built_spec(cells: WorkbookCells) -> tuple[Spec, Registry]:
    """The spec embedded in the workbook and the registry of its layout; raise
    UnreadableWorkbook when that spec breaks a rule (nothing can be read against it)."""
    try:
        spec = parse_spec(cells.spec.data)
    except SpecError as exc:
        shown = "; ".join(str(p) for p in exc.problems[:MAX_PROBLEMS_SHOWN])
        more = len(exc.problems) - MAX_PROBLEMS_SHOWN
        shown += f"; and {more} more" if more > 0 else ""
        raise UnreadableWorkbook(
            f"{cells.path}: the embedded spec does not validate ({shown}); rebuild from a "
            "corrected spec"
        ) from None
    _, registry = layout(spec)
    return spec, registry


def read_inputs(cells: WorkbookCells) -> ReadBack:
    """Every input cell's current value put back into a copy of the embedded spec data."""
    spec, registry = built_spec(cells)
    dumped = build_context(spec).spec_data
    data = copy.deepcopy(cells.spec.data)
    readings: list[InputReading] = []
    problems: list[Problem] = []
    for entry in registry.inputs():
        if entry.spec_path is None:
            continue
        built = spec_value(dumped, entry.spec_path)
        raw = input_cell_value(cells.formulas.get((entry.sheet, entry.row, entry.col)))
        reading = InputReading(entry, built, raw)
        readings.append(reading)
        if not reading.changed:
            continue
        value, problem = _as_spec_value(raw, built)
        if problem:
            problems.append(Problem(cell_path(entry), "input_type", problem))
            continue
        set_path(data, entry.spec_path, value)
    return ReadBack(data, readings, problems)


def read_back_spec(cells: WorkbookCells) -> dict[str, Any]:
    """The current inputs as spec data that validates; raise SpecError naming the cells."""
    back = read_inputs(cells)
    if back.problems:
        raise SpecError(back.problems)
    try:
        parse_spec(back.data)
    except SpecError as exc:
        raise SpecError([locate(p, back) for p in exc.problems]) from None
    return back.data


def locate(problem: Problem, back: ReadBack) -> Problem:
    """The problem with the input cell it came from added to its path, when there is one."""
    entry = back.entry_for(problem.path)
    if entry is None:
        return problem
    return Problem(f"{entry.address} ({problem.path})", problem.rule, problem.message)


def cell_path(entry: Entry) -> str:
    return f"{entry.address} ($.{entry.spec_path})"


def input_cell_value(raw: Any) -> Any:
    """An input cell's value; LibreOffice saves TRUE/FALSE as the formulas =TRUE()/=FALSE()."""
    if isinstance(raw, str) and raw.replace(" ", "").upper() in _BOOLEAN_FORMULAS:
        return _BOOLEAN_FORMULAS[raw.replace(" ", "").upper()]
    return raw


def set_path(data: dict[str, Any], path: str, value: Any) -> None:
    """Set `value` at a dotted spec path, creating missing objects on the way."""
    parts = [int(i) if i else name for name, i in _PATH_PART.findall(path)]
    node: Any = data
    for part, nxt in zip(parts, parts[1:], strict=False):
        if isinstance(part, int):
            node = node[part]
        else:
            node = node.setdefault(part, [] if isinstance(nxt, int) else {})
    node[parts[-1]] = value


def _as_spec_value(raw: Any, built: Any) -> tuple[Any, str | None]:
    """A cell value converted to the JSON type the spec field had, or a problem."""
    if isinstance(raw, str) and raw.startswith("="):
        return None, "an input cell holds a formula; type a value"
    if raw == "":
        raw = None
    if isinstance(built, bool):
        if isinstance(raw, bool):
            return raw, None
        if isinstance(raw, str) and raw.upper() in ("TRUE", "FALSE"):
            return raw.upper() == "TRUE", None
        return None, f"expected TRUE or FALSE, the cell holds {_shown(raw)}"
    if isinstance(built, int | float):
        if isinstance(raw, bool) or not isinstance(raw, int | float):
            return None, f"expected a number, the cell holds {_shown(raw)}"
        if isinstance(built, int) and float(raw).is_integer():
            return int(raw), None
        return raw, None
    if isinstance(built, str):
        if isinstance(raw, float) and raw.is_integer():
            return str(int(raw)), None
        return ("" if raw is None else str(raw)), None
    return raw, None


def _shown(raw: Any) -> str:
    return "nothing (blank)" if raw is None else repr(raw)


def _same_input(built: Any, raw: Any) -> bool:
    if raw == "" or raw is None:
        return built is None or built == ""
    if isinstance(built, bool) or isinstance(raw, bool):
        return built is raw or (isinstance(raw, str) and raw.upper() == str(built).upper())
    if isinstance(built, int | float) and isinstance(raw, int | float):
        return float(built) == float(raw)
    if isinstance(built, str) and isinstance(raw, int | float):
        return built == (str(int(raw)) if float(raw).is_integer() else str(raw))
    return built == raw
