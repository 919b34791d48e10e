/**
 * Kerfbook's own vocabulary, in its own words: material groups, cut motions, clamping
 * methods, machine classes, wheel kinds, shapes, orientations, coolants, statuses and cut
 * outcomes. Ids are stored; labels are shown. Every screen, sheet and comparison takes its
 * labels from here.
 */

/** Material groups, Kerfbook's own list. "Coated" is a flag on a material, with this as its substrate group. */
export const MATERIAL_GROUPS = [
  'plain-low-alloy-steel',
  'hardened-tool-steel',
  'stainless-steel',
  'cast-iron',
  'aluminium-magnesium',
  'copper',
  'titanium',
  'nickel-cobalt',
  'cemented-carbide',
  'ceramic-glass',
  'polymer-composite',
  'electronics-mixed',
] as const;
export type MaterialGroup = (typeof MATERIAL_GROUPS)[number];

export const MATERIAL_GROUP_LABELS: Record<MaterialGroup, string> = {
  'plain-low-alloy-steel': 'Plain and low-alloy steels',
  'hardened-tool-steel': 'Hardened and tool steels',
  'stainless-steel': 'Stainless steels',
  'cast-iron': 'Cast irons',
  'aluminium-magnesium': 'Aluminium and magnesium alloys',
  copper: 'Copper alloys',
  titanium: 'Titanium alloys',
  'nickel-cobalt': 'Nickel and cobalt alloys',
  'cemented-carbide': 'Cemented carbides',
  'ceramic-glass': 'Technical ceramics and glass',
  'polymer-composite': 'Polymers and fibre composites',
  'electronics-mixed': 'Electronics and mixed assemblies',
};

/** Groups that are mostly metal: a diamond rim wheel wears out quickly there, and CBN suits only hardened steels (common practice). */
export const METALLIC_GROUPS: readonly MaterialGroup[] = [
  'plain-low-alloy-steel',
  'hardened-tool-steel',
  'stainless-steel',
  'cast-iron',
  'aluminium-magnesium',
  'copper',
  'titanium',
  'nickel-cobalt',
];

/** Hardness scales. HBW = Brinell with a carbide ball (ASTM E10). */
export const HARDNESS_SCALES = ['HV', 'HRC', 'HRB', 'HBW'] as const;
export type HardnessScale = (typeof HARDNESS_SCALES)[number];

/** Cut motions, our own names; each has a contact-length model in contact-length.ts. */
export const CUT_MOTIONS = ['straight-plunge', 'pulsed-plunge', 'rocking', 'turning-specimen', 'traverse-pass', 'stepped-depth'] as const;
export type CutMotion = (typeof CUT_MOTIONS)[number];

export const CUT_MOTION_LABELS: Record<CutMotion, string> = {
  'straight-plunge': 'Straight plunge',
  'pulsed-plunge': 'Pulsed plunge',
  rocking: 'Rocking',
  'turning-specimen': 'Turning specimen',
  'traverse-pass': 'Traverse pass',
  'stepped-depth': 'Stepped depth',
};

/** Clamping methods, our own names. */
export const CLAMPING_METHODS = ['vise-backstop', 'top-clamp', 'v-block', 'fixture-plate', 'adhesive-wax-mount', 'small-part-gripper'] as const;
export type ClampingMethod = (typeof CLAMPING_METHODS)[number];

export const CLAMPING_METHOD_LABELS: Record<ClampingMethod, string> = {
  'vise-backstop': 'Vise with backstop',
  'top-clamp': 'Top clamp',
  'v-block': 'V-block',
  'fixture-plate': 'Fixture plate or jig',
  'adhesive-wax-mount': 'Adhesive or wax mount',
  'small-part-gripper': 'Gripper for small parts',
};

export const MACHINE_CLASSES = ['bench-abrasive', 'floor-abrasive', 'precision', 'large-traverse'] as const;
export type MachineClass = (typeof MACHINE_CLASSES)[number];

export const MACHINE_CLASS_LABELS: Record<MachineClass, string> = {
  'bench-abrasive': 'Bench abrasive',
  'floor-abrasive': 'Floor abrasive',
  precision: 'Precision',
  'large-traverse': 'Large traverse',
};

