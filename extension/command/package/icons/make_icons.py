#!/usr/bin/python3
"""Draws the command's toolbar and menu icons (analyse_16.png, analyse_26.png) beside this file:
a small table whose cells are coloured like the sheet's heat map (palette.hpp: ColorBrewer PuOr),
under a dark frame. Run once after changing the design; the PNG files are committed.

    /usr/bin/python3 extension/command/package/icons/make_icons.py
"""
import pathlib

from PIL import Image, ImageDraw

HERE = pathlib.Path(__file__).resolve().parent
PURPLE, LIGHT, ORANGE, FRAME = (0x99, 0x8E, 0xC3), (0xF7, 0xF7, 0xF7), (0xF1, 0xA3, 0x40), (0x33, 0x33, 0x33)
# Which heat-map colour each cell of the 3×3 table gets.
CELLS = [[ORANGE, LIGHT, PURPLE],
         [LIGHT, LIGHT, LIGHT],
         [PURPLE, LIGHT, ORANGE]]


def draw(size):
    image = Image.new("RGBA", (size, size), (0, 0, 0, 0))
    pen = ImageDraw.Draw(image)
    margin = 1
    cell = (size - 2 * margin - 1) // 3
    left = top = margin + (size - 2 * margin - 1 - 3 * cell) // 2
    for r in range(3):
        for c in range(3):
            x, y = left + c * cell, top + r * cell
            pen.rectangle([x, y, x + cell, y + cell], fill=CELLS[r][c], outline=FRAME)
    return image


for size in (16, 26):
    draw(size).save(HERE / f"analyse_{size}.png", optimize=True)
    print(f"wrote {HERE / f'analyse_{size}.png'}")
