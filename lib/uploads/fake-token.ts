// The SDK decodes UPLOADTHING_TOKEN as base64 JSON { apiKey: "sk_…", appId, regions: [..], ingestHost? }
// (uploadthing dist/shared-schemas: ParsedToken). A fake token has exactly that shape.

export const DEFAULT_FAKE_APP_ID = "fakelocalapp";
export const DEFAULT_FAKE_API_KEY = "sk_fake_local_development_only";
export const FAKE_REGION = "fake-local";

export interface FakeTokenParts {
  apiKey: string;
  appId: string;
  regions: string[];
  ingestHost: string;
}

export function makeFakeToken(opts: {
  baseUrl: string;
  appId?: string;
  apiKey?: string;
}): string {
  const apiKey = opts.apiKey ?? DEFAULT_FAKE_API_KEY;
  if (!apiKey.startsWith("sk_")) throw new Error("apiKey must start with sk_ (the SDK rejects others)");
  const parts: FakeTokenParts = {
    apiKey,
    appId: opts.appId ?? DEFAULT_FAKE_APP_ID,
    regions: [FAKE_REGION],
    // Informational only: the SDK would build https://<region>.<ingestHost>, which cannot reach a
    // plain-http local server, so UPLOADTHING_INGEST_URL must still be set.
    ingestHost: new URL(opts.baseUrl).host,
  };
  return Buffer.from(JSON.stringify(parts), "utf8").toString("base64");
}

/**
 * Environment for an app whose UploadThing SDK should talk to the fake at baseUrl.
 * Names come from the SDK's config provider: options are read as UPLOADTHING_<CONSTANT_CASE>.
 */
export function fakeUploadThingEnv(baseUrl: string, token: string): Record<string, string> {
  const url = new URL(baseUrl);
  return {
    UPLOADTHING_TOKEN: token,
    UPLOADTHING_INGEST_URL: url.origin,
    UPLOADTHING_API_URL: url.origin,
    // UTApi.generateSignedURL builds URLs locally; it picks http only when the host contains
    // "local", and the path form avoids needing <appId>.localhost to resolve.
    UPLOADTHING_UFS_HOST: `localhost:${url.port}`,
    UPLOADTHING_UFS_APP_ID_LOCATION: "path",
  };
}
