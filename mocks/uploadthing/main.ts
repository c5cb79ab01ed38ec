// Starts the fake: `npx tsx mocks/uploadthing/main.ts`. Prints the env the app needs.
import { resolve } from "node:path";
import { startFakeUploadThing } from "./server";

const port = Number(process.env.FAKE_UPLOADTHING_PORT ?? "12112");
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  throw new Error(`FAKE_UPLOADTHING_PORT must be a port number, got ${process.env.FAKE_UPLOADTHING_PORT}`);
}
const storageDir = process.env.FAKE_UPLOADTHING_STORAGE ?? resolve(import.meta.dirname, "../.storage/uploadthing");

const fake = await startFakeUploadThing({
  port,
  storageDir,
  appId: process.env.FAKE_UPLOADTHING_APP_ID || undefined,
  apiKey: process.env.FAKE_UPLOADTHING_API_KEY || undefined,
});

console.log(`fake UploadThing listening on ${fake.url} (files in ${storageDir})`);
console.log("Set these in the app's environment:");
for (const [name, value] of Object.entries(fake.env)) console.log(`${name}=${value}`);

const stop = (): void => {
  void fake.close().then(() => process.exit(0));
};
process.once("SIGINT", stop);
process.once("SIGTERM", stop);
