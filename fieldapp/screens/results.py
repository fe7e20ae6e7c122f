"""Results: as-found against as-built at the current station, core's numbers as text;
export of the survey file and the PDF report."""

from __future__ import annotations

from kivy.app import App
from kivy.factory import Factory
from kivy.uix.screenmanager import Screen

from fieldapp import present

HEAD = ("limit state", "as-built", "as-found", "ratio", "RF")


class ResultsScreen(Screen):
    def refresh(self) -> None:
        app = App.get_running_app()
        self.show_result(app, app.result)

    def show_result(self, app, result) -> None:
        s = app.session
        ids = self.ids
        table = ids.table
        table.clear_widgets()
        head = (*HEAD[:-1], result.measure_symbol if result is not None else HEAD[-1])
        for h in head:
            table.add_widget(Factory.Cell(text=h, bold=True, color=(0.3, 0.3, 0.34, 1)))
        if s is None:
            return
        if app.result_error:
            ids.heading.text = "Results"
            ids.worst.level, ids.worst.text = "error", present.esc(app.result_error)
            ids.flags.text = ""
            return
        if result is None or (result.member, result.station) != (s.member_id, s.station_id):
            ids.heading.text = "Results"
            ids.worst.level = "info"
            ids.worst.text = "working ..." if s.station_id else "choose a station first"
            ids.flags.text = ""
            return
        sr = result.station_result
        ids.heading.text = f"{sr.member} / station {sr.station}: as-found against as-built ({result.standard_title})"
        for r in present.rows(sr, result.unit_system):
            for text in (r.name, r.built, r.found, r.ratio, r.rf):
                table.add_widget(Factory.Cell(text=text, key=r.key))
        flag = present.worst_flag(sr)
        ids.worst.level = f"l{int(flag.level) if flag else 0}"
        ids.worst.text = "worst flag: " + present.flag_line(flag)
        notes = present.grouped_notes(present.rows(sr, result.unit_system))
        ids.flags.text = "\n".join(
            [
                *map(present.esc, notes),
                *(present.flag_line(f) for f in sorted(sr.flags, key=lambda f: -f.level)),
            ]
        )

    def export_file(self) -> None:
        App.get_running_app().export_file()

    def make_report(self) -> None:
        App.get_running_app().make_report()
