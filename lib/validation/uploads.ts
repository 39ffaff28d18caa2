// Asking for an upload sent straight to storage (POST /api/uploads with JSON): one schema for the lab
// page's upload client and the route. Only zod: the browser loads it.
import { z } from "zod";

/** The types a file may claim; the stored bytes are sniffed again when the upload completes. */
export const UPLOAD_TYPES = ["text/csv", "text/plain", "application/vnd.ms-excel", "image/png", "image/jpeg"] as const;

export const uploadRequestSchema = z.object({
  labId: z.uuid({ error: "Give the lab's id." }),
  name: z
    .string({ error: "Give the file's name." })
    .max(1000, "Use at most 1000 characters.")
    .refine((s) => s.trim() !== "", "Give the file's name."),
  size: z
    .number({ error: "Give the file's size in bytes." })
    .int("The size is a whole number of bytes.")
    .positive("The file is empty.")
    .max(Number.MAX_SAFE_INTEGER, "The size is not a number of bytes."),
  type: z.enum(UPLOAD_TYPES, { error: "Send a CSV trace (text/csv) or a PNG or JPEG image." }),
});
export type UploadRequest = z.infer<typeof uploadRequestSchema>;

/** `image` for an image's type, `trace` for the CSV ones. */
export const claimedKind = (type: UploadRequest["type"]): "image" | "trace" => (type.startsWith("image/") ? "image" : "trace");

/** Parts are 8 MiB (S3 wants at least 5 MiB but the last, and at most 10,000 parts); the upload client cuts the file the same way. */
export const PART_BYTES = 8 * 1024 * 1024;

export function partBytes(size: number): number {
  return Math.max(PART_BYTES, Math.ceil(size / 10_000));
}