/** Consumable bonded wheel, or long-life rim wheel (diamond or CBN on a metal core). */
export const WHEEL_KINDS = ['bonded', 'rim'] as const;
export type WheelKind = (typeof WHEEL_KINDS)[number];

export const WHEEL_KIND_LABELS: Record<WheelKind, string> = {
  bonded: 'Consumable bonded wheel',
  rim: 'Rim wheel (diamond or CBN on a metal core)',
};

/**
 * Scope shapes. The size window is the depth the wheel must cut through: the outside
 * diameter of a round bar or tube, the height of a rectangular section.
 */
export const SHAPES = ['round-bar', 'tube', 'rectangular'] as const;
export type Shape = (typeof SHAPES)[number];

export const SHAPE_LABELS: Record<Shape, string> = {
  'round-bar': 'Round bar',
  tube: 'Tube',
  rectangular: 'Rectangular bar or plate',
};

export const CUT_ORIENTATIONS = ['transverse', 'longitudinal', 'other'] as const;
export type CutOrientation = (typeof CUT_ORIENTATIONS)[number];

export const CUT_ORIENTATION_LABELS: Record<CutOrientation, string> = {
  transverse: 'Transverse',
  longitudinal: 'Longitudinal',
  other: 'Other',
};

export const COOLANT_TYPES = ['water-soluble', 'oil', 'dry'] as const;
export type CoolantType = (typeof COOLANT_TYPES)[number];

export const COOLANT_TYPE_LABELS: Record<CoolantType, string> = {
  'water-soluble': 'Water-soluble coolant',
  oil: 'Cutting oil',
  dry: 'Dry (no coolant)',
};

export const RECIPE_STATUSES = ['draft', 'in-review', 'returned', 'approved', 'superseded', 'withdrawn'] as const;
export type RecipeStatus = (typeof RECIPE_STATUSES)[number];

/** A status as a short label (chips, tables, headings). */
export const RECIPE_STATUS_LABELS: Record<RecipeStatus, string> = {
  draft: 'Draft',
  'in-review': 'In review',
  returned: 'Returned for changes',
  approved: 'Approved',
  superseded: 'Superseded',
  withdrawn: 'Withdrawn',
};

/** A status inside a sentence: "KB-0001 version 2 is {phrase}." */
export const RECIPE_STATUS_PHRASES: Record<RecipeStatus, string> = {
  draft: 'a draft',
  'in-review': 'in review',
  returned: 'returned to its author',
  approved: 'approved',
  superseded: 'superseded',
  withdrawn: 'withdrawn',
};

/** A check finding's severity as a word (always beside its icon and colour). */
export const CHECK_SEVERITY_LABELS = { blocker: 'Blocker', warning: 'Warning', note: 'Note' } as const;

/** What an operator reports about a cut; anything but `good` flags the recipe for its author. */
export const CUT_OUTCOMES = ['good', 'burnt', 'deformed', 'wheel-failure', 'other'] as const;
export type CutOutcome = (typeof CUT_OUTCOMES)[number];

export const CUT_OUTCOME_LABELS: Record<CutOutcome, string> = {
  good: 'Good',
  burnt: 'Discoloured or burnt',
  deformed: 'Deformed or burr',
  'wheel-failure': 'Wheel broke or glazed',
  other: 'Other',
};

/**
 * How the wheel and the part meet: the wheel comes down into a clamped part (chop), or the
 * part is fed horizontally into the wheel on a moving table. The capacity depends on it.
 */
export const FEED_DIRECTIONS = ['wheel-down', 'part-horizontal'] as const;
export type FeedDirection = (typeof FEED_DIRECTIONS)[number];

export const FEED_DIRECTION_LABELS: Record<FeedDirection, string> = {
  'wheel-down': 'Wheel moves down into the part',
  'part-horizontal': 'Part is fed horizontally into the wheel',
};

/**
 * Which geometric limit sets a wheel's cutting capacity on a machine (shared/capacity.ts
 * explains each): the wheel's radius beyond the flange, its edge at the corners of a wide
 * section it comes down into, or, for a turned part, its reach to the centre or through the wall.
 */
