import { describe, expect, it } from "vitest";
import { actionLabel, detailsText } from "../../shared/trail/vocabulary.ts";
import { newPasswordSchema, signInSchema, inviteSchema } from "../../shared/auth/schemas.ts";
import { roleFitsKind } from "../../shared/auth/roles.ts";

describe("shared schemas used by both the forms and the API", () => {
  it("when an e-mail address has spaces and capitals, then it is trimmed and lower-cased", () => {
    expect(signInSchema.parse({ email: "  Tessa.Marlow@Harbourline.TEST ", password: "x" }).email).toBe("tessa.marlow@harbourline.test");
  });

  it("when a password exceeds bcrypt's 72-byte input (OWASP Password Storage cheat sheet), then it is refused rather than silently cut", () => {
    expect(newPasswordSchema.safeParse("é".repeat(36)).success).toBe(true); // 72 bytes
    expect(newPasswordSchema.safeParse("é".repeat(37)).success).toBe(false); // 74 bytes
  });

  it("when a role belongs to another kind of organisation, then it does not fit", () => {
    expect(roleFitsKind("buyer_technologist", "retailer")).toBe(true);
    expect(roleFitsKind("buyer_technologist", "producer")).toBe(false);
    expect(roleFitsKind("org_admin", "laboratory")).toBe(true);
    expect(inviteSchema.safeParse({ email: "a@b.test", role: "sommelier" }).success).toBe(false);
  });
});

describe("the trail in words", () => {
  it("when an event's details hold money in cents, codes and lists, then they read as words (regression: raw field names were shown)", () => {
    expect(actionLabel("payment.succeeded")).toBe("Payment received");
    expect(detailsText({ paymentIntent: "pi_123", amountCents: 4500, currency: "eur" })).toBe("Payment reference: pi_123 · Amount: €45.00");
    expect(detailsText({ lotCode: "SB-25-11", failing: ["volatile_acidity"], deviations: [] })).toBe(
      "Lot: SB-25-11 · Failing: Volatile acidity · Deviations opened: none",
    );
    expect(detailsText({ stage: "pre_filling", deviations: [3, 4] })).toBe("Stage: Pre-filling · Deviations opened: #3, #4");
    expect(detailsText({ someNewField: 3 })).toBe("Some New Field: 3");
  });
});
