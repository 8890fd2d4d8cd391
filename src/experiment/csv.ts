// A small CSV reader (RFC 4180: quoted fields, doubled quotes, CRLF or LF) for rows measured
// elsewhere. Each record keeps the line it starts on, for error messages.

import { InputError } from "../errors.js";

export interface CsvRecord {
  line: number;
  fields: string[];
}

export function parseCsv(text: string, where: string): CsvRecord[] {
  const out: CsvRecord[] = [];
  let fields: string[] = [];
  let field = "";
  let quoted = false;
  let line = 1;
  let start = 1;
  let any = false;
  const end = (): void => {
    fields.push(field);
    // A line holding nothing at all is skipped (trailing newlines, blank separators).
    if (any || fields.length > 1 || field !== "") out.push({ line: start, fields });
    fields = [];
    field = "";
    any = false;
  };
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (quoted) {
      if (c === '"') {
        if (text[i + 1] === '"') {
          field += '"';
          i++;
        } else quoted = false;
      } else {
        if (c === "\n") line++;
        field += c;
      }
      continue;
    }
    if (c === '"') {
      if (field !== "") throw new InputError(`${where}:${line}: a quote inside an unquoted field`);
      quoted = true;
      any = true;
    } else if (c === ",") {
      fields.push(field);
      field = "";
      any = true;
    } else if (c === "\n" || c === "\r") {
      if (c === "\r" && text[i + 1] === "\n") i++;
      end();
      line++;
      start = line;
    } else field += c;
  }
  if (quoted) throw new InputError(`${where}:${start}: a quoted field is not closed`);
  if (field !== "" || fields.length > 0 || any) end();
  return out;
}
