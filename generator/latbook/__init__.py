"""latbook: lateral-force calc workbooks with live formulas, from a JSON building spec."""

__version__ = "0.1.0"
