"""Where a command may write, and how: the output guard and the atomic writer.

Every command that writes a file (``report``, its folder form, ``export``, ``import``) and
the library functions under them call :func:`check_output` before any work and write
through :func:`atomic_output`. The rules (also in the README's command table):

* never over one of the command's inputs (the same file: resolved paths and file identity,
  so a second name or a hard link is caught too), nor over a field store or its ``-wal``,
  ``-shm`` or ``-journal`` companion, nor over a survey file or a section description,
  nor over a folder;
* an earlier output of the same kind is replaced: a PDF that asfound wrote (its author is
  ``asfound``) by a new report, an exported survey file by a new export of the *same*
  survey (same survey id);
* any other existing file only with ``force`` (``--force``); a new store never replaces
  anything, ``force`` or not.

Outputs are written to a temporary file in the output's folder, flushed to disk (fsync),
given the mode the user's umask allows (not the temporary file's 0600) and renamed into
place, so a reader sees the old file or the new one, never a part.
"""

from __future__ import annotations

import json
import os
import re
import secrets
import time
from collections.abc import Iterator, Sequence
from contextlib import contextmanager, suppress
from dataclasses import dataclass
from pathlib import Path
from typing import Literal

from core.errors import AsfoundError, OutputError

OutputKind = Literal["pdf", "survey", "store"]

_SQLITE = b"SQLite format 3\x00"
_WAL = (b"\x37\x7f\x06\x82", b"\x37\x7f\x06\x83")
_COMPANIONS = ("-wal", "-shm", "-journal")
#: a temporary of :func:`atomic_output` older than this was left by a killed writer
STALE_TEMPORARY_S = 24 * 3600.0
_PDF_AUTHOR = b"/Author (asfound "
#: bytes of an existing file read to tell what it holds (a larger file counts as foreign)
_SNIFF_BYTES = 64 * 1024 * 1024

_WHAT = {"pdf": "the PDF report", "survey": "the survey file", "store": "the new field store"}


@dataclass(frozen=True)
class Existing:
    """What an existing path holds.

    ``kind``: "folder", "store", "store-companion", "survey", "section", "asfound-pdf",
    "pdf" or "other"; ``ident``: the survey id of a survey file (else "").
    """

    kind: str
    ident: str = ""

    @property
    def words(self) -> str:
        return {
            "folder": "a folder",
            "store": "a field store",
            "store-companion": "a field store's journal file",
            "survey": f"a survey file (survey {self.ident!r})" if self.ident else "a survey file",
            "section": "a section description",
            "asfound-pdf": "a PDF report written by asfound",
            "pdf": "a PDF that asfound did not write",
            "other": "a file that asfound did not write",
        }[self.kind]


def identify(path: str | Path) -> Existing | None:
    """What ``path`` holds, by its content (never its name alone); None when it is absent."""
    p = Path(path)
    if p.is_dir():
        return Existing("folder")
    if not p.exists():
        return None
    if _companion_of_store(p):
        return Existing("store-companion")
    try:
        with p.open("rb") as f:
            data = f.read(_SNIFF_BYTES + 1)
    except OSError:
        return Existing("other")
    if data.startswith(_SQLITE):
        return Existing("store")
    if data[:4] in _WAL:
        return Existing("store-companion")
    if data.startswith(b"%PDF-"):
        mine = len(data) <= _SNIFF_BYTES and _PDF_AUTHOR in data
        return Existing("asfound-pdf" if mine else "pdf")
    return _document_kind(data)


def _document_kind(data: bytes) -> Existing:
    try:
        doc = json.loads(data.decode("utf-8"))
    except (UnicodeDecodeError, ValueError, RecursionError):
        doc = None
    if isinstance(doc, dict):
        fmt = doc.get("format")
        if fmt == "asfound.survey":
            head = doc.get("survey")
            ident = head.get("id") if isinstance(head, dict) else None
            return Existing("survey", ident if isinstance(ident, str) else "")
        if fmt == "asfound.section":
            return Existing("section")
        return Existing("other")
    # a damaged or truncated asfound document is still somebody's survey
    if b'"asfound.survey"' in data:
        return Existing("survey")
    if b'"asfound.section"' in data:
        return Existing("section")
    return Existing("other")


