import type { DataSource } from 'typeorm';
import { Membership, ROLES, User, Workspace, type Role } from '../db/entities';
import { AppError } from '../errors';

/** What a validated SAML response says about the person signing in. */
export interface SignInClaims {
  /** The NameID (e-mail address format). */
  email: string;
  displayName?: string;
  /** Must be one of Seamline's roles. */
  role: string;
  /** Workspace slug; absent means the configured default workspace. */
  workspaceSlug?: string;
}

/** Who is now signed in, and where. */
export interface SignedInMember {
  userId: string;
  workspaceId: string;
  role: Role;
}

/** The identity provider vouched for the person, but Seamline cannot let them in as described. */
export class SignInRefusedError extends AppError {
  constructor(message: string) {
    super(403, 'sign_in_refused', message);
  }
}

const EMAIL = /^[^\s@<>]+@[^\s@<>]+\.[^\s@<>]+$/;

/**
 * Turns validated claims into a user and a membership, in one transaction: the user is found or
 * created by e-mail (display name refreshed, last sign-in stamped) and their membership in the
 * named workspace takes the role the identity provider sent, which is the source of truth for roles.
 */
export async function signInMember(dataSource: DataSource, claims: SignInClaims, defaultWorkspaceSlug: string): Promise<SignedInMember> {
  const email = claims.email.trim().toLowerCase();
  if (email.length > 320 || !EMAIL.test(email)) {
    throw new SignInRefusedError('The identity provider did not identify you by an e-mail address.');
  }
  const role = ROLES.find((r) => r === claims.role);
  if (!role) {
    throw new SignInRefusedError(`The identity provider gave you the role “${claims.role.slice(0, 40)}”, which Seamline does not know (expected one of ${ROLES.join(', ')}).`);
  }
  const slug = claims.workspaceSlug?.trim() || defaultWorkspaceSlug;
  const displayName = (claims.displayName?.trim() || email.split('@')[0]!).slice(0, 200);

  return dataSource.transaction(async (em) => {
    const workspace = await em.findOneBy(Workspace, { slug });
    if (!workspace) {
      throw new SignInRefusedError(`The workspace “${slug.slice(0, 64)}” named by the identity provider does not exist in Seamline.`);
    }
    await em
      .createQueryBuilder()
      .insert()
      .into(User)
      .values({ email, displayName, lastSignInAt: new Date() })
      .orUpdate(['display_name', 'last_sign_in_at'], ['email'])
      .execute();
    const user = await em.findOneByOrFail(User, { email });
    await em
      .createQueryBuilder()
      .insert()
      .into(Membership)
      .values({ workspaceId: workspace.id, userId: user.id, role })
      .orUpdate(['role'], ['workspace_id', 'user_id'])
      .execute();
    return { userId: user.id, workspaceId: workspace.id, role };
  });
}
