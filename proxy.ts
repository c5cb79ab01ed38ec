import { NextResponse, type NextRequest } from "next/server";
import { env } from "@/lib/env";
import { HttpError, problemBody } from "@/lib/http/problem";
import { hasMalformedEncoding, securityHeaders } from "@/lib/http/security-headers";
import { uploadOrigins } from "@/lib/uploads/config";

/**
 * Runs before every request is routed (Next.js 16's name for middleware): one
 * place for the security headers, a fresh CSP nonce per request, and a 400 for
 * a URL whose percent-encoding cannot be decoded, which the router would
 * otherwise answer with a bare 500.
 */
export function proxy(request: NextRequest): NextResponse {
  const e = env();
  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(16))).toString("base64");
  const https = e.NEXTAUTH_URL.startsWith("https:") || (e.COTTER_TRUSTED_PROXIES > 0 && request.headers.get("x-forwarded-proto") === "https");
  const headers = securityHeaders({ nonce, dev: e.NODE_ENV === "development", https, uploadOrigins: uploadOrigins() });

  let response: NextResponse;
  if (hasMalformedEncoding(request.nextUrl.pathname)) {
    const problem = new HttpError(400, "malformed_url", "Malformed URL", "The address has percent-encoding that cannot be decoded.");
    response = NextResponse.json(problemBody(problem), { status: 400, headers: { "content-type": "application/problem+json" } });
  } else {
    // Next.js reads the nonce from the request's own CSP header and stamps it on the scripts it renders.
    const forward = new Headers(request.headers);
    forward.set("content-security-policy", headers["content-security-policy"]!);
    forward.set("x-nonce", nonce);
    response = NextResponse.next({ request: { headers: forward } });
  }
  for (const [name, value] of Object.entries(headers)) response.headers.set(name, value);
  return response;
}

export const config = {
  // Built files carry no user content; everything else, pages and API alike, gets the headers.
  matcher: ["/((?!_next/static|_next/image).*)"],
};
