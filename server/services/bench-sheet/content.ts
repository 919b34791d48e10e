/**
 * What the bench sheet says, as plain rows and strings: built from the version,
 * its stock and the shared computations, with the lab's units. No drawing here, so the
 * wording can be read and tested on its own.
 */
import type { UnitPreference } from '../../../shared/api-types';
import { formatDate, formatDateTime } from '../../../shared/date-format';
import { recipeCautions, standardCautionsFor, type Caution } from '../../../shared/cautions';
import { computeRecipe } from '../../../shared/recipe-computations';
import type { RecipeContext } from '../../../shared/recipe-context';
import type { RecipeVersionDto, SignatureDto } from '../../../shared/recipe-types';
import type { HardnessWindow } from '../../../shared/schemas/stock';
import { markedMaximumText } from '../../../shared/spindle-speed';
import { motionSettingsText } from '../../../shared/motion-settings';
import { formatQuantity } from '../../../shared/units';
import {
  CLAMPING_METHOD_LABELS,
  COOLANT_TYPE_LABELS,
  CUT_MOTION_LABELS,
  CUT_ORIENTATION_LABELS,
  MACHINE_CLASS_LABELS,
  MATERIAL_GROUP_LABELS,
  SHAPE_LABELS,
  WHEEL_RESTRICTION_LABELS,
  WHEEL_PATH_LABELS,
  type DateFormat,
} from '../../../shared/vocabulary';
import type { Row } from './layout';

const MEANING_LABELS: Record<SignatureDto['meaning'], string> = { approved: 'Approved', withdrawn: 'Withdrawn' };

export interface SheetSignature {
  name: string;
  meaning: string;
  /** "2026-12-01 14:03 UTC" in the lab's date format. */
  signedAt: string;
  /** First 16 hex characters of the signed content's SHA-256. */
  hash: string;
  comment: string;
}

/** One cell of the key-settings strip: what the operator sets, in large type. */
export interface KeySetting {
  label: string;
  /** Printed large, e.g. "2800 rpm". */
  value: string;
  /** A smaller line under it, e.g. the wheel's specification or the entry feed; '' for none. */
  detail: string;
  /** Boxed beside or under the value, as large as readable: the speed never to exceed. */
  limit?: string;
}

export interface SheetModel {
  labName: string;
  number: string;
  title: string;
  version: number;
  /** "Approved — current" or "Approved — effective from 2027-01-05". */
  statusLine: string;
  /** Whether the version is in force today (else approved for a later day). */
  current: boolean;
  effectiveFrom: string;
  reviewDueOn: string;
  /** XXXX-XXXX. */
  checkCode: string;
  checkUrl: string;
  /** Who prepared the version (its author) and who approved it, printed side by side. */
  preparedBy: string;
  approvedBy: string;
  /** Wheel, wheel speed with its limit, feed, cut motion, coolant: the top of page 1. */
  keySettings: KeySetting[];
  scope: Row[];
  /** Machine and wheel facts beyond the key settings: size, marking, speeds and margin. */
  parameters: Row[];
  clamping: Row[];
  instructionsMd: string;
  acceptanceMd: string;
  cautionsMd: string;
  /** The cautions the recipe's material, coolant or flags call for, with their basis (printed first). */
  recipeCautions: Caution[];
  /** The standard cautions, citing the wheel standard of the recipe's wheel kind. */
  standardCautions: readonly Caution[];
  changeReason: string;
  signatures: SheetSignature[];
  contentHash: string;
}

function num(value: number): string {
  return Number.isInteger(value) ? String(value) : String(Number(value.toFixed(2)));
}

function hardnessText(h: HardnessWindow | null, fallback: { value: number; scale: string } | null | undefined): string {
  if (h) return h.min === h.max ? `${num(h.min)} ${h.scale}` : `${num(h.min)}–${num(h.max)} ${h.scale}`;
  if (fallback) return `${num(fallback.value)} ${fallback.scale} (typical for the material)`;
  return 'Not limited';
}

const yesNo = (b: boolean) => (b ? 'Yes' : 'No');

/**
 * The cut motion's own settings as printed beside its name (e.g. a pulse's advance and
 * retract, a rocking angle, passes and depth per pass); '' for a motion without settings.
 */
