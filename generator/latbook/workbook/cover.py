"""The cover sheet: project block, live input check, design criteria, revisions, the seal
and signature block, the stated options and choices, and the cautions.

It prints on letter landscape like the calc sheets: five columns, 711 px (7.4 in) wide in
Excel; LibreOffice's wider fallback font makes them about 10.2 in, so the builder fits the
width (about 95 %); every text cell wraps in a row made tall enough for it.
Spec text goes in as text cells; the live values (input check, criteria) are formula cells
placed by `cover_criteria.py` and `input_check.py` and written by the builder.
"""

from __future__ import annotations

from typing import Any

from xlsxwriter.worksheet import Worksheet

from latbook import __version__
from latbook.analysis.criteria import criteria_rows
from latbook.analysis.summary import design_choices
from latbook.spec.models import Spec
from latbook.spec.revisions import current_revision, revision_rows
from latbook.workbook.assumptions import seismic_basis_lines
from latbook.workbook.cautions import CAUTION_LINES, caution_line
from latbook.workbook.styles import Styles

COVER_SHEET = "Cover"
# Column widths in characters of the default font (xlsxwriter: 7 px each + 5 px padding).
COVER_WIDTHS = (28, 16, 8, 23, 23)
COL_LABEL, COL_VALUE, COL_UNIT, COL_BASIS, COL_LAST = range(5)
CAUTION_ROW = 1
TITLE_PT = 20.0  # a 14 pt title
FIELDS_FIRST_ROW = 3
COVER_FIELDS = 11  # project block rows, generator and spec SHA-256
COVER_STATUS_ROW = FIELDS_FIRST_ROW + COVER_FIELDS  # the live input check (input_check.py)
COVER_CHECK_ROWS = 2  # its status text and its count
STATUS_HEIGHT_PT = 26.0  # two lines: the text when the inputs were edited
SEAL_ROWS = ("Signature", "Name", "License no.", "Date")
SEAL_ROW_PT = 34.0  # four rows: a 1.9 in high box for the seal beside them
SEAL_HEADING_ROW = COVER_STATUS_ROW + COVER_CHECK_ROWS + 1  # on the first page
CRITERIA_HEADING_ROW = SEAL_HEADING_ROW + len(SEAL_ROWS) + 2
CRITERIA_FIRST_ROW = CRITERIA_HEADING_ROW + 1

# Characters per printed line of each wrapped area: Arial mixed text averages about 0.5 em a
# character; 0.55 em is taken (7.3 px at 10 pt, 5.9 px at 8 pt) so that rows err on the tall side.
CHARS_WIDE = 70  # columns B-E, 10 pt
CHARS_WIDE_NOTE = 85  # columns B-E, 8 pt
CHARS_LABEL = 26  # column A, 10 pt bold
CHARS_BASIS_NOTE = 54  # columns D-E, 8 pt
CHARS_DESCRIPTION = 30  # columns C-D, 10 pt
CHARS_CONTENTS = 44  # columns B-D, 10 pt
CHARS_NARROW = 15  # column B or E alone, 10 pt
CHARS_FULL = 90  # columns A-E, 10 pt
CHARS_MARK = 70  # columns A-E, 12 pt bold
LINE_PT = {8: 11.0, 10: 13.0, 12: 16.0}

CRITERIA_NOTE = (
    "Each value below is a live formula of the calc cell that holds it (by its defined name "
    "where it has one): an edited input shows here once the workbook recalculates."
)
CHOICES_NOTE = (
    "As built: fixed text written from this build's spec and results. The Summary sheet shows "
    "the choices that input cells set as live formulas."
)
SEAL_NOTE = "Engineer's seal"


def cover_width_px() -> int:
    """The printed width of the Cover's columns in pixels (96 to the inch)."""
    return sum(int(w * 7 + 0.5) + 5 for w in COVER_WIDTHS)


