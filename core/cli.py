"""The ``asfound`` command line: one subcommand per module.

Each subcommand lives in its own module (``core.cmd_<name>``) with a ``register(sub)``
function that adds its parser and sets ``func`` (called with the parsed arguments and
returning the process exit code). Every subcommand takes ``-q/--quiet`` and ``-v/--verbose``.
Errors of asfound print one clear line and exit 2 (with ``--verbose``, also the chain of
causes); a reader that goes away (``asfound section FILE | head``) ends the command quietly.
The exit codes are in :mod:`core.console` and the README.
"""

from __future__ import annotations

import argparse
import importlib
import os
import sys
import traceback

from core import CAUTION, __version__
from core.console import EXIT_INPUT, EXIT_INTERRUPTED, EXIT_PIPE
from core.errors import AsfoundError

#: subcommand modules, in the order shown by --help
COMMANDS = ("section", "validate", "import", "export", "assess", "report", "trend", "merge")


def build_parser() -> argparse.ArgumentParser:
    parser = argparse.ArgumentParser(
        prog="asfound",
        description="Field inspection of corroded built-up steel members. " + CAUTION,
    )
    parser.add_argument("--version", action="version", version=f"asfound {__version__}")
    sub = parser.add_subparsers(dest="command", metavar="COMMAND")
    for name in COMMANDS:
        try:
            mod = importlib.import_module(f"core.cmd_{name}")
        except ModuleNotFoundError as e:
            if e.name == f"core.cmd_{name}":
                continue  # not built yet
            raise
        mod.register(sub)
    for p in sub.choices.values():
        loud = p.add_mutually_exclusive_group()
        loud.add_argument(
            "-q", "--quiet", action="store_true", help="only the results and the errors"
        )
        loud.add_argument(
            "-v", "--verbose", action="store_true", help="say more (every flag, error causes)"
        )
    return parser


def _pipe_closed() -> int:
    """The reader of stdout went away: no traceback, no second error at exit (the Python
    documentation's advice for SIGPIPE: point stdout at devnull)."""
    try:
        devnull = os.open(os.devnull, os.O_WRONLY)
        os.dup2(devnull, sys.stdout.fileno())
    except (OSError, ValueError, AttributeError):
        pass
    return EXIT_PIPE


def main(argv: list[str] | None = None) -> int:
    parser = build_parser()
    args = parser.parse_args(argv)
    if not getattr(args, "func", None):
        parser.print_help()
        return 2
    try:
        code = int(args.func(args) or 0)
        sys.stdout.flush()  # inside the try: a closed pipe shows here, not at exit
        return code
    except BrokenPipeError:
        return _pipe_closed()
    except AsfoundError as e:
        print(f"asfound: error: {e}", file=sys.stderr)
        if getattr(args, "verbose", False):
            traceback.print_exception(e, file=sys.stderr)
        return EXIT_INPUT
    except KeyboardInterrupt:
        return EXIT_INTERRUPTED


if __name__ == "__main__":
    sys.exit(main())
