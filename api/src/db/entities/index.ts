import { ApiToken } from './api-token.entity';
import { AuditEvent } from './audit-event.entity';
import { Brief } from './brief.entity';
import { CallEdgeRow } from './call-edge.entity';
import { CarveAssignment } from './carve-assignment.entity';
import { CarvePlanRow } from './carve-plan.entity';
import { ClusterRow } from './cluster.entity';
import { Codebase } from './codebase.entity';
import { Comment } from './comment.entity';
import { CoverageImport } from './coverage-import.entity';
import { Decision } from './decision.entity';
import { FunctionDetail } from './function-detail.entity';
import { FunctionMetric } from './function-metric.entity';
import { ImportEdgeRow } from './import-edge.entity';
import { Membership } from './membership.entity';
import { ModuleEdgeRow } from './module-edge.entity';
import { ModuleMetric } from './module-metric.entity';
import { Notification } from './notification.entity';
import { Snapshot } from './snapshot.entity';
import { User } from './user.entity';
import { Workspace } from './workspace.entity';

export {
  ApiToken, AuditEvent, Brief, CallEdgeRow, CarveAssignment, CarvePlanRow, ClusterRow, Codebase, Comment, CoverageImport,
  Decision, FunctionDetail, FunctionMetric, ImportEdgeRow, Membership, ModuleEdgeRow, ModuleMetric, Notification, Snapshot,
  User, Workspace,
};
export type { Role } from './membership.entity';
export { ROLES } from './membership.entity';
export type { SnapshotSource, SnapshotStatus, SnapshotTotals } from './snapshot.entity';
export type { BriefSection } from './brief.entity';

/** Every entity the data source knows; the migrations must match these. */
export const ENTITIES = [
  Workspace, User, Membership, Codebase, Snapshot, ApiToken, FunctionMetric, FunctionDetail, ModuleMetric, ModuleEdgeRow,
  CallEdgeRow, ImportEdgeRow, ClusterRow, CoverageImport, CarvePlanRow, CarveAssignment, Brief, Decision, Comment,
  Notification, AuditEvent,
];
