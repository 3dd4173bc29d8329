"""Problems with a user's input, as data: where (JSON path), which rule, what to do."""

from __future__ import annotations

from collections.abc import Iterable, Sequence
from dataclasses import dataclass


@dataclass(frozen=True)
class Problem:
    """One violated rule at one place in the spec."""

    path: str
    rule: str
    message: str

    def __str__(self) -> str:
        return f"{self.path}: {self.message} [{self.rule}]"


class SpecError(Exception):
    """Raised with every problem found, so the user can fix them all in one pass."""

    def __init__(self, problems: Sequence[Problem]):
        self.problems = list(problems)
        super().__init__("\n".join(str(p) for p in self.problems))


def json_path(parts: Iterable[str | int]) -> str:
    """`("building", "levels", 2, "elevation_ft")` -> `$.building.levels[2].elevation_ft`."""
    out = "$"
    for part in parts:
        out += f"[{part}]" if isinstance(part, int) else f".{part}"
    return out
