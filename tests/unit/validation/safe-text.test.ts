import { describe, expect, it } from "vitest";
import { findUnsafeText } from "@/lib/validation/safe-text";

const NUL = "must not contain a NUL character (U+0000)";

describe("findUnsafeText", () => {
  it("names every unsafe string and field name by its path, in document order", () => {
    const value = { a: ["ok", "x\u0000"], "b\u0000": { c: "\uD800" }, d: "fine" };
    expect(findUnsafeText(value).map((p) => [p.path.join("."), p.message.slice(0, 20)])).toEqual([
      ["a.1", NUL.slice(0, 20)],
      ["", "a field name must no"],
      ["b\u0000.c", "contains a broken ch"],
    ]);
  });

  it("walks a value nested 100,000 levels deep without overflowing the stack, and finds what is at the bottom", () => {
    let value: unknown = "bottom\u0000";
    for (let i = 0; i < 100_000; i++) value = [value];
    const problems = findUnsafeText({ deep: value });
    expect(problems).toHaveLength(1);
    expect(problems[0]!.path).toHaveLength(100_001);
    expect(problems[0]!.path[0]).toBe("deep");
    expect(problems[0]!.message).toBe(NUL);
  });

  it("stops at the limit", () => {
    expect(findUnsafeText(Array.from({ length: 50 }, () => "\u0000"), 20)).toHaveLength(20);
  });
});
