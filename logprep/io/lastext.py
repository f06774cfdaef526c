"""A LAS file as bytes and text, checked before anything is parsed or sized.

:func:`load_las_source` reads one file and returns its header text (decoded, cleaned)
and its log data section (raw bytes), refusing at once what is not LAS text: an empty
or oversized file, binary content (NUL bytes in the first megabytes or at the end, as
an archive, a PDF or a copy padded with zeros leaves), a web page saved as ``.las``.

Header text is decoded as UTF-8 first (a byte-order mark for UTF-8 or UTF-16 is
honoured); when it is not valid UTF-8 it is read as Windows-1252, then ISO-8859-1, and a
warning says so.  Header lines are made safe for lasio's parser, which is slow on
pathological headers: a line over :data:`MAX_HEADER_LINE` characters is cut (with a
warning), mnemonics repeated within a section are given unique names beforehand (lasio's
own renaming is cubic in the repeats), control characters are removed.  LAS 3.0 keeps
only the sections the log needs (version, well, parameters, the log definition and the
first log data set); the other data sets (core, drilling, tops...) are dropped with a
warning.  Only :mod:`logprep.errors` is imported from logprep.
"""

from __future__ import annotations

import codecs
import hashlib
import re
from dataclasses import dataclass, field
from pathlib import Path

from logprep.errors import LasReadError
from logprep.io.safetext import show_path

MAX_FILE_BYTES = 2 * 1024**3
"""Largest LAS file read (2 GiB): about 10 million rows of 10 curves, far beyond any single
log run.  Larger files are refused before reading (split them into depth intervals)."""

HEAD_BYTES = 4 * 1024**2
"""Bytes read first to recognise binary content, and bytes checked at the end of the file."""

MAX_HEADER_LINE = 4096
"""Longest header line kept whole (characters); longer lines keep the first
:data:`HEADER_FIELD_KEEP` characters of their value and description."""

HEADER_FIELD_KEEP = 256

HEADER_FALLBACK_ENCODINGS = ("cp1252", "latin-1")
"""Tried in order when the header is not valid UTF-8 (Windows-1252 first: the usual
encoding of LAS files written on Windows; ISO-8859-1 decodes any byte)."""

_MAGIC = [
    (b"\x1f\x8b", "a gzip archive", "unpack it (gunzip) and screen the .las inside"),
    (b"PK\x03\x04", "a zip archive", "unzip it and screen the .las files inside"),
    (b"%PDF", "a PDF document", "export the log as LAS from the program that made the PDF"),
    (b"7z\xbc\xaf", "a 7-zip archive", "unpack it and screen the .las files inside"),
    (b"Rar!", "a RAR archive", "unpack it and screen the .las files inside"),
    (b"\x89PNG", "a PNG image", "use the LAS file itself, not a picture of the log"),
    (b"\xff\xd8\xff", "a JPEG image", "use the LAS file itself, not a picture of the log"),
]
_HTML = re.compile(rb"^\s*(<!doctype html|<html|<\?xml|<head|<body)", re.IGNORECASE)
_CONTROL = re.compile(r"[\x00-\x08\x0b\x0c\x0e-\x1f\x7f-\x9f]")
_FIX_DOWNLOAD = "download or copy it again from the source"


@dataclass
class LasSource:
    """One LAS file split for parsing.

    ``header`` is the decoded, cleaned header text up to (not including) the log data
    section line; ``data_title`` that line (``~A ...``); ``data`` the raw bytes after it
    (a memoryview; UTF-8 for a UTF-16 file) and ``file_offset`` where they start in the
    file (None when converted); ``sha256`` the digest of the file bytes; ``version`` the ``VERS`` value as text; ``wrap`` True for
    ``WRAP. YES``; ``delimiter`` the LAS 3.0 ``DLM`` value (``SPACE`` by default);
    ``renamed`` maps the names given to repeated mnemonics back to lasio-style names
    (``GR:2``); ``warnings`` lists what was changed or guessed.
    """

    path: Path
    header: str
    data_title: str
    data: memoryview
    encoding: str
    version: str = ""
    wrap: bool = False
    delimiter: str = "SPACE"
    renamed: dict[str, str] = field(default_factory=dict)
    warnings: list[str] = field(default_factory=list)
    sha256: str = ""
    file_offset: int | None = None

    def has_rows(self) -> bool:
        """True when the data section holds anything but blanks."""
        return bool(bytes(self.data[:65536]).strip()) or bool(bytes(self.data).strip())

    def drop_data(self) -> None:
        """Free the file's bytes (after parsing)."""
        self.data = memoryview(b"")

    @property
    def is_las3(self) -> bool:
        return self.version.startswith("3")


