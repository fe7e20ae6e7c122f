"""The as-built values of the Member screen beyond the main dimensions, and the members of
the survey (add, copy, rename, withdraw with a question first). Mixed into
:class:`fieldapp.screens.member.MemberScreen`; the values and their changes are
:mod:`fieldapp.asbuilt` and :mod:`fieldapp.members` (core validates and keeps the history)."""

from __future__ import annotations

from functools import partial

from kivy.app import App
from kivy.factory import Factory
from kivy.metrics import dp
from kivy.uix.gridlayout import GridLayout

from core.errors import AsfoundError
from fieldapp import asbuilt, members

VALUE_DP = 170  # width of a value button
STEEL_KEYS = (("header", "year_built"), ("header", "Fy"), ("header", "Fu"))
STEEL_HINT = (
    "Empty removes it. Without Fy the steel is assumed (AASHTO: from the year built); "
    "the line under Steel says what."
)


class AsBuiltForm:
    """Mixed into the Member screen: ``more`` holds the groups of :func:`asbuilt.groups`."""

    more: GridLayout | None = None

    def build_more(self, s) -> None:
        if self.more is None:
            self.more = GridLayout(cols=1, spacing=dp(6), size_hint_y=None)
            self.more.bind(minimum_height=self.more.setter("height"))
            self.ids.form.add_widget(self.more)
        box = self.more
        box.clear_widgets()
        self.rows: dict[tuple, object] = {}
        try:
            groups = asbuilt.groups(s)
        except AsfoundError as e:
            box.add_widget(Factory.Notice(text=str(e), level="error"))
            return
        heads = [h for h, _r in groups]
        stiff = [h for h in heads if h.startswith("Stiffener ")]
        # a new stiffener is added under the last one (or under the section's values)
        fallback = "Section, further values" if "Section, further values" in heads else "Member"
        self._add_stiffener_under = stiff[-1] if stiff else fallback
        for head, rows in groups:
            box.add_widget(Factory.GroupHead(text=head))
            for row in rows:
                box.add_widget(self._value_row(row))
            self._group_actions(s, head, box)

    def _value_row(self, row):
        w = Factory.ValueRow()
        w.label = row.label + (f" ({row.unit})" if row.unit else "")
        if row.kind == "number":
            b = Factory.NumberField(size_hint_x=None, width=dp(VALUE_DP))
            b.value, b.unit = row.text, row.unit
        else:
            b = Factory.SmallBig(text=row.text or "-", size_hint_x=None, width=dp(VALUE_DP))
        b.bind(on_press=partial(self.ask_row, row))
        w.add_widget(b)
        self.rows[row.key] = b
        return w

    def _group_actions(self, s, head: str, box) -> None:
        acts = []
        if head == "Steel and standard":
            box.add_widget(Factory.Notice(text=self._guarded(asbuilt.material_words, s)))
        elif head.startswith("Cover plates"):
            side = head.rsplit(" ", 2)[1]
            acts.append((f"Add a {side} plate", partial(self.ask_cover, side)))
            if asbuilt.covers_of(s.member().section["girder"], side):
                acts.append((f"Remove outer {side} plate", partial(self.ask_remove_cover, side)))
        elif head == "Section, further values":
            acts.append(("Lay rivet runs along the span", self.relay))
        elif head.startswith("Stiffener "):
            acts.append((f"Remove s{head[1:]}", partial(self.ask_remove_stiffener, head)))
        if head == self._add_stiffener_under:
            acts.append(("Add a stiffener at ...", self.ask_stiffener))
        row = Factory.BoxLayout(size_hint_y=None, height=dp(56), spacing=dp(6))
        for text, fn in acts:
            b = Factory.SmallBig(text=text)
            b.bind(on_press=lambda _b, fn=fn: fn())
            row.add_widget(b)
            self.rows[("action", text)] = b
        if acts:
            box.add_widget(row)

    def _guarded(self, fn, s) -> str:
        try:
            return fn(s)
        except AsfoundError as e:
            return str(e)

    # ------------------------------------------------------------------ one value
    def ask_row(self, row, *_a) -> None:
        app = App.get_running_app()
        s = app.session
        if row.key == ("header", "standard"):  # the whole survey follows it: asked first
            new = asbuilt.next_choice(row)
            app.confirm.ask(
                f"Assess the whole survey to {new} instead of {row.text}? Every check, "
                "clause and default then follows that standard family.",
                f"Change to {new}",
                lambda: self._store_row(row, new),
            )
        elif row.kind == "choice":
            self._store_row(row, asbuilt.next_choice(row))
        elif row.kind == "text":
            app.text_sheet.ask(
                f"{row.label}, member {s.member_id}",
                [(row.label, row.text)],
                lambda text: self._store_row(row, text),
            )
        else:
            hint = "Empty and Enter removes the value." if row.optional else ""
            if row.key in STEEL_KEYS:
                hint = STEEL_HINT
            app.ask_number(
                f"{row.label} ({row.unit}) of member {s.member_id}" if row.unit else row.label,
                row.text,
                row.unit,
                partial(self._store_row, row),
                hint=hint,
            )

    def _store_row(self, row, text: str) -> str:
        """Store one value; core's error sentence, or "" when stored."""
        app = App.get_running_app()
        if text == row.text:
            return ""
        try:
            saved = asbuilt.apply(app.session, row, text)
        except AsfoundError as e:
            if row.kind == "choice":
                app.tell(str(e), "error")
            return str(e)
        shown = text if text.strip() else "(removed)"
        app.entry_done(f"{row.label.lower()} {shown} {row.unit}".strip(), saved.warnings)
        self.refresh()
        return ""

    def _do(self, what: str, fn) -> str:
        app = App.get_running_app()
        try:
            saved = fn()
        except AsfoundError as e:
            app.tell(str(e), "error")
            return str(e)
        app.entry_done(what, getattr(saved, "warnings", ()))
        self.refresh()
        return ""

    # ------------------------------------------------------------------ lists
    def ask_cover(self, side: str) -> None:
        app = App.get_running_app()
        app.text_sheet.ask(
            f"New {side} cover plate (outside the others), member {app.session.member_id}",
            [
                (f"Width ({app.session.length_unit})", ""),
                (f"Thickness ({app.session.length_unit})", ""),
            ],
            lambda b, t: self._do(
                f"{side} cover plate {b} x {t}", lambda: asbuilt.add_cover(app.session, side, b, t)
            ),
        )

    def ask_remove_cover(self, side: str) -> None:
        app = App.get_running_app()
        n = len(asbuilt.covers_of(app.session.member().section["girder"], side))
        app.confirm.ask(
            f"Remove {side} cover plate {n} (the outer one) of member {app.session.member_id}? "
            "It stays in the history and can be undone.",
            "Remove",
            lambda: self._do(
                f"removal of {side} plate {n}",
                lambda: asbuilt.remove_cover(app.session, side, n - 1),
            ),
        )

    def ask_stiffener(self) -> None:
        app = App.get_running_app()
        s = app.session
        app.ask_number(
            f"Position of a new stiffener ({s.position_unit} from the member's start)",
            "",
            s.position_unit,
            lambda text: self._do(f"stiffener at {text}", lambda: asbuilt.add_stiffener(s, text)),
            hint="It starts like the last stiffener; change its values below.",
        )

    def ask_remove_stiffener(self, head: str) -> None:
        app = App.get_running_app()
        sid = head.split(" ", 1)[1]
        ids = [x.id for x in app.session.member().stiffeners]
        app.confirm.ask(
            f"Remove stiffener {sid} of member {app.session.member_id}? It stays in the "
            "history and can be undone.",
            "Remove",
            lambda: self._do(
                f"removal of stiffener {sid}",
                lambda: asbuilt.remove_stiffener(app.session, ids.index(sid)),
            ),
        )

    def relay(self) -> None:
        app = App.get_running_app()
        self._do("rivet runs along the span", lambda: asbuilt.relay_rivets(app.session))

    # ------------------------------------------------------------------ members
    def member_buttons(self, s) -> None:
        box = self.ids.members
        box.clear_widgets()
        self.acts: dict[str, object] = {}
        for mid in s.member_ids():
            b = Factory.Big(text=mid, chosen=mid == s.member_id)
            b.bind(on_press=partial(self._pick_member, mid))
            box.add_widget(b)
        for text, fn in (
            ("New member", self.ask_new_member),
            ("Copy", self.ask_copy_member),
            ("Rename", self.ask_rename_member),
            ("Withdraw", self.ask_delete_member),
        ):
            b = Factory.SmallBig(text=text)
            b.bind(on_press=lambda _b, fn=fn: fn())
            box.add_widget(b)
            self.acts[text] = b

    def _member_done(self, what: str, fn) -> str:
        app = App.get_running_app()
        try:
            fn()
        except AsfoundError as e:
            app.tell(str(e), "error")
            return str(e)
        app.entry_done(what)
        self.refresh()
        app.refresh_results()
        return ""

    def ask_new_member(self) -> None:
        app = App.get_running_app()
        s = app.session
        nid = members.next_member_id(s)
        app.text_sheet.ask(
            "New member from the girder template (its id cannot change later)",
            [(f"Member id (empty: {nid})", "")],
            lambda t: self._member_done(f"member {t or nid}", lambda: members.add_member(s, t)),
        )

    def ask_copy_member(self) -> None:
        app = App.get_running_app()
        s = app.session
        nid = members.next_member_id(s)
        app.text_sheet.ask(
            f"Copy member {s.member_id}: its as-built values, no stations or readings",
            [(f"Id of the copy (empty: {nid})", "")],
            lambda t: self._member_done(f"copy {t or nid}", lambda: members.copy_member(s, t)),
        )

    def ask_rename_member(self) -> None:
        app = App.get_running_app()
        s = app.session
        app.text_sheet.ask(
            f"Name shown for member {s.member_id} (the id stays: history and merges know it)",
            [("Name", s.member().label)],
            lambda t: self._member_done(f"name {t}", lambda: members.rename_member(s, t)),
        )

    def ask_delete_member(self) -> None:
        app = App.get_running_app()
        s = app.session
        n = len(s.station_ids())
        app.confirm.ask(
            f"Withdraw member {s.member_id} and its {n} station(s)? It stays in the history "
            "and can be undone.",
            "Withdraw",
            lambda: self._member_done(
                f"withdrawal of member {s.member_id}", lambda: members.delete_member(s)
            ),
        )
