/**
 * The invented lab's recipes: sixteen drafts by the demo author, one per typical job of a
 * plant lab. Stock is named, not numbered (the seed looks the ids up). Parameters are
 * realistic for the demo (typical ranges, common practice: abrasive 35–65 m/s below the
 * wheel's marked maximum, feed 0.05–1.0 mm/s; precision saw up to 5000 rpm and
 * 0.005–0.2 mm/s; coolant 2–5 % v/v) and every recipe passes the checks without a blocker.
 */
import { NO_MOTION_SETTINGS, type RecipeClamping, type RecipeCoolant, type RecipeCutting, type RecipeScope } from '../../shared/schemas/recipe';

export interface DemoRecipe {
  title: string;
  material: string | null;
  machine: string;
  wheel: string;
  scope: Omit<RecipeScope, 'materialId'>;
  cutting: Omit<RecipeCutting, 'machineId' | 'wheelId'>;
  clamping: RecipeClamping;
  coolant: RecipeCoolant;
  instructionsMd: string;
  acceptanceMd: string;
  cautionsMd: string;
}

const FLOOR = 'Bay 1 floor saw';
const BENCH = 'Bay 2 bench saw';
const PRECISION = 'Clean-room precision saw';

const wet = (pct: number, flow: number): RecipeCoolant => ({ type: 'water-soluble', concentrationPct: pct, flowLMin: flow });

const clamp = (method: RecipeClamping['method'], placement: string, extra: Partial<RecipeClamping> = {}): RecipeClamping => ({
  method,
  placement,
  bothSides: true,
  softInserts: false,
  supportBlocks: false,
  orientationRule: '',
  wheelPath: null,
  ...extra,
});

const cut = (
  wheelRpm: number,
  feedMmS: number,
  cutMotion: RecipeCutting['cutMotion'],
  extra: Partial<RecipeCutting> = {},
): Omit<RecipeCutting, 'machineId' | 'wheelId'> => ({
  wheelRpm,
  feedMmS,
  entryFeedMmS: null,
  entryLengthMm: null,
  cutMotion,
  passes: null,
  ...NO_MOTION_SETTINGS,
  ...extra,
});

const round = (
  group: RecipeScope['group'],
  sizeMinMm: number,
  sizeMaxMm: number,
  hardness: RecipeScope['hardness'] = null,
): Omit<RecipeScope, 'materialId'> => ({
  group,
  hardness,
  shape: 'round-bar',
  sizeMinMm,
  sizeMaxMm,
  widthMm: null,
  wallMm: null,
  orientation: 'transverse',
  orientationNote: '',
});

const block = (
  group: RecipeScope['group'],
  sizeMinMm: number,
  sizeMaxMm: number,
  widthMm: number,
  hardness: RecipeScope['hardness'] = null,
): Omit<RecipeScope, 'materialId'> => ({
  ...round(group, sizeMinMm, sizeMaxMm, hardness),
  shape: 'rectangular',
  widthMm,
});

const STEPS_ABRASIVE = [
  '1. Inspect the wheel for chips and cracks; check its marked speed against the recipe.',
  '2. Clamp the part on both sides of the cut; the offcut must not drop or pinch the wheel.',
  '3. Check the coolant concentration with the refractometer.',
  '4. Close the hood, start the coolant, then the wheel; start the automatic feed.',
  '5. After the cut, let the wheel stop before opening the hood. Deburr the specimen.',
].join('\n');

const FACE_OK = '- No temper colours or burn marks on the cut face.\n- Burr below 0.2 mm.';