def check_file(path: Path) -> int:
    """Size of ``path`` in bytes after the checks that need no reading: the file exists,
    is not empty and not over :data:`MAX_FILE_BYTES`."""
    where = show_path(path)
    if not path.exists():
        raise LasReadError(f"{where}: file not found; check the path (and its spelling)")
    try:
        size = path.stat().st_size
    except OSError as exc:
        raise LasReadError(f"{where}: cannot be read ({exc.strerror or exc}); check the path "
                           "and that you may read the file") from None
    if not path.is_file():
        raise LasReadError(f"{where}: not a regular file; name a LAS file or a folder of them")
    if size == 0:
        raise LasReadError(f"{where}: file is empty (0 bytes); {_FIX_DOWNLOAD}")
    if size > MAX_FILE_BYTES:
        raise LasReadError(
            f"{where}: file is {size / 1024**3:.1f} GiB, over the {MAX_FILE_BYTES / 1024**3:g} GiB "
            "limit for one LAS file; split it into depth intervals and screen those")
    return size


def check_binary(where: str, head: bytes, tail: bytes, size: int) -> None:
    """Refuse content that is not text: known archive/document signatures, HTML, NUL
    bytes in ``head`` (the first bytes) or ``tail`` (the last bytes)."""
    for magic, what, fix in _MAGIC:
        if head.startswith(magic):
            raise LasReadError(f"{where}: file is {what}, not LAS text; {fix}")
    if _HTML.match(head[:1024]):
        raise LasReadError(f"{where}: file is a web page (HTML/XML), not LAS text; save the "
                           "LAS file itself (the download link, not the page)")
    nul = head.find(b"\0")
    if nul >= 0:
        share = head.count(b"\0") / max(len(head), 1)
        raise LasReadError(
            f"{where}: binary data (NUL bytes from byte {nul:,}; {share:.0%} of the first "
            f"{len(head):,} bytes), not LAS text, as a copy padded with zeros or a binary file "
            f"saved as .las holds; {_FIX_DOWNLOAD}")
    if tail and b"\0" in tail:
        run = len(tail) - len(tail.rstrip(b"\0"))
        detail = f"ends in {run:,} NUL bytes" if run else "has NUL bytes near its end"
        raise LasReadError(f"{where}: file {detail} (of {size:,}), as a copy cut short or "
                           f"padded with zeros leaves; {_FIX_DOWNLOAD}")


def read_checked_bytes(path: str | Path) -> bytes:
    """The bytes of ``path`` after :func:`check_file` and :func:`check_binary` (the head
    and the tail are checked before the rest is read)."""
    path = Path(path)
    size = check_file(path)
    where = show_path(path)
    with path.open("rb") as f:
        head = f.read(HEAD_BYTES)
        utf16 = head.startswith((b"\xff\xfe", b"\xfe\xff"))
        tail = b""
        if size > len(head):
            f.seek(max(size - HEAD_BYTES, len(head)))
            tail = f.read()
        if not utf16:
            check_binary(where, head, tail, size)
        if size <= len(head):
            return head
        del head, tail  # read the whole file in one piece: no second copy of it
        f.seek(0)
        return f.read()


def decode_header(raw: bytes) -> tuple[str, str]:
    """``(text, encoding)`` of header bytes: UTF-8 (with or without a byte-order mark),
    else the first of :data:`HEADER_FALLBACK_ENCODINGS` that decodes them."""
    raw = raw.removeprefix(codecs.BOM_UTF8)
    try:
        return raw.decode("utf-8"), "utf-8"
    except UnicodeDecodeError:
        pass
    for enc in HEADER_FALLBACK_ENCODINGS:
        try:
            return raw.decode(enc), enc
        except UnicodeDecodeError:
            continue
    raise AssertionError("latin-1 decodes any byte")  # pragma: no cover


