"""Cell styles, created once per workbook. Inputs are unlocked and visibly different."""

from __future__ import annotations

from typing import Any

from xlsxwriter.format import Format
from xlsxwriter.workbook import Workbook

FONT = "Arial"
DEFAULT_NUMBER = "0.000"

_BASE: dict[str, dict[str, Any]] = {
    "title": {"bold": True, "font_size": 14},
    "caution": {"italic": True, "font_size": 8, "font_color": "#7a1f1f"},
    "heading": {"bold": True, "font_size": 11, "bottom": 1},
    "label": {},
    "label_key": {"bold": True},
    "symbol": {"italic": True, "align": "center"},
    "unit": {"font_size": 9, "align": "center"},
    "clause": {"font_size": 8, "font_color": "#555555", "italic": True},
    "note": {"font_size": 9, "italic": True},
    "text": {},
    # Inputs: unlocked, pale green fill with a dashed border; calculations stay locked.
    "input": {"locked": False, "bg_color": "#e3f1e0", "border": 3, "border_color": "#4f7f4a"},
    "calc": {"align": "right"},
    "result": {"bold": True, "top": 1, "bottom": 1, "align": "right"},
    "calc_text": {"align": "left"},
    "result_text": {"bold": True, "top": 1, "bottom": 1, "align": "left"},
    "th": {"bold": True, "text_wrap": True, "align": "center", "valign": "bottom", "top": 1},
    "th_unit": {"font_size": 8, "align": "center"},
    "th_clause": {
        "font_size": 7,
        "italic": True,
        "font_color": "#555555",
        "align": "center",
        "text_wrap": True,
        "bottom": 1,
    },
    "cover_label": {"bold": True, "text_wrap": True, "valign": "top"},
    "cover_value": {"text_wrap": True, "valign": "top"},
    "cover_warning": {"bold": True, "text_wrap": True, "valign": "top", "border": 2},
    "cover_caution": {"italic": True, "text_wrap": True, "valign": "top", "font_color": "#7a1f1f"},
    "cover_mark": {"bold": True, "font_size": 12, "font_color": "#c00000", "text_wrap": True},
    "cover_heading": {"bold": True, "font_size": 11, "bottom": 1},
    "cover_note": {
        "font_size": 8,
        "italic": True,
        "font_color": "#555555",
        "text_wrap": True,
        "valign": "top",
    },
    "cover_live": {"align": "left", "valign": "top", "text_wrap": True},
    "cover_th": {"bold": True, "bottom": 1, "valign": "bottom"},
    "seal_line": {"bottom": 1, "valign": "bottom"},
    "seal_box": {"border": 1, "valign": "top", "font_size": 8, "font_color": "#555555"},
}

NUMERIC_STYLES = {"input", "calc", "result", "calc_text", "result_text", "cover_live"}


class Styles:
    """Formats by (style, number format), made on first use and reused."""

    def __init__(self, workbook: Workbook):
        self._workbook = workbook
        self._made: dict[tuple[str, str | None], Format] = {}

    def get(self, style: str, number_format: str | None = None) -> Format:
        if style in NUMERIC_STYLES and number_format is None:
            number_format = DEFAULT_NUMBER
        key = (style, number_format)
        if key not in self._made:
            props = {"font_name": FONT, "font_size": 10, **_BASE[style]}
            if number_format is not None:
                props["num_format"] = number_format
            self._made[key] = self._workbook.add_format(props)
        return self._made[key]
