import "server-only";
/**
 * Who is on the other end of the connection. Next.js gives route handlers no
 * socket, and it keeps a client's own X-Forwarded-For as sent (it adds the
 * socket address only when the header is missing), so that header alone can
 * be forged by anyone. The server stamps the socket's address on every request
 * under a header of its own (installSocketAddressStamp, run once at start),
 * replacing whatever a client sent under that name.
 */
export const SOCKET_ADDRESS_HEADER = "x-cotter-socket-address";

/**
 * The client's address: the socket's when no proxy is trusted; with N trusted
 * proxies in front, the entry of X-Forwarded-For that the outermost of them
 * wrote (each proxy appends the address it was connected from, so the Nth
 * entry from the right is the first one a client could not have written).
 */
export function clientAddress(header: (name: string) => string | null | undefined, trustedProxies: number): string {
  const socket = header(SOCKET_ADDRESS_HEADER)?.trim() || "unknown";
  if (trustedProxies <= 0) return socket;
  const hops = (header("x-forwarded-for") ?? "")
    .split(",")
    .map((h) => h.trim())
    .filter(Boolean);
  if (hops.length === 0) return socket;
  return hops[Math.max(0, hops.length - trustedProxies)] ?? socket;
}

interface StampMessage {
  request: { headers: Record<string, string | string[] | undefined> };
  socket: { remoteAddress?: string };
}

const holder = globalThis as unknown as { __cotterSocketStamp?: boolean };

/**
 * Node publishes every incoming HTTP request on the "http.server.request.start"
 * diagnostics channel, with its socket, before any handler sees it.
 */
export async function installSocketAddressStamp(): Promise<void> {
  if (holder.__cotterSocketStamp) return;
  holder.__cotterSocketStamp = true;
  const { subscribe } = await import("node:diagnostics_channel");
  subscribe("http.server.request.start", (message) => {
    const { request, socket } = message as StampMessage;
    delete request.headers[SOCKET_ADDRESS_HEADER];
    if (socket.remoteAddress) request.headers[SOCKET_ADDRESS_HEADER] = socket.remoteAddress;
  });
}
