// Result records as text: one JSON object (possibly pretty-printed), or JSON lines as the CLI's
// --json writes them. Each value comes back with where it was found, for one-line errors.

import { InputError } from "../../errors.js";

export interface JsonRecordText {
  value: unknown;
  /** `where`, or `where:line` for JSON lines. */
  where: string;
  /** 1-based position of the record in the text. */
  position: number;
}

export function parseJsonRecords(text: string, where: string): JsonRecordText[] {
  const trimmed = text.trim();
  if (trimmed === "") throw new InputError(`${where}: holds no record`);
  try {
    return [{ value: JSON.parse(trimmed), where, position: 1 }];
  } catch {
    // Not one JSON value: read it as JSON lines below.
  }
  const out: JsonRecordText[] = [];
  text.split("\n").forEach((line, i) => {
    if (line.trim() === "") return;
    let value: unknown;
    try {
      value = JSON.parse(line);
    } catch {
      throw new InputError(`${where}:${i + 1}: not valid JSON`);
    }
    out.push({ value, where: `${where}:${i + 1}`, position: out.length + 1 });
  });
  return out;
}
