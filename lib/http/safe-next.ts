/** Only same-site paths may be a post-sign-in destination (no open redirects). */
export function safeNextPath(value: string | undefined | null, fallback = "/"): string {
  if (!value) return fallback;
  try {
    const url = new URL(value, "http://cotter.invalid");
    if (url.origin !== "http://cotter.invalid") return fallback;
    return `${url.pathname}${url.search}${url.hash}` || fallback;
  } catch {
    return fallback;
  }
}
