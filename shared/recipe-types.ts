/** Recipe DTOs of the API. */
import type { CheckResult } from './recipe-checks';
import type { RecipeContent } from './schemas/recipe';
import type { CutOutcome, MaterialGroup, RecipeStatus, Shape } from './vocabulary';

/** One row of the library table. */
export interface RecipeSummary {
  id: number;
  /** e.g. "KB-0042". */
  number: string;
  title: string;
  /** The latest version's number and status. */
  version: number;
  status: RecipeStatus;
  group: MaterialGroup;
  materialName: string | null;
  shape: Shape;
  sizeMinMm: number;
  sizeMaxMm: number;
  machineName: string;
  wheelName: string;
  /** Worst check severity of the latest version, for a badge. */
  worstCheck: 'blocker' | 'warning' | 'note' | null;
  updatedAt: string;
  /** The current version's periodic review date (YYYY-MM-DD, UTC), where the list reads it; null otherwise. */
  reviewDueOn: string | null;
  /** That date has passed (server's UTC day). */
  reviewOverdue: boolean;
}

export interface RecipeVersionDto {
  recipeId: number;
  number: string;
  title: string;
  version: number;
  status: RecipeStatus;
  /** Optimistic-concurrency counter: a save must carry the revision it was based on. */
  revision: number;
  content: RecipeContent;
  /** SHA-256 of the canonical content, fixed once submitted; null for drafts. */
  contentHash: string | null;
  /** The server's check results for this content. */
  checks: CheckResult[];
  createdBy: { id: number; name: string };
  updatedBy: { id: number; name: string };
  createdAt: string;
  updatedAt: string;
  attachments: AttachmentDto[];
  /** Signatures, dates and editors; present on every version once the review workflow is in. */
  workflow?: VersionWorkflowDto;
  /**
   * For an operator assigned to this version's machine, while the version is current or
   * approved: whether they must still acknowledge it ("read and understood") before the
   * sheet opens. Null for everyone else.
   */
  myAcknowledgement?: MyAcknowledgementDto | null;
  /**
   * Whether the stored content still is what was submitted and signed: its SHA-256
   * recomputed on every read against the stored hash and every signature's. Present on
   * every version the server sends.
   */
  integrity?: VersionIntegrityDto;
}

/** A failed integrity check says what does not match, in words an auditor can act on. */
export interface VersionIntegrityDto {
  ok: boolean;
  problems: string[];
}

/** The signed-in operator's acknowledgement of one version. */
export interface MyAcknowledgementDto {
  required: boolean;
  /** ISO 8601 UTC, when they acknowledged; null while still to do. */
  acknowledgedAt: string | null;
}

/**
 * GET /api/recipes/:id/versions/:n/changes-since-acknowledged — for the operator about to
 * acknowledge: what changed since the version of the recipe they last acknowledged.
 */
export interface ChangesSinceAcknowledgedDto {
  /** The latest earlier version of this recipe the operator acknowledged; null when they never acknowledged one. */
  since: { version: number; acknowledgedAt: string } | null;
  /** From `since` to the version asked about; null when `since` is. */
  comparison: RecipeComparison | null;
}

/** GET /api/recipes/:id/versions/:n/acknowledgements — who has read and understood a version. */
export interface AcknowledgementsDto {
  recipeId: number;
  version: number;
  machine: { id: number; name: string };
  acknowledged: { userId: number; displayName: string; acknowledgedAt: string }[];
  /** Active operators assigned to the machine who have not acknowledged yet. */
  pending: { userId: number; displayName: string }[];
}

export interface AttachmentDto {
  id: number;
  /** What the photo shows. */
  role: 'setup' | 'good-face' | 'bad-face' | 'other';
  caption: string;
  fileName: string;
  mimeType: string;
  sizeBytes: number;
  sha256: string;
  width: number;
  height: number;
  /** GET URLs for the image and its thumbnail. */
  url: string;
  thumbnailUrl: string;
}

/** Body of a 409 on a stale save: the version as it is now, so the editor can compare and merge. */
export interface StaleSaveBody {
  code: 'CONFLICT';
  errors: { path: string; message: string }[];
  current: RecipeVersionDto;
}

/** An electronic signature as shown wherever its version is shown or printed (21 CFR 11.50). */
export interface SignatureDto {
  id: number;
  /** The signer's printed name at the time of signing. */
  signerName: string;
  signerId: number;
  meaning: 'approved' | 'withdrawn';
  comment: string;
  /** ISO 8601 UTC. */
  signedAt: string;
  /** SHA-256 of the canonical content the signature is bound to. */
  contentHash: string;
}

export interface ReviewCommentDto {
  id: number;
  authorName: string;
  authorId: number;
  body: string;
  /** Content path the comment is about; "" for the whole version. */
  path: string;
  createdAt: string;
}

