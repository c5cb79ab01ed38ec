import { TurnedAway } from "@/components/shell/turned-away";
import { currentUser } from "@/lib/server/auth/current-user";
import { isStaff } from "@/lib/auth/policy";

export default async function Forbidden() {
  const user = await currentUser();
  const staff = user !== null && isStaff(user);
  return <TurnedAway name={user?.name ?? null} home={staff ? "/floor" : "/fleet"} staff={staff} />;
}
