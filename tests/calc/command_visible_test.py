#!/usr/bin/python3
"""The menu command in a visible Calc window: a virtual X server (Xvfb), a throwaway office with the
extension installed, the sample workbook samples/promotions.fods (a copy) open in a window, its
count table selected, and the command run as a user runs it: the Data menu opened with the keyboard
(Alt+D), Statistics ▸ "Analyse Selection with Assoc..." chosen, and the dialog's "Make the Sheet"
button pressed; then the new sheet is checked, undone with Ctrl+Z in one step, the toolbar button run
and cancelled, and a single selected column answered with a message box. Keys go through the office's own event queue (the toolkit's XToolkitRobot); menus, dialogs and
buttons are found through the accessibility API. Screenshots of the menu, the dialog and the sheet
are taken from the X server.

    /usr/bin/python3 tests/calc/command_visible_test.py --oxt build/extension/assoc.oxt [--shots docs/images]

With --shots the screenshots are kept there (scripts/render_samples.sh regenerates the guide's
images this way). Where the test cannot run (no Xvfb, no Pillow with X support, an office without
its window system such as the -nogui packages), it says why and exits with 77, which CTest reports
as skipped; it never reports a pass it did not see.
"""

import argparse
import os
import pathlib
import random
import shutil
import signal
import subprocess
import sys
import tempfile
import time
import traceback

ROOT = pathlib.Path(__file__).resolve().parents[2]
sys.path.insert(0, str(ROOT / "scripts"))

SKIP = 77
TITLE = "Analyse Selection with Assoc"
SHEET = "Department × Promotion outcome"
SCREEN = (1280, 900)


def skip(reason):
    print(f"SKIPPED: the visible test cannot run here: {reason}", flush=True)
    sys.exit(SKIP)


try:
    from PIL import Image, ImageGrab
    from PIL import features as pil_features  # noqa: F401
except ImportError:
    skip("Pillow is missing (Debian: python3-pil)")
try:
    import uno
    from com.sun.star.awt import KeyEvent
    from assoc_office import ThrowawayOffice, properties
except (ImportError, SystemExit) as error:
    skip(f"the uno module is missing ({error})")


class VirtualScreen:
    """An Xvfb server on a free display; stop() ends it and its process group. -noreset: without it the
    server resets when its last client leaves (the readiness check below), and an office that connects
    during the reset finds no display."""

    def __init__(self):
        if shutil.which("Xvfb") is None:
            skip("Xvfb is missing (Debian: xvfb)")
        if not Image.core.HAVE_XCB:
            skip("this Pillow cannot read an X screen (built without XCB)")
        self.process = None
        self.tried = set()

    def next(self):
        self.stop()
        for number in random.sample(range(40, 200), 40):
            if number in self.tried or os.path.exists(f"/tmp/.X{number}-lock") or \
                    os.path.exists(f"/tmp/.X11-unix/X{number}"):
                continue
            self.tried.add(number)
            self.process = subprocess.Popen(
                ["Xvfb", f":{number}", "-screen", "0", f"{SCREEN[0]}x{SCREEN[1]}x24", "-nolisten", "tcp", "-noreset"],
                stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, start_new_session=True)
            self.display = f":{number}"
            deadline = time.monotonic() + 10
            while time.monotonic() < deadline and self.process.poll() is None:
                try:
                    ImageGrab.grab(xdisplay=self.display)
                    return self.display
                except OSError:
                    time.sleep(0.1)
            self.stop()
        skip("no Xvfb display could be started")

    def stop(self):
        """Ends the server politely (it removes its lock file then), or by force."""
        if self.process is None:
            return
        for sig, wait in ((signal.SIGTERM, 5), (signal.SIGKILL, 5)):
            try:
                os.killpg(self.process.pid, sig)
                self.process.wait(timeout=wait)
                break
            except ProcessLookupError:
                break
            except subprocess.TimeoutExpired:
                continue
        self.process = None

    def grab(self, box=None):
        picture = ImageGrab.grab(xdisplay=self.display)
        return picture.crop(box) if box else picture


