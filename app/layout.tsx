import "@fontsource-variable/atkinson-hyperlegible-next";
import "./globals.css";
import type { Metadata, Viewport } from "next";
import { connection } from "next/server";

export const metadata: Metadata = {
  title: { default: "Cotter", template: "%s · Cotter" },
  description: "Work orders, findings, estimates and approvals between a truck shop and its fleets.",
  // Added to a phone's home screen, Cotter opens like an app (public/manifest.webmanifest); app/icon.svg and
  // app/apple-icon.png are the tab and home-screen icons by Next's file conventions.
  manifest: "/manifest.webmanifest",
  appleWebApp: { capable: true, title: "Cotter", statusBarStyle: "default" },
  robots: { index: false, follow: false },
};

export const viewport: Viewport = {
  width: "device-width",
  initialScale: 1,
  themeColor: "#f6f1e7",
};

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page renders per request, so each gets the nonce of its own CSP (proxy.ts); a prebuilt page would carry none.
  await connection();
  return (
    <html lang="en">
      <body>{children}</body>
    </html>
  );
}
