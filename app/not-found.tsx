import { NotFoundMessage } from "@/components/shell/not-found-message";

export default function NotFound() {
  return <NotFoundMessage home="/" homeLabel="Go to your home page" hint="There is nothing here, or it belongs to another account." />;
}
