/**
 * Recipe checks: rules run on every change, in the editor and on the server.
 * Types first; the rules follow below. Each rule has a stable id (stored with results and
 * referred to by approvers), a severity, a message with the numbers that triggered it, the
 * reason with its source, and the path of the field to fix. The checks flag known problems;
 * passing them does not make a setup safe.
 */
import type { RecipeContext } from './recipe-context';
import { computeRecipe, type RecipeComputed } from './recipe-computations';
import type { RecipeContent } from './schemas/recipe';
import type { HardnessWindow } from './schemas/stock';
import {
  CLAMPING_METHOD_LABELS,
  COOLANT_TYPE_LABELS,
  COOLANT_TYPES,
  CUT_MOTION_LABELS,
  MACHINE_CLASS_LABELS,
  MATERIAL_GROUP_LABELS,
  METALLIC_GROUPS,
  type MaterialGroup,
  type MachineClass,
  type WheelKind,
} from './vocabulary';
import { maxRpmForWheel } from './peripheral-speed';
import { describeCeilingBand, plungeFeedCeiling } from './feed-ceilings';
import { describeWindow, pointWindow, usableWindow } from './hardness-bands';
import { GRADE_ORDER, tableAbrasives, tableGrades } from './selection-table';
import { ABRASIVE_FAMILY_LABELS, abrasiveFamily, gradeBand, parseWheelSpec, type AbrasiveFamily, type WheelSpecResult } from './wheel-spec';
import { CAPACITY_LIMIT_RULES } from './capacity';
import { flangeTooSmall, minFlangeDiameterMm } from './flange';
import { spindleOverspeed } from './spindle-speed';
import { wheelSafetyStandard, wheelStandards } from './wheel-standards';
import { formatQuantity } from './units';
import { motorShareText } from './cutting-power';
import { MOTION_CHECK_IDS, motionSettingChecks } from './motion-checks';

/** blocker: cannot be submitted; warning: the approver must acknowledge it; note: for information. */
export type CheckSeverity = 'blocker' | 'warning' | 'note';

export interface CheckResult {
  /** Stable rule id, e.g. "wheel-overspeed". */
  id: string;
  severity: CheckSeverity;
  /** Plain words, with the numbers that triggered it. */
  message: string;
  /** Why the rule exists, with its source (standard, or "common practice"). */
  reason: string;
  /** Dotted path of the field to fix in the content, e.g. "cutting.wheelRpm"; null for the whole recipe. */
  path: string | null;
}

/** Water-soluble coolant concentration range, % v/v (common practice). */
export const COOLANT_CONCENTRATION_PCT = { min: 2, max: 5 } as const;

/**
 * Feed above which a heat-sensitive material gets a warning, mm/s. Kerfbook's threshold
 * (common practice): the low end of the typical feed ranges (abrasive cut-off
 * 0.05–1.0 mm/s, precision saw 0.005–0.2 mm/s; common practice).
 */
export const HEAT_SENSITIVE_FEED_MMS: Record<MachineClass, number> = {
  'bench-abrasive': 0.25,
  'floor-abrasive': 0.25,
  'large-traverse': 0.25,
  precision: 0.05,
};

/** A rim wheel running below this share of the rpm it could run at gets the "lower rpm only helps consumable wheels" note. */
export const RIM_LOW_RPM_SHARE = 0.75;

const SOURCE = {
  /** The marked speed binds bonded wheels under EN 12413 and diamond or CBN rim wheels under EN 13236 (see wheel-standards.ts). */
  mos: (kind: WheelKind | undefined) =>
    `Never run a wheel above the maximum operating speed marked on it (${wheelStandards(kind)}; OSHA 29 CFR 1910.215(d)(1)).`,
  machine: "The machine's manual sets its speed, feed and wheel ranges; outside them its guards, drives and controls are not made for the job.",
} as const;

const n1 = (v: number) => v.toFixed(1);
/** A length rounded up to whole mm: a wheel at least this big (rounding down would be too small). */
const wholeMmUp = (v: number) => String(Math.ceil(v - 1e-9));
/** A vocabulary label in lower case; an id the vocabulary does not know (older stored content) reads as itself. */
const lowerLabel = (labels: Readonly<Record<string, string>>, id: unknown): string =>
  (Object.hasOwn(labels, String(id)) ? labels[String(id)]! : String(id)).toLowerCase();

interface Facts {
  content: RecipeContent;
  ctx: RecipeContext;
  computed: RecipeComputed;
  /** Abrasive family from the wheel's marking, or null when it does not parse. */
  abrasive: AbrasiveFamily | null;
  /** The wheel's marking as parsed, or null without a wheel. */
  marking: WheelSpecResult | null;
  group: MaterialGroup | null;
  /** The scope's hardness window, else the material's reading; null when neither is usable. */
  hardness: HardnessWindow | null;
  /** The coating's hardness of a coated material, or null. */
  coating: HardnessWindow | null;
}

type Rule = (f: Facts) => CheckResult | CheckResult[] | null;

const result = (id: string, severity: CheckSeverity, path: string | null, message: string, reason: string): CheckResult => ({
  id,
  severity,
  message,
  reason,
  path,
});

const isPositive = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v) && v > 0;

/**
 * Estimated peak cutting power against the machine's motor: a warning above the lab's share
 * of it, a note when the machine record has no motor power (the check cannot be made).
 */
