import { createHmac } from "node:crypto";
import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

const { makeUnsubscribeToken, readUnsubscribeToken, unsubscribeSecret } = await import("@/lib/server/subscriptions/unsubscribe-token");

const secret = "a test secret of some length";
const claim = { subscriptionId: 41, userId: 7 };

describe("unsubscribe token", () => {
  it("reads back what it signed", () => {
    const token = makeUnsubscribeToken(claim, secret);
    expect(token).toMatch(/^41\.7\.[A-Za-z0-9_-]{43}$/);
    expect(readUnsubscribeToken(token, secret)).toEqual(claim);
  });

  it("is HMAC-SHA256 of the claim (RFC 4231 test case 2 checks node's HMAC itself)", () => {
    // RFC 4231 §4.3: HMAC-SHA-256(key "Jefe", "what do ya want for nothing?").
    expect(createHmac("sha256", "Jefe").update("what do ya want for nothing?").digest("hex")).toBe("5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843");
    const expected = createHmac("sha256", secret).update("benchfold:unsubscribe:v1:41:7").digest("base64url");
    expect(makeUnsubscribeToken(claim, secret)).toBe(`41.7.${expected}`);
  });

  it("refuses the token altered by any one character, at every position", () => {
    const token = makeUnsubscribeToken(claim, secret);
    const alphabet = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz-_.";
    let tried = 0;
    for (let i = 0; i < token.length; i++) {
      for (const c of alphabet) {
        if (c === token[i]) continue;
        const altered = token.slice(0, i) + c + token.slice(i + 1);
        const read = readUnsubscribeToken(altered, secret);
        // "41.7.x" → "41.07.x" style rewrites are refused by the pattern; any other change breaks the signature.
        expect(read, altered).toBeNull();
        tried++;
      }
    }
    expect(tried).toBe(token.length * (alphabet.length - 1));
  });

  it("refuses another secret's token, another claim's signature, and junk", () => {
    const token = makeUnsubscribeToken(claim, secret);
    expect(readUnsubscribeToken(token, "another secret")).toBeNull();
    const [, , sig] = token.split(".");
    expect(readUnsubscribeToken(`42.7.${sig}`, secret)).toBeNull();
    expect(readUnsubscribeToken(`41.8.${sig}`, secret)).toBeNull();
    for (const junk of ["", "41.7", "41.7.", `${token}.`, ` ${token}`, `0.7.${sig}`, `41.7.${sig}=`, "x".repeat(10_000)]) {
      expect(readUnsubscribeToken(junk, secret), junk.slice(0, 20)).toBeNull();
    }
  });

  it("signs with a dedicated secret when set, else NEXTAUTH_SECRET, and refuses to sign with none", () => {
    expect(unsubscribeSecret({ BENCHFOLD_UNSUBSCRIBE_SECRET: "u", NEXTAUTH_SECRET: "n" })).toBe("u");
    expect(unsubscribeSecret({ NEXTAUTH_SECRET: "n" })).toBe("n");
    expect(() => unsubscribeSecret({})).toThrow(/NEXTAUTH_SECRET/);
  });
});
