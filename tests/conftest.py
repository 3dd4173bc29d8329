"""Shared pytest fixtures. Each fixture group lives in its own section below."""

from __future__ import annotations

import os

import pytest

from latbook.recalc import find_soffice


def pytest_configure(config: pytest.Config) -> None:
    config.addinivalue_line(
        "markers", "libreoffice: recomputes a workbook with LibreOffice headless (soffice)"
    )


# --- Real spreadsheet engines (LibreOffice) ---------------------------------------------

SOFFICE_MISSING_REASON = "LibreOffice (soffice) not installed: real-engine tests skipped"


@pytest.fixture(scope="session")
def soffice() -> str:
    """Path of soffice. Skips when it is missing, except on CI (CI=true), where it fails."""
    path = find_soffice()
    if path is None:
        if os.environ.get("CI") == "true":
            pytest.fail(f"{SOFFICE_MISSING_REASON} -- CI must run them")
        pytest.skip(SOFFICE_MISSING_REASON)
    return path
