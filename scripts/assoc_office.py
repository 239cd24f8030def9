"""A throwaway LibreOffice with the Assoc extension installed, for the Calc tests and the demo.

    with ThrowawayOffice("build/extension/assoc.oxt") as office:
        doc = office.new_spreadsheet()
        ...

Everything lives in one temporary folder: the user profile, the shared extension folder, HOME and
TMPDIR of the office. Nothing is written outside it, so this works the same as root and as an
ordinary user, and leaves nothing behind. The office is one headless soffice on a named pipe in its
own process group; leaving the `with` block (also through an exception, or SIGTERM, which becomes
KeyboardInterrupt) asks it to quit, kills the process group if it does not, and removes the folder.
A small watchdog process does the same if this process is killed outright.

Needs /usr/bin/python3 with the uno module (Debian's python3-uno).
"""

import os
import pathlib
import shutil
import signal
import subprocess
import sys
import tempfile
import time
import uuid

try:
    import uno
    from com.sun.star.beans import PropertyValue
    from com.sun.star.connection import NoConnectException
except ImportError as error:  # pragma: no cover - the message is the point
    raise SystemExit(f"The uno module is missing ({error}). Run this with /usr/bin/python3 "
                     "and install python3-uno (scripts/install-deps.sh).")

SOFFICE = shutil.which("soffice") or "/usr/bin/soffice"
UNOPKG = shutil.which("unopkg") or "/usr/bin/unopkg"
START_TIMEOUT_SECONDS = 60
INSTALL_TIMEOUT_SECONDS = 120

# Run beside the office: if this Python process dies without cleaning up (SIGKILL from a test
# runner's timeout), it kills the office's process group and removes the folder.
WATCHDOG = r"""
import os, shutil, signal, sys, time
parent, group, folder = int(sys.argv[1]), int(sys.argv[2]), sys.argv[3]
while os.getppid() == parent and os.path.isdir(folder):
    time.sleep(0.5)
if os.path.isdir(folder):
    try:
        os.killpg(group, signal.SIGKILL)
    except ProcessLookupError:
        pass
    shutil.rmtree(folder, ignore_errors=True)
"""


def properties(**values):
    """A tuple of PropertyValue, as UNO calls take them."""
    result = []
    for name, value in values.items():
        prop = PropertyValue()
        prop.Name, prop.Value = name, value
        result.append(prop)
    return tuple(result)


def _interrupt(signum, frame):
    raise KeyboardInterrupt(f"signal {signum}")


def file_url(path):
    return uno.systemPathToFileUrl(str(pathlib.Path(path).resolve()))


