import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { resetEnvCache } from "@/lib/env";
import { startFakeUploadThing, type FakeUploadThing } from "@/mocks/uploadthing/server";

export interface UploadFake {
  fake: FakeUploadThing;
  /** Where the fake keeps files, for tests that look at them. */
  storage: string;
  stop(): Promise<void>;
}

/**
 * Starts the local upload fake on a free port with its own folder and, as with
 * no UPLOADTHING_TOKEN set, points the app's SDK at it.
 */
export async function startUploadFake(prefix: string): Promise<UploadFake> {
  const storage = await mkdtemp(join(tmpdir(), `${prefix}-`));
  const fake = await startFakeUploadThing({ port: 0, storageDir: storage, onWarning: () => undefined });
  delete process.env.UPLOADTHING_TOKEN;
  process.env.FAKE_UPLOADTHING_PORT = new URL(fake.url).port;
  resetEnvCache();
  return {
    fake,
    storage,
    async stop() {
      delete process.env.FAKE_UPLOADTHING_PORT;
      resetEnvCache();
      await fake.close();
      await rm(storage, { recursive: true, force: true });
    },
  };
}
