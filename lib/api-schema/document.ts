import { z } from "zod";
import { apiComponents } from "./components";
import { OPERATIONS, TAGS, type Body, type NotJson, type Operation } from "./operations";
import type { ProblemCode } from "./problem-codes";
import "./responses/accounts";
import "./responses/common";
import "./responses/units";
import "./responses/work-orders";

type Json = Record<string, unknown>;

const ref = (id: string) => `#/components/schemas/${id}`;

/** Words for parameters every list shares (api-v1.md "Lists"); the shapes come from the schemas. */
const PARAMETER_NOTES: Record<string, string> = {
  limit: "How many to answer (default 50, at most 200).",
  cursor: "The `nextCursor` of the page before; leave out for the first page.",
};

const STANDARD_PROBLEMS: Record<number, string> = {
  400: "Invalid input (`invalid_input` with field `errors`, or `malformed_json`).",
  401: "No session or token (`unauthenticated`).",
  403: "The caller's role may not do this (`forbidden`).",
  404: "No such item, or another account's (`not_found`): the path's id or an id the body names.",
  413: "The body is too large (`payload_too_large`).",
  415: "The body is not of the media type this takes (`unsupported_media_type`).",
  500: "Something went wrong; nothing was changed (`internal_error`).",
};

/** The codes each standard refusal carries (lib/http/problem.ts, read-body.ts, proxy.ts). */
const STANDARD_CODES: Record<number, readonly ProblemCode[]> = {
  400: ["invalid_input", "malformed_json", "malformed_url"],
  401: ["unauthenticated"],
  403: ["forbidden"],
  404: ["not_found"],
  413: ["payload_too_large"],
  415: ["unsupported_media_type"],
  500: ["internal_error"],
};

/**
 * A refusal: a problem document whose `code` is one of these. The codes are
 * also listed as `x-problem-codes`, for people's tools and the reference page.
 */
function problemResponse(description: string, codes: readonly ProblemCode[]): Json {
  return {
    description,
    "x-problem-codes": codes,
    content: { "application/problem+json": { schema: { allOf: [{ $ref: ref("Problem") }, { properties: { code: { enum: codes } } }] } } },
  };
}

const isNotJson = (b: Body): b is NotJson => "mediaType" in b && typeof (b as NotJson).mediaType === "string";

/**
 * Keeps the document readable: a `format` says what zod's long date patterns
 * say, and JavaScript's safe-integer bounds on every integer say nothing.
 */
function tidy(ctx: { jsonSchema: Json }) {
  const js = ctx.jsonSchema;
  if (js.format === "date-time" || js.format === "date") delete js.pattern;
  if (js.minimum === Number.MIN_SAFE_INTEGER) delete js.minimum;
  if (js.maximum === Number.MAX_SAFE_INTEGER) delete js.maximum;
}

/** JSON Schema for a zod schema that is not named: request bodies and parameters. */
function inline(schema: z.ZodType, io: "input" | "output"): Json {
  const out = z.toJSONSchema(schema, { target: "draft-2020-12", io, unrepresentable: "any", override: tidy }) as Json;
  delete out.$schema;
  return out;
}

function componentSchemas(): Record<string, Json> {
  const { schemas } = z.toJSONSchema(apiComponents, { target: "draft-2020-12", io: "output", uri: ref, override: tidy }) as { schemas: Record<string, Json> };
  for (const s of Object.values(schemas)) {
    delete s.$id;
    delete s.$schema;
  }
  return schemas;
}

function responseSchemaRef(schema: z.ZodType, where: string): Json {
  const meta = apiComponents.get(schema);
  if (!meta) throw new Error(`${where}: a response schema must be named (named() in lib/api-schema/components.ts)`);
  return { $ref: ref(meta.id) };
}

function parameters(op: Operation): Json[] {
  const list: Json[] = [];
  const add = (schema: z.ZodType | undefined, where: "path" | "query") => {
    if (!schema) return;
    const js = inline(schema, "input") as { properties?: Record<string, Json>; required?: string[] };
    for (const [name, property] of Object.entries(js.properties ?? {})) {
      const { description, ...rest } = property;
      const text = (description as string | undefined) ?? PARAMETER_NOTES[name];
      list.push({ name, in: where, required: where === "path" || (js.required ?? []).includes(name), ...(text ? { description: text } : {}), schema: rest });
    }
  };
  add(op.params, "path");
  add(op.query, "query");
  return list;
}

function requestBody(op: Operation, inputs: Record<string, Json>): Json | undefined {
  if (!op.body) return undefined;
  const { name, schema } = op.body;
  if (isNotJson(schema)) return { required: true, description: schema.description, content: { [schema.mediaType]: { schema: { type: "string" } } } };
  inputs[name] = inline(schema, "input");
  return { required: true, content: { "application/json": { schema: { $ref: ref(name) } } } };
}