def _utf16_to_utf8(where: str, raw: bytes) -> bytes:
    try:
        return raw.decode("utf-16").encode("utf-8")
    except UnicodeDecodeError:
        raise LasReadError(f"{where}: starts with a UTF-16 byte-order mark but is not UTF-16 "
                           "text; save it again as UTF-8 or ASCII") from None


def _has_section(raw: bytes, end: int) -> bool:
    """True when a line within the first ``end`` bytes starts a section (``~`` first on
    the line, after blanks)."""
    k = raw.find(b"~", 0, end)
    while k >= 0:
        if raw[raw.rfind(b"\n", 0, k) + 1:k].strip(b" \t\r") == b"":
            return True
        k = raw.find(b"~", k + 1, end)
    return False


def _data_section(raw: bytes) -> tuple[int, int] | None:
    """``(start of the ~A/~Log_Data line, start of the next line)`` of the first log data
    section, or None.  Sections are found one ``~`` at a time, so the data bytes are not
    scanned with a regular expression."""
    pos = 0
    while True:
        k = raw.find(b"~", pos)
        if k < 0:
            return None
        line_start = raw.rfind(b"\n", 0, k) + 1
        if raw[line_start:k].strip(b" \t") == b"":
            name = raw[k + 1:k + 40].split(b"\n")[0].strip().upper()
            if name.startswith((b"A", b"LOG_DATA")):
                nl = raw.find(b"\n", k)
                return line_start, (len(raw) if nl < 0 else nl + 1)
        pos = k + 1


def _header_value(header: str, mnemonic: str) -> str:
    m = re.search(rf"(?im)^[ \t]*{mnemonic}[ \t]*\.[^ \t]*[ \t]+([^:\n]*?)[ \t]*(?::|$)", header)
    return m.group(1).strip() if m else ""


def _las3_log_only(text: str, warnings: list[str]) -> str:
    """The sections of a LAS 3.0 text that hold the log (see the module docstring)."""
    kept, dropped, seen_log_data = [], [], False
    parts = re.split(r"(?m)^(?=[ \t]*~)", text)
    for part in parts:
        head = part.lstrip()[1:].split("\n", 1)[0] if part.lstrip().startswith("~") else ""
        name = head.split("|")[0].strip().lower()
        if not head or name in ("c", "curve", "curves", "p") or name.startswith(
                ("v", "w", "o", "log_param", "log_def", "curve ", "curve_", "parameter")):
            kept.append(part)
        elif name.startswith(("a", "log_data")) and not seen_log_data:
            kept.append(part)
            seen_log_data = True
        else:
            dropped.append(head.split("|")[0].strip())
    if dropped:
        warnings.append("LAS 3.0 sections not used (only the log is read): "
                        + ", ".join(sorted(set(dropped))))
    return "".join(kept)


