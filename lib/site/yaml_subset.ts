/**
 * A small reader of our own for the plain subset of YAML that site and readings files are
 * written in, so that the usual file is read without loading the full YAML parser (npm `yaml`,
 * whose start-up costs tens of milliseconds). Written from the YAML 1.2.2 specification: the
 * structures of §6 (indentation by spaces, separation, comments) and §7 (flow styles: plain,
 * single- and double-quoted scalars, flow sequences and mappings), block collections (§8.2) by
 * indentation, and the core schema's tag resolution (§10.3.2).
 *
 * The subset:
 * - block mappings with plain keys (a letter or `_`, then letters, digits, `_`, `-`, `.`),
 *   block sequences (`- ` items, including `- key: value` mapping items and `- - x`), and a
 *   sequence that stands at its key's indentation as that key's value;
 * - one-line flow sequences and mappings (`[1, 2, 4]`, `{ min: 4 degC, max: 22 degC }`), nested
 *   in each other, with plain keys followed by `: `;
 * - one-line plain scalars, one-line single-quoted scalars and one-line double-quoted scalars
 *   with the escapes `\\ \" \/ \n \t \r \0 \b \f \xXX \uXXXX` (no surrogate halves);
 * - `#` comments at a line's start or after a space, blank lines, trailing spaces, CRLF line
 *   ends, and one leading `---` line.
 *
 * Plain scalars resolve as the core schema says: `null`, `Null`, `NULL`, `~` and empty to null;
 * `true`/`True`/`TRUE`/`false`/`False`/`FALSE`; decimal integers (up to 15 digits), `0o` octal
 * and `0x` hexadecimal (up to 12 digits); floats, `.inf` forms with a sign and `.nan` forms;
 * anything else is a string. Keys must resolve to strings.
 *
 * The contract: {@link readYamlSubset} returns `{ value }` or `undefined`. `undefined` means
 * the text is outside the subset or in any doubt (tabs, anchors, aliases, tags, directives,
 * other document markers, block scalars, multi-line scalars or flow collections, explicit or
 * merge keys, quoted or non-string keys, duplicate keys, control characters, Unicode spaces
 * and line separators, very deep nesting), and the caller then parses the text with the full
 * YAML parser as before, with its values and its error messages. A value returned is the one
 * that the full parser gives with the core schema and unique keys (tests/site/yaml_subset
 * compares the two on every YAML file of the project, on the site fuzzer's texts and on
 * generated documents). It never throws, never loops, and costs time linear in the text.
 *
 * @module
 */

/** Thrown inside the reader when a text leaves the subset; never escapes it. */
const DEFER: unique symbol = Symbol("defer");

/** Deepest nesting of collections read (block and flow together). */
const MAX_DEPTH = 64;
/** Longest key read. */
const MAX_KEY = 256;

const KEY = /^[A-Za-z_][A-Za-z0-9_.\-]*/;
const DEC = /^[-+]?[0-9]+$/;
const OCT = /^0o[0-7]+$/;
const HEX = /^0x[0-9a-fA-F]+$/;
const HEX_DIGITS = /^[0-9a-fA-F]+$/;
const FLOAT = /^[-+]?(?:\.[0-9]+|[0-9]+(?:\.[0-9]*)?)(?:[eE][-+]?[0-9]+)?$/;
const SPECIAL: Record<string, unknown> = {
  "~": null,
  null: null,
  Null: null,
  NULL: null,
  true: true,
  True: true,
  TRUE: true,
  false: false,
  False: false,
  FALSE: false,
  ".inf": Infinity,
  ".Inf": Infinity,
  ".INF": Infinity,
  "+.inf": Infinity,
  "+.Inf": Infinity,
  "+.INF": Infinity,
  "-.inf": -Infinity,
  "-.Inf": -Infinity,
  "-.INF": -Infinity,
  ".nan": NaN,
  ".NaN": NaN,
  ".NAN": NaN,
};
/** Characters that may not begin a plain scalar (§7.3.3), `-` apart. */
const INDICATORS = "?:,[]{}#&*!|>'\"%@`";

function defer(): never {
  throw DEFER;
}

/**
 * The core schema's reading of a plain scalar (YAML 1.2.2 §10.3.2).
 *
 * @param s the scalar's text, trimmed, not empty
 * @returns null, a boolean, a number or the text itself
 */
