// Where a JSON text stops being JSON, as line and column, for one-line errors about plan files
// (Node 20's own JSON.parse message spans lines and gives no position for most errors).

export interface JsonFault {
  line: number;
  column: number;
  problem: string;
}

/** The first syntax error in `text` (RFC 8259 grammar), or null when it is valid JSON. */
export function jsonFault(text: string): JsonFault | null {
  let i = 0;
  const fault = (problem: string): JsonFault => {
    let line = 1;
    let col = 1;
    for (let k = 0; k < i && k < text.length; k++) {
      if (text[k] === "\n") {
        line++;
        col = 1;
      } else col++;
    }
    return { line, column: col, problem };
  };
  const ws = (): void => {
    while (i < text.length && " \t\n\r".includes(text[i])) i++;
  };
  const what = (): string => (i >= text.length ? "end of text" : JSON.stringify(text[i]));
  // Each parser returns a fault or null, leaving i after the value.
  const value = (): JsonFault | null => {
    ws();
    const c = text[i];
    if (c === "{") {
      i++;
      ws();
      if (text[i] === "}") return i++, null;
      for (;;) {
        ws();
        if (text[i] !== '"') return fault(text[i] === "}" ? "a comma before } (trailing commas are not JSON)" : `expected a quoted key, found ${what()}`);
        const s = string();
        if (s) return s;
        ws();
        if (text[i] !== ":") return fault(`expected : after the key, found ${what()}`);
        i++;
        const v = value();
        if (v) return v;
        ws();
        if (text[i] === ",") {
          i++;
          continue;
        }
        if (text[i] === "}") return i++, null;
        return fault(`expected , or } in an object, found ${what()}`);
      }
    }
    if (c === "[") {
      i++;
      ws();
      if (text[i] === "]") return i++, null;
      for (;;) {
        ws();
        if (text[i] === "]") return fault("a comma before ] (trailing commas are not JSON)");
        const v = value();
        if (v) return v;
        ws();
        if (text[i] === ",") {
          i++;
          continue;
        }
        if (text[i] === "]") return i++, null;
        return fault(`expected , or ] in a list, found ${what()}`);
      }
    }
    if (c === '"') return string();
    const m = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?|^true|^false|^null/.exec(text.slice(i, i + 400));
    if (m === null || m[0] === "") return fault(`expected a value, found ${what()}`);
    i += m[0].length;
    return null;
  };
  const string = (): JsonFault | null => {
    i++; // opening quote
    while (i < text.length) {
      const c = text[i];
      if (c === '"') return i++, null;
      if (c === "\\") {
        const e = text[i + 1];
        if (e === "u" ? !/^[0-9a-fA-F]{4}$/.test(text.slice(i + 2, i + 6)) : !'"\\/bfnrt'.includes(e ?? "")) return fault("bad escape in a string");
        i += e === "u" ? 6 : 2;
        continue;
      }
      if (c < " ") return fault("a control character (a line break?) inside a string");
      i++;
    }
    return fault("a string is not closed");
  };
  const f = value();
  if (f) return f;
  ws();
  return i < text.length ? fault(`unexpected ${what()} after the JSON value`) : null;
}
