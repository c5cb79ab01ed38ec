import { startCheckout } from "@/lib/server/payments/checkout";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";

export const dynamic = "force-dynamic";

/** A payment page for the open balance; the payment itself is recorded only from the signed webhook. */
export const POST = apiRoute({ roles: CAN.pay, params: idParams }, async ({ user, params }) => {
  const { url } = await startCheckout(user, params.id);
  return { url };
});
