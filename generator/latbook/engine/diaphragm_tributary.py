"""Flexible diaphragm as a chain of simple spans between resisting wall lines.

Flexible-diaphragm (tributary) distribution, ASCE 7-16 §12.3.1.1 / SDPWS-2015 §4.2.5: each
span between two consecutive wall lines is a simply supported deep beam under a uniform load
w (plf); an overhang past the outermost line is a cantilever bearing on that line. The sheathing
carries the shear (unit shear v = V/b, SDPWS-2015 §4.2), the chords carry the moment (T = C = M/b).

Positions are in feet along the diaphragm, measured perpendicular to the wall lines.
Sign conventions of `span_diagram` and the point helpers (beam convention, x increasing):
V = dM/dx, dV/dx = -w; sagging moment in a simple span is positive, the moment in a
cantilever (hogging) is negative. `span_max_moment_lbft` returns the magnitude.
"""

from dataclasses import dataclass
from typing import Literal

SpanKind = Literal["simple", "cantilever"]

_POSITION_TOLERANCE_FT = 1e-9


@dataclass(frozen=True)
class Span:
    """One diaphragm span: "simple" between two lines, or "cantilever" from an edge to a line.

    line_indices are indices into the sorted line positions; a simple span bears on
    (left, right), a cantilever on the single line it overhangs. free_edge says which end of a
    cantilever is the unsupported diaphragm edge ("start" or "end"); None for a simple span.
    """

    kind: SpanKind
    start_ft: float
    end_ft: float
    line_indices: tuple[int, ...]
    free_edge: Literal["start", "end"] | None = None

    @property
    def length_ft(self) -> float:
        """Span length [ft]."""
        return self.end_ft - self.start_ft


def _validate_lines(
    line_positions_ft: list[float], extent_start_ft: float, extent_end_ft: float
) -> None:
    if extent_end_ft <= extent_start_ft:
        raise ValueError("diaphragm extent must have end > start")
    if not line_positions_ft:
        raise ValueError("a diaphragm needs at least one resisting wall line")
    for a, b in zip(line_positions_ft, line_positions_ft[1:], strict=False):
        if b - a <= _POSITION_TOLERANCE_FT:
            raise ValueError("line positions must be sorted and distinct")
    lo, hi = line_positions_ft[0], line_positions_ft[-1]
    if lo < extent_start_ft - _POSITION_TOLERANCE_FT or hi > extent_end_ft + _POSITION_TOLERANCE_FT:
        raise ValueError("every wall line must lie within the diaphragm extent")


def spans(
    line_positions_ft: list[float], extent_start_ft: float, extent_end_ft: float
) -> list[Span]:
    """Spans of a flexible diaphragm between sorted wall lines, ASCE 7-16 §12.3.1.1 [ft].

    Returns, in order: a cantilever from the start edge to the first line (if the first line
    is not at the edge), one simple span per pair of consecutive lines, and a cantilever from
    the last line to the end edge (if any).
    """
    _validate_lines(line_positions_ft, extent_start_ft, extent_end_ft)
    result: list[Span] = []
    first, last = line_positions_ft[0], line_positions_ft[-1]
    n = len(line_positions_ft)
    if first - extent_start_ft > _POSITION_TOLERANCE_FT:
        result.append(Span("cantilever", extent_start_ft, first, (0,), free_edge="start"))
    for i in range(n - 1):
        result.append(Span("simple", line_positions_ft[i], line_positions_ft[i + 1], (i, i + 1)))
    if extent_end_ft - last > _POSITION_TOLERANCE_FT:
        result.append(Span("cantilever", last, extent_end_ft, (n - 1,), free_edge="end"))
    return result


def span_reactions(w_plf: float, span: Span) -> tuple[float, float]:
    """Reactions (at start_ft, at end_ft) of one span under uniform w: simple wL/2 each,
    cantilever wL at its supported end and 0 at the free edge (statics) [lb]."""
    total_lb = w_plf * span.length_ft
    if span.kind == "simple":
        return (total_lb / 2.0, total_lb / 2.0)
    if span.free_edge == "start":
        return (0.0, total_lb)
    return (total_lb, 0.0)


