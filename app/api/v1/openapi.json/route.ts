import { buildOpenApiDocument } from "@/lib/api-schema/document";

export const dynamic = "force-dynamic";

let document: ReturnType<typeof buildOpenApiDocument> | undefined;

/**
 * The API's description, open to anyone like any published description: it
 * names paths and shapes, never data. The security headers come from proxy.ts
 * as on every response.
 */
export function GET(): Response {
  document ??= buildOpenApiDocument();
  return Response.json(document, { headers: { "cache-control": "public, max-age=300" } });
}
