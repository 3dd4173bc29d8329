"""Row heights, page breaks, the repeated header rows and the page count of a calc sheet.

The layout knows every printed row and its text, so it knows every row's height (set
explicitly in the file: LibreOffice does not fit merged or wrapped rows on load) and
where each page ends. Breaks go between blocks, so a block that fits on a page never
straddles two; a block taller than a page is broken between rows. A sheet may repeat one
range of rows (Excel's print titles), which LibreOffice and Excel print on every page after
it: the header rows of a table chunk taller than a page, so that its continuation pages
carry its header. With one range per sheet, a sheet with more than one such chunk, or
blocks after it, cannot have the right header on every page; such chunks print on
companion sheets (companions.py), which leaves a calc sheet at most one, its last block.
`paginate` still picks the chunk that helps most, or none where any choice would print a
header over more foreign pages than its own (`foreign_header_pages`). A companion sheet
prints its bands of columns side by side on pages of their own (`SheetPages.bands`).
With these breaks LibreOffice needs none of its own, so the page count here is the printed
one (tests/test_print_legibility.py compares them).
"""

from __future__ import annotations

from collections.abc import Iterable, Mapping
from dataclasses import dataclass, field
from typing import Any

from latbook.workbook.equation_text import cached_text
from latbook.workbook.layout import CHART_ROW_PX, Cell, SheetPlan
from latbook.workbook.print_grid import (
    GRID_COLS,
    ROW_MIN_PT,
    printable_height_pt,
    row_height_for,
    span_width_pt,
    wrapped_lines,
)
from latbook.workbook.styles import font_of

TITLE_ROW, CAUTION_ROW = 0, 1


def may_break(block_height_pt: float) -> bool:
    """A block this tall may be broken between rows: it does not fit a page with the blank
    row that precedes it (which may have to start the page, when the page before is full)."""
    return block_height_pt + ROW_MIN_PT > printable_height_pt()


@dataclass
class SheetPages:
    """How a sheet prints: row heights (pt), the rows that start a new page, the repeated
    header rows (first, last) or None, the last printed row, and the bands of grid columns
    side by side (a companion sheet; each band prints the same rows on pages of its own)."""

    heights: dict[int, float] = field(default_factory=dict)
    breaks: list[int] = field(default_factory=list)
    repeat: tuple[int, int] | None = None
    last_row: int = 0
    bands: int = 1

    @property
    def pages(self) -> int:
        return (len(self.breaks) + 1) * self.bands


def cell_text(cell: Cell, results: Mapping[str, Any]) -> str | None:
    """The text a cell prints, as far as it can wrap: literal text, a text input, or a
    formula's text result."""
    if cell.text is not None:
        return cell.text
    if cell.parts is not None:  # a printed equation
        return cached_text(cell.parts, lambda qid: results[qid])
    if cell.formula is not None and cell.qid is not None:
        value = results.get(cell.qid)
        return value if isinstance(value, str) else None
    if isinstance(cell.value, str):
        return cell.value
    return None


def cell_height_pt(cell: Cell, text: str, width_pt: float) -> float:
    size, bold = font_of(cell.style)
    return row_height_for(wrapped_lines(text, width_pt, size, bold), size)


def row_heights(
    plan: SheetPlan, results: Mapping[str, Any], title_cells: Iterable[Cell]
) -> dict[int, float]:
    """Height of every row 0 .. plan.last_row: the tallest wrapped text of the row."""
    heights = {r: ROW_MIN_PT for r in range(plan.last_row + 1)}
    for cell in [*title_cells, *plan.cells]:
        text = cell_text(cell, results)
        if not text:
            continue
        h = cell_height_pt(cell, text, span_width_pt(cell.col, cell.span))
        heights[cell.row] = max(heights.get(cell.row, ROW_MIN_PT), h)
    for chart in plan.charts:
        for r in range(chart["row"], chart["row"] + chart["rows"]):
            heights[r] = CHART_ROW_PX * 0.75  # points
    return heights


