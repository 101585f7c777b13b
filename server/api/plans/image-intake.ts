import { imageSize } from "image-size";
import { HttpError } from "../../lib/http-error";

export type PlanImageMime = "image/png" | "image/jpeg";

// Signatures from the formats themselves: PNG spec §5.2 (8-byte signature); JPEG (ITU-T T.81)
// starts with SOI FF D8 followed by the next marker's FF.
const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

/** The image type from the first bytes, never from the file name or the client's content type. */
export function sniffPlanImage(data: Uint8Array): PlanImageMime | null {
  if (data.length >= 8 && PNG_SIGNATURE.every((b, i) => data[i] === b)) return "image/png";
  if (data.length >= 3 && data[0] === 0xff && data[1] === 0xd8 && data[2] === 0xff) return "image/jpeg";
  return null;
}

export interface HeaderCheck {
  mime: PlanImageMime;
  width: number;
  height: number;
}

const unsupported = (message: string) => new HttpError(415, "unsupported_image", message);
const unreadable = (message: string) => new HttpError(422, "unreadable_image", message);

/**
 * Checks an upload before any decoding: the content must be PNG or JPEG, and the header's pixel
 * count must fit the budget. A small file can declare a huge image (a decompression bomb), so the
 * header is read first and decoding never starts for one.
 */
export function checkPlanImageHeader(data: Uint8Array, maxPixels: number): HeaderCheck {
  if (data.length === 0) throw unreadable("The uploaded file is empty.");
  const mime = sniffPlanImage(data);
  if (!mime)
    throw unsupported(
      "The file is not a PNG or JPEG image (its content was checked, not its name). Export the floor plan as PNG or JPEG and try again.",
    );
  let size: { width?: number; height?: number };
  try {
    size = imageSize(data);
  } catch {
    throw unreadable(
      `The ${mime === "image/png" ? "PNG" : "JPEG"} header could not be read: the file is damaged or incomplete.`,
    );
  }
  const { width, height } = size;
  if (!width || !height)
    throw unreadable("The image header gives no width and height: the file is damaged or incomplete.");
  const pixels = width * height;
  if (pixels > maxPixels) {
    throw new HttpError(
      413,
      "image_too_many_pixels",
      `The image is ${width} × ${height} px (${(pixels / 1e6).toFixed(1)} megapixels); plans may have at most ${(maxPixels / 1e6).toFixed(0)} megapixels. Export it at a lower resolution.`,
    );
  }
  return { mime, width, height };
}