function cuttingPowerCheck({ ctx, computed }: Facts): CheckResult | null {
  const p = computed.cutPower;
  const m = ctx.machine;
  if (!m || !p || p.peakPowerW === null) return null;
  const power = (w: number) => formatQuantity(w, 'power', 'metric');
  const estimate = `${power(p.peakPowerW)} at ${p.specificEnergyJMm3} J/mm³`;
  if (p.motorPowerW === null || p.motorSharePct === null)
    return result(
      'motor-power-unknown',
      'note',
      'cutting.machineId',
      `The motor power of ${m.name} is not recorded, so the estimated peak cutting power (${estimate}) is not checked against it.`,
      "Record the motor's rated power on the machine to have the cutting power checked against it.",
    );
  if (p.motorSharePct <= p.warningSharePct) return null;
  return result(
    'cutting-power-high',
    'warning',
    'cutting.feedMmS',
    `The estimated peak cutting power (${estimate}) is ${motorShareText(p)} of ${m.name}; the lab warns above ${p.warningSharePct} %. Lower the feed, or shorten the contact with a rocking, pulsed or stepped cut.`,
    "Cutting power ≈ removal rate × specific cutting energy (Malkin & Guo, Grinding Technology, 2nd ed.); the energy per material group is an order-of-magnitude lab setting. Near the motor's limit the wheel slows, the cut heats up and the wheel can stall or jam (common practice).",
  );
}

/** A number as typed: whole numbers without decimals, others to at most two. */
const num = (v: number) => String(Number(v.toFixed(2)));

/**
 * The machine can turn the wheel above its marked maximum: its top speed, or the speed limit
 * set on its spindle, is above the marking at the wheel's new diameter. Whatever rpm the
 * recipe names, the spindle can reach that speed (a knob turned, a setting lost).
 */
function machineCanOverspeedWheel({ ctx }: Facts): CheckResult | null {
  const { machine: m, wheel: w } = ctx;
  if (!m || !w || !isPositive(w.diameterMm) || !isPositive(m.rpmMax)) return null;
  const over = spindleOverspeed(m, w);
  if (!over) return null;
  const reaches = over.limited
    ? `${m.name} is limited to ${num(over.topRpm)} rpm (set by ${m.spindleLimitSetBy || 'an unnamed person'})`
    : `${m.name} reaches ${num(over.topRpm)} rpm`;
  const against =
    w.maxSpeedMarkedIn === 'rpm'
      ? `, above the ${num(w.maxSpeedRpm)} rpm marked on the ${w.diameterMm} mm wheel "${w.name}"`
      : `: ${n1(over.speedAtTopMs)} m/s at the new diameter of the ${w.diameterMm} mm wheel "${w.name}", above the ${num(w.maxSpeedMs)} m/s marked on it (${over.wheelMaxRpm} rpm)`;
  return result(
    'machine-can-overspeed-wheel',
    'blocker',
    'cutting.wheelId',
    `${reaches}${against}. Have a spindle speed limit at or below ${over.wheelMaxRpm} rpm set and recorded on the machine, or choose a wheel marked for the machine's top speed.`,
    `The machine's spindle speed is checked before a wheel is mounted: it must not be able to exceed the maximum operating speed marked on the wheel (OSHA 29 CFR 1910.215(d)(1); ${wheelStandards(w.kind)}). The recipe's rpm does not stop the spindle from reaching its top speed.`,
  );
}

/** A recipe rpm above the speed limit set on the machine's spindle cannot be run there. */
function rpmAboveSpindleLimit({ content, ctx }: Facts): CheckResult | null {
  const m = ctx.machine;
  const rpm = content.cutting?.wheelRpm;
  if (!m || typeof m.spindleLimitRpm !== 'number' || !isPositive(rpm) || rpm <= m.spindleLimitRpm) return null;
  return result(
    'rpm-above-spindle-limit',
    'blocker',
    'cutting.wheelRpm',
    `${rpm} rpm is above the spindle speed limit of ${num(m.spindleLimitRpm)} rpm set on ${m.name}${m.spindleLimitSetBy ? ` (${m.spindleLimitSetBy})` : ''}.`,
    "The limit keeps the spindle within the marked speed of the wheels the machine takes; a recipe stays within it (the machine record; the machine's manual).",
  );
}

/** The machine's flange is too small for the wheel: cut-off wheels need at least a quarter of the wheel diameter (see flange.ts). */
function flangeTooSmallForWheel({ ctx }: Facts): CheckResult | null {
  const { machine: m, wheel: w } = ctx;
  if (!m || !w || !isPositive(w.diameterMm) || !isPositive(m.flangeDiameterMm) || !flangeTooSmall(m.flangeDiameterMm, w.diameterMm)) return null;
  const rim = w.kind === 'rim';
  return result(
    'flange-too-small',
    'blocker',
    'cutting.wheelId',
    `The flanges of ${m.name} are ${num(m.flangeDiameterMm)} mm; a ${w.diameterMm} mm cut-off wheel needs flanges of at least ${n1(minFlangeDiameterMm(w.diameterMm))} mm (a quarter of its diameter).`,
    `Flanges keep the clamping and driving forces away from the bore, where a turning wheel's stresses are highest. Cut-off wheels are mounted between flanges of at least one-fourth of the wheel diameter (ANSI B7.1; OSHA 29 CFR 1910.215(c)(1) asks one-third of most other wheels)${rim ? `; for diamond and CBN rim wheels the wheel maker states the flange (${wheelSafetyStandard(w.kind)}) and Kerfbook keeps the same floor` : ''}.`,
  );
}

