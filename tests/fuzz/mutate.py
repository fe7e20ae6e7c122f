"""Mutations of JSON documents for the fuzz tests, as hypothesis strategies.

A case is a list of mutations applied to a parsed document (a sample survey or a section
description). Some mostly keep the document valid, so that assessment and report run on
them: scale a number by a plausible factor, put long or markup text in a free-text field,
repeat an item under new ids. Others mostly break it: replace a number by an extreme or
scaled one, a string by a long, markup or unit-like one, a value by one of another type;
delete a key or an item; repeat an item as it is; copy one subtree over another; add an
unknown key. A few cases also damage the text
itself (truncation, a changed byte). Nodes are picked by index among the document's nodes of
the kind the mutation needs, so every part of a document can be reached.
"""

from __future__ import annotations

import copy
import json
from dataclasses import dataclass
from typing import Any

from hypothesis import strategies as st

#: numbers that have broken parsers and engines before (edges of float, huge integers)
EXTREME_NUMBERS: tuple[Any, ...] = (
    0,
    -0.0,
    -1,
    1e-9,
    1e-300,
    5e-324,
    1e300,
    1.7976931348623157e308,
    -1.7976931348623157e308,
    2**63,
    10**400,
    -(10**400),
    0.5,
    3,
    1e9,
)
#: factors a careless hand or a unit slip applies to a number
SCALES = (1e6, 1e-6, -1.0, 1e300, 1e-300, 25.4, 1 / 25.4, 1000.0, 0.0)
#: strings that have broken units, tables and PDF layouts before
NASTY_STRINGS: tuple[str, ...] = (
    "",
    " ",
    "<b>bold</b> & <i>",
    "</para><para>",
    "<font size=1000>x</font>",
    "&amp; &lt; &#0; &#99999999;",
    "\x00\x01\x1f",
    "mm**1000",
    "1/0",
    "kN/0",
    "mm/mm",
    "degC",
    "percent",
    "dimensionless",
    "1e400 mm",
    "m/s",
    "in**0.5",
    "{}",
    "é漢字🚧",
    "\u202e reversed",
)
#: keys of free text (names, notes, titles): any text is valid there
FREE_TEXT = frozenset(
    {"note", "notes", "title", "label", "structure", "location", "owner_ref", "inspector"}
    | {"name", "instrument", "face", "who", "time"}
)
#: values of another type
ODD_VALUES: tuple[Any, ...] = (None, True, False, [], {}, [1, 2], {"a": 1}, "12", [[]], [None])
#: how many copies a repeated item gets
REPEATS = (2, 10, 200, 1500)
#: characters a repetition may add to a document (keeps a case's file below a few MB)
MAX_GROWTH = 500_000


@dataclass(frozen=True)
class Mutation:
    """One change: the operation, which node (an index, taken modulo the candidates), and
    the operation's argument."""

    op: str
    pick: int
    arg: Any = None
    pick2: int = 0

    def __repr__(self) -> str:
        arg = self.arg
        if isinstance(arg, str) and len(arg) > 40:
            arg = f"<{len(arg)} characters>"
        return f"Mutation({self.op!r}, pick={self.pick}, arg={arg!r}, pick2={self.pick2})"


def long_strings() -> st.SearchStrategy[str]:
    """Long text: a word or a markup piece repeated, with and without spaces."""
    return st.builds(
        lambda chunk, n: chunk * n,
        st.sampled_from(("word ", "W", "<b>&amp;</b> ", "x" * 99 + " ", "漢")),
        st.integers(100, 20_000),
    )


def _picks() -> st.SearchStrategy[int]:
    """Node indexes spread evenly (hypothesis favours small integers; scrambling them keeps
    the first nodes of a document from being picked most of the time)."""
    return st.integers(0, 2**32 - 1).map(lambda i: (i * 2654435761 + 40503) % 2**32)


def gentle() -> st.SearchStrategy[Mutation]:
    """A mutation that often keeps the document valid, so assessment and report run on it."""
    pick = _picks()
    strings = st.one_of(st.sampled_from(NASTY_STRINGS), long_strings(), st.text(max_size=30))
    return st.one_of(
        st.builds(Mutation, st.just("tweak"), pick, st.floats(0.05, 20.0)),
        st.builds(Mutation, st.just("tweak"), pick, st.floats(0.5, 2.0)),
        st.builds(Mutation, st.just("text"), pick, strings),
        st.builds(Mutation, st.just("renamed"), pick, st.sampled_from(REPEATS)),
    )


def mutations() -> st.SearchStrategy[Mutation]:
    """A mutation that mostly breaks the document."""
    pick = _picks()
    numbers = st.one_of(
        st.sampled_from(EXTREME_NUMBERS),
        st.floats(allow_nan=False, allow_infinity=False),
        st.integers(-(2**70), 2**70),
    )
    strings = st.one_of(st.sampled_from(NASTY_STRINGS), long_strings(), st.text(max_size=30))
    return st.one_of(
        st.builds(Mutation, st.just("number"), pick, numbers),
        st.builds(Mutation, st.just("scale"), pick, st.sampled_from(SCALES)),
        st.builds(Mutation, st.just("string"), pick, strings),
        st.builds(Mutation, st.just("odd"), pick, st.sampled_from(ODD_VALUES)),
        st.builds(Mutation, st.just("delete"), pick),
        st.builds(Mutation, st.just("repeat"), pick, st.sampled_from(REPEATS)),
        st.builds(Mutation, st.just("copy"), pick, st.none(), pick),
        st.builds(Mutation, st.just("add_key"), pick, st.sampled_from(("zz", "id", "unit", ""))),
    )


