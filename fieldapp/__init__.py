"""asfound field app (kivy) over the core engine. It computes nothing itself."""
