/**
 * Recipe content for the large data set: the demo lab's sixteen recipes
 * (seeds/data/demo-recipes.ts) as templates, each copy with its own sizes, speeds, feeds,
 * title and Markdown, inside the machine's and wheel's limits. Every content is parsed
 * with the recipe schema, and its derived columns come from the app's own `contentValues`,
 * exactly as a save writes them. A variation that would trip a blocker falls back to the
 * template's own values, which pass the checks.
 */
import { maxRpmForWheel } from '../../../shared/peripheral-speed';
import { recipeContent, type RecipeContent } from '../../../shared/schemas/recipe';
import type { VersionContentValues } from '../../../server/data/recipes';
import { contentValues } from '../../../server/services/recipes/recipes';
import { DEMO_RECIPES, type DemoRecipe } from '../../../seeds/data/demo-recipes';
import type { Random } from './random';
import type { StockCatalog } from './stock';

const SITES = [
  'Hall A',
  'Hall B',
  'North plant',
  'South plant',
  'forge shop',
  'heat-treat line 2',
  'incoming goods',
  'weld lab',
  'failure analysis',
  'customer audit',
  'pilot line',
  'rolling mill',
  'foundry',
  'machining cell 4',
];

const EXTRA_STEPS = [
  '## Before the first cut\n\n- Check the **wheel marking** against the sheet.\n- Dress the wheel if the last job was on another material.',
  '## Specimen marking\n\nScribe the specimen id on the offcut side, **never** on the face to be examined.',
  '## After cutting\n\n1. Rinse the specimen with water, then ethanol.\n2. Dry with warm air.\n3. Put it in the desiccator until mounting.',
  '## Coolant\n\nTop up the tank to the mark; skim off tramp oil every morning. Log the refractometer reading on the machine card.',
  '> If the wheel slows down or the motor load rises, stop the feed and let the wheel recover before going on.',
  '## Long parts\n\nSupport the free end on the roller stand at table height so the cut does not close on the wheel.',
  '## Records\n\nRecord each cut with its specimen id and part, lot or heat number straight after cutting.',
  '## Waste\n\nCollect the sludge from the sump in the marked drum; it is disposed of as metal-bearing waste.',
];

const EXTRA_ACCEPTANCE = [
  '- Face flat within 0.1 mm across the section.',
  '- No cracks visible at 10×.',
  '- Edges free of chipping above 0.2 mm.',
  '- Specimen id legible on the offcut.',
];

const CHANGE_REASONS = [
  'Feed lowered after burn marks on two specimens.',
  'Size window widened for the new bar supplier.',
  'Instructions reworded after operator feedback.',
  'Wheel speed adjusted to the new wheel batch.',
  'Acceptance criteria aligned with the customer specification.',
  'Periodic review: clarified clamping and coolant steps.',
  'Entry feed added to protect the edge.',
  'Coolant concentration corrected after the tank audit.',
];

export { CHANGE_REASONS };

const round = (value: number, step: number) => Math.round(value / step) * step;
/** Rounding that leaves no floating-point tail (0.30000000000000004). */
const tidy = (value: number, decimals: number) => Number(value.toFixed(decimals));

/** A template's content with the stock ids of the catalog. */
function templateContent(template: DemoRecipe, stock: StockCatalog): RecipeContent {
  return {
    scope: { ...template.scope, materialId: template.material === null ? null : stock.material(template.material).id },
    cutting: { ...template.cutting, machineId: stock.machine(template.machine).id, wheelId: stock.wheel(template.wheel).id },
    clamping: template.clamping,
    coolant: template.coolant,
    instructionsMd: template.instructionsMd,
    acceptanceMd: template.acceptanceMd,
    cautionsMd: template.cautionsMd,
    changeReason: '',
  };
}

/** Speed and feed varied around the template's, inside the machine's ranges and the wheel's marked speed. */
function variedCutting(base: RecipeContent['cutting'], stock: StockCatalog, random: Random): RecipeContent['cutting'] {
  const machine = stock.machineById(base.machineId);
  const wheel = stock.wheelById(base.wheelId);
  const rpmCeiling = Math.min(machine.rpmMax, maxRpmForWheel(wheel.diameterMm, wheel.maxSpeedMs));
  const wheelRpm = Math.max(machine.rpmMin, Math.min(rpmCeiling, round(base.wheelRpm * random.between(0.85, 1.05), 50)));
  const precise = machine.machineClass === 'precision';
  const step = precise ? 0.005 : 0.01;
  const feedMmS = tidy(Math.max(machine.feedMinMmS, Math.min(machine.feedMaxMmS, round(base.feedMmS * random.between(0.7, 1.2), step))), 3);
  return { ...base, wheelRpm, feedMmS };
}

