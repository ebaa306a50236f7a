import { AppError } from '../errors';
import { quoteEntryName, refuseEntry, UploadRefusedError } from './upload-errors';

describe('UploadRefusedError', () => {
  it('should answer 413 for size limits, 400 for request faults and 422 for zip contents', () => {
    expect(new UploadRefusedError('upload_too_large', 'x').status).toBe(413);
    expect(new UploadRefusedError('not_multipart', 'x').status).toBe(400);
    expect(new UploadRefusedError('unsafe_entry', 'x').status).toBe(422);
  });

  it('should be an AppError so the shared error handler shapes it', () => {
    const err = new UploadRefusedError('empty_upload', 'The uploaded file is empty.');
    expect(err).toBeInstanceOf(AppError);
    expect(err.code).toBe('empty_upload');
    expect(err.name).toBe('UploadRefusedError');
  });

  it('should name the entry and the reason, with the entry and limit in details', () => {
    const err = refuseEntry('too_deep', 'a/b/c', 'it is 3 folders deep; the limit is 2.', 2);
    expect(err.message).toBe('Refused zip entry "a/b/c": it is 3 folders deep; the limit is 2.');
    expect(err.details).toEqual({ entry: 'a/b/c', limit: 2 });
  });

  it('should escape control characters and shorten very long names when showing them', () => {
    expect(quoteEntryName('a\nb')).toBe('"a\\nb"');
    const shown = quoteEntryName('x'.repeat(1000));
    expect(shown.length).toBeLessThan(200);
    expect(shown.endsWith('…"')).toBe(true);
  });
});
