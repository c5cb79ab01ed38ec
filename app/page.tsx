import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/current-user";
import { isStaff } from "@/lib/auth/policy";

export default async function Home() {
  const user = await currentUser();
  if (!user) redirect("/sign-in");
  redirect(isStaff(user) ? "/floor" : "/fleet");
}