def line_reactions(
    w_plf: float, line_positions_ft: list[float], extent_start_ft: float, extent_end_ft: float
) -> list[float]:
    """Total diaphragm reaction delivered to each wall line (flexible, tributary),
    ASCE 7-16 §12.3.1.1 [lb], in the order of line_positions_ft."""
    totals = [0.0] * len(line_positions_ft)
    for span in spans(line_positions_ft, extent_start_ft, extent_end_ft):
        r_start, r_end = span_reactions(w_plf, span)
        if span.kind == "simple":
            left, right = span.line_indices
            totals[left] += r_start
            totals[right] += r_end
        else:
            (line,) = span.line_indices
            totals[line] += r_start + r_end
    return totals


def span_max_moment_lbft(w_plf: float, span: Span) -> float:
    """Maximum moment magnitude: wL^2/8 at midspan (simple), wL^2/2 at the support
    (cantilever), statics of a uniformly loaded beam [lb-ft]."""
    length_ft = span.length_ft
    if span.kind == "simple":
        return w_plf * length_ft**2 / 8.0
    return w_plf * length_ft**2 / 2.0


def diaphragm_unit_shear_plf(R_lb: float, depth_ft: float) -> float:
    """Diaphragm unit shear v = R/b at a support of depth b, SDPWS-2015 §4.2 [plf]."""
    if depth_ft <= 0:
        raise ValueError("diaphragm depth must be positive")
    return R_lb / depth_ft


def span_max_unit_shear_plf(w_plf: float, span: Span, depth_ft: float) -> float:
    """Largest unit shear in a span, at its support: (wL/2)/b simple, wL/b cantilever,
    SDPWS-2015 §4.2 [plf]."""
    return diaphragm_unit_shear_plf(max(span_reactions(w_plf, span)), depth_ft)


def chord_force_lb(M_lbft: float, chord_spacing_ft: float) -> float:
    """Chord force T = C = M/b from the diaphragm moment, SDPWS-2015 §4.2 (deep-beam model) [lb]."""
    if chord_spacing_ft <= 0:
        raise ValueError("chord spacing must be positive")
    return M_lbft / chord_spacing_ft


def _local_position_ft(span: Span, x_ft: float) -> float:
    xi = x_ft - span.start_ft
    if xi < -_POSITION_TOLERANCE_FT or xi > span.length_ft + _POSITION_TOLERANCE_FT:
        raise ValueError("x_ft lies outside the span")
    return min(max(xi, 0.0), span.length_ft)


def span_shear_at_lb(w_plf: float, span: Span, x_ft: float) -> float:
    """Diaphragm shear V(x) in a span under uniform w, beam convention (module doc) [lb]."""
    xi = _local_position_ft(span, x_ft)
    length_ft = span.length_ft
    if span.kind == "simple":
        return w_plf * (length_ft / 2.0 - xi)
    if span.free_edge == "start":
        return -w_plf * xi
    return w_plf * (length_ft - xi)


def span_moment_at_lbft(w_plf: float, span: Span, x_ft: float) -> float:
    """Diaphragm moment M(x) in a span under uniform w; cantilevers negative, statics
    (sign convention in the module doc) [lb-ft]."""
    xi = _local_position_ft(span, x_ft)
    length_ft = span.length_ft
    if span.kind == "simple":
        return w_plf * xi * (length_ft - xi) / 2.0
    if span.free_edge == "start":
        return -w_plf * xi**2 / 2.0
    return -w_plf * (length_ft - xi) ** 2 / 2.0


def span_diagram(
    w_plf: float, span: Span, n_points: int = 11
) -> tuple[list[float], list[float], list[float]]:
    """Shear and moment diagram points for charting: (x_ft, V_lb, M_lbft) at n_points evenly
    spaced positions from start_ft to end_ft (x in diaphragm coordinates), statics."""
    if n_points < 2:
        raise ValueError("n_points must be at least 2")
    step_ft = span.length_ft / (n_points - 1)
    xs = [span.start_ft + i * step_ft for i in range(n_points)]
    xs[-1] = span.end_ft
    shears = [span_shear_at_lb(w_plf, span, x) for x in xs]
    moments = [span_moment_at_lbft(w_plf, span, x) for x in xs]
    return xs, shears, moments
