import { HttpEventType } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, type ElementRef, computed, inject, input, linkedSignal, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom } from 'rxjs';
import type { AttachmentDto } from '@shared/recipe-types';
import { isApiError } from '../../core/http/api-error';
import { callerHandles } from '../../core/http/caller-handles';
import { ConfirmDialog, type ConfirmDialogData } from '../../ui/confirm-dialog';
import { PhotoUploads } from './photo-uploads';
import { type AttachmentRole, RecipeEditorApi } from './recipe-editor-api';

/** What the server accepts; it sniffs the bytes and decides, this only saves a pointless upload. */
export const ACCEPTED_IMAGE_TYPES = ['image/jpeg', 'image/png', 'image/webp'];
export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;

export const ATTACHMENT_ROLE_LABELS: Record<AttachmentRole, string> = {
  setup: 'Setup photo',
  'good-face': 'Good cut face',
  'bad-face': 'Bad cut face',
  other: 'Other',
};

/** Why a file is refused before upload, or '' when it may go. */
export function precheckImage(file: File): string {
  if (!ACCEPTED_IMAGE_TYPES.includes(file.type)) return `${file.name} is not a JPEG, PNG or WebP photo.`;
  if (file.size > MAX_UPLOAD_BYTES) return `${file.name} is ${(file.size / 1024 / 1024).toFixed(1)} MB; photos may be at most 10 MB.`;
  return '';
}

function megabytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${(bytes / 1024 / 1024).toFixed(1)} MB` : `${Math.max(1, Math.round(bytes / 1024))} kB`;
}

/**
 * Photos of a draft version: a chosen photo uploads at once (with progress), with the role
 * and caption set above it; thumbnails, delete. A photo that failed stays chosen with its
 * reason and a "Try again" until it is sent or discarded, and PhotoUploads tells the editor.
 */
@Component({
  selector: 'kb-recipe-attachments',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './recipe-attachments.html',
  styleUrl: './recipe-attachments.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecipeAttachments {
  private readonly api = inject(RecipeEditorApi);
  private readonly dialog = inject(MatDialog);
  private readonly destroyRef = inject(DestroyRef);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly fileInput = viewChild<ElementRef<HTMLInputElement>>('fileInput');
  /** The editor's record of a photo not uploaded yet; absent where no editor provides it. */
  private readonly uploads = inject(PhotoUploads, { optional: true });

  readonly recipeId = input.required<number>();
  readonly version = input.required<number>();
  readonly attachments = input.required<readonly AttachmentDto[]>();
  /** Photos change only on a draft (a returned version becomes one when it is next saved). */
  readonly editable = input(true);

  protected readonly list = linkedSignal(() => [...this.attachments()]);
  protected readonly roles = Object.entries(ATTACHMENT_ROLE_LABELS).map(([value, label]) => ({ value: value as AttachmentRole, label }));
  protected readonly roleLabel = ATTACHMENT_ROLE_LABELS;
  protected readonly size = megabytes;
  protected readonly accept = ACCEPTED_IMAGE_TYPES.join(',');

  protected readonly file = signal<File | null>(null);
  protected readonly error = signal('');
  /** Upload progress 0–100, or null when nothing is uploading. */
  protected readonly progress = signal<number | null>(null);
  protected readonly uploading = computed(() => this.progress() !== null);

  protected readonly details = this.fb.group({
    role: this.fb.control<AttachmentRole>('setup'),
    caption: this.fb.control(''),
  });

  protected pickFile(event: Event): void {
    const file = (event.target as HTMLInputElement).files?.[0] ?? null;
    if (!file) return;
    const refused = precheckImage(file);
    if (refused) {
      this.error.set(refused);
      this.clearInput();
      return;
    }
    this.file.set(file);
    this.upload();
  }

  /** Sends the chosen photo (again, after a failure). */
  protected upload(): void {
    const file = this.file();
    if (!file || this.uploading()) return;
    const { role, caption } = this.details.getRawValue();
    this.error.set('');
    this.progress.set(0);
    this.uploads?.pending.set(`${file.name} is still uploading.`);
    this.api
      .uploadAttachment(this.recipeId(), this.version(), file, role, caption, callerHandles(400, 409, 413, 415))
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (event) => {
          if (event.type === HttpEventType.UploadProgress) {
            this.progress.set(event.total ? Math.round((100 * event.loaded) / event.total) : 0);
          } else if (event.type === HttpEventType.Response && event.body) {
            this.list.update((list) => [...list, event.body!]);
            this.progress.set(null);
            this.details.controls.caption.setValue('');
            this.forget();
          }
        },
        error: (e: unknown) => {
          this.progress.set(null);
          const reason = isApiError(e) ? e.generalMessage : 'The connection failed.';
          this.error.set(`${file.name} is not uploaded: ${reason}`);
          this.uploads?.pending.set(`${file.name} is not uploaded (${reason}). Try again or discard it.`);
        },
      });
  }

  /** Drops a chosen photo that could not be uploaded. */
  protected discard(): void {
    this.error.set('');
    this.forget();
  }

  private forget(): void {
    this.file.set(null);
    this.uploads?.pending.set('');
    this.clearInput();
  }

  private clearInput(): void {
    const input = this.fileInput()?.nativeElement;
    if (input) input.value = '';
  }

  protected async remove(attachment: AttachmentDto): Promise<void> {
    const confirmed = await firstValueFrom(
      this.dialog
        .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, {
          data: {
            title: 'Remove this photo?',
            message: [`${attachment.fileName} (${ATTACHMENT_ROLE_LABELS[attachment.role]}) is removed from this draft.`],
            confirmLabel: 'Remove photo',
          },
        })
        .afterClosed(),
    );
    if (!confirmed) return;
    await firstValueFrom(this.api.deleteAttachment(this.recipeId(), this.version(), attachment.id));
    this.list.update((list) => list.filter((a) => a.id !== attachment.id));
  }
}
