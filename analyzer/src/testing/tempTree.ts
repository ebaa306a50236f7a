import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';

/** Writes `files` (posix path → text) into a new temporary folder and returns the folder. Test use only. */
export function tempTree(files: Record<string, string>, prefix = 'seamline-tree-'): string {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), prefix));
  for (const [file, text] of Object.entries(files)) {
    fs.mkdirSync(path.dirname(path.join(root, file)), { recursive: true });
    fs.writeFileSync(path.join(root, file), text);
  }
  return root;
}
