import { z } from 'zod';

/** Free text a person reads back: no control characters. */
const printable = (max: number) => z.string().min(1).max(max).regex(/^[^\u0000-\u001f]+$/, 'must not hold control characters');

/** A codebase's name, as the upload screen and `seamline push --codebase` give it. */
export const codebaseNameField = z.string().trim().pipe(printable(200));

/** Commit and branch as CI tools print them. */
export const commitField = z.string().regex(/^[0-9A-Za-z._-]{1,64}$/, 'must be 1–64 letters, digits, dots, dashes or underscores');
export const branchField = printable(255);
