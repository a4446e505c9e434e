// What the sizing APIs (one axis, a machine) answer to requirements they cannot take.
import { expect } from "vitest";

/** 400 with error "invalid_requirements" and a message at `path` (a field, or a dotted path into a machine). */
export function expectInvalidAt(res: { status: number; data: { error?: string; fieldErrors?: Record<string, string[]> } }, path: string) {
  expect(res.status).toBe(400);
  expect(res.data.error).toBe("invalid_requirements");
  expect(Object.keys(res.data.fieldErrors ?? {})).toContain(path);
  expect(res.data.fieldErrors![path][0]).toEqual(expect.any(String));
}
