// Assertion shared by the suites' parameter-error checks: f throws an InputError naming `mentions`.
import { expect } from "vitest";
import { InputError } from "../../src/errors.js";

/** f() must throw an InputError whose message contains `mentions` (e.g. the parameter name). */
export function expectInputError(f: () => unknown, mentions: string): void {
  let caught: unknown = null;
  try {
    f();
  } catch (e) {
    caught = e;
  }
  expect(caught).toBeInstanceOf(InputError);
  expect((caught as Error).message).toContain(mentions);
}
