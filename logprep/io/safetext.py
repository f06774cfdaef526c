"""Text from input files made harmless for terminals, tables and pages.

Well names, curve mnemonics and file names come from files logprep did not write.  They
may hold control characters (terminal escape sequences, CR/LF), bytes that are not valid
in any encoding (a file name the file system allows but UTF-8 does not decode) or text a
spreadsheet runs as a formula (``=HYPERLINK(...)``).  Everything shown or written passes
through the functions here.
"""

from __future__ import annotations

import os
import re

_CONTROL = re.compile(r"[\x00-\x1f\x7f-\x9f]")
_SURROGATE = re.compile(r"[\udc80-\udcff]")
_FORMULA_START = ("=", "+", "-", "@", "\t", "\r", "|")
_NUMBER = re.compile(r"[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?")


def _hex(match: re.Match) -> str:
    ch = match.group(0)
    code = ord(ch) - 0xDC00 if 0xDC80 <= ord(ch) <= 0xDCFF else ord(ch)
    return f"\\x{code:02x}"


def escape_line(text: object) -> str:
    r"""``text`` as one printable line: control characters (tab, CR and LF included) and
    undecodable bytes (kept by Python as surrogate escapes) become ``\xNN``.

    >>> escape_line("A\x1b[31m\nB")
    'A\\x1b[31m\\x0aB'
    """
    s = _SURROGATE.sub(_hex, str(text))
    return _CONTROL.sub(_hex, s)


def show_path(path: str | os.PathLike) -> str:
    """A path as the user can read it: undecodable bytes and control characters escaped."""
    return escape_line(os.fspath(path) if not isinstance(path, bytes) else os.fsdecode(path))


def safe_cell(value: object) -> object:
    """A table cell that a spreadsheet will not run and a terminal will not act on:
    text is escaped (:func:`escape_line`) and text starting like a formula (``=``, ``+``,
    ``-``, ``@``, ``|``) gets a leading apostrophe, unless it is a plain number.
    Other values are returned unchanged."""
    if not isinstance(value, str):
        return value
    s = escape_line(value)
    if s.startswith(_FORMULA_START) and not _NUMBER.fullmatch(s):
        return "'" + s
    return s


def plain_page_text(text: object) -> str:
    r"""Text from a file for a figure: escaped, and ``$`` shown as itself (matplotlib would
    otherwise read ``$...$`` as math markup).

    >>> plain_page_text("A$\\foo$")
    'A\\$\\foo\\$'
    """
    return escape_line(text).replace("$", r"\$")
