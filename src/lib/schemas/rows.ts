// the rows the list endpoints answer with: one definition for the server services that
// build them and the islands that show them. Type-only (islands import it with
// `import type`, so nothing here, nor the database schema it names, reaches the browser).
// The services build rows with Dates; an island reads the same row from JSON, where each
// Date has become an ISO string: `Wire<JobRow>`.
import type { RevisionState, Role } from '../server/db/schema';
import type { Element } from '../server/services/defaultDocument';

export type { Element, RevisionState, Role };

/** one page of a list, as every list endpoint answers */
export interface Page<T> {
  items: T[];
  page: number;
  pageSize: number;
  total: number;
}

/** a row as JSON.stringify leaves it: each Date (or Date | null) becomes an ISO string */
export type Wire<T> = {
  [K in keyof T]: T[K] extends Date ? string : T[K] extends Date | null ? string | null : T[K];
};

export interface JobRow {
  id: number;
  name: string;
  reference: string;
  client: string;
  location: string;
  assemblyCount: number;
  createdByName: string | null;
  createdAt: Date;
  updatedAt: Date;
}

export interface AssemblyRow {
  id: number;
  name: string;
  element: Element;
  description: string;
  headNumber: number | null;
  headState: string | null;
  updatedAt: Date;
}

export interface MemberRow {
  userId: string;
  name: string;
  email: string;
  role: Role;
  joinedAt: Date;
}

export type InvitationStatus = 'open' | 'accepted' | 'revoked' | 'expired';

export interface InvitationRow {
  id: number;
  email: string;
  role: Role;
  invitedByName: string | null;
  createdAt: Date;
  expiresAt: Date;
  acceptedAt: Date | null;
  revokedAt: Date | null;
  status: InvitationStatus;
}

export interface ShareRow {
  id: number;
  label: string;
  revisionId: number;
  revisionNumber: number;
  assemblyId: number;
  assemblyName: string;
  jobName: string;
  createdByName: string | null;
  createdAt: Date;
  expiresAt: Date | null;
  revokedAt: Date | null;
  lastOpenedAt: Date | null;
  openCount: number;
  status: 'active' | 'expired' | 'revoked';
}

export interface AuditRow {
  id: number;
  action: string;
  actorName: string | null;
  target: string;
  detail: Record<string, unknown> | null;
  ip: string;
  success: boolean;
  createdAt: Date;
  /** the target in words: a member's name, a share link's label and assembly */
  targetText: string;
}

export interface RevisionRow {
  id: number;
  number: number;
  state: RevisionState;
  note: string;
  authorName: string | null;
  createdAt: Date;
  runCount: number;
  commentCount: number;
}
