"""ASCE 7-16 Minimum Design Loads: one module per clause group."""
