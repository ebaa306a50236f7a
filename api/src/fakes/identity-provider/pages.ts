import type { Response } from 'express';
import type { DemoPerson } from '../../demo/demo-people';
import { escapeHtml, newNonce, sendPage } from './page-shell';

const FAKE_NOTICE =
  'This is a local identity-provider fake for trying Seamline. Otterbay Parcel Co. and the people ' +
  'below are invented; no password is asked and nothing leaves this computer.';

/** The chooser: one button per invented person; the choice answers the pending request `requestId`. */
export function sendSignInPage(res: Response, people: readonly DemoPerson[], requestId: string): void {
  const items = people
    .map(
      (p) => `<li><button class="person" type="submit" name="email" value="${escapeHtml(p.email)}">
  <span class="name">${escapeHtml(p.displayName)}</span>
  <span class="meta">${escapeHtml(p.title)}</span>
  <span class="role">${escapeHtml(p.role)}</span>
  <span class="meta">${escapeHtml(p.email)}</span>
</button></li>`,
    )
    .join('\n');
  sendPage(res, {
    title: 'Otterbay sign-in (identity-provider fake)',
    nonce: newNonce(),
    body: `<h1>Otterbay sign-in (identity-provider fake)</h1>
<p class="notice">${FAKE_NOTICE}</p>
<p>Choose who you want to be in Seamline:</p>
<form method="post" action="sso/login">
<input type="hidden" name="requestId" value="${escapeHtml(requestId)}">
<ul class="people">
${items}
</ul>
</form>`,
  });
}

/** Posts the signed response to the service provider; the script only saves a click. */
export function sendAutoPostPage(res: Response, post: { acsUrl: string; samlResponse: string; relayState?: string }): void {
  const nonce = newNonce();
  const relay = post.relayState ? `<input type="hidden" name="RelayState" value="${escapeHtml(post.relayState)}">` : '';
  sendPage(res, {
    title: 'Returning to Seamline (identity-provider fake)',
    nonce,
    formTarget: new URL(post.acsUrl).origin,
    body: `<h1>Returning to Seamline…</h1>
<form method="post" action="${escapeHtml(post.acsUrl)}" id="saml-post">
<input type="hidden" name="SAMLResponse" value="${escapeHtml(post.samlResponse)}">
${relay}
<p>If nothing happens, continue by hand:</p>
<button class="continue" type="submit">Continue</button>
</form>
<script nonce="${nonce}">document.getElementById('saml-post').submit();</script>`,
  });
}

/** A readable refusal (never a stack trace). */
export function sendErrorPage(res: Response, status: number, message: string, appUrl: string): void {
  sendPage(res, {
    status,
    title: 'Sign-in refused (identity-provider fake)',
    nonce: newNonce(),
    body: `<h1>Sign-in refused</h1>
<p class="error">${escapeHtml(message)}</p>
<p>Start again from <a href="${escapeHtml(appUrl)}">Seamline</a>.</p>
<p class="notice">${FAKE_NOTICE}</p>`,
  });
}

/** GET / — says what this server is and where the app is. */
export function sendHomePage(res: Response, appUrl: string): void {
  sendPage(res, {
    title: 'Identity-provider fake',
    nonce: newNonce(),
    body: `<h1>Identity-provider fake</h1>
<p class="notice">${FAKE_NOTICE}</p>
<p>Sign-in starts in the app: open <a href="${escapeHtml(appUrl)}">Seamline</a> and choose “Sign in”.
This server answers its SAML requests and publishes its <a href="metadata">metadata</a>.</p>`,
  });
}
