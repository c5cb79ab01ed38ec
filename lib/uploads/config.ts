import { fakeUploadThingEnv, makeFakeToken } from "@/lib/uploads/fake-token";
import { env } from "@/lib/env";

/** What the UploadThing SDK is told: the real service's token, or the local fake's token and addresses. */
export interface UploadThingConfig {
  token: string;
  ingestUrl?: string;
  apiUrl?: string;
  ufsHost?: string;
  ufsAppIdLocation?: "subdomain" | "path";
  /** True when the SDK talks to mocks/uploadthing. Only for messages: the code path is the same. */
  fake: boolean;
}

/**
 * One code path for both: with UPLOADTHING_TOKEN the SDK reads the rest of its
 * settings from the environment as usual; without it, the same SDK gets the
 * fake's token and its address on FAKE_UPLOADTHING_PORT (mocks/uploadthing/README.md).
 */
export function uploadThingConfig(): UploadThingConfig {
  const e = env();
  if (e.UPLOADTHING_TOKEN) return { token: e.UPLOADTHING_TOKEN, fake: false };
  const baseUrl = `http://127.0.0.1:${e.FAKE_UPLOADTHING_PORT}`;
  const fakeEnv = fakeUploadThingEnv(baseUrl, makeFakeToken({ baseUrl }));
  return {
    token: fakeEnv.UPLOADTHING_TOKEN ?? "",
    ingestUrl: fakeEnv.UPLOADTHING_INGEST_URL,
    apiUrl: fakeEnv.UPLOADTHING_API_URL,
    ufsHost: fakeEnv.UPLOADTHING_UFS_HOST,
    ufsAppIdLocation: "path",
    fake: true,
  };
}

/** Origins the browser sends photo bytes to (the CSP's connect-src): the service's ingest hosts, or the local fake. */
export function uploadOrigins(): string[] {
  const c = uploadThingConfig();
  if (c.fake && c.ingestUrl) return [new URL(c.ingestUrl).origin];
  return ["https://*.ingest.uploadthing.com", "https://*.ufs.sh", "https://uploadthing.com"];
}