/** Dry cutting with a wheel marked for wet use only: a restriction marked on the wheel binds like its marked speed. */
function wetUseOnlyCutDry({ content, ctx }: Facts): CheckResult | null {
  const w = ctx.wheel;
  if (!w || content.coolant?.type !== 'dry' || !Array.isArray(w.restrictions) || !w.restrictions.includes('wet-use-only')) return null;
  return result(
    'wet-use-only-dry',
    'blocker',
    'coolant.type',
    `"${w.name}" is marked for wet use only, and the recipe cuts dry.`,
    `A restriction of use marked on the wheel binds like its marked speed: the maker rated the wheel for wet cutting only (restriction marks of ${wheelSafetyStandard(w.kind)}, from memory; ANSI B7.1: use wheels only as their maker allows).`,
  );
}

// Wheel against material, contact, clamping and coolant. Each rule is its own function; the
// selection-table rules read the lab's table (ctx.selectionRows), so the editor and the
// server agree as long as both build it with selectionRowsWithWheels.

/** A marking the parser cannot read is said, not skipped in silence: the abrasive and bond checks need it. */
function wheelMarkingUnparsed({ ctx, marking }: Facts): CheckResult | null {
  const w = ctx.wheel;
  if (!w || !marking || marking.ok) return null;
  return result(
    'wheel-marking-unparsed',
    'note',
    'cutting.wheelId',
    `The marking "${String(w.specification)}" of the wheel "${w.name}" could not be read (${marking.error}) The abrasive and bond checks skip this wheel: compare it with the lab's selection table by hand.`,
    'Kerfbook reads wheel markings in the ISO 525 field order (abrasive, grit, grade, structure, bond) and the usual diamond and CBN marking; correct the marking in Stock if it was mistyped.',
  );
}

/**
 * The abrasive against the lab's table: the families the table gives the group on wheels
 * of the same kind. Rim wheels on metal and bonded wheels on ceramics or carbides have
 * their own rules above, so they are left to those.
 */
function wheelAbrasiveUnsuited({ ctx, abrasive, group }: Facts): CheckResult | null {
  const w = ctx.wheel;
  if (!w || !abrasive || !group || (w.kind !== 'bonded' && w.kind !== 'rim')) return null;
  if (w.kind === 'rim' && METALLIC_GROUPS.includes(group)) return null;
  const offered = tableAbrasives(ctx.selectionRows ?? [], group, w.kind);
  if (offered.length === 0 || offered.includes(abrasive)) return null;
  const names = offered.map((a) => ABRASIVE_FAMILY_LABELS[a].toLowerCase()).join(' or ');
  return result(
    'wheel-abrasive-unsuited',
    'warning',
    'cutting.wheelId',
    `A ${ABRASIVE_FAMILY_LABELS[abrasive].toLowerCase()} wheel is chosen for ${lowerLabel(MATERIAL_GROUP_LABELS, group)}; the lab's selection table gives ${names} for this group.`,
    "Aluminium oxide cuts steels, cast irons and nickel and cobalt alloys, which wear silicon carbide chemically at cutting heat; silicon carbide cuts aluminium, copper and titanium, which load alumina (common practice; ASTM E3 from memory). The lab's selection table says which abrasive it uses for each group.",
  );
}

/**
 * The bond's grade against the lab's table: the grade bands (ISO 525 letters A soft … Z
 * hard; up to K soft, L–O medium, P and up hard) of the table's bonded wheels for the
 * group at this hardness, and at the coating's for a coated part. Harder material, softer
 * bond (common practice; ASTM E3 from memory).
 */
function wheelBondUnsuited({ ctx, marking, group, hardness, coating }: Facts): CheckResult | null {
  const w = ctx.wheel;
  if (!w || w.kind !== 'bonded' || !group || !marking?.ok || marking.spec.type !== 'conventional') return null;
  const grades = tableGrades(ctx.selectionRows ?? [], group, hardness, coating);
  if (!grades) return null;
  const band = gradeBand(marking.spec.grade);
  const tooHard = GRADE_ORDER[band] > GRADE_ORDER[grades.hardest];
  const tooSoft = GRADE_ORDER[band] < GRADE_ORDER[grades.softest];
  if (!tooHard && !tooSoft) return null;
  const at = [hardness ? `at ${describeWindow(hardness)}` : '', coating ? `coating ${describeWindow(coating)}` : ''].filter(Boolean).join(', ');
  const given = grades.softest === grades.hardest ? `a ${grades.softest} bond` : `${grades.softest} to ${grades.hardest} bonds`;
  const what = `${lowerLabel(MATERIAL_GROUP_LABELS, group)}${at ? ` ${at}` : ''}`;
  if (tooHard)
    return result(
      'wheel-bond-too-hard',
      'warning',
      'cutting.wheelId',
      `The wheel's grade ${marking.spec.grade} is a ${band} bond; the lab's selection table gives ${given} for ${what}. Too hard a bond holds its worn grains: the wheel glazes, rubs and burns the part.`,
      "Harder material, softer bond: a soft bond releases worn grains so fresh ones keep cutting (common practice; ASTM E3 from memory; grades after ISO 525, A soft … Z hard). The bands come from the lab's selection table.",
    );
  return result(
    'wheel-bond-too-soft',
    'warning',
    'cutting.wheelId',
    `The wheel's grade ${marking.spec.grade} is a ${band} bond; the lab's selection table gives ${given} for ${what}. Too soft a bond sheds grains that are still sharp: the wheel wears fast and the cut wanders.`,
    "Softer material, harder bond: a hard bond holds its grains while they still cut (common practice; ASTM E3 from memory; grades after ISO 525, A soft … Z hard). The bands come from the lab's selection table.",
  );
}