export const CAPACITY_LIMITS = ['radius', 'chord', 'turned-to-centre', 'turned-through-wall'] as const;
export type CapacityLimit = (typeof CAPACITY_LIMITS)[number];

export const CAPACITY_LIMIT_LABELS: Record<CapacityLimit, string> = {
  radius: 'Wheel radius beyond the flange',
  chord: "Wheel's edge at the corners of the section",
  'turned-to-centre': 'Turned part: reach to the centre',
  'turned-through-wall': 'Turned tube: reach through the wall',
};

/**
 * What the cut profile's length figure is: the wheel–part contact length, or, when the part
 * turns, the effective removal length per turn (the ring's circumference 2π·r, not an arc
 * the wheel touches at once).
 */
export const CONTACT_MEASURES = ['contact-length', 'removal-length-per-turn'] as const;
export type ContactMeasure = (typeof CONTACT_MEASURES)[number];

export const CONTACT_MEASURE_LABELS: Record<ContactMeasure, string> = {
  'contact-length': 'Contact length',
  'removal-length-per-turn': 'Effective removal length per turn',
};

/** Where a wheel's smallest usable diameter comes from. */
export const WORN_DIAMETER_SOURCES = ['wheel', 'lab-default'] as const;
export type WornDiameterSource = (typeof WORN_DIAMETER_SOURCES)[number];

export const WORN_DIAMETER_SOURCE_LABELS: Record<WornDiameterSource, string> = {
  wheel: "the wheel's record",
  'lab-default': "the lab's default share of the new diameter",
};

/** What holds back the rpm that would keep a worn wheel at its new speed. */
export const RPM_CAPS = ['marked-maximum', 'machine-top-speed', 'spindle-limit'] as const;
export type RpmCap = (typeof RPM_CAPS)[number];

export const RPM_CAP_LABELS: Record<RpmCap, string> = {
  'marked-maximum': "the wheel's marked maximum at the worn diameter",
  'machine-top-speed': "the machine's top speed",
  'spindle-limit': "the spindle's speed limit",
};

/** The unit a wheel's maximum operating speed is marked in (some markets mark rpm). */
export const SPEED_MARKINGS = ['m/s', 'rpm'] as const;
export type SpeedMarking = (typeof SPEED_MARKINGS)[number];

/**
 * Restrictions of use marked on a wheel or its label (restriction marks of EN 12413 and
 * similar markings, in our own words). Like the marked speed, they bind the recipe.
 */
export const WHEEL_RESTRICTIONS = ['wet-use-only', 'no-side-grinding', 'enclosed-machine-only', 'no-hand-held-use'] as const;
export type WheelRestriction = (typeof WHEEL_RESTRICTIONS)[number];

export const WHEEL_RESTRICTION_LABELS: Record<WheelRestriction, string> = {
  'wet-use-only': 'For wet use only',
  'no-side-grinding': 'Not for side grinding',
  'enclosed-machine-only': 'Only on a fully enclosed machine',
  'no-hand-held-use': 'Not for hand-held use',
};

/** Labels of the cutting power figures, shown in the editor's panel and on the recipe page. */
export const CUT_POWER_LABELS = {
  heading: 'Cutting power and heat',
  peakPower: 'Peak cutting power',
  tangentialForce: 'Tangential force at the peak',
  chipThickness: 'Equivalent chip thickness at the peak',
  specificEnergy: 'Specific cutting energy',
  plotTitle: 'Cutting power along the cut',
} as const;

/**
 * Where the wheel enters and leaves a coated part. Cut so the wheel presses the coating onto
 * the substrate (enters through the coating); leaving through it peels the coating off
 * (common practice). A part coated all round and cut straight through leaves through the
 * coating on the far side.
 */
export const WHEEL_PATHS = ['enters-coating', 'exits-coating', 'enters-and-exits-coating', 'not-applicable'] as const;
export type WheelPath = (typeof WHEEL_PATHS)[number];

export const WHEEL_PATH_LABELS: Record<WheelPath, string> = {
  'enters-coating': 'Enters through the coating, leaves through the substrate',
  'exits-coating': 'Enters through the substrate, leaves through the coating',
  'enters-and-exits-coating': 'Enters and leaves through the coating (coated all round, cut straight through)',
  'not-applicable': 'Not applicable: the cut does not cross the coating',
};

