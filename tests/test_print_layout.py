"""The print layout of the written workbook: 100 % scale on US letter, the column grid within
the page width, every text cell within the width and height its row and columns give it,
fonts of 8 pt or more, and wide tables cut into column chunks whose formulas still point
at the right cells.

Reference for the widths: LibreOffice 7.x sizes a column of w Excel units at 7.05 w + 5 pt
when Arial falls back to DejaVu Sans (measured on this machine's PDF, derived), and US
letter landscape with 0.5 in side margins leaves 720 pt (ANSI paper size, common practice).
"""

from __future__ import annotations

import json
from pathlib import Path

import openpyxl
import pytest

from latbook.build import build_workbook, check_spec
from latbook.workbook.builder import layout, plan_pages, printed_values
from latbook.workbook.cautions import caution_line
from latbook.workbook.index_sheet import locate_in_index
from latbook.workbook.layout import SheetPlan
from latbook.workbook.pagination import foreign_header_pages
from latbook.workbook.print_grid import (
    col_width_pt,
    line_height_pt,
    printable_width_pt,
    wrapped_lines,
)
from latbook.workbook.table_chunks import chunk_columns

EXAMPLES = sorted(Path(__file__).resolve().parents[1].glob("out_examples/*/spec.json"))
PRINTED_HIDDEN = {"Index", "SpecData"}


@pytest.fixture(scope="module", params=[p.parent.name for p in EXAMPLES])
def example_book(request, tmp_path_factory):
    spec = Path(__file__).resolve().parents[1] / "out_examples" / request.param / "spec.json"
    out = tmp_path_factory.mktemp(request.param) / "calc.xlsx"
    result = build_workbook(json.loads(spec.read_text()), out)
    book = openpyxl.load_workbook(out)
    book.latbook_path, book.latbook_registry = out, result.registry
    return book


def _width_units(ws, col_letter: str) -> float:
    """A column's width as the generator set it: openpyxl groups equal neighbours into one
    dimension, and the file stores the width plus xlsxwriter's 5 px padding (5/7 unit)."""
    col = openpyxl.utils.column_index_from_string(col_letter)
    for dim in ws.column_dimensions.values():
        if dim.min is not None and dim.min <= col <= dim.max and dim.width:
            return round(dim.width - 5 / 7, 2)
    return 8.43


def _print_cols(ws) -> tuple[int, int]:
    area = ws.print_area[0] if isinstance(ws.print_area, list) else ws.print_area
    rng = area.split("!")[-1].replace("$", "")
    first, last = rng.split(":")
    return (
        openpyxl.utils.column_index_from_string("".join(c for c in first if c.isalpha())),
        openpyxl.utils.column_index_from_string("".join(c for c in last if c.isalpha())),
    )


def test_every_printed_sheet_is_landscape_at_full_scale_within_the_page(example_book):
    for ws in example_book.worksheets:
        if ws.title in PRINTED_HIDDEN:
            continue
        assert ws.page_setup.orientation == "landscape", ws.title
        assert ws.page_setup.paperSize in (1, "1"), ws.title
        if ws.title == "Cover":
            continue  # cover.py sets its own columns; it may print fitted to the width
        assert not ws.sheet_properties.pageSetUpPr or not ws.sheet_properties.pageSetUpPr.fitToPage
        assert ws.page_setup.scale in (None, 100), ws.title
        c0, c1 = _print_cols(ws)
        # a companion sheet prints its bands of columns on pages of their own (column
        # page breaks): each band fits the page width
        cuts = sorted(b.id + 1 for b in ws.col_breaks.brk)  # first column after each break
        for first, last in zip([c0, *cuts], [*(c - 1 for c in cuts), c1], strict=True):
            width = sum(
                col_width_pt(_width_units(ws, openpyxl.utils.get_column_letter(c)))
                for c in range(first, last + 1)
            )
            assert width <= printable_width_pt(), (ws.title, first, width)


def _merged_widths(ws) -> dict[tuple[int, int], float]:
    spans = {}
    for rng in ws.merged_cells.ranges:
        spans[(rng.min_row, rng.min_col)] = sum(
            col_width_pt(_width_units(ws, openpyxl.utils.get_column_letter(c)))
            for c in range(rng.min_col, rng.max_col + 1)
        )
    return spans


