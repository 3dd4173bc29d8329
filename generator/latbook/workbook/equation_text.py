"""The printed equation of a calculation row, in symbols and with its values substituted.

Each scalar calculation row gets a live text formula beside its value, so the printed sheet
reads like a hand calc::

    Cs = SDS / (R / Ie) = 0.896 / (6.500 / 1.000) = 0.1378

An equation is a list of parts: literal text and `ValueRef`s (a cell shown through
TEXT(ref, fmt) in the referenced cell's own number format). The same parts give the formula
(`formula_pattern`) and, from the engine's results, the cached text (`cached_text`), so the
two cannot drift apart.

Where a row's formula is arithmetic (defined names, quantity and single-cell table
references, numbers, + - * / ^, MIN MAX SQRT ABS EXP LN LOG10) the equation is generated
(`auto_equation`). A formula over a range (MAX of a column, SUM of a column) shows the
symbols and the result only. Look-ups, IFs and text are described by the template's own
`equation` key (`parse_override`): the right-hand side with `[ref]` or `[ref|fmt]`
placeholders, where ref is a defined name, `q:quantity.id` or a single-cell table reference
such as `tbl.field@ctx` or `last:tbl.field`.
"""

from __future__ import annotations

import re
from collections.abc import Callable, Sequence
from dataclasses import dataclass
from decimal import ROUND_HALF_UP, Decimal
from typing import Any

#: Number formats an equation may print with; TEXT is allowed with these only
#: (workbook_functions.TEXT_FORMATS keeps the list the engines were checked with).
EQUATION_FORMATS = ("0", "0.0", "0.00", "0.000", "0.0000")
DEFAULT_FORMAT = "0.000"
MAX_FORMULA_CHARS = 200


@dataclass(frozen=True)
class ValueRef:
    """A cell whose current value is printed: `ref` is a formula-pattern reference (a
    defined name, `{q:id}`, `{tbl.field@ctx}`...), `qid` the quantity it holds."""

    ref: str
    qid: str
    fmt: str


Part = str | ValueRef


@dataclass(frozen=True)
class Operand:
    """What the renderer knows of one reference: its symbol and the quantity it holds
    (None for a range: shown in symbols only)."""

    symbol: str
    qid: str | None
    fmt: str


Resolver = Callable[[str], "Operand | None"]

_TOKEN = re.compile(
    r"""\s*(?:
    (?P<ref>\{[^{}]+\})
  | (?P<func>[A-Za-z_][A-Za-z0-9_.]*)\s*\(
  | (?P<name>[A-Za-z_][A-Za-z0-9_.]*)
  | (?P<num>\d+(?:\.\d*)?(?:[eE][-+]?\d+)?|\.\d+)
  | (?P<op>[-+*/^(),])
  | (?P<other>.)
    )""",
    re.VERBOSE,
)

FUNCTION_TEXT = {
    "MIN": "min",
    "MAX": "max",
    "SQRT": "√",
    "ABS": "abs",
    "EXP": "exp",
    "LN": "ln",
    "LOG10": "log",
    "SUM": "Σ",
}
RANGE_OPS = ("col:", "upto:")
_OP_TEXT = {"*": "·", "/": " / ", "+": " + ", "-": " - ", "^": "^", ",": ", "}


@dataclass(frozen=True)
class Rendering:
    """An arithmetic formula in symbols and with values; `values` is None when a range
    makes a substitution meaningless."""

    symbols: str
    values: tuple[Part, ...] | None
    single: bool  # the formula is one reference (an alias of another cell)


def render_arithmetic(pattern: str, resolve: Resolver) -> Rendering | None:
    """`pattern` (ctx already substituted, leading "=") in symbols and values, or None when
    it is not plain arithmetic."""
    text = pattern[1:] if pattern.startswith("=") else pattern
    symbols: list[str] = []
    values: list[Part] = []
    substitutable = True
    refs = 0
    tokens = 0
    prev: str | None = None  # kind of the previous token, for unary minus
    for m in _TOKEN.finditer(text):
        kind = m.lastgroup
        if kind is None:
            continue
        tokens += 1
        tok = m.group(kind)
        if kind == "other":
            return None
        if kind == "func":
            name = tok.upper()
            if name not in FUNCTION_TEXT:
                return None
            word = FUNCTION_TEXT[name] + "("
            symbols.append(word)
            values.append(word)
        elif kind in ("name", "ref"):
            operand = resolve(tok)
            if operand is None:
                return None
            refs += 1
            symbols.append(operand.symbol)
            if operand.qid is None:
                substitutable = False
            else:
                values.append(ValueRef(tok, operand.qid, operand.fmt))
        elif kind == "num":
            symbols.append(tok)
            values.append(tok)
        else:
            unary = tok == "-" and prev in (None, "op_open")
            word = "-" if unary else _OP_TEXT.get(tok, tok)
            symbols.append(word)
            values.append(word)
            kind = "op_open" if tok in "(,+-*/^" else "op_close"
        prev = kind
    if refs == 0:
        return None
    single = tokens == 1
    merged = tuple(_tidy(p) if isinstance(p, str) else p for p in _merge(values))
    shown = merged if substitutable and not single else None
    return Rendering(_tidy("".join(symbols)), shown, single)