def text_damage() -> st.SearchStrategy[Mutation]:
    """A change to the document's text: truncation or one changed byte."""
    frac = _picks()
    return st.one_of(
        st.builds(Mutation, st.just("truncate"), frac),
        st.builds(Mutation, st.just("byte"), frac, st.integers(0, 255)),
    )


def cases() -> st.SearchStrategy[list[Mutation]]:
    """A case: up to three gentle mutations, then (one time in two) one that mostly breaks
    the document, and (one time in eight) a damage to its text."""
    return st.tuples(
        st.lists(gentle(), min_size=0, max_size=3),
        st.one_of(st.none(), mutations()),
        st.sampled_from((False,) * 7 + (True,)).flatmap(
            lambda hit: text_damage() if hit else st.none()
        ),
    ).map(lambda t: [*t[0], *(m for m in t[1:] if m is not None)] or [Mutation("tweak", 0, 1.0)])


def nodes(doc: Any) -> list[tuple[tuple, Any]]:
    """Every (path, value) of ``doc`` except the root, depth first."""
    out: list[tuple[tuple, Any]] = []
    stack: list[tuple[tuple, Any]] = [((), doc)]
    while stack:
        path, node = stack.pop()
        if path:
            out.append((path, node))
        if isinstance(node, dict):
            stack += [((*path, k), v) for k, v in reversed(list(node.items()))]
        elif isinstance(node, list):
            stack += [((*path, i), v) for i, v in reversed(list(enumerate(node)))]
    return out


def _parent(doc: Any, path: tuple) -> Any:
    node = doc
    for step in path[:-1]:
        node = node[step]
    return node


def _is_number(v: Any) -> bool:
    return isinstance(v, int | float) and not isinstance(v, bool)


def apply(doc: Any, muts: list[Mutation]) -> bytes:
    """The text of ``doc`` (not changed) after the mutations, as UTF-8 bytes."""
    doc = copy.deepcopy(doc)
    tail: list[Mutation] = []
    for m in muts:
        if m.op in ("truncate", "byte"):
            tail.append(m)
            continue
        every = nodes(doc)
        if m.op in ("number", "scale", "tweak"):
            cands = [(p, v) for p, v in every if _is_number(v)] or every
        elif m.op == "text":
            cands = [(p, v) for p, v in every if p[-1] in FREE_TEXT and isinstance(v, str)]
        elif m.op == "renamed":
            cands = [
                (p, v)
                for p, v in every
                if isinstance(v, dict) and "id" in v and isinstance(_parent(doc, p), list)
            ]
        elif m.op == "string":
            cands = [(p, v) for p, v in every if isinstance(v, str)] or every
        elif m.op == "repeat":
            cands = [(p, v) for p, v in every if isinstance(_parent(doc, p), list)]
        elif m.op == "add_key":
            cands = [(p, v) for p, v in every if isinstance(v, dict)]
        else:
            cands = every
        if not cands:
            continue
        path, value = cands[m.pick % len(cands)]
        parent = _parent(doc, path)
        key = path[-1]
        if m.op == "number":
            parent[key] = m.arg
        elif m.op in ("scale", "tweak"):
            parent[key] = value * m.arg if _is_number(value) else m.arg
        elif m.op == "text":
            parent[key] = m.arg
        elif m.op == "renamed":
            size = len(json.dumps(value, ensure_ascii=False, default=str))
            n = max(1, min(m.arg - 1, MAX_GROWTH // max(size, 1)))
            copies = [copy.deepcopy(value) for _ in range(n)]
            for i, c in enumerate(copies, start=1):
                c["id"] = f"{value['id']}~{i}"
            parent[key + 1 : key + 1] = copies
        elif m.op in ("string", "odd"):
            parent[key] = copy.deepcopy(m.arg)
        elif m.op == "delete":
            del parent[key]
        elif m.op == "repeat":
            size = len(json.dumps(value, ensure_ascii=False, default=str))
            n = max(1, min(m.arg - 1, MAX_GROWTH // max(size, 1)))
            parent[key + 1 : key + 1] = [copy.deepcopy(value) for _ in range(n)]
        elif m.op == "copy":
            src = every[m.pick2 % len(every)][1]
            parent[key] = copy.deepcopy(src)
        elif m.op == "add_key":
            value[m.arg] = 1
    try:
        data = json.dumps(doc, ensure_ascii=False).encode("utf-8")
    except ValueError:  # a float too large for JSON cannot occur; a cycle cannot either
        data = b"{}"
    for m in tail:
        if m.op == "truncate":
            data = data[: m.pick % max(len(data), 1)]
        elif data:
            i = m.pick % len(data)
            data = data[:i] + bytes([m.arg]) + data[i + 1 :]
    return data
