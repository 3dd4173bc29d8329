"""Series styles that read in black and white: each series of a chart differs from the
others by its dash style and marker (line and scatter charts) or its fill pattern (bar and
column charts), not by colour alone. Options are xlsxwriter `add_series` keys."""

from __future__ import annotations

from typing import Any

_INK = ("#000000", "#1F4E79", "#7F3F00", "#404040", "#385723", "#5B2C6F")
_DASHES = ("solid", "dash", "round_dot", "long_dash", "dash_dot", "long_dash_dot_dot")
_MARKERS = ("circle", "square", "triangle", "diamond", "x", "star")

LINE_CYCLE: list[dict[str, Any]] = [
    {
        "line": {"color": _INK[i], "width": 1.5, "dash_type": _DASHES[i]},
        "marker": {
            "type": _MARKERS[i],
            "size": 5,
            "border": {"color": _INK[i]},
            "fill": {"color": _INK[i] if i % 2 == 0 else "#FFFFFF"},
        },
    }
    for i in range(len(_DASHES))
]
"""Scatter and line charts: dash style, marker shape and marker fill all change."""

WALL_CYCLE: list[dict[str, Any]] = [
    {
        "line": {"color": _INK[i % len(_INK)], "width": width, "dash_type": dash},
        "marker": {"type": "none"},
    }
    for i, (dash, width) in enumerate(
        [
            ("solid", 4.0),
            ("dash", 4.0),
            ("round_dot", 4.0),
            ("solid", 2.0),
            ("long_dash", 2.0),
            ("dash_dot", 2.5),
            ("long_dash_dot_dot", 2.5),
            ("square_dot", 2.5),
        ]
    )
]
"""Shear walls on a key plan, one style per assembly: heavy lines, dash style and weight
change (hold-downs are a marker series of their own). Repeats after eight assemblies."""

BAR_CYCLE: list[dict[str, Any]] = [
    {"fill": {"color": "#404040"}, "border": {"color": "#000000"}},
    {"fill": {"color": "#FFFFFF"}, "border": {"color": "#000000"}},
    {
        "pattern": {
            "pattern": "wide_upward_diagonal",
            "fg_color": "#000000",
            "bg_color": "#FFFFFF",
        },
        "border": {"color": "#000000"},
    },
    {
        "pattern": {"pattern": "small_grid", "fg_color": "#000000", "bg_color": "#FFFFFF"},
        "border": {"color": "#000000"},
    },
]
"""Bar and column charts: dark, white, hatched, gridded fills with black borders."""

CYCLES = {"line": LINE_CYCLE, "walls": WALL_CYCLE, "bar": BAR_CYCLE}


def series_style(chart_type: str, cycle: str | None, n: int) -> dict[str, Any]:
    """Style of the `n`-th series of a chart with no style of its own."""
    name = cycle or ("bar" if chart_type in ("bar", "column") else "line")
    styles = CYCLES[name]
    return styles[n % len(styles)]
