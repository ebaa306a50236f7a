import { promises as fsp } from 'node:fs';
import { CliInputError } from './CliInputError';

function why(error: unknown): string {
  const code = (error as NodeJS.ErrnoException).code;
  if (code === 'ENOENT') return 'no such file';
  if (code === 'EISDIR') return 'it is a folder, not a file';
  if (code === 'EACCES' || code === 'EPERM') return 'permission denied';
  return (error as Error).message;
}

/** The UTF-8 text of an input file; throws CliInputError saying what the file is for and why it cannot be read. */
export async function readInputFile(file: string, label: string, shownAs = file): Promise<string> {
  try {
    return await fsp.readFile(file, 'utf8');
  } catch (error) {
    throw new CliInputError(`cannot read ${label} ${shownAs}: ${why(error)}`);
  }
}
