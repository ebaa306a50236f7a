import type { NextFunction, Request, Response } from 'express';
import type { Role } from '../db/entities';
import { ForbiddenError, UnauthenticatedError } from '../errors';

/**
 * The one table of who may do what. Every route names its action and goes through `allow`;
 * the route-access test checks the answers against a matrix of its own.
 */
export const POLICY = {
  'workspace.read': ['owner', 'architect', 'reviewer', 'viewer'],
  'workspace.settings': ['owner'],
  'members.read': ['owner', 'architect', 'reviewer', 'viewer'],
  'members.manage': ['owner'],
  'tokens.manage': ['owner'],
  'audit.read': ['owner'],
  'codebase.read': ['owner', 'architect', 'reviewer', 'viewer'],
  'codebase.write': ['owner', 'architect'],
  'snapshot.status': ['owner', 'architect', 'reviewer', 'viewer'],
  'snapshot.read': ['owner', 'architect', 'reviewer', 'viewer'],
  'snapshot.upload': ['owner', 'architect'],
  'snapshot.push': ['owner', 'architect'],
  'snapshot.delete': ['owner', 'architect'],
  'coverage.upload': ['owner', 'architect'],
  'plan.read': ['owner', 'architect', 'reviewer', 'viewer'],
  'plan.write': ['owner', 'architect'],
  'outbox.read': ['owner'],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof POLICY;

/**
 * What a workspace API token may do: push snapshots and follow their status. Nothing else — a
 * leaked CI token must not read a codebase's analysis.
 */
export const TOKEN_ACTIONS: readonly Action[] = ['snapshot.push', 'snapshot.status'];

/** Lets the request through when its principal may perform `action`. */
export function allow(action: Action) {
  return (req: Request, _res: Response, next: NextFunction): void => {
    const viewer = req.viewer;
    if (!viewer) throw new UnauthenticatedError();
    if (viewer.tokenId) {
      if (!TOKEN_ACTIONS.includes(action)) throw new ForbiddenError(`An API token may only push snapshots and read their status; "${action}" needs a signed-in member.`);
    } else if (!(POLICY[action] as readonly Role[]).includes(viewer.role)) {
      throw new ForbiddenError(`This needs the role ${(POLICY[action] as readonly Role[]).join(' or ')}; you are ${viewer.role}.`);
    }
    next();
  };
}
