"""Straight-line interpolation in a tabulated row, held constant beyond its ends."""


def interpolate_clamped(
    x: float, breakpoints: tuple[float, ...], values: tuple[float, ...]
) -> float:
    """Value at x by straight-line interpolation between breakpoints, clamped at both ends."""
    if len(breakpoints) != len(values) or not breakpoints:
        raise ValueError("breakpoints and values must be non-empty and of equal length")
    if x <= breakpoints[0]:
        return values[0]
    if x >= breakpoints[-1]:
        return values[-1]
    for i in range(1, len(breakpoints)):
        x_hi = breakpoints[i]
        if x <= x_hi:
            x_lo, y_lo, y_hi = breakpoints[i - 1], values[i - 1], values[i]
            return y_lo + (y_hi - y_lo) * (x - x_lo) / (x_hi - x_lo)
    raise AssertionError("unreachable")  # pragma: no cover
