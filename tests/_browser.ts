/**
 * Render HTML in Debian's headless Chromium (/usr/bin/chromium) for tests: the serialised DOM
 * after load (`--dump-dom`), the page's console messages (read from Chromium's log on stderr)
 * and, if asked, a PNG screenshot. Used only by tests; the product never starts a browser.
 *
 * Where Chromium is missing, tests that need it are registered as ignored and a notice is
 * printed once; `.ci/run` installs it.
 *
 * @module
 */

/** The browser binary Debian's `chromium` package installs. */
export const CHROMIUM = "/usr/bin/chromium";

let available: boolean | undefined;

/**
 * True when /usr/bin/chromium runs. Prints a notice once otherwise.
 *
 * @returns whether Chromium is available
 */
export function hasChromium(): boolean {
  if (available !== undefined) return available;
  try {
    available = new Deno.Command(CHROMIUM, { args: ["--version"], stdout: "null", stderr: "null" })
      .outputSync().success;
  } catch {
    available = false;
  }
  if (!available) {
    console.warn(
      `NOTICE: browser checks are skipped: ${CHROMIUM} is missing ('apt-get install chromium'; ` +
        ".ci/run does).",
    );
  }
  return available;
}

/** What a render returns. */
export interface Rendered {
  /** The DOM after load, serialised. */
  readonly dom: string;
  /** Console messages the page produced (errors, warnings, logs), one per entry. */
  readonly console: string[];
  /** Path of the PNG screenshot, when one was asked for. */
  readonly screenshot?: string;
}

/** Options of {@link renderHtml}. */
export interface RenderOptions {
  /** Write a PNG screenshot to this path. */
  readonly screenshot?: string;
  /** Window width in CSS pixels (default 1100). */
  readonly width?: number;
  /** Window height in CSS pixels (default 1400). */
  readonly height?: number;
  /** Give up after this many milliseconds (default 90 000). */
  readonly timeoutMs?: number;
}

/**
 * Load an HTML string (or an existing file, given as `{ file }`) in headless Chromium with no
 * network use, a fresh empty profile and no GPU, and return the DOM and console messages.
 *
 * @param page the HTML text, or `{ file: path }`
 * @param options screenshot path, window size, timeout
 * @returns DOM, console messages and screenshot path
 */
export async function renderHtml(
  page: string | { file: string },
  options: RenderOptions = {},
): Promise<Rendered> {
  const dir = await Deno.makeTempDir({ prefix: "snellpath-browser-" });
  try {
    let file: string;
    if (typeof page === "string") {
      file = `${dir}/page.html`;
      await Deno.writeTextFile(file, page);
    } else {
      file = await Deno.realPath(page.file);
    }
    const profile = `${dir}/profile`;
    await Deno.mkdir(profile);
    const args = [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--hide-scrollbars",
      `--user-data-dir=${profile}`,
      "--enable-logging=stderr",
      "--v=0",
      `--window-size=${options.width ?? 1100},${options.height ?? 1400}`,
      ...(options.screenshot ? [`--screenshot=${options.screenshot}`] : []),
      "--dump-dom",
      `file://${file}`,
    ];
    const out = await new Deno.Command(CHROMIUM, {
      args,
      stdout: "piped",
      stderr: "piped",
      signal: AbortSignal.timeout(options.timeoutMs ?? 90_000),
    }).output();
    const dom = new TextDecoder().decode(out.stdout);
    const log = new TextDecoder().decode(out.stderr);
    if (!out.success && dom.trim() === "") {
      throw new Error(`chromium failed (${out.code}): ${log.slice(-1500)}`);
    }
    const consoleLines = log.split("\n").filter((l) => /:CONSOLE[:(\]]/.test(l)).map((l) =>
      l.replace(/^\[[^\]]*\]\s*/, "")
    );
    return {
      dom,
      console: consoleLines,
      ...(options.screenshot ? { screenshot: options.screenshot } : {}),
    };
  } finally {
    await Deno.remove(dir, { recursive: true }).catch(() => {});
  }
}