def start_office(screen, oxt):
    """A throwaway office with windows on the virtual screen; another display when it cannot open one."""
    for _ in range(3):
        display = screen.next()
        try:
            return ThrowawayOffice(oxt, log=lambda m: print(f"[office] {m}", flush=True), display=display).__enter__()
        except RuntimeError as error:
            if "Can't open display" not in str(error):
                raise
            print(f"the office could not open the display {display}; trying another", flush=True)
    skip("the office cannot open a window on a virtual screen (an office without its window system, such as "
         "the -nogui packages?)")


def wait_until(condition, seconds, what):
    deadline = time.monotonic() + seconds
    while time.monotonic() < deadline:
        value = condition()
        if value:
            return value
        time.sleep(0.1)
    raise AssertionError(f"timed out after {seconds} s waiting for {what}")


ROLE = {name: uno.getConstantByName(f"com.sun.star.accessibility.AccessibleRole.{name}")
        for name in ("MENU", "MENU_ITEM", "PUSH_BUTTON", "TABLE", "DOCUMENT_SPREADSHEET", "SCROLL_PANE")}
ENABLED = uno.getConstantByName("com.sun.star.accessibility.AccessibleStateType.ENABLED")
SELECTED = uno.getConstantByName("com.sun.star.accessibility.AccessibleStateType.SELECTED")


def find(accessible, matches, depth=6):
    """The first accessible below `accessible` (itself included) whose context matches; the cells of
    the sheet are not searched."""
    context = accessible.getAccessibleContext()
    if matches(context):
        return accessible
    if depth == 0 or context.getAccessibleRole() in (ROLE["TABLE"], ROLE["DOCUMENT_SPREADSHEET"], ROLE["SCROLL_PANE"]):
        return None
    for i in range(context.getAccessibleChildCount()):
        found = find(context.getAccessibleChild(i), matches, depth - 1)
        if found is not None:
            return found
    return None


def named(name, role=None):
    return lambda c: c.getAccessibleName() == name and (role is None or c.getAccessibleRole() == role)


def starting(words, role):
    return lambda c: c.getAccessibleName().startswith(words) and c.getAccessibleRole() == role


