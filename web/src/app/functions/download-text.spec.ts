import { downloadText } from './download-text';

describe('downloadText', () => {
  const created: Blob[] = [];
  let clicked: { href: string; download: string } | null;
  const originalCreate = URL.createObjectURL;
  const originalRevoke = URL.revokeObjectURL;

  beforeEach(() => {
    created.length = 0;
    clicked = null;
    URL.createObjectURL = jest.fn((blob: Blob) => {
      created.push(blob);
      return 'blob:seamline/1';
    });
    URL.revokeObjectURL = jest.fn();
    jest.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      clicked = { href: this.href, download: this.download };
    });
  });

  afterEach(() => {
    URL.createObjectURL = originalCreate;
    URL.revokeObjectURL = originalRevoke;
    jest.restoreAllMocks();
  });

  it('should click a download link to a Blob of the text, then clean up', async () => {
    downloadText(document, 'functions-v1.csv', 'a,b\r\n');

    expect(clicked).toEqual({ href: 'blob:seamline/1', download: 'functions-v1.csv' });
    expect(document.querySelector('a[download]')).toBeNull();
    expect(created[0].type).toBe('text/csv;charset=utf-8');
    const bytes = new Uint8Array(await readBytes(created[0]));
    // UTF-8 byte-order mark, then the text.
    expect(Array.from(bytes.slice(0, 3))).toEqual([0xef, 0xbb, 0xbf]);
    expect(new TextDecoder().decode(bytes.slice(3))).toBe('a,b\r\n');
    await new Promise((resolve) => setTimeout(resolve, 0));
    expect(URL.revokeObjectURL).toHaveBeenCalledWith('blob:seamline/1');
  });
});

function readBytes(blob: Blob): Promise<ArrayBuffer> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(reader.result as ArrayBuffer);
    reader.onerror = () => reject(reader.error);
    reader.readAsArrayBuffer(blob);
  });
}
