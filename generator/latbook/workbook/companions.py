"""Which table chunks print on companion sheets: those taller than a page.

A sheet repeats at most one range of rows on its pages (print titles), so a calc sheet can
give only one table chunk its header rows on the pages it continues onto. A column chunk
taller than a page (by the row heights its printed text and values give,
pagination.row_heights) therefore moves to a companion sheet that follows its calc sheet
(`<sheet>_tab`, `<sheet>_tab2`...): the tall chunks of a table side by side on the same
rows, each in a band of the column grid with its own heading and header rows, so the
companion's one repeated range prints each chunk's own header on every page (pages run
down, then over). Rows on a companion are as tall as the tallest chunk's, so a chunk joins
the previous one's companion only while that costs no more pages than a companion of its
own. A chunk stays where the calc sheet's repeated rows serve it: the sheet's only tall
chunk, printed last.

Moving a chunk keeps each column one contiguous range (formulas and charts read columns
whole); references go through the registry (TablePos.sheets, cols, offsets).
"""

from __future__ import annotations

from collections.abc import Mapping
from typing import Any

from latbook.workbook.layout import PrintBlock, SheetPlan
from latbook.workbook.pagination import may_break, row_heights
from latbook.workbook.print_grid import ROW_MIN_PT, printable_height_pt

HEAD_ROWS = 5  # on a companion: the heading ("part k of n") and the four header rows
TOP_ROWS_PT = 3 * ROW_MIN_PT + 12.0  # title, caution and a blank row (an estimate)


def chunks_apart(plans: list[SheetPlan], values: Mapping[str, Any]) -> dict[str, list[list[int]]]:
    """Table name -> groups of chunk indices, each group one companion sheet, for every
    table with a chunk taller than a page that the calc sheet's repeated rows cannot
    serve."""
    page_h = printable_height_pt()
    apart: dict[str, list[list[int]]] = {}
    for plan in plans:
        heights = row_heights(plan, values, ())
        tall = [b for b in plan.blocks if b.table is not None and may_break(_height(b, heights))]
        if tall and tall[-1] is plan.blocks[-1]:
            tall.pop()  # printed last: the sheet's repeated rows serve it
        by_table: dict[str, list[PrintBlock]] = {}
        for block in tall:
            by_table.setdefault(block.table or "", []).append(block)
        for name, blocks in by_table.items():
            groups = _groups([_chunk_rows(b, heights) for b in blocks], page_h)
            apart[name] = [[blocks[i].chunk for i in group] for group in groups]
    return apart


def _height(block: PrintBlock, heights: Mapping[int, float]) -> float:
    return sum(heights.get(r, ROW_MIN_PT) for r in range(block.first_row, block.last_row + 1))


def _chunk_rows(block: PrintBlock, heights: Mapping[int, float]) -> list[float]:
    """A chunk's row heights as a companion lays them out: heading, header rows, data."""
    assert block.header is not None
    first_data = block.header[1] + 1
    head = [heights.get(r, ROW_MIN_PT) for r in range(block.first_row, first_data)]
    head = [ROW_MIN_PT] * (HEAD_ROWS - len(head)) + head  # an untitled chunk: blank heading
    return head + [heights.get(r, ROW_MIN_PT) for r in range(first_data, block.last_row + 1)]


def _groups(chunks: list[list[float]], page_h: float) -> list[list[int]]:
    """Consecutive chunks sharing a companion while side by side costs no more pages."""
    groups: list[list[int]] = []
    for i in range(len(chunks)):
        if groups:
            group = groups[-1]
            joined = _pages([chunks[j] for j in [*group, i]], page_h)
            if joined <= _pages([chunks[j] for j in group], page_h) + _pages([chunks[i]], page_h):
                group.append(i)
                continue
        groups.append([i])
    return groups


def _pages(chunks: list[list[float]], page_h: float) -> int:
    """Pages of chunks side by side: rows as tall as the tallest, the heading and header
    rows repeated on every page, one column of pages per chunk (an estimate for choosing
    groups; pagination.py counts the pages printed)."""
    rows = [max(hs) for hs in zip(*chunks, strict=True)]
    head, data = sum(rows[:HEAD_ROWS]), rows[HEAD_ROWS:]
    pages, y = 1, TOP_ROWS_PT + head
    for h in data:
        if y + h > page_h and y > head:
            pages, y = pages + 1, head
        y += h
    return pages * len(chunks)


def fewer_moves(
    apart: dict[str, list[list[int]]], culprits: set[str]
) -> dict[str, list[list[int]]]:
    """`apart` without the tables in `culprits`: moving them would take a formula past
    equation_text.MAX_FORMULA_CHARS characters (a reference to another sheet carries its
    name). They print as before, stacked on their calc sheet; putting a table back only
    shortens references, so the formulas of the others stay within the limit."""
    return {name: groups for name, groups in apart.items() if name not in culprits}


def culprit_tables(long_cells: list[tuple[str | None, str]], plans: list[SheetPlan]) -> set[str]:
    """The tables behind formulas that grew too long, given (table, formula) of each: the
    cell's own table, and the tables of every companion sheet the formula names."""
    found: set[str] = set()
    for table, formula in long_cells:
        if table is not None:
            found.add(table)
        for plan in plans:
            if plan.companion_of and (f"{plan.name}!" in formula or f"{plan.name}'!" in formula):
                found |= {b.table for b in plan.blocks if b.table}
    return found
