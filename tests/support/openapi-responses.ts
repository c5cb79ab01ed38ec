// Holds API answers to the OpenAPI document: each one must be an answer the
// document gives for that operation and status, with a body its schema accepts.
// The integration helpers run every /api/v1 answer through it, so a route that
// drifts from its description fails the test that called it.
import { Ajv2020, type ValidateFunction } from "ajv/dist/2020";
import addFormats from "ajv-formats";
import { buildOpenApiDocument, type OpenApiDocument } from "@/lib/api-schema/document";

type Json = Record<string, unknown>;

interface Operation {
  method: string;
  template: string;
  pattern: RegExp;
  literalSegments: number;
  responses: Record<string, Json>;
}

const BASE_ID = "https://cotter.example/openapi.json";

class ResponseChecker {
  private readonly ajv = new Ajv2020({ strict: false, allErrors: true });
  private readonly operations: Operation[] = [];
  private readonly validators = new Map<string, ValidateFunction>();
  private readonly doc: OpenApiDocument;

  constructor(doc: OpenApiDocument) {
    this.doc = doc;
    addFormats(this.ajv);
    // The schemas refer to each other as `#/components/schemas/X`; under one id they resolve.
    this.ajv.addSchema({ $id: BASE_ID, components: { schemas: doc.components.schemas } });
    for (const [template, methods] of Object.entries(doc.paths)) {
      const segments = template.split("/");
      const pattern = new RegExp(`^${segments.map((s) => (/^\{[^}]+\}$/.test(s) ? "[^/]+" : s.replace(/[.*+?^$()|[\]\\]/g, "\\$&"))).join("/")}$`);
      for (const [method, op] of Object.entries(methods)) {
        this.operations.push({
          method: method.toUpperCase(),
          template,
          pattern,
          literalSegments: segments.filter((s) => !s.startsWith("{")).length,
          responses: (op as { responses: Record<string, Json> }).responses,
        });
      }
    }
    // `/invitations/accept` is that operation, not `/invitations/{id}`.
    this.operations.sort((a, b) => b.literalSegments - a.literalSegments);
  }

  private resolve(response: Json): Json {
    const ref = response.$ref as string | undefined;
    if (!ref) return response;
    const name = ref.replace("#/components/responses/", "");
    return (this.doc.components.responses as Record<string, Json>)[name]!;
  }

  private validator(schema: Json): ValidateFunction {
    const key = JSON.stringify(schema);
    let validate = this.validators.get(key);
    if (!validate) {
      // An operation's own schema (a refusal's `allOf`) refers into the components by the same ids.
      validate = this.ajv.compile(JSON.parse(key.replaceAll('"$ref":"#/', `"$ref":"${BASE_ID}#/`)) as Json);
      this.validators.set(key, validate);
    }
    return validate;
  }

  /** A validator of one named schema (`#/components/schemas/<name>`). */
  component(name: string): ValidateFunction {
    return this.validator({ $ref: `#/components/schemas/${name}` });
  }

  /** Throws, naming the operation and what is wrong, unless the answer is one the document describes. */
  check(answer: { method: string; url: string; status: number; contentType: string | null; body: unknown }): string {
    const { pathname } = new URL(answer.url, "http://localhost");
    const op = this.operations.find((o) => o.method === answer.method.toUpperCase() && o.pattern.test(pathname));
    const where = `${answer.method.toUpperCase()} ${pathname}`;
    if (!op) throw new Error(`${where} answered ${answer.status}, but the OpenAPI document has no such operation.`);
    const name = `${op.method} ${op.template} → ${answer.status}`;
    const described = op.responses[String(answer.status)];
    if (!described) {
      throw new Error(`${name}: the document does not describe this status (it has ${Object.keys(op.responses).join(", ")}). Body: ${JSON.stringify(answer.body).slice(0, 400)}`);
    }
    const content = (this.resolve(described).content ?? {}) as Record<string, { schema?: Json }>;
    const mediaType = (answer.contentType ?? "").split(";")[0]!.trim().toLowerCase();
    const media = content[mediaType];
    if (!media) throw new Error(`${name}: answered ${mediaType || "no content type"}, the document says ${Object.keys(content).join(" or ") || "no body"}.`);
    if (mediaType.endsWith("json") && media.schema) {
      const validate = this.validator(media.schema);
      if (!validate(answer.body)) {
        const valueAt = (pointer: string) => pointer.split("/").slice(1).reduce<unknown>((v, k) => (v as Record<string, unknown> | undefined)?.[k], answer.body);
        const errors = (validate.errors ?? []).slice(0, 8).map((e) => {
          const extra = e.params && "additionalProperty" in e.params ? ` (${String(e.params.additionalProperty)})` : "";
          return `${e.instancePath || "(body)"} ${e.message}${extra}; it is ${JSON.stringify(valueAt(e.instancePath))?.slice(0, 120)}`;
        });
        throw new Error(`${name}: the body does not match the document:\n  ${errors.join("\n  ")}`);
      }
    }
    return name;
  }
}

let checker: ResponseChecker | undefined;
let checked = 0;

/** Checks one /api/v1 answer against the document (other paths pass untouched); returns whether it checked. */
export function checkApiAnswer(answer: { method: string; url: string; status: number; contentType: string | null; body: unknown }): boolean {
  if (!new URL(answer.url, "http://localhost").pathname.startsWith("/api/v1/")) return false;
  checker ??= new ResponseChecker(buildOpenApiDocument());
  checker.check(answer);
  checked += 1;
  return true;
}

/** For a checker of a document other than the app's (the test that shows a drift fails). */
export function responseChecker(doc: OpenApiDocument) {
  return new ResponseChecker(doc);
}

/** How many answers this process has checked. */
export const answersChecked = () => checked;
