"""The live check that the input cells still hold the spec the workbook was built from.

The hidden SpecData sheet keeps, one row per input cell, its address, spec path and value
as built, beside a formula that gives 1 when the input cell now holds something else. The
Cover counts those rows and says whether the inputs are as built (the SHA-256 on the Cover
is of the spec as built, so alone it is misleading after an edit).

Spreadsheet comparison is not Python's: `=` compares text without regard to case, and an
empty cell is not a number. `counts_as_edited` is the same rule in Python, for `verify`.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

from latbook.analysis.build_check import AS_BUILT, EDITED, INPUTS_EDITED_ID, STATUS_ID
from latbook.workbook.cover import COVER_SHEET, COVER_STATUS_ROW
from latbook.workbook.layout import Cell, SheetPlan
from latbook.workbook.registry import Entry, Registry, a1
from latbook.workbook.sheet_names import SPEC_SHEET

STATUS_LABEL = "Inputs vs spec"
COUNT_LABEL = "Input cells edited"

# SpecData: columns A-B hold the spec itself; the check table starts in column D.
COL_ADDRESS, COL_PATH, COL_BUILT, COL_DIFFERS = 3, 4, 5, 6
HEADERS = ("input cell", "spec path", "value as built", "differs (1) or not (0)")
HELPER_CACHED = 0  # every input holds its spec value when the file is written


@dataclass
class CellGroup:
    """Cells placed on a sheet that has a writer of its own (Cover, SpecData)."""

    name: str
    cells: list[Cell] = field(default_factory=list)


def plan_input_check(plans: list[SheetPlan], registry: Registry) -> list[CellGroup]:
    """The SpecData check rows and the Cover's status and count; registers the two Cover
    quantities."""
    spec_data = CellGroup(SPEC_SHEET)
    for col, header in enumerate(HEADERS, start=COL_ADDRESS):
        spec_data.cells.append(Cell(0, col, "text", text=header))
    row = 1
    for cell in _input_cells(plans):
        entry = registry.entries[cell.qid]
        spec_data.cells += [
            Cell(row, COL_ADDRESS, "text", text=entry.address),
            Cell(row, COL_PATH, "text", text=f"$.{entry.spec_path}"),
            Cell(row, COL_BUILT, "text", value=cell.value),
            Cell(row, COL_DIFFERS, "calc", formula=differs_formula(entry, cell.value, row)),
        ]
        row += 1
    if row == 1:
        raise ValueError("a workbook without input cells has nothing to check")
    first, last = a1(1, COL_DIFFERS, True), a1(row - 1, COL_DIFFERS, True)
    count = f"=SUM({SPEC_SHEET}!{first}:{last})"
    status = f'=IF({{q:{INPUTS_EDITED_ID}}}=0,"{AS_BUILT}","{EDITED}")'
    cover = CellGroup(COVER_SHEET)
    r_status, r_count = COVER_STATUS_ROW, COVER_STATUS_ROW + 1
    cover.cells += [
        Cell(r_status, 0, "cover_label", text=STATUS_LABEL),
        Cell(r_status, 1, "cover_value", formula=status, qid=STATUS_ID),
        Cell(r_count, 0, "cover_label", text=COUNT_LABEL),
        Cell(r_count, 1, "calc_text", formula=count, qid=INPUTS_EDITED_ID, fmt="0"),
    ]
    registry.add(Entry(INPUTS_EDITED_ID, COVER_SHEET, r_count, 1, "calc", COUNT_LABEL))
    registry.add(Entry(STATUS_ID, COVER_SHEET, r_status, 1, "calc", STATUS_LABEL))
    return [spec_data, cover]


def _input_cells(plans: list[SheetPlan]) -> list[Cell]:
    return [c for plan in plans for c in plan.cells if c.style == "input" and c.qid]


def differs_formula(entry: Entry, built: Any, row: int) -> str:
    """1 when the input cell no longer holds `built` (stored in this row's column F)."""
    cell = f"{{q:{entry.id}}}"
    kept = a1(row, COL_BUILT)
    if isinstance(built, bool):
        return f"=IF({cell}={kept},0,1)"
    if isinstance(built, int | float):
        return f"=IF(ISNUMBER({cell}),IF({cell}={kept},0,1),1)"
    if built is None or built == "":
        return f'=IF(ISNUMBER({cell}),1,IF({cell}="",0,1))'
    return f"=IF(ISNUMBER({cell}),1,IF({cell}={kept},0,1))"


def counts_as_edited(built: Any, current: Any) -> bool:
    """Whether `differs_formula` gives 1 for an input cell holding `current` (a value as
    read from the file; TRUE/FALSE saved as formulas already turned into booleans)."""
    is_number = isinstance(current, int | float) and not isinstance(current, bool)
    if isinstance(built, bool):
        return current is not built
    if isinstance(built, int | float):
        return not (is_number and float(current) == float(built))
    if is_number:
        return True
    if built is None or built == "":
        return current not in (None, "")
    return not (isinstance(current, str) and current.casefold() == str(built).casefold())
