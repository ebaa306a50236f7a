// express-session's own signer ships without types; tests sign session ids the same way.
declare module 'cookie-signature' {
  export function sign(value: string, secret: string): string;
  export function unsign(signed: string, secret: string): string | false;
}
