/** How much an uploaded codebase zip may weigh, on the wire and unpacked. */
export interface UploadLimits {
  /** Bytes of the uploaded file itself. */
  maxUploadBytes: number;
  /** Entries (files and folders) in the zip's central directory. */
  maxEntries: number;
  /** Sum of every entry's unpacked size. */
  maxTotalUncompressedBytes: number;
  /** Unpacked size of any one entry. */
  maxEntryBytes: number;
  /** Unpacked bytes per packed byte; far above what source code reaches, far below a zip bomb. */
  maxCompressionRatio: number;
  /** Path segments in an entry's name, `a/b/c.ts` being 3. */
  maxPathDepth: number;
}

const MB = 1024 * 1024;

export const DEFAULT_UPLOAD_LIMITS: Readonly<UploadLimits> = Object.freeze({
  maxUploadBytes: 200 * MB,
  maxEntries: 50_000,
  maxTotalUncompressedBytes: 1024 * MB,
  maxEntryBytes: 100 * MB,
  maxCompressionRatio: 100,
  maxPathDepth: 32,
});
