import { createRouteHandler } from "uploadthing/server";
import { uploadThingConfig } from "@/lib/uploads/config";
import { photoRouter } from "./core";

type Handler = ReturnType<typeof createRouteHandler>;
const holder = globalThis as unknown as { __cotterUploadRoute?: { token: string; handler: Handler } };

// Built on first use, not at import: the build runs without the address the server will have.
function handler(): Handler {
  const { token, ingestUrl } = uploadThingConfig();
  if (holder.__cotterUploadRoute?.token !== token) {
    holder.__cotterUploadRoute = {
      token,
      handler: createRouteHandler({ router: photoRouter, config: { token, ingestUrl, logLevel: "Error" } }),
    };
  }
  return holder.__cotterUploadRoute.handler;
}

export const dynamic = "force-dynamic";

// The SDK's fetch-style handler: the phone's upload requests and the upload service's signed callbacks.
export const GET = (request: Request) => handler()(request);
export const POST = (request: Request) => handler()(request);
