// Adding Cotter to a phone's home screen (issue 12, item 5): the pages name a web
// app manifest whose icons are served, and robots.txt keeps the records out of
// search indexes. What a manifest must hold to be installable is the W3C Web
// Application Manifest spec's member list plus the browsers' common practice of
// a 192 px and a 512 px icon.
import { describe, expect, inject, it } from "vitest";

interface Manifest {
  name: string;
  short_name: string;
  start_url: string;
  display: string;
  icons: { src: string; sizes: string; type: string; purpose?: string }[];
}

const base = () => inject("baseUrl");

describe("home screen and crawlers", () => {
  it("the sign-in page links the manifest and a home-screen icon", async () => {
    const html = await (await fetch(`${base()}/sign-in`)).text();
    expect(html).toMatch(/<link rel="manifest" href="\/manifest.webmanifest"/);
    expect(html).toMatch(/<link rel="apple-touch-icon" href="\/apple-icon.png/);
    // The browser-tab icon from app/icon.svg is still there beside them.
    expect(html).toMatch(/<link rel="icon" href="\/icon.svg/);
  });

  it("the manifest opens Cotter on its own, with 192 px, 512 px and maskable icons that are served", async () => {
    const res = await fetch(`${base()}/manifest.webmanifest`);
    expect(res.status).toBe(200);
    const manifest = (await res.json()) as Manifest;
    expect(manifest).toMatchObject({ name: "Cotter", short_name: "Cotter", start_url: "/", display: "standalone" });
    expect(manifest.icons.map((i) => i.sizes)).toEqual(expect.arrayContaining(["192x192", "512x512"]));
    expect(manifest.icons.some((i) => i.purpose === "maskable")).toBe(true);
    for (const icon of [...manifest.icons, { src: "/apple-icon.png", sizes: "180x180" }]) {
      const image = await fetch(`${base()}${icon.src}`);
      expect(image.status, icon.src).toBe(200);
      expect(image.headers.get("content-type")).toBe("image/png");
      const bytes = new Uint8Array(await image.arrayBuffer());
      // A PNG's width and height are big-endian at bytes 16–23 of its IHDR chunk (PNG spec, section 11.2.2).
      const view = new DataView(bytes.buffer);
      expect(`${view.getUint32(16)}x${view.getUint32(20)}`, icon.src).toBe(icon.sizes);
    }
  });

  it("robots.txt asks every crawler to stay out", async () => {
    const res = await fetch(`${base()}/robots.txt`);
    expect(res.status).toBe(200);
    expect(await res.text()).toMatch(/User-agent: \*\nDisallow: \/\n/);
  });
});