/** A traverse pass: its removal per mm of wheel width (Q'w = removal rate / wheel thickness) against the lab's ceiling for the group. */
function traverseRemovalAboveCeiling({ content, ctx, computed, group }: Facts): CheckResult | null {
  if (content.cutting?.cutMotion !== 'traverse-pass' || !group) return null;
  const ceilings = ctx.limits?.traverseRemovalCeilings ?? {};
  const ceiling = Object.hasOwn(ceilings, group) ? ceilings[group] : undefined;
  const thickness = ctx.wheel?.thicknessMm;
  const peak = computed.peakRemovalMm3S;
  if (!isPositive(ceiling) || !isPositive(thickness) || !isPositive(peak)) return null;
  const perMm = peak / thickness;
  if (perMm <= ceiling) return null;
  return result(
    'traverse-removal-above-ceiling',
    'warning',
    'cutting.feedMmS',
    `The traverse pass removes ${n1(perMm)} mm³/s per mm of wheel width (${n1(peak)} mm³/s over a ${thickness} mm wheel), above the lab's ceiling of ${ceiling} mm³/s per mm for ${lowerLabel(MATERIAL_GROUP_LABELS, group)}. Lower the crossing feed or take more, shallower passes.`,
    "A traverse pass crosses fast over a short contact, so it is judged by its specific removal rate Q'w = removal rate / wheel width (the grinding measure, e.g. Malkin & Guo, Grinding Technology — from memory), not by the plunge-feed ceilings. The ceiling is a lab setting.",
  );
}

/** A straight plunge through a long contact: the lab's length, against the longest contact along the cut. */
function longPlungeContact({ content, ctx, computed }: Facts): CheckResult | null {
  const limit = ctx.limits?.longContactMm;
  if (content.cutting?.cutMotion !== 'straight-plunge' || !isPositive(limit) || !computed.profile) return null;
  const longest = computed.profile.reduce((m, p) => Math.max(m, p.contactMm), 0);
  if (!(longest > limit)) return null;
  return result(
    'long-plunge-contact',
    'note',
    'cutting.cutMotion',
    `A straight plunge meets up to ${n1(longest)} mm of material at once, more than the lab's ${limit} mm. A pulsed plunge, rocking, stepped depth or traverse passes keep the contact short.`,
    'Along a long contact the coolant cannot reach the middle of the cut: the wheel heats, glazes and burns the part. Motions that shorten the contact cut cooler (common practice; the length is a lab setting).',
  );
}

/**
 * Clamped on one side of the cut only. No warning where one side is the usual way: a part
 * mounted in wax or adhesive (the mount holds both pieces), or a rim wheel on a precision saw.
 */
function clampingOneSide({ content, ctx }: Facts): CheckResult | null {
  const c = content.clamping;
  if (!c || c.bothSides !== false || c.method === 'adhesive-wax-mount') return null;
  if (ctx.wheel?.kind === 'rim' && ctx.machine?.machineClass === 'precision') return null;
  return result(
    'clamping-one-side',
    'warning',
    'clamping.bothSides',
    'The part is clamped on one side of the cut only: the offcut can drop or swing into the wheel and pinch it.',
    'Clamp both sides of the cut so the offcut cannot drop or close on the wheel; a pinched abrasive wheel can break (common practice).',
  );
}

/** A coolant chosen with no flow runs the cut dry. */
function coolantFlowZero({ content }: Facts): CheckResult | null {
  const c = content.coolant;
  if (!c || c.type === 'dry' || !COOLANT_TYPES.includes(c.type) || c.flowLMin !== 0) return null;
  return result(
    'coolant-flow-zero',
    'warning',
    'coolant.flowLMin',
    `${COOLANT_TYPE_LABELS[c.type]} is chosen, but its flow is 0 L/min: the cut runs dry.`,
    'Without flow the coolant neither cools nor clears the swarf: the part burns and the wheel loads, as in a dry cut (common practice). Give the flow the machine delivers, or choose dry cutting and its checks.',
  );
}

/** A coated part whose wheel leaves through the coating. */
function wheelExitsCoating({ content, ctx }: Facts): CheckResult | null {
  const mat = ctx.material;
  const path = content.clamping?.wheelPath;
  if (!mat?.coated || (path !== 'exits-coating' && path !== 'enters-and-exits-coating')) return null;
  const how =
    path === 'exits-coating'
      ? 'Turn the part so the wheel enters through the coating.'
      : 'Cut from both sides towards the middle, or turn the part as it is cut, so the wheel enters through the coating each time.';
  return result(
    'wheel-exits-coating',
    'warning',
    'clamping.wheelPath',
    `The wheel leaves the part through its coating (${mat.name}): that peels the coating off the substrate. ${how}`,
    'Cut so the wheel presses the coating onto the substrate (enters through the coating); where it leaves through the coating it lifts it and the interface is no longer the one to examine (common practice).',
  );
}

