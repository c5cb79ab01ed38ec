import { z } from "zod";
import { listUnits } from "@/db/queries/units";
import { CAN } from "@/lib/auth/policy";
import { apiRoute } from "@/lib/http/api-route";
import { pageQuery } from "@/lib/http/pagination";

export const dynamic = "force-dynamic";

export const GET = apiRoute(
  {
    roles: CAN.anyone,
    query: pageQuery.extend({ inShop: z.enum(["true", "false"]).optional().transform((v) => v === "true") }),
  },
  ({ user, query }) => listUnits(user, query),
);
