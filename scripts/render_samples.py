#!/usr/bin/python3
"""Renders the screenshots of the user guide (docs/images/*.png) from the sample workbooks, as real
Calc draws them: each workbook is opened in a throwaway headless office with the extension installed
and recalculated, each shot's cell range is exported to PDF (charts and heat maps included), and
pdftoppm turns the page into a PNG that is cropped to its content and reduced to a small palette.

    /usr/bin/python3 scripts/render_samples.py --oxt build/extension/assoc.oxt [--out docs/images]

scripts/render_samples.sh builds the extension first. Needs pdftoppm (poppler-utils), Pillow
(python3-pil) and the Liberation fonts the samples use (fonts-liberation2; without them the office
draws a wider substitute, text wraps differently and the shots no longer match the guide).
"""

import argparse
import pathlib
import shutil
import subprocess
import sys
import tempfile

HERE = pathlib.Path(__file__).resolve().parent
sys.path.insert(0, str(HERE))
from assoc_office import ThrowawayOffice, file_url, properties  # noqa: E402
import uno  # noqa: E402  (importable once assoc_office has checked for it)

try:
    from PIL import Image, ImageChops
except ImportError:  # pragma: no cover - the message is the point
    raise SystemExit("Pillow is missing: install python3-pil and run this with /usr/bin/python3")

SAMPLES = HERE.parent / "samples"
DPI = 96
COLOURS = 64

# (image, workbook, sheet, cell range): what docs/guide.md shows.
SHOTS = [
    ("quick-start.png", "quick_start.fods", "Quick start", "B1:K7"),
    ("arrays.png", "quick_start.fods", "Quick start", "B8:H21"),
    ("report.png", "promotions.fods", "Promotions", "A4:G28"),
    ("simpson.png", "hr_review.fods", "Offices", "A1:N24"),
    ("simpson-why.png", "hr_review.fods", "Offices", "A25:I42"),
    ("impact.png", "hr_review.fods", "Selection", "A11:N27"),
    ("rates-and-pairs.png", "hr_review.fods", "Departments", "A1:N33"),
    ("common-risk-ratio.png", "hr_review.fods", "Departments", "A35:I40"),
    ("invoice-counts.png", "invoice_exceptions.fods", "By region", "A4:K32"),
    ("ordinal.png", "staff_survey.fods", "By tenure", "A4:V31"),
    ("within.png", "staff_survey.fods", "Within offices", "A20:H47"),
    ("repeated.png", "staff_survey.fods", "Waves", "A4:P21"),
]


def render(office, workbook, shots, folder, out):
    doc = office.load(SAMPLES / workbook)
    try:
        doc.calculateAll()
        # One big page at 100% and no footer, so that every range comes out whole and at its real size.
        pages = doc.StyleFamilies.getByName("PageStyles")
        for name in pages.ElementNames:
            page = pages.getByName(name)
            page.FooterIsOn = page.HeaderIsOn = False
            page.ScaleToPagesX = page.ScaleToPagesY = 0
            page.PageScale = 100
            page.IsLandscape = False
            page.Width, page.Height = 60000, 60000
        for image, _, sheet, cells in shots:
            pdf = folder / (image + ".pdf")
            selection = doc.Sheets.getByName(sheet).getCellRangeByName(cells)
            filter_data = uno.Any("[]com.sun.star.beans.PropertyValue", properties(Selection=selection))
            doc.storeToURL(file_url(pdf), properties(FilterName="calc_pdf_Export", FilterData=filter_data))
            stem = folder / image.removesuffix(".png")
            subprocess.run(["pdftoppm", "-r", str(DPI), "-png", "-singlefile", "-f", "1", "-l", "1",
                            str(pdf), str(stem)], check=True)
            shrink(stem.with_suffix(".png"), out / image)
            print(f"wrote {out / image}")
    finally:
        doc.close(True)


def shrink(source, target, margin=10):
    picture = Image.open(source).convert("RGB")
    background = Image.new("RGB", picture.size, (255, 255, 255))
    box = ImageChops.difference(picture, background).getbbox()
    if box is None:
        raise RuntimeError(f"{source} is blank")
    left, top, right, bottom = box
    picture = picture.crop((max(0, left - margin), max(0, top - margin),
                            min(picture.width, right + margin), min(picture.height, bottom + margin)))
    picture.quantize(colors=COLOURS, method=Image.Quantize.MEDIANCUT).save(target, optimize=True)


def main():
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--oxt", required=True, help="the built extension, e.g. build/extension/assoc.oxt")
    parser.add_argument("--out", default=str(HERE.parent / "docs" / "images"), help="folder for the PNG files")
    options = parser.parse_args()
    if shutil.which("pdftoppm") is None:
        raise SystemExit("pdftoppm is missing: install poppler-utils")
    if shutil.which("fc-match") is not None:
        found = subprocess.run(["fc-match", "-f", "%{family}", "Liberation Sans"], capture_output=True,
                               text=True).stdout
        if "Liberation Sans" not in found:
            raise SystemExit(f"the font Liberation Sans is missing (the office would draw {found or 'another'}): "
                             "install fonts-liberation2")
    out = pathlib.Path(options.out).resolve()
    out.mkdir(parents=True, exist_ok=True)
    with ThrowawayOffice(options.oxt, log=lambda message: print(f"[office] {message}", flush=True)) as office, \
            tempfile.TemporaryDirectory(prefix="assoc-render-") as scratch:
        for workbook in dict.fromkeys(shot[1] for shot in SHOTS):
            render(office, workbook, [shot for shot in SHOTS if shot[1] == workbook], pathlib.Path(scratch), out)


if __name__ == "__main__":
    main()
