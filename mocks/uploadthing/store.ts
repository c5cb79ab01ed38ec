import { mkdir, readdir, readFile, rename, rm, stat, writeFile } from "node:fs/promises";
import { join } from "node:path";

export type Acl = "public-read" | "private";
export type ContentDisposition = "inline" | "attachment";

export interface StoredFile {
  key: string;
  name: string;
  size: number;
  type: string;
  customId: string | null;
  acl: Acl;
  contentDisposition: ContentDisposition;
  /** md5 hex of the bytes, as the SDK's UploadedFileData.fileHash describes it. */
  fileHash: string;
  uploadedAt: number;
  slug: string | null;
  /** What onUploadComplete returned, kept so a repeated PUT can answer the same. */
  serverData?: unknown;
}

// SDK keys are Sqids (letters and digits); anything else never reaches the disk.
const KEY_PATTERN = /^[A-Za-z0-9_-]{1,128}$/;

export function isValidKey(key: string): boolean {
  return KEY_PATTERN.test(key);
}

/** Bytes in `<dir>/<key>`, description in `<dir>/<key>.json`. */
export class FileStore {
  constructor(readonly dir: string) {}

  async init(): Promise<void> {
    await mkdir(this.dir, { recursive: true });
  }

  dataPath(key: string): string {
    if (!isValidKey(key)) throw new Error(`invalid file key ${key}`);
    return join(this.dir, key);
  }

  private metaPath(key: string): string {
    return `${this.dataPath(key)}.json`;
  }

  async save(file: StoredFile, bytes: Uint8Array): Promise<void> {
    const tmp = `${this.dataPath(file.key)}.${process.pid}.tmp`;
    await writeFile(tmp, bytes);
    await rename(tmp, this.dataPath(file.key));
    await this.writeMeta(file);
  }

  private async writeMeta(file: StoredFile): Promise<void> {
    const tmp = `${this.metaPath(file.key)}.${process.pid}.tmp`;
    await writeFile(tmp, JSON.stringify(file, null, 2));
    await rename(tmp, this.metaPath(file.key));
  }

  async get(key: string): Promise<StoredFile | null> {
    if (!isValidKey(key)) return null;
    try {
      return JSON.parse(await readFile(this.metaPath(key), "utf8")) as StoredFile;
    } catch {
      return null;
    }
  }

  async read(key: string): Promise<Buffer> {
    return readFile(this.dataPath(key));
  }

  async update(key: string, patch: Partial<Omit<StoredFile, "key">>): Promise<StoredFile | null> {
    const current = await this.get(key);
    if (!current) return null;
    const next = { ...current, ...patch };
    await this.writeMeta(next);
    return next;
  }

  async remove(key: string): Promise<boolean> {
    if (!(await this.get(key))) return false;
    await rm(this.metaPath(key), { force: true });
    await rm(this.dataPath(key), { force: true });
    return true;
  }

  async list(): Promise<StoredFile[]> {
    const names = await readdir(this.dir).catch(() => [] as string[]);
    const files: StoredFile[] = [];
    for (const name of names) {
      if (!name.endsWith(".json") || name.endsWith(".tmp")) continue;
      const file = await this.get(name.slice(0, -".json".length));
      if (file) files.push(file);
    }
    return files.sort((a, b) => a.uploadedAt - b.uploadedAt || a.key.localeCompare(b.key));
  }

  /** Resolves SDK-style selectors ({ fileKey } or { customId }) to stored keys. */
  async resolve(ref: { fileKey?: unknown; customId?: unknown }): Promise<string | null> {
    if (typeof ref.fileKey === "string") return (await this.get(ref.fileKey)) ? ref.fileKey : null;
    if (typeof ref.customId === "string") {
      const match = (await this.list()).find((f) => f.customId === ref.customId);
      return match?.key ?? null;
    }
    return null;
  }

  async totalBytes(): Promise<number> {
    let total = 0;
    for (const f of await this.list()) {
      total += await stat(this.dataPath(f.key)).then((s) => s.size, () => 0);
    }
    return total;
  }
}