def title_cells(plan: SheetPlan, caution: str) -> list[Cell]:
    """The sheet title and the caution line, across the grid (in each band of a companion
    sheet: the first page of each band prints them)."""
    return [
        cell
        for band in range(plan.bands)
        for cell in (
            Cell(TITLE_ROW, band * GRID_COLS, "title", text=plan.title, span=GRID_COLS),
            Cell(CAUTION_ROW, band * GRID_COLS, "caution", text=caution, span=GRID_COLS),
        )
    ]


def paginate(plan: SheetPlan, heights: Mapping[int, float]) -> SheetPages:
    """Page breaks for `plan` with row `heights`, and the repeated header: of the table
    chunks taller than a page, the one whose header helps most (its own continuation
    pages less the later pages it would print on, the last of equals); none where every
    choice prints a header on more foreign pages than on its own."""
    tall = [
        b
        for b in plan.blocks
        if b.header is not None
        and may_break(sum(heights.get(r, ROW_MIN_PT) for r in range(b.first_row, b.last_row + 1)))
    ]
    best = _paginate(plan, heights, None)
    best_score = 0
    for block in tall:
        pages = _paginate(plan, heights, block.header)
        own = sum(1 for r in pages.breaks if block.first_row < r <= block.last_row)
        score = own - foreign_header_pages(plan, pages)
        if score > 0 and score >= best_score:
            best, best_score = pages, score
    return best


def _paginate(
    plan: SheetPlan, heights: Mapping[int, float], repeat: tuple[int, int] | None
) -> SheetPages:
    page_h = printable_height_pt()
    blocks = plan.blocks
    last = blocks[-1].last_row if blocks else max(heights, default=0)
    pages = SheetPages(dict(heights), [], repeat, last, plan.bands)
    rep = repeat

    def height(r0: int, r1: int) -> float:
        return sum(heights.get(r, ROW_MIN_PT) for r in range(r0, r1 + 1))

    def top(start: int) -> float:
        """Height the repeated rows take on a page starting at row `start`."""
        return height(rep[0], rep[1]) if rep is not None and start > rep[1] else 0.0

    y = 0.0
    prev_end = -1
    for b in blocks:
        gap_start = prev_end + 1
        gap = height(gap_start, b.first_row - 1)
        bh = height(b.first_row, b.last_row)
        prev_end = b.last_row
        if y + gap + bh <= page_h:
            y += gap + bh
            continue
        if gap_start > 0 and top(gap_start) + gap + bh <= page_h:
            pages.breaks.append(gap_start)
            y = top(gap_start) + gap + bh
            continue
        if y + gap <= page_h and top(b.first_row) + bh <= page_h:
            # fits a page without the blank row before it: that row ends this page
            pages.breaks.append(b.first_row)
            y = top(b.first_row) + bh
            continue
        # Taller than a page: start it on a fresh page unless a good part fits here.
        lead = height(b.first_row, min(b.first_row + 5, b.last_row))
        if gap_start > 0 and y + gap + lead > page_h:
            pages.breaks.append(gap_start)
            y = top(gap_start)
        y += gap
        for r in range(b.first_row, b.last_row + 1):
            h = heights.get(r, ROW_MIN_PT)
            if y + h > page_h and y > top(r):
                pages.breaks.append(r)
                y = top(r)
            y += h
    return pages


def greedy_breaks(heights: list[float]) -> list[int]:
    """Rows that start a page when rows fill pages one after another (the Cover, Tables):
    within the printable height less the safety share, so that LibreOffice, given these
    breaks, needs none of its own."""
    page_h = printable_height_pt()
    breaks, y = [], 0.0
    for r, h in enumerate(heights):
        if y + h > page_h and y > 0:
            breaks.append(r)
            y = 0.0
        y += h
    return breaks


def foreign_header_pages(plan: SheetPlan, pages: SheetPages) -> int:
    """Pages that start after the repeated header's own block has ended: they print that
    header above rows of another block (the limit of one repeated range per sheet)."""
    if pages.repeat is None:
        return 0
    own = next(b for b in plan.blocks if b.header == pages.repeat)
    return sum(1 for start in pages.breaks if start > own.last_row)
