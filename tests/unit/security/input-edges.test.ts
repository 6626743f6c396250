import { describe, expect, it } from "vitest";
import { z } from "zod";
import { parseId } from "@/lib/api";
import { formDataToObject } from "@/lib/action";
import { generateSchema } from "@/lib/validation/maintenance";

// Edges the fuzzing found, pinned down one by one.

describe("formDataToObject", () => {
  it("keeps a field named __proto__ as a field; the object's prototype stays Object's", () => {
    const form = new FormData();
    form.append("notes", "edited");
    form.append("__proto__", new File([new Uint8Array([1, 2, 3])], "x.png"));
    const out = formDataToObject(form);
    expect(Object.getPrototypeOf(out)).toBe(Object.prototype);
    expect(Object.keys(out)).toEqual(["notes", "__proto__"]);
    // Before: the File became the prototype, and reading `name` through it threw a TypeError.
    expect(z.object({ notes: z.string(), name: z.string().optional() }).parse(out)).toEqual({ notes: "edited" });
  });

  it("drops Next's own $ACTION fields", () => {
    const form = new FormData();
    form.append("$ACTION_ID_abc", "");
    form.append("ovenId", "3");
    expect(formDataToObject(form)).toEqual({ ovenId: "3" });
  });
});

describe("parseId", () => {
  it("takes plain decimal ids", () => {
    expect(parseId("1", "That oven")).toBe(1);
    expect(parseId("2348", "That run")).toBe(2348);
  });
  it.each(["0x10", " 7", "7 ", "1e1", "1.0", "+3", "-1", "0", "007", "", "9".repeat(17), "١٢", "../1"])("answers 404 to %j", (raw) => {
    expect(() => parseId(raw, "That oven")).toThrow(expect.objectContaining({ code: "not_found", status: 404 }));
  });
});

describe("generateSchema", () => {
  it("takes a horizon up to 366 days ahead and refuses a farther one", () => {
    const inDays = (d: number) => new Date(Date.now() + d * 86_400_000).toISOString();
    expect(generateSchema.safeParse({ until: inDays(30) }).success).toBe(true);
    expect(generateSchema.safeParse({ until: inDays(365) }).success).toBe(true);
    expect(generateSchema.safeParse({}).success).toBe(true);
    const far = generateSchema.safeParse({ until: "+275760-09-13T00:00:00.000Z" });
    expect(far.success).toBe(false);
    expect(far.error?.issues[0]).toMatchObject({ path: ["until"], message: "a date between 1970 and 2200" });
    expect(generateSchema.safeParse({ until: inDays(367) }).error?.issues[0]).toMatchObject({ path: ["until"], message: "at most 366 days from now" });
  });
});