def write_cover(
    ws: Worksheet,
    spec: Spec,
    spec_sha256: str,
    styles: Styles,
    results: dict[str, Any] | None = None,
    contents: list[tuple[str, str]] | None = None,
) -> tuple[int, dict[str, int]]:
    """Write the Cover's text, rows and frames; returns the last row used and the row of
    each sheet in the table of contents (`contents`: printed sheets and titles, in print
    order; the builder writes their pages once the pages are counted). The formula cells
    (input check, criteria values) are written after it by the builder."""
    for col, width in enumerate(COVER_WIDTHS):
        ws.set_column(col, col, width)
    ws.set_row(0, TITLE_PT)
    title = "Lateral force-resisting system calculation"
    ws.merge_range(0, 0, 0, COL_LAST, title, styles.get("title"))  # one line across the page
    _write_caution_line(ws, spec, styles)
    row = _write_fields(ws, spec, spec_sha256, styles)
    if row != COVER_STATUS_ROW:
        raise ValueError(f"the Cover's fields end at row {row}, not {COVER_STATUS_ROW}")
    ws.merge_range(row, COL_VALUE, row, COL_LAST, "", styles.get("cover_value"))
    ws.set_row(row, STATUS_HEIGHT_PT)
    _write_seal_block(ws, styles)
    row = _write_criteria(ws, spec, styles, results)
    row = _write_revisions(ws, spec, styles, row + 1)
    row, toc_rows = _write_contents(ws, contents or [], styles, row + 1)
    row = _write_basis(ws, spec, styles, row + 1)
    if results is not None and spec.wall_lines:
        row = _write_choices(ws, spec, results, styles, row + 1)
    row += 1
    ws.write_string(row, 0, "Cautions", styles.get("cover_heading"))
    row += 1
    for line in CAUTION_LINES:
        ws.merge_range(row, COL_LABEL, row, COL_LAST, line, styles.get("cover_warning"))
        ws.set_row(row, _height(line, CHARS_FULL - 8) + 4)
        row += 1
    return row - 1, toc_rows


def _write_contents(
    ws: Worksheet, contents: list[tuple[str, str]], styles: Styles, row: int
) -> tuple[int, dict[str, int]]:
    """The table of contents: each printed sheet, what it holds and its pages (left blank
    here; `write_contents_pages` fills them). Returns the last row and each sheet's row."""
    rows: dict[str, int] = {}
    if not contents:
        return row, rows
    row += 1
    ws.write_string(row, COL_LABEL, "Contents", styles.get("cover_heading"))
    row += 1
    th = styles.get("cover_th")
    ws.write_string(row, COL_LABEL, "Sheet", th)
    ws.merge_range(row, COL_VALUE, row, COL_BASIS, "Contents", th)
    ws.write_string(row, COL_LAST, "Pages", th)
    cell = styles.get("cover_value")
    for name, title in contents:
        row += 1
        rows[name] = row
        ws.write_string(row, COL_LABEL, name, cell)
        ws.merge_range(row, COL_VALUE, row, COL_BASIS, title, cell)
        ws.set_row(row, max(_height(name, CHARS_LABEL), _height(title, CHARS_CONTENTS)))
    return row, rows


def write_contents_pages(
    ws: Worksheet, rows: dict[str, int], pages: dict[str, int], styles: Styles
) -> None:
    """Each sheet's page numbers in the table of contents: the printout numbers its pages
    on from sheet to sheet, in print order (`pages`: the count of each printed sheet)."""
    first = 1
    for name, count in pages.items():
        if name in rows:
            last = first + count - 1
            text = str(first) if count == 1 else f"{first}–{last}"
            ws.write_string(rows[name], COL_LAST, text, styles.get("cover_value"))
        first += count