function resolvePlain(s: string): unknown {
  if (Object.hasOwn(SPECIAL, s)) return SPECIAL[s];
  const c = s.charCodeAt(0);
  // Everything numeric starts with a digit, a sign or a dot.
  if (!(c >= 0x30 && c <= 0x39) && c !== 0x2b && c !== 0x2d && c !== 0x2e) return s;
  if (DEC.test(s)) {
    if (s.length > 15) defer(); // beyond exact integers: leave the rounding to the full parser
    return Number(s);
  }
  if (OCT.test(s)) {
    if (s.length > 17) defer();
    return parseInt(s.slice(2), 8);
  }
  if (HEX.test(s)) {
    if (s.length > 14) defer();
    return parseInt(s.slice(2), 16);
  }
  if (FLOAT.test(s)) return Number(s);
  return s;
}

/** Refuse characters the subset does not take: controls but LF (CR only before LF), tabs,
 * DEL and C1 controls, Unicode spaces, format characters, separators and lone surrogates. */
function checkChars(text: string): void {
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c >= 0x20 && c < 0x7f) continue;
    if (c === 0x0a) continue;
    if (c === 0x0d && text.charCodeAt(i + 1) === 0x0a) continue;
    if (c < 0xa1) defer(); // other C0 controls, tab, DEL, C1 controls, no-break space
    if (
      c === 0x1680 || c === 0x180e || (c >= 0x2000 && c <= 0x200f) ||
      (c >= 0x2028 && c <= 0x202f) || (c >= 0x205f && c <= 0x206f) || c === 0x3000 ||
      c === 0xfeff || c >= 0xfff0
    ) defer();
    if (c >= 0xd800 && c <= 0xdbff) {
      const d = text.charCodeAt(i + 1);
      if (!(d >= 0xdc00 && d <= 0xdfff)) defer();
      i++;
    } else if (c >= 0xdc00 && c <= 0xdfff) defer();
  }
}

interface Line {
  /** Column of the first character of `s`. */
  ind: number;
  /** The line from its first non-space character. */
  s: string;
}

/** A one-line flow-style reader over `s` from `p` (YAML 1.2.2 §7). */
class Flow {
  p = 0;
  constructor(readonly s: string) {}

  spaces(): number {
    const p0 = this.p;
    while (this.s.charCodeAt(this.p) === 0x20) this.p++;
    return this.p - p0;
  }

  /** A single-quoted scalar (§7.3.2) on this line, `p` at its opening quote. */
  single(): string {
    const s = this.s;
    let out = "";
    let from = ++this.p;
    for (;;) {
      const q = s.indexOf("'", from);
      if (q < 0) defer(); // runs on to another line
      if (s.charCodeAt(q + 1) === 0x27) {
        out += s.slice(this.p, q + 1);
        this.p = from = q + 2;
      } else {
        out += s.slice(this.p, q);
        this.p = q + 1;
        return out;
      }
    }
  }

  /** A double-quoted scalar (§7.3.1) on this line, `p` at its opening quote. */
  double(): string {
    const s = this.s;
    let out = "";
    let p = this.p + 1;
    let run = p;
    for (; p < s.length; p++) {
      const c = s[p];
      if (c === '"') {
        this.p = p + 1;
        return out + s.slice(run, p);
      }
      if (c !== "\\") continue;
      out += s.slice(run, p);
      const e = s[++p];
      switch (e) {
        case "\\":
        case '"':
        case "/":
          out += e;
          break;
        case "n":
          out += "\n";
          break;
        case "t":
          out += "\t";
          break;
        case "r":
          out += "\r";
          break;
        case "0":
          out += "\0";
          break;
        case "b":
          out += "\b";
          break;
        case "f":
          out += "\f";
          break;
        case "x":
        case "u": {
          const n = e === "x" ? 2 : 4;
          const hex = s.slice(p + 1, p + 1 + n);
          if (hex.length !== n || !HEX_DIGITS.test(hex)) defer();
          const code = parseInt(hex, 16);
          if (code >= 0xd800 && code <= 0xdfff) defer();
          out += String.fromCharCode(code);
          p += n;
          break;
        }
        default:
          defer(); // other escapes, or an escaped line break
      }
      run = p + 1;
    }
    return defer(); // not closed on this line
  }

