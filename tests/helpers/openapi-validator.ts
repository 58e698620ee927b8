import Ajv2020 from "ajv/dist/2020";
import addFormats from "ajv-formats";

/**
 * Checks HTTP answers against an OpenAPI 3.1 document with Ajv (JSON Schema 2020-12, the dialect
 * OpenAPI 3.1 uses), not with our own code: the response schema is looked up by path, method,
 * status and media type, and validated with `$ref`s resolved inside the document.
 */
type Doc = { paths: Record<string, Record<string, { responses: Record<string, { content?: Record<string, { schema: unknown }> }> }>> };

export function openApiValidator(document: Doc) {
  // strict: false because an OpenAPI document has keys that are not JSON Schema keywords (paths, info…).
  const ajv = new Ajv2020({ strict: false, allErrors: true });
  addFormats(ajv);
  ajv.addSchema({ ...document, $id: "https://benchfold.invalid/openapi.json" });

  /** Null when `body` fits the response schema for (path template, method, status); else the errors in words. */
  function check(pathTemplate: string, method: string, status: number, body: unknown, mediaType = "application/json"): string | null {
    const operation = document.paths[pathTemplate]?.[method.toLowerCase()];
    if (!operation) return `no ${method} ${pathTemplate} in the document`;
    const response = operation.responses[String(status)];
    if (!response) return `status ${status} is not documented for ${method} ${pathTemplate}`;
    if (!response.content?.[mediaType]) return `no ${mediaType} body documented for ${status} of ${method} ${pathTemplate}`;
    const pointer = ["paths", pathTemplate, method.toLowerCase(), "responses", String(status), "content", mediaType, "schema"]
      .map((part) => encodeURIComponent(part.replaceAll("~", "~0").replaceAll("/", "~1")))
      .join("/");
    const validate = ajv.getSchema(`https://benchfold.invalid/openapi.json#/${pointer}`);
    if (!validate) return `cannot compile the schema at ${pointer}`;
    if (validate(body)) return null;
    return ajv.errorsText(validate.errors, { separator: "\n" });
  }

  return { ajv, check };
}