/** The rules, in the order they are reported within a severity. */
const RULES: readonly Rule[] = [
  ({ ctx }) =>
    ctx.machine
      ? null
      : result('machine-missing', 'blocker', 'cutting.machineId', 'No machine is chosen.', 'Speeds, feeds and capacity can only be checked against a machine.'),
  ({ ctx }) =>
    ctx.wheel
      ? null
      : result(
          'wheel-missing',
          'blocker',
          'cutting.wheelId',
          'No wheel is chosen.',
          'The wheel sets the speed limit, the capacity and the suitability for the material.',
        ),

  ({ content, ctx, computed }) => {
    const { peripheralSpeedMs: v, markedMaxSpeedMs: max, markedMaximum: marked, rpmAtMarkedMax } = computed;
    if (v === null || max === null || marked === null) return null;
    // Compared against the figure marked on the wheel, in its own unit.
    if (marked.maxSpeedMarkedIn === 'rpm') {
      const rpm = content.cutting.wheelRpm;
      if (rpm <= marked.maxSpeedRpm) return null;
      return result(
        'wheel-overspeed',
        'blocker',
        'cutting.wheelRpm',
        `${rpm} rpm is above its marked maximum of ${num(marked.maxSpeedRpm)} rpm (at ${ctx.wheel!.diameterMm} mm the wheel would run at ${n1(v)} m/s). Use at most ${rpmAtMarkedMax} rpm.`,
        SOURCE.mos(ctx.wheel?.kind),
      );
    }
    if (v <= max) return null;
    return result(
      'wheel-overspeed',
      'blocker',
      'cutting.wheelRpm',
      `At ${ctx.wheel!.diameterMm} mm the wheel would run at ${n1(v)} m/s, above its marked maximum of ${n1(max)} m/s. Use at most ${rpmAtMarkedMax} rpm.`,
      SOURCE.mos(ctx.wheel?.kind),
    );
  },

  machineCanOverspeedWheel,
  rpmAboveSpindleLimit,
  flangeTooSmallForWheel,
  wetUseOnlyCutDry,

  ({ content, ctx }) => {
    const m = ctx.machine;
    const rpm = content.cutting?.wheelRpm;
    if (!m || !isPositive(rpm) || (rpm >= m.rpmMin && rpm <= m.rpmMax)) return null;
    const range = m.rpmMin === m.rpmMax ? `its fixed ${m.rpmMin} rpm` : `its range of ${m.rpmMin}–${m.rpmMax} rpm`;
    return result('rpm-outside-machine', 'blocker', 'cutting.wheelRpm', `${rpm} rpm is outside ${range} on ${m.name}.`, SOURCE.machine);
  },

  ({ content, ctx }) => {
    const m = ctx.machine;
    const feed = content.cutting?.feedMmS;
    if (!m || !isPositive(feed) || (feed >= m.feedMinMmS && feed <= m.feedMaxMmS)) return null;
    return result(
      'feed-outside-machine',
      'blocker',
      'cutting.feedMmS',
      `A feed of ${feed} mm/s is outside the range of ${m.name} (${m.feedMinMmS}–${m.feedMaxMmS} mm/s).`,
      SOURCE.machine,
    );
  },

  ({ content, ctx }) => {
    const m = ctx.machine;
    const feed = content.cutting?.entryFeedMmS;
    if (!m || !isPositive(feed) || (feed >= m.feedMinMmS && feed <= m.feedMaxMmS)) return null;
    return result(
      'entry-feed-outside-machine',
      'blocker',
      'cutting.entryFeedMmS',
      `An entry feed of ${feed} mm/s is outside the range of ${m.name} (${m.feedMinMmS}–${m.feedMaxMmS} mm/s).`,
      SOURCE.machine,
    );
  },

  ({ ctx }) => {
    const { machine: m, wheel: w } = ctx;
    if (!m || !w || (w.diameterMm >= m.wheelDiameterMinMm && w.diameterMm <= m.wheelDiameterMaxMm)) return null;
    return result(
      'wheel-diameter-outside-machine',
      'blocker',
      'cutting.wheelId',
      `The wheel is ${w.diameterMm} mm; ${m.name} takes ${m.wheelDiameterMinMm}–${m.wheelDiameterMaxMm} mm wheels.`,
      `A wheel the machine is not made for may not fit its guard or flanges (the machine's manual; ${wheelStandards(w.kind)}).`,
    );
  },

  ({ content, computed }) => {
    if (computed.capacityFits !== false || computed.capacityLimit === null) return null;
    const limit = computed.capacityLimit;
    const { sizeMaxMm: size, widthMm: width, wallMm: wall } = content.scope;
    const cuttable = n1(computed.cuttableSizeMm!);
    const depth = n1(computed.cuttingDepthMm!);
    const message = {
      radius: `The largest part (${size} mm) is more than the wheel can cut on this machine with ${lowerLabel(CUT_MOTION_LABELS, content.cutting.cutMotion)} (${cuttable} mm: cutting depth ${depth} mm).`,
      chord: `The largest section (${size} mm high, ${width} mm wide) is more than the wheel can cut through coming down into it: at ${width} mm wide its edge reaches the bottom corners only through sections up to ${cuttable} mm high.`,
      'turned-to-centre': `The largest bar (${size} mm) is more than the wheel can cut turning it: it reaches the centre of bars up to ${cuttable} mm (cutting depth ${depth} mm).`,
      'turned-through-wall': `The tube's wall (${wall} mm) is more than the wheel can cut turning it: it reaches through walls up to ${cuttable} mm.`,
    }[limit];
    const smallest = computed.smallestWheelForScopeMm;
    return result(
      'scope-exceeds-capacity',
      'blocker',
      limit === 'turned-through-wall' ? 'scope.wallMm' : 'scope.sizeMaxMm',
      smallest !== null && Number.isFinite(smallest) ? `${message} A wheel of at least ${wholeMmUp(smallest)} mm would cut it on this machine.` : message,
      CAPACITY_LIMIT_RULES[limit],
    );
  },

  ({ content, computed }) => {
    const worn = computed.wornWheel;
    if (computed.capacityFits !== true || computed.capacityLimit === null || worn?.capacityFits !== false || worn.diameterMm === null) return null;
    const limit = computed.capacityLimit;
    const what = limit === 'turned-through-wall' ? `the tube's wall (${content.scope.wallMm} mm)` : `the largest part (${content.scope.sizeMaxMm} mm)`;
    const from =
      worn.source === 'lab-default' && worn.labShare !== null
        ? `${Math.round(worn.labShare * 100)} % of the new diameter, the lab's default`
        : "the wheel's record";
    const smallest = computed.smallestWheelForScopeMm;
    const replace = smallest !== null && Number.isFinite(smallest) ? ` Replace the wheel before it wears below ${wholeMmUp(smallest)} mm.` : '';
    return result(
      'scope-exceeds-worn-capacity',
      'warning',
      limit === 'turned-through-wall' ? 'scope.wallMm' : 'scope.sizeMaxMm',
      `The scope fits only a wheel that is not yet worn: at its smallest usable diameter of ${n1(worn.diameterMm)} mm (${from}) this wheel cuts ${n1(worn.cuttableSizeMm!)} mm, less than ${what}.${replace}`,
      'A consumable wheel shrinks as it cuts; once worn, a cut that fits only a newer wheel stops short or brings the flange against the part (common practice). Kerfbook warns rather than blocks: a new wheel cuts the scope, and a lab that changes wheels in time never meets the limit.',
    );
  },

  ({ content }) =>
    content.clamping?.method
      ? null
      : result(
          'clamping-missing',
          'blocker',
          'clamping.method',
          'No clamping method is given.',
          'The part must not move during the cut: a moving part can break the wheel (common practice).',
        ),

  ({ content, ctx }) => {
    const method = content.clamping?.method;
    const m = ctx.machine;
    if (!m || !method || m.clampingMethods.includes(method)) return null;
    return result(
      'clamping-unsupported',
      'blocker',
      'clamping.method',
      `${m.name} has no ${lowerLabel(CLAMPING_METHOD_LABELS, method)}.`,
      "Only the clamping the machine is equipped for holds the part safely (the machine's manual).",
    );
  },

  ({ content, ctx }) => {
    const motion = content.cutting?.cutMotion;
    const m = ctx.machine;
    if (!m || !motion || m.cutMotions.includes(motion)) return null;
    return result(
      'cut-motion-unsupported',
      'blocker',
      'cutting.cutMotion',
      `${m.name} cannot cut with ${lowerLabel(CUT_MOTION_LABELS, motion)}.`,
      "The machine's drives and controls must support the motion (the machine's manual).",
    );
  },

  ({ ctx, abrasive, group }) => {
    const w = ctx.wheel;
    if (!w || w.kind !== 'rim' || !group) return null;
    if (group === 'electronics-mixed')
      return result(
        'rim-wheel-dressing',
        'note',
        'cutting.wheelId',
        'Where the assembly has metal parts, dress the rim wheel with an alumina or silicon carbide stick to keep it cutting.',
        'Metal clogs and dulls a diamond rim wheel; dressing exposes fresh grains (common practice).',
      );
    if (!METALLIC_GROUPS.includes(group)) return null;
    // CBN is the superabrasive for hardened steels: they dull diamond (common practice; ASTM E3 from memory).
    if (abrasive === 'cbn' && group === 'hardened-tool-steel') return null;
    const groupText = MATERIAL_GROUP_LABELS[group].toLowerCase();
    // CBN does not wear out on these metals the way diamond does: softer, ductile metal loads it.
    if (abrasive === 'cbn')
      return result(
        'rim-wheel-on-metal',
        'warning',
        'cutting.wheelId',
        `A CBN rim wheel is chosen for ${groupText}. Softer, ductile metal smears into the rim and loads (clogs) it: the wheel stops cutting, rubs and heats the part. Use a consumable bonded wheel; keep the CBN rim wheel for hardened steels.`,
        'A loaded superabrasive rim rubs instead of cutting; CBN is meant for hardened steels, which it cuts without loading (common practice; ASTM E3 from memory).',
      );
    const what = abrasive === 'diamond' ? 'A diamond rim wheel' : 'A diamond or CBN rim wheel';
    return result(
      'rim-wheel-on-metal',
      'warning',
      'cutting.wheelId',
      `${what} is chosen for ${groupText}, which is mostly metal. Use a consumable bonded wheel; where only a small part of the specimen is metal, dress the rim wheel with an alumina or silicon carbide stick.`,
      'Rim wheels wear out quickly on metals: aluminium oxide suits ferrous metals and nickel and cobalt alloys, silicon carbide the other non-ferrous metals (common practice).',
    );
  },

  ({ ctx, abrasive, group }) => {
    const w = ctx.wheel;
    if (!w || w.kind !== 'bonded' || (group !== 'ceramic-glass' && group !== 'cemented-carbide')) return null;
    if (abrasive === 'diamond' || abrasive === 'cbn') return null;
    return result(
      'bonded-wheel-on-hard-brittle',
      'warning',
      'cutting.wheelId',
      `A bonded ${abrasive ? `${ABRASIVE_FAMILY_LABELS[abrasive].toLowerCase()} ` : ''}wheel is chosen for ${MATERIAL_GROUP_LABELS[group].toLowerCase()}. A diamond rim wheel cuts these with less damage.`,
      'Ceramics and cemented carbides are cut with diamond rim wheels; conventional abrasives cut slowly and crack or chip them (common practice).',
    );
  },

  ({ content, ctx }) => {
    const w = ctx.wheel;
    if (!w || content.coolant?.type !== 'dry') return null;
    if (w.kind !== 'bonded' && w.dryAllowed) return null;
    const why = w.kind === 'bonded' ? 'a consumable bonded wheel' : 'a wheel whose maker does not allow dry cutting';
    return result(
      'dry-cut-burn-risk',
      'warning',
      'coolant.type',
      `Cutting dry with ${why}: the part may burn.`,
      'Coolant carries the heat away; dry abrasive cutting overheats the part and changes its structure (common practice).',
    );
  },

  ({ content, ctx, group, hardness }) => {
    const feed = content.cutting?.feedMmS;
    const m = ctx.machine;
    // A traverse pass is judged by its removal per mm of wheel width (traverseRemovalAboveCeiling).
    if (!group || !m || !isPositive(feed) || content.cutting.cutMotion === 'traverse-pass') return null;
    const applied = plungeFeedCeiling(ctx.limits?.feedCeilings ?? [], group, m.machineClass, hardness);
    if (!applied || feed <= applied.maxFeedMmS) return null;
    const band =
      applied.basis === 'band'
        ? describeCeilingBand(applied.row)
        : applied.basis === 'no-hardness'
          ? 'no hardness given, so the lowest of the group applies'
          : `${describeWindow(hardness!)} is in none of the lab's bands, so the lowest of the group applies`;
    return result(
      'feed-above-ceiling',
      'warning',
      'cutting.feedMmS',
      `A feed of ${feed} mm/s is above the lab's ceiling of ${applied.maxFeedMmS} mm/s for ${lowerLabel(MATERIAL_GROUP_LABELS, group)} (${band}) on a ${lowerLabel(MACHINE_CLASS_LABELS, m.machineClass)} saw.`,
      'Too high a feed burns the part; harder material and precision saws need lower feeds. Start low and raise it with experience (common practice; the ceilings are lab settings per material group, hardness band and machine class).',
    );
  },

  ({ content, ctx }) => {
    const mat = ctx.material;
    if (!mat) return null;
    // A coated part needs the structured choice of where the wheel enters and leaves; content
    // stored before that field existed has no key, which reads as "not given".
    if (mat.coated && !content.clamping?.wheelPath)
      return result(
        'orientation-rule-missing',
        'warning',
        'clamping.wheelPath',
        `${mat.name} is coated, but the recipe does not say where the wheel enters and leaves it.`,
        'Cut so the wheel enters through the coating and leaves through the substrate: it presses the coating on rather than peeling it off (common practice).',
      );
    const rule = content.clamping?.orientationRule;
    if (!mat.caseHardened || (typeof rule === 'string' && rule.trim())) return null;
    return result(
      'orientation-rule-missing',
      'warning',
      'clamping.orientationRule',
      `${mat.name} is case-hardened${mat.caseDepthMm ? ` (case ${mat.caseDepthMm} mm)` : ''}, but no orientation rule says which way the wheel enters.`,
      'Cut towards the substrate so the wheel presses the layer on rather than peeling it off (common practice).',
    );
  },

  ({ content, ctx }) => {
    const { wheel: w, machine: m } = ctx;
    const rpm = content.cutting?.wheelRpm;
    // Precision saws turn rim wheels slowly by design (a gentle cut for brittle and delicate
    // specimens), so a low speed there is a choice, not a habit: the note is for abrasive
    // cut-off machines, where slowing down is what one does with a consumable wheel.
    if (!w || !m || w.kind !== 'rim' || m.machineClass === 'precision' || !isPositive(rpm)) return null;
    const ceiling = Math.min(m.rpmMax, maxRpmForWheel(w.diameterMm, w.maxSpeedMs));
    if (rpm >= RIM_LOW_RPM_SHARE * ceiling) return null;
    return result(
      'rim-wheel-low-rpm',
      'note',
      'cutting.wheelRpm',
      `${rpm} rpm is well below the ${ceiling} rpm this rim wheel could run at here. Lowering the speed to cut harder material helps only consumable wheels.`,
      'A slower consumable wheel acts softer and sheds worn grains; a diamond or CBN rim wheel does not (common practice). Not raised on precision saws, which run rim wheels slowly on purpose.',
    );
  },

  ({ content, ctx }) => {
    const { material: mat, machine: m } = ctx;
    const feed = content.cutting?.feedMmS;
    if (!mat?.heatSensitive || !m || !isPositive(feed)) return null;
    const limit = HEAT_SENSITIVE_FEED_MMS[m.machineClass];
    if (feed <= limit) return null;
    return result(
      'heat-sensitive-high-feed',
      'warning',
      'cutting.feedMmS',
      `${mat.name} is heat-sensitive and the feed is ${feed} mm/s, above ${limit} mm/s.`,
      'Heat-sensitive and hardened parts are cut at the low end of the feed range to avoid burning or tempering them (common practice).',
    );
  },

  ({ content, ctx }) => {
    const mat = ctx.material;
    if (!mat?.hazardousDust || content.coolant?.type !== 'dry') return null;
    // A blocker, not a warning: dry cutting sets the dust free, and no acknowledgement makes up for that.
    return result(
      'hazardous-dust-dry',
      'blocker',
      'coolant.type',
      `${mat.name} gives hazardous dust and the recipe cuts it dry.`,
      "Hazardous dusts (e.g. beryllium, OSHA PEL 0.2 µg/m³; lead; fibre composites) are cut wet and enclosed, under the lab's approved procedure for the material.",
    );
  },

  ({ content }) => {
    const c = content.coolant;
    if (c?.type !== 'water-soluble' || c.concentrationPct === null || !Number.isFinite(c.concentrationPct)) return null;
    const { min, max } = COOLANT_CONCENTRATION_PCT;
    if (c.concentrationPct >= min && c.concentrationPct <= max) return null;
    return result(
      'coolant-concentration',
      'note',
      'coolant.concentrationPct',
      `A coolant concentration of ${c.concentrationPct} % is outside the usual ${min}–${max} % v/v.`,
      'Too lean corrodes and breeds bacteria; too rich irritates skin and foams. Follow the coolant supplier (common practice).',
    );
  },

  wheelMarkingUnparsed,
  wheelAbrasiveUnsuited,
  wheelBondUnsuited,
  traverseRemovalAboveCeiling,
  longPlungeContact,
  clampingOneSide,
  coolantFlowZero,
  wheelExitsCoating,

  ({ ctx }) => {
    const out: CheckResult[] = [];
    const reason = 'Archived stock stays readable for old recipes but is no longer offered; check that it is still available at the saw.';
    // One id for the three records; the path says which one.
    if (ctx.material?.archived) out.push(result('stock-archived', 'warning', 'scope.materialId', `The material "${ctx.material.name}" is archived.`, reason));
    if (ctx.wheel?.archived) out.push(result('stock-archived', 'warning', 'cutting.wheelId', `The wheel "${ctx.wheel.name}" is archived.`, reason));
    if (ctx.machine?.archived) out.push(result('stock-archived', 'warning', 'cutting.machineId', `The machine "${ctx.machine.name}" is archived.`, reason));
    return out;
  },

  cuttingPowerCheck,

  // The cut motion's own settings against the recipe's sizes (motion-checks.ts).
  ({ content }) => motionSettingChecks(content),
];