  /** A plain scalar in flow context (§7.3.3), up to `,`, `]` or `}`. */
  plainInFlow(): unknown {
    const s = this.s;
    const p0 = this.p;
    const c0 = s[p0];
    if (c0 === undefined || INDICATORS.includes(c0)) defer();
    if (c0 === "-" && (s[p0 + 1] === undefined || " ,[]{}".includes(s[p0 + 1]))) defer();
    let p = p0;
    for (; p < s.length; p++) {
      const c = s[p];
      if (c === "," || c === "]" || c === "}") break;
      if (c === "[" || c === "{" || c === ":" || c === "'" || c === '"') defer();
      if (c === "#" && s[p - 1] === " ") defer(); // a comment: the collection is not closed
    }
    if (p >= s.length) defer();
    this.p = p;
    return resolvePlain(s.slice(p0, p).trimEnd());
  }

  /** A flow node: collection, quoted scalar or plain scalar. */
  node(depth: number): unknown {
    const c = this.s[this.p];
    if (c === "[") return this.seq(depth + 1);
    if (c === "{") return this.map(depth + 1);
    if (c === "'") return this.single();
    if (c === '"') return this.double();
    return this.plainInFlow();
  }

  /** After an entry: `,` then another entry, or the closing bracket. */
  next(close: string): boolean {
    this.spaces();
    const c = this.s[this.p];
    if (c === close) {
      this.p++;
      return false;
    }
    if (c !== ",") defer();
    this.p++;
    this.spaces();
    const d = this.s[this.p];
    if (d === close || d === ",") defer(); // trailing or empty entry: leave it to the parser
    return true;
  }

  /** A flow sequence (§7.4.1), `p` at `[`. */
  seq(depth: number): unknown[] {
    if (depth > MAX_DEPTH) defer();
    this.p++;
    this.spaces();
    const out: unknown[] = [];
    if (this.s[this.p] === "]") {
      this.p++;
      return out;
    }
    do out.push(this.node(depth)); while (this.next("]"));
    return out;
  }

  /** A flow mapping (§7.4.2) with plain keys each followed by `: `, `p` at `{`. */
  map(depth: number): Record<string, unknown> {
    if (depth > MAX_DEPTH) defer();
    this.p++;
    this.spaces();
    const out: Record<string, unknown> = {};
    if (this.s[this.p] === "}") {
      this.p++;
      return out;
    }
    do {
      const m = KEY.exec(this.s.slice(this.p, this.p + MAX_KEY + 1));
      if (!m) defer();
      const key = checkKey(out, m[0]);
      this.p += key.length;
      if (this.s[this.p] !== ":" || this.s[this.p + 1] !== " ") defer();
      this.p++;
      this.spaces();
      const c = this.s[this.p];
      if (c === "," || c === "}" || c === undefined) defer(); // an empty value
      out[key] = this.node(depth);
    } while (this.next("}"));
    return out;
  }

  /** Only spaces, or a comment after a space, may follow a node on its line. */
  end(): void {
    const n = this.spaces();
    if (this.p < this.s.length && !(n > 0 && this.s[this.p] === "#")) defer();
  }
}

function checkKey(into: Record<string, unknown>, key: string): string {
  if (key.length > MAX_KEY || key === "__proto__") defer();
  if (typeof resolvePlain(key) !== "string") defer(); // null, true, … as keys
  if (Object.hasOwn(into, key)) defer(); // let the full parser name the duplicate
  return key;
}

/**
 * The node that takes the rest of a line: a flow collection, a quoted scalar or a plain
 * scalar (block context, §7.3.3, one line).
 */
function inlineNode(s: string, depth: number): unknown {
  const c = s[0];
  if (c === "[" || c === "{" || c === "'" || c === '"') {
    const f = new Flow(s);
    const v = f.node(depth);
    f.end();
    return v;
  }
  if (INDICATORS.includes(c)) defer();
  if (c === "-" && (s.length === 1 || s[1] === " ")) defer();
  const hash = s.indexOf(" #");
  const text = (hash < 0 ? s : s.slice(0, hash)).trimEnd();
  if (text.endsWith(":") || text.includes(": ")) defer(); // a mapping where a scalar stands
  if (/[[\]{}]/.test(text)) defer();
  return resolvePlain(text);
}

function isSeqItem(s: string): boolean {
  return s === "-" || s.startsWith("- ");
}

/** Block collections over lines by indentation (§8.2). */
class Block {
  i = 0;
  constructor(readonly lines: Line[]) {}

  /** The node whose first line is `lines[i]`, at column `n`. */
  node(n: number, depth: number): unknown {
    if (depth > MAX_DEPTH) defer();
    const s = this.lines[this.i].s;
    if (isSeqItem(s)) return this.seq(n, depth);
    if (keyOf(s) !== undefined) return this.map(n, depth);
    this.i++;
    return inlineNode(s, depth);
  }

