/**
 * The invented lab's stock: three saws, thirteen wheels, fifteen materials. Names are made
 * up; wheels are described by their ISO 525-style marking, materials by EN or UNS numbers.
 * Values are realistic for the demo (typical lab sizes, speeds and feeds; common practice)
 * — invented, not measured (motor powers are typical of each machine class). Recipes refer
 * to these records by name.
 */
import type { z } from 'zod';
import type { MachineBody, materialBody, WheelBody } from '../../shared/schemas/stock';

/** As typed into the form: the schema fills in the defaults. */
type MaterialInput = z.input<typeof materialBody>;

export const DEMO_MACHINES: MachineBody[] = [
  {
    name: 'Bay 1 floor saw',
    machineClass: 'floor-abrasive',
    wheelDiameterMinMm: 300,
    wheelDiameterMaxMm: 350,
    // Cutting depth (350 − 100)/2 − 5 = 120 mm.
    flangeDiameterMm: 100,
    rpmMin: 1500,
    rpmMax: 3000,
    feedMinMmS: 0.02,
    feedMaxMmS: 2.0,
    feedControl: 'automatic',
    feedDirection: 'wheel-down',
    spindleLimitRpm: null,
    spindleLimitSetBy: '',
    motorPowerKw: 5.5,
    cutMotions: ['straight-plunge', 'pulsed-plunge', 'rocking', 'traverse-pass', 'stepped-depth', 'turning-specimen'],
    clampingMethods: ['vise-backstop', 'top-clamp', 'v-block', 'fixture-plate'],
    notes: 'Large parts and long bars. Table with T-slots; clamp both sides of the cut.',
  },
  {
    name: 'Bay 2 bench saw',
    machineClass: 'bench-abrasive',
    wheelDiameterMinMm: 230,
    wheelDiameterMaxMm: 250,
    // Cutting depth (250 − 70)/2 − 5 = 85 mm.
    flangeDiameterMm: 70,
    rpmMin: 1000,
    rpmMax: 3000,
    feedMinMmS: 0.02,
    feedMaxMmS: 1.5,
    feedControl: 'automatic',
    feedDirection: 'wheel-down',
    spindleLimitRpm: null,
    spindleLimitSetBy: '',
    motorPowerKw: 2.2,
    cutMotions: ['straight-plunge', 'pulsed-plunge', 'rocking'],
    clampingMethods: ['vise-backstop', 'top-clamp', 'v-block', 'small-part-gripper'],
    notes: 'Everyday sectioning of bars, tubes and small castings.',
  },
  {
    name: 'Clean-room precision saw',
    machineClass: 'precision',
    wheelDiameterMinMm: 100,
    wheelDiameterMaxMm: 200,
    // Cutting depth with a 150 mm rim wheel: (150 − 50)/2 − 5 = 45 mm. The flange is a quarter
    // of the 200 mm blade, the least a cut-off wheel takes (ANSI B7.1; see shared/flange.ts).
    flangeDiameterMm: 50,
    rpmMin: 50,
    rpmMax: 5000,
    feedMinMmS: 0.005,
    feedMaxMmS: 0.2,
    feedControl: 'automatic',
    feedDirection: 'wheel-down',
    // The saw reaches 5000 rpm, but the lab's 200 mm blade is marked 50 m/s: 60 000·50/(π·200)
    // = 4774.6 rpm. The lab needs that blade size and its maker marks it no higher, and the
    // precision work never runs above 4000 rpm; so, as a lab would, maintenance locked the
    // control's top speed at 4500 rpm (below every blade the saw takes, with a margin for the
    // speed control) and recorded it. Locked in the machine, the limit does not depend on the
    // operator picking the right speed for the blade mounted (OSHA 29 CFR 1910.215(d)(1)).
    spindleLimitRpm: 4500,
    spindleLimitSetBy: 'Maintenance, work order 2291: top speed locked at 4500 rpm in the service settings',
    motorPowerKw: 0.75,
    cutMotions: ['straight-plunge', 'pulsed-plunge', 'turning-specimen', 'stepped-depth'],
    clampingMethods: ['vise-backstop', 'adhesive-wax-mount', 'small-part-gripper', 'fixture-plate', 'v-block'],
    notes: 'Small, brittle and delicate specimens: carbides, ceramics, composites, electronics.',
  },
];

