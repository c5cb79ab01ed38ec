import { CAN } from "@/lib/auth/policy";
import { apiRoute } from "@/lib/server/http/api-route";

export const dynamic = "force-dynamic";

export const GET = apiRoute({ roles: CAN.anyone }, async ({ user }) => ({
  id: user.id,
  name: user.name,
  email: user.email,
  role: user.role,
  accountId: user.accountId,
}));
