import "server-only";
import { UTApi } from "uploadthing/server";
import { uploadThingConfig } from "@/lib/uploads/config";

const holder = globalThis as unknown as { __cotterUtApi?: { token: string; api: UTApi } };

/** The server-side UploadThing client, configured once per token (tests switch fakes between files). */
export function utApi(): UTApi {
  const { fake: _fake, ...config } = uploadThingConfig();
  if (!holder.__cotterUtApi || holder.__cotterUtApi.token !== config.token) {
    holder.__cotterUtApi = { token: config.token, api: new UTApi({ ...config, logLevel: "Error" }) };
  }
  return holder.__cotterUtApi.api;
}
