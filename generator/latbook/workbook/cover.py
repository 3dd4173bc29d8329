"""The cover sheet: project block, code basis, provenance and the cautions."""

from __future__ import annotations

from typing import Any

from xlsxwriter.worksheet import Worksheet

from latbook import __version__
from latbook.analysis.summary import design_choices
from latbook.spec.models import Spec
from latbook.workbook.assumptions import seismic_basis_lines
from latbook.workbook.cautions import CAUTION_LINES
from latbook.workbook.styles import Styles

COVER_SHEET = "Cover"
COVER_STATUS_ROW = 18  # the live input check (input_check.py), below the 16 rows of fields
COVER_CHECK_ROWS = 2  # its status text and its count
STATUS_HEIGHT_PT = 26.0  # two lines: the text when the inputs were edited


def write_cover(
    ws: Worksheet,
    spec: Spec,
    spec_sha256: str,
    styles: Styles,
    results: dict[str, Any] | None = None,
) -> int:
    """Write the cover; returns the last row used."""
    ws.set_column(0, 0, 30)
    ws.set_column(1, 1, 80)
    ws.write_string(0, 0, "Lateral force-resisting system calculation", styles.get("title"))
    p = spec.project
    rows = [
        ("Project", p.name),
        ("Project number", p.number),
        ("Location", p.location),
        ("Client", p.client),
        ("Engineer", p.engineer),
        ("Checker", p.checker),
        ("Date", p.date),
        ("Revision", p.revision),
        ("Notes", p.notes),
        ("Loads standard", spec.code.loads),
        ("Wood standard", spec.code.wood),
        ("Design method", spec.design_method),
        ("Procedures", _procedures(spec)),
        ("Seismic options and assumptions", "; ".join(seismic_basis_lines(spec))),
        ("Generator", f"latbook {__version__}"),
        ("Spec SHA-256", spec_sha256),
    ]
    row = 2
    for label, value in rows:
        ws.set_row(row, _height_for(value, chars_per_line=95))
        ws.write_string(row, 0, label, styles.get("cover_label"))
        ws.write_string(row, 1, value, styles.get("cover_value"))
        row += 1
    if row != COVER_STATUS_ROW:
        raise ValueError(f"the Cover's fields end at row {row}, not {COVER_STATUS_ROW}")
    ws.set_row(row, STATUS_HEIGHT_PT)
    row += COVER_CHECK_ROWS  # written by the builder with the other formula cells
    if results is not None and spec.wall_lines:
        row += 1
        ws.write_string(row, 0, "Design choices", styles.get("cover_label"))
        for text in design_choices(spec, results).values():
            ws.set_row(row, _height_for(text, chars_per_line=95))
            ws.write_string(row, 1, text, styles.get("cover_value"))
            row += 1
    row += 1
    ws.write_string(row, 0, "Cautions", styles.get("cover_label"))
    for line in CAUTION_LINES:
        ws.set_row(row, _height_for(line, chars_per_line=80) + 4)
        ws.write_string(row, 1, line, styles.get("cover_warning"))
        row += 1
    return row


def _height_for(text: str, chars_per_line: int) -> float:
    """Row height in points that shows `text` wrapped in the 80-character value column."""
    lines = max(1, -(-len(text) // chars_per_line))
    return 13.0 * lines


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
