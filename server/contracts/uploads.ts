/** The upload limits the server enforces (server/http/uploads.ts) and the client states and checks
 * before sending: one place for each figure and for the words that tell a person about it. Sizes are
 * binary megabytes (60 MB = 60 × 1024 × 1024 bytes), as client/lib/upload.ts formats them. */
export const CSV_MAX_BYTES = 60 * 1024 * 1024;
export const PHOTO_MAX_BYTES = 15 * 1024 * 1024;
export const PHOTOS_PER_UPLOAD = 20;

const megabytes = (bytes: number) => `${bytes / (1024 * 1024)} MB`;
export const CSV_MAX_SIZE = megabytes(CSV_MAX_BYTES);
export const PHOTO_MAX_SIZE = megabytes(PHOTO_MAX_BYTES);

/** What a CSV over the limit is told; `name` is the file's name where it is known. */
export function csvTooLargeMessage(name = 'The CSV file'): string {
  return `${name} is larger than ${CSV_MAX_SIZE}. Split the export into smaller files and import them one by one.`;
}

/** What a photo over the limit is told; `name` is the file's name where it is known. */
export function photoTooLargeMessage(name = 'A photo'): string {
  return `${name} is larger than ${PHOTO_MAX_SIZE}. Export it at a smaller size and add it again.`;
}