def test_every_text_cell_fits_its_width_and_row_height(example_book):
    """Each string cell's wrapped lines (Arial advance widths scaled to the fallback font)
    fit the height of its row. A single word wider than its cell (an identifier such as
    four_story_drift_tolerant in the 10-unit value column) is broken over lines, as
    LibreOffice and Excel do with wrapped text, and counted so."""
    short = []
    for ws in example_book.worksheets:
        if ws.title in PRINTED_HIDDEN or ws.title == "Cover":
            continue
        merged = _merged_widths(ws)
        for row in ws.iter_rows():
            for cell in row:
                if not isinstance(cell.value, str) or not cell.value or cell.data_type == "f":
                    continue
                width = merged.get((cell.row, cell.column)) or col_width_pt(
                    _width_units(ws, cell.column_letter)
                )
                size = float(cell.font.sz or 10)
                bold = bool(cell.font.b)
                height = ws.row_dimensions[cell.row].height
                lines = wrapped_lines(cell.value, width, size, bold)
                if height is None or lines * line_height_pt(size) > height + 0.5:
                    short.append((ws.title, cell.coordinate, cell.value[:50], lines, height))
    assert not short, short[:10]


def test_every_style_prints_at_8_pt_or_more(example_book):
    small = {
        (ws.title, c.coordinate, c.font.sz)
        for ws in example_book.worksheets
        if ws.title not in PRINTED_HIDDEN
        for row in ws.iter_rows()
        for c in row
        if c.value is not None and c.font is not None and (c.font.sz or 10) < 8
    }
    assert not small, sorted(small)[:10]


def test_a_wide_table_is_cut_into_chunks_that_repeat_nothing_but_the_key():
    # 32 columns asking 12 units each: more than one chunk, every column placed once, in
    # order, and no chunk past the grid (derived).
    chunks = chunk_columns([None] * 32)
    placed = [c.index for chunk in chunks for c in chunk]
    assert len(chunks) >= 4
    assert placed == list(range(32))
    assert chunks[0][0].grid_col == 0
    for chunk in chunks[1:]:
        assert chunk[0].grid_col == 1  # grid column 0 holds the repeated key
    assert all(c.grid_col + c.span <= 9 for chunk in chunks for c in chunk)


def test_the_index_finds_fields_of_later_chunks(example_book):
    """locate_in_index (reading the Index sheet only) finds a field printed in a later
    column chunk at the cell the generator registered, and the Walls_in tables print in
    parts."""
    registry = example_book.latbook_registry
    checked = 0
    for table in registry.tables.values():
        for field_name in table.patterns:
            if not table.offsets.get(field_name) or not table.rows:
                continue
            key = list(table.rows)[-1]
            row, col = table.cell(key, field_name)
            entry = next(
                e
                for e in registry.entries.values()
                if e.table == table.name and e.row == row and e.col == col
            )
            assert locate_in_index(example_book.latbook_path, entry.id) == entry.address
            checked += 1
    assert checked > 20
    ws = example_book["Walls_in"]
    heads = [c.value for c in ws["A"] if isinstance(c.value, str) and "(part " in c.value]
    assert len(heads) >= 2


@pytest.mark.parametrize("spec_path", EXAMPLES, ids=lambda p: p.parent.name)
def test_no_page_continues_a_table_without_its_header(spec_path):
    """By the layout's own pagination (the LibreOffice test checks the PDF): every page
    break inside a table chunk's rows falls where that chunk's header rows repeat, no page
    repeats the header of a chunk that has ended, and the examples need companion sheets
    (derived: their wall-segment tables run over several pages)."""
    spec, results = check_spec(json.loads(spec_path.read_text(encoding="utf-8")))
    plans, _ = layout(spec, results)
    sheets = [p for p in plans if isinstance(p, SheetPlan)]
    values = printed_values(sheets, results)
    unserved = []
    for plan in sheets:
        pages = plan_pages(plan, values, caution_line(spec))
        for block in plan.blocks:
            inside = [r for r in pages.breaks if block.first_row < r <= block.last_row]
            if block.header is not None and inside and pages.repeat != block.header:
                unserved.append((plan.name, block.first_row, inside))
        assert foreign_header_pages(plan, pages) == 0, plan.name
    assert not unserved, unserved[:5]
    assert any(p.companion_of for p in sheets)