/** How dates read on every screen, chosen by the lab; the stored value is the id. */
export const DATE_FORMATS = ['iso', 'dmy-dot', 'dmy-slash', 'mdy-slash'] as const;
export type DateFormat = (typeof DATE_FORMATS)[number];

export const DATE_FORMAT_LABELS: Record<DateFormat, string> = {
  iso: 'Year-month-day, 2026-12-05 (ISO 8601)',
  'dmy-dot': 'Day.month.year, 05.12.2026',
  'dmy-slash': 'Day/month/year, 05/12/2026',
  'mdy-slash': 'Month/day/year, 12/05/2026',
};

/** Paper the bench sheet is laid out for. */
export const SHEET_PAPERS = ['A4', 'Letter'] as const;
export type SheetPaper = (typeof SHEET_PAPERS)[number];

export const SHEET_PAPER_LABELS: Record<SheetPaper, string> = {
  A4: 'A4 (210 × 297 mm, ISO 216)',
  Letter: 'US Letter (8.5 × 11 in)',
};

/** The lab's default units for people who have not chosen their own. */
export const UNIT_PREFERENCES = ['metric', 'metric+imperial'] as const;

export const UNIT_PREFERENCE_LABELS: Record<(typeof UNIT_PREFERENCES)[number], string> = {
  metric: 'Metric',
  'metric+imperial': 'Metric, with imperial beside it',
};

/** The trail's word for a change of the lab's settings. */
export const LAB_SETTINGS_EVENT_LABEL = 'Lab settings changed';

/**
 * Trail event types in words. The stored code (the key) stays in every row's hash and in the
 * CSV; screens show these words and keep the code at hand in a tooltip.
 */
export const TRAIL_EVENT_LABELS: Record<string, string> = {
  'user.created': 'Person added',
  'user.roles_changed': 'Roles changed',
  'user.details_changed': 'Person’s details changed',
  'user.deactivated': 'Person deactivated',
  'user.reactivated': 'Person reactivated',
  'user.temporary_password_set': 'Temporary password set',
  'user.password_changed': 'Own password changed',
  'user.preferences_changed': 'Preferences changed',
  'user.invited': 'Person invited',
  'user.invitation_resent': 'Invitation sent again',
  'user.machines_changed': 'Machines assigned changed',
  'user.password_set_by_link': 'Password set through a link',
  'user.password_reset_requested': 'Password reset asked for',
  'user.notification_preferences_changed': 'Mail preferences changed',
  'user.signature_password_wrong': 'Signature refused: wrong password',
  'user.current_password_wrong': 'Password change refused: wrong current password',
  'user.wrong_password_limit_reached': 'Too many wrong passwords: signing blocked, signed out, admins told',
  'session.signed_in': 'Signed in',
  'session.sign_in_failed': 'Sign-in refused',
  'session.signed_out': 'Signed out',
  'material.created': 'Material added',
  'material.updated': 'Material changed',
  'material.archived': 'Material archived',
  'material.unarchived': 'Material back in use',
  'material.deleted': 'Material deleted',
  'wheel.created': 'Wheel added',
  'wheel.updated': 'Wheel changed',
  'wheel.archived': 'Wheel archived',
  'wheel.unarchived': 'Wheel back in use',
  'wheel.deleted': 'Wheel deleted',
  'machine.created': 'Machine added',
  'machine.updated': 'Machine changed',
  'machine.archived': 'Machine archived',
  'machine.unarchived': 'Machine back in use',
  'machine.deleted': 'Machine deleted',
  'selection_row.created': 'Selection row added',
  'selection_row.updated': 'Selection row changed',
  'selection_row.deleted': 'Selection row deleted',
  'recipe.created': 'Recipe created',
  'recipe.draft_saved': 'Draft saved',
  'attachment.added': 'Photo added',
  'attachment.deleted': 'Photo removed',
  'recipe.version_submitted': 'Version sent for review',
  'recipe.version_returned': 'Version returned to the author',
  'recipe.version_approved': 'Version approved (signed)',
  'recipe.version_effective': 'Version in use',
  'recipe.version_superseded': 'Version superseded',
  'recipe.version_withdrawn': 'Version withdrawn (signed)',
  'recipe.version_created': 'New version started',
  'recipe.review_comment_added': 'Review comment added',
  'sheet.printed': 'Bench sheet printed',
  'cut.recorded': 'Cut logged',
  'cut.flag_cleared': 'Cut flag cleared',
  'recipe.version_acknowledged': 'Version acknowledged',
  'recipe.version_integrity_failed': 'Version failed its integrity check',
  'lab_settings.changed': LAB_SETTINGS_EVENT_LABEL,
};

