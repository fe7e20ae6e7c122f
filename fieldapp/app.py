"""The kivy application: screens, the open survey, live results and the keyboard.

Every entry goes straight to core's field store (no save button); after each entry a
snapshot goes to the results worker, whose answer comes back on the UI thread through
``Clock.schedule_once`` and is shown only if it answers the newest request.
"""

from __future__ import annotations

import importlib.util
import threading
import time
from pathlib import Path

from kivy.app import App
from kivy.clock import Clock
from kivy.core.window import Window
from kivy.factory import Factory
from kivy.lang import Builder
from kivy.properties import BooleanProperty, NumericProperty, ObjectProperty, StringProperty

from core import CAUTION
from core.errors import AsfoundError
from core.survey import export_survey
from fieldapp import identity, screens  # noqa: F401  (screens: registers the classes for kv)
from fieldapp.live import LiveResult, ResultsWorker
from fieldapp.pad import PadSheet, pad_width
from fieldapp.places import PlaceBook
from fieldapp.session import Session
from fieldapp.sheets import ConfirmSheet
from fieldapp.textsheet import TextSheet

KV_DIR = Path(__file__).resolve().parent / "kv"
KV_FILES = ("theme.kv", "pad.kv", "sheets.kv", "text.kv", "surveys.kv", "asbuilt.kv", "member.kv",
            "station.kv", "rivets.kv", "results.kv", "history.kv", "root.kv")  # fmt: skip
SCREENS = ("surveys", "member", "station", "rivets", "results", "history")
ACK_WAIT = 0.25  # s: an entry's acknowledgement waits at most this long for its result
KEY_ENTER, KEY_PAD_ENTER, KEY_ESCAPE, KEY_BACKSPACE = 13, 271, 27, 8


