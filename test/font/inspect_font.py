# Opens a font with fontTools (Debian python3-fonttools, an independent font
# compiler/parser) and prints what the font tests compare, as JSON on stdout:
# every warning fontTools logs while opening the font, decompiling every table and
# drawing every glyph; the stored table values; the values fontTools itself would
# compute (bounding box, hhea extremes, average width, Unicode ranges); and each
# glyph's outline as recorded by a pen.
#
# usage: /usr/bin/python3 inspect_font.py FONT [GLYPH_NAME ...]
#   with glyph names, only those glyphs' outlines are dumped (default: all).
# TrueType quadratic curves are drawn through a pen that elevates them to cubics
# (fontTools' BasePen does this exactly), so every outline comes out as
# moveTo / lineTo / curveTo / closePath.
import json
import logging
import sys
import warnings

from fontTools.pens.basePen import BasePen
from fontTools.pens.boundsPen import BoundsPen
from fontTools.pens.reverseContourPen import ReverseContourPen
from fontTools.pens.recordingPen import DecomposingRecordingPen
from fontTools.ttLib import TTFont


class CubicRecordingPen(BasePen):
    """Records moveTo/lineTo/curveTo/closePath; quadratics arrive as cubics via BasePen."""

    def __init__(self, glyphSet):
        super().__init__(glyphSet)
        self.value = []

    def _moveTo(self, pt):
        self.value.append(["moveTo", [list(pt)]])

    def _lineTo(self, pt):
        self.value.append(["lineTo", [list(pt)]])

    def _curveToOne(self, p1, p2, p3):
        self.value.append(["curveTo", [list(p1), list(p2), list(p3)]])

    def _closePath(self):
        self.value.append(["closePath", []])

    def _endPath(self):
        self.value.append(["endPath", []])


class Collect(logging.Handler):
    def __init__(self):
        super().__init__(level=logging.WARNING)
        self.messages = []

    def emit(self, record):
        self.messages.append("%s: %s" % (record.name, record.getMessage()))


def main():
    path = sys.argv[1]
    wanted = sys.argv[2:]
    collector = Collect()
    root = logging.getLogger("fontTools")
    root.addHandler(collector)
    root.setLevel(logging.WARNING)
    warnings.simplefilter("always")
    result = {}
    with warnings.catch_warnings(record=True) as caught:
        checksum_error = None
        try:
            # checkChecksums=2 raises on any table whose directory checksum is wrong.
            TTFont(path, checkChecksums=2).ensureDecompiled()
        except Exception as error:  # noqa: BLE001 - reported to the test
            checksum_error = str(error)
        font = TTFont(path)
        tags = sorted(font.keys())
        for tag in tags:
            font[tag]
        result["checksumError"] = checksum_error
        result["tables"] = [t for t in tags if t != "GlyphOrder"]
        order = font.getGlyphOrder()
        result["glyphOrder"] = order

        head = font["head"]
        result["head"] = {k: getattr(head, k) for k in ["fontRevision", "checkSumAdjustment", "created", "modified", "xMin", "yMin", "xMax", "yMax", "macStyle", "unitsPerEm", "flags"]}
        hhea = font["hhea"]
        result["hhea"] = {k: getattr(hhea, k) for k in ["ascent", "descent", "lineGap", "advanceWidthMax", "minLeftSideBearing", "minRightSideBearing", "xMaxExtent", "numberOfHMetrics"]}
        os2 = font["OS/2"]
        result["os2"] = {k: getattr(os2, k, None) for k in ["version", "xAvgCharWidth", "usWeightClass", "achVendID", "fsSelection", "sTypoAscender", "sTypoDescender", "sTypoLineGap", "usWinAscent", "usWinDescent", "sxHeight", "sCapHeight", "usFirstCharIndex", "usLastCharIndex", "usDefaultChar", "usBreakChar", "yStrikeoutSize", "yStrikeoutPosition"]}
        result["os2"]["unicodeRanges"] = sorted(os2.getUnicodeRanges())
        post = font["post"]
        result["post"] = {k: getattr(post, k) for k in ["formatType", "underlinePosition", "underlineThickness", "italicAngle"]}
        result["names"] = [
            {"platformID": r.platformID, "platEncID": r.platEncID, "langID": r.langID, "nameID": r.nameID, "string": r.toUnicode()}
            for r in font["name"].names
        ]
        result["cmap"] = {str(k): v for k, v in font["cmap"].getBestCmap().items()}
        result["hmtx"] = {name: list(font["hmtx"][name]) for name in order}
        result["maxp"] = {"numGlyphs": font["maxp"].numGlyphs}

        if "CFF " in font:
            cff = font["CFF "].cff
            top = cff.topDictIndex[0]
            result["cff"] = {
                "fontNames": list(cff.fontNames),
                "FontBBox": list(top.FontBBox),
                "FullName": getattr(top, "FullName", None),
                "FamilyName": getattr(top, "FamilyName", None),
                "UnderlinePosition": top.UnderlinePosition,
                "UnderlineThickness": top.UnderlineThickness,
                "FontMatrix": list(top.FontMatrix),
            }
            for name in order:
                top.CharStrings[name].decompile()

        glyph_set = font.getGlyphSet()
        outlines = {}
        bounds = {}
        # TrueType contours run clockwise; Stemline's outline model uses the CFF
        # direction (outer contours counter-clockwise), so a glyf font's reference
        # drawing goes through fontTools' own ReverseContourPen, which keeps each
        # contour's first point. Composite glyphs are decomposed first, so that their
        # components' contours are reversed too.
        truetype = "glyf" in font
        for name in (wanted or order):
            pen = CubicRecordingPen(glyph_set)
            if truetype:
                decomposed = DecomposingRecordingPen(glyph_set)
                glyph_set[name].draw(decomposed)
                decomposed.replay(ReverseContourPen(pen))
            else:
                glyph_set[name].draw(pen)
            outlines[name] = pen.value
            bounds_pen = BoundsPen(glyph_set)
            glyph_set[name].draw(bounds_pen)
            bounds[name] = list(bounds_pen.bounds) if bounds_pen.bounds is not None else None
        result["outlines"] = outlines
        # Tight bounds of each drawn glyph (fontTools BoundsPen: curve extrema, not handles).
        result["glyphBounds"] = bounds

        # What fontTools computes itself, after the stored values were read.
        recalculated = {}
        if "CFF " in font:
            top = font["CFF "].cff.topDictIndex[0]
            top.recalcFontBBox()
            recalculated["FontBBox"] = list(top.FontBBox)
        hhea.recalc(font)
        recalculated["hhea"] = {k: getattr(hhea, k) for k in ["advanceWidthMax", "minLeftSideBearing", "minRightSideBearing", "xMaxExtent"]}
        recalculated["xAvgCharWidth"] = os2.recalcAvgCharWidth(font)
        recalculated["unicodeRanges"] = sorted(os2.recalcUnicodeRanges(font))
        result["recalculated"] = recalculated
    result["warnings"] = collector.messages + [str(w.message) for w in caught]
    print(json.dumps(result))


main()
