import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // A second build directory lets two checkouts' servers (or a test run beside
  // a dev server) live side by side without clobbering each other.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  // libSQL ships a native module: load it from node_modules at run time.
  serverExternalPackages: ["@libsql/client", "libsql", "sharp", "heic-convert", "heic-decode", "libheif-js", "pdfkit", "bcryptjs"],
  poweredByHeader: false,
  // Inlined into browser bundles at build time, so times drawn on screen use
  // the shop's zone like the server does (lib/format's default).
  env: { APP_TIME_ZONE: process.env.APP_TIME_ZONE || "America/Chicago" },
  typedRoutes: false,
  // unauthorized() and forbidden() render app/unauthorized.tsx and app/forbidden.tsx with 401/403.
  experimental: { authInterrupts: true },
  // The owner's mail page moved when it started showing real outgoing mail; old links still land.
  async redirects() {
    return [{ source: "/dev/mail", destination: "/settings/mail", permanent: false }];
  },
};

export default nextConfig;
