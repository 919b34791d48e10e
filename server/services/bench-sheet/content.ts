/**
 * What the bench sheet says, as plain rows and strings: built from the version,
 * its stock and the shared computations, with the lab's units. No drawing here, so the
 * wording can be read and tested on its own.
 */
import type { UnitPreference } from '../../../shared/api-types';
import { recipeCautions, standardCautionsFor, type Caution } from '../../../shared/cautions';
import { computeRecipe } from '../../../shared/recipe-computations';
import type { RecipeContext } from '../../../shared/recipe-context';
import type { RecipeVersionDto, SignatureDto } from '../../../shared/recipe-types';
import type { HardnessWindow } from '../../../shared/schemas/stock';
import { markedMaximumText } from '../../../shared/spindle-speed';
import { MOTION_SETTINGS_NOT_GIVEN, motionSettingRows, motionSettingsMissing } from '../../../shared/motion-settings';
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
} from '../../../shared/vocabulary';
import type { Row } from './layout';

const MEANING_LABELS: Record<SignatureDto['meaning'], string> = { approved: 'Approved', withdrawn: 'Withdrawn' };

export interface SheetSignature {
  name: string;
  meaning: string;
  /** "2026-12-01 14:03 UTC". */
  signedAt: string;
  /** First 16 hex characters of the signed content's SHA-256. */
  hash: string;
  comment: string;
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
  scope: Row[];
  parameters: Row[];
  clamping: Row[];
  coolant: Row[];
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

/** "2026-12-01 14:03 UTC" from an ISO instant. */
export function utcMinute(iso: string | Date): string {
  const s = (typeof iso === 'string' ? new Date(iso) : iso).toISOString();
  return `${s.slice(0, 10)} ${s.slice(11, 16)} UTC`;
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

export interface SheetInput {
  version: RecipeVersionDto;
  context: RecipeContext;
  labName: string;
  units: UnitPreference;
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
  const effective = v.workflow?.effectiveFrom ?? '—';

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
  const entry =
    c.cutting.entryFeedMmS !== null
      ? `${formatQuantity(c.cutting.entryFeedMmS, 'feed', units)}${c.cutting.entryLengthMm !== null ? ` for the first ${len(c.cutting.entryLengthMm)}` : ''}`
      : null;

  const parameters: Row[] = [
    { label: 'Machine', value: machine ? `${machine.name} (${MACHINE_CLASS_LABELS[machine.machineClass]})` : '—' },
    { label: 'Wheel', value: wheel ? wheel.name : '—', strong: true },
    { label: 'Specification (ISO 525)', value: wheel ? wheel.specification : '—', strong: true },
    {
      label: 'Wheel size',
      value: wheel ? `Ø ${len(wheel.diameterMm)} × ${len(wheel.thicknessMm)}, bore ${len(wheel.boreMm)}` : '—',
    },
    {
      label: 'Restrictions marked on the wheel',
      value: wheel ? (wheel.restrictions.length ? wheel.restrictions.map((r) => WHEEL_RESTRICTION_LABELS[r]).join('; ') : 'None marked') : '—',
      strong: !!wheel?.restrictions.length,
    },
    {
      label: 'Marked maximum speed',
      value: computed.markedMaximum ? markedMaximumText(computed.markedMaximum, units) : '—',
      note: 'As marked on the wheel — never exceed it.',
    },
    {
      label: 'Wheel speed',
      value: formatQuantity(c.cutting.wheelRpm, 'rpm', units),
      strong: true,
      // Beside the rpm in large type: the wheel's marked maximum in whole rpm, or the machine's spindle limit where lower.
      ...(computed.neverAboveRpm !== null ? { callout: `never above ${computed.neverAboveRpm} rpm on this machine` } : {}),
    },
    ...(computed.spindleOverspeed
      ? [
          {
            label: 'Machine top speed',
            value: `${formatQuantity(computed.spindleOverspeed.topRpm, 'rpm', units)} — ABOVE the wheel's marked maximum: check the speed setting before every start`,
            strong: true,
          } satisfies Row,
        ]
      : []),
    { label: 'Peripheral speed', value: speed, note: 'Computed at the new wheel diameter.' },
    {
      label: 'Margin to marked maximum',
      value: overMax ? `${formatQuantity(-computed.speedMarginMs!, 'speed', units)} ABOVE the marked maximum — do not run` : margin,
      strong: overMax,
    },
    { label: 'Feed', value: formatQuantity(c.cutting.feedMmS, 'feed', units), strong: true },
    ...(entry ? [{ label: 'Entry feed', value: entry, strong: true } satisfies Row] : []),
    { label: 'Cut motion', value: CUT_MOTION_LABELS[c.cutting.cutMotion], strong: true },
    // The motion's own settings, what the operator sets for it; older content has none: "not given".
    ...motionSettingRows(c, units).map((r): Row => ({ label: r.label, value: r.value, strong: true })),
    ...(motionSettingsMissing(c) ? [{ label: 'Motion settings', value: MOTION_SETTINGS_NOT_GIVEN } satisfies Row] : []),
    { label: 'Passes', value: c.cutting.passes === null ? 'Single cut' : String(c.cutting.passes) },
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

  const coolant: Row[] = [{ label: 'Coolant', value: COOLANT_TYPE_LABELS[c.coolant.type], strong: true }];
  if (c.coolant.concentrationPct !== null) coolant.push({ label: 'Concentration', value: `${num(c.coolant.concentrationPct)} % v/v` });
  if (c.coolant.flowLMin !== null) coolant.push({ label: 'Flow', value: `${num(c.coolant.flowLMin)} L/min` });

  const signatures = (v.workflow?.signatures ?? []).map((s) => ({
    name: s.signerName,
    meaning: MEANING_LABELS[s.meaning],
    signedAt: utcMinute(s.signedAt),
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
    reviewDueOn: v.workflow?.reviewDueOn ?? '—',
    checkCode: input.checkCode,
    checkUrl: input.checkUrl,
    scope,
    parameters,
    clamping,
    coolant,
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
