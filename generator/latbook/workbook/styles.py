"""Cell styles, created once per workbook. Inputs are unlocked and visibly different.

Every style prints at 8 pt or more (MIN_FONT_PT) and wraps its text at the top of the
cell; numbers are right-aligned and text reads from the left, each indented by one step,
so a number never runs into the text of the next column."""

from __future__ import annotations

from typing import Any

from xlsxwriter.format import Format
from xlsxwriter.workbook import Workbook

FONT = "Arial"
DEFAULT_NUMBER = "0.000"
DEFAULT_FONT_PT = 10
MIN_FONT_PT = 8

_BASE: dict[str, dict[str, Any]] = {
    "title": {"bold": True, "font_size": 14},
    "caution": {"italic": True, "font_size": 8, "font_color": "#7a1f1f"},
    "heading": {"bold": True, "font_size": 11, "bottom": 1},
    "label": {"indent": 1},
    "label_key": {"bold": True, "indent": 1},
    "symbol": {"italic": True, "align": "center"},
    "unit": {"font_size": 9, "align": "center"},
    "equation": {"font_size": 9, "align": "left", "indent": 1},
    "clause": {"font_size": 8, "font_color": "#555555", "italic": True, "indent": 1},
    "note": {"font_size": 9, "italic": True},
    "text": {"indent": 1},
    # Inputs: unlocked, pale green fill with a dashed border; calculations stay locked.
    "input": {
        "locked": False,
        "bg_color": "#e3f1e0",
        "border": 3,
        "border_color": "#4f7f4a",
    },
    "calc": {"align": "right", "indent": 1},
    "result": {"bold": True, "top": 1, "bottom": 1, "align": "right", "indent": 1},
    "calc_text": {"align": "left", "indent": 1},
    "result_text": {"bold": True, "top": 1, "bottom": 1, "align": "left", "indent": 1},
    "th": {"bold": True, "text_wrap": True, "align": "center", "valign": "bottom", "top": 1},
    "th_unit": {"font_size": 8, "align": "center"},
    "th_clause": {
        "font_size": 8,
        "italic": True,
        "font_color": "#555555",
        "align": "center",
        "text_wrap": True,
        "bottom": 1,
    },
    "th_equation": {"font_size": 8, "italic": True, "align": "center", "text_wrap": True},
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
            props = {"font_name": FONT, **_props(style)}
            if number_format is not None:
                props["num_format"] = number_format
            self._made[key] = self._workbook.add_format(props)
        return self._made[key]


def _props(style: str) -> dict[str, Any]:
    return {"font_size": DEFAULT_FONT_PT, "text_wrap": True, "valign": "top", **_BASE[style]}


def font_of(style: str) -> tuple[float, bool]:
    """(font size in pt, bold) of `style`."""
    props = _props(style)
    return float(props["font_size"]), bool(props.get("bold", False))
