import { getClient } from "@/db/client";

export const dynamic = "force-dynamic";

export async function GET(): Promise<Response> {
  try {
    await getClient().execute("select 1");
    return Response.json({ status: "ok" });
  } catch {
    return new Response(
      JSON.stringify({
        type: "urn:cotter:problem:database_unreachable",
        title: "Database unreachable",
        status: 503,
        detail: "The app is up but cannot reach its database.",
        code: "database_unreachable",
      }),
      { status: 503, headers: { "content-type": "application/problem+json" } },
    );
  }
}
