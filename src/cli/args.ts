// A small declarative option parser: each command lists its options once, and the same
// list drives parsing, validation (one-line errors naming the option) and `--help` text.

import { InputError, echo } from "../errors.js";
import { parseDecimal } from "../decimal.js";

export type OptionType = "boolean" | "string" | "number" | "integer";

export interface OptionSpec {
  name: string; // long name without dashes, e.g. "seconds"
  type: OptionType;
  description: string;
  default?: boolean | string | number;
  /** For strings: the allowed values. */
  choices?: readonly string[];
  /** For numbers: inclusive bounds. */
  min?: number;
  max?: number;
  /** Placeholder shown in help, e.g. "S". */
  placeholder?: string;
  /** One-letter alias, e.g. "o" for `-o FILE`. */
  short?: string;
}

export interface CommandSpec {
  name: string;
  summary: string;
  /** e.g. "<source...>"; shown in usage. */
  positionals: string;
  minPositionals: number;
  maxPositionals: number; // Infinity for variadic
  options: readonly OptionSpec[];
  /** Paragraphs shown under the summary: what the command does, in plain words. */
  description?: readonly string[];
  /** Extra lines shown under the usage (examples). */
  examples?: readonly string[];
  /** Options this command refuses with a message saying what to use instead (e.g. an ambiguous --seed). */
  refused?: Readonly<Record<string, string>>;
  run(args: ParsedArgs, io: CommandIO): Promise<number>;
}

/** A command's spec without its implementation: everything `--help` and the option parser need. */
export type CommandHelp = Omit<CommandSpec, "run">;

export interface ParsedArgs {
  positionals: string[];
  options: Record<string, boolean | string | number | undefined>;
}

export interface CommandIO {
  stdout: NodeJS.WritableStream;
  stderr: NodeJS.WritableStream;
  stdin: NodeJS.ReadableStream;
}

function parseValue(spec: OptionSpec, raw: string): string | number {
  if (spec.type === "string") {
    if (spec.choices && !spec.choices.includes(raw)) {
      throw new InputError(`--${spec.name} must be one of ${spec.choices.join(", ")} (got ${JSON.stringify(raw)})`);
    }
    return raw;
  }
  // Decimal notation only, the same rule as spec strings: "0x10", " 5" and "Infinity" are refused.
  const x = parseDecimal(raw);
  if (!Number.isFinite(x)) {
    throw new InputError(`--${spec.name} must be a decimal number (got ${echo(raw)})`);
  }
  if (spec.type === "integer" && !Number.isInteger(x)) {
    throw new InputError(`--${spec.name} must be an integer (got ${JSON.stringify(raw)})`);
  }
  if ((spec.min !== undefined && x < spec.min) || (spec.max !== undefined && x > spec.max)) {
    const range = `[${spec.min ?? "-∞"}, ${spec.max ?? "∞"}]`;
    throw new InputError(`--${spec.name} must lie in ${range} (got ${raw})`);
  }
  return x;
}

export function parseArgs(cmd: CommandSpec, argv: readonly string[]): ParsedArgs {
  const byName = new Map(cmd.options.map((o) => [o.name, o]));
  const byShort = new Map(cmd.options.filter((o) => o.short !== undefined).map((o) => [o.short!, o]));
  const options: ParsedArgs["options"] = {};
  for (const o of cmd.options) options[o.name] = o.default;
  const positionals: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === "--") {
      positionals.push(...argv.slice(i + 1));
      break;
    }
    if (/^-[A-Za-z]$/.test(a)) {
      const spec = byShort.get(a.slice(1));
      if (spec === undefined) throw new InputError(`unknown option ${a} (see halfplus ${cmd.name} --help)`);
      if (spec.type === "boolean") options[spec.name] = true;
      else {
        if (i + 1 >= argv.length) throw new InputError(`${a} needs a value`);
        options[spec.name] = parseValue(spec, argv[++i]);
      }
      continue;
    }
    if (a.startsWith("--")) {
      const eq = a.indexOf("=");
      const name = eq < 0 ? a.slice(2) : a.slice(2, eq);
      const refusal = cmd.refused?.[name];
      if (refusal !== undefined) throw new InputError(`--${name}: ${refusal}`);
      let spec = byName.get(name);
      if (spec === undefined && name.startsWith("no-") && byName.get(name.slice(3))?.type === "boolean") {
        if (eq >= 0) throw new InputError(`--${name} takes no value`);
        options[name.slice(3)] = false;
        continue;
      }
      if (spec === undefined) {
        throw new InputError(`unknown option --${name} (see halfplus ${cmd.name} --help)`);
      }
      if (spec.type === "boolean") {
        if (eq >= 0) throw new InputError(`--${name} takes no value`);
        options[name] = true;
        continue;
      }
      let raw: string;
      if (eq >= 0) raw = a.slice(eq + 1);
      else {
        if (i + 1 >= argv.length) throw new InputError(`--${name} needs a value`);
        raw = argv[++i];
      }
      options[name] = parseValue(spec, raw);
      continue;
    }
    positionals.push(a);
  }
  if (positionals.length < cmd.minPositionals) {
    throw new InputError(`missing ${cmd.positionals} (see halfplus ${cmd.name} --help)`);
  }
  if (positionals.length > cmd.maxPositionals) {
    throw new InputError(`too many arguments: ${positionals.slice(cmd.maxPositionals).join(" ")}`);
  }
  return { positionals, options };
}

export function commandHelp(cmd: CommandHelp): string {
  const lines = [`halfplus ${cmd.name} ${cmd.positionals}`.trimEnd(), "", `  ${cmd.summary}`, ""];
  for (const paragraph of cmd.description ?? []) lines.push(...wrap(paragraph, 96).map((l) => `  ${l}`), "");
  if (cmd.options.length > 0) {
    lines.push("options:");
    const rows = cmd.options.map((o) => {
      const long = o.type === "boolean" ? `--${o.name}` : `--${o.name} ${o.placeholder ?? o.type.toUpperCase()}`;
      const flag = o.short === undefined ? long : `-${o.short}, ${long}`;
      const extra = [
        o.choices ? `one of ${o.choices.join("|")}` : "",
        o.default !== undefined && o.type !== "boolean" ? `default ${o.default}` : "",
      ].filter(Boolean);
      return [flag, o.description + (extra.length ? ` (${extra.join("; ")})` : "")];
    });
    const w = Math.max(...rows.map((r) => r[0].length));
    for (const [f, d] of rows) {
      const [first, ...rest] = wrap(d, Math.max(40, 100 - w));
      lines.push(`  ${f.padEnd(w)}  ${first}`, ...rest.map((l) => `  ${"".padEnd(w)}  ${l}`));
    }
    lines.push("");
  }
  if (cmd.examples && cmd.examples.length > 0) {
    lines.push("examples:");
    for (const e of cmd.examples) lines.push(`  ${e}`);
    lines.push("");
  }
  return lines.join("\n");
}

/** Greedy word wrap at `width` columns. */
function wrap(text: string, width: number): string[] {
  const out: string[] = [];
  let line = "";
  for (const word of text.split(/\s+/).filter((x) => x !== "")) {
    if (line !== "" && line.length + 1 + word.length > width) {
      out.push(line);
      line = word;
    } else line = line === "" ? word : `${line} ${word}`;
  }
  out.push(line);
  return out;
}