def clean_header(text: str, warnings: list[str]) -> tuple[str, dict[str, str]]:
    """Header text made safe for lasio (see the module docstring); returns the text and
    the map from temporary names of repeated mnemonics to lasio-style names."""
    text = text.replace("\r\n", "\n").replace("\r", "\n")
    if _CONTROL.search(text):
        n = len(_CONTROL.findall(text))
        text = _CONTROL.sub("", text)
        warnings.append(f"header held {n} control character(s); removed")
    lines = text.split("\n")
    renamed: dict[str, str] = {}
    counts: dict[str, int] = {}
    section_lines: list[int] = []
    cut = 0

    curve_repeats: set[str] = set()
    section = ""

    def finish_section() -> None:
        repeated = {k for k, v in counts.items() if v > 1}
        if section in ("C", "L"):
            curve_repeats.update(repeated)
        seen: dict[str, int] = {}
        for i in section_lines:
            mnem, rest = lines[i].split(".", 1)
            key = mnem.strip().upper()
            if key in repeated:
                seen[key] = seen.get(key, 0) + 1
                tmp = f"{mnem.strip()}__REP{seen[key]}"
                renamed[tmp.upper()] = f"{key}:{seen[key]}"  # lasio's names (upper case)
                lines[i] = f" {tmp}.{rest}"
        counts.clear()
        section_lines.clear()

    items_section = True
    for i, line in enumerate(lines):
        stripped = line.lstrip()
        if stripped.startswith("~"):
            finish_section()
            section = stripped[1:2].upper()
            items_section = section in ("V", "W", "C", "P", "L")
            continue
        if not items_section:
            if len(line) > MAX_HEADER_LINE:
                lines[i] = line[:MAX_HEADER_LINE]
                cut += 1
            continue
        if stripped.startswith("#") or "." not in line:
            continue
        if len(line) > MAX_HEADER_LINE:
            mnem, rest = line.split(".", 1)
            value, colon, descr = rest.rpartition(":") if ":" in rest else (rest, "", "")
            line = f"{mnem}.{value[:HEADER_FIELD_KEEP]}{colon}{descr[:HEADER_FIELD_KEEP]}"
            lines[i] = line
            cut += 1
        key = line.split(".", 1)[0].strip().upper()
        if key:
            counts[key] = counts.get(key, 0) + 1
            section_lines.append(i)
    finish_section()
    if cut:
        warnings.append(f"{cut} header line(s) over {MAX_HEADER_LINE} characters; value and "
                        f"description cut to {HEADER_FIELD_KEEP} characters")
    if curve_repeats:
        names = sorted(curve_repeats)
        warnings.append("repeated curve mnemonics numbered as NAME:1, NAME:2...: "
                        + ", ".join(names[:8]) + (" ..." if len(names) > 8 else ""))
    return "\n".join(lines), renamed


def load_las_source(path: str | Path) -> LasSource:
    """Read and split one LAS file (see the module docstring).

    Raises
    ------
    LasReadError
        The file is missing, empty, too large, binary, a web page, or has no ``~`` sections.
    """
    path = Path(path)
    where = show_path(path)
    raw = read_checked_bytes(path)
    digest = hashlib.sha256(raw).hexdigest()
    converted = raw.startswith((b"\xff\xfe", b"\xfe\xff"))
    if converted:
        raw = _utf16_to_utf8(where, raw)
        check_binary(where, raw[:HEAD_BYTES], raw[-HEAD_BYTES:] if len(raw) > HEAD_BYTES else b"",
                     len(raw))
    if not _has_section(raw, min(len(raw), HEAD_BYTES)):
        raise LasReadError(f"{where}: not a readable LAS file (no line starts with ~V, ~W, ~C "
                           "or ~A); check it is the log export, not another file saved as .las")
    warnings: list[str] = []
    if b"\r" in raw[:65536] and b"\n" not in raw[:65536]:
        raw = raw.replace(b"\r", b"\n")  # old Mac line ends: one CR per line
        converted = True
    span = _data_section(raw)
    head_end, data_start = span if span else (len(raw), len(raw))
    header, encoding = decode_header(raw[:head_end])
    if encoding != "utf-8":
        warnings.append(f"header is not UTF-8; read as {encoding} (check accented names)")
    title = raw[head_end:data_start].decode(encoding, errors="replace").strip()
    version = _header_value(header, "VERS")
    wrap = _header_value(header, "WRAP").upper().startswith("Y")
    delimiter = (_header_value(header, "DLM") or "SPACE").upper()
    data = memoryview(raw)[data_start:]
    offset = None if converted else data_start
    if version.startswith("3"):
        offset = None
        text = _las3_log_only(header + title + "\n" + str(data, encoding, "replace"), warnings)
        span3 = _data_section(text.encode("utf-8"))
        body = text.encode("utf-8")
        if span3:
            header = body[:span3[0]].decode("utf-8")
            title = body[span3[0]:span3[1]].decode("utf-8").strip()
            data = memoryview(body)[span3[1]:]
        else:
            header, title, data = text, "", memoryview(b"")
    if delimiter == "COMMA":
        # lasio counts the columns of a comma-delimited section by its blanks, so values
        # written "1670.0,123.4" read as one column; a blank after each comma fixes that
        data = memoryview(bytes(data).replace(b",", b", "))
        offset = None
    header, renamed = clean_header(header, warnings)
    return LasSource(path=path, header=header, data_title=title, data=data, encoding=encoding,
                     version=version, wrap=wrap, delimiter=delimiter, renamed=renamed,
                     warnings=warnings, sha256=digest, file_offset=offset)
