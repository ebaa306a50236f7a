import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { codeCacheDir } from './codeCacheDir';

let scratch: string;
beforeEach(() => {
  scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'seamline-code-cache-dir-'));
});
afterEach(() => fs.rmSync(scratch, { recursive: true, force: true }));

describe('codeCacheDir', () => {
  it.each(['off', 'OFF', '0', '', 'false'])('should be off for SEAMLINE_CODE_CACHE=%j', (value) => {
    expect(codeCacheDir({ SEAMLINE_CODE_CACHE: value, XDG_CACHE_HOME: scratch })).toBeUndefined();
    expect(fs.readdirSync(scratch)).toEqual([]);
  });

  it('should create the named folder, private to the user', () => {
    const dir = path.join(scratch, 'a', 'b');
    expect(codeCacheDir({ SEAMLINE_CODE_CACHE: dir })).toBe(dir);
    expect(fs.statSync(dir).mode & 0o777).toBe(0o700);
  });

  it("should default to seamline/code-cache in the user's cache folder", () => {
    expect(codeCacheDir({ XDG_CACHE_HOME: scratch })).toBe(path.join(scratch, 'seamline', 'code-cache'));
  });

  it('should not use a folder others can write to', () => {
    const dir = path.join(scratch, 'shared');
    fs.mkdirSync(dir);
    fs.chmodSync(dir, 0o777);
    expect(codeCacheDir({ SEAMLINE_CODE_CACHE: dir })).toBeUndefined();
  });

  it('should not follow a symbolic link', () => {
    const real = path.join(scratch, 'real');
    fs.mkdirSync(real, { mode: 0o700 });
    fs.symlinkSync(real, path.join(scratch, 'link'));
    expect(codeCacheDir({ SEAMLINE_CODE_CACHE: path.join(scratch, 'link') })).toBeUndefined();
  });

  it('should be off when the folder cannot be made', () => {
    const file = path.join(scratch, 'file');
    fs.writeFileSync(file, '');
    expect(codeCacheDir({ SEAMLINE_CODE_CACHE: path.join(file, 'cache') })).toBeUndefined();
  });
});
