"""Value checks shared by spec fields: text a workbook can store, numbers that are not booleans."""

from __future__ import annotations

import re
from typing import Any

# Characters an .xlsx cell cannot hold as written: C0 controls other than tab and line feed
# (the writer stores them as _xHHHH_ escapes that readers do not decode; a carriage return
# included), the XML noncharacters U+FFFE and U+FFFF, and lone surrogates (not UTF-8).
_UNSTORABLE = re.compile("[\x00-\x08\x0b-\x1f\ufffe\uffff\ud800-\udfff]")


def unstorable_character(text: str) -> str | None:
    """The first character of `text` a workbook cannot store, as U+XXXX, or None."""
    m = _UNSTORABLE.search(text)
    return None if m is None else f"U+{ord(m.group(0)):04X}"


def storable_text(text: str) -> str:
    """Pydantic check: refuse text with a character a workbook cannot store."""
    bad = unstorable_character(text)
    if bad is not None:
        raise ValueError(
            f"text holds the character {bad}, which a workbook cannot store "
            "(control characters other than tab and line feed, U+FFFE, U+FFFF); remove it"
        )
    return text


def not_a_boolean(value: Any) -> Any:
    """Pydantic check before a numeric literal: JSON true/false is not a number."""
    if isinstance(value, bool):
        raise ValueError("must be a number, not true or false")
    return value
