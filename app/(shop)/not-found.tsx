import { NotFoundMessage } from "@/components/shell/not-found-message";

// Inside the shop's own frame, so the navigation stays at hand.
export default function ShopNotFound() {
  return <NotFoundMessage inShell home="/floor" homeLabel="Back to the Floor" hint="There is no such record here. It may have been retired, or the link is mistyped." />;
}