def _companion_of_store(p: Path) -> bool:
    for suffix in _COMPANIONS:
        if p.name.endswith(suffix) and len(p.name) > len(suffix):
            base = p.with_name(p.name[: -len(suffix)])
            with suppress(OSError), base.open("rb") as f:
                if f.read(16) == _SQLITE:
                    return True
    return False


def same_file(a: str | Path, b: str | Path) -> bool:
    """True when ``a`` and ``b`` name the same file: equal resolved paths, or (both
    existing) the same device and inode (a hard link, a second spelling on a
    case-insensitive disk)."""
    pa, pb = Path(a), Path(b)
    with suppress(OSError, RuntimeError):
        if pa.resolve() == pb.resolve():
            return True
    with suppress(OSError):
        return os.path.samefile(pa, pb)
    return False


def _companion_of(out: Path, inp: Path) -> bool:
    """True when ``out`` names the -wal, -shm or -journal file of the store ``inp`` (which
    need not exist yet: SQLite makes it when the store is next opened)."""
    if not any(same_file(out, inp.with_name(inp.name + s)) for s in _COMPANIONS):
        return False
    with suppress(OSError), inp.open("rb") as f:
        return f.read(16) == _SQLITE
    return False


def check_output(
    out: str | Path,
    inputs: Sequence[str | Path],
    kind: OutputKind,
    *,
    force: bool = False,
    survey_id: str | None = None,
) -> Path:
    """Refuse an output path that would destroy an input, a store or a file of another kind.

    Args:
        out: the path the command is about to write.
        inputs: every file the command reads (a field store's companions are covered).
        kind: what the command writes: "pdf", "survey" (an exported survey file) or
            "store" (a new field store).
        force: also replace an existing file that is neither an input, a store, a
            survey file nor a section description (never for a store).
        survey_id: the id of the survey being exported (an earlier export of the same
            survey is replaced without ``force``).

    Returns:
        ``out`` as a Path.

    Raises:
        OutputError: naming the output, what it holds, and the input.
    """
    o = Path(out)
    src = ", ".join(str(i) for i in inputs) or "none"

    def refuse(why: str, hint: str = "choose another output path", named: bool = False):
        return OutputError(
            f"refusing to write {_WHAT[kind]} to {o}: {why}; {hint}"
            + ("" if named else f" (input: {src})")
            + "; nothing was written"
        )

    for inp in inputs:
        if same_file(o, inp):
            raise refuse(f"it is the input {inp}", named=True)
        if _companion_of(o, Path(inp)):
            raise refuse(f"it is the journal file of the input store {inp}", named=True)
    found = identify(o)
    if found is None:
        return o
    if kind == "store":
        raise refuse(f"it exists ({found.words})", "a new store never replaces a file")
    if found.kind in ("folder", "store", "store-companion", "section"):
        raise refuse(f"it is {found.words}")
    if found.kind == "survey":
        if kind == "survey" and survey_id is not None and found.ident == survey_id:
            return o  # an earlier export of the same survey
        raise refuse(f"it is {found.words}", "a survey file is never replaced by another")
    if kind == "pdf" and found.kind == "asfound-pdf":
        return o  # an earlier report
    if force:
        return o
    raise refuse(f"it is {found.words}", "add --force to replace it, or choose another output path")


def check_output_folder(folder: str | Path, inputs: Sequence[str | Path]) -> Path:
    """Refuse a folder for many outputs that exists as a file (or is an input).

    Raises:
        OutputError: naming the folder and what it holds.
    """
    f = Path(folder)
    found = identify(f)
    if found is not None and found.kind != "folder":
        src = ", ".join(str(i) for i in inputs) or "none"
        raise OutputError(
            f"refusing to write reports into {f}: it is {found.words}, not a folder "
            f"(input: {src}); nothing was written"
        )
    return f


