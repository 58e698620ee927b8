import { describe, expect, it } from "vitest";
import { factoryPassword } from "@/tests/integration/helpers/factory-password";
import { demoPassword } from "@/models/seeders/demo-scenario";
import { judgePassword, newPasswordSchema } from "@/lib/schemas/password";
import { acceptInvitationBodySchema, resetPasswordBodySchema, signUpBodySchema } from "@/lib/schemas/accounts";

// NIST SP 800-63B §5.1.1.2 (memorized secret verifiers): at least 8 characters; at least 64
// allowed; any printing character and spaces; compared against commonly used, expected or
// compromised values (breach lists, dictionary words, repetitive or sequential characters,
// context-specific words such as the service's name and the user's own name); no composition
// rules. The estimator is zxcvbn (@zxcvbn-ts/core, lists from @zxcvbn-ts/language-common).

describe("new passwords", () => {
  it.each([
    ["seven characters", "k9#vQ2m", "Use at least 8 characters."],
    ["a top-ten password", "password", "This is one of the most used passwords."],
    ["a common password with digits", "password123", "commonly used password"],
    ["a keyboard row", "qwertyuiop", "used password"],
    ["a repeated character", "aaaaaaaaaaaa", "Repeated characters"],
    ["a sequence", "abcdefgh12345678", "easy to guess"],
    ["a date", "31.12.1999", "easy to guess"],
    ["the service's name and a year", "benchfold2026", "easy to guess"],
    // bcrypt reads 72 bytes; §5.1.1.2: "Truncation of the secret SHALL NOT be performed."
    ["73 ASCII characters (73 bytes)", "a quiet lab at dawn, the analyzer warming and the coffee cold; then noise", "Use at most 72 bytes"],
    ["40 two-byte characters (80 bytes)", "ü".repeat(40), "Use at most 72 bytes"],
  ])("refuses %s", (_, password, says) => {
    const result = newPasswordSchema.safeParse(password);
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].message).toContain(says);
  });

  it.each([
    ["the demo accounts' password", demoPassword],
    ["the test factories' password", factoryPassword],
    ["a random 9-character password", "vK8#qz!Tp"],
    ["a 64-character passphrase", "the kettle sang twice before the bench supply finally settled ok"],
    ["a 72-byte passphrase", "a quiet lab at dawn, the analyzer warming and the coffee cold; then nois"],
    ["spaces and non-ASCII letters", "größere Brücke über der Förde"],
    ["passwords the tests set", "a long sentence for a password"],
    ["", "another long sentence, new"],
    ["", "a-good-password"],
    ["", "brand-new-password"],
    ["", "buyer-password-1"],
    ["", "long-enough-pw"],
  ])("accepts %s", (_, password) => {
    expect(newPasswordSchema.safeParse(password).success, judgePassword(password).message).toBe(true);
  });

  // zxcvbn estimates a random string of n characters at 10^n guesses, so an 8-character one sits
  // just under score 3: the length floor is NIST's 8, the estimator asks for more in practice.
  it("refuses even a random 8-character password as below 10^8 guesses", () => {
    expect(judgePassword("vK8#qz!T")).toMatchObject({ ok: false, score: 2 });
  });

  it("imposes no composition rule: lower-case words alone pass when long enough", () => {
    expect(newPasswordSchema.safeParse("violet harbour engine lantern").success).toBe(true);
  });

  it("refuses a password made of the person's own name, address or company on sign-up", () => {
    const body = { name: "Orla Penhaligon", email: "orla.penhaligon@corvane.example", company: "Corvane Test Systems", password: "penhaligoncorvane" };
    expect(newPasswordSchema.safeParse(body.password).success).toBe(true);
    const result = signUpBodySchema.safeParse(body);
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]).toMatchObject({ path: ["password"], message: expect.stringContaining("your name, your address") });
    expect(signUpBodySchema.safeParse({ ...body, password: "violet harbour engine lantern" }).success).toBe(true);
  });

  it("every schema that sets a password uses the rule", () => {
    expect(resetPasswordBodySchema.safeParse({ token: "t".repeat(43), password: "password123" }).success).toBe(false);
    expect(acceptInvitationBodySchema.safeParse({ token: "t".repeat(43), name: "A Person", password: "password123" }).success).toBe(false);
    expect(resetPasswordBodySchema.safeParse({ token: "t".repeat(43), password: "violet harbour engine lantern" }).success).toBe(true);
  });
});
