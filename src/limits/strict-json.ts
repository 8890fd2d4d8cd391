// JSON as records and plans need it: a syntax error (RFC 8259's grammar), a duplicate key, too deep
// a nesting, or trailing garbage is bad input naming the line, column and key, never something two
// parsers could read differently (JSON.parse keeps the last of two equal keys silently; RFC 8259 §4
// leaves the meaning open) and never Node's multi-line message without a position.

import { InputError } from "../errors.js";

/** Deepest nesting of arrays and objects accepted (records are a few levels deep). */
export const MAX_JSON_DEPTH = 64;

export interface JsonValueAt {
  value: unknown;
  /** 1-based line where the value starts. */
  line: number;
}

const NUMBER_RE = /-?(?:0|[1-9][0-9]*)(?:\.[0-9]+)?(?:[eE][+-]?[0-9]+)?/y;

class Parser {
  private p = 0;
  private line = 1;
  private lineStart = 0;

  constructor(
    private readonly text: string,
    private readonly where: string,
  ) {}

  fail(problem: string): never {
    throw new InputError(`${this.where}:${this.line}:${this.p - this.lineStart + 1}: not valid JSON: ${problem}`);
  }

  /** What stands at the current place, for messages. */
  what(): string {
    return this.p >= this.text.length ? "the end of the text" : JSON.stringify(this.text[this.p]);
  }

  /** Skip JSON whitespace; true when text remains. */
  skip(): boolean {
    const t = this.text;
    while (this.p < t.length) {
      const c = t.charCodeAt(this.p);
      if (c === 10) {
        this.line++;
        this.lineStart = this.p + 1;
      } else if (c !== 32 && c !== 9 && c !== 13) break;
      this.p++;
    }
    return this.p < t.length;
  }

  get currentLine(): number {
    return this.line;
  }

  value(depth: number, path: string): unknown {
    if (!this.skip()) this.fail("the text ends where a value should start");
    const t = this.text;
    const c = t.charCodeAt(this.p);
    if (c === 123) return this.object(depth + 1, path);
    if (c === 91) return this.array(depth + 1, path);
    if (c === 34) return this.string();
    if (t.startsWith("true", this.p)) return this.literal(4, true);
    if (t.startsWith("false", this.p)) return this.literal(5, false);
    if (t.startsWith("null", this.p)) return this.literal(4, null);
    NUMBER_RE.lastIndex = this.p;
    const m = NUMBER_RE.exec(t);
    if (m === null) this.fail(`expected a value, found ${JSON.stringify(t.slice(this.p, this.p + 12))}`);
    this.p += m[0].length;
    return Number(m[0]);
  }

  private literal(len: number, v: boolean | null): boolean | null {
    this.p += len;
    return v;
  }

  private string(): string {
    const t = this.text;
    const s = this.p;
    let q = s + 1;
    for (;;) {
      const e = t.indexOf('"', q);
      if (e < 0) this.fail("a string is not closed");
      let bs = 0;
      for (let k = e - 1; k > s && t.charCodeAt(k) === 92; k--) bs++;
      if (bs % 2 === 0) {
        q = e;
        break;
      }
      q = e + 1;
    }
    let out: string;
    try {
      out = JSON.parse(t.slice(s, q + 1)) as string;
    } catch {
      this.fail("a bad string (a control character such as a line break, or a bad escape)");
    }
    this.p = q + 1;
    return out;
  }

  private array(depth: number, path: string): unknown[] {
    if (depth > MAX_JSON_DEPTH) this.fail(`nested deeper than ${MAX_JSON_DEPTH} levels`);
    this.p++;
    const out: unknown[] = [];
    if (this.skip() && this.text.charCodeAt(this.p) === 93) {
      this.p++;
      return out;
    }
    for (;;) {
      if (out.length > 0 && this.skip() && this.text.charCodeAt(this.p) === 93) this.fail("a comma before ] (trailing commas are not JSON)");
      out.push(this.value(depth, `${path}[${out.length}]`));
      if (!this.skip()) this.fail("a list is not closed");
      const c = this.text.charCodeAt(this.p++);
      if (c === 93) return out;
      if (c !== 44) {
        this.p--;
        this.fail(`expected , or ] in a list, found ${this.what()}`);
      }
    }
  }

  private object(depth: number, path: string): Record<string, unknown> {
    if (depth > MAX_JSON_DEPTH) this.fail(`nested deeper than ${MAX_JSON_DEPTH} levels`);
    this.p++;
    const out: Record<string, unknown> = {};
    const seen = new Set<string>();
    if (this.skip() && this.text.charCodeAt(this.p) === 125) {
      this.p++;
      return out;
    }
    for (;;) {
      if (!this.skip() || this.text.charCodeAt(this.p) !== 34) {
        this.fail(seen.size > 0 && this.text.charCodeAt(this.p) === 125 ? "a comma before } (trailing commas are not JSON)" : `expected a quoted key, found ${this.what()}`);
      }
      const key = this.string();
      const here = path === "" ? key : `${path}.${key}`;
      if (seen.has(key)) this.fail(`duplicate key ${JSON.stringify(here.length > 80 ? `${here.slice(0, 80)}...` : here)}`);
      seen.add(key);
      if (!this.skip() || this.text.charCodeAt(this.p) !== 58) this.fail(`expected : after the key, found ${this.what()}`);
      this.p++;
      const v = this.value(depth, here);
      // An own property even for "__proto__", so a key can never change the object's prototype.
      Object.defineProperty(out, key, { value: v, enumerable: true, writable: true, configurable: true });
      if (!this.skip()) this.fail("an object is not closed");
      const c = this.text.charCodeAt(this.p++);
      if (c === 125) return out;
      if (c !== 44) {
        this.p--;
        this.fail(`expected , or } in an object, found ${this.what()}`);
      }
    }
  }
}

/**
 * Every JSON value in `text`, one after another (JSON lines, or one pretty-printed value), each
 * with the line it starts on. `where` names the input in messages.
 */
export function parseJsonSequence(text: string, where: string): JsonValueAt[] {
  const parser = new Parser(text.charCodeAt(0) === 0xfeff ? ` ${text.slice(1)}` : text, where);
  const out: JsonValueAt[] = [];
  while (parser.skip()) {
    const line = parser.currentLine;
    out.push({ value: parser.value(0, ""), line });
  }
  return out;
}

/** Exactly one JSON value (surrounding whitespace allowed): a plan file, one record. */
export function parseStrictJson(text: string, where: string): unknown {
  const parser = new Parser(text.charCodeAt(0) === 0xfeff ? ` ${text.slice(1)}` : text, where);
  const value = parser.value(0, "");
  if (parser.skip()) parser.fail(`unexpected ${parser.what()} after the JSON value`);
  return value;
}
