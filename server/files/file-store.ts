import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";
import type { Readable } from "node:stream";
import type { Config } from "../config";

/**
 * The one place uploaded bytes live. A file is saved under its stored id: the SHA-256 of the stored bytes
 * in lowercase hex, a dot and its extension (content addressing: the same bytes always get the same id, an
 * id never names two contents, so it may be cached forever). Ids are checked against a strict pattern before
 * any path is built, so no id can reach outside the store's directory (OWASP Path Traversal; OWASP File Upload
 * Cheat Sheet: "generate a new filename", "store files outside the webroot").
 *
 * Files are read with fs streams, not `res.sendFile`: `send` refuses any path with a dot-directory such as the
 * default `.data/` (it answers "not found" unless `dotfiles: "allow"`; express docs, res.sendFile options).
 */

export const STORED_TYPES = {
  jpg: "image/jpeg",
  png: "image/png",
  webp: "image/webp",
  pdf: "application/pdf",
} as const;
export type StoredExt = keyof typeof STORED_TYPES;
export type StoredMime = (typeof STORED_TYPES)[StoredExt];

export const EXT_FOR_MIME: Record<StoredMime, StoredExt> = { "image/jpeg": "jpg", "image/png": "png", "image/webp": "webp", "application/pdf": "pdf" };

/**
 * 64 hex digits: a SHA-256 content hash (FIPS 180-4: 256-bit digest). 32 hex digits: the random names photos and
 * certificates were stored under before content addressing; they are still read, never written.
 */
const ID_PATTERN = /^(?:[a-f0-9]{64}|[a-f0-9]{32})\.(jpg|png|webp|pdf)$/;

export function isStoredId(id: unknown): id is string {
  return typeof id === "string" && ID_PATTERN.test(id);
}

/** The Content-Type of a stored id, from its extension (the extension was chosen from the sniffed bytes). */
export function contentTypeOf(id: string): StoredMime {
  const m = ID_PATTERN.exec(id);
  if (!m) throw new Error("not a stored id");
  return STORED_TYPES[m[1] as StoredExt];
}

/** The hash part of a stored id: a strong validator for ETag (RFC 9110 §8.8.3). */
export const hashOf = (id: string) => id.slice(0, id.indexOf("."));

export interface OpenedFile {
  id: string;
  contentType: StoredMime;
  size: number;
  stream: Readable;
}

export class FileStore {
  constructor(readonly dir: string) {}

  private pathOf(id: string): string {
    if (!isStoredId(id)) throw new Error(`not a stored id: ${JSON.stringify(id).slice(0, 80)}`);
    const full = path.resolve(this.dir, id);
    // Belt and braces: the pattern has no separators or dots before the extension, so this always holds.
    if (path.dirname(full) !== path.resolve(this.dir)) throw new Error("stored id outside the store");
    return full;
  }

  /** Save bytes; answers their stored id. Written to a temporary name and renamed, so a reader never sees half a file. */
  async save(bytes: Buffer, ext: StoredExt): Promise<string> {
    if (!(ext in STORED_TYPES)) throw new Error(`unknown extension ${ext}`);
    const id = `${crypto.createHash("sha256").update(bytes).digest("hex")}.${ext}`;
    const target = this.pathOf(id);
    await fs.promises.mkdir(this.dir, { recursive: true });
    if (await this.exists(id)) return id; // same bytes, same file
    const tmp = path.join(this.dir, `.incoming-${crypto.randomBytes(8).toString("hex")}`);
    try {
      await fs.promises.writeFile(tmp, bytes, { mode: 0o600, flag: "wx" });
      await fs.promises.rename(tmp, target); // atomic within one file system (POSIX rename(2))
    } catch (err) {
      await fs.promises.rm(tmp, { force: true }).catch(() => undefined);
      throw err;
    }
    return id;
  }

  async exists(id: string): Promise<boolean> {
    if (!isStoredId(id)) return false;
    try {
      return (await fs.promises.stat(this.pathOf(id))).isFile();
    } catch {
      return false;
    }
  }

  /** Open a stored file for reading; null when the id is not a stored id or no such file is stored. */
  async open(id: string): Promise<OpenedFile | null> {
    if (!isStoredId(id)) return null;
    let handle: fs.promises.FileHandle;
    try {
      handle = await fs.promises.open(this.pathOf(id), "r");
    } catch (err) {
      const code = (err as NodeJS.ErrnoException).code;
      if (code === "ENOENT" || code === "ENOTDIR" || code === "EISDIR") return null;
      throw err;
    }
    try {
      const st = await handle.stat();
      if (!st.isFile()) {
        await handle.close();
        return null;
      }
      return { id, contentType: contentTypeOf(id), size: st.size, stream: handle.createReadStream() };
    } catch (err) {
      await handle.close().catch(() => undefined);
      throw err;
    }
  }

  /** The whole file (tests and small reads); null when missing. */
  async read(id: string): Promise<Buffer | null> {
    if (!isStoredId(id)) return null;
    try {
      return await fs.promises.readFile(this.pathOf(id));
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === "ENOENT") return null;
      throw err;
    }
  }

  async remove(id: string): Promise<void> {
    if (!isStoredId(id)) return;
    await fs.promises.rm(this.pathOf(id), { force: true });
  }
}

/**
 * The two stores under the configured data directory (`config.uploadsDir`, by default `.data/uploads`):
 * product photos at its top level (the sizes screens show), their originals in `originals/` and tax certificates in `certificates/` — the layout used before, so files
 * stored earlier are still found. Resolved per call, so a changed config (tests) takes effect.
 */
export const photoStore = (config: Pick<Config, "uploadsDir">) => new FileStore(config.uploadsDir);
/** Checked originals of product photos, kept for making other sizes later; never served (the uploads route reads the top level only). */
export const originalPhotoStore = (config: Pick<Config, "uploadsDir">) => new FileStore(path.join(config.uploadsDir, "originals"));
export const certificateStore = (config: Pick<Config, "uploadsDir">) => new FileStore(path.join(config.uploadsDir, "certificates"));
