"""Subcommand `diff OLD NEW`: parse options, compare, print, set the exit code.

Exit codes as in `latbook.exit_codes`: 0 nothing changed; 1 changes found; 2 a side cannot
be read or is not a valid spec (its problems listed), or a wrong option.
"""

from __future__ import annotations

import argparse
import json
import math
import sys
from pathlib import Path

from latbook.exit_codes import EXIT_BAD_INPUT, EXIT_FAILED, EXIT_OK
from latbook.problems import SpecError

MAX_PROBLEMS_LISTED = 50


def add_diff_command(sub: argparse._SubParsersAction) -> None:
    """Register `diff` on the main parser's subcommands."""
    from latbook.diff import ABS_TOL, REL_TOL

    d = sub.add_parser(
        "diff",
        help="compare two specs or workbooks: inputs, moved results, checks crossing 1.0",
    )
    d.add_argument("old", type=Path, help="the earlier spec (.json) or workbook (.xlsx)")
    d.add_argument("new", type=Path, help="the later spec (.json) or workbook (.xlsx)")
    d.add_argument("--json", action="store_true", help="machine-readable report")
    d.add_argument(
        "--rel-tol",
        type=_tolerance,
        default=REL_TOL,
        help=f"a result moved when it changed by more than this fraction (default {REL_TOL:g})",
    )
    d.add_argument(
        "--abs-tol",
        type=_tolerance,
        default=ABS_TOL,
        help=f"... and by more than this amount (default {ABS_TOL:g})",
    )


def _tolerance(text: str) -> float:
    try:
        value = float(text)
    except ValueError:
        raise argparse.ArgumentTypeError(f"{text!r} is not a number") from None
    if not math.isfinite(value) or value < 0:
        raise argparse.ArgumentTypeError(f"{text!r} must be a finite number >= 0")
    return value


def cmd_diff(args: argparse.Namespace) -> int:
    from latbook.diff import diff_sides
    from latbook.diff_report import diff_as_dict, diff_text
    from latbook.diff_sides import load_side

    sides = []
    for role, path in (("old", args.old), ("new", args.new)):
        try:
            sides.append(load_side(path))
        except SpecError as exc:
            _print_problems(role, path, exc)
            return EXIT_BAD_INPUT
    d = diff_sides(*sides, rel_tol=args.rel_tol, abs_tol=args.abs_tol)
    print(json.dumps(diff_as_dict(d), indent=2, ensure_ascii=False) if args.json else diff_text(d))
    return EXIT_FAILED if d.changed else EXIT_OK


def _print_problems(role: str, path: Path, exc: SpecError) -> None:
    problems = exc.problems
    print(
        f"latbook diff: {role} side {path} cannot be compared ({len(problems)} problem(s)):",
        file=sys.stderr,
    )
    for problem in problems[:MAX_PROBLEMS_LISTED]:
        print(f"  {problem}", file=sys.stderr)
    if len(problems) > MAX_PROBLEMS_LISTED:
        rest = len(problems) - MAX_PROBLEMS_LISTED
        print(f"  ... and {rest} more problem(s) not listed", file=sys.stderr)


DIFF_COMMANDS = {"diff": cmd_diff}
