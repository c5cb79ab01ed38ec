import { runFirstSetup } from "@/db/queries/setup";
import { publicRoute } from "@/lib/server/http/api-route";
import { setupApiInput } from "@/lib/validation/setup";

export const dynamic = "force-dynamic";

/** First run only: creates the shop and its owner on an empty database; 409 `already_set_up` ever after. */
export const POST = publicRoute({ body: setupApiInput }, async ({ body }) => {
  const owner = await runFirstSetup(body);
  return Response.json({ owner: { id: owner.id, email: owner.email, name: owner.name } }, { status: 201 });
});
