import { resolveEntryPath } from './entry-path';
import { UploadRefusedError } from './upload-errors';

function refusal(name: string, maxDepth = 32): UploadRefusedError {
  try {
    resolveEntryPath(name, maxDepth);
  } catch (err) {
    if (err instanceof UploadRefusedError) return err;
    throw err;
  }
  throw new Error(`expected ${JSON.stringify(name)} to be refused`);
}

describe('resolveEntryPath', () => {
  it('should keep ordinary relative paths as they are', () => {
    expect(resolveEntryPath('src/app/main.ts', 32)).toEqual({
      segments: ['src', 'app', 'main.ts'],
      path: 'src/app/main.ts',
      endsWithSeparator: false,
    });
    expect(resolveEntryPath('src/app/', 32)).toEqual({ segments: ['src', 'app'], path: 'src/app', endsWithSeparator: true });
  });

  it('should drop empty and "." segments and resolve ".." that stays inside the root', () => {
    expect(resolveEntryPath('./src//a/./b.ts', 32).path).toBe('src/a/b.ts');
    expect(resolveEntryPath('src/lib/../main.ts', 32).path).toBe('src/main.ts');
  });

  it('should treat backslashes as separators', () => {
    expect(resolveEntryPath('src\\app\\main.ts', 32).path).toBe('src/app/main.ts');
    expect(resolveEntryPath('src\\app\\', 32).endsWithSeparator).toBe(true);
  });

  it('should give the root itself no segments so the caller can decide', () => {
    expect(resolveEntryPath('./', 32).segments).toEqual([]);
    expect(resolveEntryPath('a/..', 32).segments).toEqual([]);
  });

  it.each([
    ['../evil.ts', /".." segments lead outside/],
    ['src/../../evil.ts', /".." segments lead outside/],
    ['..\\..\\evil.ts', /".." segments lead outside/],
    ['src\\..\\..\\evil.ts', /".." segments lead outside/],
    ['/etc/passwd', /absolute path/],
    ['\\etc\\passwd', /absolute path/],
    ['C:\\Windows\\evil.dll', /drive letter/],
    ['c:evil.ts', /drive letter/],
    ['\\\\server\\share\\evil.ts', /network \(UNC\) path/],
    ['//server/share/evil.ts', /network \(UNC\) path/],
    ['', /empty name/],
  ])('should refuse %j as unsafe, naming it and why', (name, reason) => {
    const err = refusal(name);
    expect(err.code).toBe('unsafe_entry');
    expect(err.status).toBe(422);
    expect(err.message).toContain(`Refused zip entry ${JSON.stringify(name)}`);
    expect(err.message).toMatch(reason);
    expect(err.details).toEqual({ entry: name });
  });

  it('should refuse control characters in a name', () => {
    const err = refusal('src/a\u0000b.ts');
    expect(err.code).toBe('unsupported_entry');
    expect(err.message).toMatch(/"src\/a\\u0000b.ts".*control characters/);
  });

  it('should refuse a path segment longer than file systems allow', () => {
    const err = refusal(`src/${'x'.repeat(256)}.ts`);
    expect(err.code).toBe('unsupported_entry');
    expect(err.message).toMatch(/longer than 255 bytes/);
  });

  it('should refuse paths deeper than the limit and accept the limit itself', () => {
    expect(resolveEntryPath('a/b/c.ts', 3).segments).toHaveLength(3);
    const err = refusal('a/b/c/d.ts', 3);
    expect(err.code).toBe('too_deep');
    expect(err.message).toBe('Refused zip entry "a/b/c/d.ts": it is 4 levels deep; the limit is 3.');
    expect(err.details).toEqual({ entry: 'a/b/c/d.ts', limit: 3 });
  });
});
