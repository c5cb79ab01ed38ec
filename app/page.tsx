import { redirect } from "next/navigation";
import { needsSetup } from "@/db/queries/setup";
import { currentUser } from "@/lib/server/auth/current-user";
import { isStaff } from "@/lib/auth/policy";

// Asks the database whether this install is set up yet: never prerendered at build time.
export const dynamic = "force-dynamic";

export default async function Home() {
  if (await needsSetup()) redirect("/setup");
  const user = await currentUser();
  if (!user) redirect("/sign-in");
  redirect(isStaff(user) ? "/floor" : "/fleet");
}