def _height(text: str, chars_per_line: int, size_pt: int = 10) -> float:
    """Row height in points that shows `text` wrapped at `chars_per_line` characters."""
    lines = sum(max(1, -(-len(part) // chars_per_line)) for part in text.split("\n"))
    return LINE_PT[size_pt] * lines + 2.0


def _write_caution_line(ws: Worksheet, spec: Spec, styles: Styles) -> None:
    """Row 2: 'PRELIMINARY - not for construction' where the spec marks it, else the
    review caution every calc sheet carries."""
    text = caution_line(spec)
    if spec.project.preliminary:
        ws.merge_range(CAUTION_ROW, 0, CAUTION_ROW, COL_LAST, text, styles.get("cover_mark"))
        ws.set_row(CAUTION_ROW, _height(text, CHARS_MARK, 12))
    else:
        ws.merge_range(CAUTION_ROW, 0, CAUTION_ROW, COL_LAST, text, styles.get("cover_caution"))
        ws.set_row(CAUTION_ROW, _height(text, CHARS_FULL))


def _write_fields(ws: Worksheet, spec: Spec, spec_sha256: str, styles: Styles) -> int:
    p = spec.project
    revision, date = current_revision(p)
    rows = [
        ("Project", p.name),
        ("Project number", p.number),
        ("Location", p.location),
        ("Client", p.client),
        ("Engineer", p.engineer),
        ("Checker", p.checker),
        ("Date", date),
        ("Revision", revision),
        ("Notes", p.notes),
        ("Generator", f"latbook {__version__}"),
        ("Spec SHA-256", spec_sha256),
    ]
    row = FIELDS_FIRST_ROW
    for label, value in rows:
        ws.set_row(row, _height(value, CHARS_WIDE))
        ws.write_string(row, COL_LABEL, label, styles.get("cover_label"))
        ws.merge_range(row, COL_VALUE, row, COL_LAST, value, styles.get("cover_value"))
        row += 1
    return row


def _write_criteria(ws: Worksheet, spec: Spec, styles: Styles, results) -> int:
    """The labels, units, bases and fixed texts of the design criteria; returns the last
    row. Their live values are the formula cells of `cover_criteria.py`."""
    ws.write_string(CRITERIA_HEADING_ROW, COL_LABEL, "Design criteria", styles.get("cover_heading"))
    ws.merge_range(
        CRITERIA_HEADING_ROW,
        COL_VALUE,
        CRITERIA_HEADING_ROW,
        COL_LAST,
        CRITERIA_NOTE,
        styles.get("cover_note"),
    )
    ws.set_row(CRITERIA_HEADING_ROW, _height(CRITERIA_NOTE, CHARS_WIDE_NOTE, 8))
    row = CRITERIA_FIRST_ROW
    for item in criteria_rows(spec):
        if item.heading:
            ws.merge_range(row, COL_LABEL, row, COL_LAST, item.label, styles.get("cover_th"))
            ws.set_row(row, 18.0)
            row += 1
            continue
        ws.write_string(row, COL_LABEL, item.label, styles.get("cover_label"))
        height = _height(item.label, CHARS_LABEL)
        value = item.text
        if value is None and results is not None and item.source is not None:
            value = results.get(item.source)
        shown = "" if value is None else str(value)
        if item.wide:
            if item.text is not None:
                ws.merge_range(row, COL_VALUE, row, COL_LAST, item.text, styles.get("cover_value"))
            else:
                ws.merge_range(row, COL_VALUE, row, COL_LAST, "", styles.get("cover_live"))
            height = max(height, _height(shown, CHARS_WIDE))
        else:
            if item.text is not None:
                ws.write_string(row, COL_VALUE, item.text, styles.get("cover_value"))
            height = max(height, _height(shown, CHARS_NARROW))
            ws.write_string(row, COL_UNIT, item.unit, styles.get("cover_value"))
            ws.merge_range(row, COL_BASIS, row, COL_LAST, item.basis, styles.get("cover_note"))
            height = max(height, _height(item.basis, CHARS_BASIS_NOTE, 8))
        ws.set_row(row, height)
        row += 1
    return row - 1


def _write_revisions(ws: Worksheet, spec: Spec, styles: Styles, row: int) -> int:
    """The revision block from the spec (text cells); returns the last row."""
    row += 1
    ws.write_string(row, COL_LABEL, "Revisions", styles.get("cover_heading"))
    row += 1
    th = styles.get("cover_th")
    ws.write_string(row, COL_LABEL, "Revision", th)
    ws.write_string(row, COL_VALUE, "Date", th)
    ws.merge_range(row, COL_UNIT, row, COL_BASIS, "Description", th)
    ws.write_string(row, COL_LAST, "By", th)
    cell = styles.get("cover_value")
    for rev in revision_rows(spec.project):
        row += 1
        ws.write_string(row, COL_LABEL, rev.revision, cell)
        ws.write_string(row, COL_VALUE, rev.date, cell)
        ws.merge_range(row, COL_UNIT, row, COL_BASIS, rev.description, cell)
        ws.write_string(row, COL_LAST, rev.by, cell)
        ws.set_row(
            row,
            max(
                _height(rev.revision, CHARS_LABEL),
                _height(rev.date, CHARS_NARROW),
                _height(rev.description, CHARS_DESCRIPTION),
                _height(rev.by, CHARS_NARROW),
            ),
        )
    return row


def _write_seal_block(ws: Worksheet, styles: Styles) -> None:
    """A blank framed seal area beside lines for signature, name, license number and date,
    on the first page under the project block."""
    row = SEAL_HEADING_ROW
    ws.merge_range(
        row,
        COL_LABEL,
        row,
        COL_LAST,
        "Engineer of record: seal and signature",
        styles.get("cover_heading"),
    )
    first = row + 1
    for i, label in enumerate(SEAL_ROWS):
        r = first + i
        ws.set_row(r, SEAL_ROW_PT)
        ws.write_string(r, COL_LABEL, label, styles.get("cover_label"))
        ws.merge_range(r, COL_VALUE, r, COL_UNIT, "", styles.get("seal_line"))
    last = first + len(SEAL_ROWS) - 1
    ws.merge_range(first, COL_BASIS, last, COL_LAST, SEAL_NOTE, styles.get("seal_box"))


def _write_basis(ws: Worksheet, spec: Spec, styles: Styles, row: int) -> int:
    """Procedures and the seismic options and assumptions; returns the last row."""
    row += 1
    ws.write_string(row, COL_LABEL, "Basis of the calculation", styles.get("cover_heading"))
    items = [("Procedures", _procedures(spec))]
    lines = seismic_basis_lines(spec)
    if lines:
        items.append(("Seismic options and assumptions", "; ".join(lines)))
    for label, text in items:
        row += 1
        ws.write_string(row, COL_LABEL, label, styles.get("cover_label"))
        ws.merge_range(row, COL_VALUE, row, COL_LAST, text, styles.get("cover_value"))
        ws.set_row(row, max(_height(text, CHARS_WIDE), _height(label, CHARS_LABEL)))
    return row


def _write_choices(ws: Worksheet, spec: Spec, results, styles: Styles, row: int) -> int:
    """The design choices as built (fixed text); returns the last row."""
    row += 1
    ws.write_string(row, COL_LABEL, "Design choices as built", styles.get("cover_heading"))
    ws.merge_range(row, COL_VALUE, row, COL_LAST, CHOICES_NOTE, styles.get("cover_note"))
    ws.set_row(row, _height(CHOICES_NOTE, CHARS_WIDE_NOTE, 8))
    for text in design_choices(spec, results).values():
        row += 1
        ws.merge_range(row, COL_VALUE, row, COL_LAST, text, styles.get("cover_value"))
        ws.set_row(row, _height(text, CHARS_WIDE))
    return row


def _procedures(spec: Spec) -> str:
    parts = []
    if spec.seismic is not None:
        parts.append("seismic ELF (ASCE 7-16 §12.8), diaphragm forces (§12.10)")
    if spec.wind is not None:
        parts.append("MWFRS wind, directional procedure (ASCE 7-16 ch. 27 Part 1)")
    if spec.wall_lines:
        parts.append(
            "flexible diaphragms by tributary area, overhangs continuous over their line; "
            "shear walls (AWC SDPWS-2015)"
        )
    return "; ".join(parts)
