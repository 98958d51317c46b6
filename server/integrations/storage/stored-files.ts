/** Files users upload (certificates, attachments): type by content, random names outside the web root. */
import { fileTypeFromBuffer } from "file-type";
import { mkdir, readFile, unlink, writeFile } from "node:fs/promises";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { sha256 } from "../../lib/crypto.ts";
import { unsupportedMedia } from "../../errors.ts";
import { serviceSettings } from "../../settings.ts";

export const ACCEPTED_TYPES: Record<string, string> = { "application/pdf": "pdf", "image/png": "png", "image/jpeg": "jpg" };

export interface SavedFile {
  storedName: string;
  mime: string;
  sha256: string;
  sizeBytes: number;
  originalName: string;
}

export async function saveCheckedFile(file: { buffer: Buffer; originalname: string }): Promise<SavedFile> {
  const detected = await fileTypeFromBuffer(file.buffer);
  if (!detected || !ACCEPTED_TYPES[detected.mime]) {
    throw unsupportedMedia(`The file's content is ${detected ? detected.mime : "not a known type"}; upload a PDF, PNG or JPEG.`);
  }
  const dir = serviceSettings().certificateDir;
  await mkdir(dir, { recursive: true });
  const storedName = `${randomUUID()}.${ACCEPTED_TYPES[detected.mime]}`;
  await writeFile(path.join(dir, storedName), file.buffer, { flag: "wx" });
  return {
    storedName,
    mime: detected.mime,
    sha256: sha256(file.buffer),
    sizeBytes: file.buffer.length,
    originalName: path.basename(file.originalname).slice(0, 200),
  };
}

/** Removes a saved file when the database refused its row, so no orphan stays behind. */
export const discardFile = (storedName: string) => unlink(path.join(serviceSettings().certificateDir, storedName)).catch(() => undefined);

export const readStoredFile = (storedName: string) => readFile(path.join(serviceSettings().certificateDir, storedName));