class VisibleSession:
    def __init__(self, screen, office, shots):
        self.screen, self.office, self.shots = screen, office, shots
        self.toolkit = office.service("com.sun.star.awt.Toolkit")

    def key(self, name, char="", modifiers=0):
        """Presses and releases a key in the document's window."""
        event = KeyEvent()
        event.Source = self.window
        event.KeyCode = uno.getConstantByName(f"com.sun.star.awt.Key.{name}")
        if char:
            event.KeyChar = char
        event.Modifiers = modifiers
        self.toolkit.keyPress(event)
        self.toolkit.keyRelease(event)
        time.sleep(0.3)

    @staticmethod
    def press_button(window, name):
        button = find(window, named(name, ROLE["PUSH_BUTTON"]), 4)
        assert button is not None, f"no button {name}"
        button.getAccessibleContext().doAccessibleAction(0)

    def top_window(self, name):
        for i in range(self.toolkit.getTopWindowCount()):
            window = self.toolkit.getTopWindow(i)
            context = window.getAccessibleContext() if window is not None else None
            if context is not None and context.getAccessibleName() == name:  # a closing window has none
                return window
        return None

    def shot(self, name, box=None):
        picture = self.screen.grab(box)
        self.assert_drawn(picture, name)
        if self.shots:
            picture.convert("RGB").quantize(colors=128, method=Image.Quantize.MEDIANCUT).save(
                self.shots / name, optimize=True)
            print(f"wrote {self.shots / name}", flush=True)

    @staticmethod
    def assert_drawn(picture, name):
        colours = picture.convert("RGB").getcolors(maxcolors=1 << 16)
        if colours is not None and len(colours) < 8:
            raise AssertionError(f"the screenshot {name} is nearly blank ({len(colours)} colours)")

    def run(self, workbook):
        office = self.office
        misc = office.service("com.sun.star.configuration.ConfigurationProvider").createInstanceWithArguments(
            "com.sun.star.configuration.ConfigurationUpdateAccess",
            properties(nodepath="/org.openoffice.Office.Common/Misc"))
        misc.ShowTipOfTheDay = False  # a fresh profile would greet the first window with a tip
        misc.commitChanges()
        copy = office.scratch_path(workbook.name)
        shutil.copy(workbook, copy)  # the office locks what it opens: never the repository's file
        self.doc = doc = office.load(copy, hidden=False)
        controller = doc.getCurrentController()
        frame = controller.getFrame()
        frame.getContainerWindow().setPosSize(0, 0, SCREEN[0], SCREEN[1], 15)
        self.window = controller.ComponentWindow
        controller.select(doc.NamedRanges.getByName("CountTable").getReferredCells())
        time.sleep(1)
        top = frame.getContainerWindow()

        # The menu entry: Data (Alt+D), up to its last entry Statistics, into it, up to its last entry.
        data = wait_until(lambda: find(top, named("Data", ROLE["MENU"]), 4), 10, "the Data menu")
        self.key("D", "d", uno.getConstantByName("com.sun.star.awt.KeyModifier.MOD2"))
        self.key("UP")
        self.key("RIGHT")
        self.key("UP")
        statistics = wait_until(lambda: find(data, named("Statistics", ROLE["MENU"]), 2), 10, "Data ▸ Statistics")
        entry = wait_until(lambda: find(statistics, starting(TITLE, ROLE["MENU_ITEM"]), 2), 10,
                           f"the menu entry Data ▸ Statistics ▸ {TITLE}")
        entry = entry.getAccessibleContext()
        states = entry.getAccessibleStateSet()
        assert states.contains(ENABLED), "the menu entry is disabled although a range is selected"
        assert states.contains(SELECTED), "the keys did not reach the command's menu entry"
        time.sleep(0.5)
        bottom = entry.getLocationOnScreen().Y + entry.getSize().Height + 12
        self.shot("command-menu.png", (0, 0, 900, min(SCREEN[1], bottom)))
        self.key("RETURN", "\r")

        dialog = wait_until(lambda: self.top_window(TITLE), 20, "the command's dialog")
        time.sleep(1)
        box = dialog.getAccessibleContext()
        corner, size = box.getLocationOnScreen(), box.getSize()
        selection = find(dialog, lambda c: c.getAccessibleName().startswith("A table of counts"), 4)
        assert selection is not None, "the dialog does not say what the selection holds"
        self.shot("command-dialog.png", (corner.X, corner.Y, corner.X + size.Width, corner.Y + size.Height))
        self.press_button(dialog, "Make the Sheet")

        wait_until(lambda: doc.Sheets.hasByName(SHEET), 30, f"the sheet {SHEET}")
        sheet = doc.Sheets.getByName(SHEET)
        # The sheet is inserted before the command shows it and closes its dialog: wait for both.
        wait_until(lambda: doc.getCurrentController().getActiveSheet().Name == SHEET, 30, "the new sheet shown")
        doc.calculateAll()
        assert sheet.getCellRangeByName("A1").getString() == "Association analysis: " + SHEET
        labels = [row[0] for row in sheet.getCellRangeByName("A1:A60").getDataArray()]
        pearson = sheet.getCellByPosition(1, labels.index("Pearson X²"))
        assert pearson.getError() == 0 and pearson.getValue() > 0, "Pearson X² shows no value"
        time.sleep(2)
        self.shot("command-sheet.png", (0, 0, SCREEN[0], SCREEN[1]))
        print(f"made the sheet {SHEET}: Pearson X² = {pearson.getString()}", flush=True)
        # Further down: the rates by row and the pairs of rows.
        labels = [row[0] for row in sheet.getCellRangeByName("A1:A200").getDataArray()]
        rates = next(row for row, text in enumerate(labels) if isinstance(text, str) and "Rates by row" in text)
        doc.getCurrentController().setFirstVisibleRow(rates - 1)
        time.sleep(1)
        self.shot("command-memo.png", (0, 0, SCREEN[0], SCREEN[1]))

        # One undo step takes the whole sheet away, in a visible window.
        self.key("Z", "z", uno.getConstantByName("com.sun.star.awt.KeyModifier.MOD1"))
        wait_until(lambda: not doc.Sheets.hasByName(SHEET), 20, "Ctrl+Z to remove the sheet")
        assert doc.Sheets.ElementNames == ("Promotions",), doc.Sheets.ElementNames

        print("Ctrl+Z removed the sheet in one step", flush=True)

        # The toolbar button runs the same command; Cancel in its dialog changes nothing.
        toolbar = frame.LayoutManager.getElement("private:resource/toolbar/addon_org.assocproject.calc.toolbar")
        assert toolbar is not None, "the Assoc toolbar is not shown"
        button = find(toolbar.getRealInterface(), named(TITLE, ROLE["PUSH_BUTTON"]), 3)
        assert button is not None, "the toolbar has no button " + TITLE
        button = button.getAccessibleContext()
        # After Undo one cell is selected and the button is disabled; with the table it is enabled.
        assert not button.getAccessibleStateSet().contains(ENABLED), "the button is enabled for one cell"
        controller.select(doc.NamedRanges.getByName("CountTable").getReferredCells())
        wait_until(lambda: button.getAccessibleStateSet().contains(ENABLED), 10, "the toolbar button to be enabled")
        button.doAccessibleAction(0)
        print("toolbar button pressed", flush=True)
        dialog = wait_until(lambda: self.top_window(TITLE), 20, "the dialog from the toolbar button")
        time.sleep(0.5)
        self.press_button(dialog, "Cancel")
        wait_until(lambda: self.top_window(TITLE) is None, 20, "Cancel to close the dialog")
        assert doc.Sheets.ElementNames == ("Promotions",), doc.Sheets.ElementNames
        print("the toolbar button opened the dialog; Cancel made no sheet", flush=True)

        # A selection the command cannot read gets a message box, and no sheet.
        controller.select(doc.Sheets.getByName("Promotions").getCellRangeByName("D5:D9"))
        wait_until(lambda: button.getAccessibleStateSet().contains(ENABLED), 10, "the button for a column")
        button.doAccessibleAction(0)
        message = wait_until(lambda: self.top_window("Assoc: analyse selection"), 20, "the message box")
        text = find(message, lambda c: c.getAccessibleName().startswith("Only one column is selected."), 4)
        assert text is not None, "the message box does not say why"
        self.press_button(message, "OK")
        wait_until(lambda: self.top_window("Assoc: analyse selection") is None, 20, "OK to close the message")
        assert doc.Sheets.ElementNames == ("Promotions",), doc.Sheets.ElementNames
        print("a single column got the message box and no sheet", flush=True)
        doc.close(True)



def main():
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--oxt", required=True, help="the built extension, e.g. build/extension/assoc.oxt")
    parser.add_argument("--shots", help="a folder to keep the screenshots in (the guide's docs/images)")
    options = parser.parse_args()
    shots = pathlib.Path(options.shots).resolve() if options.shots else None
    if shots:
        shots.mkdir(parents=True, exist_ok=True)
    started = time.monotonic()
    screen = VirtualScreen()
    try:
        office = start_office(screen, options.oxt)
        try:
            session = VisibleSession(screen, office, shots)
            try:
                session.run(ROOT / "samples" / "promotions.fods")
            except Exception:
                traceback.print_exc()
                with tempfile.NamedTemporaryFile(prefix="command-visible-failure-", suffix=".png", delete=False) as f:
                    screen.grab().save(f.name)
                    print(f"the screen at the failure: {f.name}", flush=True)
                # A dialog may still be open, and asking the office to quit would wait for it.
                os.killpg(office.process.pid, signal.SIGKILL)
                raise
        finally:
            office.close()
    finally:
        screen.stop()
    print(f"Visible command test passed in {time.monotonic() - started:.1f} s", flush=True)


if __name__ == "__main__":
    main()