class ThrowawayOffice:
    """display: None for a headless office; an X display (":5") for one with windows there."""

    def __init__(self, oxt, log=None, display=None):
        self.oxt = pathlib.Path(oxt).resolve()
        self.display = display
        self.log = log or (lambda message: None)
        self.folder = None
        self.process = None
        self.watchdog = None
        self.context = None
        self.desktop = None

    # -- life cycle ---------------------------------------------------------------------------

    def __enter__(self):
        # A test runner's timeout sends SIGTERM: unwind through the normal clean-up.
        signal.signal(signal.SIGTERM, _interrupt)
        try:
            self._prepare()
            self._install_extension()
            self._start()
        except BaseException:
            self.close()
            raise
        return self

    def __exit__(self, *exc):
        self.close()
        return False

    def _prepare(self):
        if not self.oxt.is_file():
            raise RuntimeError(f"{self.oxt} does not exist; build it first (cmake --build build)")
        self.folder = pathlib.Path(tempfile.mkdtemp(prefix="assoc-office-"))
        for sub in ("profile", "shared", "home", "tmp"):
            (self.folder / sub).mkdir()
        self.env = dict(os.environ, HOME=str(self.folder / "home"), TMPDIR=str(self.folder / "tmp"))
        if self.display:
            self.env["DISPLAY"] = self.display
        self.office_flags = [
            f"-env:UserInstallation={file_url(self.folder / 'profile')}",
            f"-env:UNO_SHARED_PACKAGES={file_url(self.folder / 'shared')}",
            f"-env:UNO_SHARED_PACKAGES_CACHE={file_url(self.folder / 'shared')}/cache",
        ]

    def _install_extension(self):
        # --shared (into our own shared folder) is what unopkg allows as root, and works as a user too.
        started = time.monotonic()
        result = subprocess.run([UNOPKG, "add", "--shared", "-s", *self.office_flags, str(self.oxt)],
                                env=self.env, capture_output=True, text=True, timeout=INSTALL_TIMEOUT_SECONDS,
                                start_new_session=True)
        if result.returncode != 0:
            raise RuntimeError(f"unopkg add failed ({result.returncode}):\n{result.stdout}{result.stderr}")
        self.log(f"installed {self.oxt.name} in {time.monotonic() - started:.1f} s")

    def _start(self):
        started = time.monotonic()
        pipe = f"assoc_{os.getpid()}_{uuid.uuid4().hex[:8]}"
        self.office_log = open(self.folder / "soffice.log", "a")  # a restart adds to it
        unseen = [] if self.display else ["--headless", "--invisible"]
        self.process = subprocess.Popen(
            [SOFFICE, *unseen, "--nologo", "--norestore", "--nodefault", "--nolockcheck",
             *self.office_flags, f"--accept=pipe,name={pipe};urp;StarOffice.ComponentContext"],
            env=self.env, stdout=self.office_log, stderr=subprocess.STDOUT, start_new_session=True)
        self.watchdog = subprocess.Popen([sys.executable, "-c", WATCHDOG, str(os.getpid()), str(self.process.pid),
                                          str(self.folder)], start_new_session=True)
        local = uno.getComponentContext()
        resolver = local.ServiceManager.createInstanceWithContext("com.sun.star.bridge.UnoUrlResolver", local)
        deadline = time.monotonic() + START_TIMEOUT_SECONDS
        while True:
            try:
                self.context = resolver.resolve(f"uno:pipe,name={pipe};urp;StarOffice.ComponentContext")
                break
            except NoConnectException:
                if self.process.poll() is not None:
                    raise RuntimeError(f"soffice exited with {self.process.returncode} before its pipe opened; "
                                       f"log:\n{self._office_log_text()}")
                if time.monotonic() > deadline:
                    raise RuntimeError(f"soffice did not open its pipe within {START_TIMEOUT_SECONDS} s")
                time.sleep(0.1)
        self.desktop = self.service("com.sun.star.frame.Desktop")
        self.log(f"office answered in {time.monotonic() - started:.1f} s")

    def _office_log_text(self):
        try:
            return (self.folder / "soffice.log").read_text(errors="replace")[-4000:]
        except OSError:
            return "(no log)"

    def close(self):
        """Quits the office (killing its process group if it lingers) and removes the folder."""
        self._quit()
        if self.folder is not None:
            shutil.rmtree(self.folder, ignore_errors=True)
            self.folder = None

    def restart(self):
        """Quits the office and starts it again on the same profile, as a user closes LibreOffice and
        opens it again. Documents of the office are gone; open them again with load()."""
        self._quit()
        self._start()

    def remove_extension(self):
        """Quits the office, removes the extension from the throwaway profile and starts the office
        again (without the extension), as a colleague's office without it."""
        self._quit()
        result = subprocess.run([UNOPKG, "remove", "--shared", "-s", *self.office_flags, self.identifier()],
                                env=self.env, capture_output=True, text=True, timeout=INSTALL_TIMEOUT_SECONDS,
                                start_new_session=True)
        if result.returncode != 0:
            raise RuntimeError(f"unopkg remove failed ({result.returncode}):\n{result.stdout}{result.stderr}")
        self._start()

    def add_extension(self):
        """Quits the office, installs the extension again and starts the office again."""
        self._quit()
        self._install_extension()
        self._start()

    def identifier(self):
        """The extension's identifier, from the description.xml inside the .oxt."""
        import re
        import zipfile
        with zipfile.ZipFile(self.oxt) as archive:
            found = re.search(rb'<identifier value="([^"]+)"', archive.read("description.xml"))
        if not found:
            raise RuntimeError(f"{self.oxt} has no identifier in its description.xml")
        return found.group(1).decode()

    def _quit(self):
        """Quits the office (killing its process group if it lingers); keeps the folder."""
        asked_to_quit = False
        if self.desktop is not None:
            try:
                self.desktop.terminate()
            except Exception:  # the bridge goes down while terminate() returns
                pass
            asked_to_quit = True
            self.desktop = None
        if self.process is not None:
            if asked_to_quit:
                try:
                    self.process.wait(timeout=10)
                except subprocess.TimeoutExpired:
                    pass
            # The launcher may have exited while soffice.bin lives on in the same group.
            try:
                os.killpg(self.process.pid, signal.SIGKILL)
            except ProcessLookupError:
                pass
            try:
                self.process.wait(timeout=5)
            except subprocess.TimeoutExpired:
                pass
            self.process = None
        if self.watchdog is not None:
            self.watchdog.kill()
            self.watchdog.wait()
            self.watchdog = None
        if getattr(self, "office_log", None) is not None:
            self.office_log.close()
            self.office_log = None

    # -- working with documents ---------------------------------------------------------------

    def service(self, name):
        return self.context.ServiceManager.createInstanceWithContext(name, self.context)

    def new_spreadsheet(self):
        return self.desktop.loadComponentFromURL("private:factory/scalc", "_blank", 0, properties(Hidden=True))

    def load(self, path, hidden=True):
        doc = self.desktop.loadComponentFromURL(file_url(path), "_blank", 0, properties(Hidden=hidden))
        if doc is None:
            raise RuntimeError(f"the office could not open {path}")
        return doc

    def scratch_path(self, name):
        """A path inside the throwaway folder, for files a test writes."""
        return self.folder / "tmp" / name