/** Every rule id runChecks can report. */
export const CHECK_IDS = [
  'machine-missing',
  'wheel-missing',
  'wheel-overspeed',
  'machine-can-overspeed-wheel',
  'rpm-above-spindle-limit',
  'flange-too-small',
  'wet-use-only-dry',
  'rpm-outside-machine',
  'feed-outside-machine',
  'entry-feed-outside-machine',
  'wheel-diameter-outside-machine',
  'scope-exceeds-capacity',
  'scope-exceeds-worn-capacity',
  'clamping-missing',
  'clamping-unsupported',
  'cut-motion-unsupported',
  'rim-wheel-dressing',
  'rim-wheel-on-metal',
  'bonded-wheel-on-hard-brittle',
  'dry-cut-burn-risk',
  'feed-above-ceiling',
  'orientation-rule-missing',
  'rim-wheel-low-rpm',
  'heat-sensitive-high-feed',
  'hazardous-dust-dry',
  'coolant-concentration',
  'wheel-marking-unparsed',
  'wheel-abrasive-unsuited',
  'wheel-bond-too-hard',
  'wheel-bond-too-soft',
  'traverse-removal-above-ceiling',
  'long-plunge-contact',
  'clamping-one-side',
  'coolant-flow-zero',
  'wheel-exits-coating',
  'stock-archived',
  'cutting-power-high',
  'motor-power-unknown',
  ...MOTION_CHECK_IDS,
] as const;
export type CheckId = (typeof CHECK_IDS)[number];