def _umask() -> int:
    """The process's umask (read from /proc where it can be, without changing it)."""
    with suppress(OSError, ValueError), open("/proc/self/status", encoding="ascii") as f:
        for line in f:
            if line.startswith("Umask:"):
                return int(line.split()[1], 8)
    old = os.umask(0o022)
    os.umask(old)
    return old


def _fsync_path(path: Path) -> None:
    fd = os.open(path, os.O_RDONLY)
    try:
        os.fsync(fd)
    finally:
        os.close(fd)


def _fsync_folder(folder: Path) -> None:
    with suppress(OSError):  # not every platform can open a folder
        _fsync_path(folder)


@contextmanager
def atomic_output(out: str | Path, *, replace: bool = True) -> Iterator[Path]:
    """A temporary path beside ``out`` to write to; renamed onto ``out`` when the block ends
    without an error (after fsync and with the umask's mode), removed otherwise.

    ``replace=False`` never replaces an existing ``out`` (a new store): the file is
    linked into place, which fails when ``out`` appeared meanwhile.

    Raises:
        OutputError: ``replace`` is False and ``out`` exists, or the file cannot be
        written (no room, no permission, a file where a folder should be).
    """
    o = Path(out)
    folder = o.parent
    tmp = folder / f".{o.name}.{secrets.token_hex(6)}.tmp"
    try:
        folder.mkdir(parents=True, exist_ok=True)
        sweep_stale_temporaries(o)
        yield tmp
        if not tmp.exists():
            raise OSError(f"{tmp}: the temporary output was not written")
        os.chmod(tmp, 0o666 & ~_umask())
        _fsync_path(tmp)
        if replace:
            os.replace(tmp, o)
        else:
            _link_new(tmp, o)
        _fsync_folder(folder)
    except OSError as e:
        if isinstance(e, AsfoundError):
            raise
        raise OutputError(
            f"cannot write {o}: {e.strerror or e}; nothing was replaced", where=""
        ) from None
    finally:
        for extra in (tmp, *(tmp.with_name(tmp.name + s) for s in _COMPANIONS)):
            with suppress(OSError):
                extra.unlink(missing_ok=True)


def sweep_stale_temporaries(out: str | Path, older_than_s: float = STALE_TEMPORARY_S) -> int:
    """Remove the temporaries that a killed writer of ``out`` left beside it.

    Only names :func:`atomic_output` makes for this very output (``.<name>.<12 hex>.tmp``
    and its SQLite companions) and only those last changed more than ``older_than_s``
    ago, so a writer still at work is never touched. Returns how many were removed;
    a file that cannot be looked at or removed is left alone.
    """
    o = Path(out)
    pattern = re.compile(
        rf"\.{re.escape(o.name)}\.[0-9a-f]{{12}}\.tmp(?:{'|'.join(map(re.escape, _COMPANIONS))})?"
    )
    removed = 0
    try:
        names = [e for e in os.scandir(o.parent) if pattern.fullmatch(e.name)]
    except OSError:
        return 0
    now = time.time()
    for entry in names:
        with suppress(OSError):
            if entry.is_file(follow_symlinks=False) and (
                now - entry.stat(follow_symlinks=False).st_mtime > older_than_s
            ):
                os.unlink(entry.path)
                removed += 1
    return removed


def _link_new(tmp: Path, o: Path) -> None:
    """Put ``tmp`` at ``o`` only if nothing is there (a hard link fails on an existing name)."""
    try:
        os.link(tmp, o)
    except FileExistsError:
        raise OutputError(
            f"refusing to write to {o}: a file of that name appeared meanwhile; "
            "nothing was replaced"
        ) from None
    except OSError:  # no hard links on this file system: rename, checked just before
        if o.exists():
            raise OutputError(
                f"refusing to write to {o}: a file of that name appeared meanwhile"
            ) from None
        os.rename(tmp, o)


def write_atomic(out: str | Path, data: bytes) -> Path:
    """Write ``data`` to ``out`` through :func:`atomic_output`."""
    with atomic_output(out) as tmp:
        tmp.write_bytes(data)
    return Path(out)