_NUMBER_RATIO = re.compile(r"(?<![\w.])(\d+) / (\d+)(?![\w.])")


def _tidy(text: str) -> str:
    """A ratio of two whole numbers written as one ("2/3")."""
    return _NUMBER_RATIO.sub(r"\1/\2", text)


def _merge(parts: Sequence[Part]) -> tuple[Part, ...]:
    """Adjacent literal strings joined into one."""
    out: list[Part] = []
    for p in parts:
        if isinstance(p, str) and out and isinstance(out[-1], str):
            out[-1] += p
        else:
            out.append(p)
    return tuple(out)


_PLACEHOLDER = re.compile(r"\[([^\[\]|]+)(?:\|([^\[\]]+))?\]")


def parse_override(text: str, resolve: Resolver) -> tuple[Part, ...]:
    """A template's `equation` text as parts: `[ref]` prints ref in its own format,
    `[ref|fmt]` in `fmt`."""
    parts: list[Part] = []
    last = 0
    for m in _PLACEHOLDER.finditer(text):
        parts.append(text[last : m.start()])
        ref = m.group(1).strip()
        pattern = ref if re.fullmatch(r"[A-Za-z_][A-Za-z0-9_]*", ref) else "{" + ref + "}"
        operand = resolve(pattern)
        if operand is None or operand.qid is None:
            raise ValueError(f"equation placeholder '[{ref}]' is not a single quantity: {text}")
        fmt = m.group(2) or operand.fmt
        if fmt not in EQUATION_FORMATS:
            raise ValueError(f"equation format '{fmt}' is not one of {EQUATION_FORMATS}: {text}")
        parts.append(ValueRef(pattern, operand.qid, fmt))
        last = m.end()
    parts.append(text[last:])
    return _merge([p for p in parts if p != ""])


def equation_lines(
    head: str, rendering: Rendering | None, override: tuple[Part, ...] | None, result: ValueRef
) -> list[tuple[Part, ...]]:
    """Candidate equations of one row, longest first; the caller keeps the first whose
    formula is short enough. `head` is the row's symbol ("" for none)."""
    lead: tuple[Part, ...] = (f"{head} = ",) if head else ()
    tail: tuple[Part, ...] = (" = ", result)
    if override is not None:
        return [
            _merge([*lead, *override, *tail]),
            _merge([*lead, *_literals_only(override), *tail]),
            _merge([*lead, result]),
        ]
    if rendering is None:
        return [_merge([*lead, result])] if head else []
    if rendering.single:
        same = rendering.symbols == head
        return [_merge([*lead, result] if same else [*lead, rendering.symbols, *tail])]
    lines = []
    if rendering.values is not None:
        lines.append(_merge([*lead, rendering.symbols, " = ", *rendering.values, *tail]))
        lines.append(_merge([*lead, *rendering.values, *tail]))
    lines.append(_merge([*lead, rendering.symbols, *tail]))
    lines.append(_merge([*lead, result]))
    return lines


def _literals_only(parts: Sequence[Part]) -> list[Part]:
    return [p if isinstance(p, str) else "…" for p in parts]


def formula_pattern(parts: Sequence[Part]) -> str:
    """The text formula (a pattern for `formula.render`) that prints `parts`."""
    pieces = []
    for p in parts:
        if isinstance(p, ValueRef):
            pieces.append(f'TEXT({p.ref},"{p.fmt}")')
        else:
            pieces.append('"' + _literal(p).replace('"', '""') + '"')
    return "=" + "&".join(pieces)


def _literal(text: str) -> str:
    """Literal text safe inside a formula pattern: no `{}` (references) or `<>` around a
    word (row context)."""
    return text.replace("{", "(").replace("}", ")").replace("<", "‹").replace(">", "›")


def cached_text(parts: Sequence[Part], value_of: Callable[[str], Any]) -> str:
    """The text the formula of `parts` gives, from the values of the quantities."""
    out = []
    for p in parts:
        out.append(text_value(value_of(p.qid), p.fmt) if isinstance(p, ValueRef) else _literal(p))
    return "".join(out)


def text_value(value: Any, fmt: str) -> str:
    """TEXT(value, fmt) as LibreOffice gives it: text unchanged, a number rounded half away
    from zero on its shortest decimal value (1.005 -> "1.01", 0.125 -> "0.13"), never "-0.00".
    (The `formulas` package rounds the binary value half to even instead: "1.00", "0.12".)"""
    if isinstance(value, bool):
        return "TRUE" if value else "FALSE"
    if isinstance(value, str):
        return value
    if fmt not in EQUATION_FORMATS:
        raise ValueError(f"unsupported equation format {fmt!r}")
    places = len(fmt) - 2 if "." in fmt else 0
    exact = Decimal(repr(float(value)))
    rounded = exact.quantize(Decimal(1).scaleb(-places), rounding=ROUND_HALF_UP)
    if rounded == 0:
        rounded = abs(rounded)
    return f"{rounded:.{places}f}"
