"""The field overview in a real headless Chromium (Debian packages chromium and
chromium-driver, driven through Selenium): the page opens from disk, sorts on a click,
filters, every link resolves to a file that exists, and nothing is fetched over a network.

Skips with the reason where Chromium, ChromeDriver or Selenium is not installed
(``.ci/run`` installs them).
"""

from __future__ import annotations

import json
import shutil
import tempfile
from pathlib import Path
from urllib.parse import unquote, urlparse

import pytest

from logprep.cli import main

CHROMIUM = shutil.which("chromium") or "/usr/bin/chromium"
CHROMEDRIVER = shutil.which("chromedriver") or "/usr/bin/chromedriver"


@pytest.fixture(scope="module")
def batch_out(tmp_path_factory, example_dir) -> Path:
    """A real batch through the command line: two wells with sheets, their pair, and one
    broken file, so the overview holds ok wells, a pair and a failure."""
    tmp = tmp_path_factory.mktemp("overview")
    src = tmp / "logs"
    src.mkdir()
    for name in ("HRM-2.las", "HRM-3.las"):
        shutil.copy(example_dir / name, src / name)
    (src / "BROKEN-9.las").write_text("~Version\nthis is not a LAS file\n")
    out = tmp / "out dir"  # a space in the path: links must be quoted
    code = main(["screen", str(src), "--out", str(out), "--tops", str(example_dir / "tops.csv"),
                 "--pairs", str(example_dir / "pairs.csv")])
    assert code == 1  # the broken file failed, the others were screened
    assert (out / "overview.html").is_file() and (out / "overview.pdf").is_file()
    return out


@pytest.fixture(scope="module")
def browser():
    webdriver = pytest.importorskip("selenium.webdriver", reason="selenium not installed (pip install selenium)")
    if not (Path(CHROMIUM).exists() and Path(CHROMEDRIVER).exists()):
        pytest.skip("Chromium/ChromeDriver not installed (Debian packages chromium and "
                    "chromium-driver; .ci/run installs them)")
    from selenium.webdriver.chrome.service import Service

    profile = tempfile.mkdtemp(prefix="logprep-chromium-")
    opts = webdriver.ChromeOptions()
    opts.binary_location = CHROMIUM
    for flag in ("--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
                 "--disable-background-networking", "--disable-component-update", "--disable-sync",
                 "--disable-dev-shm-usage", f"--user-data-dir={profile}", "--window-size=1400,1000"):
        opts.add_argument(flag)
    opts.set_capability("goog:loggingPrefs", {"performance": "ALL", "browser": "ALL"})
    try:
        driver = webdriver.Chrome(service=Service(CHROMEDRIVER), options=opts)
    except Exception as exc:  # noqa: BLE001 - a broken browser install is an environment problem: say so
        pytest.skip(f"Chromium could not be started here: {str(exc).splitlines()[0]}")
    driver.set_page_load_timeout(30)
    yield driver
    driver.quit()
    shutil.rmtree(profile, ignore_errors=True)


def _column(driver, heading: str) -> int:
    heads = driver.find_elements("css selector", "#wells thead th")
    return [h.text.strip() for h in heads].index(heading)


def _values(driver, col: int) -> list[str]:
    return driver.execute_script(
        "return Array.from(document.querySelectorAll('#wells tbody tr'))"
        ".filter(r => !r.hidden).map(r => r.cells[arguments[0]].getAttribute('data-v') ?? "
        "r.cells[arguments[0]].textContent.trim());", col)


def test_overview_opens_sorts_filters_and_links(browser, batch_out):
    page = batch_out / "overview.html"
    browser.get(page.as_uri())
    assert "Field overview" in browser.title
    rows = browser.find_elements("css selector", "#wells tbody tr")
    names = [r.find_elements("css selector", "td")[1].text for r in rows]
    assert names == ["BROKEN-9", "HRM-2", "HRM-3", "HRM-2 / HRM-3"]  # input order, wells first
    assert "CAUTION" in browser.find_element("css selector", ".caution").text
    failed = browser.find_element("xpath", "//h2[text()='Failed']/following-sibling::ul").text
    assert "BROKEN-9.las" in failed

    # sort on a click: lowest SGR ascending (blanks last), then descending
    col = _column(browser, "lowest SGR %")
    head = browser.find_elements("css selector", "#wells thead th")[col]
    head.find_element("tag name", "button").click()
    assert head.get_attribute("aria-sort") == "ascending"
    vals = _values(browser, col)
    nums = [float(v) for v in vals if v != ""]
    assert len(nums) == 3 and nums == sorted(nums) and vals[-1] == ""
    head.find_element("tag name", "button").click()
    assert head.get_attribute("aria-sort") == "descending"
    nums_down = [float(v) for v in _values(browser, col) if v != ""]
    assert nums_down == sorted(nums, reverse=True)

    # filter by text and by status
    box = browser.find_element("id", "f-text")
    box.send_keys("HRM-3")
    shown = [n for n in _values(browser, 1)]
    assert sorted(shown) == ["hrm-2 / hrm-3", "hrm-3"]
    box.clear()
    box.send_keys(" ")  # an input event with an empty filter shows every row again
    from selenium.webdriver.support.ui import Select

    Select(browser.find_element("id", "f-status")).select_by_value("error")
    assert _values(browser, 1) == ["broken-9"]
    Select(browser.find_element("id", "f-status")).select_by_value("")

    # every link resolves to a file that exists
    hrefs = browser.execute_script("return Array.from(document.querySelectorAll('a[href]'))"
        ".map(a => new URL(a.getAttribute('href'), document.baseURI).href);")
    assert len(hrefs) >= 12
    for href in hrefs:
        url = urlparse(href)
        assert url.scheme == "file", href
        assert Path(unquote(url.path)).is_file(), href
    assert any(h.endswith("pair_HRM-2_HRM-3/sheet.pdf") for h in hrefs)

    # following a map point opens that well's sheet image
    browser.find_element("css selector", "svg a").click()
    assert browser.current_url.endswith("/sheet.png")
    assert browser.execute_script("return document.images.length") == 1

    # nothing went over a network: every request the browser made was for a local file
    requests = [json.loads(e["message"])["message"] for e in browser.get_log("performance")]
    urls = [m["params"]["request"]["url"] for m in requests if m["method"] == "Network.requestWillBeSent"]
    assert page.as_uri() in urls  # the log holds the page's own load
    # the browser's own pages (chrome://, chrome-untrusted:// of its new-tab page) are
    # internal; anything reaching out is http(s), ws(s) or ftp
    remote = [u for u in urls if urlparse(u).scheme in ("http", "https", "ws", "wss", "ftp")]
    assert not remote, remote
    errors = [e for e in browser.get_log("browser") if e["level"] == "SEVERE"]
    assert not errors, errors


def test_overview_prints_to_one_pdf_page(batch_out):
    data = (batch_out / "overview.pdf").read_bytes()
    assert data.startswith(b"%PDF")
    assert data.count(b"/Type /Page\n") + data.count(b"/Type /Page ") + data.count(b"/Type /Page>") == 1 \
        or data.count(b"/Type /Page") - data.count(b"/Type /Pages") == 1
