"""Scene: a placement on a time scale made into marks on a page, in page units.

The renderers' contract is `primitives` (Rect, GradientRect, Line, Polygon, Text, Group and
the Scene holding them); it is all this package's import brings in. The modules that build a
scene from a placement:

- `scale`: fixed day -> page x, ticks from days to millions of years; `axis` draws them;
- `theme`: sizes, fonts, palettes; `textsize`: text widths in the renderers' font;
- `encodings`: one function per mark (core, fade, whisker, hatch, dots, open arrow, ...);
- `bars`: one record's bar, signs and label; `legend`: the legend (only marks that occur) and
  the notes; `bands`: named periods behind the lanes;
- `compose`: the whole chart; `facets`: small multiples on one axis; `page`: page size and
  fitting the height; `measure`: the room the drawing needs, handed to the layout.
"""
from .primitives import (
    PRIMITIVE_KINDS, TEXT_MODES, GradientRect, Group, Line, Polygon, Primitive, Rect, Scene, Text,
    find, walk,
)

__all__ = ["GradientRect", "Group", "Line", "PRIMITIVE_KINDS", "Polygon", "Primitive", "Rect",
           "Scene", "TEXT_MODES", "Text", "find", "walk"]
