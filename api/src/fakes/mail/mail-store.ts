import { randomUUID } from 'node:crypto';
import * as fs from 'node:fs/promises';
import * as path from 'node:path';

/** A message as the mail fake stored it. */
export interface StoredMail {
  id: string;
  receivedAt: string;
  envelopeFrom: string | null;
  envelopeTo: string[];
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string | null;
}

/** One JSON file per message in a folder; written to a temp name then renamed, so readers never see half a message. */
export class MailStore {
  constructor(private readonly dir: string) {}

  async save(mail: Omit<StoredMail, 'id' | 'receivedAt'>): Promise<StoredMail> {
    await fs.mkdir(this.dir, { recursive: true });
    const receivedAt = new Date().toISOString();
    const stored: StoredMail = { id: `${receivedAt.replace(/[:.]/g, '-')}-${randomUUID().slice(0, 8)}`, receivedAt, ...mail };
    const file = path.join(this.dir, `${stored.id}.json`);
    await fs.writeFile(`${file}.tmp`, JSON.stringify(stored, null, 2));
    await fs.rename(`${file}.tmp`, file);
    return stored;
  }

  /** Newest first. */
  async list(limit = 100): Promise<StoredMail[]> {
    let names: string[];
    try {
      names = (await fs.readdir(this.dir)).filter((n) => n.endsWith('.json'));
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return [];
      throw err;
    }
    names.sort().reverse();
    const picked = names.slice(0, limit);
    return Promise.all(picked.map(async (n) => JSON.parse(await fs.readFile(path.join(this.dir, n), 'utf8')) as StoredMail));
  }
}
