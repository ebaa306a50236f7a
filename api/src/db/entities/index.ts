import { Codebase } from './codebase.entity';
import { Membership } from './membership.entity';
import { Snapshot } from './snapshot.entity';
import { User } from './user.entity';
import { Workspace } from './workspace.entity';

export { Codebase, Membership, Snapshot, User, Workspace };
export type { Role } from './membership.entity';
export { ROLES } from './membership.entity';
export type { SnapshotStatus, SnapshotTotals } from './snapshot.entity';

/** Every entity the data source knows; the migration must match these. */
export const ENTITIES = [Workspace, User, Membership, Codebase, Snapshot];