function variedScope(base: RecipeContent['scope'], random: Random): RecipeContent['scope'] {
  const f = random.between(0.6, 1.3);
  let sizeMinMm = Math.max(1, tidy(base.sizeMinMm * f, base.sizeMinMm < 5 ? 1 : 0));
  const sizeMaxMm = Math.max(sizeMinMm + 1, tidy(base.sizeMaxMm * random.between(0.7, 1.1), base.sizeMaxMm < 20 ? 1 : 0));
  if (base.shape === 'tube' && base.wallMm !== null && 2 * base.wallMm >= sizeMinMm) sizeMinMm = 2 * base.wallMm + 2;
  const orientation = random.chance(0.15) ? 'longitudinal' : base.orientation;
  const orientationNote = orientation === 'longitudinal' ? 'Along the rolling direction.' : base.orientationNote;
  return { ...base, sizeMinMm, sizeMaxMm: Math.max(sizeMaxMm, sizeMinMm), orientation, orientationNote };
}

function extraMarkdown(random: Random, count: number): string {
  const parts: string[] = [];
  for (let i = 0; i < count; i++) {
    const step = random.pick(EXTRA_STEPS);
    if (!parts.includes(step)) parts.push(step);
  }
  return parts.join('\n\n');
}

export interface PlannedContent {
  title: string;
  content: RecipeContent;
  values: VersionContentValues;
}

/** Parses the content as the API does and derives its columns as a save does. */
function finish(title: string, content: RecipeContent, stock: StockCatalog): PlannedContent {
  const parsed = recipeContent.parse(content);
  return { title, content: parsed, values: contentValues(title, parsed, stock.context(parsed)) };
}

function blocked(planned: PlannedContent): boolean {
  return planned.values.worst_check === 'blocker';
}

/** Version 1 of recipe number `serial`: a template with its own numbers, title and Markdown. */
export function firstContent(serial: number, stock: StockCatalog, random: Random): PlannedContent {
  const template = DEMO_RECIPES[serial % DEMO_RECIPES.length]!;
  const base = templateContent(template, stock);
  const scope = variedScope(base.scope, random);
  const content: RecipeContent = {
    ...base,
    scope,
    cutting: variedCutting(base.cutting, stock, random),
    coolant: base.coolant.type === 'water-soluble' ? { ...base.coolant, concentrationPct: random.int(3, 5) } : base.coolant,
    instructionsMd: `${base.instructionsMd}\n\n${extraMarkdown(random, random.int(1, 4))}`,
  };
  const title = `${template.title}, ${scope.sizeMinMm}–${scope.sizeMaxMm} mm (${random.pick(SITES)})`;
  const planned = finish(title, content, stock);
  return blocked(planned) ? finish(title, { ...base, instructionsMd: content.instructionsMd }, stock) : planned;
}

/** The next version: new numbers or wording, and the reason for the change. */
export function nextContent(previous: PlannedContent, stock: StockCatalog, random: Random): PlannedContent {
  const changeReason = random.pick(CHANGE_REASONS);
  const content: RecipeContent = {
    ...previous.content,
    cutting: random.chance(0.6) ? variedCutting(previous.content.cutting, stock, random) : previous.content.cutting,
    instructionsMd: random.chance(0.5) ? `${previous.content.instructionsMd}\n\n${extraMarkdown(random, 1)}`.slice(0, 20000) : previous.content.instructionsMd,
    changeReason,
  };
  const planned = finish(previous.title, content, stock);
  return blocked(planned) ? finish(previous.title, { ...previous.content, changeReason }, stock) : planned;
}

/**
 * The content as first submitted, before the reviewer sent it back: the final content
 * without the acceptance line the author added after the review.
 */
export function withReviewFix(planned: PlannedContent, stock: StockCatalog, random: Random): { reviewed: PlannedContent; fixed: PlannedContent } {
  const fixed = finish(planned.title, { ...planned.content, acceptanceMd: `${planned.content.acceptanceMd}\n${random.pick(EXTRA_ACCEPTANCE)}` }, stock);
  return { reviewed: planned, fixed };
}
