import type { Membership, User, Workspace } from '../db/entities';

// What Seamline keeps in a browser session (stored in PostgreSQL by connect-pg-simple).
declare module 'express-session' {
  interface SessionData {
    userId?: string;
    workspaceId?: string;
    /** The token cookie-authenticated changes must echo in X-XSRF-TOKEN. */
    csrfToken?: string;
  }
}

/**
 * Who is calling, as every authenticated handler sees it: a signed-in member, or a workspace API
 * token (then `user` is the token's creator when known, `tokenId` is set, and the policy limits it).
 */
export interface Viewer {
  user: User | null;
  workspace: Workspace;
  role: Membership['role'];
  tokenId?: string;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Set by `requireSession`; absent on public routes. */
      viewer?: Viewer;
    }
  }
}
