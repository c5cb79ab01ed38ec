import { TurnedAway } from "@/components/shell/turned-away";
import { currentUser } from "@/lib/auth/current-user";
import { isStaff } from "@/lib/auth/policy";

export default async function Forbidden() {
  const user = await currentUser();
  return <TurnedAway name={user?.name ?? null} home={user && isStaff(user) ? "/floor" : "/fleet"} />;
}
