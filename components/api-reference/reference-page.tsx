import Link from "next/link";
import { ApiReference, Words } from "@/components/api-reference/api-reference";
import { CopyCommand } from "@/components/api-reference/copy-command";
import { Card, CardTitle } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { buildOpenApiDocument } from "@/lib/api-schema/document";
import { referenceView } from "@/lib/api-schema/reference";
import { env } from "@/lib/env";

/** The fleet API reference with the token steps and example requests; each side's page guards itself first and renders this. */
export function ReferencePage({ tokensHref }: { tokensHref: string }) {
  const view = referenceView(buildOpenApiDocument());
  const origin = env().NEXTAUTH_URL.replace(/\/$/, "");
  const operations = view.tags.reduce((n, t) => n + t.operations.length, 0);
  return (
    <>
      <PageHeader title="Fleet API reference" kicker={`OpenAPI 3.1 · version ${view.version} · ${operations} operations`} />
      <div className="flex flex-col gap-4">
        <Card>
          <CardTitle>Start here</CardTitle>
          <p className="text-sm">
            <Words text={view.description} />
          </p>
          <ol className="mt-2 list-decimal pl-5 text-sm">
            <li>
              Create a personal token under <Link href={tokensHref}>API tokens</Link>. It is shown once; keep it in your script&apos;s secrets, not in its code.
            </li>
            <li>
              Send it on every request as <code>Authorization: Bearer ctr_…</code>. It acts with your role and your account, nothing more; revoke it there when the script retires.
            </li>
            <li>
              The machine-readable description is at <a href="/api/v1/openapi.json">/api/v1/openapi.json</a>; tools that read OpenAPI 3.1 check requests and answers against it.
            </li>
          </ol>
        </Card>
        <Card>
          <CardTitle>Try it</CardTitle>
          <div className="flex flex-col gap-4">
            <CopyCommand label="Your units in the shop" command={`curl -H "Authorization: Bearer $COTTER_TOKEN" "${origin}/api/v1/units?inShop=true"`} />
            <CopyCommand
              label="A typed client: types from the description, calls through openapi-fetch"
              command={`npx openapi-typescript ${origin}/api/v1/openapi.json -o fleet-api.d.ts\nnpm install openapi-fetch`}
            />
          </div>
        </Card>
        <ApiReference view={view} />
      </div>
    </>
  );
}
