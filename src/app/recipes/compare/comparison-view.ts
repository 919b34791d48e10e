import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { RecipeComparison, TextChange } from '@shared/recipe-types';
import type { RecipeStatus } from '@shared/vocabulary';
import { RECIPE_STATUS_LABELS } from '@shared/vocabulary';

/** How a text diff is laid out: the two versions in columns, or one flow with both marked. */
export type ComparisonLayout = 'side-by-side' | 'inline';

/** One run of words in a text diff, as this view marks it. */
interface Run {
  kind: 'same' | 'added' | 'removed';
  value: string;
}

/** A changed text field, split the three ways the layouts need it. */
interface TextDiffView {
  path: string;
  label: string;
  /** Every run in order: what the inline layout shows. */
  all: Run[];
  /** The older text, removed runs marked: the left column. */
  before: Run[];
  /** The newer text, added runs marked: the right column. */
  after: Run[];
  added: number;
  removed: number;
  /** A side with no text at all says so instead of showing an empty box. */
  beforeEmpty: boolean;
  afterEmpty: boolean;
}

function toView(change: TextChange): TextDiffView {
  const all = change.parts.map<Run>((part) => ({
    kind: part.added ? 'added' : part.removed ? 'removed' : 'same',
    value: part.value,
  }));
  const words = (kind: Run['kind']) => all.filter((run) => run.kind === kind).reduce((n, run) => n + (run.value.match(/\S+/g)?.length ?? 0), 0);
  const before = all.filter((run) => run.kind !== 'added');
  const after = all.filter((run) => run.kind !== 'removed');
  const blank = (runs: Run[]) => runs.every((run) => run.value.trim() === '');
  return {
    path: change.path,
    label: change.label,
    all,
    before,
    after,
    added: words('added'),
    removed: words('removed'),
    beforeEmpty: blank(before),
    afterEmpty: blank(after),
  };
}

/**
 * What changed between two versions of a recipe, as the server's compare route reports it:
 * a table of changed parameters and a word-level diff of each changed text. Added and removed
 * words are underlined or struck through and announced to screen readers, never shown by
 * colour alone. Used by the Compare and Review screens.
 */
@Component({
  selector: 'kb-comparison-view',
  imports: [NgTemplateOutlet],
  templateUrl: './comparison-view.html',
  styleUrl: './comparison-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ComparisonView {
  readonly comparison = input.required<RecipeComparison>();
  readonly layout = input<ComparisonLayout>('side-by-side');
  /** Level of this view's own headings, so it fits under the host page's outline. */
  readonly headingLevel = input<2 | 3 | 4>(2);

  protected readonly fromLabel = computed(() => this.versionLabel(this.comparison().from));
  protected readonly toLabel = computed(() => this.versionLabel(this.comparison().to));
  protected readonly texts = computed(() => this.comparison().texts.map(toView));
  protected readonly unchanged = computed(() => this.comparison().parameters.length === 0 && this.comparison().texts.length === 0);

  private versionLabel(side: RecipeComparison['from']): string {
    const status = RECIPE_STATUS_LABELS[side.status as RecipeStatus] ?? side.status;
    return `Version ${side.version} (${status})`;
  }
}
