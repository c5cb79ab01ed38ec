import { resolve } from "node:path";

/** Where the fake keeps files: FAKE_UPLOADTHING_STORAGE, or mocks/.storage/uploadthing (git-ignored). */
export function fakeStorageDir(): string {
  return process.env.FAKE_UPLOADTHING_STORAGE ?? resolve(import.meta.dirname, "../.storage/uploadthing");
}