const RANK: Record<CheckSeverity, number> = { blocker: 0, warning: 1, note: 2 };

/**
 * Run every rule on a recipe's content with its stock context. Results are ordered
 * blockers, warnings, notes. `computed` may be passed when the caller already has it.
 */
export function runChecks(content: RecipeContent, ctx: RecipeContext, computed: RecipeComputed = computeRecipe(content, ctx)): CheckResult[] {
  const parsed = ctx.wheel ? parseWheelSpec(ctx.wheel.specification) : null;
  const mat = ctx.material;
  const scopeHardness = content.scope?.hardness;
  const facts: Facts = {
    content,
    ctx,
    computed,
    abrasive: parsed?.ok ? abrasiveFamily(parsed.spec) : null,
    marking: parsed,
    group: content.scope?.group ?? ctx.material?.group ?? null,
    hardness: usableWindow(scopeHardness) ? scopeHardness : mat?.hardness && usableWindow(pointWindow(mat.hardness)) ? pointWindow(mat.hardness) : null,
    coating: mat?.coated && mat.coatingHardness && usableWindow(pointWindow(mat.coatingHardness)) ? pointWindow(mat.coatingHardness) : null,
  };
  const results = RULES.flatMap((rule) => {
    const r = rule(facts);
    return r === null ? [] : Array.isArray(r) ? r : [r];
  });
  return results
    .map((r, i) => ({ r, i }))
    .sort((a, b) => RANK[a.r.severity] - RANK[b.r.severity] || a.i - b.i)
    .map(({ r }) => r);
}

/**
 * From version 2 on, a version must say why it differs from the one before (change
 * control: what changed and why is kept with the record). Checked on submit and live in
 * the editor; a draft may be saved without it.
 */
export function changeReasonMissing(version: number, changeReason: string): string | null {
  return version >= 2 && changeReason.trim() === '' ? 'Say why this version differs from the one before (required from version 2 on).' : null;
}

/** The most serious severity among results, or null when there are none. */
export function worstSeverity(results: readonly CheckResult[]): CheckSeverity | null {
  let worst: CheckSeverity | null = null;
  for (const r of results) if (worst === null || RANK[r.severity] < RANK[worst]) worst = r.severity;
  return worst;
}
