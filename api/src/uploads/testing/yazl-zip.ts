import { ZipFile } from 'yazl';

/** A zip of `files` (path → contents) and empty `folders`, written by an honest zip writer. */
export async function zipWithYazl(files: Record<string, string | Buffer>, folders: string[] = []): Promise<Buffer> {
  const zip = new ZipFile();
  for (const folder of folders) zip.addEmptyDirectory(folder);
  for (const [name, data] of Object.entries(files)) zip.addBuffer(Buffer.from(data), name);
  zip.end();
  const chunks: Buffer[] = [];
  for await (const chunk of zip.outputStream) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}
