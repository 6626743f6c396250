import { describe, expect, it } from "vitest";
import { meterReadingSchema } from "@/lib/validation/maintenance";
import { impactQuerySchema } from "@/lib/validation/drift";

// Numbers a person could type stay within what the arithmetic after them can carry.
describe("numeric inputs are bounded", () => {
  it("a meter reading above a billion hours or cycles is refused, naming the field", () => {
    expect(meterReadingSchema.safeParse({ kind: "heater_hours", value: "1e308" }).error?.issues.map((i) => [i.path.join("."), i.message])).toEqual([["value", "at most 1 000 000 000"]]);
    expect(meterReadingSchema.parse({ kind: "cycles", value: "48210" }).value).toBe(48210);
  });

  it("the difference a change impact is sized for is positive and at most 1000", () => {
    expect(impactQuerySchema.safeParse({ delta: "1e300" }).success).toBe(false);
    expect(impactQuerySchema.parse({ delta: "0.5" }).delta).toBe(0.5);
  });
});
