import type { OpenApiDocument } from "./document";

/**
 * The API description as people read it on the reference page: operations by
 * tag, each with its parameters, body, answers and problem codes, and each
 * named schema as a list of fields. Built from the document's JSON alone, so
 * the page shows exactly what a client generator sees.
 */
type Json = Record<string, unknown>;

export interface FieldView {
  name: string;
  type: string;
  required: boolean;
  description: string;
}

export interface ParameterView extends FieldView {
  in: string;
}

export interface AnswerView {
  status: string;
  description: string;
  mediaType: string | null;
  /** The named schema of the body, when it has one. */
  schema: string | null;
  codes: string[];
}

export interface OperationView {
  id: string;
  method: string;
  path: string;
  summary: string;
  description: string;
  roles: string[];
  open: boolean;
  parameters: ParameterView[];
  body: { mediaType: string; schema: string | null; description: string } | null;
  answers: AnswerView[];
}

export interface TagView {
  name: string;
  description: string;
  operations: OperationView[];
}

export interface SchemaView {
  name: string;
  description: string;
  /** Text for a schema that is not an object with fields (an enum, a list). */
  type: string;
  fields: FieldView[];
}

export interface ReferenceView {
  title: string;
  version: string;
  description: string;
  tags: TagView[];
  schemas: SchemaView[];
  /** Every problem code, with the operations that name it. */
  problemCodes: { code: string; operations: string[] }[];
}

const refName = (ref: string) => ref.slice(ref.lastIndexOf("/") + 1);

/** A JSON Schema in a few words: `string or null`, `list of EstimateLine`, `one of "approve", "decline"`. */
export function typeText(schema: Json | undefined): string {
  if (!schema) return "any";
  if (typeof schema.$ref === "string") return refName(schema.$ref);
  if (Array.isArray(schema.enum)) return `one of ${schema.enum.map((v) => JSON.stringify(v)).join(", ")}`;
  if ("const" in schema) return JSON.stringify(schema.const);
  for (const key of ["anyOf", "oneOf"] as const) {
    const options = schema[key];
    if (Array.isArray(options)) return (options as Json[]).map(typeText).join(" or ");
  }
  if (Array.isArray(schema.allOf)) return (schema.allOf as Json[]).map(typeText).filter((t) => t !== "object").join(" and ") || "object";
  const types = Array.isArray(schema.type) ? (schema.type as string[]) : typeof schema.type === "string" ? [schema.type] : [];
  const words = types.map((t) => {
    if (t === "array") return `list of ${typeText(schema.items as Json | undefined)}`;
    if (t === "string" && typeof schema.format === "string") return `string (${schema.format})`;
    return t;
  });
  return words.length ? words.join(" or ") : "any";
}

function fieldsOf(schema: Json): FieldView[] {
  const properties = (schema.properties ?? {}) as Record<string, Json>;
  const required = new Set((schema.required ?? []) as string[]);
  return Object.entries(properties).map(([name, p]) => ({ name, type: typeText(p), required: required.has(name), description: String(p.description ?? "") }));
}

function resolveResponse(doc: OpenApiDocument, response: Json): Json {
  const ref = response.$ref;
  return typeof ref === "string" ? ((doc.components.responses as Record<string, Json>)[refName(ref)] ?? {}) : response;
}

function answer(doc: OpenApiDocument, status: string, raw: Json): AnswerView {
  const response = resolveResponse(doc, raw);
  const [mediaType, media] = Object.entries((response.content ?? {}) as Record<string, { schema?: Json }>)[0] ?? [null, undefined];
  const schema = media?.schema;
  const named = schema?.$ref ?? (Array.isArray(schema?.allOf) ? (schema.allOf as Json[])[0]?.$ref : undefined);
  return {
    status,
    description: String(response.description ?? ""),
    mediaType,
    schema: typeof named === "string" ? refName(named) : null,
    codes: (response["x-problem-codes"] ?? []) as string[],
  };
}

function operation(doc: OpenApiDocument, path: string, method: string, op: Json): OperationView {
  const body = op.requestBody as Json | undefined;
  const [bodyType, bodyMedia] = Object.entries((body?.content ?? {}) as Record<string, { schema?: Json }>)[0] ?? [null, undefined];
  const security = op.security as unknown[] | undefined;
  return {
    id: String(op.operationId),
    method: method.toUpperCase(),
    path,
    summary: String(op.summary ?? ""),
    description: String(op.description ?? ""),
    roles: (op["x-roles"] ?? []) as string[],
    open: Array.isArray(security) && security.length === 0,
    parameters: ((op.parameters ?? []) as Json[]).map((p) => ({
      name: String(p.name),
      in: String(p.in),
      type: typeText(p.schema as Json),
      required: Boolean(p.required),
      description: String(p.description ?? ""),
    })),
    body: bodyType
      ? { mediaType: bodyType, schema: typeof bodyMedia?.schema?.$ref === "string" ? refName(bodyMedia.schema.$ref) : null, description: String(body?.description ?? "") }
      : null,
    answers: Object.entries(op.responses as Record<string, Json>).map(([status, r]) => answer(doc, status, r)),
  };
}

export function referenceView(doc: OpenApiDocument): ReferenceView {
  const operations = Object.entries(doc.paths).flatMap(([path, methods]) => Object.entries(methods).map(([method, op]) => ({ op: operation(doc, path, method, op), tag: ((op.tags ?? []) as string[])[0] ?? "" })));
  const tags = ((doc.tags ?? []) as { name: string; description?: string }[]).map((t) => ({
    name: t.name,
    description: t.description ?? "",
    operations: operations.filter((o) => o.tag === t.name).map((o) => o.op),
  }));
  const byCode = new Map<string, Set<string>>();
  for (const { op } of operations) for (const a of op.answers) for (const code of a.codes) (byCode.get(code) ?? byCode.set(code, new Set()).get(code)!).add(op.id);
  const codeList = ((doc.components.schemas.ProblemCode?.enum ?? []) as string[]).map((code) => ({ code, operations: [...(byCode.get(code) ?? [])] }));
  const schemas = Object.entries(doc.components.schemas)
    .map(([name, s]) => ({ name, description: String(s.description ?? ""), type: typeText(s), fields: fieldsOf(s) }))
    .sort((a, b) => a.name.localeCompare(b.name));
  const info = doc.info as { title?: string; version?: string; description?: string };
  return { title: info.title ?? "", version: info.version ?? "", description: info.description ?? "", tags, schemas, problemCodes: codeList };
}
