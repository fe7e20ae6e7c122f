"""The screens of the field app (their layouts are in ``fieldapp/kv``)."""

from kivy.uix.boxlayout import BoxLayout

from fieldapp.drawing import SectionView
from fieldapp.pad import FitLabel, NumPad, PadPanel, PadSheet
from fieldapp.rivetmap import Overview, RivetLegend, StretchAxis
from fieldapp.screens.entries import EntryRow
from fieldapp.screens.member import MemberScreen
from fieldapp.screens.results import ResultsScreen
from fieldapp.screens.rivets import RivetsScreen
from fieldapp.screens.station import StationScreen
from fieldapp.screens.surveys import SurveysScreen
from fieldapp.sheets import ConfirmSheet
from fieldapp.strip import SpanStrip


class Root(BoxLayout):
    """Navigation bar, status line and the screens."""


__all__ = [
    "ConfirmSheet",
    "EntryRow",
    "FitLabel",
    "MemberScreen",
    "NumPad",
    "Overview",
    "PadPanel",
    "PadSheet",
    "ResultsScreen",
    "RivetLegend",
    "RivetsScreen",
    "Root",
    "SectionView",
    "SpanStrip",
    "StationScreen",
    "StretchAxis",
    "SurveysScreen",
]
