"""Axes and size of a key-plan chart with equal x and y scales (layout only).

A chart's axes cannot follow a cell, so the frame is fixed when the workbook is built, from
the plan extents of the spec: both axes get the same grid step, and the plot area's inner
size in pixels is in the proportion of the axis spans (xlsxwriter's manual plot layout is
the inner plot area). An edited plan dimension moves the drawing, not the axes.
"""

from __future__ import annotations

import math
from typing import Any

MAX_WIDTH_PX = 640  # inside the print grid's 689 Excel pixels (builder.CHART_WIDTH_PX)
MAX_HEIGHT_PX = 540  # with the sheet's title rows, within a landscape page (484 pt)
MAX_INNER_HEIGHT_PX = 420  # with titles, axis and legend: within a landscape page (484 pt)
MIN_WIDTH_PX = 420
MARGIN_LEFT_PX, MARGIN_RIGHT_PX, MARGIN_TOP_PX = 70, 30, 44
AXIS_BELOW_PX = 56  # x tick labels and the x axis title
LEGEND_ROW_PX, LEGEND_ENTRY_PX = 20, 230


def nice_step(span: float) -> float:
    """A 1-2-5 grid step giving about six divisions of `span`."""
    raw = span / 6.0
    power = 10.0 ** math.floor(math.log10(raw))
    for mult in (1.0, 2.0, 5.0, 10.0):
        if raw <= mult * power:
            return mult * power
    return 10.0 * power


def plan_frame(plan: dict[str, float], legend_entries: int) -> dict[str, Any]:
    """Axis bounds, chart size (px) and inner plot layout (fractions) for a plan
    {x_min_ft, x_max_ft, y_min_ft, y_max_ft}."""
    x0, x1, y0, y1 = (plan[k] for k in ("x_min_ft", "x_max_ft", "y_min_ft", "y_max_ft"))
    span = max(x1 - x0, y1 - y0)
    step = nice_step(span)
    pad = 0.06 * span  # room for the wall-line names left of the lines' starts
    lo_x, hi_x = math.floor((x0 - pad) / step) * step, math.ceil((x1 + pad * 0.5) / step) * step
    lo_y, hi_y = math.floor((y0 - pad) / step) * step, math.ceil((y1 + pad * 0.5) / step) * step
    inner_w_max = MAX_WIDTH_PX - MARGIN_LEFT_PX - MARGIN_RIGHT_PX
    # the whole chart stays on one page under the sheet's title: the legend's rows (at the
    # narrowest width, the most rows) come out of the plot's height
    worst_rows = -(-legend_entries // max(1, (MIN_WIDTH_PX - 40) // LEGEND_ENTRY_PX))
    inner_h_max = min(
        MAX_INNER_HEIGHT_PX,
        MAX_HEIGHT_PX - MARGIN_TOP_PX - AXIS_BELOW_PX - LEGEND_ROW_PX * worst_rows - 16,
    )
    px_per_ft = min(inner_w_max / (hi_x - lo_x), inner_h_max / (hi_y - lo_y))
    inner_w, inner_h = (hi_x - lo_x) * px_per_ft, (hi_y - lo_y) * px_per_ft
    width = max(MIN_WIDTH_PX, round(inner_w + MARGIN_LEFT_PX + MARGIN_RIGHT_PX))
    per_row = max(1, (width - 40) // LEGEND_ENTRY_PX)
    legend_px = LEGEND_ROW_PX * (-(-legend_entries // per_row)) + 16
    height = round(MARGIN_TOP_PX + inner_h + AXIS_BELOW_PX + legend_px)
    left = MARGIN_LEFT_PX + (width - MARGIN_LEFT_PX - MARGIN_RIGHT_PX - inner_w) / 2
    return {
        "x_axis": {"min": lo_x, "max": hi_x, "major_unit": step},
        "y_axis": {"min": lo_y, "max": hi_y, "major_unit": step},
        "width": width,
        "height": height,
        "layout": {
            "x": left / width,
            "y": MARGIN_TOP_PX / height,
            "width": inner_w / width,
            "height": inner_h / height,
        },
    }