export const DEMO_RECIPES: DemoRecipe[] = [
  {
    title: 'C45 bar, transverse section',
    material: 'C45 carbon steel',
    machine: FLOOR,
    wheel: 'Alumina 350 hard',
    scope: round('plain-low-alloy-steel', 20, 60, { min: 170, max: 230, scale: 'HBW' }),
    // 350 mm at 2800 rpm = 51.3 m/s (marked 80 m/s).
    cutting: cut(2800, 0.5, 'straight-plunge'),
    clamping: clamp('vise-backstop', 'Vise jaws 10 mm either side of the cut line.'),
    coolant: wet(4, 12),
    instructionsMd: STEPS_ABRASIVE,
    acceptanceMd: FACE_OK,
    cautionsMd: '',
  },
  {
    title: '42CrMo4 quenched and tempered bar, large diameters',
    material: '42CrMo4 alloy steel',
    machine: FLOOR,
    wheel: 'Alumina 350 hard',
    scope: round('plain-low-alloy-steel', 40, 110, { min: 25, max: 35, scale: 'HRC' }),
    // Invented demo settings: an 8 mm rocking stroke keeps the contact short on the big bars.
    cutting: cut(2800, 0.35, 'rocking', { entryFeedMmS: 0.15, entryLengthMm: 3, rockingStrokeMm: 8 }),
    clamping: clamp('vise-backstop', 'Both vises, bar supported on V-shaped jaws; offcut side on the support block.', { supportBlocks: true }),
    coolant: wet(4, 12),
    instructionsMd: `${STEPS_ABRASIVE}\n\nRocking: let the machine rock the wheel; do not force the feed on the last 10 mm.`,
    acceptanceMd: FACE_OK,
    cautionsMd: 'Bars above 20 kg: use the hoist.',
  },
  {
    title: 'X153CrMoV12 hardened block, bench saw',
    material: 'X153CrMoV12 cold-work tool steel',
    machine: BENCH,
    wheel: 'Alumina 250 soft',
    scope: block('hardened-tool-steel', 10, 50, 60, { min: 58, max: 62, scale: 'HRC' }),
    // 250 mm at 3000 rpm = 39.3 m/s (marked 63 m/s).
    // Pulses of 0.5 mm forward, 0.2 mm back (invented demo settings).
    cutting: cut(3000, 0.12, 'pulsed-plunge', { pulseAdvanceMm: 0.5, pulseRetractMm: 0.2 }),
    clamping: clamp('vise-backstop', 'Vise on the thicker side, top clamp on the offcut.'),
    coolant: wet(5, 8),
    instructionsMd: `${STEPS_ABRASIVE}\n\nKeep the feed low: the steel is at 60 HRC and tempers easily.`,
    acceptanceMd: `${FACE_OK}\n- Check with etching that the face shows no rehardened or tempered zone.`,
    cautionsMd: '',
  },
  {
    title: '16MnCr5 gear, tooth section through the case',
    material: '16MnCr5 gear, case-hardened',
    machine: BENCH,
    wheel: 'Alumina 250 soft',
    scope: block('hardened-tool-steel', 10, 40, 30, { min: 56, max: 62, scale: 'HRC' }),
    cutting: cut(3000, 0.1, 'straight-plunge'),
    clamping: clamp('top-clamp', 'Top clamp on the gear body, soft inserts on the teeth.', {
      softInserts: true,
      orientationRule: 'The wheel enters at the tooth tip and cuts towards the core, so the case is pressed onto the core.',
    }),
    coolant: wet(5, 8),
    instructionsMd: `${STEPS_ABRASIVE}\n\nMark the tooth to be cut; section through the middle of the flank.`,
    acceptanceMd: `${FACE_OK}\n- Case intact at the edge, no chipping.`,
    cautionsMd: '',
  },
  {
    title: 'X5CrNi18-10 tube, transverse',
    material: 'X5CrNi18-10 austenitic stainless',
    machine: BENCH,
    wheel: 'Alumina 250 medium',
    scope: { ...round('stainless-steel', 20, 60), shape: 'tube', wallMm: 3 },
    cutting: cut(3000, 0.3, 'straight-plunge'),
    clamping: clamp('v-block', 'V-blocks either side of the cut; do not crush the tube.'),
    coolant: wet(4, 8),
    instructionsMd: STEPS_ABRASIVE,
    acceptanceMd: FACE_OK,
    cautionsMd: '',
  },
  {
    title: 'Ductile iron casting, section through the wall',
    material: 'Ductile iron',
    machine: FLOOR,
    wheel: 'Alumina 350 medium',
    scope: block('cast-iron', 20, 80, 100),
    cutting: cut(2800, 0.5, 'straight-plunge'),
    clamping: clamp('vise-backstop', 'Vise on the flange; support block under the offcut.', { supportBlocks: true }),
    coolant: wet(4, 12),
    instructionsMd: STEPS_ABRASIVE,
    acceptanceMd: '- Graphite nodules not pulled out at the edge.\n- No burn marks.',
    cautionsMd: '',
  },
  {
    title: 'EN AW-6082 bar, transverse',
    material: 'AlSi1MgMn wrought aluminium',
    machine: BENCH,
    wheel: 'Silicon carbide 250 hard',
    // Up to 60 mm: the bench saw's wheels, replaced at 200 mm, still cut it through.
    scope: round('aluminium-magnesium', 10, 60),
    cutting: cut(3000, 0.8, 'straight-plunge'),
    clamping: clamp('vise-backstop', 'Vise jaws with soft inserts to keep the surface unmarked.', { softInserts: true }),
    coolant: wet(4, 8),
    instructionsMd: STEPS_ABRASIVE,
    acceptanceMd: '- No smearing on the face.\n- Burr below 0.3 mm.',
    cautionsMd: '',
  },
  {
    title: 'CW614N brass bar',
    material: 'CuZn39Pb3 free-cutting brass',
    machine: BENCH,
    wheel: 'Silicon carbide 250 hard',
    scope: round('copper', 5, 40),
    cutting: cut(3000, 0.6, 'straight-plunge'),
    clamping: clamp('vise-backstop', 'Vise jaws 10 mm from the cut.'),
    coolant: wet(4, 8),
    instructionsMd: STEPS_ABRASIVE,
    acceptanceMd: FACE_OK,
    cautionsMd: 'Leaded brass: wash hands after handling the specimens.',
  },
  {
    title: 'Ti-6Al-4V bar, pulsed cut',
    material: 'Ti-6Al-4V',
    machine: BENCH,
    wheel: 'Silicon carbide 250 medium',
    scope: round('titanium', 10, 50),
    // Pulsed by time: 3 s feeding, 1 s pause for the coolant (invented demo settings).
    cutting: cut(2800, 0.2, 'pulsed-plunge', { pulseFeedS: 3, pulsePauseS: 1 }),
    clamping: clamp('vise-backstop', 'Vise jaws 10 mm from the cut.'),
    coolant: wet(5, 10),
    instructionsMd: `${STEPS_ABRASIVE}\n\nFull coolant flow: titanium conducts heat poorly.`,
    acceptanceMd: '- No discoloration (straw or blue) on the face.',
    cautionsMd: 'Titanium swarf can ignite: keep the coolant on and clean the sump weekly.',
  },
  {
    title: 'Alloy 718 bar',
    material: 'Nickel alloy 718',
    machine: BENCH,
    wheel: 'Alumina 250 medium',
    scope: round('nickel-cobalt', 10, 40),
    cutting: cut(2800, 0.15, 'pulsed-plunge', { pulseAdvanceMm: 0.4, pulseRetractMm: 0.1 }),
    clamping: clamp('vise-backstop', 'Vise jaws 10 mm from the cut.'),
    coolant: wet(5, 10),
    instructionsMd: STEPS_ABRASIVE,
    acceptanceMd: FACE_OK,
    cautionsMd: '',
  },
  {
    title: 'WC-Co insert, precision cut',
    material: 'WC-10Co cemented carbide',
    machine: PRECISION,
    wheel: 'Diamond rim 150 metal bond',
    scope: block('cemented-carbide', 3, 10, 15),
    // 150 mm at 4000 rpm = 31.4 m/s (marked 50 m/s).
    cutting: cut(4000, 0.02, 'straight-plunge'),
    clamping: clamp('adhesive-wax-mount', 'Wax-mounted on a glass slide on the fixture.', { bothSides: false }),
    coolant: wet(3, 2),
    instructionsMd: '1. Mount the insert with wax; let it cool.\n2. Set the load and feed; start the coolant.\n3. Cut; remove the slide and dissolve the wax.',
    acceptanceMd: '- No chipping at the cutting edge above 50 µm.',
    cautionsMd: 'Cobalt-bearing dust: cut wet only; clean the chamber with a wet cloth.',
  },
  {
    title: 'Alumina ceramic plate',
    material: 'Alumina 99.5 %',
    machine: PRECISION,
    wheel: 'Diamond rim 150 metal bond',
    scope: block('ceramic-glass', 2, 20, 25),
    cutting: cut(4000, 0.03, 'straight-plunge'),
    clamping: clamp('adhesive-wax-mount', 'Wax-mounted on a steel block.', { bothSides: false }),
    coolant: wet(3, 2),
    instructionsMd: '1. Mount the plate with wax.\n2. Cut at constant feed; do not stop mid-cut.',
    acceptanceMd: '- No cracks from the cut face (check at 50×).',
    cautionsMd: '',
  },
  {
    title: 'CFRP laminate coupon',
    material: 'CFRP laminate, quasi-isotropic',
    machine: PRECISION,
    wheel: 'Diamond rim 150 resin bond',
    scope: block('polymer-composite', 2, 8, 50),
    cutting: cut(4000, 0.05, 'straight-plunge'),
    clamping: clamp('vise-backstop', 'Vise with soft inserts, laminate between two backing plates.', { softInserts: true }),
    coolant: wet(3, 2),
    instructionsMd: '1. Sandwich the laminate between backing plates.\n2. Cut slowly so the fibres do not fray.',
    acceptanceMd: '- No delamination at the face.\n- Fibres cut clean, not pulled.',
    cautionsMd: 'Carbon fibre dust: cut wet, extraction on.',
  },
  {
    title: 'Populated circuit board, solder joint section',
    material: 'Populated circuit board',
    machine: PRECISION,
    wheel: 'Diamond rim 150 resin bond',
    scope: block('electronics-mixed', 1.5, 10, 40),
    cutting: cut(3800, 0.02, 'straight-plunge'),
    clamping: clamp('small-part-gripper', 'Gripper on the board edge, 5 mm from the cut.', { bothSides: false }),
    coolant: wet(3, 2),
    instructionsMd: '1. Cut 2 mm beside the joint row; the joints are ground to later.\n2. Dress the wheel with the alumina stick before each board.',
    acceptanceMd: '- Components not torn off.\n- No cracks in the joints from the cut.',
    cautionsMd: 'Leaded solder: wash hands.',
  },
  {
    title: 'Thermally sprayed shaft, section through the coating',
    material: 'HVOF WC-CoCr coating on 42CrMo4 shaft',
    machine: BENCH,
    // The hard carbide coating sets the bond: a soft one, so the wheel keeps cutting through it.
    wheel: 'Alumina 250 soft',
    scope: round('plain-low-alloy-steel', 20, 60, { min: 25, max: 35, scale: 'HRC' }),
    cutting: cut(3000, 0.2, 'straight-plunge'),
    clamping: clamp('top-clamp', 'Top clamp with soft inserts on the shaft, away from the coated band.', {
      softInserts: true,
      orientationRule: 'The wheel enters through the coating, so the coating is pressed onto the substrate, not peeled off.',
      wheelPath: 'enters-coating',
    }),
    coolant: wet(4, 8),
    instructionsMd: `${STEPS_ABRASIVE}\n\nThe shaft is coated all round: cut to just past the middle, turn it half a turn and finish from the other side, so the wheel enters through the coating both times and never leaves through it.`,
    acceptanceMd: '- Coating attached along the whole interface; no gaps from the cut.',
    cautionsMd: '',
  },
  {
    title: 'X153CrMoV12 hardened sample, precision CBN cut',
    material: 'X153CrMoV12 cold-work tool steel',
    machine: PRECISION,
    wheel: 'CBN rim 150',
    scope: block('hardened-tool-steel', 5, 20, 20, { min: 58, max: 64, scale: 'HRC' }),
    cutting: cut(4000, 0.03, 'straight-plunge'),
    clamping: clamp('vise-backstop', 'Precision vise, 5 mm from the cut.'),
    coolant: wet(4, 2),
    instructionsMd: '1. Clamp; start the coolant.\n2. Cut at constant feed; the CBN wheel needs no dressing on steel.',
    acceptanceMd: '- No tempered zone visible after etching.',
    cautionsMd: '',
  },
];
