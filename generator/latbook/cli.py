"""Command line: parse options, call the library, print problems, set the exit code.

Exit codes (latbook.exit_codes): 0 done; 1 a check failed (verify) or changes found
(diff); 2 bad input or usage, nothing written; 3 the environment failed (output not
writable, disk full, LibreOffice missing, stdout closed), nothing written; 130 interrupted
(Ctrl-C); 143 terminated (SIGTERM).
"""

from __future__ import annotations

import argparse
import contextlib
import json
import os
import signal
import sys
from collections.abc import Iterator, Sequence
from pathlib import Path

from latbook import __version__
from latbook.cli_diff import DIFF_COMMANDS, add_diff_command
from latbook.cli_workbook import WORKBOOK_COMMANDS, add_workbook_commands, output_error
from latbook.exit_codes import (
    EXIT_BAD_INPUT,
    EXIT_ENVIRONMENT,
    EXIT_FAILED,
    EXIT_INTERRUPTED,
    EXIT_OK,
    EXIT_TERMINATED,
)
from latbook.problems import Problem, SpecError
from latbook.workbook.cautions import CAUTION_SHORT

__all__ = ["EXIT_BAD_INPUT", "EXIT_ENVIRONMENT", "EXIT_FAILED", "EXIT_OK", "main"]

MAX_PROBLEMS_LISTED = 50
"""Problems printed in full; the rest are counted (a hostile spec can have millions)."""


class Terminated(BaseException):
    """SIGTERM arrived: unwinds like Ctrl-C so every temp file is removed on the way out."""


def _parser() -> argparse.ArgumentParser:
    p = argparse.ArgumentParser(
        prog="latbook",
        description="Lateral-force calc workbooks with live formulas from a JSON spec. "
        + CAUTION_SHORT,
        epilog="Exit codes: 0 done, 1 a check failed or changes found, 2 bad input "
        "(nothing written), 3 environment failure (nothing written), 130 interrupted, "
        "143 terminated.",
    )
    p.add_argument("--version", action="version", version=f"latbook {__version__}")
    sub = p.add_subparsers(dest="command", required=True)

    b = sub.add_parser("build", help="validate a spec and write its workbook")
    b.add_argument("spec", type=Path)
    b.add_argument("-o", "--output", type=Path, required=True, help="the .xlsx to write")
    b.add_argument("--no-protect", action="store_true", help="leave sheets unprotected")

    v = sub.add_parser("validate", help="check a spec and list every problem")
    v.add_argument("spec", type=Path)

    sub.add_parser("schema", help="print the spec's JSON Schema")

    r = sub.add_parser("results", help="the engine's quantities for a spec, by id")
    r.add_argument("spec", type=Path)
    r.add_argument("--json", action="store_true", help="JSON output (default: id = value)")
    add_workbook_commands(sub)
    add_diff_command(sub)
    return p


def main(argv: Sequence[str] | None = None) -> int:
    try:
        with _sigterm_unwinds():
            args = _parser().parse_args(argv)
            try:
                return COMMANDS[args.command](args)
            except SpecError as exc:
                print_problems(exc.problems)
                return EXIT_BAD_INPUT
            except MemoryError:
                print("latbook: out of memory; nothing was written", file=sys.stderr)
                return EXIT_ENVIRONMENT
            except BrokenPipeError:  # the reader of stdout went away (`| head`)
                os.dup2(os.open(os.devnull, os.O_WRONLY), sys.stdout.fileno())
                return EXIT_ENVIRONMENT
    except KeyboardInterrupt:
        print("latbook: interrupted; nothing was written", file=sys.stderr)
        return EXIT_INTERRUPTED
    except Terminated:
        print("latbook: terminated; nothing was written", file=sys.stderr)
        return EXIT_TERMINATED


