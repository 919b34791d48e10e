import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatRadioModule } from '@angular/material/radio';
import type { RecipeVersionDto } from '@shared/recipe-types';
import type { RecipeContent } from '@shared/schemas/recipe';
import { FIELD_INFO } from './recipe-form';
import { LabDatePipe } from '../../core/dates/lab-date-pipe';

/** What the author tried to save: title and content. */
export interface DraftBody {
  title: string;
  content: RecipeContent;
}

export interface SaveConflictDialogData {
  /** The draft as it was when this editor last loaded or saved it: what both sides started from. */
  base: DraftBody;
  mine: DraftBody;
  /** The version as it is on the server now. */
  theirs: RecipeVersionDto;
  /** Display text for a value at a path, with its unit (names for ids, labels for choices). */
  describe: (path: string, value: unknown) => string;
}

/** One field that differs between the two drafts. */
export interface Difference {
  path: string;
  mine: unknown;
  theirs: unknown;
}

function valueAt(body: unknown, path: string): unknown {
  return path.split('.').reduce<unknown>((node, key) => (isObject(node) ? node[key] : undefined), body);
}

const same = (a: unknown, b: unknown) => JSON.stringify(a ?? null) === JSON.stringify(b ?? null);

type Choice = 'mine' | 'theirs';

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * Fields whose values differ, as dotted paths. Objects present on both sides are compared
 * field by field; an object on one side and null on the other (a hardness window added or
 * removed) is one difference.
 */
export function differences(mine: unknown, theirs: unknown, prefix = ''): Difference[] {
  if (isObject(mine) && isObject(theirs)) {
    const keys = [...new Set([...Object.keys(mine), ...Object.keys(theirs)])];
    return keys.flatMap((key) => differences(mine[key], theirs[key], prefix ? `${prefix}.${key}` : key));
  }
  return same(mine, theirs) ? [] : [{ path: prefix, mine, theirs }];
}

function setPath(target: Record<string, unknown>, path: string, value: unknown): void {
  const parts = path.split('.');
  let node = target;
  for (const part of parts.slice(0, -1)) {
    if (!isObject(node[part])) node[part] = {};
    node = node[part] as Record<string, unknown>;
  }
  node[parts[parts.length - 1]] = structuredClone(value);
}

/** Their draft with my value wherever I chose to keep mine. */
export function merge(mine: DraftBody, theirs: DraftBody, keepMine: readonly Difference[]): DraftBody {
  const merged = structuredClone(theirs) as unknown as Record<string, unknown>;
  for (const d of keepMine) setPath(merged, d.path, d.mine);
  return merged as unknown as DraftBody;
}

/**
 * Someone saved this draft after the author's copy was loaded. Lists every field that differs,
 * with the value both started from (old → theirs, old → mine, with units), and lets the author
 * keep their value or take the other one, field by field. The starting choice is the side that
 * changed the field (mine where both did). It cannot be dismissed without a decision, so
 * nothing is overwritten silently and nothing typed is lost. Closes with the merged draft.
 */
@Component({
  selector: 'kb-save-conflict-dialog',
  imports: [LabDatePipe, MatButtonModule, MatDialogModule, MatRadioModule],
  templateUrl: './save-conflict-dialog.html',
  styleUrl: './save-conflict-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SaveConflictDialog {
  private readonly dialogRef = inject<MatDialogRef<SaveConflictDialog, DraftBody>>(MatDialogRef);
  protected readonly data = inject<SaveConflictDialogData>(MAT_DIALOG_DATA);

  private readonly theirs: DraftBody = { title: this.data.theirs.title, content: this.data.theirs.content };
  protected readonly rows = differences(this.data.mine, this.theirs).map((d) => {
    const path = d.path.replace(/^content\./, '');
    const base = valueAt(this.data.base, d.path);
    return {
      ...d,
      label: FIELD_INFO[path]?.label ?? path,
      baseText: this.data.describe(path, base),
      mineText: this.data.describe(path, d.mine),
      theirsText: this.data.describe(path, d.theirs),
      /** Only they changed it: taking theirs loses nothing of mine. */
      start: (same(d.mine, base) ? 'theirs' : 'mine') as Choice,
    };
  });
  protected readonly choices = signal<Record<string, Choice>>(Object.fromEntries(this.rows.map((r) => [r.path, r.start])));
  protected readonly keptMine = computed(() => this.rows.filter((r) => this.choices()[r.path] === 'mine').length);

  protected choose(path: string, choice: Choice): void {
    this.choices.update((all) => ({ ...all, [path]: choice }));
  }

  protected chooseAll(choice: Choice): void {
    this.choices.set(Object.fromEntries(this.rows.map((r) => [r.path, choice])));
  }

  protected applyChoices(): void {
    const keep = this.rows.filter((r) => this.choices()[r.path] === 'mine');
    this.dialogRef.close(merge(this.data.mine, this.theirs, keep));
  }
}
