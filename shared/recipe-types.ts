/** Recipe DTOs of the API. */
import type { CheckResult } from './recipe-checks';
import type { RecipeContent } from './schemas/recipe';
import type { MaterialGroup, RecipeStatus, Shape } from './vocabulary';

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
