/**
 * Signs in through the identity-provider fake over plain HTTP, the way a browser would (login
 * redirect → pick a person → the signed response posted to the API), and returns the session
 * cookie and the anti-forgery token the API hands out.
 */
export interface ApiSession {
  cookie: string;
  csrf: string;
  headers: Record<string, string>;
}

export async function signInOverHttp(apiUrl: string, email: string): Promise<ApiSession> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const eq = pair.indexOf('=');
      jar.set(pair.slice(0, eq), pair.slice(eq + 1));
    }
  };
  const cookieHeader = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');

  const login = await fetch(`${apiUrl}/api/auth/login`, { redirect: 'manual' });
  keep(login);
  const ssoUrl = login.headers.get('location');
  if (!ssoUrl) throw new Error(`login did not redirect (HTTP ${login.status})`);
  const picker = await (await fetch(ssoUrl)).text();
  const requestId = /name="requestId" value="([^"]+)"/.exec(picker)?.[1];
  if (!requestId) throw new Error('the identity provider page had no request id');
  const idpLogin = new URL('sso/login', ssoUrl.split('?')[0].replace(/sso$/, ''));
  const posted = await (await fetch(idpLogin, { method: 'POST', body: new URLSearchParams({ requestId, email }) })).text();
  const samlResponse = /name="SAMLResponse" value="([^"]+)"/.exec(posted)?.[1];
  if (!samlResponse) throw new Error(`the identity provider did not answer with a SAML response for ${email}`);
  const relay = /name="RelayState" value="([^"]+)"/.exec(posted)?.[1];
  const form = new URLSearchParams({ SAMLResponse: unescapeHtml(samlResponse), ...(relay ? { RelayState: unescapeHtml(relay) } : {}) });
  const acs = await fetch(`${apiUrl}/api/auth/saml/acs`, { method: 'POST', body: form, redirect: 'manual', headers: { Cookie: cookieHeader() } });
  keep(acs);
  if (acs.status >= 400) throw new Error(`the API refused the SAML response (HTTP ${acs.status}): ${await acs.text()}`);
  const me = await fetch(`${apiUrl}/api/me`, { headers: { Cookie: cookieHeader() } });
  keep(me);
  if (me.status !== 200) throw new Error(`signed in, but /api/me answered ${me.status}`);
  // The session holds its anti-forgery token from sign-in on (startSession); this answer hands it
  // out as the XSRF-TOKEN cookie. Read to the end so no request of this session overlaps another.
  await me.text();
  const csrf = jar.get('XSRF-TOKEN');
  if (!csrf) throw new Error('the API set no XSRF-TOKEN cookie');
  const cookie = cookieHeader();
  return { cookie, csrf, headers: { Cookie: cookie, 'X-XSRF-TOKEN': csrf } };
}

function unescapeHtml(text: string): string {
  return text.replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&');
}
