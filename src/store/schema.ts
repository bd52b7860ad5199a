import type { Generated, Insertable, Selectable, Updateable } from 'kysely';

/**
 * Table types for the query layer. Times are ISO-8601 strings (UTC) so that they sort and
 * compare the same way on SQLite and PostgreSQL; JSON documents are stored as text; booleans
 * are 0/1 integers. Ids are integers the database assigns.
 */
export interface Database {
  batches: BatchTable;
  items: ItemTable;
  responses: ResponseTable;
  rubric_versions: RubricVersionTable;
  scores: ScoreTable;
  reviews: ReviewTable;
  adjudications: AdjudicationTable;
  work_claims: WorkClaimTable;
  users: UserTable;
  sessions: SessionTable;
  api_tokens: ApiTokenTable;
  audit_events: AuditEventTable;
  settings: SettingTable;
  login_failures: LoginFailureTable;
}

export interface BatchTable {
  id: Generated<number>;
  name: string;
  /** sha-256 of the imported file's bytes: the same file imported twice is found by it. */
  source_hash: string;
  source_name: string;
  reviews_required: number;
  blind_first: number;
  /** JSON: the consensus rule, e.g. {"kind":"pairwise","threshold":0.75}. */
  consensus_rule: string;
  rubric_id: string | null;
  created_by: number | null;
  created_at: string;
  /** Characters a reviewer's or adjudicator's rationale needs at least. */
  rationale_min: Generated<number>;
  /** While an import stores the batch: who is doing it ("host:pid") and when it last made progress; null once done. */
  import_owner: string | null;
  import_heartbeat_at: string | null;
}

/** `staged`: stored by an import still under way; no list or queue shows it until the import ends. */
export type ItemState = 'staged' | 'open' | 'in_review' | 'adjudication' | 'final' | 'escalated';

export interface ItemTable {
  id: Generated<number>;
  batch_id: number;
  prompt_id: string;
  prompt: string;
  flag_reason: string | null;
  flag_severity: string | null;
  /** JSON object of caller-supplied metadata, kept as given. */
  meta: string | null;
  state: ItemState;
  /** Higher is read first; computed by the triage policy. */
  priority: number;
  created_at: string;
  /** The bands of its responses' scores, comma-delimited (",fail,pass,"); null before scoring. */
  score_bands: string | null;
  /** The checks with findings in its responses, comma-delimited (",refusal,repetition,"). */
  finding_checks: string | null;
}

export interface ResponseTable {
  id: Generated<number>;
  item_id: number;
  response_id: string;
  text: string;
  /** Order in the imported file (0-based); display order is shuffled per review. */
  position: number;
}

export interface RubricVersionTable {
  id: Generated<number>;
  rubric_id: string;
  /** Content hash of the canonical rubric. */
  version: string;
  content: string;
  author_id: number | null;
  note: string | null;
  created_at: string;
}

export interface ScoreTable {
  id: Generated<number>;
  response_id: number;
  rubric_id: string;
  rubric_version: string;
  overall: number;
  band: string;
  suggested_rank: number;
  /** JSON: {criterionId: {value, band, metrics}}. */
  criteria: string;
  /** JSON: [{criterion, check, start, end, severity, message, evidence}]. */
  findings: string;
  created_at: string;
}

export type ReviewStatus = 'submitted' | 'skipped' | 'escalated';

export interface ReviewTable {
  id: Generated<number>;
  item_id: number;
  reviewer_id: number;
  status: ReviewStatus;
  /** JSON array of response ids in the order shown to this reviewer. */
  display_order: string;
  /** JSON {responseId: rank} committed before anything was revealed (null when not blind). */
  first_ranking: string | null;
  /** JSON {responseId: rank}: the ranking that counts. */
  final_ranking: string | null;
  rationale: string | null;
  /** Why the item was skipped or escalated. */
  reason: string | null;
  rubric_version: string | null;
  started_at: string;
  revealed_at: string | null;
  submitted_at: string;
  time_spent_ms: number;
}

export interface AdjudicationTable {
  id: Generated<number>;
  item_id: number;
  adjudicator_id: number | null;
  /** consensus (reviews agreed) or adjudication (a person decided). */
  method: 'consensus' | 'adjudication';
  ranking: string;
  rationale: string | null;
  rubric_version: string | null;
  created_at: string;
}

export interface WorkClaimTable {
  id: Generated<number>;
  item_id: number;
  user_id: number;
  claimed_at: string;
  expires_at: string;
}

export interface UserTable {
  id: Generated<number>;
  username: string;
  display_name: string;
  /** scrypt$N$r$p$salt$hash */
  password_hash: string;
  /** Comma-separated roles: reviewer, adjudicator, policy, data, admin. */
  roles: string;
  disabled: number;
  created_at: string;
}

export interface SessionTable {
  /** sha-256 of the cookie value; the cookie value itself is never stored. */
  id: string;
  user_id: number;
  csrf_token: string;
  created_at: string;
  last_seen_at: string;
}

export interface ApiTokenTable {
  id: Generated<number>;
  name: string;
  token_hash: string;
  scopes: string;
  created_by: number | null;
  created_at: string;
  revoked_at: string | null;
  last_used_at: string | null;
}

export interface AuditEventTable {
  id: Generated<number>;
  at: string;
  actor_id: number | null;
  kind: string;
  subject: string | null;
  /** JSON object. */
  detail: string | null;
}

export interface LoginFailureTable {
  id: Generated<number>;
  at: string;
  username: string;
  address: string;
}

export interface SettingTable {
  key: string;
  value: string;
}

export type Batch = Selectable<BatchTable>;
export type Item = Selectable<ItemTable>;
export type ResponseRow = Selectable<ResponseTable>;
export type Review = Selectable<ReviewTable>;
export type User = Selectable<UserTable>;
export type NewUser = Insertable<UserTable>;
export type UserUpdate = Updateable<UserTable>;
export type AuditEvent = Selectable<AuditEventTable>;
