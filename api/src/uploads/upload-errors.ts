import { AppError } from '../errors';

/** Why an upload was turned away; the client may branch on these. */
export type UploadRefusalCode =
  // The request itself.
  | 'upload_too_large'
  | 'not_multipart'
  | 'bad_multipart'
  | 'no_file'
  | 'unexpected_file'
  | 'too_many_files'
  | 'bad_field'
  | 'empty_upload'
  | 'upload_aborted'
  // The zip inside it.
  | 'not_a_zip'
  | 'damaged_zip'
  | 'empty_zip'
  | 'too_many_entries'
  | 'unsafe_entry'
  | 'unsupported_entry'
  | 'too_deep'
  | 'zip_bomb';

const STATUS: Record<UploadRefusalCode, number> = {
  upload_too_large: 413,
  not_multipart: 400,
  bad_multipart: 400,
  no_file: 400,
  unexpected_file: 400,
  too_many_files: 400,
  bad_field: 400,
  empty_upload: 400,
  upload_aborted: 400,
  not_a_zip: 422,
  damaged_zip: 422,
  empty_zip: 422,
  too_many_entries: 422,
  unsafe_entry: 422,
  unsupported_entry: 422,
  too_deep: 422,
  zip_bomb: 422,
};

/** Sent to the client as `details`: which entry, if any, and the limit that was crossed. */
export interface UploadRefusalDetails {
  entry?: string;
  limit?: number;
}

/** An upload Seamline will not keep. Size limits answer 413, request faults 400, zip contents 422. */
export class UploadRefusedError extends AppError {
  declare readonly code: UploadRefusalCode;

  constructor(code: UploadRefusalCode, message: string, details?: UploadRefusalDetails) {
    super(STATUS[code], code, message, details);
  }
}

const MAX_SHOWN_NAME = 160;

/** An entry name as it can be shown: quoted, control characters escaped, long names shortened. */
export function quoteEntryName(name: string): string {
  const short = name.length > MAX_SHOWN_NAME ? `${name.slice(0, MAX_SHOWN_NAME)}…` : name;
  return JSON.stringify(short);
}

/** A refusal that names the entry and says why, e.g. `Refused zip entry "../x": its path …`. */
export function refuseEntry(code: UploadRefusalCode, name: string, reason: string, limit?: number): UploadRefusedError {
  return new UploadRefusedError(code, `Refused zip entry ${quoteEntryName(name)}: ${reason}`, {
    entry: name,
    ...(limit !== undefined ? { limit } : {}),
  });
}