function problemStatuses(op: Operation): number[] {
  const statuses = new Set<number>([500]);
  if (op.roles) [401, 403].forEach((s) => statuses.add(s));
  // A path id, or an id a signed-in caller's body names (a unit to check in, an account), may name nothing of theirs.
  if (op.params || (op.body && op.roles)) statuses.add(404);
  if (op.query || op.body) statuses.add(400);
  if (op.body) [413, 415].forEach((s) => statuses.add(s));
  for (const s of Object.keys(op.problems ?? {})) statuses.add(Number(s));
  return [...statuses].sort((a, b) => a - b);
}

function responses(op: Operation): Json {
  const where = `${op.method.toUpperCase()} ${op.path}`;
  const out: Json = {};
  for (const [status, body] of Object.entries(op.responses)) {
    out[status] = isNotJson(body)
      ? { description: body.description, content: { [body.mediaType]: { schema: body.mediaType === "application/json" ? { type: "object" } : { type: "string" } } } }
      : { description: "Success.", content: { "application/json": { schema: responseSchemaRef(body, where) } } };
  }
  for (const status of problemStatuses(op)) {
    const codes = op.problems?.[status];
    if (!codes) {
      out[status] = { $ref: `#/components/responses/Problem${status}` };
      continue;
    }
    const standard = STANDARD_PROBLEMS[status];
    out[status] = problemResponse(
      `${standard ? `${standard} Also: ` : ""}${codes.map((c) => `\`${c}\``).join(", ")}.`,
      [...new Set([...(STANDARD_CODES[status] ?? []), ...codes])],
    );
  }
  return out;
}

function roleNote(op: Operation): string {
  if (!op.roles) return "Anyone: no session or token needed.";
  return `Roles: ${op.roles.join(", ")}.`;
}

export interface OpenApiDocument {
  openapi: string;
  info: Json;
  paths: Record<string, Record<string, Json>>;
  components: { schemas: Record<string, Json>; responses: Json; securitySchemes: Json };
  [key: string]: unknown;
}

/** The API's description, built from the operation registry and the zod schemas the routes parse with. */
export function buildOpenApiDocument(): OpenApiDocument {
  const inputs: Record<string, Json> = {};
  const paths: Record<string, Record<string, Json>> = {};
  for (const op of OPERATIONS) {
    const params = parameters(op);
    const body = requestBody(op, inputs);
    (paths[op.path] ??= {})[op.method] = {
      operationId: op.operationId,
      tags: [op.tag],
      summary: op.summary,
      description: [op.description, roleNote(op)].filter(Boolean).join("\n\n"),
      ...(op.roles ? {} : { security: [] }),
      "x-roles": op.roles ?? [],
      ...(params.length ? { parameters: params } : {}),
      ...(body ? { requestBody: body } : {}),
      responses: responses(op),
    };
  }
  const problemResponses: Json = {};
  for (const [status, description] of Object.entries(STANDARD_PROBLEMS)) {
    problemResponses[`Problem${status}`] = problemResponse(description, STANDARD_CODES[Number(status)] ?? []);
  }
  return {
    openapi: "3.1.1",
    info: {
      title: "Cotter fleet API",
      version: "1.0.0",
      summary: "Units, work orders, estimates and decisions, invoices and statements of a repair shop's fleet accounts.",
      description: [
        "JSON under `/api/v1`. Money is integer cents in fields ending `Cents`; times are ISO 8601 UTC strings.",
        "Errors are RFC 9457 problem documents (`application/problem+json`) with a stable `code`.",
        "Another account's data is `404 not_found`, exactly like an id that does not exist.",
        "Lists take `?limit=` (default 50, at most 200) and `?cursor=`, and answer `nextCursor` (null at the end).",
        "Fields may be added; none is renamed or removed within version 1.",
      ].join(" "),
      license: { name: "Proprietary", identifier: "LicenseRef-Proprietary" },
    },
    servers: [{ url: "/", description: "This Cotter" }],
    security: [{ personalToken: [] }, { session: [] }],
    tags: Object.entries(TAGS).map(([name, description]) => ({ name, description })),
    paths,
    components: {
      schemas: { ...componentSchemas(), ...inputs },
      responses: problemResponses,
      securitySchemes: {
        personalToken: {
          type: "http",
          scheme: "bearer",
          description: "A personal API token (`ctr_…`), created under *API tokens* in the app and shown once. It acts with its owner's role and account; revoke it there.",
        },
        session: {
          type: "apiKey",
          in: "cookie",
          name: "next-auth.session-token",
          description: "The browser's signed-in session (`__Secure-next-auth.session-token` over HTTPS). The app's own pages use it.",
        },
      },
    },
  };
}