/**
 * The lab replaces its 250 mm bench-saw wheels at 200 mm (a rule of its own, kept on each
 * wheel record); the 350 mm floor-saw wheels run down to the lab's default share (70 %).
 */
const BENCH_WHEEL_SMALLEST_MM = 200;

// Thin reinforced cut-off wheels are not for side grinding; the metal-bond rim wheels are for
// wet cutting only (the restriction marks their makers print; invented for the demo).
const bonded = (name: string, specification: string, diameterMm: number, thicknessMm: number, maxSpeedMs: number, notes: string): WheelBody => ({
  name,
  kind: 'bonded',
  specification,
  diameterMm,
  thicknessMm,
  boreMm: 32,
  maxSpeedMarkedIn: 'm/s',
  maxSpeedMs,
  maxSpeedRpm: null,
  dryAllowed: false,
  restrictions: ['no-side-grinding'],
  minUsableDiameterMm: diameterMm === 250 ? BENCH_WHEEL_SMALLEST_MM : null,
  notes,
});

const rimWheel = (name: string, specification: string, thicknessMm: number, dryAllowed: boolean, notes: string): WheelBody => ({
  name,
  kind: 'rim',
  specification,
  diameterMm: 150,
  thicknessMm,
  boreMm: 12.7,
  maxSpeedMarkedIn: 'm/s',
  maxSpeedMs: 50,
  maxSpeedRpm: null,
  dryAllowed,
  restrictions: dryAllowed ? [] : ['wet-use-only'],
  minUsableDiameterMm: null,
  notes,
});

export const DEMO_WHEELS: WheelBody[] = [
  bonded('Alumina 350 hard', 'A60P5B', 350, 2.5, 80, 'Plain and low-alloy steels up to about 35 HRC.'),
  bonded('Alumina 350 medium', 'A46M5B', 350, 2.5, 80, 'Stainless steels and cast irons.'),
  bonded('Alumina 350 soft', 'A36K5B', 350, 2.5, 80, 'Hardened steels on the floor saw.'),
  bonded('Silicon carbide 350 hard', 'C60P5B', 350, 2.5, 80, 'Large aluminium and copper parts.'),
  bonded('Alumina 250 hard', 'A60P5B', 250, 1.5, 63, 'Plain and low-alloy steels.'),
  bonded('Alumina 250 medium', 'A60M5B', 250, 1.5, 63, 'Stainless steels, cast irons and nickel alloys.'),
  bonded('Alumina 250 soft', 'A60J5B', 250, 1.5, 63, 'Hardened and case-hardened steels.'),
  bonded('Silicon carbide 250 hard', 'C80P5B', 250, 1.5, 63, 'Aluminium, magnesium and copper alloys.'),
  bonded('Silicon carbide 250 medium', 'C80N5B', 250, 1.5, 63, 'Titanium alloys.'),
  rimWheel('Diamond rim 150 metal bond', 'D126N100M', 0.5, false, 'Ceramics and cemented carbides.'),
  rimWheel('Diamond rim 150 resin bond', 'D91N75B', 0.4, true, 'Composites and electronics; dress with an alumina stick after metal.'),
  // Superabrasive blades are often marked in rpm (EN 13236 marks diamond saws so): 6000 rpm
  // at 150 mm is 47.1 m/s.
  {
    ...rimWheel('CBN rim 150', 'B126N100M', 0.5, false, 'Fully hardened tool steels on the precision saw.'),
    maxSpeedMarkedIn: 'rpm',
    maxSpeedMs: null,
    maxSpeedRpm: 6000,
  },
  // Marked 50 m/s: 4774 rpm at 200 mm, below the saw's 5000 rpm; the saw's locked limit
  // (4500 rpm) keeps it within the marking.
  {
    ...rimWheel('Diamond rim 200 metal bond', 'D151N100M', 0.8, false, 'Larger ceramic and carbide sections; mind the marked speed at 200 mm.'),
    diameterMm: 200,
  },
];