/** An event type in words; a type without words yet (a newer server) shows its code. */
export function trailEventLabel(type: string): string {
  return TRAIL_EVENT_LABELS[type] ?? type;
}

/** Families an auditor filters the trail by; an event may belong to more than one (an approval is a recipe event and a signature). */
export const TRAIL_FAMILIES = ['recipes', 'signatures', 'shop-floor', 'stock', 'people', 'sign-ins', 'settings'] as const;
export type TrailFamily = (typeof TRAIL_FAMILIES)[number];

export const TRAIL_FAMILY_LABELS: Record<TrailFamily, string> = {
  recipes: 'Recipes and photos',
  signatures: 'Signatures',
  'shop-floor': 'Sheets, cuts and acknowledgements',
  stock: 'Stock (materials, wheels, machines, selection table)',
  people: 'People and accounts',
  'sign-ins': 'Sign-ins and sign-outs',
  settings: 'Lab settings',
};

/** The kinds of record a trail event is about, in words (a stand-in when a record has no name to show). */
export const TRAIL_ENTITY_LABELS: Record<string, string> = {
  recipe: 'Recipe',
  recipe_version: 'Recipe version',
  attachment: 'Photo',
  material: 'Material',
  wheel: 'Wheel',
  machine: 'Machine',
  selection_row: 'Selection row',
  user: 'Person',
  lab_settings: 'Lab settings',
};

/** The marker a recipe carries while its current version's periodic review date has passed. */
export const REVIEW_OVERDUE_LABEL = 'Review overdue';

/**
 * The settings a cut motion carries, stored in the recipe's cutting section (each null when
 * not given). A pulsed plunge is set by distance (advance and retract per pulse) or by time
 * (feeding time and pause per pulse); rocking by its swing angle or its stroke. The number of
 * passes of a traverse or stepped cut is the cutting section's `passes`.
 */
export const MOTION_SETTINGS = [
  'pulseAdvanceMm',
  'pulseRetractMm',
  'pulseFeedS',
  'pulsePauseS',
  'rockingAngleDeg',
  'rockingStrokeMm',
  'specimenRpm',
  'depthPerPassMm',
  'stepDepthMm',
] as const;
export type MotionSetting = (typeof MOTION_SETTINGS)[number];

export const MOTION_SETTING_LABELS: Record<MotionSetting, string> = {
  pulseAdvanceMm: 'Advance per pulse',
  pulseRetractMm: 'Retract per pulse',
  pulseFeedS: 'Feeding time per pulse',
  pulsePauseS: 'Pause between pulses',
  rockingAngleDeg: 'Rocking angle (total swing)',
  rockingStrokeMm: 'Rocking stroke',
  specimenRpm: 'Specimen speed',
  depthPerPassMm: 'Depth per pass',
  stepDepthMm: 'Step depth',
};

/** Which settings belong to which motion (a straight plunge has none). */
export const CUT_MOTION_SETTINGS: Record<CutMotion, readonly MotionSetting[]> = {
  'straight-plunge': [],
  'pulsed-plunge': ['pulseAdvanceMm', 'pulseRetractMm', 'pulseFeedS', 'pulsePauseS'],
  rocking: ['rockingAngleDeg', 'rockingStrokeMm'],
  'turning-specimen': ['specimenRpm'],
  'traverse-pass': ['depthPerPassMm'],
  'stepped-depth': ['stepDepthMm'],
};

/**
 * Where the check code is printed on a bench sheet (the sheet's header and every page's
 * foot): the check page's hints say it in these words.
 */
export const CHECK_CODE_PLACE = 'under the QR code at the top right of the bench sheet, and at the foot of every page';
