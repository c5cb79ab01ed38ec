import { NotFoundMessage } from "@/components/shell/not-found-message";

// Inside the fleet portal's frame; a record of another account reads the same as none.
export default function FleetNotFound() {
  return <NotFoundMessage inShell home="/fleet" homeLabel="Back to your units" hint="There is no such record in your account, or the link is mistyped." />;
}
