import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { RecipeVersionDto } from '@shared/recipe-types';
import { RecipeAttachments } from '../recipe-attachments';

/** Photos: the setup and good and bad cut faces, once the draft exists to attach them to. */
@Component({
  selector: 'kb-photos-section',
  imports: [RecipeAttachments],
  template: `
    <section class="kb-section" id="sec-photos" aria-labelledby="h-photos">
      <h2 id="h-photos" tabindex="-1">Photos</h2>
      @if (version(); as ver) {
        <kb-recipe-attachments [recipeId]="ver.recipeId" [version]="ver.version" [attachments]="ver.attachments" [editable]="ver.status === 'draft'" />
      } @else {
        <p class="kb-small">Create the draft first; then you can add a setup photo and photos of a good and a bad cut face.</p>
      }
    </section>
  `,
  styleUrl: './editor-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PhotosSection {
  /** Null until a new recipe is first saved. */
  readonly version = input.required<RecipeVersionDto | null>();
}
