import "server-only";
import { createHash } from "node:crypto";
import { fileTypeFromBuffer } from "file-type";
import sharp, { type Metadata } from "sharp";

export const MAX_PHOTO_BYTES = 12 * 1024 * 1024;
export const ACCEPTED_TYPES = ["image/jpeg", "image/png", "image/webp"] as const;

export class PhotoRejected extends Error {}

/**
 * Checks an uploaded photo by its bytes (not its name or declared type), then re-encodes it as a
 * JPEG with the camera's orientation applied and every piece of metadata removed — location
 * above all, since students are minors — and makes a thumbnail.
 */
export async function processPhoto(bytes: Buffer): Promise<{ image: Buffer; thumb: Buffer; width: number; height: number; sha256: string; detected: string }> {
  if (bytes.length === 0) throw new PhotoRejected("The file is empty.");
  if (bytes.length > MAX_PHOTO_BYTES) throw new PhotoRejected(`The photo is too large: ${(bytes.length / 1048576).toFixed(1)} MB. The limit is ${MAX_PHOTO_BYTES / 1048576} MB.`);
  const type = await fileTypeFromBuffer(bytes);
  if (!type) throw new PhotoRejected("This file is not a photo Meniscus can read. Use a JPEG, PNG or WebP image.");
  if (type.mime === "image/heic" || type.mime === "image/heif") throw new PhotoRejected("HEIC photos cannot be read yet. On an iPhone choose Settings › Camera › Formats › Most Compatible, or share the photo as JPEG.");
  if (!(ACCEPTED_TYPES as readonly string[]).includes(type.mime)) throw new PhotoRejected(`This file is a ${type.ext.toUpperCase()} file, not a photo. Use a JPEG, PNG or WebP image.`);
  let meta: Metadata;
  try {
    meta = await sharp(bytes, { failOn: "error" }).metadata();
  } catch {
    throw new PhotoRejected("The photo is damaged or incomplete. Try taking or uploading it again.");
  }
  if (!meta.width || !meta.height || meta.width * meta.height > 80_000_000) throw new PhotoRejected("The photo's size in pixels is not one Meniscus can handle.");
  try {
    // rotate() with no angle applies the EXIF orientation; sharp writes no metadata unless asked,
    // so GPS, camera and date tags are all dropped.
    const image = await sharp(bytes, { failOn: "error" }).rotate().resize({ width: 2000, height: 2000, fit: "inside", withoutEnlargement: true }).flatten({ background: "#ffffff" }).jpeg({ quality: 85, mozjpeg: false }).toBuffer({ resolveWithObject: true });
    const thumb = await sharp(image.data).resize({ width: 360, height: 360, fit: "inside" }).jpeg({ quality: 78 }).toBuffer();
    return { image: image.data, thumb, width: image.info.width, height: image.info.height, sha256: createHash("sha256").update(image.data).digest("hex"), detected: type.mime };
  } catch {
    throw new PhotoRejected("The photo is damaged or incomplete. Try taking or uploading it again.");
  }
}