/** Workflow facts of a version, beside its content. */
export interface VersionWorkflowDto {
  signatures: SignatureDto[];
  /** YYYY-MM-DD: when an approved version becomes (or became) current. */
  effectiveFrom: string | null;
  /** YYYY-MM-DD: when the approved version is due for periodic review. */
  reviewDueOn: string | null;
  submittedAt: string | null;
  supersededAt: string | null;
  withdrawnAt: string | null;
  withdrawnReason: string | null;
  /** Everyone who authored or edited this version: they may not approve it. */
  editorIds: number[];
  /** Each time the version went back to its author, oldest first (from the trail's "version returned" events). */
  returns?: ReturnRoundDto[];
}

/** One return of a version to its author: who, when (ISO, UTC) and their comment. */
export interface ReturnRoundDto {
  returnedAt: string;
  returnedBy: { id: number | null; name: string };
  comment: string;
}

/** One changed parameter between two versions. */
export interface ParameterChange {
  /** Content path, e.g. "cutting.feedMmS". */
  path: string;
  label: string;
  /** Display values with units ("0.30 mm/s"), or names for referenced stock. */
  before: string;
  after: string;
}

/** A word-level diff of one text field (`diff` package, diffWordsWithSpace). */
export interface TextChange {
  path: string;
  label: string;
  parts: { value: string; added?: boolean; removed?: boolean }[];
}

/** GET /api/recipes/:id/compare?from=&to= */
export interface RecipeComparison {
  recipeId: number;
  number: string;
  from: { version: number; status: string; title: string; integrity?: VersionIntegrityDto };
  to: { version: number; status: string; title: string; integrity?: VersionIntegrityDto };
  parameters: ParameterChange[];
  texts: TextChange[];
}

/** One row of the trail. */
export interface TrailEventDto {
  id: number;
  occurredAt: string;
  actorId: number | null;
  actorName: string;
  type: string;
  entityType: string;
  entityId: string | null;
  before: unknown;
  after: unknown;
  clientAddress: string | null;
  /** The record as people know it ("KB-0017 v1", a person's or a material's name); read, never chained. */
  what: string;
  /** SHA-256 of the previous row and of this row (hex). */
  prevHash: string;
  hash: string;
}

/** A person as the trail's person filter lists them. */
export interface PersonNameDto {
  id: number;
  displayName: string;
  active: boolean;
}

export interface TrailPage {
  items: TrailEventDto[];
  /** Pass as `before` for the next (older) page; null on the last page. */
  nextBefore: number | null;
}

export interface ChainVerification {
  ok: boolean;
  checked: number;
  /** The first row whose stored hash or link does not match; null when the chain is whole. */
  firstBroken: { id: number; reason: string } | null;
}

/** GET /api/today — the signed-in person's lists, per role: the home screen's work lists. */
export interface TodayDto {
  myDrafts: RecipeSummary[];
  waitingForMyReview: RecipeSummary[];
  reviewsDue: (RecipeSummary & { reviewDueOn: string })[];
  flaggedCuts: { recipeId: number; number: string; title: string; count: number }[];
  toAcknowledge: RecipeSummary[];
  /** Start-up warnings for admins (e.g. APP_BASE_URL unset while listening beyond loopback); empty for everyone else. */
  notices: string[];
}

/** One finder hit: the current approved version of a recipe and why it matches. */
export interface FinderHit {
  summary: RecipeSummary;
  /** Higher is better; hits come sorted by it. */
  score: number;
  /** Plain words, e.g. "Material: 42CrMo4 alloy steel", "Size 30 mm within 20–60 mm". */
  reasons: string[];
}

/** GET /api/check/:code — what a printed sheet's code says now. */
export interface CheckCodeResult {
  code: string;
  recipeId: number;
  number: string;
  title: string;
  version: number;
  /** The printed version's state: current (approved and in force), pending (approved, not yet effective), superseded, withdrawn. */
  state: 'current' | 'pending' | 'superseded' | 'withdrawn';
  /** The version in force now, when there is one and it is not this one. */
  currentVersion: number | null;
  /** One sentence for the person at the saw. */
  message: string;
}

export interface CutRecordDto {
  id: number;
  recipeId: number;
  number: string;
  version: number;
  specimenId: string;
  partRef: string;
  quantity: number;
  outcome: CutOutcome;
  notes: string;
  operatorId: number;
  operatorName: string;
  /** ISO 8601 UTC. */
  cutAt: string;
  /** Set when the author has looked at a flagged (not good) cut. */
  flagClearedAt: string | null;
}

/** GET /api/cuts?specimenId= — a cut with the version's parameters, for traceability. */
export interface CutTrace {
  cut: CutRecordDto;
  versionContent: RecipeContent;
  signatures: SignatureDto[];
}
