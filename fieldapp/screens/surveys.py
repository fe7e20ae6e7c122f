"""Surveys: open a survey of the folder, or start one from the girder template or a sample."""

from __future__ import annotations

import datetime as _dt
from functools import partial
from pathlib import Path

from kivy.app import App
from kivy.factory import Factory
from kivy.properties import StringProperty
from kivy.uix.screenmanager import Screen

from fieldapp.places import store_files
from fieldapp.session import Session
from fieldapp.templates import sample_files, samples_folder


class SurveysScreen(Screen):
    system = StringProperty("si")

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self._samples: list[Path] | None = None  # checked once

    def refresh(self) -> None:
        app = App.get_running_app()
        self.ids.folder.text = f"Folder: {app.folder}"
        box = self.ids.stores
        box.clear_widgets()
        files = store_files(app.folder)
        for p in files:
            when = _dt.datetime.fromtimestamp(p.stat().st_mtime).strftime("%Y-%m-%d %H:%M")
            current = app.session is not None and app.session.path == p
            b = Factory.Big(text=f"{p.stem}    ({when})", chosen=current)
            b.bind(on_press=partial(self._open, p))
            box.add_widget(b)
        if not files:
            box.add_widget(
                Factory.Wrap(text="No surveys in this folder yet: start one on the right.")
            )
        sbox = self.ids.samples
        sbox.clear_widgets()
        if self._samples is None:
            self._samples = sample_files(samples_folder())
        for p in self._samples:
            b = Factory.Big(text=f"Copy {p.stem}")
            b.bind(on_press=partial(self._copy, p))
            sbox.add_widget(b)

    def set_system(self, system: str) -> None:
        self.system = system

    def _open(self, path: Path, *_a) -> None:
        App.get_running_app().open_store(path)

    def _copy(self, sample: Path, *_a) -> None:
        app = App.get_running_app()
        s = app.guard(lambda: Session.from_sample(app.folder, app.book, sample))
        if s is not None:
            app.set_session(s)

    def new_survey(self) -> None:
        app = App.get_running_app()
        name = self.ids.new_id.text.strip()
        if not name:
            app.tell("type a name for the new survey first", "warn")
            return
        s = app.guard(lambda: Session.from_template(app.folder, app.book, name, self.system))
        if s is not None:
            self.ids.new_id.text = ""
            app.set_session(s)
            app.go("member")