  /** Whether the next line belongs to nothing that has ended: more indented than `n`. */
  deeper(n: number): boolean {
    return this.i < this.lines.length && this.lines[this.i].ind > n;
  }

  seq(n: number, depth: number): unknown[] {
    const out: unknown[] = [];
    const L = this.lines;
    while (this.i < L.length && L[this.i].ind === n && isSeqItem(L[this.i].s)) {
      const rest = L[this.i].s.slice(1);
      const k = rest.length - rest.trimStart().length;
      if (k === rest.length || rest[k] === "#") {
        this.i++;
        out.push(this.deeper(n) ? this.node(L[this.i].ind, depth + 1) : null);
      } else {
        // The item's content starts a node at its own column, as if on a line of its own.
        L[this.i] = { ind: n + 1 + k, s: rest.slice(k) };
        out.push(this.node(n + 1 + k, depth + 1));
      }
      if (this.deeper(n)) defer();
    }
    return out;
  }

  map(n: number, depth: number): Record<string, unknown> {
    const out: Record<string, unknown> = {};
    const L = this.lines;
    while (this.i < L.length && L[this.i].ind === n) {
      const s = L[this.i].s;
      const found = keyOf(s);
      if (found === undefined) break;
      const key = checkKey(out, found);
      const rest = s.slice(key.length + 1).trimStart();
      let value: unknown = null;
      if (rest === "" || rest[0] === "#") {
        this.i++;
        if (this.deeper(n)) value = this.node(L[this.i].ind, depth + 1);
        else if (this.i < L.length && L[this.i].ind === n && isSeqItem(L[this.i].s)) {
          value = this.seq(n, depth + 1); // a sequence at its key's indentation
        }
      } else {
        this.i++;
        value = inlineNode(rest, depth);
      }
      if (this.deeper(n)) defer();
      out[key] = value;
    }
    return out;
  }
}

/** The plain key that begins a block mapping line (`key:` then a space or the line's end). */
function keyOf(s: string): string | undefined {
  const m = KEY.exec(s.length > MAX_KEY + 2 ? s.slice(0, MAX_KEY + 2) : s);
  if (!m) return undefined;
  const after = s.charCodeAt(m[0].length + 1);
  if (s[m[0].length] !== ":" || !(Number.isNaN(after) || after === 0x20)) return undefined;
  return m[0];
}

/**
 * Read a YAML text of the plain subset that site files are written in, or say that it is not
 * one (see the module's documentation for the subset and the contract).
 *
 * @param text the YAML text (without a byte-order mark)
 * @returns `{ value }`, the value that the full YAML parser (core schema, unique keys) gives,
 *   or `undefined` when the text is outside the subset or in any doubt
 *
 * @example
 * ```ts
 * import { readYamlSubset } from "./yaml_subset.ts";
 * const r = readYamlSubset("pipe:\n  nps: '8'\n  od: 219.1 mm # measured\nmountings: [1, 2, 4]\n");
 * if (JSON.stringify(r?.value) !== '{"pipe":{"nps":"8","od":"219.1 mm"},"mountings":[1,2,4]}') {
 *   throw new Error("not read");
 * }
 * if (readYamlSubset("a: &x 1\nb: *x\n") !== undefined) throw new Error("aliases are deferred");
 * ```
 */
export function readYamlSubset(text: string): { value: unknown } | undefined {
  try {
    if (typeof text !== "string") return undefined;
    checkChars(text);
    const raw = text.includes("\r") ? text.replaceAll("\r\n", "\n") : text;
    const lines: Line[] = [];
    let started = false;
    for (const line of raw.split("\n")) {
      let ind = 0;
      while (line.charCodeAt(ind) === 0x20) ind++;
      if (ind === line.length || line[ind] === "#") continue; // blank or comment
      if (ind === 0 && (line.startsWith("---") || line.startsWith("..."))) {
        // One leading document-start marker, alone or with a comment; no other marker.
        if (started || !/^---( +(#.*)?)?$/.test(line)) return undefined;
        started = true;
        continue;
      }
      if (line[ind] === "%") return undefined; // a directive
      started = true;
      lines.push({ ind, s: ind ? line.slice(ind) : line });
    }
    if (lines.length === 0) return { value: null };
    const b = new Block(lines);
    const value = b.node(lines[0].ind, 0);
    if (b.i !== lines.length) return undefined;
    return { value };
  } catch {
    return undefined; // DEFER, or anything unforeseen: the full parser decides
  }
}
