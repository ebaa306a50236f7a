/**
 * Lets the browser save `text` as a file, built in the page (Blob + object URL; nothing is
 * fetched). A byte-order mark leads the text so spreadsheet programs read it as UTF-8.
 */
export function downloadText(document: Document, fileName: string, text: string, type = 'text/csv;charset=utf-8'): void {
  const url = URL.createObjectURL(new Blob(['\uFEFF', text], { type }));
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.style.display = 'none';
  document.body.appendChild(link);
  try {
    link.click();
  } finally {
    link.remove();
    // The click has started the download; the URL is no longer needed once this task ends.
    setTimeout(() => URL.revokeObjectURL(url), 0);
  }
}
