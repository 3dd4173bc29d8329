"""Print geometry of the calc sheets: the page, the column grid, and how much text fits.

Every calc sheet prints at 100 % on US letter, landscape. Its columns form one fixed grid
(GRID_WIDTHS, in Excel column-width units) that fits the page width; scalar blocks use the
first columns (label | symbol | value | unit | equation | clause) and tables are cut into
column chunks that fit the same grid (layout.py). Text sizes are estimated from Arial's
advance widths scaled up to DejaVu Sans (LibreOffice's fallback where Arial and its metric
twin Liberation Sans are not installed, ~16 % wider), and column widths as LibreOffice
sizes them with that fallback (7.05 pt per unit + 5 pt, wider than Excel's), so a cell whose
text is estimated to fit does fit (tests/test_print_legibility.py measures the PDF).
"""

from __future__ import annotations

import math

# US letter landscape, margins in inches (the header and footer print inside the margins).
PAGE_WIDTH_IN, PAGE_HEIGHT_IN = 11.0, 8.5
MARGIN_SIDE_IN, MARGIN_TOP_IN, MARGIN_BOTTOM_IN = 0.5, 0.75, 0.75
HEADER_FOOTER_MARGIN_IN = 0.3
PT_PER_IN = 72.0
# Share of the printable height the pagination fills: room for LibreOffice's rounding of
# row heights (twips) so that it never needs a page break of its own.
HEIGHT_SAFETY = 0.96
WIDTH_SAFETY = 0.97

# The grid (Excel width units). Cols 0-3: label/key, symbol, value, unit; 4 onwards: equal
# table columns (a scalar row's equation spans 4-6, its clause 7-8).
GRID_WIDTHS: tuple[float, ...] = (22, 8, 10, 7, 9, 9, 9, 9, 9)
GRID_COLS = len(GRID_WIDTHS)

ROW_MIN_PT = 14.25  # one line of 10 pt text with room above and below (19 px)
XLSX_DEFAULT_ROW_PT = 15.0  # a row of this height is written without one (xlsxwriter)
CELL_PAD_PT = 14.0  # padding and one indent step inside a cell
LINE_FACTOR = 1.25  # line height / font size (DejaVu Sans in LibreOffice: 1.17)
ROW_PAD_PT = 2.0
FALLBACK_FONT_FACTOR = 1.16  # DejaVu Sans advance widths / Arial's

# Arial advance widths in 1/1000 em (regular). Characters not listed take DEFAULT_EM.
_NARROW = {c: 278 for c in "ijl.,:;'|!I /\\[]ft"}
_NARROW.update({"f": 278, "t": 278, "r": 333, "(": 333, ")": 333, "-": 333, "*": 389})
_WIDE = {c: 667 for c in "ABEKPSVXY&"}
_WIDE.update({c: 722 for c in "CDHNRUw"})
_WIDE.update({c: 778 for c in "GOQ"})
_WIDE.update({"m": 833, "M": 833, "W": 944, "%": 889, "@": 1015, "F": 611, "T": 611})
_WIDE.update({"Z": 611, "L": 556, "J": 500, "≥": 549, "≤": 549, "Σ": 600, "δ": 556})
DEFAULT_EM = 556
BOLD_FACTOR = 1.08


def col_width_pt(width_units: float) -> float:
    """Printed width of a column of `width_units` Excel units in LibreOffice with the
    DejaVu Sans fallback (measured: 7.05 pt per unit + 5 pt; Excel's is 5.25 pt + 3.75)."""
    return width_units * 7.05 + 5.0


def span_width_pt(first_col: int, span: int) -> float:
    """Printed width of grid columns first_col .. first_col + span - 1 (a companion sheet
    repeats the grid in bands side by side)."""
    return sum(col_width_pt(GRID_WIDTHS[c % GRID_COLS]) for c in range(first_col, first_col + span))


def printable_width_pt() -> float:
    return (PAGE_WIDTH_IN - 2 * MARGIN_SIDE_IN) * PT_PER_IN


def printable_height_pt() -> float:
    """Height available to rows on one page, less the safety share."""
    usable = (PAGE_HEIGHT_IN - MARGIN_TOP_IN - MARGIN_BOTTOM_IN) * PT_PER_IN
    return usable * HEIGHT_SAFETY


def text_width_pt(text: str, font_pt: float, bold: bool = False) -> float:
    """Estimated printed width of `text` in Arial at `font_pt`."""
    em = sum(_NARROW.get(ch, _WIDE.get(ch, DEFAULT_EM)) for ch in text) / 1000.0
    return em * font_pt * FALLBACK_FONT_FACTOR * (BOLD_FACTOR if bold else 1.0)


def wrapped_lines(text: str, width_pt: float, font_pt: float, bold: bool = False) -> int:
    """Lines `text` takes when wrapped at spaces into `width_pt` (a word longer than the
    line is broken, as LibreOffice does)."""
    inner = max(width_pt - CELL_PAD_PT, 1.0)
    lines = 0
    for paragraph in str(text).split("\n"):
        lines += 1
        used = 0.0
        space = text_width_pt(" ", font_pt, bold)
        for word in paragraph.split(" "):
            w = text_width_pt(word, font_pt, bold)
            if used and used + space + w <= inner:
                used += space + w
                continue
            if used:
                lines += 1
            while w > inner:  # a word wider than the cell is broken over lines
                lines += 1
                w -= inner
            used = w
    return lines


def line_height_pt(font_pt: float) -> float:
    return font_pt * LINE_FACTOR


def row_height_for(lines: int, font_pt: float) -> float:
    """Row height holding `lines` lines of text at `font_pt`: whole pixels (0.75 pt), as
    the file stores it, and never the default height (which the file would leave out,
    letting LibreOffice size the row itself)."""
    px = max(ROW_MIN_PT, lines * line_height_pt(font_pt) + ROW_PAD_PT) / 0.75
    height = math.ceil(px - 1e-9) * 0.75
    return height + 0.75 if height == XLSX_DEFAULT_ROW_PT else height
