import { Injectable, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { type AbstractControl, NonNullableFormBuilder, type ValidationErrors } from '@angular/forms';
import { MatDialog } from '@angular/material/dialog';
import { Router } from '@angular/router';
import { Subject, concatMap, debounceTime, firstValueFrom, from, map, startWith } from 'rxjs';
import { canonicalJson } from '@shared/canonical-json';
import { changeReasonMissing } from '@shared/recipe-checks';
import type { RecipeVersionDto, StaleSaveBody } from '@shared/recipe-types';
import { RECIPE_STATUS_LABELS, type RecipeStatus } from '@shared/vocabulary';
import { utcTimeOfDay } from '../../core/dates/calendar';
import { applyServerErrors } from '../../core/forms/server-errors';
import { isApiError } from '../../core/http/api-error';
import { callerHandles } from '../../core/http/caller-handles';
import { ConfirmDialog, type ConfirmDialogData } from '../../ui/confirm-dialog';
import { RecipeEditorApi } from './recipe-editor-api';
import { type RecipeFormValue, attachContentValidators, buildRecipeForm, fromContent, revalidate, toContent } from './recipe-form';
import { type DraftBody, SaveConflictDialog, type SaveConflictDialogData } from './save-conflict-dialog';

/** A draft saves itself this long after the last change. */
export const AUTOSAVE_DEBOUNCE_MS = 3000;

const EDITABLE: readonly RecipeStatus[] = ['draft', 'returned'];

export type SaveState = 'idle' | 'saving' | 'conflict' | 'failed';

function bodyOf(value: RecipeFormValue): DraftBody {
  return { title: value.title, content: toContent(value.content) };
}

/**
 * A draft as comparable text: canonical JSON (the server may order keys differently) of the
 * content passed through the form's own mapping, so loading a draft never looks like a change.
 * Through JSON.stringify first: a number typed as 1e999 is Infinity, which a save sends as null.
 */
function snapshotOf(body: DraftBody): string {
  return canonicalJson(JSON.parse(JSON.stringify({ title: body.title, content: toContent(fromContent(body.content)) })));
}

/** The version a stale-save 409 carries (`StaleSaveBody.current`), if the body has one. */
function staleCurrent(body: unknown): RecipeVersionDto | null {
  const current = (body as Partial<StaleSaveBody> | null)?.current;
  return current && typeof current === 'object' && 'revision' in current ? current : null;
}

/**
 * The editor's draft and how it is kept: the form, the version it is based on, saves a few
 * seconds after the last change, one save at a time (each carries the revision the previous
 * one left), the save state shown beside the buttons, the conflict dialog when someone else
 * saved first, and whether leaving now would lose input. Provided by the editor component,
 * so every editor has its own.
 */
@Injectable()
export class DraftAutosave {
  private readonly api = inject(RecipeEditorApi);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);

  readonly form = buildRecipeForm(inject(NonNullableFormBuilder));
  /** The form's raw value, updated on every change (not debounced). */
  readonly value = toSignal(this.form.valueChanges.pipe(map(() => this.form.getRawValue())), { initialValue: this.form.getRawValue() });

  private readonly loadedVersion = signal<RecipeVersionDto | null>(null);
  /** The version being edited; null until a new recipe is first saved. */
  readonly version = this.loadedVersion.asReadonly();
  readonly isNew = computed(() => this.version() === null);
  /** Why this version cannot be edited, or '' when it can. */
  readonly lockedReason = computed(() => {
    const v = this.version();
    if (!v || EDITABLE.includes(v.status)) return '';
    return `Version ${v.version} of ${v.number} is ${RECIPE_STATUS_LABELS[v.status].toLowerCase()}. Only drafts and versions returned for changes can be edited; submitted content stays as it was approved or reviewed.`;
  });

  /** The revision the form's content is based on; every save carries it. */
  private readonly baseRevision = signal(0);
  readonly revision = this.baseRevision.asReadonly();
  /** Title and content as last saved (or loaded), to tell whether there is anything to save. */
  private readonly savedSnapshot = signal(snapshotOf(bodyOf(this.form.getRawValue())));
  readonly dirty = computed(() => snapshotOf(bodyOf(this.value())) !== this.savedSnapshot());
  /** Input that leaving the page would throw away. */
  readonly unsaved = computed(() => this.dirty() && !this.lockedReason());
  readonly saveState = signal<SaveState>('idle');
  readonly savedAt = signal<Date | null>(null);
  readonly formError = signal('');
  private readonly isValid = signal(false);
  readonly valid = this.isValid.asReadonly();

  readonly saveStatus = computed(() => {
    switch (this.saveState()) {
      case 'saving':
        return 'Saving…';
      case 'conflict':
        return 'Not saved: this draft was changed by someone else';
      case 'failed':
        return 'Not saved';
    }
    if (this.dirty()) return this.valid() || this.isNew() ? 'Unsaved changes' : 'Unsaved changes: complete the marked fields to save';
    const at = this.savedAt();
    return at ? `Saved ${utcTimeOfDay(at)}` : this.isNew() ? 'Not saved yet' : 'No changes';
  });

  /** How the conflict dialog shows a value (names for ids, labels for choices); the editor knows its stock and units. */
  describe: (path: string, value: unknown) => string = (_path, value) => String(value ?? '—');

  private readonly saves = new Subject<'auto' | 'manual'>();

  constructor() {
    attachContentValidators(this.form);
    this.form.controls.content.controls.changeReason.addValidators((c: AbstractControl): ValidationErrors | null => {
      const missing = changeReasonMissing(this.version()?.version ?? 1, String(c.value));
      return missing ? { zod: missing } : null;
    });

    // Every change re-validates the whole form: one field can make another (in)valid.
    this.form.valueChanges.pipe(startWith(null), takeUntilDestroyed()).subscribe(() => {
      revalidate(this.form);
      this.isValid.set(this.form.valid);
      if (this.saveState() === 'failed') this.saveState.set('idle');
    });

    this.form.valueChanges.pipe(debounceTime(AUTOSAVE_DEBOUNCE_MS), takeUntilDestroyed()).subscribe(() => {
      if (this.canAutosave()) this.saves.next('auto');
    });
    // One save at a time, each reading the revision the previous one left.
    this.saves
      .pipe(
        concatMap((kind) => from(this.persist(kind))),
        takeUntilDestroyed(),
      )
      .subscribe();
  }

  /** Takes a version from the server as the new base: its revision, and (optionally) its content into the form. */
  adopt(version: RecipeVersionDto, intoForm: boolean): void {
    this.loadedVersion.set(version);
    this.baseRevision.set(version.revision);
    if (intoForm) {
      this.form.setValue({ title: version.title, content: fromContent(version.content) });
      this.savedAt.set(new Date(version.updatedAt));
    }
    this.savedSnapshot.set(snapshotOf(version));
    if (this.lockedReason()) this.form.disable({ emitEvent: false });
    this.revalidateNow();
  }

  revalidateNow(): void {
    revalidate(this.form);
    this.isValid.set(this.form.valid);
  }

  /** Saves now. False when the form is not complete: the fields are marked and the error says so. */
  saveNow(): boolean {
    this.formError.set('');
    revalidate(this.form);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      this.formError.set('Some fields are missing or out of range; they are marked below.');
      return false;
    }
    this.saves.next('manual');
    return true;
  }

  /** For the unsaved-changes guard: ask before unsaved input is thrown away. */
  async canLeave(): Promise<boolean> {
    if (!this.unsaved()) return true;
    return (
      (await firstValueFrom(
        this.dialog
          .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, {
            data: {
              title: 'Leave with unsaved changes?',
              message: ['Your latest changes to this recipe have not been saved.', 'If you leave now, they are lost.'],
              confirmLabel: 'Leave without saving',
            },
          })
          .afterClosed(),
      )) === true
    );
  }

  private canAutosave(): boolean {
    return !this.isNew() && !this.lockedReason() && this.saveState() !== 'conflict' && this.saveState() !== 'saving' && this.dirty() && this.form.valid;
  }

  private async persist(kind: 'auto' | 'manual'): Promise<void> {
    if (this.saveState() === 'conflict' || this.lockedReason()) return;
    if (kind === 'auto' && !this.canAutosave()) return;
    if (!this.form.valid) return;
    const body = bodyOf(this.form.getRawValue());
    const sent = snapshotOf(body);
    const version = this.version();
    this.saveState.set('saving');
    this.formError.set('');
    try {
      if (!version) {
        const created = await firstValueFrom(this.api.create(body, callerHandles(400)));
        this.savedSnapshot.set(sent);
        this.saveState.set('idle');
        void this.router.navigate(['/recipes', created.recipeId, 'edit'], { replaceUrl: true });
        return;
      }
      const saved = await firstValueFrom(this.api.save(version.recipeId, version.version, { revision: this.baseRevision(), ...body }, callerHandles(400, 409)));
      this.loadedVersion.set(saved);
      this.baseRevision.set(saved.revision);
      // Only what was sent is saved; anything typed meanwhile stays "unsaved" and goes next time.
      this.savedSnapshot.set(sent);
      this.savedAt.set(new Date());
      this.saveState.set('idle');
    } catch (e) {
      if (!isApiError(e)) throw e;
      if (e.status === 409 && version) {
        await this.resolveConflict(version, staleCurrent(e.body));
      } else {
        this.saveState.set('failed');
        const unmatched = e.status === 400 ? applyServerErrors(this.form, e.errors) : [];
        this.formError.set(unmatched.join(' ') || e.generalMessage);
      }
    }
  }

  /**
   * A stale save: autosave stops, the version as it is now is fetched, and the author decides
   * field by field. Then the base revision becomes the current one and the merge is saved.
   */
  private async resolveConflict(mineWasBasedOn: RecipeVersionDto, sent: RecipeVersionDto | null): Promise<void> {
    this.saveState.set('conflict');
    const current = sent ?? (await firstValueFrom(this.api.version(mineWasBasedOn.recipeId, mineWasBasedOn.version)).catch(() => null));
    if (!current) {
      this.formError.set('The draft was changed elsewhere and its current state could not be loaded. Your input is still here; try saving again.');
      this.saveState.set('failed');
      return;
    }
    if (!EDITABLE.includes(current.status)) {
      // Submitted meanwhile: the content is frozen. Keep the author's input on screen, read-only.
      this.loadedVersion.set(current);
      this.form.disable({ emitEvent: false });
      this.saveState.set('failed');
      this.formError.set('This version was submitted while you edited it, so your last changes could not be saved.');
      return;
    }
    const mine = bodyOf(this.form.getRawValue());
    const base = JSON.parse(this.savedSnapshot()) as DraftBody;
    const merged = await firstValueFrom(
      this.dialog
        .open<SaveConflictDialog, SaveConflictDialogData, DraftBody>(SaveConflictDialog, {
          data: { base, mine, theirs: current, describe: (path, value) => this.describe(path, value) },
          disableClose: true,
          width: '880px',
          maxWidth: '96vw',
          autoFocus: 'dialog',
        })
        .afterClosed(),
    );
    this.loadedVersion.set(current);
    this.baseRevision.set(current.revision);
    this.savedSnapshot.set(snapshotOf(current));
    if (merged) this.form.setValue({ title: merged.title, content: fromContent(merged.content) });
    this.saveState.set('idle');
    this.revalidateNow();
    if (this.form.valid && this.dirty()) this.saves.next('manual');
  }
}
