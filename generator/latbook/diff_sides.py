"""One side of `latbook diff`: a spec file or a workbook, as validated inputs and the
engine's results for them.

A workbook side is read back from its current input cells (edits included) and the engine
is run on those inputs; the values the file stores are not used, whatever program saved it.
"""

from __future__ import annotations

import zipfile
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from latbook import __version__
from latbook.build import check_spec
from latbook.problems import Problem, SpecError
from latbook.spec.load import load_json

SPEC, WORKBOOK = "spec", "workbook"
HOW_READ = {
    SPEC: "spec; the engine run on it",
    WORKBOOK: "workbook; the engine run on its current input cells, not the values stored "
    "in the file",
}


@dataclass(frozen=True)
class Side:
    """What one side of a diff holds: its inputs and the engine's results for them."""

    path: Path
    kind: str  # SPEC or WORKBOOK
    inputs: dict[str, Any]  # the validated spec, defaults filled in, as JSON data
    results: dict[str, Any]
    notes: list[str] = field(default_factory=list)


def load_side(path: Path) -> Side:
    """The side at `path` (a workbook when it is a zip archive, else a JSON spec); raise
    SpecError naming the problems (a workbook's as input cells with their spec paths)."""
    path = Path(path)
    if path.is_file() and zipfile.is_zipfile(path):
        data, notes = _workbook_inputs(path)
        kind = WORKBOOK
    else:
        data, notes, kind = load_json(path), [], SPEC
    spec, results = check_spec(data)
    inputs = spec.model_dump(mode="json", by_alias=True, exclude={"schema_ref"})
    return Side(path, kind, inputs, results, notes)


def _workbook_inputs(path: Path) -> tuple[dict[str, Any], list[str]]:
    from latbook.readback import read_back_spec
    from latbook.workbook_file import UnreadableWorkbook, read_workbook

    try:
        cells = read_workbook(path)
        data = read_back_spec(cells)
    except UnreadableWorkbook as exc:
        raise SpecError([Problem("$", "workbook", str(exc))]) from None
    notes = []
    if not cells.spec.intact:
        notes.append(f"{path}: the embedded spec does not match its SHA-256 (edited)")
    if cells.spec.generator_version != __version__:
        notes.append(
            f"{path}: built by latbook {cells.spec.generator_version}, results from "
            f"latbook {__version__}"
        )
    return data, notes
