import { UploadRefusedError } from '../upload-errors';

/** The UploadRefusedError `work` rejects with; fails the test if it resolves or rejects otherwise. */
export async function refusalOf(work: Promise<unknown>): Promise<UploadRefusedError> {
  let outcome: unknown;
  try {
    outcome = await work;
  } catch (err) {
    if (err instanceof UploadRefusedError) return err;
    throw err;
  }
  throw new Error(`expected an UploadRefusedError, got a result: ${JSON.stringify(outcome)}`);
}