export function cutMotionSettingsText(cutting: RecipeVersionDto['content']['cutting'], units: UnitPreference): string {
  const text = motionSettingsText({ cutting }, units);
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** The strip at the top of page 1, in the order the operator sets the machine. */
function keySettingsOf(c: RecipeVersionDto['content'], wheel: RecipeContext['wheel'], neverAboveRpm: number | null, units: UnitPreference): KeySetting[] {
  const len = (mm: number | null | undefined) => formatQuantity(mm, 'length', units);
  const entry =
    c.cutting.entryFeedMmS !== null
      ? `entry ${formatQuantity(c.cutting.entryFeedMmS, 'feed', units)}${c.cutting.entryLengthMm !== null ? ` for the first ${len(c.cutting.entryLengthMm)}` : ''}`
      : '';
  const coolantDetail = [
    c.coolant.concentrationPct !== null ? `${num(c.coolant.concentrationPct)} % v/v` : '',
    c.coolant.flowLMin !== null ? `${num(c.coolant.flowLMin)} L/min` : '',
  ]
    .filter(Boolean)
    .join(' · ');
  return [
    { label: 'Wheel', value: wheel ? wheel.name : '—', detail: wheel ? wheel.specification : '' },
    {
      label: 'Wheel speed',
      value: formatQuantity(c.cutting.wheelRpm, 'rpm', units),
      detail: '',
      // The wheel's marked maximum in whole rpm, or the machine's spindle limit where lower.
      ...(neverAboveRpm !== null ? { limit: `never above ${neverAboveRpm} rpm on this machine` } : {}),
    },
    // The metric feed large; where the lab wants imperial too, it goes first on the smaller line.
    {
      label: 'Feed',
      value: formatQuantity(c.cutting.feedMmS, 'feed', 'metric'),
      detail: [
        formatQuantity(c.cutting.feedMmS, 'feed', units)
          .slice(formatQuantity(c.cutting.feedMmS, 'feed', 'metric').length)
          .trim(),
        entry,
      ]
        .filter(Boolean)
        .join(' · '),
    },
    {
      label: 'Cut motion',
      value: CUT_MOTION_LABELS[c.cutting.cutMotion],
      detail: cutMotionSettingsText(c.cutting, units),
    },
    { label: 'Coolant', value: COOLANT_TYPE_LABELS[c.coolant.type], detail: coolantDetail },
  ];
}

export interface SheetInput {
  version: RecipeVersionDto;
  context: RecipeContext;
  labName: string;
  units: UnitPreference;
  /** The lab's date format: every date the sheet prints follows it. */
  dateFormat: DateFormat;
  checkCode: string;
  checkUrl: string;
  /** Whether this version is the one in force today (else approved for a later day). */
  current: boolean;
}

export function buildSheetModel(input: SheetInput): SheetModel {
  const { version: v, context: ctx, units } = input;
  const c = v.content;
  const computed = computeRecipe(c, ctx);
  const len = (mm: number | null | undefined) => formatQuantity(mm, 'length', units);
  const { material, machine, wheel } = ctx;
  const effective = formatDate(v.workflow?.effectiveFrom, input.dateFormat) || '—';

  const size = c.scope.sizeMinMm === c.scope.sizeMaxMm ? `Ø ${len(c.scope.sizeMaxMm)}` : `Ø ${len(c.scope.sizeMinMm)} to ${len(c.scope.sizeMaxMm)}`;
  const sizeLine =
    c.scope.shape === 'round-bar'
      ? size
      : c.scope.shape === 'tube'
        ? `${size}, wall ${len(c.scope.wallMm)}`
        : `height ${len(c.scope.sizeMinMm)} to ${len(c.scope.sizeMaxMm)}, width ${len(c.scope.widthMm)}`;

  const scope: Row[] = [
    {
      label: 'Material',
      value: material
        ? `${material.name}${material.designation ? ` (${material.designation})` : ''}${material.condition ? `, ${material.condition}` : ''}`
        : 'Any material of the group',
    },
    { label: 'Material group', value: MATERIAL_GROUP_LABELS[c.scope.group] },
    { label: 'Hardness', value: hardnessText(c.scope.hardness, material?.hardness) },
    { label: 'Shape and size', value: `${SHAPE_LABELS[c.scope.shape]}, ${sizeLine}` },
    { label: 'Cut orientation', value: `${CUT_ORIENTATION_LABELS[c.scope.orientation]}${c.scope.orientationNote ? ` — ${c.scope.orientationNote}` : ''}` },
  ];

  const speed = formatQuantity(computed.peripheralSpeedMs, 'speed', units);
  const margin =
    computed.speedMarginMs === null
      ? '—'
      : `${formatQuantity(computed.speedMarginMs, 'speed', units)} below the marked maximum${computed.speedMarginPct === null ? '' : ` (${computed.speedMarginPct.toFixed(0)} %)`}`;
  const overMax = computed.speedMarginMs !== null && computed.speedMarginMs < 0;
  // Wheel, wheel speed, feed, cut motion and coolant are in the key-settings strip; these are the facts behind them.
  const parameters: Row[] = [
    { label: 'Machine', value: machine ? `${machine.name} (${MACHINE_CLASS_LABELS[machine.machineClass]})` : '—' },
    {
      label: 'Wheel size',
      value: wheel ? `Ø ${len(wheel.diameterMm)} × ${len(wheel.thicknessMm)}, bore ${len(wheel.boreMm)}` : '—',
    },
    { label: 'Specification (ISO 525)', value: wheel ? wheel.specification : '—', strong: true },
    {
      label: 'Restrictions marked on the wheel',
      value: wheel ? (wheel.restrictions.length ? wheel.restrictions.map((r) => WHEEL_RESTRICTION_LABELS[r]).join('; ') : 'None marked') : '—',
      strong: !!wheel?.restrictions.length,
    },
    // "Never exceed it" is said by the strip's limit and the standard cautions.
    { label: 'Marked maximum speed', value: computed.markedMaximum ? markedMaximumText(computed.markedMaximum, units) : '—' },
    { label: 'Peripheral speed (new wheel)', value: speed },
    {
      label: 'Margin to marked maximum',
      value: overMax ? `${formatQuantity(-computed.speedMarginMs!, 'speed', units)} ABOVE the marked maximum — do not run` : margin,
      strong: overMax,
    },
    { label: 'Passes', value: c.cutting.passes === null ? 'Single cut' : String(c.cutting.passes) },
    ...(computed.spindleOverspeed
      ? [
          {
            label: 'Machine top speed',
            value: `${formatQuantity(computed.spindleOverspeed.topRpm, 'rpm', units)} — ABOVE the wheel's marked maximum: check the speed setting before every start`,
            strong: true,
          } satisfies Row,
        ]
      : []),
  ];

  const clamping: Row[] = [
    { label: 'Method', value: c.clamping.method ? CLAMPING_METHOD_LABELS[c.clamping.method] : '—', strong: true },
    ...(c.clamping.placement ? [{ label: 'Placement', value: c.clamping.placement }] : []),
    { label: 'Both sides of the cut', value: yesNo(c.clamping.bothSides) },
    { label: 'Protective inserts', value: yesNo(c.clamping.softInserts) },
    { label: 'Support blocks', value: yesNo(c.clamping.supportBlocks) },
    // Older content has no wheel path (no key): nothing is printed for it.
    ...(c.clamping.wheelPath
      ? [{ label: 'Wheel path through the coating', value: WHEEL_PATH_LABELS[c.clamping.wheelPath] ?? c.clamping.wheelPath, strong: true }]
      : []),
    ...(c.clamping.orientationRule ? [{ label: 'Orientation rule', value: c.clamping.orientationRule }] : []),
  ];

  const signatures = (v.workflow?.signatures ?? []).map((s) => ({
    name: s.signerName,
    meaning: MEANING_LABELS[s.meaning],
    signedAt: formatDateTime(s.signedAt, input.dateFormat),
    hash: s.contentHash.slice(0, 16),
    comment: s.comment,
  }));

  return {
    labName: input.labName,
    number: v.number,
    title: v.title,
    version: v.version,
    statusLine: input.current ? 'Approved — current' : 'Approved — not yet current',
    current: input.current,
    effectiveFrom: effective,
    reviewDueOn: formatDate(v.workflow?.reviewDueOn, input.dateFormat) || '—',
    checkCode: input.checkCode,
    checkUrl: input.checkUrl,
    preparedBy: v.createdBy.name,
    approvedBy:
      signatures
        .filter((sg) => sg.meaning === MEANING_LABELS.approved)
        .map((sg) => sg.name)
        .join(', ') || '—',
    keySettings: keySettingsOf(c, wheel, computed.neverAboveRpm, units),
    scope,
    parameters,
    clamping,
    instructionsMd: c.instructionsMd,
    acceptanceMd: c.acceptanceMd,
    cautionsMd: c.cautionsMd,
    recipeCautions: recipeCautions(c, ctx),
    standardCautions: standardCautionsFor(wheel?.kind),
    changeReason: c.changeReason,
    signatures,
    contentHash: v.contentHash ?? '',
  };
}
