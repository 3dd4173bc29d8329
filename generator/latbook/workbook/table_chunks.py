"""Cut a table's columns into chunks that fit the print grid's width.

A table wider than the page is printed as stacked blocks: each chunk holds as many of the
table's columns as fit the grid; every chunk after the first repeats the table's key
column (its first column: level, line, segment...) in grid column 0. A column asking for
a width wider than one grid column spans two or three (merged cells).
"""

from __future__ import annotations

from dataclasses import dataclass

from latbook.workbook.print_grid import GRID_COLS, GRID_WIDTHS

DEFAULT_COLUMN_WIDTH = 12.0
MAX_SPAN = 3
# A column gets grid columns until they reach this share of the width it asks for
# (capped at WIDE_COLUMN_CAP units; its text wraps beyond that).
WIDTH_SHARE = 0.8
WIDE_COLUMN_CAP = 36.0


@dataclass(frozen=True)
class ChunkColumn:
    """Template column `index` placed at grid column `grid_col`, spanning `span` columns."""

    index: int
    grid_col: int
    span: int


def _span_at(grid_col: int, width: float) -> tuple[int, bool]:
    """Grid columns a column of `width` takes from `grid_col`, and whether they are enough
    (False: the grid ended first)."""
    target = min(width, WIDE_COLUMN_CAP) * WIDTH_SHARE
    span, covered = 0, 0.0
    while grid_col + span < GRID_COLS:
        covered += GRID_WIDTHS[grid_col + span]
        span += 1
        if covered >= target or span == MAX_SPAN:
            return span, True
    return span, False


def chunk_columns(widths: list[float | None]) -> list[list[ChunkColumn]]:
    """Chunks of the columns whose requested widths are `widths` (None: the default).
    Column 0 is the key: grid column 0 of the first chunk (the layout repeats it in the
    others)."""
    if not widths:
        return []
    chunks: list[list[ChunkColumn]] = [[ChunkColumn(0, 0, 1)]]
    pos = 1
    for index in range(1, len(widths)):
        width = widths[index] or DEFAULT_COLUMN_WIDTH
        span, enough = _span_at(pos, width) if pos < GRID_COLS else (0, False)
        if not enough and pos > 1:
            chunks.append([])
            pos = 1
            span, _ = _span_at(pos, width)
        chunks[-1].append(ChunkColumn(index, pos, span))
        pos += span
    return chunks