export const DEMO_MATERIALS: MaterialInput[] = [
  { name: 'C45 carbon steel', designation: 'EN 1.0503', group: 'plain-low-alloy-steel', condition: 'normalised', hardness: { value: 200, scale: 'HBW' } },
  {
    name: '42CrMo4 alloy steel',
    designation: 'EN 1.7225',
    group: 'plain-low-alloy-steel',
    condition: 'quenched and tempered',
    hardness: { value: 30, scale: 'HRC' },
  },
  {
    name: 'X153CrMoV12 cold-work tool steel',
    designation: 'EN 1.2379',
    group: 'hardened-tool-steel',
    condition: 'hardened and tempered',
    hardness: { value: 60, scale: 'HRC' },
    heatSensitive: true,
  },
  {
    name: '16MnCr5 gear, case-hardened',
    designation: 'EN 1.7131',
    group: 'hardened-tool-steel',
    condition: 'carburised, hardened and tempered',
    hardness: { value: 60, scale: 'HRC' },
    caseHardened: true,
    caseDepthMm: 0.8,
    heatSensitive: true,
    notes: 'Surface hardness; core about 35 HRC. Case depth to 550 HV.',
  },
  {
    name: 'X5CrNi18-10 austenitic stainless',
    designation: 'EN 1.4301 / UNS S30400',
    group: 'stainless-steel',
    condition: 'solution annealed',
    hardness: { value: 180, scale: 'HV' },
  },
  { name: 'Ductile iron', designation: 'EN-GJS-500-7', group: 'cast-iron', condition: 'as cast', hardness: { value: 200, scale: 'HBW' } },
  { name: 'AlSi1MgMn wrought aluminium', designation: 'EN AW-6082', group: 'aluminium-magnesium', condition: 'T6', hardness: { value: 95, scale: 'HBW' } },
  { name: 'CuZn39Pb3 free-cutting brass', designation: 'CW614N', group: 'copper', condition: 'drawn', hardness: { value: 130, scale: 'HV' } },
  {
    name: 'Ti-6Al-4V',
    designation: 'UNS R56400',
    group: 'titanium',
    condition: 'mill annealed',
    hardness: { value: 340, scale: 'HV' },
    combustibleFines: true,
  },
  {
    name: 'Nickel alloy 718',
    designation: 'UNS N07718',
    group: 'nickel-cobalt',
    condition: 'solution treated and aged',
    hardness: { value: 44, scale: 'HRC' },
  },
  {
    name: 'WC-10Co cemented carbide',
    group: 'cemented-carbide',
    condition: 'sintered',
    hardness: { value: 1600, scale: 'HV' },
    hazardousDust: true,
    notes: 'Cobalt-bearing dust: cut wet only.',
  },
  { name: 'Alumina 99.5 %', group: 'ceramic-glass', condition: 'sintered', hardness: { value: 1500, scale: 'HV' } },
  {
    name: 'CFRP laminate, quasi-isotropic',
    group: 'polymer-composite',
    condition: 'cured',
    hazardousDust: true,
    heatSensitive: true,
    notes: 'Carbon fibre dust: cut wet, extraction on.',
  },
  {
    name: 'Populated circuit board',
    group: 'electronics-mixed',
    condition: 'assembled, FR-4 with solder joints',
    hazardousDust: true,
    heatSensitive: true,
    notes: 'Leaded solder and glass fibre: cut wet, wash hands.',
  },
  {
    name: 'HVOF WC-CoCr coating on 42CrMo4 shaft',
    designation: 'EN 1.7225 (substrate)',
    group: 'plain-low-alloy-steel',
    condition: 'coating 0.3 mm, substrate quenched and tempered',
    hardness: { value: 30, scale: 'HRC' },
    coated: true,
    // Typical of sprayed carbide layers (from memory); invented for the demo, not measured.
    coatingHardness: { value: 1150, scale: 'HV' },
    notes: 'Thermally sprayed layer; the typical hardness is the substrate\u2019s, the coating\u2019s is given apart.',
  },
];
