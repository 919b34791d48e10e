/** Version rows and attachment rows as the API returns them. */
import type { CheckResult } from '../../../shared/recipe-checks';
import type { AttachmentDto, RecipeSummary, RecipeVersionDto, ReturnRoundDto, VersionWorkflowDto } from '../../../shared/recipe-types';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import type { MaterialGroup, Shape } from '../../../shared/vocabulary';
import type { AttachmentMetaRow } from '../../data/attachments';
import type { RecipeSummaryRow, VersionWithNames } from '../../data/recipes';
import type { StoredTrailEventRow } from '../../data/trail-events';
import { fromJsonColumn } from '../../data/json-column';
import type { EditorRow, SignatureRow } from '../../data/workflow';
import { dayOf } from '../../../shared/calendar-dates';
import { reviewDue } from '../../../shared/review-due';
import { toSignatureDto } from './signatures';
import { versionIntegrity } from './version-integrity';

/** The rows of other tables a version's workflow facts come from (for one or many versions). */
export interface WorkflowRows {
  signatures: readonly SignatureRow[];
  editors: readonly EditorRow[];
  /** The trail's "version returned" events of these versions, oldest first. */
  returns: readonly StoredTrailEventRow[];
}

const NO_WORKFLOW_ROWS: WorkflowRows = { signatures: [], editors: [], returns: [] };

const iso = (value: Date | null | undefined): string | null => (value ? new Date(value).toISOString() : null);

export function toVersionWorkflow(row: VersionWithNames, rows: WorkflowRows): VersionWorkflowDto {
  return {
    signatures: rows.signatures.filter((s) => s.version_id === row.id).map(toSignatureDto),
    effectiveFrom: dayOf(row.effective_from),
    reviewDueOn: dayOf(row.review_due_on),
    submittedAt: iso(row.submitted_at),
    supersededAt: iso(row.superseded_at),
    withdrawnAt: iso(row.withdrawn_at),
    withdrawnReason: row.withdrawn_reason ?? null,
    editorIds: rows.editors.filter((e) => e.version_id === row.id).map((e) => e.user_id),
    returns: rows.returns.filter((e) => e.entity_id === String(row.id)).map(toReturnRound),
  };
}

/** A return as the trail recorded it: the comment is in the event's "after" state. */
function toReturnRound(event: StoredTrailEventRow): ReturnRoundDto {
  const after = fromJsonColumn<{ comment?: unknown } | null>(event.after_json);
  return {
    returnedAt: new Date(event.occurred_at).toISOString(),
    returnedBy: { id: event.actor_user_id, name: event.actor_name },
    comment: typeof after?.comment === 'string' ? after.comment : '',
  };
}

export function toAttachmentDto(row: AttachmentMetaRow): AttachmentDto {
  return {
    id: row.id,
    role: row.role,
    caption: row.caption,
    fileName: row.file_name,
    mimeType: row.mime_type,
    sizeBytes: row.size_bytes,
    sha256: row.sha256,
    width: row.width,
    height: row.height,
    url: `/api/attachments/${row.id}`,
    thumbnailUrl: `/api/attachments/${row.id}/thumbnail`,
  };
}

export function toVersionDto(row: VersionWithNames, attachments: readonly AttachmentMetaRow[], workflow: WorkflowRows = NO_WORKFLOW_ROWS): RecipeVersionDto {
  return {
    recipeId: row.recipe_id,
    number: row.number,
    title: row.title,
    version: row.version,
    status: row.status,
    revision: row.revision,
    content: JSON.parse(row.content_json) as RecipeContent,
    contentHash: row.content_hash,
    checks: JSON.parse(row.checks_json) as CheckResult[],
    createdBy: { id: row.created_by, name: row.created_by_name },
    updatedBy: { id: row.updated_by, name: row.updated_by_name },
    createdAt: new Date(row.created_at).toISOString(),
    updatedAt: new Date(row.updated_at).toISOString(),
    attachments: attachments.filter((a) => a.version_id === row.id).map(toAttachmentDto),
    workflow: toVersionWorkflow(row, workflow),
    integrity: versionIntegrity(
      row,
      workflow.signatures.filter((s) => s.version_id === row.id),
    ),
  };
}

export function toRecipeSummary(row: RecipeSummaryRow): RecipeSummary {
  return {
    id: row.id,
    number: row.number,
    title: row.title,
    version: row.version,
    status: row.status,
    group: row.material_group as MaterialGroup,
    materialName: row.material_name,
    shape: row.shape as Shape,
    sizeMinMm: row.size_min_mm,
    sizeMaxMm: row.size_max_mm,
    machineName: row.machine_name,
    wheelName: row.wheel_name,
    worstCheck: row.worst_check,
    updatedAt: new Date(row.updated_at).toISOString(),
    ...reviewDue(dayOf(row.review_due_on ?? null)),
  };
}
