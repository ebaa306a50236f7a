import type { Membership, User, Workspace } from '../db/entities';

// What Seamline keeps in a browser session (stored in PostgreSQL by connect-pg-simple).
declare module 'express-session' {
  interface SessionData {
    userId?: string;
    workspaceId?: string;
  }
}

/** The signed-in person as every authenticated handler sees it. */
export interface Viewer {
  user: User;
  workspace: Workspace;
  role: Membership['role'];
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