@contextlib.contextmanager
def _sigterm_unwinds() -> Iterator[None]:
    """While a command runs, SIGTERM raises Terminated (outside the main thread: no-op)."""

    def _raise(signum, frame):
        raise Terminated

    try:
        previous = signal.signal(signal.SIGTERM, _raise)
    except ValueError:  # not the main thread
        yield
        return
    try:
        yield
    finally:
        signal.signal(signal.SIGTERM, previous)


def print_problems(problems: Sequence[Problem], limit: int = MAX_PROBLEMS_LISTED) -> None:
    """The first `limit` problems and a count of the rest, on stderr."""
    print(
        f"latbook: the spec has {len(problems)} problem(s); nothing was written:", file=sys.stderr
    )
    for problem in problems[:limit]:
        print(f"  {problem}", file=sys.stderr)
    if len(problems) > limit:
        print(f"  ... and {len(problems) - limit} more problem(s) not listed", file=sys.stderr)


def _cmd_build(args: argparse.Namespace) -> int:
    from latbook.build import build_workbook
    from latbook.spec.load import load_json

    out: Path = args.output
    if out.suffix.lower() != ".xlsx":
        raise SpecError([Problem("-o", "output", "the output file must end in .xlsx")])
    try:
        if not out.parent.is_dir():
            raise SpecError([Problem("-o", "output", f"folder {out.parent} does not exist")])
        if out.is_dir():
            raise SpecError([Problem("-o", "output", f"{out} is a folder, not a file")])
        data = load_json(args.spec)
        result = build_workbook(data, out, protect=not args.no_protect)
    except SpecError:
        raise
    except Exception as exc:
        reason = output_error(exc)
        if reason is None:
            raise
        print(f"latbook: cannot write {out}: {reason}; nothing was written", file=sys.stderr)
        return EXIT_ENVIRONMENT
    n_calc = len(result.registry.calcs())
    print(f"wrote {out} ({n_calc} calculated cells, spec SHA-256 {result.spec_sha256[:12]})")
    print(f"caution: {CAUTION_SHORT}")
    return EXIT_OK


def _cmd_validate(args: argparse.Namespace) -> int:
    from latbook.build import check_spec
    from latbook.spec.load import load_json

    check_spec(load_json(args.spec))
    print(f"{args.spec}: valid")
    return EXIT_OK


def _cmd_schema(args: argparse.Namespace) -> int:
    from latbook.spec.schema import schema_text

    sys.stdout.write(schema_text())
    return EXIT_OK


def _cmd_results(args: argparse.Namespace) -> int:
    from latbook.build import check_spec
    from latbook.spec.load import load_json

    spec, results = check_spec(load_json(args.spec))
    if args.json:
        print(json.dumps(results, indent=2, sort_keys=True))
        return EXIT_OK
    units = quantity_units(spec)
    for key in sorted(results):
        unit = units.get(key, "")
        print(f"{key} = {plain_value(results[key])}" + (f" {unit}" if unit else ""))
    return EXIT_OK


RESULT_DIGITS = 10
"""Significant digits `results` prints: enough for any engineering figure, none of the
binary noise of a float (0.45999999999999996 prints as 0.46)."""


def plain_value(value: object) -> str:
    """A result as an engineer reads it: floats to RESULT_DIGITS significant digits."""
    if isinstance(value, float):
        return f"{value:.{RESULT_DIGITS}g}"
    return str(value)


def quantity_units(spec) -> dict[str, str]:
    """Unit of every quantity the workbook shows, by quantity id (its layout's registry)."""
    from latbook.workbook.builder import layout

    _, registry = layout(spec)
    return {e.id: e.unit for e in registry.entries.values() if e.unit and e.unit != "-"}


COMMANDS = {
    "build": _cmd_build,
    "validate": _cmd_validate,
    "schema": _cmd_schema,
    "results": _cmd_results,
    **WORKBOOK_COMMANDS,
    **DIFF_COMMANDS,
}

if __name__ == "__main__":
    raise SystemExit(main())
