import { randomBytes } from 'node:crypto';
import type { Response } from 'express';

/** Escapes text for HTML element content and double-quoted attributes. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/** A fresh CSP nonce for one page. */
export function newNonce(): string {
  return randomBytes(16).toString('base64');
}

/**
 * Sends a self-contained page: inline CSS and (optionally) one inline script, both allowed only by
 * this response's nonce; nothing is loaded from elsewhere, forms may post only here and to `formTarget`.
 */
export function sendPage(res: Response, page: { status?: number; title: string; body: string; nonce: string; formTarget?: string }): void {
  const formAction = ["'self'", page.formTarget].filter(Boolean).join(' ');
  res
    .status(page.status ?? 200)
    .set({
      'Content-Type': 'text/html; charset=utf-8',
      'Cache-Control': 'no-store',
      'Content-Security-Policy': `default-src 'none'; style-src 'nonce-${page.nonce}'; script-src 'nonce-${page.nonce}'; form-action ${formAction}; base-uri 'none'; frame-ancestors 'none'`,
      'Referrer-Policy': 'no-referrer',
      'X-Content-Type-Options': 'nosniff',
    })
    .send(`<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(page.title)}</title>
<style nonce="${page.nonce}">${CSS}</style>
</head>
<body>
<main>
${page.body}
</main>
</body>
</html>`);
}

const CSS = `
:root { color-scheme: light; font-family: system-ui, -apple-system, "Segoe UI", sans-serif; color: #1c2430; background: #eef2f5; }
body { margin: 0; padding: 2rem 1rem; }
main { max-width: 40rem; margin: 0 auto; background: #fff; border-radius: 12px; padding: 1.75rem 2rem; box-shadow: 0 1px 3px rgba(0,0,0,.12); }
h1 { font-size: 1.35rem; margin: 0 0 .5rem; }
p { line-height: 1.5; }
.notice { background: #fff6e0; border-left: 4px solid #d79a00; padding: .6rem .9rem; border-radius: 4px; font-size: .95rem; }
.error { background: #fdecec; border-left: 4px solid #c62828; padding: .6rem .9rem; border-radius: 4px; }
ul.people { list-style: none; padding: 0; margin: 1.25rem 0 0; display: grid; gap: .75rem; }
button.person { width: 100%; text-align: left; border: 1px solid #c9d3dc; background: #f8fafc; border-radius: 8px; padding: .8rem 1rem; cursor: pointer; font: inherit; color: inherit; display: grid; gap: .15rem; }
button.person:hover, button.person:focus-visible { border-color: #2f6f9f; background: #eaf3fa; outline: 2px solid #2f6f9f; outline-offset: 1px; }
.name { font-weight: 600; }
.meta { font-size: .9rem; color: #4a5766; }
.role { display: inline-block; font-size: .8rem; font-weight: 600; text-transform: uppercase; letter-spacing: .04em; color: #2f6f9f; }
button.continue { font: inherit; padding: .6rem 1.2rem; border-radius: 6px; border: 0; background: #2f6f9f; color: #fff; cursor: pointer; }
a { color: #2f6f9f; }
`;
