import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import type { AddressInfo } from 'node:net';
import { Mailer } from '../../mail/mailer';
import { createMailFake } from './mail-fake';
import { MailStore } from './mail-store';

describe('mail fake', () => {
  let dir: string;
  let server: ReturnType<typeof createMailFake>;
  let port: number;

  beforeAll(async () => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'seamline-mail-'));
    server = createMailFake(new MailStore(dir));
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
    port = (server.server.address() as AddressInfo).port;
  });

  afterAll(async () => {
    await new Promise<void>((resolve) => server.close(() => resolve()));
    fs.rmSync(dir, { recursive: true, force: true });
  });

  it('should store a message sent by the API mailer and read it back', async () => {
    const mailer = new Mailer({ host: '127.0.0.1', port, from: 'Seamline <seamline@otterbay.example>', storeDir: dir });
    await mailer.send({ to: 'priya.raman@otterbay.example', subject: 'Brief ready for review', text: 'The carve plan brief is ready.' });
    mailer.close();

    const [mail, ...rest] = await new MailStore(dir).list();
    expect(rest).toHaveLength(0);
    expect(mail.subject).toBe('Brief ready for review');
    expect(mail.envelopeTo).toEqual(['priya.raman@otterbay.example']);
    expect(mail.from).toContain('seamline@otterbay.example');
    expect(mail.text.trim()).toBe('The carve plan brief is ready.');
  });

  it('should list nothing when no message arrived yet', async () => {
    expect(await new MailStore(path.join(dir, 'never-written')).list()).toEqual([]);
  });
});
