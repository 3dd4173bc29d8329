"""The independent calculation engine: plain functions, one per published equation.

The engine never reads templates_src/ or the workbook; the tests compare the two paths.
"""
