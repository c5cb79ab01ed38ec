/**
 * The headers every response carries, from one place (proxy.ts). Scripts run
 * only from this origin or with the request's nonce (Next.js puts the nonce on
 * its own scripts when it finds it in the request's CSP); nothing may frame
 * the app; the browser may not guess content types.
 */
export interface SecurityHeaderOptions {
  nonce: string;
  /** next dev needs eval for React's debugging aids; production never does. */
  dev: boolean;
  https: boolean;
  /** Where the browser may upload photos to directly (the upload service's ingest address). */
  uploadOrigins: readonly string[];
}

export function contentSecurityPolicy(o: SecurityHeaderOptions): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${o.nonce}' 'strict-dynamic'${o.dev ? " 'unsafe-eval'" : ""}`,
    // Elements need the nonce; style attributes (charts, progress bars) are data, not code.
    `style-src 'self' 'nonce-${o.nonce}'`,
    "style-src-attr 'unsafe-inline'",
    // Photo previews before upload are blob: URLs; icons may be data: URLs.
    "img-src 'self' blob: data:",
    "media-src 'self' blob:",
    "font-src 'self'",
    `connect-src 'self' ${o.uploadOrigins.join(" ")}${o.dev ? " ws:" : ""}`.trim(),
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(o.https ? ["upgrade-insecure-requests"] : []),
  ].join("; ");
}

export function securityHeaders(o: SecurityHeaderOptions): Record<string, string> {
  return {
    "content-security-policy": contentSecurityPolicy(o),
    "x-frame-options": "DENY",
    "x-content-type-options": "nosniff",
    "referrer-policy": "strict-origin-when-cross-origin",
    // The technician's camera upload is the app's own; nothing else gets a device.
    "permissions-policy": "camera=(self), microphone=(), geolocation=(), payment=(), usb=(), interest-cohort=()",
    "cross-origin-opener-policy": "same-origin",
    ...(o.https ? { "strict-transport-security": "max-age=31536000; includeSubDomains" } : {}),
  };
}

/** True when the path's percent-encoding cannot be decoded (e.g. /units/%E0%A4%A). */
export function hasMalformedEncoding(pathname: string): boolean {
  try {
    decodeURIComponent(pathname);
    return false;
  } catch {
    return true;
  }
}