class FieldApp(App):
    """The field app over a folder of surveys. ``survey`` opens that store at start."""

    title = "asfound field"
    screen = StringProperty("surveys")
    has_session = BooleanProperty(False)
    status = StringProperty("")
    status_level = StringProperty("info")
    result = ObjectProperty(None, allownone=True)
    result_error = StringProperty("")
    caution = StringProperty(CAUTION)
    portrait = BooleanProperty(False)
    pad_w = NumericProperty(440)

    def __init__(self, folder: Path, survey: Path | None = None, **kw) -> None:
        super().__init__(**kw)
        self.folder = Path(folder)
        self.book = PlaceBook(self.folder)
        self.first_survey = survey
        self.session: Session | None = None
        self.seq = 0
        self.asked_at = 0.0
        self.latency = 0.0
        self.shown_at = 0.0
        self.posted_at = 0.0
        self.worker: ResultsWorker | None = None
        self._acks: list = []
        self._ack_soon = Clock.create_trigger(self._flush_acks, ACK_WAIT)
        self.sheet: PadSheet | None = None
        self.confirm: ConfirmSheet | None = None
        self.text_sheet: TextSheet | None = None

    # ------------------------------------------------------------------ start and stop
    def build(self):
        for name in KV_FILES:
            path = str(KV_DIR / name)
            if path not in Builder.files:  # a second app in one process reuses the rules
                Builder.load_file(path)
        root = Factory.Root()
        self.bind(result=self._result_changed, result_error=self._result_changed)
        self.worker = ResultsWorker(self._post)
        Window.bind(on_key_down=self._on_key, size=self._resized)
        Window.clearcolor = (0.98, 0.98, 0.96, 1)
        self.sheet, self.confirm, self.text_sheet = PadSheet(), ConfirmSheet(), TextSheet()
        self._resized()
        return root

    def _resized(self, *_a) -> None:
        """Landscape or portrait, and the width of the pad's column, from the window."""
        self.portrait = Window.width < Window.height
        self.pad_w = pad_width(Window.width, Window.height)
        for s in (self.sheet, self.confirm):
            if s is not None and s.is_open:
                s.dismiss()

    def on_start(self) -> None:
        if identity.load() is None:
            self.ask_inspector(first=True)
        target = self.first_survey or self.book.last
        if target is not None:
            self.open_store(Path(target))
        else:
            self.go("surveys")

    def on_stop(self) -> None:
        Window.unbind(on_key_down=self._on_key, size=self._resized)
        for s in (self.sheet, self.confirm, self.text_sheet):
            if s is not None:
                s.dismiss()
        if self.worker is not None:
            self.worker.stop()
        if self.session is not None:
            self.session.close()
            self.session = None

    def ask_inspector(self, first: bool = False, other: bool = False, typed=None) -> None:
        """Ask the inspector's name and initials (kept on this device, asked once).

        ``other``: another person takes the device (:func:`identity.hand_over`); else the
        name of the same person is corrected (:func:`identity.correct`). Either is asked
        again as a question before it is kept; "Keep it" brings back what was typed."""
        now = identity.load()

        def done(name: str, initials: str) -> str:
            try:
                new = identity.Inspector(name, initials)
            except AsfoundError as e:
                return str(e)
            if now is None:
                return self._name_inspector(identity.save, name, initials)
            if new.who == now.who and not other:
                self.tell(f"entries are already recorded as made by {now.who}", "info")
                return ""
            if other:
                text = (
                    f"Hand this device to {new.who}? Entries from now on are theirs; what "
                    f"{now.who} entered stays theirs, and {new.who}'s Undo never reaches it."
                )
            else:
                text = (
                    f"Record entries from now on as {new.who} instead of {now.who}? The same "
                    "person: earlier entries keep the name they were made under, and Undo "
                    "still reaches them on this device."
                )
            fn = identity.hand_over if other else identity.correct
            self.confirm.ask(
                text,
                "Hand over" if other else "Change name",
                lambda: self._name_inspector(fn, name, initials),
                "Keep it",
                lambda: self.ask_inspector(other=other, typed=(name, initials)),
            )
            return ""

        if typed is not None:
            fields = typed
        elif other or now is None:
            fields = ("", "")
        else:
            fields = (now.name, now.initials)
        if other:
            title = "Another inspector takes this device: name and initials"
        elif first:
            title = "Who is inspecting? (asked once on this device; kept with every entry)"
        else:
            title = f"Correct the name of {now.who if now else 'the inspector'} (same person)"
        self.text_sheet.ask(
            title,
            [("Name", fields[0]), ("Initials", fields[1])],
            done,
            can_close=not first,
        )

    def _name_inspector(self, fn, name: str, initials: str) -> str:
        try:
            who = fn(name, initials)
        except (AsfoundError, OSError) as e:
            self.tell(str(e), "error")
            if not self.text_sheet.is_open:  # after the question: what was typed comes back
                self.ask_inspector(other=fn is identity.hand_over, typed=(name, initials))
                self.text_sheet.message, self.text_sheet.level = str(e), "error"
            return str(e)
        if self.session is not None:
            self.session.who, self.session.formerly = who.who, who.formerly
        self.tell(f"entries are now recorded as made by {who.who}", "ok")
        if self.root is not None and self.root.ids.sm.current == "history":
            self.screen_of("history").refresh()
        return ""

    def screen_of(self, name: str):
        return self.root.ids.sm.get_screen(name)

    # ------------------------------------------------------------------ surveys
    def open_store(self, path: Path) -> None:
        self.guard(lambda: self.set_session(Session.open(path, self.book)))

    def set_session(self, session: Session) -> None:
        if self.session is not None:
            self.session.close()
        self.session = session
        self.has_session = True
        self.result = None
        self.result_error = ""
        where = session.screen if session.screen in SCREENS else ""
        self.tell(f"opened {session.path.name}", "ok")
        self.go(where or ("station" if session.station_id else "member"))
        self.refresh_results()

    def go(self, name: str) -> None:
        """Show screen ``name`` and remember it as the place where work stopped."""
        if name != "surveys" and self.session is None:
            name = "surveys"
        if name == "station" and self.session is not None and not self.session.station_id:
            name = "member"
            self.tell("add or choose a station first (Member screen)", "warn")
        self.screen = name
        self.root.ids.sm.current = name
        if self.session is not None and name != "surveys":
            self.session.screen = name
            self.guard(self.session.remember)
        self.screen_of(name).refresh()

    # ------------------------------------------------------------------ entries
    def tell(self, text: str, level: str = "info") -> None:
        """Show a message in the status line (after any acknowledgement still waiting)."""
        self._flush_acks()
        self.status, self.status_level = text, level

    def guard(self, fn):
        """Run an entry; show core's message instead of raising (the input stays as typed)."""
        try:
            return fn()
        except (AsfoundError, OSError) as e:
            self.tell(str(e), "error")
            return None

    def entry_done(self, what: str, warnings=(), then=None) -> None:
        """After an entry reached the store: refresh the results, then say so (and run
        ``then``) together with the new result, so the screen is redrawn once (at the
        latest after :data:`ACK_WAIT` s when the result is slow)."""
        text = f"saved {what}" + "".join(f"; {w.message}" for w in warnings)

        def ack() -> None:
            self.status, self.status_level = text, "warn" if warnings else "ok"
            if then is not None:
                then()

        self._acks.append(ack)
        self._ack_soon()
        self.refresh_results()

    def _flush_acks(self, *_a) -> None:
        acks, self._acks = self._acks, []
        for ack in acks:
            ack()

    def undo(self) -> None:
        """The Undo button: say exactly what would be undone, then ask (or say why not)."""
        if self.session is None:
            return
        got = self.guard(self.session.undo_plan)
        if got is None:
            return
        plan, what = got
        if plan.change is None:
            self.tell("nothing of yours to undo on this device", "info")
        elif plan.refused:
            why = plan.refused.removeprefix("undo refused: ")
            self.confirm.tell(f"Cannot undo {what}: {why}.")
        else:
            self.confirm.ask(
                f"Undo {what}?", "Undo it", lambda: self.undo_now(plan.change), "Keep it"
            )

    def undo_now(self, change: int) -> str | None:
        """Undo ``change`` (the one shown); the sentence said, or None if refused."""
        msg = self.guard(lambda: self.session.undo(change))
        if msg is not None:
            self.tell(msg, "ok")
            self.go(self.screen)
            self.refresh_results()
        return msg

    def ask_number(self, title: str, text: str, unit: str, done, **kw):
        """The pad over the screen for one number; ``done(text)`` stores it and returns an
        error sentence, or "" when stored (the pad closes). ``kw``: ``minus``, ``typed``
        (called as typed), ``hint`` (see :meth:`fieldapp.pad.PadSheet.show`)."""
        self.sheet.show(title, text, unit, done, **kw)
        return self.sheet

    # ------------------------------------------------------------------ live results
    def refresh_results(self) -> None:
        if self.session is None:
            return
        self.seq += 1
        self.asked_at = time.perf_counter()
        try:
            snap = self.session.snapshot(self.seq)
        except (AsfoundError, ValueError) as e:
            self._show(self.seq, None, str(e))
            return
        if snap is None:
            self._show(self.seq, None, "")
        else:
            self.worker.submit(snap)

    def _post(self, seq: int, result: LiveResult | None, error: str) -> None:
        """Called on the worker thread: hand over to the UI thread."""
        self.posted_at = time.perf_counter()
        Clock.schedule_once(lambda _dt: self._show(seq, result, error), 0)

    def _show(self, seq: int, result: LiveResult | None, error: str) -> None:
        if seq != self.seq:
            return  # a newer entry was made meanwhile; its result follows
        self.shown_at = time.perf_counter()
        self.latency = self.shown_at - self.asked_at
        self._flush_acks()
        self.result_error = error
        self.result = result

    def _result_changed(self, *_a) -> None:
        for name in ("station", "results"):
            self.screen_of(name).show_result(self, self.result)

    # ------------------------------------------------------------------ files out
    def out_folder(self) -> Path:
        out = self.folder / "exports"
        out.mkdir(exist_ok=True)
        return out

    def export_file(self) -> Path | None:
        if self.session is None:
            return None
        out = self.out_folder() / (self.session.path.stem + ".json")
        done = self.guard(lambda: export_survey(self.session.store, out))
        if done is not None:
            self.tell(f"survey file written: {done}", "ok")
        return done

    def make_report(self) -> threading.Thread | None:
        """The PDF report through core's command line, in a worker thread."""
        if self.session is None:
            return None
        if importlib.util.find_spec("core.cmd_report") is None:
            self.tell("report module not available", "warn")
            return None
        out = self.out_folder() / (self.session.path.stem + ".pdf")
        src = str(self.session.path)
        self.tell("writing the PDF report ...", "info")

        def work() -> None:
            from core.cli import main as cli

            try:
                code = cli(["report", src, "-o", str(out)])
                msg, lv = (f"report written: {out}", "ok") if code == 0 else (
                    f"the report could not be written (exit code {code})", "error")  # fmt: skip
            except Exception as e:  # the report module is new; show any failure
                msg, lv = f"the report could not be written: {e}", "error"
            Clock.schedule_once(lambda _dt: self.tell(msg, lv), 0)

        t = threading.Thread(target=work, name="asfound-report", daemon=True)
        t.start()
        return t

    # ------------------------------------------------------------------ keyboard
    def _on_key(self, _window, key, _scancode, codepoint, _modifiers) -> bool:
        if self.text_sheet is not None and self.text_sheet.is_open:
            if key == KEY_ESCAPE and self.text_sheet.can_close:
                self.text_sheet.close()
            return key == KEY_ESCAPE  # the text fields take the other keys
        if self.confirm is not None and self.confirm.is_open:
            if key == KEY_ESCAPE:
                self.confirm.answer(False)
            return True
        if self.sheet is not None and self.sheet.is_open:
            return pad_keys(self.sheet.panel, key, codepoint or "", self.sheet.dismiss)
        if self.screen == "station":
            return self.screen_of("station").key(key, codepoint or "")
        return key == KEY_ESCAPE  # Escape never closes the app


def pad_keys(panel, key: int, codepoint: str, close) -> bool:
    """Keyboard keys for a pad panel: digits, point, minus, Backspace, Enter, Escape."""
    if key == KEY_ESCAPE:
        close()
    elif key in (KEY_ENTER, KEY_PAD_ENTER):
        panel.key("Enter")
    elif key == KEY_BACKSPACE:
        panel.key("Back")
    elif codepoint and codepoint in "0123456789":
        panel.key(codepoint)
    elif codepoint in (".", ","):
        panel.key(".")
    elif codepoint == "-":
        panel.key("-")
    else:
        return False
    return True
